/**
 * Feasibility verdicts in plain words: each compares one computed scale of the lens with one limit of
 * the instrument or the campaign, and says which way it falls. Thresholds are rules of thumb stated
 * beside each function, not instrument models.
 */

import { formatInUnit, formatPlain, naturalAngleUnit, naturalTimeUnit } from "./display-units";

export type VerdictOutlook = "feasible" | "marginal" | "infeasible";

export interface Verdict {
  /** Stable key, also the test id of the verdict on the page. */
  id: "resolution" | "sampling" | "time-delay";
  outlook: VerdictOutlook;
  text: string;
}

const FIGURE_DIGITS = 2;

function angleWords(angleRad: number): string {
  return formatInUnit("angle", angleRad, naturalAngleUnit(angleRad), FIGURE_DIGITS);
}

function timeWords(timeS: number): string {
  return formatInUnit("time", timeS, naturalTimeUnit(timeS), FIGURE_DIGITS);
}

/**
 * Image separation against the resolution element: at one element or more two images are separate
 * (Rayleigh-like criterion); from half an element a fit of two point sources can still split them.
 */
export function resolutionVerdict(separationRad: number, resolutionRad: number, resolutionName: "FWHM" | "λ/B"): Verdict {
  const ratio = separationRad / resolutionRad;
  const lead = `images separated by ${formatPlain(ratio, FIGURE_DIGITS)} ${resolutionName} (${angleWords(separationRad)})`;
  if (ratio >= 1) return { id: "resolution", outlook: "feasible", text: `${lead}: resolvable` };
  if (ratio >= 0.5) return { id: "resolution", outlook: "marginal", text: `${lead}: marginal, needs a two-source fit` };
  return { id: "resolution", outlook: "infeasible", text: `${lead}: unresolved, the images blend into one` };
}

/** Observing epochs k·cadence (k = 0, 1, ...) inside [fromS, toS] ∩ [0, campaignS]. */
export function epochsWithin(fromS: number, toS: number, cadenceS: number, campaignS: number): number {
  const first = Math.max(0, Math.ceil(Math.max(fromS, 0) / cadenceS));
  const last = Math.floor(Math.min(toS, campaignS) / cadenceS);
  return Math.max(0, last - first + 1);
}

/** Epochs across t0 ± t_E that make a light curve well sampled, or at least usable. */
const WELL_SAMPLED_EPOCHS = 20;
const USABLE_EPOCHS = 6;

/** How densely the campaign samples the event's rise and fall (t0 ± t_E). */
export function samplingVerdict(einsteinTimeS: number, cadenceS: number, campaignS: number, peakTimeS: number): Verdict {
  const epochs = epochsWithin(peakTimeS - einsteinTimeS, peakTimeS + einsteinTimeS, cadenceS, campaignS);
  const lead = `t_E = ${timeWords(einsteinTimeS)} sampled ${epochs} ${epochs === 1 ? "time" : "times"} within t0 ± t_E at a cadence of ${timeWords(cadenceS)}`;
  if (peakTimeS < 0 || peakTimeS > campaignS) {
    return { id: "sampling", outlook: "infeasible", text: `${lead}; the peak falls outside the ${timeWords(campaignS)} campaign` };
  }
  // Epochs alone do not make a light curve (our rule): t_E is measured from the wings against the
  // baseline, so a campaign shorter than t_E constrains it poorly, and one under a tenth of t_E cannot
  // measure the event at all (near the peak only the combination u0·t_E is seen).
  if (campaignS < einsteinTimeS / 10) {
    return { id: "sampling", outlook: "infeasible", text: `${lead}; the ${timeWords(campaignS)} campaign covers less than t_E (under a tenth of it), so neither the event's timescale nor its baseline can be measured` };
  }
  if (campaignS < einsteinTimeS) {
    return { id: "sampling", outlook: "marginal", text: `${lead}; the ${timeWords(campaignS)} campaign covers less than t_E, so the wings and the baseline fall outside it and t_E is poorly constrained` };
  }
  if (epochs >= WELL_SAMPLED_EPOCHS) return { id: "sampling", outlook: "feasible", text: `${lead}: well sampled` };
  if (epochs >= USABLE_EPOCHS) return { id: "sampling", outlook: "marginal", text: `${lead}: sparsely sampled` };
  return { id: "sampling", outlook: "infeasible", text: `${lead}: undersampled` };
}

/** A delay is measurable from light curves when it spans several cadence intervals and fits in the campaign. */
const MEASURABLE_DELAY_CADENCES = 3;

/** The time delay between the images against the cadence and the campaign. */
export function timeDelayVerdict(delayS: number, cadenceS: number, campaignS: number): Verdict {
  const lead = `time delay ${timeWords(delayS)} against a cadence of ${timeWords(cadenceS)}`;
  if (delayS > campaignS) return { id: "time-delay", outlook: "infeasible", text: `${lead}: longer than the ${timeWords(campaignS)} campaign` };
  const cadences = delayS / cadenceS;
  if (cadences >= MEASURABLE_DELAY_CADENCES) return { id: "time-delay", outlook: "feasible", text: `${lead}: measurable` };
  if (cadences >= 1) return { id: "time-delay", outlook: "marginal", text: `${lead}: marginal, a few epochs apart` };
  return { id: "time-delay", outlook: "infeasible", text: `${lead}: shorter than the cadence, not measurable` };
}

/** A lens body that hides one image (or both) leaves no pair to split or time. */
export function occultedImageVerdict(areBothHidden: boolean): Verdict {
  const text = areBothHidden
    ? "both images lie behind the lens's body (their rays pass closer than its radius): the source is hidden"
    : "the inner image lies behind the lens's body (its ray passes closer than its radius): one image is seen, no pair to resolve and no time delay";
  return { id: "resolution", outlook: "infeasible", text };
}

/** An SIS with the source outside its Einstein radius forms one image: there is no pair to split or time. */
export function singleImageVerdict(): Verdict {
  return { id: "resolution", outlook: "infeasible", text: "a single image (β ≥ θ_E): no image pair to resolve and no time delay" };
}
