/**
 * One target's time line over the cycle, written stretch by stretch in time order: usable stretches
 * become windows, the rest gaps with their reason (adjacent stretches with the same reason merged),
 * and each night's usable time as if it were clear is tallied for seasons and best weeks.
 */
import type { ScheduleGap, ScheduleGapReason, TimeSpanJd } from "./types";

/** What a stretch of time is: usable, or the first rule it fails (the order of `ScheduleGapReason`). */
export const USABLE = 0;
export const DAYLIGHT = 1;
export const BELOW_LIMIT = 2;
export const SUN = 3;
export const MOON = 4;
export const WEATHER = 5;
export type StretchCode = typeof USABLE | typeof DAYLIGHT | typeof BELOW_LIMIT | typeof SUN | typeof MOON | typeof WEATHER;

const gapReasonOfCode: Record<Exclude<StretchCode, typeof USABLE>, ScheduleGapReason> = {
  [DAYLIGHT]: "daylight",
  [BELOW_LIMIT]: "below-limit",
  [SUN]: "sun",
  [MOON]: "moon",
  [WEATHER]: "weather",
};

export class TargetTimeline {
  readonly windows: TimeSpanJd[] = [];
  readonly gaps: ScheduleGap[] = [];
  /** Usable hours of each night as if it were clear (usable and weather-lost stretches), h. */
  readonly usableHoursPerNight: Float32Array;
  /** Each night's longest run of such time, days; and its first and last instant (JD UTC, NaN if none). */
  readonly longestClearRunDays: Float64Array;
  readonly firstClearJdUtc: Float64Array;
  readonly lastClearJdUtc: Float64Array;
  /** Bit `1 << code` is set once a stretch with that code has been written. */
  codesSeen = 0;

  private runCode = -1;
  private runStartJdUtc = 0;
  private clearRunStartJdUtc = Number.NaN;
  private night = 0;

  constructor(nightCount: number) {
    this.usableHoursPerNight = new Float32Array(nightCount);
    this.longestClearRunDays = new Float64Array(nightCount);
    this.firstClearJdUtc = new Float64Array(nightCount).fill(Number.NaN);
    this.lastClearJdUtc = new Float64Array(nightCount).fill(Number.NaN);
  }

  /** Starts night `night` (index from the cycle's first); stretches that follow are tallied to it. */
  beginNight(night: number): void {
    this.night = night;
  }

  /** Appends the stretch [startJdUtc, endJdUtc], which begins where the previous one ended. */
  add(code: StretchCode, startJdUtc: number, endJdUtc: number): void {
    if (!(endJdUtc > startJdUtc)) return;
    this.codesSeen |= 1 << code;
    if (code !== this.runCode) {
      this.closeRun(startJdUtc);
      this.runCode = code;
      this.runStartJdUtc = startJdUtc;
    }
    if (code === USABLE || code === WEATHER) {
      const night = this.night;
      this.usableHoursPerNight[night] += (endJdUtc - startJdUtc) * 24;
      if (Number.isNaN(this.clearRunStartJdUtc)) this.clearRunStartJdUtc = startJdUtc;
      if (Number.isNaN(this.firstClearJdUtc[night])) this.firstClearJdUtc[night] = startJdUtc;
      this.lastClearJdUtc[night] = endJdUtc;
    } else {
      this.closeClearRun(startJdUtc);
    }
  }

  /** Ends the current night at `endJdUtc` (a run of clear time is not carried into the next night). */
  endNight(endJdUtc: number): void {
    this.closeClearRun(endJdUtc);
  }

  /** Closes the last stretch at the end of the cycle. */
  finish(endJdUtc: number): void {
    this.closeClearRun(endJdUtc);
    this.closeRun(endJdUtc);
    this.runCode = -1;
  }

  private closeRun(endJdUtc: number): void {
    if (this.runCode < 0) return;
    if (this.runCode === USABLE) this.windows.push({ startJdUtc: this.runStartJdUtc, endJdUtc });
    else this.gaps.push({ startJdUtc: this.runStartJdUtc, endJdUtc, reason: gapReasonOfCode[this.runCode as Exclude<StretchCode, typeof USABLE>] });
  }

  private closeClearRun(endJdUtc: number): void {
    if (Number.isNaN(this.clearRunStartJdUtc)) return;
    const night = this.night;
    this.longestClearRunDays[night] = Math.max(this.longestClearRunDays[night], endJdUtc - this.clearRunStartJdUtc);
    this.clearRunStartJdUtc = Number.NaN;
  }
}
