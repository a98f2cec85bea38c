/**
 * The simulated observing schedule of one target: when the site can observe it over the proposal's
 * cycle, the visits a cadence places in those windows, and why the rest of the time is lost. Plain
 * data (typed arrays and objects) so that it crosses a worker boundary unchanged.
 */

/**
 * Why a stretch of the cycle has no usable time for the target. A moment failing several rules takes
 * the first in the order listed (daylight, below-limit, sun, moon, weather), so "weather" marks only
 * time that a clear night would have given.
 */
export type ScheduleGapReason =
  /** The Sun is above the twilight limit. */
  | "daylight"
  /** Dark, but the target is below the airmass (or horizon) limit. */
  | "below-limit"
  /** Dark and high enough, but closer to the Moon than the minimum separation, or the Moon too bright. */
  | "moon"
  /** Dark and high enough, but the target is closer to the Sun than the safe elongation tonight. */
  | "sun"
  /** A night lost to the clear-night fraction. */
  | "weather";

export interface TimeSpanJd {
  /** Julian dates, UTC. */
  startJdUtc: number;
  endJdUtc: number;
}

export interface ScheduleGap extends TimeSpanJd {
  reason: ScheduleGapReason;
}

/**
 * A run of nights on which a window as if the night were clear can hold a visit (an observing
 * season), with interruptions of at most `SEASON_BRIDGE_NIGHTS` nights bridged (our rule, see
 * `seasons.ts`). The span runs from the first usable instant of its first night to the last of its
 * last night.
 */
export interface ObservingSeason extends TimeSpanJd {
  /** Nights from the first to the last, bridged nights included. */
  nightCount: number;
  /** Nights of the season that can hold a visit (bridged nights not counted). */
  usableNightCount: number;
  /** Evening dates (`YYYY-MM-DD`) of the first and last night. */
  firstNightIso: string;
  lastNightIso: string;
  /** endJdUtc − startJdUtc, days. */
  lengthDays: number;
}

/** Why a schedule collects no visit at all. */
export type EmptyScheduleReason =
  /** The target never rises above the limit at this site. */
  | "never-up"
  /** It clears the limit only in daylight or twilight during the cycle. */
  | "always-daylight"
  /** It is up in darkness only while too close to the Sun. */
  | "behind-sun"
  /** Usable time exists, but the Moon constraint removes all of it. */
  | "moon"
  /** Usable time exists, but every window is shorter than one visit. */
  | "windows-too-short"
  /** Windows long enough for a visit exist only on nights lost to the clear-night fraction. */
  | "weather";

/**
 * Sky conditions at the middle of each planned visit, index-aligned with `visitsJdUtc`
 * (see `visit-sky.ts` for the method and accuracy).
 */
export interface VisitSky {
  /** Air mass (Pickering 2002 of the apparent altitude, the same formula as the airmass limit, lib/astro/airmass.ts), ≥ 1. */
  airmass: Float32Array;
  /** Target's geometric zenith distance, degrees [0, 90]. */
  targetZenithDeg: Float32Array;
  /** Moon's geometric topocentric zenith distance, degrees [0, 180] (> 90: below the horizon). */
  moonZenithDeg: Float32Array;
  /** Topocentric Moon–target separation, degrees [0, 180]. */
  moonSeparationDeg: Float32Array;
  /** Sun–Moon–Earth phase angle α from the night's illuminated fraction k: α = acos(2k − 1), degrees [0, 180] (0 full). */
  moonPhaseAngleDeg: Float32Array;
}

export interface ObservingSchedule {
  /** From local mean noon before the first night to local mean noon after the last. */
  cycle: TimeSpanJd;
  /** Evening date of the first night (`YYYY-MM-DD`) and the number of nights; night i is that date + i. */
  firstNightIso: string;
  nightCount: number;
  /** Usable windows on clear nights, ascending and disjoint. */
  windows: TimeSpanJd[];
  /** The rest of the cycle, ascending, each stretch with its reason. */
  gaps: ScheduleGap[];
  /** Start times of the planned visits, ascending. */
  visitsJdUtc: Float64Array;
  visitLengthDays: number;
  /** The sky at the middle of each visit (air mass, zenith distances, the Moon), aligned with `visitsJdUtc`. */
  visitSky: VisitSky;
  seasons: ObservingSeason[];
  /**
   * Usable hours of each night as if it were clear (dark, above the limit, Sun and Moon rules; the
   * clear-night fraction not applied), h. Season and best weeks are read from these.
   */
  usableHoursPerNight: Float32Array;
  /** The same summed per block of 7 nights from the first night (the last may be shorter), h. */
  weeklyUsableHours: Float32Array;
  /** Blocks whose hours reach 90% of this target's best block, best first; empty when none. */
  bestWeekIndices: number[];
  /** Null when at least one visit is planned. */
  emptyReason: EmptyScheduleReason | null;
}
