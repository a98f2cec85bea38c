/**
 * The technical summary's science-case part, per target: the case, then each question answered as a
 * sentence with its verdict, its number (the visits the schedule collects, for the sampling questions)
 * and the rule's source. Read from the stored answers, so the page and the PDF say the same.
 */
import { scienceCaseLabels } from "@/lib/lensing/science-cases";
import type { Verdict } from "@/lib/lensing/feasibility-rules";
import type { TargetView } from "@/lib/workspace/target-view";
import { verdictWithFigure } from "@/lib/workspace/case-verdict-words";

export interface SummaryAnswer {
  question: string;
  verdict: Verdict;
  /** "Feasible (6 visits)": the verdict with the number behind it, when there is one. */
  verdictText: string;
  sentence: string;
  source: string;
}

export interface SummaryCase {
  targetId: string;
  targetName: string;
  /** "Photometric microlensing event (inferred from the model and numbers)". */
  caseText: string;
  answers: SummaryAnswer[];
}

/** The case part of one target; a target whose hypothesis gives no solution says so in `caseText`. */
export function summaryCaseOf(row: TargetView): SummaryCase {
  const caseText =
    row.answeredCase === null
      ? "No science case: the stored hypothesis gives no lens solution."
      : `${scienceCaseLabels[row.answeredCase]} (${row.scienceCase === null ? "inferred from the model and numbers" : "chosen by the team"})`;
  return {
    targetId: row.id,
    targetName: row.name,
    caseText,
    answers: row.caseAnswers.map((answer) => ({
      question: answer.question,
      verdict: answer.verdict,
      verdictText: verdictWithFigure(answer),
      sentence: answer.sentence,
      source: answer.source,
    })),
  };
}
