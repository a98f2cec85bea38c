import type { Provenance } from "@/lib/exports/provenance";
import { cellOf, roundSignificant, type CellValue } from "./columns";
import type { TargetTable } from "./table";

export interface TargetTableJson {
  provenance: Provenance;
  columns: { key: string; label: string; unit: string; ucd: string; origin: "input" | "computed"; digits: number | null }[];
  rows: Record<string, CellValue>[];
}

/** The table as JSON: provenance, column descriptions (units, UCDs, digits) and rows keyed by column. */
export function targetTableJson(table: TargetTable): string {
  const body: TargetTableJson = {
    provenance: table.provenance,
    columns: table.columns.map(({ column, digits }) => ({
      key: column.key,
      label: column.label,
      unit: column.unit,
      ucd: column.ucd,
      origin: column.origin,
      digits: column.kind === "double" ? digits : null,
    })),
    rows: table.rows.map((row) =>
      Object.fromEntries(
        table.columns.map(({ column, digits }) => {
          const value = cellOf(row, column);
          return [column.key, typeof value === "number" && column.kind === "double" ? roundSignificant(value, digits) : value];
        }),
      ),
    ),
  };
  return `${JSON.stringify(body, null, 2)}\n`;
}
