/**
 * How long a season (the sky page's, the season figure's) or a proposal's observing cycle may be, in
 * nights, and how many nights lie between two evening dates. Every check and every message takes its
 * numbers from here, so the sky page, the season figure, the schedule and the proposal form agree.
 *
 * The limits (our rule): a cycle is at most one calendar year, and the longest calendar year, a leap
 * year, has 366 evenings (1 January to 31 December), so 366 nights hold any yearly cycle (the season
 * computation's cost grows linearly with the nights, about 60 ms a target for 183 nights, so a year
 * stays within a page's time). One night is the shortest season: the season view then shows one
 * partial week. The default, 183 nights, is half of 366: a semester.
 */
import { DAY_MS } from "./constants";
import { addDaysIso } from "./time";

/** Fewest nights in a season or a cycle. */
export const SEASON_MIN_NIGHTS = 1;

/** Most nights in a season or a cycle: a leap year's 366 evenings. */
export const SEASON_MAX_NIGHTS = 366;

/** Nights a season spans when nobody chose its length: half a year. */
export const SEASON_DEFAULT_NIGHTS = 183;

/** "from 1 to 366": the allowed season lengths as every message says them. */
export const seasonNightsRangeWords = `from ${SEASON_MIN_NIGHTS} to ${SEASON_MAX_NIGHTS}`;

/**
 * Nights from the evening of `firstNightIso` to the evening of `lastNightIso`, both counted
 * (`YYYY-MM-DD`, proleptic Gregorian calendar, UTC arithmetic): 1 for the same date, below 1 when the
 * last comes before the first.
 */
export function nightCountInclusive(firstNightIso: string, lastNightIso: string): number {
  return Math.round((Date.parse(`${lastNightIso}T00:00:00Z`) - Date.parse(`${firstNightIso}T00:00:00Z`)) / DAY_MS) + 1;
}

/** The refusal of a cycle longer than `SEASON_MAX_NIGHTS`, naming its latest last night. */
export function cycleTooLongMessage(firstNightIso: string): string {
  return `The cycle is at most ${SEASON_MAX_NIGHTS} nights (last night ${addDaysIso(firstNightIso, SEASON_MAX_NIGHTS - 1)} at the latest).`;
}
