/**
 * The event's peak time t0 as astronomers type it: a UTC calendar date with an optional time
 * ("2027-06-15", "2027-06-15 04:30", "2027-06-15T04:30:00Z") or a Julian date ("JD 2461571.69",
 * "2461571.69", "MJD 61571.19"). Stored as a Julian date in UTC; heliocentric corrections (at most
 * 8.3 min) are below what a schedule of nights resolves, so an HJD is read as a JD and said so.
 */
import { dateFromJdUtc, jdUtcFromDate } from "@/lib/astro/time";

/** Accepted peak times: 1 January 2000 to 1 January 2100 UTC, the span the ephemeris serves well (our rule). */
export const EVENT_PEAK_MIN_JD = 2_451_544.5;
export const EVENT_PEAK_MAX_JD = 2_488_069.5;
const MJD_OFFSET = 2_400_000.5;
const MAX_EPOCH_CHARS = 40;

export class EventPeakError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "EventPeakError";
  }
}

const calendarPattern = /^(\d{4})-(\d{2})-(\d{2})(?:[ T](\d{1,2}):(\d{2})(?::(\d{2}(?:\.\d+)?))?)?\s*(?:Z|UTC)?$/i;
const julianPattern = /^(H?JD|MJD)?\s*(\d+(?:\.\d+)?)$/i;

const EXAMPLE = "type a UTC date such as 2027-06-15 04:30, or a Julian date such as JD 2461571.69";

/** A field read as a date: how a message names it, and the span it accepts (Julian dates, UTC, from inclusive, to exclusive). */
interface EpochField {
  /** "The event peak". */
  name: string;
  minJd: number;
  maxJd: number;
  /** The span in words: "between 2000 and 2099". */
  spanWords: string;
}

const eventPeakField: EpochField = { name: "The event peak", minJd: EVENT_PEAK_MIN_JD, maxJd: EVENT_PEAK_MAX_JD, spanWords: "between 2000 and 2099" };

/**
 * Accepted times of periapsis: 1 January 1900 to 1 January 2100 UTC (our rule: any passage since
 * 1900 serves, the next one is found from the period; the ephemeris span of the schedule is not
 * needed for a passage itself).
 */
const PERIAPSIS_MIN_JD = 2_415_020.5;
const periapsisField: EpochField = { name: "The time of periapsis", minJd: PERIAPSIS_MIN_JD, maxJd: EVENT_PEAK_MAX_JD, spanWords: "between 1900 and 2099" };

function calendarJdUtc(match: RegExpExecArray, field: EpochField): number {
  const [year, month, day, hour = 0, minute = 0] = match.slice(1, 6).map((part) => (part === undefined ? 0 : Number(part)));
  const seconds = match[6] === undefined ? 0 : Number(match[6]);
  if (month < 1 || month > 12) throw new EventPeakError(`${field.name}'s month must be 01 to 12 (got ${match[2]}).`);
  if (hour > 23 || minute > 59 || seconds >= 60) throw new EventPeakError(`${field.name}'s time of day must be 00:00 to 23:59:59.`);
  const ms = Date.UTC(year, month - 1, day, hour, minute) + seconds * 1000;
  const date = new Date(ms);
  if (date.getUTCDate() !== day) throw new EventPeakError(`${field.name}'s date ${match[0].slice(0, 10)} does not exist.`);
  return jdUtcFromDate(date);
}

/** Reads a typed date or Julian date into a Julian date (UTC); throws `EventPeakError` in the user's words naming the field. */
function parseEpochJdUtc(input: string | number, field: EpochField): number {
  const text = typeof input === "number" ? String(input) : input.trim();
  if (text.length === 0) throw new EventPeakError(`${field.name} is empty; ${EXAMPLE}.`);
  if (text.length > MAX_EPOCH_CHARS) throw new EventPeakError(`${field.name} is at most ${MAX_EPOCH_CHARS} characters; ${EXAMPLE}.`);
  const calendar = calendarPattern.exec(text);
  const julian = calendar ? null : julianPattern.exec(text);
  if (!calendar && !julian) throw new EventPeakError(`${field.name} "${text}" is not a date; ${EXAMPLE}.`);
  const jdUtc = calendar ? calendarJdUtc(calendar, field) : julian![1]?.toUpperCase() === "MJD" ? Number(julian![2]) + MJD_OFFSET : Number(julian![2]);
  if (!(jdUtc >= field.minJd && jdUtc < field.maxJd)) {
    throw new EventPeakError(`${field.name} must fall ${field.spanWords} (JD ${field.minJd} to ${field.maxJd}); ${EXAMPLE}.`);
  }
  return jdUtc;
}

/** Reads a typed peak time into a Julian date (UTC); throws `EventPeakError` in the user's words. */
export function parseEventPeakJdUtc(input: string | number): number {
  return parseEpochJdUtc(input, eventPeakField);
}

/** Reads a typed time of periapsis passage (the orbiting star's) as the event peak is read; throws `EventPeakError`. */
export function parsePeriapsisJdUtc(input: string | number): number {
  return parseEpochJdUtc(input, periapsisField);
}

/** A stored peak time for people: "2027-06-15 04:30 UTC (JD 2461571.69)". */
export function formatEventPeak(jdUtc: number): string {
  const iso = dateFromJdUtc(jdUtc).toISOString();
  return `${iso.slice(0, 10)} ${iso.slice(11, 16)} UTC (JD ${jdUtc.toFixed(2)})`;
}

/** A stored peak as text the peak field reads back exactly ("JD 2461571.6875"), for forms and links. */
export function eventPeakText(jdUtc: number): string {
  return `JD ${jdUtc}`;
}
