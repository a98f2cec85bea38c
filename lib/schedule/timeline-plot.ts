/**
 * What a drawing of a target's simulated schedule reads: each night's usable windows and gaps as
 * spans of that night, the runs of nights with and without usable time (long runs named by what
 * causes them), visits merged to a drawing's resolution, one night's planned visits, and the
 * schedule summed up in words. Nights run from local mean noon to local mean noon (`ObservingSchedule`);
 * times are Julian dates UTC, offsets and spans in days.
 */
import { formatUtcClock } from "@/lib/astro/sky-format";
import { addDaysIso, nightStartJdUtc } from "@/lib/astro/time";
import { emptyScheduleMessage } from "./empty-reason";
import { SEASON_BRIDGE_NIGHTS } from "./seasons";
import type { ObservingSchedule, ScheduleGapReason } from "./types";

/** What the page says where a schedule needs the proposal's cycle. */
export const NO_CYCLE_SCHEDULE_SENTENCE = "Set the proposal's cycle dates to see the schedule.";
const NO_CYCLE_VISITS_SENTENCE = "Set the proposal's cycle dates to plan visits.";

/** Each gap reason as a legend names it. */
export const gapReasonLabels: Record<ScheduleGapReason, string> = {
  daylight: "daylight",
  "below-limit": "below the limit in darkness",
  moon: "Moon",
  sun: "too close to the Sun",
  weather: "weather (clear-night fraction)",
};

/** The reasons in the schedule's order of precedence (`ScheduleGapReason`). */
export const gapReasons: readonly ScheduleGapReason[] = ["daylight", "below-limit", "sun", "moon", "weather"];

/** A run of nights without usable time is named on the chart from this many nights (our rule). */
export const NAMED_GAP_MIN_NIGHTS = 3;

/** Part of one night: a usable window, or a gap with its reason. */
export interface NightSpan {
  /** Index of the night from the cycle's first. */
  night: number;
  /** Start and end, days from the night's local mean noon, 0 ≤ from < to ≤ 1. */
  fromDay: number;
  toDay: number;
  kind: "usable" | ScheduleGapReason;
}

const nightOfJd = (schedule: Pick<ObservingSchedule, "cycle">, jdUtc: number) => jdUtc - schedule.cycle.startJdUtc;

/**
 * The schedule's windows and gaps other than daylight, cut at the nights' boundaries (a stretch
 * across local noon happens only in a polar night). Daylight is left out: a drawing shows it as the
 * ground the rest is drawn on.
 */
export function nightSpans(schedule: Pick<ObservingSchedule, "cycle" | "nightCount" | "windows" | "gaps">): NightSpan[] {
  const spans: NightSpan[] = [];
  const add = (kind: NightSpan["kind"], startJdUtc: number, endJdUtc: number) => {
    const from = nightOfJd(schedule, startJdUtc);
    const to = nightOfJd(schedule, endJdUtc);
    for (let night = Math.max(0, Math.floor(from)); night < Math.min(schedule.nightCount, Math.ceil(to)); night++) {
      const fromDay = Math.max(0, from - night);
      const toDay = Math.min(1, to - night);
      if (toDay > fromDay) spans.push({ night, fromDay, toDay, kind });
    }
  };
  for (const window of schedule.windows) add("usable", window.startJdUtc, window.endJdUtc);
  for (const gap of schedule.gaps) if (gap.reason !== "daylight") add(gap.reason, gap.startJdUtc, gap.endJdUtc);
  return spans.sort((a, b) => a.night - b.night || a.fromDay - b.fromDay);
}

/** A run of consecutive nights that all have usable time, or all have none. */
export interface NightRun {
  firstNight: number;
  nightCount: number;
  isUsable: boolean;
  /** For a run without usable time: the reason most of its nights have none (`nightGapReason`); null for a usable run. */
  reason: ScheduleGapReason | null;
  /** The run's name on a chart ("season gap: too close to the Sun", "4 nights: Moon"); null when not named. */
  label: string | null;
}

