import { readFileSync } from "node:fs";
import { join } from "node:path";
import { Body, Equator, Illumination, Observer, SiderealTime } from "astronomy-engine";
import { describe, expect, it } from "vitest";
import { airmassPickering } from "@/lib/astro/airmass";
import { apparentDirectionOfDate, apparentPlaceContext } from "@/lib/astro/apparent-place";
import type { SkySiteInput, SkyTarget } from "@/lib/astro/inputs";
import { apparentAltitudeDeg, refractionScale } from "@/lib/astro/refraction";
import { astroTimeFromJdUtc, nightStartJdUtc } from "@/lib/astro/time";
import { observingSchedule } from "@/lib/schedule";
import { buildScheduleNight } from "@/lib/schedule/night";
import { parseScheduleConditions } from "@/lib/schedule/request";
import { VisitSkyNights } from "@/lib/schedule/visit-sky";
import { bulge, southSite } from "./sites";

interface FixtureVisit {
  isoUtc: string;
  middleJdUtc: number;
  targetZenithDeg: number;
  moonZenithDeg: number;
  moonSeparationDeg: number;
  airmassPickering: number;
  moonPhaseAngleAtVisitDeg: number;
}
interface VisitNight { site: string; target: string; nightDateIso: string; note: string; midDarkJdUtc: number; moonPhaseAngleDeg: number; visits: FixtureVisit[] }
interface Fixture { sites: Record<string, SkySiteInput>; targets: Record<string, SkyTarget>; stepMinutes: number; visits: VisitNight[] }

// Source of every expected value in the first block: astropy (builtin Moon ephemeris, refraction at
// the site's standard-atmosphere pressure, IERS download off) via tests/fixtures/generate_schedule.py.
const fixture: Fixture = JSON.parse(readFileSync(join(process.cwd(), "tests", "fixtures", "schedule", "geometry.json"), "utf8"));
const ARCMIN_DEG = 1 / 60;
const DEG = Math.PI / 180;
const VISIT_DAYS = 20 / 1440;
const worst = { zenithDeg: 0, moonZenithDeg: 0, separationDeg: 0, airmassRelative: 0, phaseDeg: 0 };

describe.each(fixture.visits)("the sky at visits of the $target from the $site site on the night of $nightDateIso ($note)", (night) => {
  it("has astropy's zenith distances and separation to 1′, air mass to 1e-3, phase angle to 0.5°", () => {
    const settings = parseScheduleConditions({
      site: fixture.sites[night.site],
      cycleStartNightIso: night.nightDateIso,
      cycleEndNightIso: night.nightDateIso,
      limits: { stepMinutes: fixture.stepMinutes },
      cadenceHours: 1,
      visitMinutes: 20,
    });
    const nights = new VisitSkyNights(settings.site, nightStartJdUtc(night.nightDateIso, settings.site.longitudeEastDeg), 1, refractionScale(settings.site.elevationM));
    nights.add(buildScheduleNight(settings, 0));
    const starts = Float64Array.from(night.visits, (visit) => visit.middleJdUtc - VISIT_DAYS / 2);
    const sky = nights.skyOf(fixture.targets[night.target], starts, VISIT_DAYS);
    night.visits.forEach((visit, i) => {
      worst.zenithDeg = Math.max(worst.zenithDeg, Math.abs(sky.targetZenithDeg[i] - visit.targetZenithDeg));
      worst.moonZenithDeg = Math.max(worst.moonZenithDeg, Math.abs(sky.moonZenithDeg[i] - visit.moonZenithDeg));
      worst.separationDeg = Math.max(worst.separationDeg, Math.abs(sky.moonSeparationDeg[i] - visit.moonSeparationDeg));
      // Compared with Pickering 2002 of astropy's apparent altitude (the fixture also holds secz).
      worst.airmassRelative = Math.max(worst.airmassRelative, Math.abs(sky.airmass[i] / visit.airmassPickering - 1));
      // The contract's phase angle is the night's, at the middle of darkness (Meeus eq. 48.3 on astropy's side).
      worst.phaseDeg = Math.max(worst.phaseDeg, Math.abs(sky.moonPhaseAngleDeg[i] - night.moonPhaseAngleDeg));
      // At the visit itself it lags by the Moon's ~0.51° per hour of distance from the middle of darkness.
      const hoursFromMiddle = Math.abs(visit.middleJdUtc - night.midDarkJdUtc) * 24;
      expect(Math.abs(sky.moonPhaseAngleDeg[i] - visit.moonPhaseAngleAtVisitDeg)).toBeLessThan(0.5 + 0.55 * hoursFromMiddle);
    });
    expect(worst.zenithDeg).toBeLessThan(ARCMIN_DEG);
    expect(worst.moonZenithDeg).toBeLessThan(ARCMIN_DEG);
    expect(worst.separationDeg).toBeLessThan(ARCMIN_DEG);
    expect(worst.airmassRelative).toBeLessThan(1e-3);
    expect(worst.phaseDeg).toBeLessThan(0.5);
  });
});

