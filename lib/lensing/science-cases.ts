/**
 * Science cases: what a team means to observe of a lens, and the questions each case asks of the
 * lensing layer's solution, the instrument and the simulated observing schedule. A case asks only its
 * own questions; a question that does not apply to it is absent, not answered "infeasible".
 * Each case's questions are in its own file (science-case-*.ts); the rules they grade with are in
 * feasibility-rules.ts.
 */

import { DAY_S, MILLIARCSECOND_RAD } from "@/lib/physics/constants";
import type { ObservingSchedule } from "@/lib/schedule/types";
import {
  ASTROMETRIC_DEFAULT_MIN_OFFSET_THETA_E,
  ASTROMETRIC_DEFAULT_MIN_PRECISIONS,
  HORIZON_DEFAULT_MIN_BEAMS,
  interferometerBeamRad,
  RESOLUTION_RULE,
  type Verdict,
} from "./feasibility-rules";
import type { PhotonBudgetOutcome } from "./photon-budget";
import { astrometricAnswers } from "./science-case-astrometric";
import { depthAnswer } from "./science-case-depth";
import { timeDelayAnswers } from "./science-case-delay";
import { horizonAnswers, resolutionElement, resolvedImagesAnswers } from "./science-case-imaging";
import { relativisticOrbitAnswers } from "./science-case-orbit";
import { photometricAnswers } from "./science-case-photometric";
import { relativisticOrbitOf } from "./relativistic-orbit";
import { angleWords, daysWords, numberWords, rotationWords } from "./science-case-words";
import type { LensSolution } from "./solution";

/** The case ids, once: a tuple for zod and database enums. */
export const scienceCaseIds = ["photometric-microlensing", "astrometric-microlensing", "resolved-images", "time-delay", "horizon-scale", "relativistic-orbit"] as const;
export type ScienceCaseId = (typeof scienceCaseIds)[number];

/** How each case is named to people (the trade's terms). */
export const scienceCaseLabels: Record<ScienceCaseId, string> = {
  "photometric-microlensing": "Photometric microlensing event",
  "astrometric-microlensing": "Astrometric microlensing",
  "resolved-images": "Resolved multiple images",
  "time-delay": "Time-delay monitoring",
  "horizon-scale": "Horizon-scale imaging",
  "relativistic-orbit": "Relativistic orbit",
};

/** The event's timing and source, for the microlensing cases. */
export interface EventTiming {
  /** Time of the closest approach (the peak), Julian date UTC; null when not set. */
  peakJdUtc: number | null;
  /** Impact parameter u0, units of θ_E, ≥ 0; null when not set. */
  impactParameterThetaE: number | null;
  /** The source's angular radius in units of θ_E, ρ = θ_s / θ_E, ≥ 0; null for a point source (radius not set). */
  sourceRadiusThetaE: number | null;
  /** Linear limb-darkening coefficient a of I(r) ∝ 1 − a(1 − √(1 − r²)), 0 ≤ a ≤ 1 (0: uniform disk). */
  limbDarkeningU: number;
}

/** The instrument's side of the comparisons; each setting null when the proposal does not give it. */
export interface InstrumentSettings {
  /** Resolution of a single telescope: the PSF's FWHM, mas. */
  psfFwhmMas: number | null;
  /** An interferometer: observing wavelength (mm) and longest baseline (km), both or none. */
  interferometer: { wavelengthMm: number; longestBaselineKm: number } | null;
  /** Astrometric precision of one epoch (one visit), mas. */
  astrometricPrecisionMas: number | null;
  /**
   * Reachable contrast: the largest flux ratio, brighter over fainter (≥ 1), at which the fainter of two
   * images is still detected beside the brighter. A contrast given as Δm magnitudes is 10^(0.4 Δm).
   */
  reachableContrast: number | null;
  /** Radial-velocity precision of one spectroscopic epoch, km/s. */
  spectroscopicPrecisionKmPerS: number | null;
}

/** The campaign's span and pace. */
export interface CampaignSettings {
  /** Length of the monitoring campaign, days; null to use the cycle's length from the schedule. */
  lengthDays: number | null;
  /** Time between visits the proposal asks for, hours; null when not set. */
  cadenceHours: number | null;
}

/**
 * A star (or pulsar) orbiting the compact lens, as the target gives it, for the relativistic-orbit
 * case; each value null when not set.
 */
