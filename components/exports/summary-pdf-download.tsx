"use client";

import { useState } from "react";
import { useDownload } from "./use-download";

/** Night charts one summary may carry (the server's limit too). */
const MAX_NIGHT_CHARTS = 6;

/**
 * The technical summary PDF with the figures the PI chooses: the season chart of every target and
 * the night charts of up to six chosen targets on one night.
 */
export function SummaryPdfDownload({ proposalId, targets, initialNightIso }: { proposalId: string; targets: { id: string; name: string }[]; initialNightIso: string }) {
  const [withSeason, setWithSeason] = useState(true);
  const [nightTargetIds, setNightTargetIds] = useState<string[]>([]);
  const [night, setNight] = useState(initialNightIso);
  const { download, error, isBusy } = useDownload();

  const figures = [...(withSeason ? ["season"] : []), ...(nightTargetIds.length > 0 ? ["night"] : [])];
  const query = new URLSearchParams({ figures: figures.join(",") });
  if (nightTargetIds.length > 0) {
    query.set("nightTargets", nightTargetIds.join(","));
    query.set("night", night);
  }

  return (
    <fieldset className="space-y-2 rounded-md border border-void-edge p-3 text-sm" aria-label="Technical summary PDF">
      <legend className="px-1 font-semibold text-dusk">Technical summary (PDF): the target table and</legend>
      <label className="flex items-center gap-2">
        <input type="checkbox" checked={withSeason} onChange={(event) => setWithSeason(event.target.checked)} />
        the season chart of every target
      </label>
      <div className="flex flex-wrap items-end gap-3">
        <label className="flex flex-col gap-1">
          night charts of (up to {MAX_NIGHT_CHARTS})
          <select
            multiple
            aria-label="Targets for night charts"
            value={nightTargetIds}
            onChange={(event) => setNightTargetIds([...event.target.selectedOptions].map((o) => o.value).slice(0, MAX_NIGHT_CHARTS))}
            className="h-24 min-w-56 rounded border border-void-edge bg-void px-2 py-1 text-dusk"
          >
            {targets.map((target) => (
              <option key={target.id} value={target.id}>
                {target.name}
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col gap-1">
          on the night of
          <input type="date" aria-label="Night of the night charts" value={night} onChange={(event) => setNight(event.target.value)} className="rounded border border-void-edge bg-void px-2 py-1 text-dusk" />
        </label>
        <button
          type="button"
          disabled={isBusy}
          onClick={() => download(`/api/proposals/${proposalId}/exports/summary?${query}`, "technical-summary.pdf")}
          className="rounded-md bg-ember px-3 py-1.5 font-semibold text-void disabled:opacity-50"
        >
          {isBusy ? "Preparing the PDF…" : "Download the technical summary (PDF)"}
        </button>
      </div>
      {error ? (
        <p role="alert" className="text-alarm">
          {error}
        </p>
      ) : null}
    </fieldset>
  );
}
