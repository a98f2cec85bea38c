import { expect } from "vitest";
import type { DataTable } from "@/lib/exports/tables/data-table";

/** Every column described (UCD, description), names unique, and each cell of the column's kind. */
export function expectWellFormed(table: DataTable): void {
  const names = table.columns.map((column) => column.name);
  expect(new Set(names).size).toBe(names.length);
  for (const column of table.columns) {
    expect(column.name).toMatch(/^[a-z][a-z0-9_]*$/);
    expect(column.ucd).not.toBe("");
    expect(column.description).not.toBe("");
    // Full precision: no column rounds its values.
    expect(column.digits).toBeUndefined();
  }
  expect(table.rows.length).toBeGreaterThan(0);
  for (const row of table.rows) {
    expect(row).toHaveLength(table.columns.length);
    row.forEach((cell, index) => {
      const { kind } = table.columns[index];
      if (cell === null) return;
      if (kind === "text") expect(typeof cell).toBe("string");
      else expect(Number.isFinite(cell) && (kind === "double" || Number.isInteger(cell))).toBe(true);
    });
  }
}

/** The column `name` of every row (or of the rows `keep` picks). */
export function columnOf(table: DataTable, name: string, keep: (row: DataTable["rows"][number]) => boolean = () => true) {
  const index = table.columns.findIndex((column) => column.name === name);
  if (index < 0) throw new Error(`no column ${name}`);
  return table.rows.filter(keep).map((row) => row[index]);
}
