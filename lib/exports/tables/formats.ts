import { targetTableCsv } from "./csv";
import { targetTableJson } from "./json";
import { targetTableLatex } from "./latex";
import type { TargetTable } from "./table";
import { targetTableVotable } from "./votable";

export const tableFormats = ["csv", "tex", "votable", "json"] as const;
export type TableFormat = (typeof tableFormats)[number];

interface TableWriter {
  write: (table: TargetTable) => string;
  contentType: string;
  extension: string;
  /** Whether the file holds its provenance; a bare table (CSV) has it only in the download's header and name. */
  carriesProvenance: boolean;
}

/** Each table format's writer, media type and file extension. */
export const tableWriters: Record<TableFormat, TableWriter> = {
  csv: { write: targetTableCsv, contentType: "text/csv; charset=utf-8; header=present", extension: "csv", carriesProvenance: false },
  tex: { write: targetTableLatex, contentType: "application/x-tex; charset=utf-8", extension: "tex", carriesProvenance: true },
  votable: { write: targetTableVotable, contentType: "application/x-votable+xml; charset=utf-8", extension: "vot", carriesProvenance: true },
  json: { write: targetTableJson, contentType: "application/json; charset=utf-8", extension: "json", carriesProvenance: true },
};
