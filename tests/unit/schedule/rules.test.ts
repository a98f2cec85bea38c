import { describe, expect, it } from "vitest";
import { Body, Illumination, MoonPhase, SearchMoonPhase } from "astronomy-engine";
import { weekWithMostTargetsAtBest } from "@/lib/astro/season";
import { astroTimeFromJdUtc } from "@/lib/astro/time";
import { isClearNight, observingSchedule, placeVisits, SEASON_BRIDGE_NIGHTS, type ObservingSchedule } from "@/lib/schedule";
import { bulge, bulgeSeason, jd, southSite } from "./sites";

const HOUR = 1 / 24;
const MINUTE = 1 / 1440;

describe("visits placed by cadence in the windows (our rule)", () => {
  const windows = [
    { startJdUtc: 100, endJdUtc: 100 + 10 * HOUR },
    { startJdUtc: 101, endJdUtc: 101 + 10 * MINUTE },
    { startJdUtc: 102, endJdUtc: 102 + 5 * HOUR },
  ];

  it("starts at the first usable instant and repeats a cadence later while a whole visit fits", () => {
    const visits = Array.from(placeVisits(windows, 4 * HOUR, 20 * MINUTE));
    // 0 h, 4 h, 8 h fit in the first window (8 h + 20 min < 10 h); 12 h would start after it ends.
    expect(visits.slice(0, 3).map((v) => (v - 100) / HOUR)).toEqual([0, 4, 8].map((h) => expect.closeTo(h, 9)));
    // The 10-minute window cannot hold a 20-minute visit: the next visit starts the third window.
    expect(visits[3]).toBe(102);
    expect(visits.slice(4).map((v) => (v - 102) / HOUR)).toEqual([expect.closeTo(4, 9)]);
    expect(visits).toHaveLength(5);
  });

  it("moves a visit that would run past its window's end to the next window that holds one", () => {
    // From 100 + 9.8 h a 20-minute visit would end after 10 h: it waits for the third window.
    const visits = placeVisits([{ startJdUtc: 100, endJdUtc: 100 + 10 * HOUR }, ...windows.slice(2)], 9.8 * HOUR, 20 * MINUTE);
    expect(Array.from(visits)).toEqual([100, 102]);
  });

  it("places visits back to back when the cadence is shorter than a visit", () => {
    const visits = placeVisits([{ startJdUtc: 100, endJdUtc: 100 + HOUR }], 5 * MINUTE, 20 * MINUTE);
    expect(Array.from(visits, (v) => Math.round((v - 100) / MINUTE))).toEqual([0, 20, 40]);
  });

  it("places none in no window, and a visit exactly as long as its window", () => {
    expect(placeVisits([], HOUR, MINUTE)).toHaveLength(0);
    expect(Array.from(placeVisits([{ startJdUtc: 100, endJdUtc: 100.5 }], HOUR, 0.5))).toEqual([100]);
  });

  it("in a schedule, spaces visits by at least the cadence and keeps each inside a window", () => {
    const schedule = observingSchedule({ ...bulgeSeason, site: southSite, target: bulge, cycleStartNightIso: "2022-06-01", cycleEndNightIso: "2022-06-10", cadenceHours: 3, visitMinutes: 45 });
    const visits = schedule.visitsJdUtc;
    expect(visits.length).toBeGreaterThan(20);
    for (let i = 1; i < visits.length; i++) expect(visits[i] - visits[i - 1]).toBeGreaterThanOrEqual(3 * HOUR - 1e-9);
    // Each night's first visit is at its window's start.
    for (const window of schedule.windows) expect(visits).toContain(window.startJdUtc);
  });
});

