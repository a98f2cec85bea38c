import { CaseAnswers } from "@/components/shared/case-answers";
import { scienceCaseLabels } from "@/lib/lensing/science-cases";
import type { TargetCaseReport } from "@/lib/workspace/derived";

/**
 * The sketch's science case and its answered questions, from the same grading as a stored target
 * (`lib/bench/case-report.ts`); the inferred case states why it was inferred.
 */
export function VerdictList({ report, cosmologyNote }: { report: TargetCaseReport | null; cosmologyNote?: string }) {
  return (
    <section aria-label="Feasibility" className="space-y-2 rounded-md border border-void-edge bg-void-raised p-4">
      <h2 className="text-base font-semibold text-dusk">Feasibility</h2>
      {report === null ? (
        <p className="text-sm text-dusk-dim">This sketch cannot be graded as a target: bring its values inside what a target accepts.</p>
      ) : (
        <>
          <p className="text-sm" data-testid="bench-case" data-case={report.scienceCase.caseId}>
            <span className="font-semibold">Science case: {scienceCaseLabels[report.scienceCase.caseId]}</span>{" "}
            <span className="text-dusk-dim">{report.scienceCase.isChosen ? "(chosen in the sketch)" : "(inferred)"}</span>
          </p>
          {report.scienceCase.reason !== null ? (
            <p className="text-sm text-dusk-dim" data-testid="bench-case-reason">
              {report.scienceCase.reason}
            </p>
          ) : null}
          {cosmologyNote !== undefined ? (
            <p className="text-sm text-ember" data-testid="bench-case-cosmology">
              {cosmologyNote}
            </p>
          ) : null}
          <CaseAnswers answers={report.answers} />
        </>
      )}
    </section>
  );
}
