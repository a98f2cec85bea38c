/**
 * Time scales and the "night of a date". Times are Julian dates in UTC (`jdUtc`); astronomy-engine
 * counts UT days from J2000 and treats UT1 as UTC (|UT1 − UTC| < 0.9 s, i.e. under 14″ of hour angle).
 */
import { AstroTime } from "astronomy-engine";
import { DAY_MS, J2000_JD } from "./constants";

/** Julian date (UTC) of an instant. Exact arithmetic on the Unix epoch (JD 2440587.5). */
export function jdUtcFromDate(date: Date): number {
  return date.getTime() / DAY_MS + 2_440_587.5;
}

/** The instant of a Julian date (UTC), to the millisecond. */
export function dateFromJdUtc(jdUtc: number): Date {
  return new Date(Math.round((jdUtc - 2_440_587.5) * DAY_MS));
}

/** astronomy-engine's time object for a Julian date (UTC). */
export function astroTimeFromJdUtc(jdUtc: number): AstroTime {
  return new AstroTime(jdUtc - J2000_JD);
}

/**
 * Start of the night named by `nightDateIso` (the local calendar date of its evening): local mean
 * noon of that date at the site's longitude, as a Julian date (UTC). A night runs from this noon to
 * the next, so the whole dark period lies inside one window at every longitude, including sites near
 * the date line whose evening falls on the previous or next UTC date. Mean solar time rather than a
 * civil time zone keeps the window independent of politics; the Sun's true noon differs by the
 * equation of time (at most about 16 minutes), far from the dark hours.
 */
export function nightStartJdUtc(nightDateIso: string, longitudeEastDeg: number): number {
  const [year, month, day] = nightDateIso.split("-").map(Number);
  const noonUtcMs = Date.UTC(year, month - 1, day, 12);
  return noonUtcMs / DAY_MS + 2_440_587.5 - longitudeEastDeg / 360;
}

/** The date `days` after `nightDateIso`, as `YYYY-MM-DD` (proleptic Gregorian, UTC arithmetic). */
export function addDaysIso(nightDateIso: string, days: number): string {
  const [year, month, day] = nightDateIso.split("-").map(Number);
  return new Date(Date.UTC(year, month - 1, day + days)).toISOString().slice(0, 10);
}

/**
 * The evening date (`YYYY-MM-DD`) of the night under way or coming next at `now` for a site at
 * `longitudeEastDeg`: the date in local mean solar time (UTC + longitude/15 h), minus one day
 * before local noon, so that 03:00 belongs to the night that began the evening before.
 */
export function currentNightIso(now: Date, longitudeEastDeg: number): string {
  const localMs = now.getTime() + (longitudeEastDeg / 15) * 3_600_000;
  const local = new Date(localMs);
  const dateIso = local.toISOString().slice(0, 10);
  return local.getUTCHours() < 12 ? addDaysIso(dateIso, -1) : dateIso;
}
