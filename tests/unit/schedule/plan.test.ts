import { describe, expect, it } from "vitest";
import { AppError } from "@/lib/errors";
import { emptyScheduleMessage, observingSchedule, observingSchedules, type ObservingSchedule } from "@/lib/schedule";
import { bulge, bulgeSeason, jd, northSite, southSite } from "./sites";

function visitsBetween(schedule: ObservingSchedule, fromJdUtc: number, toJdUtc: number): number {
  return schedule.visitsJdUtc.filter((visit) => visit >= fromJdUtc && visit < toJdUtc).length;
}

/** Windows and gaps together, in time order. */
function stretches(schedule: ObservingSchedule) {
  return [...schedule.windows.map((w) => ({ ...w, reason: "usable" })), ...schedule.gaps].sort((a, b) => a.startJdUtc - b.startJdUtc);
}

describe("a Galactic-bulge event seen from a southern and a northern site", () => {
  const t0 = jd("2022-06-15T04:00:00Z");
  const south = observingSchedule({ ...bulgeSeason, site: southSite, target: bulge });
  const north = observingSchedule({ ...bulgeSeason, site: northSite, target: bulge });

  it("with t0 in June (southern winter) collects visits around t0 at the southern site", () => {
    // Mid-June the bulge transits near local midnight, 89° up at 30° S: a long window every night.
    expect(visitsBetween(south, t0 - 10, t0 + 10)).toBeGreaterThanOrEqual(40);
    expect(south.emptyReason).toBeNull();
    // Every visit lies inside one window, whole.
    for (const visit of south.visitsJdUtc) {
      expect(south.windows.some((w) => visit >= w.startJdUtc && visit + south.visitLengthDays <= w.endJdUtc)).toBe(true);
    }
  });

  it("collects fewer at the northern site, where it culminates only 32° up", () => {
    expect(visitsBetween(north, t0 - 10, t0 + 10)).toBeGreaterThan(0);
    expect(visitsBetween(north, t0 - 10, t0 + 10)).toBeLessThan(visitsBetween(south, t0 - 10, t0 + 10));
    // Early March it is above airmass 2 only after dawn from 28.8° N: the season starts later there.
    expect(north.seasons[0].firstNightIso > south.seasons[0].firstNightIso).toBe(true);
  });

  it("covers the whole cycle with windows and named gaps, adjacent gaps of one reason merged", () => {
    for (const schedule of [south, north]) {
      const all = stretches(schedule);
      expect(all[0].startJdUtc).toBe(schedule.cycle.startJdUtc);
      expect(all[all.length - 1].endJdUtc).toBeCloseTo(schedule.cycle.endJdUtc, 9);
      for (let i = 1; i < all.length; i++) {
        expect(all[i].startJdUtc).toBe(all[i - 1].endJdUtc);
        expect(all[i].reason).not.toBe(all[i - 1].reason);
      }
      expect(new Set(schedule.gaps.map((g) => g.reason))).toEqual(new Set(["daylight", "below-limit"]));
    }
  });

  it("has one season and best weeks read from this target's own hours, around June", () => {
    expect(south.seasons).toHaveLength(1);
    expect(south.seasons[0].nightCount).toBe(184);
    expect(south.bestWeekIndices.length).toBeGreaterThan(0);
    // Week 15 starts 2022-06-14: the longest nights of the southern winter.
    expect(south.bestWeekIndices[0]).toBeGreaterThanOrEqual(13);
    expect(south.bestWeekIndices[0]).toBeLessThanOrEqual(17);
    // Never more hours in a week than it has hours (the season view once summed 1019.9 h into one week).
    for (const hours of south.weeklyUsableHours) expect(hours).toBeLessThanOrEqual(7 * 24);
  });
});

describe("schedules with no visit say why", () => {
  it("the bulge in December, when the Galactic centre is behind the Sun, collects none", () => {
    for (const site of [southSite, northSite]) {
      const schedule = observingSchedule({ ...bulgeSeason, site, target: bulge, cycleStartNightIso: "2022-12-01", cycleEndNightIso: "2022-12-31" });
      expect(schedule.visitsJdUtc.length).toBe(0);
      expect(schedule.windows).toEqual([]);
      // Up only in twilight or daylight around conjunction with the Sun (18 December).
      expect(["always-daylight", "behind-sun"]).toContain(schedule.emptyReason);
      expect(emptyScheduleMessage(schedule.emptyReason!)).toMatch(/daylight or twilight|behind the Sun/);
      expect(schedule.seasons).toEqual([]);
    }
  });

  it("a target near the Sun but up in darkness is behind the Sun", () => {
    // On 2022-12-20 the Sun is at RA 17.9 h, Dec −23.4°. A target at the same RA and Dec −80° is 57°
    // from it and, circumpolar from 30° S, still 20° up at lower culmination around midnight: in
    // darkness above airmass 4, but inside a 60° safe elongation.
    const schedule = observingSchedule({ ...bulgeSeason, site: southSite, target: { raDeg: 268, decDeg: -80 }, cycleStartNightIso: "2022-12-18", cycleEndNightIso: "2022-12-22", limits: { airmassLimit: 4, safeSunElongationDeg: 60 } });
    expect(schedule.emptyReason).toBe("behind-sun");
    expect(schedule.gaps.some((g) => g.reason === "sun")).toBe(true);
  });

  it("a far-north target at the southern site is never up", () => {
    const schedule = observingSchedule({ ...bulgeSeason, site: southSite, target: { raDeg: 150, decDeg: 75 } });
    expect(schedule.emptyReason).toBe("never-up");
    expect(emptyScheduleMessage("never-up")).toBe("No visit can be planned: the target never rises above the altitude limit at this site.");
    expect(schedule.gaps.every((g) => g.reason === "daylight" || g.reason === "below-limit")).toBe(true);
  });

  it("windows shorter than a visit hold none", () => {
    // On 2022-03-01 at 28.8° N the bulge clears airmass 2 only minutes before astronomical dawn.
    const short = observingSchedule({ ...bulgeSeason, site: northSite, target: bulge, cycleStartNightIso: "2022-04-01", cycleEndNightIso: "2022-04-01", visitMinutes: 600 });
    expect(short.windows.length).toBe(1);
    expect(short.emptyReason).toBe("windows-too-short");
  });

  it("every reason has a sentence of its own", () => {
    const reasons = ["never-up", "always-daylight", "behind-sun", "moon", "windows-too-short", "weather"] as const;
    expect(new Set(reasons.map(emptyScheduleMessage)).size).toBe(reasons.length);
  });
});

