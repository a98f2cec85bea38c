/**
 * Science cases: what a team means to observe of a lens, and the questions each case asks of the
 * lensing layer's solution, the instrument and the simulated observing schedule. A case asks only its
 * own questions; a question that does not apply to it is absent, not answered "infeasible".
 * Each case's questions are in its own file (science-case-*.ts); the rules they grade with are in
 * feasibility-rules.ts.
 */

import { DAY_S, MILLIARCSECOND_RAD } from "@/lib/physics/constants";
import {
  ASTROMETRIC_DEFAULT_MIN_OFFSET_THETA_E,
  ASTROMETRIC_DEFAULT_MIN_PRECISIONS,
  HORIZON_DEFAULT_MIN_BEAMS,
  interferometerBeamRad,
  RESOLUTION_RULE,
  type Verdict,
} from "./feasibility-rules";
import type { InstrumentSettings, OrbitInputs, ScienceCaseId } from "./science-case-inputs";
import type { CaseAnswer, ScienceCaseInputs } from "./science-case-questions";
import { astrometricAnswers } from "./science-case-astrometric";
import { depthAnswer } from "./science-case-depth";
import { timeDelayAnswers } from "./science-case-delay";
import { horizonAnswers, resolutionElement, resolvedImagesAnswers } from "./science-case-imaging";
import { relativisticOrbitAnswers } from "./science-case-orbit";
import { photometricAnswers } from "./science-case-photometric";
import { relativisticOrbitOf } from "./relativistic-orbit";
import { angleWords, daysWords, numberWords, rotationWords } from "./science-case-words";
import type { LensSolution } from "./solution";

/** How each case is named to people (the trade's terms). */
export const scienceCaseLabels: Record<ScienceCaseId, string> = {
  "photometric-microlensing": "Photometric microlensing event",
  "astrometric-microlensing": "Astrometric microlensing",
  "resolved-images": "Resolved multiple images",
  "time-delay": "Time-delay monitoring",
  "horizon-scale": "Horizon-scale imaging",
  "relativistic-orbit": "Relativistic orbit",
};

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