/**
 * Why a night without usable time has none: the rule that takes the time the target is up in
 * darkness (too close to the Sun, Moon or weather, whichever takes the most), else "below-limit"
 * when it has darkness, else "daylight". `reasonDays` holds the night's days per reason in the
 * order of `gapReasons`.
 */
function nightGapReason(reasonDays: ArrayLike<number>): ScheduleGapReason {
  let reason: ScheduleGapReason = reasonDays[1] > 0 ? "below-limit" : "daylight";
  let most = 0;
  for (let r = 2; r < gapReasons.length; r++) {
    if (reasonDays[r] > most) [most, reason] = [reasonDays[r], gapReasons[r]];
  }
  return reason;
}

/**
 * The cycle's nights in runs with and without usable time. A run without any takes the reason of
 * most of its nights (`nightGapReason`; the earlier in `gapReasons` on a tie); a run of
 * `NAMED_GAP_MIN_NIGHTS` nights or more is labelled, as a season gap when it is longer than
 * `SEASON_BRIDGE_NIGHTS` (what splits seasons, `seasons.ts`).
 */
export function nightRuns(schedule: Pick<ObservingSchedule, "cycle" | "nightCount" | "windows" | "gaps">): NightRun[] {
  const { nightCount } = schedule;
  const reasonCount = gapReasons.length;
  const hasWindow = new Uint8Array(nightCount);
  const reasonDays = new Float64Array(nightCount * reasonCount);
  for (const span of nightSpans(schedule)) {
    if (span.kind === "usable") hasWindow[span.night] = 1;
    else reasonDays[span.night * reasonCount + gapReasons.indexOf(span.kind)] += span.toDay - span.fromDay;
  }
  const runs: NightRun[] = [];
  let first = 0;
  for (let night = 1; night <= nightCount; night++) {
    if (night < nightCount && hasWindow[night] === hasWindow[first]) continue;
    const isUsable = hasWindow[first] === 1;
    const count = night - first;
    let reason: ScheduleGapReason | null = null;
    if (!isUsable) {
      const nights = new Map<ScheduleGapReason, number>();
      for (let n = first; n < night; n++) {
        const nightReason = nightGapReason(reasonDays.subarray(n * reasonCount, (n + 1) * reasonCount));
        nights.set(nightReason, (nights.get(nightReason) ?? 0) + 1);
      }
      reason = gapReasons.reduce((best, candidate) => ((nights.get(candidate) ?? 0) > (nights.get(best) ?? 0) ? candidate : best));
    }
    const label = reason === null || count < NAMED_GAP_MIN_NIGHTS ? null : `${count > SEASON_BRIDGE_NIGHTS ? "season gap" : `${count} nights`}: ${gapReasonLabels[reason]}`;
    runs.push({ firstNight: first, nightCount: count, isUsable, reason, label });
    first = night;
  }
  return runs;
}

/** Visits drawn as one mark: from the first's start to the last's end. */
export interface VisitMark {
  startJdUtc: number;
  endJdUtc: number;
  visitCount: number;
}

/**
 * The visits merged wherever the next starts within `joinDays` of the previous one's end, so a
 * drawing at a resolution of `joinDays` gets a bounded number of marks however short the cadence.
 */
export function visitMarks(visitsJdUtc: ArrayLike<number>, visitLengthDays: number, joinDays: number): VisitMark[] {
  const marks: VisitMark[] = [];
  for (let i = 0; i < visitsJdUtc.length; i++) {
    const start = visitsJdUtc[i];
    const last = marks.at(-1);
    if (last !== undefined && start <= last.endJdUtc + joinDays) {
      last.endJdUtc = start + visitLengthDays;
      last.visitCount++;
    } else {
      marks.push({ startJdUtc: start, endJdUtc: start + visitLengthDays, visitCount: 1 });
    }
  }
  return marks;
}

/** Index of the night of `nightIso` (evening date) from the cycle's first; outside 0…nightCount − 1 when outside the cycle. */
export function nightIndexOf(schedule: Pick<ObservingSchedule, "firstNightIso">, nightIso: string): number {
  return Math.round(nightStartJdUtc(nightIso, 0) - nightStartJdUtc(schedule.firstNightIso, 0));
}

