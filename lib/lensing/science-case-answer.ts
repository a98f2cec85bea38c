/**
 * The shared steps of answering a question: an answer that names a missing input, and the schedule a
 * sampling question needs (or the answer that says why there is none to read).
 */

import { emptyScheduleMessage } from "@/lib/schedule/empty-reason";
import type { ObservingSchedule } from "@/lib/schedule/types";
import type { CaseAnswer, ScienceCaseInputs } from "./science-case-questions";
import { NO_SCHEDULE_SENTENCE } from "./science-case-words";

/** What a question is, before it is answered. */
export type Question = Pick<CaseAnswer, "id" | "question" | "source">;

/** The answer when an input is missing: "unknown", the sentence naming the input. */
export function missingInput(question: Question, sentence: string, figure = "—"): CaseAnswer {
  return { ...question, verdict: "unknown", figure, sentence };
}

/**
 * The schedule a sampling question counts visits in, or its answer when there is none: "unknown" when
 * the proposal has no site or cycle, "infeasible" with the reason when no night offers a visit.
 */
export function readSchedule(question: Question, inputs: ScienceCaseInputs): { schedule: ObservingSchedule } | { answer: CaseAnswer } {
  const { schedule } = inputs;
  if (schedule === null) return { answer: missingInput(question, NO_SCHEDULE_SENTENCE) };
  if (schedule.emptyReason !== null) {
    return { answer: { ...question, verdict: "infeasible", figure: "0 visits", sentence: emptyScheduleMessage(schedule.emptyReason) } };
  }
  return { schedule };
}
