/**
 * Relativistic orbit: a star (or pulsar) orbiting the compact lens, observed around its periapsis
 * passages, where the orbit's relativistic precession and the gravitational redshift are measured (as
 * for S2 about the Galactic-centre black hole: GRAVITY Collaboration 2018, 2020). Questions: the next
 * periapsis after the cycle's start against the site's observing seasons, the visits within ±10 % of
 * the period around it, the apoapsis shift per orbit against the astrometric precision with those
 * visits, and the redshift at periapsis against the spectroscopic precision. The orbit itself is
 * relativistic-orbit.ts.
 */

import { citationText } from "@/lib/citations/cite";
import { MICROARCSECOND_RAD, MILLIARCSECOND_RAD } from "@/lib/physics/constants";
import {
  gradeAtLeast,
  PERIAPSIS_EPOCHS_RULE,
  periapsisSeasonVerdict,
  PRECESSION_SIGNAL_RULE,
  REDSHIFT_SIGNAL_RULE,
  type KnownVerdict,
} from "./feasibility-rules";
import { periapsisPassage, relativisticOrbitOf, type RelativisticOrbit, type RelativisticOrbitOutcome } from "./relativistic-orbit";
import { missingInput, readSchedule, type Question } from "./science-case-answer";
import { daysInCycleAround, daysToUsableTime, isInCycle, isInSeason, visitsBetween } from "./science-case-schedule";
import type { CaseAnswer, ScienceCaseInputs } from "./science-case-questions";
import { angleWords, dateWords, dayWords, daysWords, numberWords, rotationWords, SEASON_GAP_WORDS, speedWords, visitsWords } from "./science-case-words";

const NEEDS_PERIAPSIS_DATE = "Set the time of one periapsis passage of the star";

export function relativisticOrbitAnswers(inputs: ScienceCaseInputs): CaseAnswer[] {
  const outcome = relativisticOrbitOf(inputs.orbit);
  return [seasonAnswer(inputs, outcome), epochsAnswer(inputs, outcome), precessionAnswer(inputs, outcome), redshiftAnswer(inputs, outcome)];
}

/** The periapsis a campaign in the cycle aims at, and its window ±10 % of the period. */
interface Passage {
  orbit: RelativisticOrbit;
  jdUtc: number;
  windowHalfDays: number;
}

/** The next periapsis after the cycle's start, or the answer naming what is missing (the orbit, its periapsis time, the schedule). */
function nextPassage(question: Question, inputs: ScienceCaseInputs, outcome: RelativisticOrbitOutcome, purpose: string): { passage: Passage; schedule: NonNullable<ScienceCaseInputs["schedule"]> } | { answer: CaseAnswer } {
  if ("missing" in outcome) return { answer: missingInput(question, outcome.missing) };
  const t0 = inputs.orbit.periapsisJdUtc;
  if (t0 === null) return { answer: missingInput(question, `${NEEDS_PERIAPSIS_DATE} to ${purpose}.`) };
  if (!Number.isFinite(t0)) return { answer: missingInput(question, "The time of periapsis must be a date.") };
  const read = readSchedule(question, inputs);
  if ("answer" in read) return read;
  const { orbit } = outcome;
  return {
    passage: { orbit, ...periapsisPassage(orbit, t0, read.schedule.cycle.startJdUtc) },
    schedule: read.schedule,
  };
}

