import Papa from "papaparse";
import { dataCellOf, headerOf } from "./columns";
import type { TargetTable } from "./table";

// papaparse's own guard pattern (`^[=+\-@\t\r].*$`) fails on a formula followed by a line break,
// since `.` stops there; the lead character alone decides.
const FORMULA_LEAD = /^[=+\-@\t\r]/;

/** Quotes a text starting with #, which astropy's CSV and ECSV readers take for a comment line when it opens a row. */
export const quoteCommentLike = (value: unknown): boolean => typeof value === "string" && value.startsWith("#");

/**
 * The table as plain CSV (RFC 4180: the header row first, CRLF line ends, quoted fields where
 * needed), as spreadsheets and astropy's and STILTS's CSV readers take it, written by papaparse.
 * The body holds the table alone: the provenance travels in the download's `Arcwright-Provenance`
 * header and file name (`lib/exports/server/routes.ts`), and the units in the header text; the ECSV
 * export carries both inside the file. papaparse's formula guard is on: a text cell starting with
 * = + - @ tab or CR gets a leading apostrophe (OWASP CSV injection), while numbers, which a
 * spreadsheet reads as numbers, are written as they are. An empty field is a value the model does
 * not give; inputs are written as stored, computed quantities at their digits (`dataCellOf`).
 */
export function targetTableCsv(table: TargetTable): string {
  return `${Papa.unparse(
    {
      fields: table.columns.map(({ column }) => headerOf(column)),
      data: table.rows.map((row) => table.columns.map((chosen) => dataCellOf(row, chosen))),
    },
    { newline: "\r\n", escapeFormulae: FORMULA_LEAD, quotes: quoteCommentLike },
  )}\r\n`;
}
