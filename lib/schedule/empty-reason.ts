/**
 * Why a schedule holds no visit, decided from what its time line saw, and said in the user's words.
 */
import { MOON, SUN, USABLE, WEATHER, type TargetTimeline } from "./timeline";
import type { EmptyScheduleReason } from "./types";

const bit = (code: number) => 1 << code;
/** Stretches that were dark with the target above the limit; of those, not too close to the Sun; of those, clear of the Moon. */
const DARK_ABOVE_LIMIT = bit(SUN) | bit(MOON) | bit(WEATHER) | bit(USABLE);
const AWAY_FROM_SUN = bit(MOON) | bit(WEATHER) | bit(USABLE);
const CLEAR_OF_MOON = bit(WEATHER) | bit(USABLE);

/**
 * The reason a schedule with no visit has none, checking in this order: the target never reaches
 * the limit (`isNeverUp`: its upper culmination is below it); it is above the limit only in
 * daylight or twilight; only while too close to the Sun; only while the Moon rule removes the time;
 * windows that could hold a visit (`visitDays`) fall only on nights lost to the clear-night
 * fraction; else every window is shorter than a visit.
 */
export function emptyScheduleReason(isNeverUp: boolean, timeline: TargetTimeline, visitDays: number): EmptyScheduleReason {
  if (isNeverUp) return "never-up";
  const seen = timeline.codesSeen;
  if ((seen & DARK_ABOVE_LIMIT) === 0) return "always-daylight";
  if ((seen & AWAY_FROM_SUN) === 0) return "behind-sun";
  if ((seen & CLEAR_OF_MOON) === 0) return "moon";
  // A clear night's window that could hold a visit would have one: such windows were all lost to weather.
  for (const longest of timeline.longestClearRunDays) if (longest >= visitDays) return "weather";
  return "windows-too-short";
}

const emptyScheduleWords: Record<EmptyScheduleReason, string> = {
  "never-up": "No visit can be planned: the target never rises above the altitude limit at this site.",
  "always-daylight": "No visit can be planned: during the cycle the target is above the altitude limit only in daylight or twilight.",
  "behind-sun": "No visit can be planned: during the cycle the target is up in darkness only while it is too close to the Sun (behind the Sun).",
  moon: "No visit can be planned: the Moon constraint removes every hour the target is up in darkness during the cycle.",
  weather: "No visit can be planned: the only nights long enough for a visit are lost to the clear-night fraction.",
  "windows-too-short": "No visit can be planned: every window in which the target can be observed is shorter than one visit.",
};

/** Why a schedule has no visit, as a sentence for the page. */
export function emptyScheduleMessage(reason: EmptyScheduleReason): string {
  return emptyScheduleWords[reason];
}
