"use client";

import { useRouter } from "next/navigation";
import useSWR, { useSWRConfig } from "swr";
import { targetRevisionsUrl, type TargetRevisionView } from "@/lib/workspace/fit-revision";
import { changedFields, fitRevisionFieldLabels, fitRevisionValueWords } from "@/lib/workspace/fit-revision-words";
import { numberWords } from "@/lib/lensing/science-case-words";
import { apiFetch, swrFetcher } from "@/components/shared/api-client";
import { FormError, quietButtonClass } from "@/components/shared/field";
import { formatDateTime } from "@/components/shared/format";
import { useFormSubmit } from "@/components/shared/use-form-submit";

interface FitRevisionsProps {
  proposalId: string;
  targetId: string;
  /** Co-I or PI: may undo the latest fit. */
  canEdit: boolean;
}

/** "χ²/dof 1.02 over 412 points in 2 datasets (OGLE I, Site A V); magnitude from OGLE I". */
function summaryWords(summary: NonNullable<TargetRevisionView["summary"]>): string {
  const datasets = `${summary.datasets.length} dataset${summary.datasets.length === 1 ? "" : "s"} (${summary.datasets.join(", ")})`;
  return `χ²/dof ${numberWords(summary.chi2 / summary.dof)} over ${summary.pointCount} points in ${datasets}; source magnitude from ${summary.referenceDataset}`;
}

function RevisionEntry({ revision, canEdit, onUndo, isBusy }: { revision: TargetRevisionView; canEdit: boolean; onUndo: () => void; isBusy: boolean }) {
  const fields = changedFields(revision.before, revision.after);
  const what = revision.kind === "light_curve_fit" ? "Light-curve fit applied" : "Fit undone";
  return (
    <li className="space-y-1 rounded-md border border-void-edge p-3" data-testid="fit-revision">
      <p>
        <span className="font-semibold">{what}</span> by {revision.actorName ?? "a former member"}, {formatDateTime(revision.createdAt)}
        {revision.undoneAt !== null && <span className="text-dusk-dim"> (undone {formatDateTime(revision.undoneAt)})</span>}
      </p>
      {revision.summary !== null && <p className="text-sm text-dusk-dim">{summaryWords(revision.summary)}</p>}
      {fields.length === 0 ? (
        <p className="text-sm text-dusk-dim">No value changed.</p>
      ) : (
        <dl className="grid grid-cols-[auto_1fr] gap-x-4 text-sm">
          {fields.map((field) => (
            <div key={field} className="contents">
              <dt className="text-dusk-dim">{fitRevisionFieldLabels[field]}</dt>
              <dd>
                {fitRevisionValueWords(field, revision.before[field])} → {fitRevisionValueWords(field, revision.after[field])}
              </dd>
            </div>
          ))}
        </dl>
      )}
      {canEdit && revision.canUndo && (
        <button type="button" className={quietButtonClass} disabled={isBusy} onClick={onUndo}>
          Undo fit
        </button>
      )}
    </li>
  );
}

/**
 * The light-curve fits applied to a target and their undos, newest first: what each changed (before →
 * after), who and when, with "Undo fit" on the latest fit while the target still holds its values.
 * An undo refreshes the page's server data (the verdicts, schedule and budget it shows) and every
 * list of this proposal the page holds, this one included.
 */
export function FitRevisions({ proposalId, targetId, canEdit }: FitRevisionsProps) {
  const url = targetRevisionsUrl(proposalId, targetId);
  const router = useRouter();
  const { mutate } = useSWRConfig();
  const { data, error } = useSWR<{ revisions: TargetRevisionView[] }>(url, swrFetcher);
  const undo = useFormSubmit();
  const revisions = data?.revisions ?? [];

  const undoRevision = (revision: TargetRevisionView) =>
    void undo.run(async () => {
      await apiFetch(`${url}/${revision.id}/undo`, { method: "POST" });
      router.refresh();
      await mutate((key) => typeof key === "string" && key.startsWith(`/api/proposals/${proposalId}/`));
    });

  return (
    <section aria-labelledby="fit-revisions-heading" className="space-y-3">
      <h2 id="fit-revisions-heading" className="text-xl font-semibold">
        Fit revisions
      </h2>
      {error && <FormError message={error.message} />}
      {data !== undefined && revisions.length === 0 && <p className="text-dusk-dim">No light-curve fit has been applied to this target.</p>}
      <ol className="space-y-3" data-testid="fit-revisions">
        {revisions.map((revision) => (
          <RevisionEntry key={revision.id} revision={revision} canEdit={canEdit} isBusy={undo.isBusy} onUndo={() => undoRevision(revision)} />
        ))}
      </ol>
      <FormError message={undo.message} />
    </section>
  );
}
