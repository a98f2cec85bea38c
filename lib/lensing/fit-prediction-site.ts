/**
 * The predicted peak of a fit (fit-prediction.ts) against the site's simulated observing schedule
 * (lib/schedule, as the target page builds it with `targetSchedules`): the window of the peak's
 * night, the air mass at the peak (or at the window's nearest instant), the visits within t0 ± 1σ,
 * and a sentence. Times are Julian dates UTC: the fit's times must be geocentric UTC Julian dates, as
 * the photometry reader gives them (lib/event-photometry); a heliocentric or barycentric time would
 * differ by up to ~8.3 min of light time.
 *
 * The air mass is the schedule's own: the sky at one instant of the night by `skyAtTimes`
 * (lib/schedule/visit-sky.ts, the code that gives every planned visit its air mass: Pickering 2002 of
 * the apparent altitude), on the night grid and Moon of lib/astro at the schedule's step.
 */

import { DEFAULT_STEP_MINUTES } from "@/lib/astro/constants";
import { parseSkyInput, skySiteSchema, skyTargetSchema, type SkySiteInput } from "@/lib/astro/inputs";
import { buildNightGrid } from "@/lib/astro/night-grid";
import { nightMoon } from "@/lib/astro/night-moon";
import { refractionScale } from "@/lib/astro/refraction";
import { formatUtcClock } from "@/lib/astro/sky-format";
import { addDaysIso } from "@/lib/astro/time";
import type { ObservingSchedule, ScheduleGapReason, TimeSpanJd } from "@/lib/schedule/types";
import { skyAtTimes } from "@/lib/schedule/visit-sky";
import { formatSignificant } from "@/lib/numbers/significant";
import type { FitPrediction } from "./fit-prediction";
import { firstVisitFrom, gapAt, isInCycle } from "./science-case-schedule";
import { dateWords, dayWords, gapReasonWords, visitsWords } from "./science-case-words";

/** Significant digits of the ± in the sentence (the band's 16–84 % is known to a few %). */
const SIGMA_DIGITS = 2;
/** Decimals of the air mass in the sentence, as the issue writes it ("airmass 1.1"). */
const AIRMASS_DECIMALS = 1;

export interface SitePeakOutlook {
  /** Median predicted peak (JD UTC) and its 1σ half-width, days. */
  peakJdUtc: number;
  sigmaDays: number;
  /** Where the peak falls: a usable window, a gap of the schedule, or outside the cycle. */
  where: "window" | "gap" | "outside-cycle";
  /** The schedule's gap the peak falls in; null in a window or outside the cycle. */
  gapReason: ScheduleGapReason | null;
  /** The usable window of the peak's night holding it, else that night's window nearest to it; null when the night has none. */
  window: TimeSpanJd | null;
  /** The instant the air mass is given for: the peak, or the window's instant nearest to it. */
  observedJdUtc: number | null;
  airmass: number | null;
  /** The next usable window after the peak, when its night has none. */
  nextWindow: TimeSpanJd | null;
  /** Start times (JD UTC) of the schedule's visits that start within t0 ± 1σ. */
  visitsInSigmaJdUtc: Float64Array;
  sentence: string;
}

/** Index of the night (local mean noon to noon) holding `jdUtc`, or −1 outside the cycle. */
function nightIndexOf(schedule: ObservingSchedule, jdUtc: number): number {
  const index = Math.floor(jdUtc - schedule.cycle.startJdUtc);
  return index >= 0 && index < schedule.nightCount ? index : -1;
}

/** The window of night `index` that holds `jdUtc`, else the nearest of that night's windows; null when none. */
function windowOfNight(schedule: ObservingSchedule, index: number, jdUtc: number): TimeSpanJd | null {
  const nightStart = schedule.cycle.startJdUtc + index;
  let best: TimeSpanJd | null = null;
  let bestDistance = Infinity;
  for (const window of schedule.windows) {
    if (window.endJdUtc <= nightStart) continue;
    if (window.startJdUtc >= nightStart + 1) break;
    const distance = Math.max(0, window.startJdUtc - jdUtc, jdUtc - window.endJdUtc);
    if (distance < bestDistance) {
      best = window;
      bestDistance = distance;
    }
  }
  return best;
}

