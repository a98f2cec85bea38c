/**
 * Astrometric microlensing: one measures the shift of the light centroid of the unresolved images,
 * δ = θ_E u/(u² + 2), largest (θ_E/√8) at u = √2 (Walker 1995, ApJ 453, 37; Miyamoto & Yoshii 1995,
 * AJ 110, 1427; Høg, Novikov & Polnarev 1995, A&A 294, 287 — from memory). Questions: the largest
 * shift and when it occurs against the precision per epoch, and its significance over the visits the
 * schedule collects around it.
 */

import { DAY_S, MILLIARCSECOND_RAD } from "@/lib/physics/constants";
import { pointLensImages } from "@/lib/physics/point-lens";
import { ASTROMETRIC_DETECTION_RULE, ASTROMETRIC_EPOCH_RULE, ASTROMETRIC_NEAR_PEAK_FRACTION, gradeAtLeast, type KnownVerdict } from "./feasibility-rules";
import { missingInput, readSchedule, type Question } from "./science-case-answer";
import { firstVisitFrom } from "./science-case-schedule";
import type { CaseAnswer, ScienceCaseInputs } from "./science-case-questions";
import { angleWords, dateWords, daysWords, numberWords, visitsWords } from "./science-case-words";

const SHIFT_SOURCES = "Walker 1995, ApJ 453, 37; Miyamoto & Yoshii 1995, AJ 110, 1427; Høg, Novikov & Polnarev 1995, A&A 294, 287 (from memory)";

/** Offset at which the centroid shift is largest, u = √2 (θ_E). */
const LARGEST_SHIFT_OFFSET = Math.SQRT2;

export function astrometricAnswers(inputs: ScienceCaseInputs): CaseAnswer[] {
  return [shiftAnswer(inputs), detectionAnswer(inputs)];
}

/** The centroid shift at offset u, units of θ_E. */
function shiftThetaE(u: number): number {
  return pointLensImages(u).centroidShift;
}

/** The event's largest shift (θ_E) and how far from t0 it occurs (t_E): at ±√(2 − u0²) when u0 < √2, else at t0. */
function eventShiftPeak(u0: number): { shiftThetaE: number; offsetTE: number } {
  if (u0 < LARGEST_SHIFT_OFFSET) return { shiftThetaE: 1 / Math.sqrt(8), offsetTE: Math.sqrt(2 - u0 * u0) };
  return { shiftThetaE: shiftThetaE(u0), offsetTE: 0 };
}

const NOT_COMPACT = "The centroid shift of astrometric microlensing is computed for a compact (point) lens, and this lens is extended: choose another science case for it.";

function shiftAnswer(inputs: ScienceCaseInputs): CaseAnswer {
  const question: Question = {
    id: "astrometric-shift",
    question: "Largest centroid shift against the precision per epoch",
    source: `${SHIFT_SOURCES}; threshold: our rule (3 precisions in one epoch; from 1, epochs combined; below 1, systematics dominate)`,
  };
  const { solution, event, instrument } = inputs;
  if (solution.maxAstrometricShiftRad === null) return missingInput(question, NOT_COMPACT);
  const thetaERad = solution.einsteinRadiusRad;
  const u0 = event.impactParameterThetaE;
  const peak = u0 === null ? null : eventShiftPeak(u0);
  const shiftRad = peak === null ? solution.maxAstrometricShiftRad : peak.shiftThetaE * thetaERad;
  const what =
    peak === null || peak.offsetTE > 0
      ? `The centroid shift reaches θ_E/√8 = ${angleWords(shiftRad)} at u = √2`
      : `The source passes no closer than u0 = ${numberWords(u0!)} θ_E, beyond √2, so the centroid shift is largest at closest approach, θ_E u0/(u0² + 2) = ${angleWords(shiftRad)}`;
  const when = shiftTiming(inputs, peak);
  const precisionMas = instrument.astrometricPrecisionMas;
  if (precisionMas === null) return missingInput(question, `${what}${when}. Set the astrometric precision per epoch to compare the shift with it.`, angleWords(shiftRad));
  const ratio = shiftRad / (precisionMas * MILLIARCSECOND_RAD);
  const verdict = gradeAtLeast(ratio, ASTROMETRIC_EPOCH_RULE);
  const meaning: Record<KnownVerdict, string> = {
    feasible: "one epoch near the maximum detects it",
    marginal: "one epoch does not detect it, several combined can",
    infeasible: "it is below the precision of one epoch, where systematic errors, which do not average down over epochs, usually dominate",
  };
  return {
    ...question,
    verdict,
    figure: `${angleWords(shiftRad)} = ${numberWords(ratio)} × the precision per epoch (${angleWords(precisionMas * MILLIARCSECOND_RAD)})`,
    sentence: `${what}${when}: ${numberWords(ratio)} times the precision per epoch of ${angleWords(precisionMas * MILLIARCSECOND_RAD)}, so ${meaning[verdict]}.`,
  };
}

