/**
 * The imaging cases. Resolved multiple images: the images' separation against the resolution element
 * and their flux ratio against the contrast the instrument reaches. Horizon-scale imaging: the
 * shadow's diameter against λ/B of the interferometer's longest baseline, and the photon ring's
 * diameter from the exact lens equation (asked only here).
 */

import { MILLIARCSECOND_RAD } from "@/lib/physics/constants";
import { CONTRAST_RULE, gradeAtLeast, interferometerBeamRad, RESOLUTION_RULE, SHADOW_RULE, type KnownVerdict } from "./feasibility-rules";
import { missingInput, type Question } from "./science-case-answer";
import type { InstrumentSettings } from "./science-case-inputs";
import type { CaseAnswer, ScienceCaseInputs } from "./science-case-questions";
import { formatSignificant } from "@/lib/numbers/significant";
import { angleWords, numberWords } from "./science-case-words";

/**
 * The resolution element the images are graded against (our rule): the PSF's FWHM when set (the
 * imaging instrument), else λ/B of the interferometer; null when neither is set.
 */
export function resolutionElement(instrument: InstrumentSettings): { rad: number; name: string } | null {
  if (instrument.psfFwhmMas !== null) return { rad: instrument.psfFwhmMas * MILLIARCSECOND_RAD, name: "PSF FWHM" };
  if (instrument.interferometer !== null) return { rad: beamOf(instrument.interferometer), name: "λ/B" };
  return null;
}

function beamOf(interferometer: NonNullable<InstrumentSettings["interferometer"]>): number {
  return interferometerBeamRad(interferometer.wavelengthMm, interferometer.longestBaselineKm);
}

const SINGLE_IMAGE = "The lens forms a single image for this hypothesis (the source lies outside the region where a second image forms): there is no pair of images to";

export function resolvedImagesAnswers(inputs: ScienceCaseInputs): CaseAnswer[] {
  return [separationAnswer(inputs), fluxRatioAnswer(inputs)];
}

function separationAnswer(inputs: ScienceCaseInputs): CaseAnswer {
  const question: Question = {
    id: "image-separation",
    question: "Image separation against the resolution",
    source: "Common practice (Rayleigh-like: one resolution element separates two images; half of one still allows a two-source fit)",
  };
  const separationRad = inputs.solution.imageSeparationRad;
  if (separationRad === null) return { ...question, verdict: "infeasible", figure: "one image", sentence: `${SINGLE_IMAGE} resolve.` };
  const element = resolutionElement(inputs.instrument);
  if (element === null) {
    return missingInput(question, `The images are ${angleWords(separationRad)} apart. Set the instrument's resolution (the PSF's FWHM) or an interferometer's wavelength and longest baseline to compare the separation with it.`, angleWords(separationRad));
  }
  const ratio = separationRad / element.rad;
  const verdict = gradeAtLeast(ratio, RESOLUTION_RULE);
  const meaning: Record<KnownVerdict, string> = {
    feasible: "the two images are resolved",
    marginal: "a fit of two point sources can still split them",
    infeasible: "they blend into one image",
  };
  return {
    ...question,
    verdict,
    figure: `${angleWords(separationRad)} = ${numberWords(ratio)} × ${element.name} (${angleWords(element.rad)})`,
    sentence: `The images are ${angleWords(separationRad)} apart, ${numberWords(ratio)} times the ${element.name} of ${angleWords(element.rad)}: ${meaning[verdict]}.`,
  };
}

/** Magnitudes for a flux ratio: 2.5 log₁₀ ratio. */
function ratioMag(ratio: number): number {
  return 2.5 * Math.log10(ratio);
}

function fluxRatioAnswer(inputs: ScienceCaseInputs): CaseAnswer {
  const question: Question = {
    id: "flux-ratio",
    question: "Flux ratio against the reachable contrast",
    source: "Our rule (within the reachable contrast the fainter image is seen; up to twice it, 0.75 mag beyond, marginal)",
  };
  const fluxRatio = inputs.solution.fluxRatio;
  if (fluxRatio === null) return { ...question, verdict: "infeasible", figure: "one image", sentence: `${SINGLE_IMAGE} compare.` };
  const ratioWords = `${numberWords(fluxRatio)} (Δm = ${numberWords(ratioMag(fluxRatio))} mag)`;
  const brighter = `The brighter image is ${numberWords(fluxRatio)} times as bright as the fainter (Δm = ${numberWords(ratioMag(fluxRatio))} mag)`;
  const contrast = inputs.instrument.reachableContrast;
  if (contrast === null) {
    return missingInput(question, `${brighter}. Set the contrast the instrument reaches (the largest flux ratio at which a faint image is still seen beside a bright one) to compare it.`, `flux ratio ${ratioWords}`);
  }
  const verdict = gradeAtLeast(contrast / fluxRatio, CONTRAST_RULE);
  const meaning: Record<KnownVerdict, string> = {
    feasible: "within it, so the fainter image is seen beside the brighter",
    marginal: "beyond it by less than a factor of two: the fainter image may show after a careful subtraction of the brighter",
    infeasible: "well beyond it: the fainter image is lost in the brighter one's light",
  };
  return {
    ...question,
    verdict,
    figure: `flux ratio ${ratioWords} against a contrast of ${numberWords(contrast)}`,
    sentence: `${brighter}, against a reachable contrast of ${numberWords(contrast)} (${numberWords(ratioMag(contrast))} mag): ${meaning[verdict]}.`,
  };
}

