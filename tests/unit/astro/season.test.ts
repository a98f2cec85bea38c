import { describe, expect, it } from "vitest";
import { bestWeekIndices, seasonWindows, weeklySums, weekWithMostTargetsAtBest } from "@/lib/astro/season";
import { SEASON_MAX_NIGHTS } from "@/lib/astro/season-length";
import { addDaysIso, nightStartJdUtc } from "@/lib/astro/time";
import { nightlyVisibility } from "@/lib/astro/visibility";
import { AppError } from "@/lib/errors";

const northSite = { latitudeDeg: 40.5, longitudeEastDeg: -4.2, elevationM: 1500, horizonLimitDeg: 10 };
const datelineSite = { latitudeDeg: -16.5, longitudeEastDeg: 179.3, elevationM: 100 };

describe("seasonWindows", () => {
  it("gives each night the same usable dark hours as the nightly view (shared grid and kernel)", () => {
    const targets = [{ raDeg: 83.8221, decDeg: -5.3911 }, { raDeg: 10.6847, decDeg: 41.2688 }];
    const season = seasonWindows({ site: datelineSite, targets, startNightIso: "2022-12-28", nightCount: 10 });
    expect(season.nightDatesIso[4]).toBe("2023-01-01");
    for (const night of [0, 4, 9]) {
      for (const [t, target] of targets.entries()) {
        const nightly = nightlyVisibility(datelineSite, target, season.nightDatesIso[night]);
        expect(season.targets[t].hoursDarkPerNight[night]).toBeCloseTo(nightly.hoursDarkAboveLimit, 4);
      }
      expect(season.hoursDarkPerNight[night]).toBeCloseTo(nightlyVisibility(datelineSite, targets[0], season.nightDatesIso[night]).hoursDark, 4);
    }
  });

  it("flags never-observable targets with the reason: below the limit, daylight only, or the Sun", () => {
    const season = seasonWindows({
      site: northSite,
      targets: [
        { name: "deep south", raDeg: 200, decDeg: -80 },
        // Near the Sun in late June (Sun at RA ≈ 90°, Dec ≈ +23.4°, common knowledge of the solstice).
        { name: "solstice Sun field", raDeg: 90, decDeg: 23 },
        { name: "winter field", raDeg: 83.8221, decDeg: -5.3911 },
      ],
      startNightIso: "2022-06-10",
      nightCount: 21,
    });
    expect(season.targets[0]).toMatchObject({ isNeverObservable: true, neverObservableReason: "below-limit", totalHoursDark: 0 });
    expect(season.targets[1]).toMatchObject({ isNeverObservable: true, neverObservableReason: "no-dark-time" });
    expect(season.targets[2].isNeverObservable).toBe(true);
    expect(season.targets[0].bestWeekIndices).toEqual([]);
  });

  it("marks nights too close to the Sun unusable when the target would otherwise be up in darkness", () => {
    // A wide safe elongation (90°) makes an evening target near the Sun count as unsafe.
    const target = { raDeg: 165, decDeg: 25 };
    const base = { site: northSite, targets: [target], startNightIso: "2022-06-10", nightCount: 14 };
    const permissive = seasonWindows({ ...base, limits: { safeSunElongationDeg: 0, airmassLimit: 4 } });
    const strict = seasonWindows({ ...base, limits: { safeSunElongationDeg: 90, airmassLimit: 4 } });
    expect(permissive.targets[0].totalHoursDark).toBeGreaterThan(0);
    expect(strict.targets[0].totalHoursDark).toBe(0);
    expect(strict.targets[0].neverObservableReason).toBe("sun");
    expect([...strict.targets[0].tooCloseToSunPerNight].some((flag) => flag === 1)).toBe(true);
  });

  it("finds the best weeks: a target rising earlier each night is best late in the range", () => {
    // Stars rise about 4 minutes earlier each night (sidereal minus solar day, common knowledge), so a
    // morning target in spring gains dark hours through the range.
    const season = seasonWindows({ site: northSite, targets: [{ raDeg: 300, decDeg: 20 }], startNightIso: "2022-03-01", nightCount: 42 });
    const { weeklyHoursDark, bestWeekIndices } = season.targets[0];
    expect(weeklyHoursDark.length).toBe(6);
    expect(bestWeekIndices[0]).toBe(5);
    expect(weeklyHoursDark[5]).toBeGreaterThan(weeklyHoursDark[0]);
    expect(season.weekStartDatesIso[5]).toBe("2022-04-05");
  });

  it("names the field of bad input and caps the request", () => {
    const request = { site: northSite, targets: [{ raDeg: 10, decDeg: 10 }], startNightIso: "2022-06-10", nightCount: 5 };
    expect(() => seasonWindows({ ...request, nightCount: SEASON_MAX_NIGHTS + 1 })).toThrow(/nightCount/);
    expect(() => seasonWindows({ ...request, startNightIso: "2022-02-30" })).toThrow(/startNightIso/);
    expect(() => seasonWindows({ ...request, targets: [] })).toThrow(/targets/);
    try {
      seasonWindows({ ...request, targets: [{ raDeg: 10, decDeg: 91 }] });
      expect.unreachable();
    } catch (error) {
      expect((error as AppError).fields).toHaveProperty(["targets.0.decDeg"]);
    }
    expect(() => seasonWindows({ ...request, limits: { airmassLimit: 0.5 } })).toThrow(/limits\.airmassLimit/);
  });
});

describe("best weeks are per target (the list's headline once summed 1019.9 h into a 168-hour week)", () => {
  it("sums nights into 7-night blocks and keeps the blocks within 90% of the best (our rule)", () => {
    const weekly = weeklySums(Float32Array.from({ length: 16 }, (_, night) => (night < 7 ? 1 : night < 14 ? 2 : 10)));
    expect(Array.from(weekly)).toEqual([7, 14, 20]);
    expect(bestWeekIndices(weekly)).toEqual([2]);
    expect(bestWeekIndices([10, 9.5, 3, 9.5])).toEqual([0, 1, 3]);
    expect(bestWeekIndices([0, 0])).toEqual([]);
  });

  it("names the list's headline week by how many targets have it among their best, never by hours added across them", () => {
    // Two targets best in week 0 with few hours, one best in week 2 with many: week 0 has more targets.
    const targets = [{ bestWeekIndices: [0] }, { bestWeekIndices: [0, 1] }, { bestWeekIndices: [2] }];
    expect(weekWithMostTargetsAtBest(targets, 3)).toEqual({ weekIndex: 0, targetCount: 2 });
    expect(weekWithMostTargetsAtBest([{ bestWeekIndices: [] }], 3)).toBeNull();
    expect(weekWithMostTargetsAtBest([], 0)).toBeNull();
  });
});

describe("night window and dates", () => {
  it("puts the night of a date-line site's evening on the right UTC dates", () => {
    // Local mean noon is 12:00 − longitude/15 h UTC (definition of mean solar time).
    expect(nightStartJdUtc("2022-04-20", 179.3)).toBeCloseTo(2_459_689.5 + 0.5 - 179.3 / 360, 9);
    expect(nightStartJdUtc("2022-09-10", -178.2)).toBeCloseTo(2_459_832.5 + 0.5 + 178.2 / 360, 9);
    expect(addDaysIso("2022-12-31", 1)).toBe("2023-01-01");
    expect(addDaysIso("2024-02-28", 1)).toBe("2024-02-29");
  });
});
