import { defaultPhotometrySettings } from "@/lib/workspace/photometry-schema";
import { describe, expect, it } from "vitest";
import { currentNightIso } from "@/lib/astro/time";
import { cycleNightCount, proposalSettingsErrors } from "@/lib/workspace/proposal-schema";

const noInterferometer = { interferometerWavelengthMm: null, interferometerBaselineKm: null, visitMinutes: 20 };

describe("cycle nights", () => {
  it("counts nights inclusively across month ends (proleptic Gregorian calendar)", () => {
    // 1 Feb – 2 Aug 2031: 28 + 31 + 30 + 31 + 30 + 31 + 2 = 183 nights (2031 is not a leap year).
    expect(cycleNightCount("2031-02-01", "2031-08-02")).toBe(183);
    expect(cycleNightCount("2032-02-28", "2032-03-01")).toBe(3); // 2032 is a leap year: 28, 29 Feb, 1 Mar.
    expect(cycleNightCount("2031-02-01", "2031-02-01")).toBe(1);
  });

  it("refuses a cycle longer than the season view computes", () => {
    // 2031-01-01 + 399 days = 2032-02-04 (365 days to 2032-01-01, then 34): the 400th night.
    expect(proposalSettingsErrors({ cycleStartDate: "2031-01-01", cycleEndDate: "2032-02-05", instrument: noInterferometer, photometry: defaultPhotometrySettings })).toEqual({
      cycleEndDate: ["The cycle is at most 400 nights (last night 2032-02-04 at the latest)."],
    });
    expect(proposalSettingsErrors({ cycleStartDate: "2031-01-01", cycleEndDate: "2032-02-04", instrument: noInterferometer, photometry: defaultPhotometrySettings })).toEqual({});
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
