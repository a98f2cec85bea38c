/**
 * Photometric microlensing event: one watches the source brighten and fade as a compact lens passes.
 * Questions: the peak magnification (finite source included), the visits over the event and over its
 * peak, whether the peak falls in usable time, and the event's duration against the campaign. No
 * image-resolution or time-delay question: the images are not resolved and their delay not observed.
 */

import { DAY_S } from "@/lib/physics/constants";
import { pointLensMagnification } from "@/lib/physics/point-lens";
import {
  EVENT_VISITS_RULE,
  coverageVerdict,
  gradeAtLeast,
  PEAK_MAGNIFICATION_RULE,
  PEAK_VISITS_RULE,
  peakHalfWidthDays,
  peakReachVerdict,
  worseVerdict,
  type PeakWidthTerm,
  type KnownVerdict,
} from "./feasibility-rules";
import { peakMagnification } from "./microlensing";
import { missingInput, readSchedule, type Question } from "./science-case-answer";
import { cycleDays, daysInCycleAround, daysToUsableTime, gapAt, isInCycle, isInSeason, visitsBetween } from "./science-case-schedule";
import type { CaseAnswer, ScienceCaseInputs } from "./science-case-questions";
import { dateWords, daysWords, gapReasonWords, isCalendarDate, numberWords, SEASON_GAP_WORDS, visitsWords } from "./science-case-words";

const PACZYNSKI = "Paczyński 1986, ApJ 304, 1";

const NEEDS_EINSTEIN_TIME = "Set the relative proper motion, or apply a light-curve fit, to get the event's timescale t_E";
const NEEDS_PEAK_DATE = "Set the event's peak date (t0)";
const NEEDS_IMPACT = "Set the event's impact parameter u0 (its closest approach, in Einstein radii)";

export function photometricAnswers(inputs: ScienceCaseInputs): CaseAnswer[] {
  return [peakMagnificationAnswer(inputs), eventVisitsAnswer(inputs), peakVisitsAnswer(inputs), peakWindowAnswer(inputs), eventDurationAnswer(inputs)];
}

function einsteinTimeDays(inputs: ScienceCaseInputs): number | null {
  const { einsteinTimeS } = inputs.solution;
  return einsteinTimeS === null ? null : einsteinTimeS / DAY_S;
}

/** Magnitudes of brightening for a magnification A: 2.5 log₁₀ A. */
function brighteningMag(magnification: number): number {
  return 2.5 * Math.log10(magnification);
}

function peakMagnificationAnswer(inputs: ScienceCaseInputs): CaseAnswer {
  const question: Question = {
    id: "peak-magnification",
    question: "Peak magnification",
    source: `${PACZYNSKI} (point source); Witt & Mao 1994, ApJ 430, 505 (finite source); Lee et al. 2009, ApJ 695, 200 (the disk integral near the lens); Gould 2008, ApJ 681, 1593 and Pejcha & Heyrovský 2009, ApJ 690, 1772 (the series in the source radius away from it); thresholds: common practice (A ≥ 1.34 is u0 ≤ 1) and our rule (marginal from A = 1.06, u0 = 2)`,
  };
  if (inputs.solution.shadowDiameterRad === null) {
    return missingInput(question, "The peak magnification of a microlensing event is computed for a compact (point) lens, and this lens is extended: choose another science case for it.");
  }
  const { impactParameterThetaE: u0, sourceRadiusThetaE: rho, limbDarkeningU } = inputs.event;
  if (u0 === null) return missingInput(question, `${NEEDS_IMPACT} to compute the peak magnification.`);
  const hasDisk = rho !== null && rho > 0;
  if (u0 === 0 && !hasDisk) {
    return missingInput(question, "A point source passing exactly behind the lens (u0 = 0) has no finite peak: set the source's radius ρ (in Einstein radii) to compute the finite-source peak.");
  }
  const magnification = peakMagnification(u0, hasDisk ? rho : 0, hasDisk ? limbDarkeningU : 0);
  const verdict = gradeAtLeast(magnification, PEAK_MAGNIFICATION_RULE);
  const brightening = `a brightening of ${numberWords(brighteningMag(magnification))} mag`;
  const grade: Record<KnownVerdict, string> = {
    feasible: "",
    marginal: " The source passes outside the Einstein radius (A below 1.34), so only precise photometry detects the event.",
    infeasible: " The source passes far outside the Einstein radius (A below 1.06): the brightening is too small to be seen as an event.",
  };
  if (!hasDisk) {
    return {
      ...question,
      verdict,
      figure: `A = ${numberWords(magnification)} at u0 = ${numberWords(u0)} (point source)`,
      sentence: `At u0 = ${numberWords(u0)} the peak magnification of a point source is A = ${numberWords(magnification)} (${PACZYNSKI}), ${brightening}; set the source's radius ρ to include the finite-source limit.${grade[verdict]}`,
    };
  }
  const pointSource = u0 > 0 ? `against ${numberWords(pointLensMagnification(u0))} for a point source` : "where a point source would have no finite peak";
  const darkening = limbDarkeningU > 0 ? `, limb darkening a = ${numberWords(limbDarkeningU)}` : ", uniform";
  const crossing = rho > u0 ? " The source passes over the lens (ρ > u0), so its disk flattens the peak and the light curve measures ρ." : "";
  return {
    ...question,
    verdict,
    figure: `A = ${numberWords(magnification)} at u0 = ${numberWords(u0)}, ρ = ${numberWords(rho)}`,
    sentence: `At u0 = ${numberWords(u0)} a source of radius ρ = ${numberWords(rho)} θ_E${darkening} peaks at A = ${numberWords(magnification)}, ${pointSource}: ${brightening}.${crossing}${grade[verdict]}`,
  };
}

