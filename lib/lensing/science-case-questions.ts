/**
 * What the science cases' questions read and answer: their inputs in one place and one answered
 * question. Shapes only (no logic): each case's questions (science-case-*.ts) and the registry of
 * cases (science-cases.ts) import them from here.
 */

import type { ObservingSchedule } from "@/lib/schedule/types";
import type { Verdict } from "./feasibility-rules";
import type { PhotonBudgetOutcome } from "./photon-budget";
import type { CampaignSettings, EventTiming, InstrumentSettings, OrbitInputs } from "./science-case-inputs";
import type { LensSolution } from "./solution";

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
