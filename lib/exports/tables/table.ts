import type { TargetView } from "@/lib/workspace/target-view";
import type { Provenance } from "@/lib/exports/provenance";
import { cellOf, descriptionOf, isWrittenAsStored, type ChosenColumn } from "./columns";
import type { DataColumn, DataTable } from "./data-table";

/** Everything a table export is written from; every format writes the same rows and provenance. */
export interface TargetTable {
  /** The proposal's title, for captions and resource names. */
  title: string;
  columns: ChosenColumn[];
  rows: TargetView[];
  provenance: Provenance;
}

/** Folds line breaks so a value fits one comment line of a text format. */
export function singleLine(text: string): string {
  return text.replace(/[\r\n]+/g, " ");
}

/** The columns holding ICRS positions, which a VOTable refers to its ICRS COOSYS. */
export const icrsColumnKeys: readonly string[] = ["raDeg", "decDeg"];

function dataColumnOf(chosen: ChosenColumn): DataColumn {
  const { column } = chosen;
  return {
    name: column.key,
    label: column.label,
    unit: column.unit,
    voUnit: column.voUnit,
    ucd: column.ucd,
    kind: column.kind,
    description: descriptionOf(column),
    // Inputs the request named no digits for are written as stored, so a re-import matches exactly (`isWrittenAsStored`).
    ...(column.kind === "double" && !isWrittenAsStored(chosen) ? { digits: chosen.digits } : {}),
  };
}

/** The target table as the data formats (CSV, ECSV, VOTable) write it: one row per target, cells as stored. */
export function targetDataTable(table: TargetTable): DataTable {
  return {
    name: "targets",
    title: `Targets of ${table.title}`,
    columns: table.columns.map(dataColumnOf),
    rows: table.rows.map((row) => table.columns.map((chosen) => cellOf(row, chosen.column))),
    provenance: table.provenance,
  };
}
