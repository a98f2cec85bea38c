import { toCsvField } from "@/lib/imports/formula";
import { provenanceLines } from "@/lib/exports/provenance";
import { cellOf, cellText, headerOf } from "./columns";
import { singleLine, type TargetTable } from "./table";

/**
 * The table as CSV (RFC 4180: CRLF line ends, quoted fields where needed) after "#" comment lines
 * holding the provenance (the comment convention of astropy's ECSV and papaparse's `comments`).
 * Text cells a spreadsheet would run as a formula are neutralized by `toCsvField`; empty fields are
 * values the model does not give.
 */
export function targetTableCsv(table: TargetTable): string {
  const comments = provenanceLines(table.provenance).map((line) => `# ${singleLine(line)}`);
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
  return [...comments, header, ...rows].join("\r\n") + "\r\n";
}
