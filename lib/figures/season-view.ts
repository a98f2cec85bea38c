/**
 * What the season chart and tables draw, filled from either source of nightly hours: the sky page's
 * usable dark hours (`seasonWindows`, no proposal) or a proposal's simulated observing schedules
 * (`observingSchedules`, the same the verdicts count). Best weeks are each source's own, computed by
 * the one rule `bestWeekIndices` (lib/astro/season.ts); nothing here ranks weeks or adds hours across
 * targets.
 */
import { z } from "zod";
import { nightDateSchema } from "@/lib/astro/inputs";
import { SEASON_WEEK_NIGHTS, type SeasonWindows } from "@/lib/astro/season";
import { SEASON_MAX_NIGHTS, SEASON_MIN_NIGHTS } from "@/lib/astro/season-length";
import { addDaysIso } from "@/lib/astro/time";
import { emptyScheduleMessage, type MoonConstraintInput, type ObservingSchedule, type ObservingSeason } from "@/lib/schedule";

/**
 * A season window named in a URL: `start` (evening date of the first night) and `nights`. The season
 * figure's export reads it, and its reproduce link carries it back to the season view.
 */
export const seasonWindowQuerySchema = z.object({
  start: nightDateSchema.optional(),
  nights: z.coerce
    .number({ error: "The number of nights must be a whole number." })
    .int("The number of nights must be a whole number.")
    .min(SEASON_MIN_NIGHTS, `The number of nights is at least ${SEASON_MIN_NIGHTS}.`)
    .max(SEASON_MAX_NIGHTS, `The number of nights is at most ${SEASON_MAX_NIGHTS}.`)
    .optional(),
});

/** One target's row. */
export interface SeasonViewRow {
  name: string;
  /** Usable hours on each night of the view, h. */
  hoursPerNight: Float32Array;
  /** 1 on nights when the target is up in darkness above the limit but too close to the Sun. */
  tooCloseToSunPerNight: Uint8Array;
  /** 7-night blocks from the first night, best first (`bestWeekIndices`); empty when none. */
  bestWeekIndices: readonly number[];
  /** No usable time (sky page) or no planned visit (schedule) in the whole range. */
  isEmpty: boolean;
}

export interface SeasonView<Row extends SeasonViewRow = SeasonViewRow> {
  /** Evening date of each night, `YYYY-MM-DD`. */
  nightDatesIso: string[];
  /** Top of the chart's colour scale, h: the same for every page of rows. */
  scaleMaxHours: number;
  rows: Row[];
}

/** A row of a proposal's schedule: what the season table says of each target. */
export interface ScheduleSeasonRow extends SeasonViewRow {
  seasons: readonly ObservingSeason[];
  visitCount: number;
  /** Why no visit can be planned, as a sentence (`emptyScheduleMessage`); null when one can. */
  emptyMessage: string | null;
}

/** Number of 7-night blocks (the last may be shorter). */
export function seasonWeekCount(nightDatesIso: readonly string[]): number {
  return Math.ceil(nightDatesIso.length / SEASON_WEEK_NIGHTS);
}

/** "2031-06-10 – 2031-06-16": the first and last night of block `week` (the last block may be shorter). */
export function weekRangeText(nightDatesIso: readonly string[], week: number): string {
  const first = week * SEASON_WEEK_NIGHTS;
  const last = Math.min(nightDatesIso.length, first + SEASON_WEEK_NIGHTS) - 1;
  return `${nightDatesIso[first]} – ${nightDatesIso[last]}`;
}

/** The first `count` of a target's best weeks (best first) as week ranges joined by "; "; "—" without one. */
export function bestWeeksText(nightDatesIso: readonly string[], bestWeekIndices: readonly number[], count = 3): string {
  return bestWeekIndices.slice(0, count).map((week) => weekRangeText(nightDatesIso, week)).join("; ") || "—";
}

