/**
 * How the science cases write their numbers and the schedule's gaps: numbers by the product's
 * formatSignificant (three significant digits), angles in µas, mas or arcsec (rotations up to
 * arcmin and degrees), speeds in km/s, times in s, h, d or yr, whichever keeps the number short, and
 * dates as UTC date and clock.
 */

import { formatUtcDateTime } from "@/lib/astro/sky-format";
import { dateFromJdUtc } from "@/lib/astro/time";
import { ARCSECOND_RAD, DAY_S, JULIAN_YEAR_S, MICROARCSECOND_RAD, MILLIARCSECOND_RAD } from "@/lib/physics/constants";
import { formatSignificant } from "@/lib/numbers/significant";
import type { ScheduleGapReason } from "@/lib/schedule/types";

const DIGITS = 3;

/** A plain number, three significant digits ("10.1", "3.3 × 10⁻⁷"). */
export function numberWords(value: number): string {
  return formatSignificant(value, DIGITS);
}

/** An angle given in radians: µas below 1 mas, mas below 1″, else arcsec. */
export function angleWords(angleRad: number): string {
  const magnitudeMas = Math.abs(angleRad) / MILLIARCSECOND_RAD;
  if (magnitudeMas < 1) return `${numberWords(angleRad / MICROARCSECOND_RAD)} µas`;
  if (magnitudeMas < 1000) return `${numberWords(angleRad / MILLIARCSECOND_RAD)} mas`;
  return `${numberWords(angleRad / ARCSECOND_RAD)}″`;
}

/** A rotation (a periapsis advance) given in radians: degrees from 1°, arcminutes from 1′, else as angleWords. */
export function rotationWords(angleRad: number): string {
  const magnitudeArcsec = Math.abs(angleRad) / ARCSECOND_RAD;
  if (magnitudeArcsec >= 3600) return `${numberWords(angleRad / (3600 * ARCSECOND_RAD))}°`;
  if (magnitudeArcsec >= 60) return `${numberWords(angleRad / (60 * ARCSECOND_RAD))}′`;
  return angleWords(angleRad);
}

/** A speed given in km/s ("206 km/s"). */
export function speedWords(kmPerS: number): string {
  return `${numberWords(kmPerS)} km/s`;
}

/** Days below which a span is written in days, above in Julian years (the bench's reading). */
const MAX_DAYS = 1000;

/** A time span given in days: seconds below 2 min, minutes below 2 h, hours below 1 d, days below 1000 d, else years. */
export function daysWords(days: number): string {
  const magnitudeS = Math.abs(days) * DAY_S;
  if (magnitudeS >= MAX_DAYS * DAY_S) return `${numberWords((days * DAY_S) / JULIAN_YEAR_S)} yr`;
  if (magnitudeS >= DAY_S) return `${numberWords(days)} d`;
  if (magnitudeS >= 7200) return `${numberWords(days * 24)} h`;
  if (magnitudeS >= 120) return `${numberWords(days * 1440)} min`;
  return `${numberWords(days * DAY_S)} s`;
}

/** Julian dates a calendar date is written for: JavaScript's dates reach ±10⁸ days from 1970. */
const LATEST_CALENDAR_JD = 2_440_587.5 + 1e8;
const EARLIEST_CALENDAR_JD = 2_440_587.5 - 1e8;

/** Whether a Julian date can be written as a calendar date. */
export function isCalendarDate(jdUtc: number): boolean {
  return jdUtc >= EARLIEST_CALENDAR_JD && jdUtc <= LATEST_CALENDAR_JD;
}

/** "2027-07-03 04:00 UTC" for a Julian date (UTC); "JD 1.2 × 10⁹" beyond the calendar (t0 ± a huge t_E). */
export function dateWords(jdUtc: number): string {
  return isCalendarDate(jdUtc) ? formatUtcDateTime(jdUtc) : `JD ${numberWords(jdUtc)}`;
}

/** "2027-07-03": the UTC calendar day of a Julian date. */
export function dayWords(jdUtc: number): string {
  return isCalendarDate(jdUtc) ? dateFromJdUtc(jdUtc).toISOString().slice(0, 10) : dateWords(jdUtc);
}

/** "1 visit", "12 visits". */
export function visitsWords(count: number): string {
  return `${count} ${count === 1 ? "visit" : "visits"}`;
}

/** Where an instant lies when it is not in a usable window, as the end of "… falls …". */
const gapWords: Record<ScheduleGapReason, string> = {
  daylight: "in daylight (the Sun is above the twilight limit)",
  "below-limit": "while the target is below the airmass limit",
  moon: "in time lost to the Moon (too close to the target, or too bright)",
  sun: "while the target is too close to the Sun (within the safe elongation)",
  weather: "on a night counted as lost to weather (the clear-night fraction)",
};

export function gapReasonWords(reason: ScheduleGapReason): string {
  return gapWords[reason];
}

/** Where an instant lies between the target's observing seasons, as the end of "… falls …". */
export const SEASON_GAP_WORDS = "in the season gap: at that time of year the target is not up in darkness, being too close to the Sun in the sky";

/** Asked where a question needs the schedule and the proposal has no site or cycle. */
export const NO_SCHEDULE_SENTENCE = "Set the observing site and the cycle's first and last nights to simulate the nights and count the visits.";
