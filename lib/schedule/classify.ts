/**
 * One target on one night: every stretch of the night classified as usable or by the first rule it
 * fails, written to the target's time line. The rules are signs of quantities sampled on the night's
 * grid and taken as linear between samples, so each rule changes at most once per sample step and a
 * step splits into at most five stretches, each boundary interpolated (seconds with a 5-minute step).
 */
import { TWILIGHT_ALTITUDE_DEG } from "@/lib/astro/constants";
import { apparentDirectionOfDate } from "@/lib/astro/apparent-place";
import { fillSineAltitudes, isTooCloseToSun } from "@/lib/astro/target-night";
import type { SkyTarget } from "@/lib/astro/inputs";
import type { ScheduleNight } from "./night";
import { BELOW_LIMIT, DAYLIGHT, MOON, SUN, USABLE, WEATHER, type StretchCode, type TargetTimeline } from "./timeline";

/** The cycle's thresholds, as the quantities the per-sample tests compare. */
export interface ScheduleRules {
  /** Sine of the binding geometric altitude limit (airmass or horizon limit). */
  sinAltitudeLimit: number;
  /** Cosine of the safe Sun elongation. */
  cosSafeSunElongation: number;
  /** Cosine of the minimum Moon separation; null when there is none. */
  cosMinMoonSeparation: number | null;
}

const DARK_LIMIT_DEG = TWILIGHT_ALTITUDE_DEG.astronomical;
const RULES = 4;

/** Scratch arrays reused across targets and nights (no allocation per target-night). */
export interface ClassifyScratch {
  direction: Float64Array;
  sineAltitudes: Float64Array;
  /** Where rules change inside a step (fractions of the step), and the step's end. */
  crossings: Float64Array;
}

export function classifyScratch(): ClassifyScratch {
  return {
    direction: new Float64Array(3),
    sineAltitudes: new Float64Array(0),
    crossings: new Float64Array(RULES + 1),
  };
}

/** Insertion sort of the first `count` entries (at most five). */
function sortAscending(values: Float64Array, count: number): void {
  for (let i = 1; i < count; i++) {
    const value = values[i];
    let j = i - 1;
    for (; j >= 0 && values[j] > value; j--) values[j + 1] = values[j];
    values[j + 1] = value;
  }
}

/** The code of a moment from the rules that fail there; `lateCode` is SUN, WEATHER or USABLE from the nightly rules. */
function codeOf(isDaylight: boolean, isBelowLimit: boolean, isMoonFailing: boolean, lateCode: StretchCode): StretchCode {
  if (isDaylight) return DAYLIGHT;
  if (isBelowLimit) return BELOW_LIMIT;
  if (lateCode === SUN) return SUN;
  return isMoonFailing ? MOON : lateCode;
}

/**
 * Writes the night `night` of the target `target` (ICRS degrees) to `timeline`, from local noon to
 * local noon. Per sample, four margins, each ≤ 0 when its rule holds: the Sun's altitude above −18°
 * (astronomical darkness), the limit's sine above the target's, the cosine of the Moon–target
 * separation above the cosine of the minimum, the bright-Moon margin (`ScheduleNight`). The Sun rule
 * is the nightly safe-elongation test (`isTooCloseToSun`), the weather the night's clear flag.
 * A stretch's code is the first failing rule in the order daylight, below-limit, sun, moon, weather.
 */