describe("nights near the date line keep their local evening dates", () => {
  const nights = 30;
  const conditions = { ...bulgeSeason, cycleStartNightIso: "2022-06-01", cycleEndNightIso: "2022-06-30", target: { raDeg: 270, decDeg: -30 } };
  const east = observingSchedule({ ...conditions, site: { latitudeDeg: -16.5, longitudeEastDeg: 179.9, elevationM: 100 } });
  const west = observingSchedule({ ...conditions, site: { latitudeDeg: -16.5, longitudeEastDeg: -179.9, elevationM: 100 } });

  it("starts each cycle at local noon of its first date, a day apart in UTC", () => {
    // Local mean noon of 2022-06-01 is 00:00:24 UTC at 179.9° E and 23:59:36 UTC at 179.9° W.
    expect(east.cycle.startJdUtc).toBeCloseTo(jd("2022-06-01T00:00:24Z"), 8);
    expect(west.cycle.startJdUtc).toBeCloseTo(jd("2022-06-01T23:59:36Z"), 8);
    expect(east.cycle.endJdUtc - east.cycle.startJdUtc).toBe(nights);
  });

  it("gives each night exactly one window, inside that night, none lost or doubled", () => {
    for (const schedule of [east, west]) {
      expect(schedule.nightCount).toBe(nights);
      expect(schedule.windows).toHaveLength(nights);
      schedule.windows.forEach((window, night) => {
        expect(window.startJdUtc).toBeGreaterThan(schedule.cycle.startJdUtc + night);
        expect(window.endJdUtc).toBeLessThan(schedule.cycle.startJdUtc + night + 1);
      });
      expect(Array.from(schedule.usableHoursPerNight).every((hours) => hours > 5)).toBe(true);
    }
    // The same local evening at both sites: windows 0.2° of longitude (48 s) apart in local time.
    east.windows.forEach((window, night) => {
      const westWindow = west.windows[night];
      expect(Math.abs(window.startJdUtc - (westWindow.startJdUtc - 359.8 / 360)) * 1440).toBeLessThan(5);
    });
  });
});

describe("many targets share the nights", () => {
  it("gives each target the schedule it gets alone", () => {
    const targets = [bulge, { raDeg: 83.8, decDeg: -5.4 }, { raDeg: 150, decDeg: 75 }];
    const conditions = { ...bulgeSeason, cycleEndNightIso: "2022-03-31", site: southSite, moon: { minSeparationDeg: 30, maxIlluminatedFraction: 0.8 }, clearNightFraction: 0.6 };
    const together = observingSchedules({ ...conditions, targets });
    targets.forEach((target, t) => expect(together[t]).toEqual(observingSchedule({ ...conditions, target })));
  });
});

describe("the request is checked and refused in words naming the field", () => {
  const valid = { ...bulgeSeason, site: southSite, target: bulge };
  it.each([
    [{ cadenceHours: 0 }, "cadenceHours", /cadence/i],
    [{ visitMinutes: 1000 }, "visitMinutes", /time per visit/i],
    [{ clearNightFraction: 0 }, "clearNightFraction", /clear-night fraction/i],
    [{ moon: { minSeparationDeg: 200 } }, "moon.minSeparationDeg", /Moon separation/i],
    [{ moon: { maxIlluminatedFraction: 1.5 } }, "moon.maxIlluminatedFraction", /Moon illumination/i],
    [{ cycleEndNightIso: "2022-02-01" }, "cycleEndNightIso", /last night of the cycle/i],
    [{ cycleEndNightIso: "2023-12-31" }, "cycleEndNightIso", /at most 366 nights/],
    [{ cycleStartNightIso: "2022-02-30" }, "cycleStartNightIso", /real calendar date/],
  ] as const)("%o", (change, field, words) => {
    try {
      observingSchedule({ ...valid, ...change } as Parameters<typeof observingSchedule>[0]);
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(AppError);
      const fields = (error as AppError).fields!;
      expect(fields[field]?.[0]).toMatch(words);
    }
  });
});
