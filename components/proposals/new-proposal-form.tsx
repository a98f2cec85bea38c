"use client";

import { useRouter } from "next/navigation";
import { apiFetch } from "@/components/shared/api-client";
import { FormError, buttonClass } from "@/components/shared/field";
import { ProposalFields, proposalBody } from "@/components/proposals/proposal-fields";
import { formValues, useFormSubmit } from "@/components/shared/use-form-submit";

/** Starts a proposal; its author becomes the PI. Every field can be changed later in the settings. */
export function NewProposalForm() {
  const router = useRouter();
  const { fields, message, isBusy, run } = useFormSubmit();
  return (
    <form
      aria-label="New proposal"
      className="space-y-4 rounded-lg border border-void-edge bg-void-raised p-5"
      onSubmit={(event) => {
        event.preventDefault();
        const body = proposalBody(formValues(event.currentTarget));
        void run(async () => {
          const { proposal } = await apiFetch<{ proposal: { id: string } }>("/api/proposals", { method: "POST", body });
          router.push(`/proposals/${proposal.id}`);
        });
      }}
    >
      <h2 className="text-xl font-semibold">Start a proposal</h2>
      <ProposalFields fields={fields} />
      <FormError message={message} />
      <button type="submit" className={buttonClass} disabled={isBusy}>
        Create proposal
      </button>
    </form>
  );
}