export interface OrbitInputs {
  /** The compact mass, M☉ (the target's lens mass); null to take it from the period (Kepler's third law). */
  centralMassSolar: number | null;
  /** Distance to the compact mass, pc (the target's lens distance), for angles on the sky. */
  distancePc: number | null;
  /** Semi-major axis, au; null to read it from `semiMajorAxisMas`. */
  semiMajorAxisAu: number | null;
  /** Semi-major axis as an angle at `distancePc`, mas (used when `semiMajorAxisAu` is null). */
  semiMajorAxisMas: number | null;
  /** Eccentricity, 0 ≤ e < 1. */
  eccentricity: number | null;
  /** Orbital period, days (used for the mass when `centralMassSolar` is null). */
  periodDays: number | null;
  /** A time of periapsis passage, Julian date UTC. */
  periapsisJdUtc: number | null;
  /** Inclination, longitude of the ascending node and argument of periapsis, degrees (the usual visual-binary convention). */
  inclinationDeg: number | null;
  nodeDeg: number | null;
  periapsisArgumentDeg: number | null;
}

/** Everything the questions read. */
export interface ScienceCaseInputs {
  solution: LensSolution;
  event: EventTiming;
  instrument: InstrumentSettings;
  /** The target's simulated schedule over the cycle; null when the proposal has no site or cycle dates. */
  schedule: ObservingSchedule | null;
  campaign: CampaignSettings;
  /** The target's photon budget in this case, or why there is none (photon-budget.ts). */
  photonBudget: PhotonBudgetOutcome;
  /** The orbiting star of the relativistic-orbit case (every value null for other targets). */
  orbit: OrbitInputs;
}

/** Stable question ids (also test ids on the page). */
export type CaseQuestionId =
  | "peak-magnification"
  | "event-visits"
  | "peak-visits"
  | "peak-window"
  | "event-duration"
  | "astrometric-shift"
  | "astrometric-detection"
  | "image-separation"
  | "flux-ratio"
  | "delay-season"
  | "delay-visits"
  | "delay-cadence"
  | "seasons-covered"
  | "shadow"
  | "photon-ring"
  | "periapsis-season"
  | "periapsis-epochs"
  | "precession-signal"
  | "redshift-signal"
  | "depth";

/** One answered question. */
export interface CaseAnswer {
  id: CaseQuestionId;
  /** The question as the page names it. */
  question: string;
  verdict: Verdict;
  /** The number behind the verdict, in words with units ("—" when there is none). */
  figure: string;
  /** The answer as a full sentence with its number; for "unknown", the missing input in words. */
  sentence: string;
  /** The rule's source: a paper, "common practice" or "our rule". */
  source: string;
}

/** The questions of a case with their answers, in the order the page shows them. */
export function scienceCaseQuestions(caseId: ScienceCaseId, inputs: ScienceCaseInputs): CaseAnswer[] {
  const depth = depthAnswer(inputs.photonBudget);
  const withDepth = (answers: CaseAnswer[]) => (depth === null ? answers : [...answers, depth]);
  switch (caseId) {
    case "photometric-microlensing":
      return withDepth(photometricAnswers(inputs));
    case "astrometric-microlensing":
      return withDepth(astrometricAnswers(inputs));
    case "resolved-images":
      return withDepth(resolvedImagesAnswers(inputs));
    case "time-delay":
      return withDepth(timeDelayAnswers(inputs));
    case "horizon-scale":
      return withDepth(horizonAnswers(inputs));
    case "relativistic-orbit":
      return withDepth(relativisticOrbitAnswers(inputs));
  }
}

/** The case inferred for a hypothesis, with the sentence the page shows for it. */
export interface DefaultScienceCase {
  caseId: ScienceCaseId;
  reason: string;
}

/**
 * The science case inferred from the solution, the instrument and the target's orbiting star (our
 * rule), first match wins:
 * 1. a compact lens (one with a shadow) whose target gives an orbiting star's elements, enough to
 *    compute its orbit (relativisticOrbitOf) → relativistic orbit;
 * 2. a compact lens whose shadow spans at least half of λ/B of the interferometer set → horizon-scale
 *    imaging;
 * 3. two images at least one resolution element apart (PSF FWHM, else λ/B) → resolved multiple images;
 * 4. a compact lens seen at u ≥ 1 whose largest centroid shift is at least the precision per epoch set
 *    → astrometric microlensing;
 * 5. a compact lens → a photometric microlensing event;
 * 6. an extended lens with a time delay → time-delay monitoring; else resolved multiple images.
 */
