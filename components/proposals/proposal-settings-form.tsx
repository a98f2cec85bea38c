"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import type { ProposalInput } from "@/lib/workspace/proposal-schema";
import { apiFetch } from "@/components/shared/api-client";
import { FormError, buttonClass } from "@/components/shared/field";
import { PhotometryFields } from "@/components/shared/photometry-fields";
import { photometryBody } from "@/components/shared/photometry-body";
import { ProposalFields, proposalBody } from "@/components/proposals/proposal-fields";
import { formValues, useFormSubmit } from "@/components/shared/use-form-submit";

/**
 * The PI's edit form for a proposal: details, cycle dates, site, instrument defaults and the photon
 * budget's photometry (sent complete, like the instrument). Saving new instrument scales or photometry
 * re-grades every target on the server, in the same transaction.
 */
export function ProposalSettingsForm({ proposalId, initial }: { proposalId: string; initial: ProposalInput }) {
  const router = useRouter();
  const { fields, message, isBusy, run } = useFormSubmit();
  const [savedAt, setSavedAt] = useState<string | null>(null);
  return (
    <form
      aria-label="Proposal settings"
      className="space-y-4 rounded-lg border border-void-edge bg-void-raised p-5"
      onSubmit={(event) => {
        event.preventDefault();
        const values = formValues(event.currentTarget);
        const body = { ...proposalBody(values), photometry: photometryBody(values) };
        setSavedAt(null);
        void run(async () => {
          await apiFetch(`/api/proposals/${proposalId}`, { method: "PATCH", body });
          setSavedAt(new Date().toISOString().slice(11, 19));
          router.refresh();
        });
      }}
    >
      <ProposalFields fields={fields} initial={initial} />
      <PhotometryFields fields={fields} initial={initial.photometry} />
      <FormError message={message} />
      <div className="flex items-center gap-4">
        <button type="submit" className={buttonClass} disabled={isBusy}>
          Save settings
        </button>
        {savedAt && (
          <p role="status" className="text-sm text-glint">
            Saved at {savedAt} UTC; targets re-graded.
          </p>
        )}
      </div>
    </form>
  );
}
