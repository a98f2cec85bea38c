/**
 * What the science cases read from a simulated observing schedule (lib/schedule/types.ts): visits
 * between two instants, the gap an instant falls in, the distance to the nearest usable time, the
 * seasons. Binary searches over the ascending arrays, so a question costs O(log n). Times are Julian
 * dates UTC, spans in days.
 */

import type { ObservingSchedule, ScheduleGap } from "@/lib/schedule/types";

/** Index of the first visit starting at or after `jdUtc` (visits.length when none). */
export function firstVisitFrom(visitsJdUtc: Float64Array, jdUtc: number): number {
  let low = 0;
  let high = visitsJdUtc.length;
  while (low < high) {
    const middle = (low + high) >>> 1;
    if (visitsJdUtc[middle] < jdUtc) low = middle + 1;
    else high = middle;
  }
  return low;
}

/** Visits starting in [startJdUtc, endJdUtc]. */
export function visitsBetween(schedule: Pick<ObservingSchedule, "visitsJdUtc">, startJdUtc: number, endJdUtc: number): number {
  if (!(endJdUtc >= startJdUtc)) return 0;
  return firstVisitFrom(schedule.visitsJdUtc, nextAfter(endJdUtc)) - firstVisitFrom(schedule.visitsJdUtc, startJdUtc);
}

/** The smallest double above `value` (visits exactly at the end count). */
function nextAfter(value: number): number {
  return value + Math.max(Math.abs(value) * Number.EPSILON, Number.MIN_VALUE);
}

/** Index of the last span starting at or before `jdUtc`, or −1. */
function lastStartingBy(spans: readonly { startJdUtc: number }[], jdUtc: number): number {
  let low = 0;
  let high = spans.length;
  while (low < high) {
    const middle = (low + high) >>> 1;
    if (spans[middle].startJdUtc <= jdUtc) low = middle + 1;
    else high = middle;
  }
  return low - 1;
}

/** The gap `jdUtc` falls in, or null (in a window, or outside the cycle). */
export function gapAt(schedule: Pick<ObservingSchedule, "gaps">, jdUtc: number): ScheduleGap | null {
  const gap = schedule.gaps[lastStartingBy(schedule.gaps, jdUtc)];
  return gap !== undefined && jdUtc < gap.endJdUtc ? gap : null;
}

/** Whether `jdUtc` lies within one of the target's observing seasons. */
export function isInSeason(schedule: Pick<ObservingSchedule, "seasons">, jdUtc: number): boolean {
  const season = schedule.seasons[lastStartingBy(schedule.seasons, jdUtc)];
  return season !== undefined && jdUtc <= season.endJdUtc;
}

/** Days from `jdUtc` to the nearest usable time (0 inside a window); null when the schedule has no window. */
export function daysToUsableTime(schedule: Pick<ObservingSchedule, "windows">, jdUtc: number): number | null {
  const index = lastStartingBy(schedule.windows, jdUtc);
  const before = schedule.windows[index];
  const after = schedule.windows[index + 1];
  if (before !== undefined && jdUtc <= before.endJdUtc) return 0;
  const distances = [before === undefined ? Infinity : jdUtc - before.endJdUtc, after === undefined ? Infinity : after.startJdUtc - jdUtc];
  const nearest = Math.min(...distances);
  return Number.isFinite(nearest) ? nearest : null;
}

/** Whether `jdUtc` lies within the schedule's cycle. */
export function isInCycle(schedule: Pick<ObservingSchedule, "cycle">, jdUtc: number): boolean {
  return jdUtc >= schedule.cycle.startJdUtc && jdUtc <= schedule.cycle.endJdUtc;
}

/** Days of centre ± halfWidthDays inside the cycle: exactly 2·halfWidthDays when all of it is. */
export function daysInCycleAround(schedule: Pick<ObservingSchedule, "cycle">, centreJdUtc: number, halfWidthDays: number): number {
  const startJdUtc = centreJdUtc - halfWidthDays;
  const endJdUtc = centreJdUtc + halfWidthDays;
  const { cycle } = schedule;
  if (startJdUtc >= cycle.startJdUtc && endJdUtc <= cycle.endJdUtc) return 2 * halfWidthDays;
  return Math.max(0, Math.min(endJdUtc, cycle.endJdUtc) - Math.max(startJdUtc, cycle.startJdUtc));
}

/** The cycle's length, days. */
export function cycleDays(schedule: Pick<ObservingSchedule, "cycle">): number {
  return schedule.cycle.endJdUtc - schedule.cycle.startJdUtc;
}

/** The seasons' summary: the longest (days, first to last usable night), their total length and the visits inside them. */
export function seasonSummary(schedule: Pick<ObservingSchedule, "seasons" | "visitsJdUtc">): { longestDays: number; totalDays: number; visits: number } {
  let longestDays = 0;
  let totalDays = 0;
  let visits = 0;
  for (const season of schedule.seasons) {
    const days = season.endJdUtc - season.startJdUtc;
    longestDays = Math.max(longestDays, days);
    totalDays += days;
    visits += visitsBetween(schedule, season.startJdUtc, season.endJdUtc);
  }
  return { longestDays, totalDays, visits };
}
