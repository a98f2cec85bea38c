"use client";

import { useId, useState } from "react";
import { figureDataFormatLabels, type FigureDataFormat } from "@/lib/exports/figure-data/formats";
import { useDownload } from "./use-download";

const formats = [
  { format: "svg", label: "SVG" },
  { format: "png", label: "PNG" },
  { format: "pdf", label: "PDF" },
] as const;

/** The data behind the figure, in the order offered: ECSV (units and provenance inside), VOTable, plain CSV. */
const dataFormats: readonly FigureDataFormat[] = ["ecsv", "votable", "csv"];

interface FigureDownloadsProps {
  /** The export route, e.g. /api/bench/exports/deflection. */
  path: string;
  /** Fixed query parameters; with `isSketchFromAddress` the current address-bar query is sent too. */
  query?: Record<string, string>;
  isSketchFromAddress?: boolean;
  /** What the figure is, for the buttons' accessible names ("Download deflection plot as PNG"). */
  figureName: string;
}

/**
 * SVG / PNG / PDF download buttons for one figure, with the PNG's width (px) and DPI, and the data it
 * draws as ECSV / VOTable / CSV (the same export address with that `format`). The server regenerates
 * the figure from the same inputs, so every file carries its provenance.
 */
export function FigureDownloads({ path, query = {}, isSketchFromAddress = false, figureName }: FigureDownloadsProps) {
  const id = useId();
  const [widthPx, setWidthPx] = useState("2000");
  const [dpi, setDpi] = useState("300");
  const { download, error, isBusy } = useDownload();
  function urlFor(format: string): string {
    const params = new URLSearchParams(isSketchFromAddress ? window.location.search : "");
    for (const [key, value] of Object.entries(query)) params.set(key, value);
    params.set("format", format);
    if (format === "png") {
      params.set("width", widthPx);
      params.set("dpi", dpi);
    }
    return `${path}?${params}`;
  }
  const button = (format: string, label: string, what: string, fallbackName: string) => (
    <button
      key={format}
      type="button"
      disabled={isBusy}
      onClick={() => download(urlFor(format), fallbackName)}
      aria-label={`Download ${what} as ${label}`}
      className="rounded border border-void-edge px-2 py-0.5 text-dusk hover:border-ember disabled:opacity-50"
    >
      {label}
    </button>
  );
  return (
    <div className="mt-2 flex flex-wrap items-center gap-2 text-xs text-dusk-dim" role="group" aria-label={`Download the ${figureName}`}>
      <span>Download</span>
      {formats.map(({ format, label }) => button(format, label, `the ${figureName}`, `figure.${format}`))}
      <label htmlFor={`${id}-width`}>PNG width (px)</label>
      <input id={`${id}-width`} inputMode="numeric" value={widthPx} onChange={(e) => setWidthPx(e.target.value)} className="w-16 rounded border border-void-edge bg-void px-1 font-mono text-dusk" />
      <label htmlFor={`${id}-dpi`}>DPI</label>
      <input id={`${id}-dpi`} inputMode="numeric" value={dpi} onChange={(e) => setDpi(e.target.value)} className="w-12 rounded border border-void-edge bg-void px-1 font-mono text-dusk" />
      <span aria-hidden="true">·</span>
      <span>Data</span>
      {dataFormats.map((format) => button(format, figureDataFormatLabels[format], `the data of the ${figureName}`, `figure-data.${format}`))}
      {error !== null ? (
        <p role="alert" className="w-full text-alarm">
          {error}
        </p>
      ) : null}
    </div>
  );
}