/** "2031-02-01 – 2031-06-19 (138 d)" per season, lengths rounded to whole days, joined by "; "; "none" without one. */
export function observingSeasonsText(seasons: readonly ObservingSeason[]): string {
  if (seasons.length === 0) return "none";
  return seasons.map((season) => `${season.firstNightIso} – ${season.lastNightIso} (${Math.round(season.lengthDays)} d)`).join("; ");
}

/** A schedule's Moon constraint in words: "at least 30° from the Moon, and no Moon more than 60% illuminated above the horizon". */
export function moonRuleText({ minSeparationDeg, maxIlluminatedFraction }: MoonConstraintInput): string {
  const brightness = maxIlluminatedFraction == null ? null : `no Moon more than ${Math.round(maxIlluminatedFraction * 100)}% illuminated above the horizon`;
  if (minSeparationDeg == null) return brightness ?? "no Moon constraint";
  return `at least ${minSeparationDeg}° from the Moon${brightness ? `, and ${brightness}` : ""}`;
}

/** Which nights a schedule's visits may use, from its clear-night fraction (lost nights spread evenly, `isClearNight`). */
export function clearNightsText(clearNightFraction: number): string {
  if (clearNightFraction >= 1) return "with a clear-night fraction of 1, every night";
  return `a clear-night fraction of ${clearNightFraction} keeps ${Math.round(clearNightFraction * 100)}% of the nights, spread evenly`;
}

const maxOf = (values: Iterable<number>, start = 0) => {
  let max = start;
  for (const value of values) max = Math.max(max, value);
  return max;
};

/** The sky page's season: hours shaded against the longest night's darkness. */
export function seasonViewOfWindows(season: SeasonWindows): SeasonView {
  return {
    nightDatesIso: season.nightDatesIso,
    scaleMaxHours: maxOf(season.hoursDarkPerNight),
    rows: season.targets.map((target, index) => ({
      name: target.name ?? `target ${index + 1}`,
      hoursPerNight: target.hoursDarkPerNight,
      tooCloseToSunPerNight: target.tooCloseToSunPerNight,
      bestWeekIndices: target.bestWeekIndices,
      isEmpty: target.isNeverObservable,
    })),
  };
}

/**
 * Nights (indices from the schedule's first) that hold a stretch lost to the Sun rule. The cycle
 * starts at local mean noon before the first night, so night i is [start + i, start + i + 1) days.
 */
function nightsTooCloseToSun(schedule: ObservingSchedule): Uint8Array {
  const flags = new Uint8Array(schedule.nightCount);
  for (const gap of schedule.gaps) {
    if (gap.reason !== "sun") continue;
    const first = Math.max(0, Math.floor(gap.startJdUtc - schedule.cycle.startJdUtc));
    const last = Math.min(schedule.nightCount - 1, Math.ceil(gap.endJdUtc - schedule.cycle.startJdUtc) - 1);
    for (let night = first; night <= last; night++) flags[night] = 1;
  }
  return flags;
}

/**
 * A proposal's season from its targets' schedules (`names[i]` is the name of `schedules[i]`; all
 * under the same conditions, so with the same nights). Hours shaded against the largest usable hours
 * of any target on any night.
 */
export function seasonViewOfSchedules(names: readonly string[], schedules: readonly ObservingSchedule[]): SeasonView<ScheduleSeasonRow> {
  const first = schedules[0];
  const nightDatesIso = first ? Array.from({ length: first.nightCount }, (_, night) => addDaysIso(first.firstNightIso, night)) : [];
  return {
    nightDatesIso,
    scaleMaxHours: schedules.reduce((max, schedule) => maxOf(schedule.usableHoursPerNight, max), 0),
    rows: schedules.map((schedule, index) => ({
      name: names[index],
      hoursPerNight: schedule.usableHoursPerNight,
      tooCloseToSunPerNight: nightsTooCloseToSun(schedule),
      bestWeekIndices: schedule.bestWeekIndices,
      isEmpty: schedule.emptyReason !== null,
      seasons: schedule.seasons,
      visitCount: schedule.visitsJdUtc.length,
      emptyMessage: schedule.emptyReason === null ? null : emptyScheduleMessage(schedule.emptyReason),
    })),
  };
}
