import { describe, expect, it } from "vitest";
import { seasonWindows, weekWithMostTargetsAtBest } from "@/lib/astro/season";
import { bestWeeksText, clearNightsText, moonRuleText, observingSeasonsText, seasonViewOfSchedules, seasonViewOfWindows, seasonWeekCount, weekRangeText } from "@/lib/figures/season-view";
import { emptyScheduleMessage, observingSchedules, type ObservingSeason } from "@/lib/schedule";
import { bulge, northSite, southSite } from "./sites";

const season = (firstNightIso: string, lastNightIso: string, lengthDays: number): ObservingSeason => ({
  startJdUtc: 0,
  endJdUtc: lengthDays,
  nightCount: 0,
  usableNightCount: 0,
  firstNightIso,
  lastNightIso,
  lengthDays,
});

describe("season view text", () => {
  it("writes each observing season as first – last night with its length in whole days", () => {
    expect(observingSeasonsText([season("2031-02-01", "2031-06-19", 137.8)])).toBe("2031-02-01 – 2031-06-19 (138 d)");
    expect(observingSeasonsText([season("2031-02-01", "2031-04-05", 63.0), season("2031-07-02", "2031-08-02", 31.0)])).toBe(
      "2031-02-01 – 2031-04-05 (63 d); 2031-07-02 – 2031-08-02 (31 d)",
    );
    expect(observingSeasonsText([])).toBe("none");
  });

  it("says the Moon constraint and the clear-night fraction in words", () => {
    expect(moonRuleText({ minSeparationDeg: 30, maxIlluminatedFraction: null })).toBe("at least 30° from the Moon");
    expect(moonRuleText({ minSeparationDeg: 30, maxIlluminatedFraction: 0.6 })).toBe("at least 30° from the Moon, and no Moon more than 60% illuminated above the horizon");
    expect(moonRuleText({ maxIlluminatedFraction: 0 })).toBe("no Moon more than 0% illuminated above the horizon");
    expect(moonRuleText({})).toBe("no Moon constraint");
    expect(clearNightsText(1)).toBe("with a clear-night fraction of 1, every night");
    expect(clearNightsText(0.7)).toBe("a clear-night fraction of 0.7 keeps 70% of the nights, spread evenly");
  });

  it("names a week by its first and last night, the last block shorter", () => {
    const nights = Array.from({ length: 10 }, (_, night) => `2031-02-${String(night + 1).padStart(2, "0")}`);
    expect(seasonWeekCount(nights)).toBe(2);
    expect(weekRangeText(nights, 0)).toBe("2031-02-01 – 2031-02-07");
    expect(weekRangeText(nights, 1)).toBe("2031-02-08 – 2031-02-10");
    expect(bestWeeksText(nights, [1, 0])).toBe("2031-02-08 – 2031-02-10; 2031-02-01 – 2031-02-07");
    expect(bestWeeksText(nights, [1, 0], 1)).toBe("2031-02-08 – 2031-02-10");
    expect(bestWeeksText(nights, [])).toBe("—");
  });
});

