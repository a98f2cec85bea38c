import { targetTableCsv } from "./csv";
import { targetTableEcsv } from "./ecsv";
import { targetTableJson } from "./json";
import { z } from "zod";
import { latexFits, targetTableLatex } from "./latex";
import type { TargetTable } from "./table";
import { targetTableVotable } from "./votable";

export const tableFormats = ["csv", "ecsv", "tex", "votable", "json"] as const;
export type TableFormat = (typeof tableFormats)[number];

/** The export query's options that shape a file rather than choose its rows or columns; each writer reads only its own. */
export const tableWriteOptionsSchema = z.object({
  /** How a LaTeX table meets the text width (`LatexFit`). */
  fit: z.enum(latexFits, { error: `The LaTeX table layout must be one of ${latexFits.join(", ")}.` }).default("shrink"),
});
export type TableWriteOptions = z.infer<typeof tableWriteOptionsSchema>;

interface TableWriter {
  write: (table: TargetTable, options: TableWriteOptions) => string;
  contentType: string;
  extension: string;
  /** Whether the file holds its provenance; a bare table (CSV) has it only in the download's header and name. */
  carriesProvenance: boolean;
}

/** Each table format's writer, media type and file extension. */
export const tableWriters: Record<TableFormat, TableWriter> = {
  csv: { write: targetTableCsv, contentType: "text/csv; charset=utf-8; header=present", extension: "csv", carriesProvenance: false },
  // No registered media type; text/plain so a browser shows it rather than guessing a spreadsheet.
  ecsv: { write: targetTableEcsv, contentType: "text/plain; charset=utf-8", extension: "ecsv", carriesProvenance: true },
  tex: { write: (table, { fit }) => targetTableLatex(table, fit), contentType: "application/x-tex; charset=utf-8", extension: "tex", carriesProvenance: true },
  votable: { write: targetTableVotable, contentType: "application/x-votable+xml; charset=utf-8", extension: "vot", carriesProvenance: true },
  json: { write: targetTableJson, contentType: "application/json; charset=utf-8", extension: "json", carriesProvenance: true },
};
