/**
 * The season view: usable dark hours per night for many targets over a range of nights, the best
 * weeks of each, and the targets that are never observable. Per night the grid (sidereal time, Sun,
 * precession–nutation, aberration) is built once and shared; per target and night only the apparent
 * place and a few multiply-adds per dark sample remain.
 */
import { z } from "zod";
import { Body, Illumination } from "astronomy-engine";
import { apparentDirectionOfDate } from "./apparent-place";
import {
  nightDateSchema,
  parseSkyInput,
  skyLimitsSchema,
  skySiteSchema,
  skyTargetSchema,
  type SkyLimitsInput,
  type SkySiteInput,
  type SkyTarget,
} from "./inputs";
import { altitudeLimit, type AltitudeLimit } from "./limits";
import { buildNightGrid, hoursOfDarkness } from "./night-grid";
import { fillSineAltitudes, hoursAboveInDarkness, isTooCloseToSun, upperCulminationAltitudeDeg } from "./target-night";
import { SEASON_MAX_NIGHTS, SEASON_MIN_NIGHTS } from "./season-length";
import { addDaysIso, astroTimeFromJdUtc } from "./time";

const DEG = Math.PI / 180;

/** At most this many targets (a large survey list) per request; nights: ./season-length. */
export const SEASON_MAX_TARGETS = 5000;
/** Nights per "week" of the best-week summary. */
export const SEASON_WEEK_NIGHTS = 7;
/** A week is among the best when its dark hours reach this share of the best week's (our rule). */
export const BEST_WEEK_SHARE = 0.9;

export interface SeasonRequest {
  site: SkySiteInput;
  targets: SkyTarget[];
  /** First night, by the local date of its evening, `YYYY-MM-DD`. */
  startNightIso: string;
  nightCount: number;
  limits?: SkyLimitsInput;
}

/** Why a target has no usable dark hour in the whole range. */
export type NeverObservableReason =
  /** Its highest culmination stays below the altitude limit at this latitude. */
  | "below-limit"
  /** It clears the limit only in daylight or twilight during these nights. */
  | "no-dark-time"
  /** It clears the limit in darkness only on nights when it is too close to the Sun. */
  | "sun";

export interface SeasonTargetWindows {
  name?: string;
  raDeg: number;
  decDeg: number;
  /** Usable dark hours on each night (h): dark, above the limit, 0 on nights too close to the Sun. */
  hoursDarkPerNight: Float32Array;
  /** 1 on nights when the target would be up in darkness but is closer to the Sun than the safe elongation. */
  tooCloseToSunPerNight: Uint8Array;
  totalHoursDark: number;
  /** Usable dark hours per block of 7 nights from the first night (last block may be shorter) (h). */
  weeklyHoursDark: Float32Array;
  /** Blocks whose hours reach 90% of the best block's, best first; empty when never observable. */
  bestWeekIndices: number[];
  isNeverObservable: boolean;
  neverObservableReason: NeverObservableReason | null;
}

export interface SeasonWindows {
  nightDatesIso: string[];
  /** Start night of each 7-night block. */
  weekStartDatesIso: string[];
  /** Length of astronomical darkness on each night (h). */
  hoursDarkPerNight: Float32Array;
  /** Moon's illuminated fraction at the middle of each night's window, [0, 1]. */
  moonIlluminatedFractionPerNight: Float32Array;
  limit: AltitudeLimit;
  safeSunElongationDeg: number;
  targets: SeasonTargetWindows[];
}

const nightCountSchema = z
  .number({ error: "The number of nights must be a whole number." })
  .int("The number of nights must be a whole number.")
  .min(SEASON_MIN_NIGHTS, `The number of nights is at least ${SEASON_MIN_NIGHTS}.`)
  .max(SEASON_MAX_NIGHTS, `The number of nights is at most ${SEASON_MAX_NIGHTS}.`);
const targetListSchema = z
  .array(skyTargetSchema)
  .min(1, "Give at least one target.")
  .max(SEASON_MAX_TARGETS, `At most ${SEASON_MAX_TARGETS} targets at once.`);

/** Sums of `perNight` over blocks of `SEASON_WEEK_NIGHTS` nights from the first (the last block may be shorter). */
export function weeklySums(perNight: ArrayLike<number>): Float32Array {
  const weekly = new Float32Array(Math.ceil(perNight.length / SEASON_WEEK_NIGHTS));
  for (let night = 0; night < perNight.length; night++) weekly[Math.floor(night / SEASON_WEEK_NIGHTS)] += perNight[night];
  return weekly;
}

/**
 * One target's best weeks: the blocks whose hours reach `BEST_WEEK_SHARE` of its best block's, best
 * first (ties: earlier first); empty when every block has none. Hours of different targets are never
 * added: each target has its own best weeks.
 */
export function bestWeekIndices(weekly: ArrayLike<number>): number[] {
  let best = 0;
  for (let week = 0; week < weekly.length; week++) best = Math.max(best, weekly[week]);
  if (best <= 0) return [];
  return Array.from({ length: weekly.length }, (_, week) => week)
    .filter((week) => weekly[week] >= BEST_WEEK_SHARE * best)
    .sort((a, b) => weekly[b] - weekly[a] || a - b);
}