describe("seasonViewOfSchedules", () => {
  // Three weeks of June 2022 from the southern site: the bulge high at midnight, a far-northern
  // field that never rises from 30° S (its upper culmination is 10° below the horizon), and an evening field (RA 10h,
  // Dec +10°) that the Sun approaches night by night, with a 60° safe elongation.
  const names = ["Bulge field", "Far north", "Evening field"];
  const targets = [bulge, { raDeg: 200, decDeg: 70 }, { raDeg: 150, decDeg: 10 }];
  const conditions = {
    site: southSite,
    cycleStartNightIso: "2022-06-10",
    cycleEndNightIso: "2022-06-30",
    limits: { airmassLimit: 4, safeSunElongationDeg: 60 },
    moon: { minSeparationDeg: 30 },
    cadenceHours: 4,
    visitMinutes: 20,
    clearNightFraction: 0.7,
  };
  const schedules = observingSchedules({ ...conditions, targets });
  const view = seasonViewOfSchedules(names, schedules);

  it("shows each target's own schedule: its hours, best weeks, seasons and visits", () => {
    expect(view.nightDatesIso).toHaveLength(21);
    expect(view.nightDatesIso[0]).toBe("2022-06-10");
    expect(view.nightDatesIso[20]).toBe("2022-06-30");
    for (const [index, row] of view.rows.entries()) {
      expect(row.name).toBe(names[index]);
      expect(row.hoursPerNight).toBe(schedules[index].usableHoursPerNight);
      expect(row.bestWeekIndices).toEqual(schedules[index].bestWeekIndices);
      expect(row.seasons).toBe(schedules[index].seasons);
      expect(row.visitCount).toBe(schedules[index].visitsJdUtc.length);
    }
    expect(view.rows[0]).toMatchObject({ isEmpty: false, emptyMessage: null });
    expect(view.rows[0].visitCount).toBeGreaterThan(0);
    expect(observingSeasonsText(view.rows[0].seasons)).toMatch(/^2022-06-1\d – 2022-06-30 \(\d+ d\)$/);
  });

  it("says in words why a target gets no visit", () => {
    expect(view.rows[1]).toMatchObject({ isEmpty: true, visitCount: 0, seasons: [], bestWeekIndices: [], emptyMessage: emptyScheduleMessage("never-up") });
  });

  it("marks the nights lost to the Sun rule: those with a Sun gap, where no hour is usable", () => {
    const evening = schedules[2];
    const sunNights = [...new Set(evening.gaps.filter((gap) => gap.reason === "sun").map((gap) => Math.floor(gap.startJdUtc - evening.cycle.startJdUtc)))].sort((a, b) => a - b);
    const flagged = [...view.rows[2].tooCloseToSunPerNight].flatMap((flag, night) => (flag ? [night] : []));
    // The Sun gains on the field through the range: the last nights are lost, the first are not.
    expect(flagged.length).toBeGreaterThan(0);
    expect(flagged[0]).toBeGreaterThan(0);
    expect(flagged[flagged.length - 1]).toBe(20);
    expect(flagged).toEqual(sunNights);
    for (const night of flagged) expect(evening.usableHoursPerNight[night]).toBe(0);
    expect(view.rows[2].visitCount).toBeGreaterThan(0);
    expect(view.rows[0].tooCloseToSunPerNight.every((flag) => flag === 0)).toBe(true);
  });

  it("shades against the largest usable hours of any target, and counts targets (not hours) for the headline week", () => {
    expect(view.scaleMaxHours).toBe(Math.max(...schedules.flatMap((schedule) => [...schedule.usableHoursPerNight])));
    const headline = weekWithMostTargetsAtBest(view.rows, seasonWeekCount(view.nightDatesIso));
    expect(headline).not.toBeNull();
    expect(headline!.targetCount).toBe(view.rows.filter((row) => row.bestWeekIndices.includes(headline!.weekIndex)).length);
    expect(headline!.targetCount).toBeLessThanOrEqual(2);
  });
});

describe("seasonViewOfWindows", () => {
  it("fills the same view from the sky page's dark hours, unnamed targets numbered", () => {
    const windows = seasonWindows({ site: northSite, targets: [{ raDeg: 300, decDeg: 20 }, { name: "Deep south", raDeg: 200, decDeg: -80 }], startNightIso: "2022-03-01", nightCount: 14 });
    const view = seasonViewOfWindows(windows);
    expect(view.rows.map((row) => row.name)).toEqual(["target 1", "Deep south"]);
    expect(view.rows[0].hoursPerNight).toBe(windows.targets[0].hoursDarkPerNight);
    expect(view.rows[1].isEmpty).toBe(true);
    expect(view.scaleMaxHours).toBe(Math.max(...windows.hoursDarkPerNight));
  });
});
