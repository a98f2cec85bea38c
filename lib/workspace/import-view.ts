/**
 * What the import wizard receives: the preview of an uploaded target list row by row, and the
 * outcome of a commit. Types only, shared by the data-access layer (lib/server/imports.ts) and the
 * wizard.
 */
import type { ColumnMapping } from "@/lib/imports/columns";
import type { ImportColumn, ImportTable } from "@/lib/imports/import-table";
import type { ImportPlan, PlannedRow } from "@/lib/imports/plan";
import type { ImportFill } from "@/lib/imports/rows";
import type { CreateTargetInput } from "@/lib/workspace/target-schema";

/** One row of the preview as the mapping step shows it. */
export interface ImportRowView {
  rowNumber: number;
  cells: PlannedRow["cells"];
  /** The parsed target (ra/dec in ICRS degrees); null for a row with errors. */
  values: CreateTargetInput | null;
  errors: string[];
  action: PlannedRow["action"]["kind"];
  /** What the action means for this row ("updates TB-ML-0001, matched by position 0.4″"). */
  detail: string;
  /** For a refused row, every cell as the file wrote it, for the refused-rows download. */
  fileCells?: string[];
}

export interface ImportPreviewView {
  file: { id: string; name: string; sizeBytes: number; format: ImportTable["format"] };
  columns: ImportColumn[];
  proposedMapping: ColumnMapping;
  mapping: ColumnMapping;
  /** The column whose text becomes each new target's first note; null for none. */
  noteColumn: number | null;
  fill: ImportFill;
  toleranceArcsec: number;
  rows: ImportRowView[];
  counts: ImportPlan["counts"];
}

export interface ImportResult {
  importId: string;
  added: number;
  updated: number;
  skipped: number;
  /** Refused rows the user chose to leave out (0 for a file imported whole). */
  leftOut: number;
}
