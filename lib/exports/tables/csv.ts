import { toCsvField } from "@/lib/imports/formula";
import { cellOf, cellText, headerOf } from "./columns";
import type { TargetTable } from "./table";

/**
 * The table as plain CSV (RFC 4180: the header row first, CRLF line ends, quoted fields where
 * needed), as spreadsheets and astropy's and STILTS's CSV readers take it. The body holds the table
 * alone: the provenance travels in the download's `Arcwright-Provenance` header and file name
 * (`lib/exports/server/routes.ts`), since comment lines before the header are no part of RFC 4180
 * and a title written there would reach a spreadsheet as a cell. Every text field, headers included,
 * goes through the formula guard (`toCsvField`); empty fields are values the model does not give.
 */
export function targetTableCsv(table: TargetTable): string {
  const header = table.columns.map(({ column }) => toCsvField(headerOf(column))).join(",");
  const rows = table.rows.map((row) =>
    table.columns
      .map((chosen) => {
        const value = cellOf(row, chosen.column);
        // Numbers go out as written at their digits; text through the formula guard.
        return typeof value === "number" ? cellText(value, chosen) : toCsvField(value);
      })
      .join(","),
  );
  return [header, ...rows].join("\r\n") + "\r\n";
}