/** One night's planned visits and the sentence that states them. */
export interface NightPlan {
  /** Start times of the night's visits, JD UTC, ascending. */
  visitsJdUtc: number[];
  sentence: string;
}

/** The night's times listed in full up to this many visits, else the first and the last (our rule). */
const LISTED_VISITS = 8;

/**
 * The visits the schedule plans on the night of `nightIso` (evening date), with a sentence: their
 * UTC start times, or why there are none (no cycle, no visit in the whole cycle, a night outside
 * the cycle, no usable time that night and what takes it, or a cadence that passes the night).
 */
export function nightPlan(schedule: ObservingSchedule | null, nightIso: string): NightPlan {
  if (schedule === null) return { visitsJdUtc: [], sentence: NO_CYCLE_VISITS_SENTENCE };
  if (schedule.emptyReason !== null) return { visitsJdUtc: [], sentence: emptyScheduleMessage(schedule.emptyReason) };
  const night = nightIndexOf(schedule, nightIso);
  if (night < 0 || night >= schedule.nightCount) {
    const last = addDaysIso(schedule.firstNightIso, schedule.nightCount - 1);
    return { visitsJdUtc: [], sentence: `No visit planned: this night is outside the proposal's cycle (${schedule.firstNightIso} to ${last}).` };
  }
  const startJdUtc = schedule.cycle.startJdUtc + night;
  const visitsJdUtc: number[] = [];
  for (let i = 0; i < schedule.visitsJdUtc.length; i++) {
    const jdUtc = schedule.visitsJdUtc[i];
    if (jdUtc >= startJdUtc && jdUtc < startJdUtc + 1) visitsJdUtc.push(jdUtc);
  }
  if (visitsJdUtc.length === 0) return { visitsJdUtc, sentence: noVisitSentence(schedule, night) };
  const clocks = visitsJdUtc.map(formatUtcClock);
  const times = clocks.length <= LISTED_VISITS ? clocks.join(", ") : `${clocks[0]} to ${clocks.at(-1)}`;
  const count = visitsJdUtc.length === 1 ? "1 visit" : `${visitsJdUtc.length} visits`;
  return { visitsJdUtc, sentence: `${count} planned this night: ${times} (UTC).` };
}

/** Why night `night` of the cycle holds no visit although the cycle holds some. */
function noVisitSentence(schedule: ObservingSchedule, night: number): string {
  const run = nightRuns(schedule).find((candidate) => night >= candidate.firstNight && night < candidate.firstNight + candidate.nightCount);
  if (run !== undefined && !run.isUsable && run.reason !== null) return `No visit planned this night, which has no usable time: ${gapReasonLabels[run.reason]}.`;
  let longestDays = 0;
  for (const span of nightSpans(schedule)) if (span.night === night && span.kind === "usable") longestDays = Math.max(longestDays, span.toDay - span.fromDay);
  if (longestDays < schedule.visitLengthDays) return "No visit planned this night: its usable time is shorter than one visit.";
  return "No visit planned this night: at the proposal's cadence the visits fall on the nights before and after it.";
}

/** The schedule in one sentence: visits over the cycle and the seasons (the timeline's accessible name). */
export function scheduleSummary(schedule: ObservingSchedule): string {
  const last = addDaysIso(schedule.firstNightIso, schedule.nightCount - 1);
  const visits = schedule.visitsJdUtc.length === 1 ? "1 visit" : `${schedule.visitsJdUtc.length} visits`;
  const cycle = `${visits} planned over ${schedule.nightCount} nights (${schedule.firstNightIso} to ${last})`;
  const { seasons } = schedule;
  if (seasons.length === 0) return `${cycle}; no observing season.`;
  const list = seasons.map((season) => `${season.firstNightIso} to ${season.lastNightIso}`).join(", ");
  return `${cycle}; ${seasons.length === 1 ? "observing season" : `${seasons.length} observing seasons`}: ${list}.`;
}