describe("the clear-night fraction (our rule: night i clear iff ⌊(i+1)f⌋ > ⌊if⌋)", () => {
  const clearCount = (nights: number, fraction: number) => Array.from({ length: nights }, (_, i) => isClearNight(i, fraction)).filter(Boolean).length;

  it("keeps exactly ⌊N·f⌋ of the first N nights, spread evenly", () => {
    expect(Array.from({ length: 6 }, (_, i) => isClearNight(i, 0.5))).toEqual([false, true, false, true, false, true]);
    expect(clearCount(10, 0.7)).toBe(7); // 0.7 × 10 computes as 6.999…: the guard keeps the seventh
    expect(clearCount(183, 0.7)).toBe(128);
    expect(clearCount(183, 1)).toBe(183);
    expect(clearCount(100, 0.01)).toBe(1);
    for (let n = 1; n <= 50; n++) expect(clearCount(n, 0.3)).toBe(Math.floor(n * 0.3 + 1e-9));
  });

  it("loses the right nights in a schedule, as weather gaps, the same way every time", () => {
    const conditions = { ...bulgeSeason, site: southSite, target: bulge, cycleStartNightIso: "2022-06-01", cycleEndNightIso: "2022-06-30" };
    const clear = observingSchedule(conditions);
    const cloudy = observingSchedule({ ...conditions, clearNightFraction: 0.7 });
    expect(observingSchedule({ ...conditions, clearNightFraction: 0.7 })).toEqual(cloudy);
    const nightOf = (jdUtc: number) => Math.floor(jdUtc - cloudy.cycle.startJdUtc);
    const nightsWithWindows = new Set(cloudy.windows.map((w) => nightOf(w.startJdUtc)));
    const weatherNights = new Set(cloudy.gaps.filter((g) => g.reason === "weather").map((g) => nightOf(g.startJdUtc)));
    expect(nightsWithWindows.size).toBe(21); // ⌊30 × 0.7⌋
    for (let night = 0; night < 30; night++) {
      expect(nightsWithWindows.has(night)).toBe(isClearNight(night, 0.7));
      expect(weatherNights.has(night)).toBe(!isClearNight(night, 0.7));
    }
    // A lost night's weather gap is exactly the window a clear night would have had.
    const lost = cloudy.gaps.find((g) => g.reason === "weather")!;
    expect(clear.windows).toContainEqual({ startJdUtc: lost.startJdUtc, endJdUtc: lost.endJdUtc });
    // Weather is lost time inside the season, not a break of it; the hours per night are as if clear.
    expect(cloudy.seasons).toEqual(clear.seasons);
    expect(cloudy.usableHoursPerNight).toEqual(clear.usableHoursPerNight);
  });

  it("says 'weather' when the only nights long enough for a visit are lost", () => {
    const schedule = observingSchedule({ ...bulgeSeason, site: southSite, target: bulge, cycleStartNightIso: "2022-06-01", cycleEndNightIso: "2022-06-01", clearNightFraction: 0.5 });
    expect(schedule.emptyReason).toBe("weather");
  });
});