function seasonAnswer(inputs: ScienceCaseInputs, outcome: RelativisticOrbitOutcome): CaseAnswer {
  const question: Question = {
    id: "periapsis-season",
    question: "Next periapsis in the observing season",
    source: "Our rule (the passage in an observing season is observed; usable time within ±10 % of the period sees its approach or recession)",
  };
  const found = nextPassage(question, inputs, outcome, "date its next periapsis");
  if ("answer" in found) return found.answer;
  const { passage, schedule } = found;
  const inSeason = isInSeason(schedule, passage.jdUtc);
  const distance = daysToUsableTime(schedule, passage.jdUtc);
  const verdict = periapsisSeasonVerdict(inSeason, distance, passage.windowHalfDays);
  const lead = `The next periapsis after the cycle's start is on ${dateWords(passage.jdUtc)} (period ${daysWords(passage.orbit.periodDays)})`;
  const window = `±10 % of the period (${daysWords(passage.windowHalfDays)})`;
  if (inSeason) {
    return { ...question, verdict, figure: `${dayWords(passage.jdUtc)}, in season`, sentence: `${lead}, within the target's observing season at this site: the passage itself can be observed.` };
  }
  const where = isInCycle(schedule, passage.jdUtc) ? ` and falls ${SEASON_GAP_WORDS}` : `, after the cycle ends (${dayWords(schedule.cycle.endJdUtc)})`;
  const nearest = distance === null ? "" : `; the nearest usable time is ${daysWords(distance)} away`;
  const consequence: Record<KnownVerdict, string> = {
    feasible: "",
    marginal: `, within ${window}: the approach to or the recession from periapsis is observed, not the passage`,
    infeasible: `, beyond ${window}: the passage is not observed in this cycle`,
  };
  const figure = distance === null ? `${dayWords(passage.jdUtc)}, no usable time` : `${dayWords(passage.jdUtc)}, ${daysWords(distance)} from usable time`;
  return { ...question, verdict, figure, sentence: `${lead}${where}${nearest}${consequence[verdict]}.` };
}

/** Visits within the passage's window, and the days of the window inside the cycle. */
function windowVisits(passage: Passage, schedule: NonNullable<ScienceCaseInputs["schedule"]>): { count: number; coveredDays: number } {
  return {
    count: visitsBetween(schedule, passage.jdUtc - passage.windowHalfDays, passage.jdUtc + passage.windowHalfDays),
    coveredDays: daysInCycleAround(schedule, passage.jdUtc, passage.windowHalfDays),
  };
}

function epochsAnswer(inputs: ScienceCaseInputs, outcome: RelativisticOrbitOutcome): CaseAnswer {
  const question: Question = {
    id: "periapsis-epochs",
    question: "Visits around periapsis (±10 % of the period)",
    source: "Our rule (ten visits within ±10 % of the period trace the passage; three give it before, at and after periapsis)",
  };
  const found = nextPassage(question, inputs, outcome, "count the visits around its next periapsis");
  if ("answer" in found) return found.answer;
  const { passage, schedule } = found;
  const { count, coveredDays } = windowVisits(passage, schedule);
  const verdict = gradeAtLeast(count, PERIAPSIS_EPOCHS_RULE);
  const meaning: Record<KnownVerdict, string> = {
    feasible: "enough to trace the passage (ten or more)",
    marginal: "the passage is sampled, not traced (three to nine)",
    infeasible: "too few to sample the passage (under three)",
  };
  const span = `${dateWords(passage.jdUtc - passage.windowHalfDays)} to ${dateWords(passage.jdUtc + passage.windowHalfDays)}`;
  const partial = coveredDays < 2 * passage.windowHalfDays ? ` The cycle covers only ${daysWords(coveredDays)} of the ${daysWords(2 * passage.windowHalfDays)} window.` : "";
  return {
    ...question,
    verdict,
    figure: `${visitsWords(count)} within ±${daysWords(passage.windowHalfDays)} of periapsis`,
    sentence: `The schedule collects ${visitsWords(count)} within ±10 % of the period around the periapsis of ${dayWords(passage.jdUtc)} (${span}): ${meaning[verdict]}.${partial}`,
  };
}

