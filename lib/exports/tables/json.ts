import type { Provenance } from "@/lib/exports/provenance";
import type { TargetView } from "@/lib/workspace/target-view";
import { dataCellOf, dataDigitsOf, type CellValue, type ChosenColumn } from "./columns";
import { sexagesimalCompanionOf, type TargetTable } from "./table";

export interface TargetTableJson {
  provenance: Provenance;
  columns: { key: string; label: string; unit: string; ucd: string; origin: "input" | "computed"; digits: number | null }[];
  rows: Record<string, CellValue>[];
}

type JsonColumn = TargetTableJson["columns"][number];

/** A chosen column's description and cell, and its sexagesimal companion's after it (RA and Dec). */
function jsonColumnsOf(chosen: ChosenColumn): { column: JsonColumn; cell: (row: TargetView) => CellValue }[] {
  const { column } = chosen;
  const own = {
    column: { key: column.key, label: column.label, unit: column.unit, ucd: column.ucd, origin: column.origin, digits: column.kind === "double" ? dataDigitsOf(chosen) : null },
    cell: (row: TargetView) => dataCellOf(row, chosen),
  };
  const companion = sexagesimalCompanionOf(column.key);
  if (companion === undefined) return [own];
  const { name, label, ucd } = companion.column;
  return [own, { column: { key: name, label, unit: "", ucd, origin: "input", digits: null }, cell: (row: TargetView) => companion.text(row[companion.after] as number) }];
}

/**
 * The table as JSON: provenance, column descriptions (units, UCDs, digits written) and rows keyed by
 * column (`dataCellOf`); RA and Dec are each followed by their sexagesimal form, as in every format.
 */
export function targetTableJson(table: TargetTable): string {
  const columns = table.columns.flatMap(jsonColumnsOf);
  const body: TargetTableJson = {
    provenance: table.provenance,
    columns: columns.map(({ column }) => column),
    rows: table.rows.map((row) => Object.fromEntries(columns.map(({ column, cell }) => [column.key, cell(row)]))),
  };
  return `${JSON.stringify(body, null, 2)}\n`;
}
