/**
 * The time column of a photometry file and its conversion to the fit's time: the geocentric Julian
 * date in UTC, as the product stores an event's peak t0 ("JD, UTC", `eventPeakJdUtc`).
 */
import { geocentricJd } from "./light-time";
import { jdTtFromScale, jdUtcFromScale, type TimeScale } from "./time-scales";

/** What a time column counts: a Julian date at the geocentre (JD, MJD), the Sun (HJD) or the barycentre (BJD). */
export const timeKinds = ["JD", "MJD", "HJD", "BJD"] as const;
export type TimeKind = (typeof timeKinds)[number];

/** MJD = JD − 2400000.5 (IAU 1997 Resolution B1). */
export const MJD_OFFSET_DAYS = 2_400_000.5;

/**
 * The offsets a JD, HJD or BJD column may be written with ("HJD − 2450000", common practice in survey
 * files; 2400000.5 for a heliocentric or barycentric MJD).
 */
export const timeOffsetsDays = [0, 2_400_000, MJD_OFFSET_DAYS, 2_450_000, 2_460_000] as const;

export interface EventTimeFormat {
  kind: TimeKind;
  /** Days added to a cell to give the full date of its kind (one of `timeOffsetsDays`); an MJD takes MJD_OFFSET_DAYS. */
  offsetDays: number;
  scale: TimeScale;
}

/** Where the event is (ICRS, degrees): an HJD or BJD depends on it. */
export interface EventDirection {
  raDeg: number;
  decDeg: number;
}

/** Our rule: photometry from 1990-01-01 (JD 2447892.5) to 2100-01-01 (JD 2488069.5); outside, the offset or format is likely wrong. */
export const EARLIEST_PHOTOMETRY_JD = 2_447_892.5;
export const LATEST_PHOTOMETRY_JD = 2_488_069.5;

/** The full Julian date (of its kind and scale) a cell's number stands for. */
export function fullJd(value: number, format: Pick<EventTimeFormat, "kind" | "offsetDays">): number {
  return value + (format.kind === "MJD" ? MJD_OFFSET_DAYS : format.offsetDays);
}

/**
 * The geocentric UTC Julian date of a cell's number `value` (days) in `format`; `direction` is needed
 * for an HJD or BJD. Worst difference from astropy 5.2 (tests/unit/event-photometry/conversions.test.ts,
 * 2016–2030): 5e-10 d for JD/MJD in UTC, TT or TDB (rounding), 3e-8 d (3 ms) for HJD, 7e-8 d (6 ms)
 * for BJD. An HJD or BJD in UTC whose light time spans a leap second is read as the clock's reading
 * plus the delay, one second off astropy's elapsed-time sum: UTC is the wrong scale for such dates.
 */
export function jdUtcOfTime(value: number, format: EventTimeFormat, direction?: EventDirection): number {
  const jd = fullJd(value, format);
  if (format.kind === "JD" || format.kind === "MJD") return jdUtcFromScale(jd, format.scale);
  if (direction === undefined) throw new RangeError(`An ${format.kind} needs the event's position.`);
  const toJdTt = (date: number) => jdTtFromScale(date, format.scale);
  const geocentric = geocentricJd(jd, format.kind === "HJD" ? "sun" : "barycentre", direction.raDeg, direction.decDeg, toJdTt);
  return jdUtcFromScale(geocentric, format.scale);
}