/**
 * The week in which the most targets are in one of their own best weeks, and how many (ties: the
 * earlier week); null when no target has a best week. A count of targets, never hours summed over
 * them (our rule for a list's headline week).
 */
export function weekWithMostTargetsAtBest(targets: readonly { bestWeekIndices: readonly number[] }[], weekCount: number): { weekIndex: number; targetCount: number } | null {
  const counts = new Int32Array(weekCount);
  for (const target of targets) for (const week of target.bestWeekIndices) counts[week] += 1;
  let weekIndex = 0;
  for (let week = 1; week < weekCount; week++) if (counts[week] > counts[weekIndex]) weekIndex = week;
  return weekCount > 0 && counts[weekIndex] > 0 ? { weekIndex, targetCount: counts[weekIndex] } : null;
}

/**
 * Usable dark hours for every target of `request.targets` (ICRS degrees) on each of
 * `request.nightCount` nights from `request.startNightIso` at `request.site`, under
 * `request.limits` (airmass limit; safe Sun elongation, degrees; grid step, minutes).
 * Method and accuracy as `nightlyVisibility` (same grid and kernel), hours to a few minutes per
 * night. Cost: one grid per night (~0.3 ms) plus ~1 µs per target-night.
 * Throws `AppError("bad_request:sky")` naming the invalid field.
 */
export function seasonWindows(request: SeasonRequest): SeasonWindows {
  const site = parseSkyInput(skySiteSchema, request.site, "site");
  const targets = parseSkyInput(targetListSchema, request.targets, "targets");
  const startNightIso = parseSkyInput(nightDateSchema, request.startNightIso, "startNightIso");
  const nightCount = parseSkyInput(nightCountSchema, request.nightCount, "nightCount");
  const limits = parseSkyInput(skyLimitsSchema, request.limits ?? {}, "limits");
  const limit = altitudeLimit(site, limits);
  const cosSafe = Math.cos(limits.safeSunElongationDeg * DEG);

  const nightDatesIso = Array.from({ length: nightCount }, (_, night) => addDaysIso(startNightIso, night));
  const hoursDarkPerNight = new Float32Array(nightCount);
  const moonIlluminatedFractionPerNight = new Float32Array(nightCount);
  const perTarget = targets.map(() => ({
    hours: new Float32Array(nightCount),
    tooClose: new Uint8Array(nightCount),
    hasDarkTimeAboveLimit: false,
  }));
  const direction = new Float64Array(3);
  let sineAltitudes = new Float64Array(0);

  for (let night = 0; night < nightCount; night++) {
    const grid = buildNightGrid(site, nightDatesIso[night], limits.stepMinutes);
    if (sineAltitudes.length < grid.sampleCount) sineAltitudes = new Float64Array(grid.sampleCount);
    hoursDarkPerNight[night] = hoursOfDarkness(grid);
    moonIlluminatedFractionPerNight[night] = Illumination(Body.Moon, astroTimeFromJdUtc(grid.startJdUtc + 0.5)).phase_fraction;
    if (grid.darkStepCount === 0) continue;
    for (let t = 0; t < targets.length; t++) {
      apparentDirectionOfDate(grid.place, targets[t].raDeg, targets[t].decDeg, direction);
      fillSineAltitudes(grid, direction, sineAltitudes, grid.darkFirstSample, grid.darkLastSample);
      const hours = hoursAboveInDarkness(grid, sineAltitudes, limit.sinGeometric);
      if (hours <= 0) continue;
      const state = perTarget[t];
      state.hasDarkTimeAboveLimit = true;
      if (isTooCloseToSun(grid, direction, cosSafe)) state.tooClose[night] = 1;
      else state.hours[night] = hours;
    }
  }

  const weekCount = Math.ceil(nightCount / SEASON_WEEK_NIGHTS);
  const weekStartDatesIso = Array.from({ length: weekCount }, (_, week) => nightDatesIso[week * SEASON_WEEK_NIGHTS]);
  const latitudeDeg = site.latitudeDeg;
  return {
    nightDatesIso,
    weekStartDatesIso,
    hoursDarkPerNight,
    moonIlluminatedFractionPerNight,
    limit,
    safeSunElongationDeg: limits.safeSunElongationDeg,
    targets: targets.map((target, t) => {
      const { hours, tooClose, hasDarkTimeAboveLimit } = perTarget[t];
      const weeklyHoursDark = weeklySums(hours);
      let totalHoursDark = 0;
      for (let night = 0; night < nightCount; night++) totalHoursDark += hours[night];
      const isNeverObservable = totalHoursDark <= 0;
      let neverObservableReason: NeverObservableReason | null = null;
      if (isNeverObservable) {
        if (upperCulminationAltitudeDeg(latitudeDeg, target.decDeg) < limit.geometricDeg) neverObservableReason = "below-limit";
        else neverObservableReason = hasDarkTimeAboveLimit ? "sun" : "no-dark-time";
      }
      return {
        name: target.name,
        raDeg: target.raDeg,
        decDeg: target.decDeg,
        hoursDarkPerNight: hours,
        tooCloseToSunPerNight: tooClose,
        totalHoursDark,
        weeklyHoursDark,
        bestWeekIndices: bestWeekIndices(weeklyHoursDark),
        isNeverObservable,
        neverObservableReason,
      };
    }),
  };
}
