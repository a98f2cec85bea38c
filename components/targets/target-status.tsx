"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { allowedNextStatuses, statusLabels, type TargetStatus } from "@/lib/workspace/status";
import { apiFetch } from "@/components/shared/api-client";
import { FormError } from "@/components/shared/field";

/**
 * Moves a target along its status path. Optimistic: the new status shows at once and returns to the
 * old one if the server refuses.
 */
export function TargetStatusControl({ targetUrl, status }: { targetUrl: string; status: TargetStatus }) {
  const router = useRouter();
  const [shown, setShown] = useState(status);
  const [error, setError] = useState<string | null>(null);
  const options = [shown, ...allowedNextStatuses(shown)];
  return (
    <div className="space-y-1">
      <label className="flex items-center gap-2 text-sm">
        Status
        <select
          value={shown}
          onChange={async (event) => {
            const next = event.target.value as TargetStatus;
            const previous = shown;
            setShown(next);
            setError(null);
            try {
              await apiFetch(targetUrl, { method: "PATCH", body: { status: next } });
              router.refresh();
            } catch (failure) {
              setShown(previous);
              setError(failure instanceof Error ? failure.message : "The status could not be changed.");
            }
          }}
          className="rounded border border-void-edge bg-void px-2 py-1"
        >
          {options.map((s) => (
            <option key={s} value={s}>
              {statusLabels[s]}
            </option>
          ))}
        </select>
      </label>
      <FormError message={error} />
    </div>
  );
}