function precessionAnswer(inputs: ScienceCaseInputs, outcome: RelativisticOrbitOutcome): CaseAnswer {
  const question: Question = {
    id: "precession-signal",
    question: "Precession: apoapsis shift per orbit against the astrometric precision",
    source: `Exact Schwarzschild precession: ${citationText("darwin1961")}; first order: ${citationText("einstein1915")}; measured for S2: ${citationText("gravity2020")}; threshold: common practice (5σ a detection, 3σ evidence), the periapsis epochs combined as σ/√N: our rule`,
  };
  if ("missing" in outcome) return missingInput(question, outcome.missing);
  const { orbit } = outcome;
  const advance = `The periapsis advances ${rotationWords(orbit.precessionExactRad)} per orbit (exact Schwarzschild; ${rotationWords(orbit.precessionFirstOrderRad)} to first order)`;
  const shiftMicroarcsec = orbit.apoapsisShiftMicroarcsec;
  if (shiftMicroarcsec === null) return missingInput(question, `${advance}. Set the lens distance to turn the apoapsis' shift into an angle on the sky.`, rotationWords(orbit.precessionExactRad));
  const shift = angleWords(shiftMicroarcsec * MICROARCSECOND_RAD);
  const bound = orbit.orientationGiven ? "" : " at most (the orbit seen face-on; set the inclination and the argument of periapsis for its projection)";
  const moves = `${advance}, moving the apoapsis by ${shift} on the sky${bound}`;
  const precisionMas = inputs.instrument.astrometricPrecisionMas;
  if (precisionMas === null) return missingInput(question, `${moves}. Set the astrometric precision per epoch to compare the shift with it.`, shift);
  const precision = angleWords(precisionMas * MILLIARCSECOND_RAD);
  const perEpoch = shiftMicroarcsec / (precisionMas * 1000);
  const against = `${moves}: ${numberWords(perEpoch)} times the precision per epoch of ${precision}`;
  const found = nextPassage(question, inputs, outcome, "count the epochs around its next periapsis that measure the shift");
  if ("answer" in found) {
    const { answer } = found;
    return { ...answer, figure: answer.verdict === "unknown" ? shift : answer.figure, sentence: `${against}. ${answer.sentence}` };
  }
  const { count } = windowVisits(found.passage, found.schedule);
  const significance = perEpoch * Math.sqrt(count);
  const verdict = gradeAtLeast(significance, PRECESSION_SIGNAL_RULE);
  const meaning: Record<KnownVerdict, string> = { feasible: "a detection", marginal: "evidence, short of a detection", infeasible: "not detected" };
  return {
    ...question,
    verdict,
    figure: `${numberWords(significance)}σ: ${shift} over ${visitsWords(count)} at ${precision}`,
    sentence: `${against}; the ${visitsWords(count)} within ±10 % of the period around periapsis measure it at ${numberWords(significance)}σ: ${meaning[verdict]}.`,
  };
}

function redshiftAnswer(inputs: ScienceCaseInputs, outcome: RelativisticOrbitOutcome): CaseAnswer {
  const question: Question = {
    id: "redshift-signal",
    question: "Redshift at periapsis against the spectroscopic precision",
    source: `First-order redshift GM/(c² r) + v²/(2c²): ${citationText("gravity2018")}; threshold: common practice (5σ a detection, 3σ evidence), asked of one epoch at periapsis: our rule`,
  };
  if ("missing" in outcome) return missingInput(question, outcome.missing);
  const { orbit } = outcome;
  const { redshift } = orbit;
  const combined = speedWords(redshift.combinedKmPerS);
  const at = `At periapsis (${numberWords(orbit.periapsisAu)} au, ${numberWords(orbit.periapsisM)} GM/c²) the star moves at ${speedWords(orbit.periapsisSpeedKmPerS)}; its redshift, gravitational ${speedWords(redshift.gravitationalKmPerS)} plus transverse Doppler ${speedWords(redshift.transverseDopplerKmPerS)}, is ${combined} (c·z, first order in (v/c)²)`;
  const precisionKmPerS = inputs.instrument.spectroscopicPrecisionKmPerS;
  if (precisionKmPerS === null) return missingInput(question, `${at}. Set the spectroscopic (radial-velocity) precision per epoch to compare the redshift with it.`, combined);
  const ratio = redshift.combinedKmPerS / precisionKmPerS;
  const verdict = gradeAtLeast(ratio, REDSHIFT_SIGNAL_RULE);
  const meaning: Record<KnownVerdict, string> = {
    feasible: "one epoch at periapsis detects it",
    marginal: "one epoch at periapsis gives evidence of it; several near periapsis combined detect it",
    infeasible: "below 3σ in one epoch: it must be built up from many epochs near periapsis, where the orbit's own radial velocity changes fast",
  };
  return {
    ...question,
    verdict,
    figure: `${combined} = ${numberWords(ratio)} × the precision (${speedWords(precisionKmPerS)})`,
    sentence: `${at}: ${numberWords(ratio)} times the spectroscopic precision of ${speedWords(precisionKmPerS)} per epoch, so ${meaning[verdict]}.`,
  };
}
