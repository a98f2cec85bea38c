/**
 * The formats the data behind a figure downloads in (a subset of the table formats), with the words a
 * download link shows; safe to import in the browser (no writer code).
 */
import type { TableFormat } from "@/lib/exports/tables/formats";

export const figureDataFormats = ["csv", "ecsv", "votable"] as const satisfies readonly TableFormat[];
export type FigureDataFormat = (typeof figureDataFormats)[number];

export const figureDataFormatLabels: Record<FigureDataFormat, string> = { csv: "CSV", ecsv: "ECSV", votable: "VOTable" };

export function isFigureDataFormat(format: string): format is FigureDataFormat {
  return (figureDataFormats as readonly string[]).includes(format);
}
