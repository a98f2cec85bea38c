/**
 * The simulated observing schedule of one target: when the site can observe it over the proposal's
 * cycle, the visits a cadence places in those windows, and why the rest of the time is lost. Plain
 * data (typed arrays and objects) so that it crosses a worker boundary unchanged.
 */

/** Why a stretch of the cycle has no usable time for the target. */
export type ScheduleGapReason =
  /** The Sun is above the twilight limit. */
  | "daylight"
  /** Dark, but the target is below the airmass (or horizon) limit. */
  | "below-limit"
  /** Dark and high enough, but closer to the Moon than the minimum separation, or the Moon too bright. */
  | "moon"
  /** The target is closer to the Sun than the safe elongation. */
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

/** A run of consecutive nights with usable time (an observing season). */
export interface ObservingSeason extends TimeSpanJd {
  nightCount: number;
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
  | "windows-too-short";

export interface ObservingSchedule {
  cycle: TimeSpanJd;
  /** Usable windows, ascending and disjoint. */
  windows: TimeSpanJd[];
  /** The rest of the cycle, ascending, each stretch with its reason. */
  gaps: ScheduleGap[];
  /** Start times of the planned visits, ascending. */
  visitsJdUtc: Float64Array;
  visitLengthDays: number;
  seasons: ObservingSeason[];
  /** Null when at least one visit is planned. */
  emptyReason: EmptyScheduleReason | null;
}