function eventVisitsAnswer(inputs: ScienceCaseInputs): CaseAnswer {
  const question: Question = {
    id: "event-visits",
    question: "Visits over the event (t0 ± t_E)",
    source: "Common practice (ten points per t_E trace the light curve, three give its shape); our rule for an event the cycle covers only in part",
  };
  const tE = einsteinTimeDays(inputs);
  if (tE === null) return missingInput(question, `${NEEDS_EINSTEIN_TIME} and count the visits over the event.`);
  const t0 = inputs.event.peakJdUtc;
  if (t0 === null) return missingInput(question, `${NEEDS_PEAK_DATE} to count the visits over the event (t0 ± t_E).`);
  const read = readSchedule(question, inputs);
  if ("answer" in read) return read.answer;
  const { schedule } = read;
  const count = visitsBetween(schedule, t0 - tE, t0 + tE);
  const coveredDays = daysInCycleAround(schedule, t0, tE);
  const byCount = gradeAtLeast(count, EVENT_VISITS_RULE);
  const byCoverage = coverageVerdict(coveredDays, tE);
  const verdict = worseVerdict(byCount, byCoverage);
  const dates = isCalendarDate(t0 - tE) && isCalendarDate(t0 + tE) ? `${dateWords(t0 - tE)} to ${dateWords(t0 + tE)}, ` : "";
  const collected = `The schedule collects ${visitsWords(count)} within t0 ± t_E (${dates}t_E = ${daysWords(tE)})`;
  const countWords: Record<KnownVerdict, string> = {
    feasible: "enough to trace the rise and fall (20 or more)",
    marginal: "a sparse light curve (6 to 19)",
    infeasible: "too few to trace the light curve (under 6)",
  };
  const covered = `the cycle covers only ${daysWords(coveredDays)} of the event's 2 t_E = ${daysWords(2 * tE)}`;
  const sentence =
    byCoverage === "feasible"
      ? `${collected}: ${countWords[byCount]}.`
      : byCoverage === "infeasible"
        ? `${collected}, but ${covered}, under a tenth of t_E: too little of the light curve to measure the event.`
        : `${collected}: ${countWords[byCount]}; ${covered}, so its wings and baseline are partly missed.`;
  return { ...question, verdict, figure: `${visitsWords(count)} in t0 ± t_E (±${daysWords(tE)})`, sentence };
}

const widthWords: Record<PeakWidthTerm, string> = {
  impact: "u0·t_E",
  source: "ρ·t_E, the source's crossing time, as the source is larger than u0",
  floor: "t_E/10, the least half-width we take",
};

/** t_eff and the words saying which term set it, or the sentence naming the missing input. */
function peakWidth(inputs: ScienceCaseInputs, purpose: string): { tEff: number; words: string } | { missing: string } {
  const tE = einsteinTimeDays(inputs);
  if (tE === null) return { missing: `${NEEDS_EINSTEIN_TIME} and ${purpose}.` };
  const u0 = inputs.event.impactParameterThetaE;
  if (u0 === null) return { missing: `${NEEDS_IMPACT} to ${purpose}.` };
  const width = peakHalfWidthDays(tE, u0, inputs.event.sourceRadiusThetaE);
  return { tEff: width.days, words: `t_eff = ${daysWords(width.days)} (${widthWords[width.term]})` };
}

function peakVisitsAnswer(inputs: ScienceCaseInputs): CaseAnswer {
  const question: Question = {
    id: "peak-visits",
    question: "Visits over the peak (|t − t0| < t_eff)",
    source: "Our rule (five points give the peak's shape, two its height; a cycle covering under a tenth of t_eff sees too little of it); t_eff = u0·t_E: common practice",
  };
  const width = peakWidth(inputs, "find the width of the peak");
  if ("missing" in width) return missingInput(question, width.missing);
  const t0 = inputs.event.peakJdUtc;
  if (t0 === null) return missingInput(question, `${NEEDS_PEAK_DATE} to count the visits around the peak.`);
  const read = readSchedule(question, inputs);
  if ("answer" in read) return read.answer;
  const count = visitsBetween(read.schedule, t0 - width.tEff, t0 + width.tEff);
  const byCount = gradeAtLeast(count, PEAK_VISITS_RULE);
  const coveredDays = daysInCycleAround(read.schedule, t0, width.tEff);
  const byCoverage = coverageVerdict(coveredDays, width.tEff);
  const meaning: Record<KnownVerdict, string> = {
    feasible: "enough to trace the peak's shape (five or more)",
    marginal: "enough for the peak's height, not its shape (two to four)",
    infeasible: "the peak is not sampled (fewer than two)",
  };
  const collected = `The schedule collects ${visitsWords(count)} within the peak, |t − t0| < ${width.words}`;
  const covered = `the cycle covers only ${daysWords(coveredDays)} of the peak's 2 t_eff`;
  const sentence =
    byCoverage === "feasible"
      ? `${collected}: ${meaning[byCount]}.`
      : byCoverage === "infeasible"
        ? `${collected}, but ${covered}, under a tenth of t_eff: the visits see too little of the peak to trace it.`
        : `${collected}: ${meaning[byCount]}; ${covered}, so part of the peak is missed.`;
  return { ...question, verdict: worseVerdict(byCount, byCoverage), figure: `${visitsWords(count)} within ±${daysWords(width.tEff)} of t0`, sentence };
}