/**
 * The predicted peak of `prediction` (its t0 band and 1σ half-width, times as JD UTC) against `schedule`, the simulated schedule of
 * the event's target (`raDeg`, `decDeg`, ICRS degrees) at `site` (the proposal's site, as
 * `scheduleConditionsOf` gives it): the peak's night's window, the air mass there, the visits within
 * t0 ± 1σ and a sentence ("Peak 2031-07-14 03:10 UTC ± 0.4 d; the site observes it 23:40–05:10 that
 * night at airmass 1.1."). Method: the file's comment. Throws `AppError("bad_request:sky")` for a bad
 * site or target.
 */
export function sitePeakOutlook(input: { prediction: Pick<FitPrediction, "t0Days" | "t0SigmaDays">; schedule: ObservingSchedule; site: SkySiteInput; target: { raDeg: number; decDeg: number } }): SitePeakOutlook {
  const { prediction, schedule } = input;
  const site = parseSkyInput(skySiteSchema, input.site, "site");
  const target = parseSkyInput(skyTargetSchema, input.target, "target");
  const peakJdUtc = prediction.t0Days.median;
  const sigmaDays = prediction.t0SigmaDays;
  const start = firstVisitFrom(schedule.visitsJdUtc, peakJdUtc - sigmaDays);
  const end = firstVisitFrom(schedule.visitsJdUtc, peakJdUtc + sigmaDays);
  const visitsInSigmaJdUtc = schedule.visitsJdUtc.slice(start, end);
  const peak = `Peak ${dateWords(peakJdUtc)} ± ${formatSignificant(sigmaDays, SIGMA_DIGITS)} d`;
  const visits = ` ${visitsWords(visitsInSigmaJdUtc.length)} of the schedule ${visitsInSigmaJdUtc.length === 1 ? "starts" : "start"} within t0 ± 1σ.`;

  const index = nightIndexOf(schedule, peakJdUtc);
  if (index < 0 || !isInCycle(schedule, peakJdUtc)) {
    const sentence = `${peak} falls outside the cycle (${dateWords(schedule.cycle.startJdUtc)} to ${dateWords(schedule.cycle.endJdUtc)}).${visits}`;
    return { peakJdUtc, sigmaDays, where: "outside-cycle", gapReason: null, window: null, observedJdUtc: null, airmass: null, nextWindow: null, visitsInSigmaJdUtc, sentence };
  }
  const gap = gapAt(schedule, peakJdUtc);
  const window = windowOfNight(schedule, index, peakJdUtc);
  const gapWords = gap === null ? "" : ` falls ${gapReasonWords(gap.reason)}`;
  const base = { peakJdUtc, sigmaDays, where: gap === null ? ("window" as const) : ("gap" as const), gapReason: gap?.reason ?? null, window, visitsInSigmaJdUtc };
  if (window === null) {
    const nextWindow = schedule.windows.find((w) => w.startJdUtc > peakJdUtc) ?? null;
    const next = nextWindow === null ? "no usable window follows in the cycle" : `the next usable window is ${dayWords(nextWindow.startJdUtc)} ${formatUtcClock(nextWindow.startJdUtc)}–${formatUtcClock(nextWindow.endJdUtc)} UTC`;
    return { ...base, observedJdUtc: null, airmass: null, nextWindow, sentence: `${peak}${gapWords}; the site has no usable window that night, and ${next}.${visits}` };
  }
  const observedJdUtc = Math.min(window.endJdUtc, Math.max(window.startJdUtc, peakJdUtc));
  const grid = buildNightGrid(site, addDaysIso(schedule.firstNightIso, index), DEFAULT_STEP_MINUTES);
  const sky = skyAtTimes(site, grid, nightMoon(grid, site), refractionScale(site.elevationM), target, Float64Array.of(observedJdUtc));
  const airmass = sky === null ? null : sky.airmass[0];
  const airmassWords = airmass === null ? "" : ` at airmass ${airmass.toFixed(AIRMASS_DECIMALS)}`;
  const span = `${formatUtcClock(window.startJdUtc)}–${formatUtcClock(window.endJdUtc)}`;
  const sentence =
    gap === null
      ? `${peak}; the site observes it ${span} that night${airmassWords}.${visits}`
      : `${peak}${gapWords}; that night the site observes the target ${span}, nearest the peak at ${formatUtcClock(observedJdUtc)}${airmassWords}.${visits}`;
  return { ...base, observedJdUtc, airmass, nextWindow: null, sentence };
}