/** ", on … and … (t0 ∓ …)" when t0 and t_E are known, ", at t0 ∓ …" with t_E alone (", at t0 …" for u0 ≥ √2), else nothing. */
function shiftTiming(inputs: ScienceCaseInputs, peak: { offsetTE: number } | null): string {
  const { einsteinTimeS } = inputs.solution;
  const t0 = inputs.event.peakJdUtc;
  if (peak === null || einsteinTimeS === null) return "";
  const offsetDays = (peak.offsetTE * einsteinTimeS) / DAY_S;
  if (offsetDays === 0) return t0 === null ? ", at t0" : `, at t0 (${dateWords(t0)})`;
  const offset = `t0 ∓ t_E √(2 − u0²) = t0 ∓ ${daysWords(offsetDays)}`;
  return t0 === null ? `, at ${offset}` : `, on ${dateWords(t0 - offsetDays)} and ${dateWords(t0 + offsetDays)} (${offset})`;
}

/** Offsets u (θ_E) where the shift u/(u² + 2) is at least `shift`: the roots of u² − u/shift + 2 = 0. */
function offsetsWithShiftAtLeast(shift: number): { low: number; high: number } {
  const b = 1 / shift;
  const root = Math.sqrt(b * b - 8);
  return { low: (b - root) / 2, high: (b + root) / 2 };
}

function detectionAnswer(inputs: ScienceCaseInputs): CaseAnswer {
  const question: Question = {
    id: "astrometric-detection",
    question: "Shift detected over the visits near its maximum",
    source: "Common practice (5σ a detection, 3σ evidence); our rule: visits while the shift is at least half its largest value, combined as √Σ(δ/σ)²",
  };
  const { solution, event, instrument } = inputs;
  if (solution.maxAstrometricShiftRad === null) return missingInput(question, NOT_COMPACT);
  if (solution.einsteinTimeS === null) return missingInput(question, "Set the relative proper motion, or apply a light-curve fit, to get the event's timescale t_E and find when the shift occurs.");
  const u0 = event.impactParameterThetaE;
  if (u0 === null) return missingInput(question, "Set the event's impact parameter u0 (its closest approach, in Einstein radii) to find when the shift is largest.");
  const t0 = event.peakJdUtc;
  if (t0 === null) return missingInput(question, "Set the event's peak date (t0) to count the visits around the largest shift.");
  const precisionMas = instrument.astrometricPrecisionMas;
  if (precisionMas === null) return missingInput(question, "Set the astrometric precision per epoch to find the significance of the shift.");
  const read = readSchedule(question, inputs);
  if ("answer" in read) return read.answer;
  const visits = read.schedule.visitsJdUtc;
  const tE = solution.einsteinTimeS / DAY_S;
  const peak = eventShiftPeak(u0);
  const band = offsetsWithShiftAtLeast(peak.shiftThetaE * ASTROMETRIC_NEAR_PEAK_FRACTION);
  // |t − t0|/t_E between these bounds puts u(t) = √(u0² + τ²) inside the band.
  const innerTE = u0 < band.low ? Math.sqrt(band.low * band.low - u0 * u0) : 0;
  const outerTE = Math.sqrt(band.high * band.high - u0 * u0);
  const shiftPerPrecision = solution.einsteinRadiusRad / (precisionMas * MILLIARCSECOND_RAD);
  let count = 0;
  let sumOfSquares = 0;
  for (let i = firstVisitFrom(visits, t0 - outerTE * tE); i < visits.length && visits[i] <= t0 + outerTE * tE; i++) {
    const tau = Math.abs(visits[i] - t0) / tE;
    if (tau < innerTE) continue;
    const ratio = shiftThetaE(Math.hypot(u0, tau)) * shiftPerPrecision;
    count += 1;
    sumOfSquares += ratio * ratio;
  }
  const significance = Math.sqrt(sumOfSquares);
  const verdict = gradeAtLeast(significance, ASTROMETRIC_DETECTION_RULE);
  const halfShift = angleWords(peak.shiftThetaE * ASTROMETRIC_NEAR_PEAK_FRACTION * solution.einsteinRadiusRad);
  const window = innerTE > 0 ? `${daysWords(innerTE * tE)} to ${daysWords(outerTE * tE)} from t0 on either side` : `within ${daysWords(outerTE * tE)} of t0`;
  const meaning: Record<KnownVerdict, string> = { feasible: "a detection", marginal: "evidence, short of a detection", infeasible: "not detected" };
  return {
    ...question,
    verdict,
    figure: `${numberWords(significance)}σ over ${visitsWords(count)}`,
    sentence: `The schedule collects ${visitsWords(count)} while the shift is at least half its largest value (${halfShift} or more, ${window}); at ${angleWords(precisionMas * MILLIARCSECOND_RAD)} per epoch they measure it at ${numberWords(significance)}σ: ${meaning[verdict]}.`,
  };
}