export function classifyTargetNight(night: ScheduleNight, rules: ScheduleRules, target: SkyTarget, scratch: ClassifyScratch, timeline: TargetTimeline): void {
  const { grid, moon } = night;
  const jd = grid.jdUtc;
  const endJdUtc = jd[grid.sampleCount - 1];
  timeline.beginNight(night.index);
  if (grid.darkStepCount === 0) {
    timeline.add(DAYLIGHT, grid.startJdUtc, endJdUtc);
    timeline.endNight(endJdUtc);
    return;
  }
  const from = grid.darkFirstSample;
  const to = grid.darkLastSample;
  const direction = apparentDirectionOfDate(grid.place, target.raDeg, target.decDeg, scratch.direction);
  if (scratch.sineAltitudes.length < grid.sampleCount) scratch.sineAltitudes = new Float64Array(grid.sampleCount);
  const sinAltitude = scratch.sineAltitudes;
  fillSineAltitudes(grid, direction, sinAltitude, from, to);
  const sunAltitude = grid.sunAltitudeDeg;
  const { sinAltitudeLimit } = rules;
  const cosMinSeparation = moon !== null ? rules.cosMinMoonSeparation : null;
  const bright = night.brightMoonMargin;
  const dx = direction[0];
  const dy = direction[1];
  const dz = direction[2];

  const lateCode: StretchCode = isTooCloseToSun(grid, direction, rules.cosSafeSunElongation) ? SUN : night.isClear ? USABLE : WEATHER;
  const hasSeparationRule = cosMinSeparation !== null;
  const cosSeparation = cosMinSeparation ?? 0;
  const moonX = moon?.x;
  const moonY = moon?.y;
  const moonZ = moon?.z;
  const { crossings } = scratch;

  // Stretches with one code are merged here and written to the time line once per run.
  let runCode: StretchCode = DAYLIGHT;
  let runStartJdUtc = grid.startJdUtc;
  // Margins at the step's start (a*) and end (b*): darkness, altitude limit, Moon separation, bright Moon.
  let a0 = 0, a1 = 0, a2 = 0, a3 = 0;
  for (let k = from; k <= to; k++) {
    const b0 = sunAltitude[k] - DARK_LIMIT_DEG;
    const b1 = sinAltitudeLimit - sinAltitude[k];
    const b2 = hasSeparationRule ? dx * moonX![k] + dy * moonY![k] + dz * moonZ![k] - cosSeparation : -1;
    const b3 = bright === null ? -1 : bright[k];
    if (k > from) {
      // The step from sample k − 1: cut where a rule changes, one code per piece (read at its middle).
      let cuts = 0;
      if (a0 > 0 !== b0 > 0) crossings[cuts++] = a0 / (a0 - b0);
      if (a1 > 0 !== b1 > 0) crossings[cuts++] = a1 / (a1 - b1);
      if (a2 > 0 !== b2 > 0) crossings[cuts++] = a2 / (a2 - b2);
      if (a3 > 0 !== b3 > 0) crossings[cuts++] = a3 / (a3 - b3);
      if (cuts === 0) {
        const code = codeOf(a0 > 0, a1 > 0, a2 > 0 || a3 > 0, lateCode);
        if (code !== runCode) {
          timeline.add(runCode, runStartJdUtc, jd[k - 1]);
          runCode = code;
          runStartJdUtc = jd[k - 1];
        }
      } else {
        crossings[cuts++] = 1;
        sortAscending(crossings, cuts);
        let x0 = 0;
        for (let c = 0; c < cuts; c++) {
          const x1 = crossings[c];
          if (x1 <= x0) continue;
          const x = (x0 + x1) / 2;
          const code = codeOf(a0 + (b0 - a0) * x > 0, a1 + (b1 - a1) * x > 0, a2 + (b2 - a2) * x > 0 || a3 + (b3 - a3) * x > 0, lateCode);
          if (code !== runCode) {
            const startJdUtc = jd[k - 1] + x0 * grid.stepDays;
            timeline.add(runCode, runStartJdUtc, startJdUtc);
            runCode = code;
            runStartJdUtc = startJdUtc;
          }
          x0 = x1;
        }
      }
    }
    a0 = b0;
    a1 = b1;
    a2 = b2;
    a3 = b3;
  }
  if (runCode !== DAYLIGHT) {
    timeline.add(runCode, runStartJdUtc, jd[to]);
    runStartJdUtc = jd[to];
  }
  timeline.add(DAYLIGHT, runStartJdUtc, endJdUtc);
  timeline.endNight(endJdUtc);
}
