import Papa from "papaparse";
import { AppError } from "@/lib/errors";
import type { ImportColumn, ImportTable } from "@/lib/imports/import-table";
import { MAX_IMPORT_ROWS } from "@/lib/imports/limits";

const importError = (message: string) => new AppError("bad_request:import", message);

/** "mass [Msun]" or "D_L (kpc)": the unit in brackets at the end of a header, common practice in catalogues. */
const HEADER_UNIT = /^(.*?)\s*[[(]\s*([^\])]+?)\s*[\])]\s*$/;

export function columnFromHeader(header: string, index: number): ImportColumn {
  const text = header.trim();
  if (text === "") return { name: `column ${index + 1}` };
  const match = HEADER_UNIT.exec(text);
  return match && match[1] !== "" ? { name: match[1], unit: match[2] } : { name: text };
}

/**
 * Reads a CSV target list (RFC 4180, with the delimiter detected among comma, tab, semicolon and
 * pipe as spreadsheets write them). The first row is the header. Blank lines are skipped. A quoted
 * field that is never closed or has text after its closing quote makes the whole file malformed
 * (RFC 4180 §2.5–2.7); a row with the wrong number of fields is left for row validation to report.
 */
export function parseCsvTable(text: string): ImportTable {
  // One row past the limit is enough to know the file is too long, without parsing the rest.
  const result = Papa.parse<string[]>(text, { skipEmptyLines: "greedy", preview: MAX_IMPORT_ROWS + 2 });
  const quoteError = result.errors.find((error) => error.type === "Quotes");
  if (quoteError) {
    const where = quoteError.row === undefined ? "" : quoteError.row === 0 ? "In the header: " : `Row ${quoteError.row}: `;
    const problem = quoteError.code === "MissingQuotes" ? "a quoted field is never closed" : "a quoted field has text after its closing quote";
    throw importError(`The CSV is malformed. ${where}${problem} (RFC 4180 §2.5–2.7).`);
  }
  const [header, ...dataRows] = result.data;
  if (header === undefined) throw importError("The file is empty.");
  if (dataRows.length === 0) throw importError("The file has a header row but no data rows.");
  if (dataRows.length > MAX_IMPORT_ROWS) {
    throw importError(`The file has more than ${MAX_IMPORT_ROWS.toLocaleString("en-US")} data rows; split it into smaller lists.`);
  }
  return {
    format: "csv",
    columns: header.map(columnFromHeader),
    rows: dataRows.map((cells, index) => ({ rowNumber: index + 1, cells })),
  };
}
