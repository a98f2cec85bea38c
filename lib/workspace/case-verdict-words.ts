/**
 * A science case's verdicts in words, for the places that show them in one line (the target table,
 * the table exports): each verdict names its question, so no badge has to be matched to a header.
 */
import type { Verdict } from "@/lib/lensing/feasibility-rules";
import type { CaseAnswer } from "@/lib/lensing/science-case-questions";

/** How a verdict reads to people. */
export const verdictLabels: Record<Verdict, string> = {
  feasible: "Feasible",
  marginal: "Marginal",
  infeasible: "Not feasible",
  unknown: "Unknown",
};

/** The verdicts that hold a case back, worst first: the ones whose questions a one-line summary names. */
const namedVerdicts = ["infeasible", "marginal", "unknown"] as const satisfies readonly Verdict[];

/**
 * The case's verdict with the questions behind it, worst first: "Not feasible: Peak in an observable
 * window; Marginal: Visits within t0 ± t_E". Only the verdict when every answer is feasible, or when
 * there are no answers (a hypothesis that cannot be solved).
 */
export function caseVerdictLine(verdict: Verdict, answers: readonly CaseAnswer[]): string {
  const groups = namedVerdicts.flatMap((v) => {
    const questions = answers.filter((answer) => answer.verdict === v).map((answer) => answer.question);
    return questions.length === 0 ? [] : [`${verdictLabels[v]}: ${questions.join(", ")}`];
  });
  return groups.length === 0 ? verdictLabels[verdict] : groups.join("; ");
}

/** An answer's verdict with the number behind it, "Marginal (6 visits)"; the verdict alone when there is no number. */
export function verdictWithFigure(answer: Pick<CaseAnswer, "verdict" | "figure">): string {
  return answer.figure === "—" ? verdictLabels[answer.verdict] : `${verdictLabels[answer.verdict]} (${answer.figure})`;
}

/** One answer in a line: "Peak magnification: Feasible (A = 10.04)". */
export function answerLine(answer: CaseAnswer): string {
  return `${answer.question}: ${verdictWithFigure(answer)}`;
}

/** Every answer of a case in one text, "; " between them (a table cell, an export's text column). */
export function answersLine(answers: readonly CaseAnswer[]): string {
  return answers.map(answerLine).join("; ");
}
