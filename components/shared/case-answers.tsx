import { verdictClass } from "@/components/shared/format";
import type { CaseAnswer } from "@/lib/lensing/science-case-questions";
import { verdictWithFigure } from "@/lib/workspace/case-verdict-words";

/**
 * A science case's questions, each with its verdict, the number behind it, the answer as a sentence
 * and the rule's source. The verdict names its question: no badge stands for a column header.
 */
export function CaseAnswers({ answers }: { answers: CaseAnswer[] }) {
  return (
    <ul className="space-y-3 text-sm" data-testid="case-answers">
      {answers.map((answer) => (
        <li key={answer.id} data-testid={`case-answer-${answer.id}`} data-verdict={answer.verdict}>
          <p>
            <span className="text-dusk-dim">{answer.question}: </span>
            <span className={`font-semibold tabular-nums ${verdictClass[answer.verdict]}`}>{verdictWithFigure(answer)}</span>
          </p>
          <p data-testid="case-answer-sentence">{answer.sentence}</p>
          <p className="text-xs text-dusk-dim">Rule: {answer.source}</p>
        </li>
      ))}
    </ul>
  );
}
