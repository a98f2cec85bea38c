import { defaultPhotometrySettings } from "@/lib/workspace/photometry-schema";
import { describe, expect, it } from "vitest";
import { currentNightIso } from "@/lib/astro/time";
import { cycleTooLongMessage, nightCountInclusive, SEASON_DEFAULT_NIGHTS, SEASON_MAX_NIGHTS, SEASON_MIN_NIGHTS } from "@/lib/astro/season-length";
import { defaultSkyQuery, parseSkyQuery } from "@/lib/astro/sky-query";
import { parseScheduleConditions, type ScheduleConditions } from "@/lib/schedule/request";
import { proposalSettingsErrors } from "@/lib/workspace/proposal-schema";

// A whole non-leap year and one night: 1 January 2031 to 1 January 2032, 366 nights.
const conditions: ScheduleConditions = {
  site: { name: "Ridge", latitudeDeg: -27.5, longitudeEastDeg: -66.9, elevationM: 2300, horizonLimitDeg: 15 },
  cycleStartNightIso: "2031-01-01",
  cycleEndNightIso: "2032-01-01",
  cadenceHours: 4,
  visitMinutes: 20,
};
const noInterferometer = { interferometerWavelengthMm: null, interferometerBaselineKm: null, visitMinutes: 20 };

describe("cycle nights", () => {
  it("counts nights inclusively across month ends (proleptic Gregorian calendar)", () => {
    // 1 Feb – 2 Aug 2031: 28 + 31 + 30 + 31 + 30 + 31 + 2 = 183 nights (2031 is not a leap year).
    expect(nightCountInclusive("2031-02-01", "2031-08-02")).toBe(183);
    expect(nightCountInclusive("2032-02-28", "2032-03-01")).toBe(3); // 2032 is a leap year: 28, 29 Feb, 1 Mar.
    expect(nightCountInclusive("2031-02-01", "2031-02-01")).toBe(1);
    expect(nightCountInclusive("2031-02-02", "2031-02-01")).toBe(0); // the last before the first
    // A leap year's calendar year: 366 evenings, 1 January to 31 December 2032.
    expect(nightCountInclusive("2032-01-01", "2032-12-31")).toBe(366);
  });

  it("refuses a cycle longer than a leap year's 366 nights, in the words the schedule uses", () => {
    // 2031-01-01 + 365 days = 2032-01-01 (2031 is not a leap year): the 366th night.
    const tooLong = proposalSettingsErrors({ cycleStartDate: "2031-01-01", cycleEndDate: "2032-01-02", instrument: noInterferometer, photometry: defaultPhotometrySettings });
    expect(tooLong).toEqual({ cycleEndDate: ["The cycle is at most 366 nights (last night 2032-01-01 at the latest)."] });
    expect(tooLong.cycleEndDate).toEqual([cycleTooLongMessage("2031-01-01")]);
    expect(proposalSettingsErrors({ cycleStartDate: "2031-01-01", cycleEndDate: "2032-01-01", instrument: noInterferometer, photometry: defaultPhotometrySettings })).toEqual({});
    expect(proposalSettingsErrors({ cycleStartDate: "2032-01-01", cycleEndDate: "2032-12-31", instrument: noInterferometer, photometry: defaultPhotometrySettings })).toEqual({});
  });

  it("quotes the same limits on the sky page, in the season request and in the schedule", () => {
    expect([SEASON_MIN_NIGHTS, SEASON_DEFAULT_NIGHTS, SEASON_MAX_NIGHTS]).toEqual([1, 183, 366]);
    expect(parseSkyQuery({ ...defaultSkyQuery("2031-06-15"), nights: "367" }).errors?.nights).toBe("The season is a whole number of nights from 1 to 366.");
    expect(parseSkyQuery({ ...defaultSkyQuery("2031-06-15"), nights: "1" }).errors).toBeNull();
    expect(defaultSkyQuery("2031-06-15").nights).toBe("183");
    expect(() => parseScheduleConditions({ ...conditions, cycleEndNightIso: "2032-01-02" })).toThrow(cycleTooLongMessage("2031-01-01"));
    expect(parseScheduleConditions(conditions).nightCount).toBe(366);
  });
});

describe("the current night at a site", () => {
  it("belongs to the previous evening before local noon, by mean solar time", () => {
    // 2031-03-10 06:00 UTC at 70.4° W is 01:18 local mean time: still the night of the 9th.
    expect(currentNightIso(new Date("2031-03-10T06:00:00Z"), -70.4)).toBe("2031-03-09");
    // 20:00 UTC there is 15:18 local: tonight is the 10th.
    expect(currentNightIso(new Date("2031-03-10T20:00:00Z"), -70.4)).toBe("2031-03-10");
    // Across the date line: 2031-03-10 06:00 UTC at 178° E is 17:52 local on the 10th.
    expect(currentNightIso(new Date("2031-03-10T06:00:00Z"), 178)).toBe("2031-03-10");
  });
});