export function horizonAnswers(inputs: ScienceCaseInputs): CaseAnswer[] {
  return [shadowAnswer(inputs), photonRingAnswer(inputs)];
}

const NO_INTERFEROMETER = "Set the interferometer's wavelength and longest baseline to compare it with λ/B.";
const EXTENDED = "This lens is extended: it has no horizon, so there is no shadow or photon ring to image.";

/** λ/B in words: "25.2 µas (1.3 mm over 10700 km)". */
function beamWords(interferometer: NonNullable<InstrumentSettings["interferometer"]>): string {
  return `${angleWords(beamOf(interferometer))} (${numberWords(interferometer.wavelengthMm)} mm over ${numberWords(interferometer.longestBaselineKm)} km)`;
}

/** A diameter against λ/B (SHADOW_RULE): the verdict, the figure, and the ratio in words for the sentence. */
function againstBeam(diameterRad: number, interferometer: NonNullable<InstrumentSettings["interferometer"]>): { verdict: KnownVerdict; figure: string; words: string } {
  const beamRad = beamOf(interferometer);
  const ratio = diameterRad / beamRad;
  return {
    verdict: gradeAtLeast(ratio, SHADOW_RULE),
    figure: `${angleWords(diameterRad)} = ${numberWords(ratio)} × λ/B (${angleWords(beamRad)})`,
    words: `${numberWords(ratio)} times λ/B = ${beamWords(interferometer)}`,
  };
}

function shadowAnswer(inputs: ScienceCaseInputs): CaseAnswer {
  const question: Question = {
    id: "shadow",
    question: "Shadow against λ/B",
    source: "Shadow diameter 2√27 GM/(c² D) for a distant observer (Synge 1966, MNRAS 131, 463, from memory); threshold: common practice (one λ/B images the ring, half of one allows fitting its size)",
  };
  const shadowRad = inputs.solution.shadowDiameterRad;
  if (shadowRad === null) return { ...question, verdict: "infeasible", figure: "no shadow", sentence: EXTENDED };
  const interferometer = inputs.instrument.interferometer;
  if (interferometer === null) return missingInput(question, `The shadow is ${angleWords(shadowRad)} across. ${NO_INTERFEROMETER}`, angleWords(shadowRad));
  const graded = againstBeam(shadowRad, interferometer);
  const meaning: Record<KnownVerdict, string> = {
    feasible: "its edge is resolved and the shadow can be imaged",
    marginal: "its size can be fitted to the visibilities, but it is not imaged",
    infeasible: "it is unresolved, far below the finest detail the array sees",
  };
  return { ...question, verdict: graded.verdict, figure: graded.figure, sentence: `The shadow is ${angleWords(shadowRad)} across, ${graded.words}: ${meaning[graded.verdict]}.` };
}

function photonRingAnswer(inputs: ScienceCaseInputs): CaseAnswer {
  const question: Question = {
    id: "photon-ring",
    question: "Photon ring (exact lens equation)",
    source: "Virbhadra & Ellis 2000, Phys. Rev. D 62, 084003 (exact lens equation, n = 1 relativistic ring); threshold as for the shadow: common practice",
  };
  const { photonRingDiameterRad: ringRad, shadowDiameterRad: shadowRad } = inputs.solution;
  if (ringRad === null || shadowRad === null) return { ...question, verdict: "infeasible", figure: "no photon ring", sentence: EXTENDED };
  const ring = `The first relativistic Einstein ring (n = 1) is ${angleWords(ringRad)} across, ${formatSignificant(ringRad / shadowRad, 5)} times the shadow's`;
  const interferometer = inputs.instrument.interferometer;
  if (interferometer === null) return missingInput(question, `${ring}. ${NO_INTERFEROMETER}`, angleWords(ringRad));
  const graded = againstBeam(ringRad, interferometer);
  const meaning: Record<KnownVerdict, string> = {
    feasible: "the ring's diameter is resolved",
    marginal: "its diameter can be fitted, not imaged",
    infeasible: "it is unresolved",
  };
  return { ...question, verdict: graded.verdict, figure: graded.figure, sentence: `${ring}, and ${graded.words}: ${meaning[graded.verdict]}.` };
}
