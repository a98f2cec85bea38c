"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { useSWRConfig } from "swr";
import { apiFetch } from "@/components/shared/api-client";
import { FormError, quietButtonClass } from "@/components/shared/field";
import { useFormSubmit } from "@/components/shared/use-form-submit";

interface ConfirmDeleteProps {
  /** The button that starts it, e.g. "Delete target". */
  label: string;
  /** What goes, in a sentence the confirmation shows. */
  consequence: string;
  /** The API resource the DELETE goes to. */
  url: string;
  /** Where the page goes once the record is gone; without it the page stays. */
  afterUrl?: string;
  /** When set, the person types this (the proposal's title) before the button works. */
  typeToConfirm?: string;
  /** Cached API answers under this prefix are dropped (read again when the page stays), so no list shows the record after it is gone. */
  staleKeyPrefix: string;
}

/**
 * A delete that asks first: the button opens a confirmation naming what goes with the record, and only
 * the second button sends the DELETE. The server checks the role again; a refusal is shown here.
 */
export function ConfirmDelete({ label, consequence, url, afterUrl, typeToConfirm, staleKeyPrefix }: ConfirmDeleteProps) {
  const router = useRouter();
  const { mutate } = useSWRConfig();
  const { message, isBusy, run } = useFormSubmit();
  const [isAsking, setAsking] = useState(false);
  const [typed, setTyped] = useState("");
  const isConfirmed = typeToConfirm === undefined || typed.trim() === typeToConfirm.trim();

  if (!isAsking) {
    return (
      <button type="button" className="rounded-md border border-alarm/60 px-3 py-1.5 text-sm text-alarm hover:border-alarm" onClick={() => setAsking(true)}>
        {label}
      </button>
    );
  }
  return (
    <div role="alertdialog" aria-label={label} className="max-w-xl space-y-3 rounded-lg border border-alarm/60 bg-void-raised p-4">
      <p className="text-sm">{consequence} This cannot be undone.</p>
      {typeToConfirm !== undefined && (
        <label className="block text-sm">
          Type <strong>{typeToConfirm}</strong> to confirm
          <input value={typed} onChange={(e) => setTyped(e.target.value)} className="mt-1 w-full rounded-md border border-void-edge bg-void px-3 py-2" />
        </label>
      )}
      <FormError message={message} />
      <div className="flex gap-3">
        <button
          type="button"
          className="rounded-md bg-alarm px-4 py-2 font-semibold text-void disabled:opacity-50"
          disabled={!isConfirmed || isBusy}
          onClick={() =>
            void run(async () => {
              await apiFetch(url, { method: "DELETE" });
              await mutate((key) => typeof key === "string" && key.startsWith(staleKeyPrefix), undefined, { revalidate: afterUrl === undefined });
              if (afterUrl === undefined) return;
              router.push(afterUrl);
              router.refresh();
            })
          }
        >
          Delete for good
        </button>
        <button type="button" className={quietButtonClass} onClick={() => setAsking(false)}>
          Keep it
        </button>
      </div>
    </div>
  );
}
