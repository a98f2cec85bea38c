"use client";

import { useState } from "react";

/** Copies one results row as plain text ("Einstein radius θ_E = 0.7133 mas") for notes and proposals. */
export function CopyRowButton({ text, label }: { text: string; label: string }) {
  const [isCopied, setIsCopied] = useState(false);
  return (
    <button
      type="button"
      aria-label={`Copy ${label} as text`}
      title={text}
      onClick={() => {
        void navigator.clipboard.writeText(text).then(() => {
          setIsCopied(true);
          window.setTimeout(() => setIsCopied(false), 1500);
        });
      }}
      className="rounded border border-void-edge px-2 py-0.5 text-xs text-dusk-dim hover:text-dusk"
    >
      {isCopied ? "Copied" : "Copy"}
    </button>
  );
}
