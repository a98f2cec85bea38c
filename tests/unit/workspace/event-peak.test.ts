import { describe, expect, test } from "vitest";
import fixture from "../../fixtures/epochs.json";
import { EventPeakError, formatEventPeak, parseEventPeakJdUtc } from "@/lib/workspace/event-peak";

// Julian dates of UTC calendar times from astropy.time (tests/fixtures/generate_epochs.py).
describe("event peak times as typed", () => {
  test.each(fixture.rows)("$typed is JD $jdUtc (astropy.time)", ({ typed, jdUtc }) => {
    expect(parseEventPeakJdUtc(typed)).toBeCloseTo(jdUtc, 7); // 0.01 s
  });

  test("a Julian date is read as typed, with or without JD", () => {
    expect(parseEventPeakJdUtc("JD 2461571.69")).toBe(2461571.69);
    expect(parseEventPeakJdUtc("2461571.69")).toBe(2461571.69);
    expect(parseEventPeakJdUtc(2461571.69)).toBe(2461571.69);
  });

  test.each([
    ["", /empty/],
    ["next June", /is not a date/],
    ["2027-02-30", /does not exist/],
    ["2027-13-01", /month/],
    ["2027-06-15 25:00", /time of day/],
    ["1999-12-31", /between 2000 and 2099/],
    ["JD 245", /between 2000 and 2099/],
  ])("%j is refused in words", (typed, message) => {
    expect(() => parseEventPeakJdUtc(typed)).toThrow(EventPeakError);
    expect(() => parseEventPeakJdUtc(typed)).toThrow(message);
  });

  test("a stored peak reads back as a UTC date with its JD", () => {
    expect(formatEventPeak(2461571.6875)).toBe("2027-06-15 04:30 UTC (JD 2461571.69)");
  });
});
