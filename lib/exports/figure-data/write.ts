/**
 * A figure's data table as a file in one of `figureDataFormats`: written by the generic table writers
 * (`data-table.ts`), with the media type and extension of the table exports' own registry (`tableWriters`).
 */
import { dataTableCsv, dataTableEcsv, dataTableVotable, type DataTable } from "@/lib/exports/tables/data-table";
import { tableWriters } from "@/lib/exports/tables/formats";
import type { FigureDataFormat } from "./formats";

const writers: Record<FigureDataFormat, (table: DataTable) => string> = {
  // Plain CSV has nowhere else for units: the header reads "Time from peak t0 [d]".
  csv: (table) => dataTableCsv(table, { header: "label" }),
  ecsv: dataTableEcsv,
  votable: (table) => dataTableVotable(table),
};

export interface FigureDataFile {
  text: string;
  contentType: string;
  /** Without the dot: "csv", "ecsv", "vot". */
  extension: string;
  /** Whether the file holds its provenance; the plain CSV has it only in the download's header and name. */
  carriesProvenance: boolean;
}

/** The table written in `format`, with the media type and extension a download of it carries. */
export function figureDataFile(table: DataTable, format: FigureDataFormat): FigureDataFile {
  const { contentType, extension, carriesProvenance } = tableWriters[format];
  return { text: writers[format](table), contentType, extension, carriesProvenance };
}
