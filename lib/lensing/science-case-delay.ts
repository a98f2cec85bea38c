/**
 * Time-delay monitoring: one measures the delay Δt between the images from the same intrinsic
 * variation seen in each. Questions: Δt against the target's observing season at the site, the visits
 * per Δt within the seasons, Δt against the cadence, and the seasons the cycle covers.
 */

import { DAY_S } from "@/lib/physics/constants";
import { DELAY_CADENCE_RULE, DELAY_SEASON_RULE, DELAY_SEASONS_RULE, DELAY_VISITS_RULE, gradeAtLeast, type KnownVerdict } from "./feasibility-rules";
import { missingInput, readSchedule, type Question } from "./science-case-answer";
import { seasonSummary } from "./science-case-schedule";
import type { CaseAnswer, ScienceCaseInputs } from "./science-case-questions";
import { dayWords, daysWords, numberWords, visitsWords } from "./science-case-words";

const SINGLE_IMAGE = "The lens forms a single image for this hypothesis: there is no second image, so no time delay to measure.";

export function timeDelayAnswers(inputs: ScienceCaseInputs): CaseAnswer[] {
  return [seasonAnswer(inputs), visitsAnswer(inputs), cadenceAnswer(inputs), seasonsAnswer(inputs)];
}

function delayDays(inputs: ScienceCaseInputs): number | null {
  const { timeDelayS } = inputs.solution;
  return timeDelayS === null ? null : timeDelayS / DAY_S;
}

function noDelay(question: Question): CaseAnswer {
  return { ...question, verdict: "infeasible", figure: "one image", sentence: SINGLE_IMAGE };
}

function seasonAnswer(inputs: ScienceCaseInputs): CaseAnswer {
  const question: Question = {
    id: "delay-season",
    question: "Delay within the observing season",
    source: "Common practice (the same variation must be seen in both images within one season); 1.5 Δt for a feasible overlap: the product's rule",
  };
  const delay = delayDays(inputs);
  if (delay === null) return noDelay(question);
  const read = readSchedule(question, inputs);
  if ("answer" in read) return read.answer;
  const { longestDays } = seasonSummary(read.schedule);
  const ratio = longestDays / delay;
  const verdict = gradeAtLeast(ratio, DELAY_SEASON_RULE);
  const lead = `The delay Δt = ${daysWords(delay)}`;
  const season = `the target's longest observing season at this site (${daysWords(longestDays)} within the cycle)`;
  const sentence: Record<KnownVerdict, string> = {
    feasible: `${lead} fits ${numberWords(ratio)} times in ${season}: a variation seen in one image is seen again in the other within the season.`,
    marginal: `${lead} fits in ${season}, but only ${daysWords(longestDays - delay)} of each image's light curve overlaps the other's: few variations can be matched.`,
    infeasible: `${lead} is longer than ${season}: a variation seen in one image reaches the other while the target cannot be observed.`,
  };
  return { ...question, verdict, figure: `Δt = ${daysWords(delay)} against a ${daysWords(longestDays)} season`, sentence: sentence[verdict] };
}

function visitsAnswer(inputs: ScienceCaseInputs): CaseAnswer {
  const question: Question = {
    id: "delay-visits",
    question: "Visits per Δt within the seasons",
    source: "Common practice (ten points per timescale trace a variation, three give its shape)",
  };
  const delay = delayDays(inputs);
  if (delay === null) return noDelay(question);
  const read = readSchedule(question, inputs);
  if ("answer" in read) return read.answer;
  const { totalDays, visits } = seasonSummary(read.schedule);
  const perDelay = totalDays > 0 ? (visits * delay) / totalDays : 0;
  const verdict = gradeAtLeast(perDelay, DELAY_VISITS_RULE);
  const meaning: Record<KnownVerdict, string> = {
    feasible: "enough to trace the variations the delay is measured from",
    marginal: "a sparse trace of the variations: the delay is measured coarsely",
    infeasible: "too few to trace a variation within the delay",
  };
  return {
    ...question,
    verdict,
    figure: `${numberWords(perDelay)} visits per Δt (${daysWords(delay)})`,
    sentence: `The schedule collects ${visitsWords(visits)} over ${daysWords(totalDays)} of observing season: ${numberWords(perDelay)} per Δt = ${daysWords(delay)}, ${meaning[verdict]}.`,
  };
}

function cadenceAnswer(inputs: ScienceCaseInputs): CaseAnswer {
  const question: Question = {
    id: "delay-cadence",
    question: "Delay against the cadence",
    source: "Common practice (a delay spanning three visit intervals is measured; one shorter than the spacing of the visits is not)",
  };
  const delay = delayDays(inputs);
  if (delay === null) return noDelay(question);
  const { cadenceHours } = inputs.campaign;
  if (cadenceHours === null) return missingInput(question, `The delay is Δt = ${daysWords(delay)}. Set the cadence to compare the delay with the spacing of the visits.`, `Δt = ${daysWords(delay)}`);
  const cadenceDays = cadenceHours / 24;
  const ratio = delay / cadenceDays;
  const verdict = gradeAtLeast(ratio, DELAY_CADENCE_RULE);
  const meaning: Record<KnownVerdict, string> = {
    feasible: "the delay spans several visit intervals and can be measured",
    marginal: "the delay spans only one or two visit intervals: it is measured coarsely",
    infeasible: "the delay is shorter than the spacing of the visits and is not measured",
  };
  return {
    ...question,
    verdict,
    figure: `Δt = ${numberWords(ratio)} × the cadence (${daysWords(cadenceDays)})`,
    sentence: `The delay Δt = ${daysWords(delay)} is ${numberWords(ratio)} times the ${daysWords(cadenceDays)} cadence: ${meaning[verdict]}.`,
  };
}

function seasonsAnswer(inputs: ScienceCaseInputs): CaseAnswer {
  const question: Question = {
    id: "seasons-covered",
    question: "Observing seasons in the cycle",
    source: "Our rule (one season can give a delay; none cannot)",
  };
  const read = readSchedule(question, inputs);
  if ("answer" in read) return read.answer;
  const { seasons } = read.schedule;
  const count = seasons.length;
  const verdict = gradeAtLeast(count, DELAY_SEASONS_RULE);
  const list = seasons.map((season) => `${dayWords(season.startJdUtc)} to ${dayWords(season.endJdUtc)}`).join("; ");
  const sentence =
    count === 0
      ? "The cycle covers no observing season of the target: no night offers usable time."
      : `The cycle covers ${count} observing ${count === 1 ? "season" : "seasons"} of the target (${list}).`;
  return { ...question, verdict, figure: `${count} ${count === 1 ? "season" : "seasons"}`, sentence };
}
