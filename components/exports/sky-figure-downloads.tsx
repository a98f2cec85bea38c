"use client";

import { useId, useState } from "react";
import { FigureDownloads } from "./figure-downloads";

/** The night chart of a target on a chosen night, exported with the proposal's site and limits. */
export function NightFigureDownloads({ proposalId, targetId, initialDateIso }: { proposalId: string; targetId: string; initialDateIso: string }) {
  const id = useId();
  const [date, setDate] = useState(initialDateIso);
  return (
    <section aria-label="Night chart export" className="space-y-1 text-sm">
      <div className="flex items-center gap-2">
        <label htmlFor={id} className="text-dusk-dim">Night chart for the night of</label>
        <input id={id} type="date" value={date} onChange={(e) => setDate(e.target.value)} className="rounded border border-void-edge bg-void px-2 py-0.5 text-dusk" />
      </div>
      <FigureDownloads path={`/api/proposals/${proposalId}/exports/figures/night`} query={{ targetId, date }} figureName="night chart" />
    </section>
  );
}

/** The season chart of every target of the proposal (its cycle, or 183 nights from today). */
export function SeasonFigureDownloads({ proposalId }: { proposalId: string }) {
  return (
    <section aria-label="Season chart export" className="text-sm">
      <p className="text-dusk-dim">Season chart of all targets over the proposal&apos;s cycle:</p>
      <FigureDownloads path={`/api/proposals/${proposalId}/exports/figures/season`} figureName="season chart" />
    </section>
  );
}

/** The sky brightness through one target's night in its band, exported with the proposal's site and photometry settings. */
export function NightSkyFigureDownloads({ proposalId, targetId, nightIso }: { proposalId: string; targetId: string; nightIso: string }) {
  return (
    <section aria-label="Sky brightness figure export" className="text-sm">
      <FigureDownloads path={`/api/proposals/${proposalId}/exports/figures/night-sky`} query={{ targetId, date: nightIso }} figureName="sky brightness figure" />
    </section>
  );
}
