/**
 * The depth question every case with a photon budget asks: is what the case measures bright enough at
 * the worst visit it needs, under that night's sky? Graded by `DEPTH_RULE`; the numbers come from the
 * target's photon budget (photon-budget.ts).
 */
import { MOONLIGHT_MODEL_MIN_SEPARATION_DEG } from "@/lib/photometry/moon-sky";
import { DEPTH_RULE, gradeAtLeast, worseVerdict } from "./feasibility-rules";
import { measuredLightWords, type PhotonBudgetOutcome, type TargetPhotonBudget } from "./photon-budget";
import { missingInput, type Question } from "./science-case-answer";
import type { CaseAnswer } from "./science-case-questions";
import { dayWords, numberWords, visitsWords } from "./science-case-words";

const QUESTION: Question = {
  id: "depth",
  question: "Depth at the worst visit",
  source:
    "CCD equation: Merline & Howell 1995, Exp. Astron. 6, 163 (Howell, Handbook of CCD Astronomy, 2006, eq. 4.4); moonlit sky: Krisciunas & Schaefer 1991, PASP 103, 1033; thresholds: our rule (the goal at every visit; half of it marginal), saturation common practice",
};

/** "air mass 1.3, Moon 62% lit 35° away" or "air mass 1.3, Moon down". */
function conditionsWords(budget: TargetPhotonBudget, index: number): string {
  const sky = budget.visitSky;
  const litPercent = Math.round(((1 + Math.cos((sky.moonPhaseAngleDeg[index] * Math.PI) / 180)) / 2) * 100);
  const moon = sky.moonZenithDeg[index] > 90 ? "Moon down" : `Moon ${litPercent}% lit ${Math.round(sky.moonSeparationDeg[index])}° away`;
  return `${dayWords(budget.visitsJdUtc[index])}, air mass ${numberWords(sky.airmass[index])}, ${moon}`;
}

const seconds = (value: number) => `${numberWords(value)} s`;

/** The depth answer, or null for a case without a photon budget (horizon-scale imaging). */
export function depthAnswer(outcome: PhotonBudgetOutcome): CaseAnswer | null {
  if ("notApplicable" in outcome) return null;
  if ("missing" in outcome) return missingInput(QUESTION, outcome.missing);
  const { budget } = outcome;
  const count = budget.visitsJdUtc.length;
  if (count === 0) {
    return missingInput(QUESTION, "No planned visit falls where the case needs one, so there is no visit to grade: see the visit questions above.");
  }
  const worst = budget.worstVisit;
  const reached = budget.series.signalToNoise[worst];
  const needed = budget.series.exposureForGoalS[worst];
  const goal = budget.signalToNoiseGoal;
  let verdict = gradeAtLeast(reached / goal, DEPTH_RULE);
  if (budget.saturatedVisits > 0) verdict = worseVerdict(verdict, "marginal");
  const what = measuredLightWords[budget.measured];
  const where = conditionsWords(budget, worst);
  const reach =
    needed <= budget.visitExposureS
      ? `reaches S/N ${numberWords(goal)} in ${seconds(needed)} of the ${seconds(budget.visitExposureS)} a visit leaves after its overhead`
      : `reaches only S/N ${numberWords(reached)} in the ${seconds(budget.visitExposureS)} a visit leaves (goal ${numberWords(goal)}; it would need ${seconds(needed)}); ${budget.shortVisits} of ${visitsWords(count)} fall short`;
  const saturation = budget.saturatedVisits > 0 ? ` The brightest pixel saturates on ${visitsWords(budget.saturatedVisits)}: split those exposures.` : "";
  const nearMoon =
    budget.nearMoonVisits > 0
      ? ` ${visitsWords(budget.nearMoonVisits)} ${budget.nearMoonVisits === 1 ? "lies" : "lie"} within ${MOONLIGHT_MODEL_MIN_SEPARATION_DEG}° of the Moon, where the moonlight model underestimates the sky (Krisciunas & Schaefer 1991 fit separations above about ${MOONLIGHT_MODEL_MIN_SEPARATION_DEG}°).`
      : "";
  const centroid = budget.worstCentroidPrecisionMas === null ? "" : ` The centroid is then measured to ${numberWords(budget.worstCentroidPrecisionMas)} mas (photon-limited).`;
  return {
    ...QUESTION,
    verdict,
    figure: `S/N ${numberWords(reached)} at the worst visit (goal ${numberWords(goal)})`,
    sentence: `At the worst of the ${visitsWords(count)} the case needs (${where}) ${what} in ${budget.bandLabel} ${reach}. Hours requested: ${numberWords(budget.timeRequestHours)} h.${saturation}${nearMoon}${centroid}`,
  };
}
