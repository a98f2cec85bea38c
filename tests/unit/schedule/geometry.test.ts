import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { apparentDirectionOfDate } from "@/lib/astro/apparent-place";
import type { SkySiteInput, SkyTarget } from "@/lib/astro/inputs";
import { skySiteSchema } from "@/lib/astro/inputs";
import { buildNightGrid } from "@/lib/astro/night-grid";
import { nightMoon } from "@/lib/astro/night-moon";
import { fillSineAltitudes } from "@/lib/astro/target-night";
import { observingSchedule } from "@/lib/schedule";

interface GeometrySample { sample: number; jdUtc: number; moonSeparationDeg: number; targetAltitudeDeg: number; moonAltitudeDeg: number }
interface GeometryCase {
  site: string;
  target: string;
  nightDateIso: string;
  startJdUtc: number;
  moon: { minSeparationDeg: number | null; maxIlluminatedFraction: number | null };
  moonIlluminatedFraction: number;
  samples: GeometrySample[];
  windows: [number, number][];
}
interface GeometryFixture {
  versions: Record<string, string>;
  sites: Record<string, SkySiteInput>;
  targets: Record<string, SkyTarget>;
  airmassLimit: number;
  safeSunElongationDeg: number;
  stepMinutes: number;
  cases: GeometryCase[];
}

// Source of every expected value here: astropy (builtin Moon ephemeris, IERS download off) via
// tests/fixtures/generate_schedule.py; versions in geometry.json.
const fixture: GeometryFixture = JSON.parse(readFileSync(join(process.cwd(), "tests", "fixtures", "schedule", "geometry.json"), "utf8"));
const ARCMIN_DEG = 1 / 60;
const DEG = Math.PI / 180;
const worst = { separationDeg: 0, targetAltitudeDeg: 0, moonAltitudeDeg: 0, edgeMinutes: 0 };

describe.each(fixture.cases)("the $target from the $site site on the night of $nightDateIso", (c) => {
  const site = fixture.sites[c.site];
  const target = fixture.targets[c.target];

  it("has the Moon–target separation, the target's and the Moon's altitudes of astropy to 1′", () => {
    const grid = buildNightGrid(skySiteSchema.parse(site), c.nightDateIso, fixture.stepMinutes);
    const moon = nightMoon(grid, skySiteSchema.parse(site))!;
    const direction = apparentDirectionOfDate(grid.place, target.raDeg, target.decDeg, new Float64Array(3));
    const sinAltitude = new Float64Array(grid.sampleCount);
    fillSineAltitudes(grid, direction, sinAltitude, 0, grid.sampleCount - 1);
    expect(c.samples.length).toBeGreaterThan(5);
    for (const sample of c.samples) {
      const k = sample.sample;
      expect(Math.abs(grid.jdUtc[k] - sample.jdUtc) * 86400).toBeLessThan(0.01);
      const cosSeparation = direction[0] * moon.x[k] + direction[1] * moon.y[k] + direction[2] * moon.z[k];
      const separationDeg = Math.acos(Math.min(1, cosSeparation)) / DEG;
      worst.separationDeg = Math.max(worst.separationDeg, Math.abs(separationDeg - sample.moonSeparationDeg));
      worst.targetAltitudeDeg = Math.max(worst.targetAltitudeDeg, Math.abs(Math.asin(sinAltitude[k]) / DEG - sample.targetAltitudeDeg));
      worst.moonAltitudeDeg = Math.max(worst.moonAltitudeDeg, Math.abs(Math.asin(moon.sinAltitude[k]) / DEG - sample.moonAltitudeDeg));
    }
    expect(worst.separationDeg).toBeLessThan(ARCMIN_DEG);
    expect(worst.targetAltitudeDeg).toBeLessThan(ARCMIN_DEG);
    expect(worst.moonAltitudeDeg).toBeLessThan(ARCMIN_DEG);
    // The illuminated fraction the bright-Moon rule reads (Meeus eqs. 48.1–48.3 on astropy's side).
    expect(Math.abs(moon.illuminatedFraction - c.moonIlluminatedFraction)).toBeLessThan(0.005);
  });

  it("finds the night's usable windows (dark, above airmass 2, Sun and Moon rules) to 1 minute", () => {
    const schedule = observingSchedule({
      site,
      target,
      cycleStartNightIso: c.nightDateIso,
      cycleEndNightIso: c.nightDateIso,
      limits: { airmassLimit: fixture.airmassLimit, safeSunElongationDeg: fixture.safeSunElongationDeg, stepMinutes: fixture.stepMinutes },
      moon: c.moon,
      cadenceHours: 1,
      visitMinutes: 10,
    });
    expect(c.windows.length).toBeGreaterThan(0);
    expect(schedule.windows.length).toBe(c.windows.length);
    schedule.windows.forEach((window, index) => {
      const [start, end] = c.windows[index];
      worst.edgeMinutes = Math.max(worst.edgeMinutes, Math.abs(window.startJdUtc - start) * 1440, Math.abs(window.endJdUtc - end) * 1440);
    });
    expect(worst.edgeMinutes).toBeLessThan(1);
  });
});

describe("agreement with astropy", () => {
  // Worst seen when written: separation 0.10′, target altitude 0.03′, Moon altitude 0.11′, window
  // edges 0.6 min (a Moon-separation edge, where the separation changes by only ~10′ an hour).
  it("stays well inside the tolerances: a regression such as dropping the Moon's parallax (up to 1°) shows here", () => {
    expect(worst.separationDeg).toBeLessThan(0.2 * ARCMIN_DEG);
    expect(worst.targetAltitudeDeg).toBeLessThan(0.1 * ARCMIN_DEG);
    expect(worst.moonAltitudeDeg).toBeLessThan(0.2 * ARCMIN_DEG);
  });
});