describe("the fixture's visits", () => {
  it("include the Moon up and down, near full and near new", () => {
    const all = fixture.visits.flatMap((night) => night.visits.map((visit) => ({ ...visit, phaseDeg: night.moonPhaseAngleDeg })));
    expect(all.some((visit) => visit.moonZenithDeg < 60)).toBe(true);
    expect(all.some((visit) => visit.moonZenithDeg > 90)).toBe(true);
    expect(Math.min(...all.map((visit) => visit.phaseDeg))).toBeLessThan(15);
    expect(Math.max(...all.map((visit) => visit.phaseDeg))).toBeGreaterThan(170);
  });
});

describe("agreement with astropy", () => {
  // Worst seen when written: target zenith distance 0.024′, Moon zenith distance 0.049′, separation
  // 0.055′, air mass 1.7e-4 relative (the air mass 3.2 visit: the two refraction models), phase 0.006°.
  it("stays well inside the tolerances: a regression such as the Moon read one 5-minute sample off (its zenith distance moves up to 1.25° a step) shows here", () => {
    expect(worst.zenithDeg).toBeLessThan(0.1 * ARCMIN_DEG);
    expect(worst.moonZenithDeg).toBeLessThan(0.2 * ARCMIN_DEG);
    expect(worst.separationDeg).toBeLessThan(0.2 * ARCMIN_DEG);
    expect(worst.airmassRelative).toBeLessThan(5e-4);
    expect(worst.phaseDeg).toBeLessThan(0.05);
  });
});

describe("the schedule's visit sky", () => {
  const conditions = {
    site: southSite,
    target: bulge,
    cycleStartNightIso: "2022-06-08",
    cycleEndNightIso: "2022-06-21",
    limits: { airmassLimit: 2 },
    cadenceHours: 3,
    visitMinutes: 20,
  };

  it("is aligned with visitsJdUtc: each entry is the sky at that visit's middle (astronomy-engine at that instant)", () => {
    const schedule = observingSchedule(conditions);
    const count = schedule.visitsJdUtc.length;
    expect(count).toBeGreaterThan(20);
    for (const values of Object.values(schedule.visitSky)) expect(values.length).toBe(count);

    const site = parseScheduleConditions(conditions).site;
    const observer = new Observer(site.latitudeDeg, site.longitudeEastDeg, site.elevationM);
    const scale = refractionScale(site.elevationM);
    const target = new Float64Array(3);
    for (let i = 0; i < count; i++) {
      // Independent of the night grid: sidereal time, the target's place and the Moon at the instant itself.
      const middle = schedule.visitsJdUtc[i] + schedule.visitLengthDays / 2;
      const time = astroTimeFromJdUtc(middle);
      const lstRad = (SiderealTime(time) * 15 + site.longitudeEastDeg) * DEG;
      const zenithDeg = (u: ArrayLike<number>) =>
        90 - Math.asin(Math.sin(site.latitudeDeg * DEG) * u[2] + Math.cos(site.latitudeDeg * DEG) * (u[0] * Math.cos(lstRad) + u[1] * Math.sin(lstRad))) / DEG;
      apparentDirectionOfDate(apparentPlaceContext(middle), bulge.raDeg, bulge.decDeg, target);
      const { vec } = Equator(Body.Moon, time, observer, true, false);
      const moonLength = Math.hypot(vec.x, vec.y, vec.z);
      const moon = [vec.x / moonLength, vec.y / moonLength, vec.z / moonLength];
      const separationDeg = Math.acos(target[0] * moon[0] + target[1] * moon[1] + target[2] * moon[2]) / DEG;

      expect(Math.abs(schedule.visitSky.targetZenithDeg[i] - zenithDeg(target))).toBeLessThan(0.01);
      expect(Math.abs(schedule.visitSky.moonZenithDeg[i] - zenithDeg(moon))).toBeLessThan(ARCMIN_DEG);
      expect(Math.abs(schedule.visitSky.moonSeparationDeg[i] - separationDeg)).toBeLessThan(ARCMIN_DEG);
      const airmass = airmassPickering(apparentAltitudeDeg(90 - schedule.visitSky.targetZenithDeg[i], scale));
      expect(schedule.visitSky.airmass[i]).toBeCloseTo(airmass, 5);
      expect(schedule.visitSky.airmass[i]).toBeGreaterThanOrEqual(1);
      expect(schedule.visitSky.airmass[i]).toBeLessThanOrEqual(2 + 1e-3);
      // The night's phase angle, within the Moon's ~6° of phase per half night of the instant's.
      expect(Math.abs(schedule.visitSky.moonPhaseAngleDeg[i] - Illumination(Body.Moon, time).phase_angle)).toBeLessThan(4);
    }
  });

  it("is the same with or without a Moon rule (the Moon is computed every night)", () => {
    const withRule = observingSchedule({ ...conditions, moon: { minSeparationDeg: 1 } });
    const without = observingSchedule(conditions);
    expect(withRule.visitsJdUtc).toEqual(without.visitsJdUtc);
    expect(withRule.visitSky).toEqual(without.visitSky);
    expect(without.gaps.some((gap) => gap.reason === "moon")).toBe(false);
  });

  it("is empty, every array, when the schedule has no visit", () => {
    const schedule = observingSchedule({ ...conditions, target: { raDeg: 10, decDeg: 75 } });
    expect(schedule.emptyReason).toBe("never-up");
    expect(schedule.visitsJdUtc.length).toBe(0);
    for (const values of Object.values(schedule.visitSky)) {
      expect(values).toBeInstanceOf(Float32Array);
      expect(values.length).toBe(0);
    }
  });
});
