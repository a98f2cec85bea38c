/**
 * The ray view's time slider: at coordinate time T (units of M, since the rays left the start plane
 * x = −R₀) each ray is drawn only as far as it has travelled, so the rays' tips form the advancing
 * front, which lags near the mass; its last stretch (the head) is drawn brighter. The rule is here once,
 * in TypeScript for the saved figure and the tests and in GLSL for the view's shaders, side by side.
 */
import { SOLAR_MASS_TIME_S } from "@/lib/physics";
import { formatInUnit, naturalTimeUnit } from "../bench/display-units";
import { formatSignificant } from "@/lib/numbers/significant";

/** Positions of the slider; the last shows every path whole. */
export const TIME_SLIDER_STEPS = 400;

/** Length of a ray's bright head, as a share of the slider's whole span (our choice: visible, not a smear). */
export const FRONT_HEAD_SHARE = 0.025;

/** The time (units of M) at slider `step` of TIME_SLIDER_STEPS for a bundle whose latest point is at `latestTimeM`; the last step is +∞ (no cut). */
export function sliderTimeM(step: number, latestTimeM: number): number {
  if (step >= TIME_SLIDER_STEPS) return Number.POSITIVE_INFINITY;
  return (Math.max(0, step) / TIME_SLIDER_STEPS) * latestTimeM;
}

/** The length of the bright head (units of M) at `timeM`: none while every path is shown whole. */
export function frontHeadM(timeM: number, latestTimeM: number): number {
  return Number.isFinite(timeM) ? FRONT_HEAD_SHARE * latestTimeM : 0;
}

/** Whether a point reached at `vertexTimeM` is drawn at slider time `timeM` (both units of M). */
export const isShownAtTime = (vertexTimeM: number, timeM: number): boolean => vertexTimeM <= timeM;

/** Whether a drawn point lies in the ray's bright head: reached less than `headM` before `timeM`. */
export const isInFrontHead = (vertexTimeM: number, timeM: number, headM: number): boolean => vertexTimeM <= timeM && timeM - vertexTimeM < headM;

/**
 * The same rule for the view's fragment shaders (the times are interpolated linearly along each drawn
 * segment, as `pathUpToTime` does): 1.0 when shown, else 0.0; 1.0 in the head, else 0.0.
 */
export const TIME_RULE_GLSL = /* glsl */ `
float shownAtTime(float vertexTime, float timeM) { return vertexTime <= timeM ? 1.0 : 0.0; }
float inFrontHead(float vertexTime, float timeM, float headM) { return (vertexTime <= timeM && timeM - vertexTime < headM) ? 1.0 : 0.0; }
`;

/**
 * How much of the path [first, end) of `vertices` ([x, y, z] per point, times in `timesM`, ascending)
 * is drawn at `timeM`: the whole points shown, and the tip where the path is cut between the last of
 * them and the next (linear in time along that segment), or undefined when the path is whole or unstarted.
 */
export function pathUpToTime(vertices: Float32Array, timesM: Float32Array, first: number, end: number, timeM: number): { shownPoints: number; tip: [number, number, number] | undefined } {
  let p = first;
  while (p < end && isShownAtTime(timesM[p], timeM)) p++;
  if (p === end || p === first) return { shownPoints: p - first, tip: undefined };
  const t0 = timesM[p - 1];
  const f = timesM[p] > t0 ? (timeM - t0) / (timesM[p] - t0) : 0;
  const at = (axis: number) => vertices[3 * (p - 1) + axis] + f * (vertices[3 * p + axis] - vertices[3 * (p - 1) + axis]);
  return { shownPoints: p - first, tip: [at(0), at(1), at(2)] };
}

/** The slider's reading: "all paths whole", or "t = 120 M" and, for a known mass, "(59.1 µs)". */
export function sliderTimeText(timeM: number, massSolar: number | undefined): string {
  if (!Number.isFinite(timeM)) return "all paths whole";
  const inM = `t = ${formatSignificant(timeM, 3)} M`;
  if (massSolar === undefined) return inM;
  const seconds = timeM * massSolar * SOLAR_MASS_TIME_S;
  return `${inM} (${formatInUnit("time", seconds, naturalTimeUnit(seconds), 3)})`;
}
