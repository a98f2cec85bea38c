import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { jdUtcFromDate } from "@/lib/astro/time";
import { jdUtcOfTime, type EventTimeFormat } from "@/lib/event-photometry/event-time";
import { roemerDelayDays } from "@/lib/event-photometry/light-time";
import { jdTtFromJdUtc, jdUtcFromJdTt, taiMinusUtcSeconds, tdbMinusTtSeconds } from "@/lib/event-photometry/time-scales";

/**
 * Times against astropy 5.2 `Time` (ERFA leap seconds, TT, full TDB series, `light_travel_time` with
 * its built-in ephemeris at the geocentre) for three targets and instants 2016–2030 across the leap
 * second at the end of 2016-12-31: tests/fixtures/generate_event_photometry.py.
 */
type ConversionRow = {
  target: string;
  raDeg: number;
  decDeg: number;
  isoUtc: string;
  mjdUtc: number;
  jdTt: number;
  jdTdb: number;
} & Record<`${"hjd" | "bjd"}_${"utc" | "tt" | "tdb"}`, number>;
const fixture = JSON.parse(readFileSync("tests/fixtures/event-photometry/conversions.json", "utf8")) as { versions: Record<string, string>; rows: ConversionRow[] };

/** Our bound: 1e-6 d (0.086 s), far below a minute, the least a microlensing light curve resolves. */
const TOLERANCE_DAYS = 1e-6;

/**
 * An HJD or BJD in UTC whose light time spans a leap second: we add the delay to the clock's
 * reading, astropy adds it as elapsed seconds, so the two differ by the leap second.
 */
const LEAP_SECOND_JD_UTC = 2_457_754.5;
const straddlesLeapSecond = (format: EventTimeFormat, jdUtc: number, written: number) =>
  format.kind !== "JD" && format.kind !== "MJD" && format.scale === "UTC" && Math.sign(jdUtc - LEAP_SECOND_JD_UTC) !== Math.sign(written - LEAP_SECOND_JD_UTC);

const cases: { label: string; key: keyof ConversionRow; format: EventTimeFormat }[] = [
  { label: "MJD (UTC)", key: "mjdUtc", format: { kind: "MJD", offsetDays: 0, scale: "UTC" } },
  { label: "JD (TT)", key: "jdTt", format: { kind: "JD", offsetDays: 0, scale: "TT" } },
  { label: "JD (TDB)", key: "jdTdb", format: { kind: "JD", offsetDays: 0, scale: "TDB" } },
  ...(["utc", "tt", "tdb"] as const).flatMap((scale) =>
    (["hjd", "bjd"] as const).map((kind) => ({
      label: `${kind.toUpperCase()} (${scale.toUpperCase()})`,
      key: `${kind}_${scale}` as const,
      format: { kind: kind.toUpperCase() as "HJD" | "BJD", offsetDays: 0, scale: scale.toUpperCase() as "UTC" | "TT" | "TDB" },
    })),
  ),
];

describe(`time conversions against astropy ${fixture.versions.astropy}`, () => {
  it.each(cases)("$label → JD (UTC) within 1e-6 d at every target and instant", ({ label, key, format }) => {
    let worst = 0;
    let straddled = false;
    for (const row of fixture.rows) {
      const truth = jdUtcFromDate(new Date(`${row.isoUtc}Z`));
      const error = Math.abs(jdUtcOfTime(row[key] as number, format, row) - truth);
      if (straddlesLeapSecond(format, truth, row[key] as number)) {
        expect(Math.abs(error - 1 / 86400), `${row.target} ${row.isoUtc}: one leap second apart`).toBeLessThan(TOLERANCE_DAYS);
        straddled = true;
        continue;
      }
      worst = Math.max(worst, error);
      expect(error, `${row.target} ${row.isoUtc}`).toBeLessThan(TOLERANCE_DAYS);
    }
    expect(straddled, "the fixture has an instant whose light time spans the leap second").toBe(format.scale === "UTC" && format.kind !== "JD" && format.kind !== "MJD");
    console.log(`${label}: worst |ours − astropy| = ${worst.toExponential(2)} d (${(worst * 86400 * 1000).toFixed(3)} ms)`);
  });

  it("TAI − UTC steps from 36 s to 37 s at 2017-01-01 00:00 UTC (IERS Bulletin C 52)", () => {
    expect(taiMinusUtcSeconds(2_457_754.5 - 1 / 86400)).toBe(36);
    expect(taiMinusUtcSeconds(2_457_754.5)).toBe(37);
  });

  it("TT ↔ UTC round-trips to rounding on both sides of the leap second", () => {
    for (const jdUtc of [2_457_754.4, 2_457_754.5 - 2 / 86400, 2_457_754.5 + 1 / 86400, 2_461_235.6]) {
      expect(Math.abs(jdUtcFromJdTt(jdTtFromJdUtc(jdUtc)) - jdUtc)).toBeLessThan(1e-9);
    }
  });

  it("TDB − TT stays within its ±1.7 ms amplitude (Fairhead & Bretagnon 1990)", () => {
    for (let jd = 2_457_000; jd < 2_462_000; jd += 37) expect(Math.abs(tdbMinusTtSeconds(jd))).toBeLessThan(0.00168);
  });

  it("the Rømer delay towards the ecliptic pole is small and towards the Sun's opposite ~ +499 s", () => {
    // At the June solstice the Earth is at ecliptic longitude ~270°: the direction RA 270°, Dec −23.44° points along it.
    const june = jdTtFromJdUtc(jdUtcFromDate(new Date("2026-06-21T12:00:00Z")));
    expect(roemerDelayDays(june, "sun", 270, -23.44) * 86400).toBeGreaterThan(480);
    expect(Math.abs(roemerDelayDays(june, "sun", 270, 66.56) * 86400)).toBeLessThan(15);
  });
});
