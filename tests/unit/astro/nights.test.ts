import { describe, expect, it } from "vitest";
import { geometricAltitudeDeg, refractionScale } from "@/lib/astro/refraction";
import { nightlyVisibility } from "@/lib/astro/visibility";
import type { SunCrossing } from "@/lib/astro/twilight";
import { loadAstroFixture, minutesBetween } from "./fixtures";

interface FixtureCrossing { eveningJdUtc: number | null; morningJdUtc: number | null; isSunAlwaysAbove: boolean; isSunAlwaysBelow: boolean }
interface FixtureTarget {
  target: string;
  transitJdUtc: number;
  riseJdUtc: number | null;
  setJdUtc: number | null;
  isCircumpolar: boolean;
  isNeverRising: boolean;
  sunElongationDeg: number;
  moonSeparationDeg: number;
}
interface FixtureNight {
  site: string;
  nightDateIso: string;
  startJdUtc: number;
  stepMinutes: number;
  twilight: Record<"sunset" | "civil" | "nautical" | "astronomical", FixtureCrossing>;
  hoursDark: number;
  moonIlluminatedFraction: number;
  moonAltitudes: { jdUtc: number; altitudeDeg: number }[];
  targets: FixtureTarget[];
}

// Source of every expected value here: astropy via tests/fixtures/generate_astro.py (IERS
// auto-download off; versions in nights.json). Tolerances: 1 minute of time, 1 arcminute of angle.
const fixture = loadAstroFixture<{ nights: FixtureNight[] }>("nights.json");
const ONE_MINUTE = 1;
const ARCMIN_DEG = 1 / 60;

function expectSameCrossing(actual: SunCrossing, expected: FixtureCrossing, label: string) {
  expect(actual.isSunAlwaysAbove, label).toBe(expected.isSunAlwaysAbove);
  expect(actual.isSunAlwaysBelow, label).toBe(expected.isSunAlwaysBelow);
  for (const key of ["eveningJdUtc", "morningJdUtc"] as const) {
    const want = expected[key];
    if (want === null) expect(actual[key], `${label} ${key}`).toBeNull();
    else expect(minutesBetween(actual[key]!, want), `${label} ${key}`).toBeLessThan(ONE_MINUTE);
  }
}

describe.each(fixture.nights)("night of $nightDateIso at the $site site", (night) => {
  const site = fixture.sites[night.site];

  it("starts at local mean noon and finds sunset, the three twilights and sunrise to 1 minute", () => {
    const visibility = nightlyVisibility(site, fixture.targets[night.targets[0].target], night.nightDateIso, { stepMinutes: night.stepMinutes });
    expect(minutesBetween(visibility.samples.jdUtc[0], night.startJdUtc)).toBeLessThan(1e-6);
    for (const key of ["sunset", "civil", "nautical", "astronomical"] as const) {
      expectSameCrossing(visibility.twilight[key], night.twilight[key], key);
    }
    // Astropy side: dawn minus dusk of astronomical twilight (0 or 24 h when there is no boundary).
    expect(Math.abs(visibility.hoursDark - night.hoursDark) * 60).toBeLessThan(2 * ONE_MINUTE);
  });

  it("follows the Moon's topocentric altitude to 1′ and its illuminated fraction to 0.005", () => {
    const visibility = nightlyVisibility(site, fixture.targets[night.targets[0].target], night.nightDateIso, { stepMinutes: night.stepMinutes });
    const scale = refractionScale(site.elevationM);
    for (const sample of night.moonAltitudes) {
      const k = Math.round((sample.jdUtc - night.startJdUtc) * (visibility.samples.jdUtc.length - 1));
      expect(minutesBetween(visibility.samples.jdUtc[k], sample.jdUtc)).toBeLessThan(1e-6);
      // Compare geometric with geometric: undo our refraction exactly (inverse to 1e-10°).
      const geometric = geometricAltitudeDeg(visibility.samples.moonAltitudeDeg[k], scale);
      expect(Math.abs(geometric - sample.altitudeDeg)).toBeLessThan(ARCMIN_DEG);
    }
    expect(Math.abs(visibility.moon.illuminatedFraction - night.moonIlluminatedFraction)).toBeLessThan(0.005);
  });

  it.each(night.targets)("places transit, rise and set of $target to 1 minute, with Sun and Moon angles to 1′", (expected) => {
    const visibility = nightlyVisibility(site, fixture.targets[expected.target], night.nightDateIso, { stepMinutes: night.stepMinutes });
    const { passages } = visibility;
    expect(minutesBetween(passages.transitJdUtc, expected.transitJdUtc)).toBeLessThan(ONE_MINUTE);
    expect(passages.isCircumpolar).toBe(expected.isCircumpolar);
    expect(passages.isNeverRising).toBe(expected.isNeverRising);
    if (expected.riseJdUtc === null) {
      expect(passages.riseJdUtc).toBeNull();
      expect(passages.setJdUtc).toBeNull();
    } else {
      expect(minutesBetween(passages.riseJdUtc!, expected.riseJdUtc)).toBeLessThan(ONE_MINUTE);
      expect(minutesBetween(passages.setJdUtc!, expected.setJdUtc!)).toBeLessThan(ONE_MINUTE);
    }
    expect(Math.abs(visibility.sun.elongationDeg - expected.sunElongationDeg)).toBeLessThan(ARCMIN_DEG);
    expect(Math.abs(visibility.moon.separationDeg - expected.moonSeparationDeg)).toBeLessThan(ARCMIN_DEG);
  });
});

describe("fixture coverage", () => {
  it("holds a circumpolar and a never-rising target, a southern site, both sides of the date line and a night without darkness", () => {
    const targets = fixture.nights.flatMap((night) => night.targets);
    expect(targets.some((t) => t.isCircumpolar)).toBe(true);
    expect(targets.some((t) => t.isNeverRising)).toBe(true);
    expect(fixture.nights.some((night) => fixture.sites[night.site].latitudeDeg < -20)).toBe(true);
    expect(fixture.nights.some((night) => fixture.sites[night.site].longitudeEastDeg > 179)).toBe(true);
    expect(fixture.nights.some((night) => fixture.sites[night.site].longitudeEastDeg < -178)).toBe(true);
    expect(fixture.nights.some((night) => night.twilight.astronomical.isSunAlwaysAbove)).toBe(true);
  });
});