describe("the Moon constraint", () => {
  // The full Moon of June 2022 (14 June) stands in Sagittarius, a few degrees from the bulge.
  const fullMoonJd = SearchMoonPhase(180, astroTimeFromJdUtc(jd("2022-06-01T00:00:00Z")), 30)!.ut + 2_451_545;
  const conditions = { ...bulgeSeason, site: southSite, target: bulge, cycleStartNightIso: "2022-06-01", cycleEndNightIso: "2022-06-30" };
  const free = observingSchedule(conditions);
  const nightOf = (schedule: ObservingSchedule, jdUtc: number) => Math.floor(jdUtc - schedule.cycle.startJdUtc);

  it("removes time near full Moon close to the target, and none near new Moon", () => {
    const constrained = observingSchedule({ ...conditions, moon: { minSeparationDeg: 30 } });
    const moonNights = new Set(constrained.gaps.filter((g) => g.reason === "moon").map((g) => nightOf(constrained, g.startJdUtc)));
    expect(moonNights.size).toBeGreaterThanOrEqual(3);
    // Every night touched by the Moon rule lies within 4 days of full Moon.
    for (const night of moonNights) expect(Math.abs(constrained.cycle.startJdUtc + night + 0.5 - fullMoonJd)).toBeLessThan(4);
    expect(MoonPhase(astroTimeFromJdUtc(fullMoonJd))).toBeCloseTo(180, 3);
    // The nights near full Moon lose hours; the others keep every hour.
    for (let night = 0; night < 30; night++) {
      if (moonNights.has(night)) expect(constrained.usableHoursPerNight[night]).toBeLessThan(free.usableHoursPerNight[night]);
      else expect(constrained.usableHoursPerNight[night]).toBeCloseTo(free.usableHoursPerNight[night], 4);
    }
    expect(constrained.visitsJdUtc.length).toBeLessThan(free.visitsJdUtc.length);
  });

  it("with a largest illumination, loses the time a brighter Moon is up, and the whole night at full Moon", () => {
    const dark = observingSchedule({ ...conditions, moon: { maxIlluminatedFraction: 0.25 } });
    const fullNight = nightOf(dark, fullMoonJd);
    // Full Moon: up from dusk to dawn, fully lit.
    expect(Illumination(Body.Moon, astroTimeFromJdUtc(fullMoonJd)).phase_fraction).toBeGreaterThan(0.99);
    expect(dark.usableHoursPerNight[fullNight]).toBe(0);
    expect(dark.gaps.some((g) => g.reason === "moon" && nightOf(dark, g.startJdUtc) === fullNight)).toBe(true);
    // New Moon (28 June): every hour kept.
    const newMoonNight = nightOf(dark, jd("2022-06-29T02:00:00Z"));
    expect(dark.usableHoursPerNight[newMoonNight]).toBeCloseTo(free.usableHoursPerNight[newMoonNight], 4);
  });

  it("says 'moon' when it removes every usable hour", () => {
    const schedule = observingSchedule({ ...conditions, cycleStartNightIso: "2022-06-13", cycleEndNightIso: "2022-06-15", moon: { minSeparationDeg: 60 } });
    expect(schedule.emptyReason).toBe("moon");
  });
});

describe("seasons and best weeks", () => {
  it("splits a year-long cycle (366 nights, the longest) at the conjunction with the Sun into two seasons", () => {
    const schedule = observingSchedule({ ...bulgeSeason, site: southSite, target: bulge, cycleStartNightIso: "2022-06-01", cycleEndNightIso: "2023-06-01" });
    expect(schedule.seasons).toHaveLength(2);
    const [first, second] = schedule.seasons;
    expect(first.firstNightIso).toBe("2022-06-01");
    expect(first.lastNightIso > "2022-10-01" && first.lastNightIso < "2022-11-30").toBe(true);
    expect(second.firstNightIso > "2023-01-15" && second.firstNightIso < "2023-03-15").toBe(true);
    expect(second.lastNightIso).toBe("2023-06-01");
    for (const season of schedule.seasons) {
      expect(season.lengthDays).toBeCloseTo(season.endJdUtc - season.startJdUtc, 12);
      expect(season.nightCount).toBeGreaterThan(season.lengthDays);
    }
  });

  it("bridges the nights a strict Moon rule removes, counting them out of the usable nights", () => {
    const schedule = observingSchedule({ ...bulgeSeason, site: southSite, target: bulge, moon: { minSeparationDeg: 40, maxIlluminatedFraction: 0.3 } });
    expect(schedule.seasons).toHaveLength(1);
    expect(schedule.seasons[0].nightCount).toBe(184);
    expect(schedule.seasons[0].usableNightCount).toBeLessThan(160);
    expect(SEASON_BRIDGE_NIGHTS).toBe(14);
  });

  it("names each target's own best weeks, and the list's headline week by a count of targets", () => {
    const early = observingSchedule({ ...bulgeSeason, site: southSite, target: { raDeg: 200, decDeg: -40 } });
    const late = observingSchedule({ ...bulgeSeason, site: southSite, target: bulge });
    expect(early.bestWeekIndices[0]).toBeLessThan(late.bestWeekIndices[0]);
    const headline = weekWithMostTargetsAtBest([early, late, late], early.weeklyUsableHours.length);
    expect(headline).toEqual({ weekIndex: expect.any(Number), targetCount: expect.any(Number) });
    expect(late.bestWeekIndices).toContain(headline!.weekIndex);
    expect(headline!.targetCount).toBeGreaterThanOrEqual(2);
    expect(headline!.targetCount).toBeLessThanOrEqual(3);
  });
});
