"use client";

import { useRouter } from "next/navigation";
import { apiFetch } from "@/components/shared/api-client";
import { FormError, buttonClass } from "@/components/shared/field";
import { useFormSubmit } from "@/components/shared/use-form-submit";

export function AcceptInvitation({ token }: { token: string }) {
  const router = useRouter();
  const { message, isBusy, run } = useFormSubmit();
  return (
    <div className="space-y-3">
      <button
        type="button"
        className={buttonClass}
        disabled={isBusy}
        onClick={() =>
          void run(async () => {
            const { proposalId } = await apiFetch<{ proposalId: string }>("/api/invitations/accept", { method: "POST", body: { token } });
            router.push(`/proposals/${proposalId}`);
          })
        }
      >
        Accept the invitation
      </button>
      <FormError message={message} />
    </div>
  );
}