function peakWindowAnswer(inputs: ScienceCaseInputs): CaseAnswer {
  const question: Question = {
    id: "peak-window",
    question: "Peak in usable time",
    source: "Our rule (within t_eff/4 of t0 the magnification is within 3 % of its peak)",
  };
  const t0 = inputs.event.peakJdUtc;
  if (t0 === null) return missingInput(question, `${NEEDS_PEAK_DATE} to see whether the peak falls in usable time.`);
  const read = readSchedule(question, inputs);
  if ("answer" in read) return read.answer;
  const { schedule } = read;
  const peak = `The peak (t0 = ${dateWords(t0)})`;
  const distance = daysToUsableTime(schedule, t0);
  if (distance === 0) return { ...question, verdict: "feasible", figure: "t0 in a usable window", sentence: `${peak} falls in a usable window.` };
  const gap = gapAt(schedule, t0);
  const where = !isInCycle(schedule, t0)
    ? `outside the cycle (${dateWords(schedule.cycle.startJdUtc)} to ${dateWords(schedule.cycle.endJdUtc)})`
    : !isInSeason(schedule, t0)
      ? SEASON_GAP_WORDS
      : gap === null
        ? "outside the usable windows"
        : gapReasonWords(gap.reason);
  const width = peakWidth(inputs, "judge how far the peak lies from usable time");
  if ("missing" in width) return missingInput(question, `${peak} falls ${where}. ${width.missing}`);
  const nearest = distance ?? Infinity;
  const verdict = peakReachVerdict(nearest, width.tEff);
  const consequence: Record<KnownVerdict, string> = {
    feasible: `within a quarter of the peak's half-width ${width.words}, where the magnification is within 3 % of its peak: the peak is observed`,
    marginal: `within the peak's half-width ${width.words}: its wings are observed, its top is not`,
    infeasible: `beyond the peak's half-width ${width.words}: the peak is not observed`,
  };
  return {
    ...question,
    verdict,
    figure: `nearest usable time ${daysWords(nearest)} from t0 (t_eff = ${daysWords(width.tEff)})`,
    sentence: `${peak} falls ${where}; the nearest usable time is ${daysWords(nearest)} away, ${consequence[verdict]}.`,
  };
}

function eventDurationAnswer(inputs: ScienceCaseInputs): CaseAnswer {
  const question: Question = {
    id: "event-duration",
    question: "Event duration against the campaign",
    source: "Common practice (the event is t0 ± t_E); our rule below that (t_E poorly constrained; under t_E/10 not measured)",
  };
  const tE = einsteinTimeDays(inputs);
  if (tE === null) return missingInput(question, `${NEEDS_EINSTEIN_TIME} and compare the event's duration with the campaign.`);
  const campaignDays = inputs.campaign.lengthDays ?? (inputs.schedule === null ? null : cycleDays(inputs.schedule));
  if (campaignDays === null) return missingInput(question, "Set the campaign length or the cycle dates to compare the event's duration with them.");
  const verdict = coverageVerdict(campaignDays, tE);
  const span = inputs.campaign.lengthDays === null ? `the ${daysWords(campaignDays)} cycle` : `the ${daysWords(campaignDays)} campaign`;
  const lasts = `The event lasts 2 t_E = ${daysWords(2 * tE)}`;
  const sentence =
    verdict === "feasible"
      ? `${lasts}, within ${span}: the rise, the peak and the fall can all be observed.`
      : verdict === "infeasible"
        ? `${lasts}; ${span} covers under a tenth of t_E = ${daysWords(tE)}, so the brightening is too slow to be measured as an event.`
        : campaignDays >= tE
          ? `${lasts}, longer than ${span}: part of the wings and the baseline fall outside it, so t_E is less well constrained.`
          : `${lasts}; ${span} covers less than t_E = ${daysWords(tE)}: the peak can be seen, but neither the wings nor the baseline, so only u0·t_E is measured well.`;
  return { ...question, verdict, figure: `2 t_E = ${daysWords(2 * tE)} against ${daysWords(campaignDays)}`, sentence };
}
