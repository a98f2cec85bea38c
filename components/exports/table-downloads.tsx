"use client";

import { useId, useState } from "react";
import { defaultExportColumns, exportColumns, headerOf, type ExportColumnKey } from "@/lib/exports/tables/columns";
import { tableFormats, tableWriteOptionsSchema } from "@/lib/exports/tables/formats";
import { latexFits, type LatexFit } from "@/lib/exports/tables/latex";
import { useDownload } from "./use-download";

const formatLabels: Record<(typeof tableFormats)[number], string> = { csv: "CSV", ecsv: "ECSV (CSV with units and provenance)", tex: "LaTeX", votable: "VOTable", json: "JSON" };

const fitLabels: Record<LatexFit, string> = {
  shrink: "One table, scaled to the text width",
  landscape: "One table, turned sideways",
  split: "Split into parts that fit, names repeated",
};
const defaultFit: LatexFit = tableWriteOptionsSchema.parse({}).fit;

/**
 * The target table download: format, columns (inputs and computed quantities) and significant
 * digits for the numeric columns. Viewers may export too.
 */
export function TableDownloads({ proposalId }: { proposalId: string }) {
  const id = useId();
  const [format, setFormat] = useState<(typeof tableFormats)[number]>("csv");
  const [columns, setColumns] = useState<ExportColumnKey[]>(defaultExportColumns);
  const [digits, setDigits] = useState("");
  const [fit, setFit] = useState<LatexFit>(defaultFit);
  const { download, error, isBusy } = useDownload();
  const toggle = (key: ExportColumnKey) =>
    setColumns((current) => (current.includes(key) ? current.filter((k) => k !== key) : exportColumns.map((c) => c.key).filter((k) => k === key || current.includes(k))));
  function url(): string {
    const params = new URLSearchParams({ format, columns: columns.join(",") });
    if (digits.trim() !== "") params.set("digits", digits.trim());
    if (format === "tex") params.set("fit", fit);
    return `/api/proposals/${proposalId}/exports/targets?${params}`;
  }
  return (
    <section aria-label="Export the target table" className="space-y-2 rounded-md border border-void-edge bg-void-raised p-3 text-sm">
      <div className="flex flex-wrap items-end gap-3">
        <div className="flex flex-col gap-1">
          <label htmlFor={`${id}-format`} className="text-dusk-dim">Table format</label>
          <select id={`${id}-format`} value={format} onChange={(e) => setFormat(e.target.value as typeof format)} className="rounded border border-void-edge bg-void px-2 py-1 text-dusk">
            {tableFormats.map((f) => (
              <option key={f} value={f}>{formatLabels[f]}</option>
            ))}
          </select>
        </div>
        {format === "tex" && (
          <div className="flex flex-col gap-1">
            <label htmlFor={`${id}-fit`} className="text-dusk-dim">LaTeX layout for a wide table</label>
            <select id={`${id}-fit`} value={fit} onChange={(e) => setFit(e.target.value as LatexFit)} className="rounded border border-void-edge bg-void px-2 py-1 text-dusk">
              {latexFits.map((f) => (
                <option key={f} value={f}>{fitLabels[f]}</option>
              ))}
            </select>
          </div>
        )}
        <div className="flex flex-col gap-1">
          <label htmlFor={`${id}-digits`} className="text-dusk-dim">Significant digits (e.g. 4, or einsteinRadiusMas:3)</label>
          <input id={`${id}-digits`} value={digits} onChange={(e) => setDigits(e.target.value)} placeholder="per column default" className="rounded border border-void-edge bg-void px-2 py-1 font-mono text-dusk" />
        </div>
        <button type="button" disabled={isBusy || columns.length === 0} onClick={() => download(url(), `targets.${format}`)} className="rounded-md bg-ember px-3 py-1.5 font-semibold text-void disabled:opacity-50">
          Download target table
        </button>
      </div>
      <details>
        <summary className="cursor-pointer text-dusk-dim">Columns ({columns.length} of {exportColumns.length})</summary>
        <fieldset className="mt-2 grid gap-1 sm:grid-cols-3">
          <legend className="sr-only">Columns to export</legend>
          {exportColumns.map((column) => (
            <label key={column.key} className="flex items-center gap-2">
              <input type="checkbox" checked={columns.includes(column.key)} onChange={() => toggle(column.key)} />
              <span>{headerOf(column)}</span>
              <span className="text-xs text-dusk-dim">{column.origin}</span>
            </label>
          ))}
        </fieldset>
      </details>
      {error !== null ? <p role="alert" className="text-alarm">{error}</p> : null}
    </section>
  );
}
