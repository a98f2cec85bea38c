import Papa from "papaparse";
import { quoteCommentLike } from "@/lib/exports/tables/csv";
import { FORMULA_CELL } from "@/lib/imports/formula";
import type { ImportColumn } from "@/lib/imports/import-table";

/** A row the import refused: its cells as the file wrote them, and why. */
export interface RefusedRow {
  rowNumber: number;
  cells: string[];
  errors: string[];
}

/** The header of the refused-rows file's first column: where each row is in the uploaded file. */
export const REFUSED_ROW_NUMBER_HEADER = "row in file";
/** The header of its last column: each refusal, in the words the preview showed. */
export const REFUSED_REASONS_HEADER = "refused because";

/** "D_L [kpc]" for a column with a unit, so a corrected file imports with the same units. */
const headerText = (column: ImportColumn) => (column.unit ? `${column.name} [${column.unit}]` : column.name);

/**
 * The refused rows as plain CSV (RFC 4180, CRLF, header first) for the user to correct: the row's
 * number in the uploaded file, every cell as written under the file's own headers (units kept in
 * brackets), and the reasons. Written by papaparse with its formula guard on (OWASP CSV
 * injection): a text cell starting with = + - @ tab or CR that is not a plain number gets a leading
 * apostrophe, as `isFormulaLike` decides for every CSV this product writes.
 */
export function refusedRowsCsv(columns: readonly ImportColumn[], rows: readonly RefusedRow[]): string {
  return `${Papa.unparse(
    {
      fields: [REFUSED_ROW_NUMBER_HEADER, ...columns.map(headerText), REFUSED_REASONS_HEADER],
      data: rows.map((row) => [String(row.rowNumber), ...columns.map((_, index) => row.cells[index] ?? ""), row.errors.join(" ")]),
    },
    { newline: "\r\n", escapeFormulae: FORMULA_CELL, quotes: quoteCommentLike },
  )}\r\n`;
}

/** The download's name: "bulge list.csv" → "bulge list refused rows.csv". */
export function refusedRowsFileName(uploadedName: string): string {
  return `${uploadedName.replace(/\.(csv|tsv|txt|ecsv|xml|vot|votable)$/i, "")} refused rows.csv`;
}