export function defaultScienceCase(solution: LensSolution, instrument: InstrumentSettings, orbit: OrbitInputs): DefaultScienceCase {
  const isCompact = solution.shadowDiameterRad !== null;
  const orbiting = isCompact ? relativisticOrbitOf(orbit) : null;
  if (orbiting !== null && "orbit" in orbiting) {
    const { semiMajorAxisAu, eccentricity, periapsisM, precessionExactRad } = orbiting.orbit;
    return {
      caseId: "relativistic-orbit",
      reason: `A star orbits the compact lens (a = ${numberWords(semiMajorAxisAu)} au, e = ${numberWords(eccentricity)}, periapsis at ${numberWords(periapsisM)} GM/c²), so its periapsis passages show the orbit's relativistic precession, ${rotationWords(precessionExactRad)} per orbit, and redshift: relativistic orbit.`,
    };
  }
  const shadowRad = solution.shadowDiameterRad;
  if (shadowRad !== null && instrument.interferometer !== null) {
    const beamRad = interferometerBeamRad(instrument.interferometer.wavelengthMm, instrument.interferometer.longestBaselineKm);
    if (shadowRad / beamRad >= HORIZON_DEFAULT_MIN_BEAMS) {
      return {
        caseId: "horizon-scale",
        reason: `The lens's shadow is ${angleWords(shadowRad)} across, at least half of the interferometer's λ/B of ${angleWords(beamRad)}, so the shadow itself can be observed: horizon-scale imaging.`,
      };
    }
  }
  const element = resolutionElement(instrument);
  const separationRad = solution.imageSeparationRad;
  if (separationRad !== null && element !== null && separationRad / element.rad >= RESOLUTION_RULE.feasibleAt) {
    return {
      caseId: "resolved-images",
      reason: `The two images are ${angleWords(separationRad)} apart, at least the ${element.name} of ${angleWords(element.rad)}, so they can be seen as separate images: resolved multiple images.`,
    };
  }
  const shiftRad = solution.maxAstrometricShiftRad;
  const precisionMas = instrument.astrometricPrecisionMas;
  if (
    isCompact &&
    shiftRad !== null &&
    precisionMas !== null &&
    solution.sourceOffsetThetaE >= ASTROMETRIC_DEFAULT_MIN_OFFSET_THETA_E &&
    shiftRad / (precisionMas * MILLIARCSECOND_RAD) >= ASTROMETRIC_DEFAULT_MIN_PRECISIONS
  ) {
    return {
      caseId: "astrometric-microlensing",
      reason: `The source passes the lens at ${numberWords(solution.sourceOffsetThetaE)} θ_E, too far for a strong brightening, but the centroid shift reaches ${angleWords(shiftRad)}, at least the precision per epoch of ${angleWords(precisionMas * MILLIARCSECOND_RAD)}: astrometric microlensing.`,
    };
  }
  if (isCompact) {
    const lens =
      separationRad === null
        ? "A compact lens"
        : element === null
          ? `A compact lens whose two images are ${angleWords(separationRad)} apart (no resolution is set to separate them)`
          : `A compact lens whose two images, ${angleWords(separationRad)} apart, blend within the ${element.name} of ${angleWords(element.rad)}`;
    const timescale = solution.einsteinTimeS === null ? "" : `, with t_E = ${daysWords(solution.einsteinTimeS / DAY_S)}`;
    return {
      caseId: "photometric-microlensing",
      reason: `${lens}${timescale}: one watches the source brighten and fade, a photometric microlensing event.`,
    };
  }
  if (solution.timeDelayS !== null) {
    const unresolved = element === null ? " (no resolution is set to separate them)" : ` and lie closer together than the ${element.name} of ${angleWords(element.rad)}`;
    return {
      caseId: "time-delay",
      reason: `An extended lens whose images arrive ${daysWords(solution.timeDelayS / DAY_S)} apart${unresolved}: the question is whether the delay can be measured, time-delay monitoring.`,
    };
  }
  return {
    caseId: "resolved-images",
    reason: "An extended lens forming a single image at this offset: the question is whether the instrument resolves the lensed image, resolved multiple images.",
  };
}
