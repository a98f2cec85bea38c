import type { Provenance } from "@/lib/exports/provenance";
import { dataCellOf, dataDigitsOf, type CellValue } from "./columns";
import type { TargetTable } from "./table";

export interface TargetTableJson {
  provenance: Provenance;
  columns: { key: string; label: string; unit: string; ucd: string; origin: "input" | "computed"; digits: number | null }[];
  rows: Record<string, CellValue>[];
}

/** The table as JSON: provenance, column descriptions (units, UCDs, digits written) and rows keyed by column (`dataCellOf`). */
export function targetTableJson(table: TargetTable): string {
  const body: TargetTableJson = {
    provenance: table.provenance,
    columns: table.columns.map((chosen) => ({
      key: chosen.column.key,
      label: chosen.column.label,
      unit: chosen.column.unit,
      ucd: chosen.column.ucd,
      origin: chosen.column.origin,
      digits: chosen.column.kind === "double" ? dataDigitsOf(chosen) : null,
    })),
    rows: table.rows.map((row) => Object.fromEntries(table.columns.map((chosen) => [chosen.column.key, dataCellOf(row, chosen)]))),
  };
  return `${JSON.stringify(body, null, 2)}\n`;
}
