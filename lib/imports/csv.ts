import Papa from "papaparse";
import { AppError } from "@/lib/errors";
import { readEcsvHeader } from "@/lib/imports/ecsv-header";
import type { ImportColumn, ImportTable } from "@/lib/imports/import-table";
import { MAX_IMPORT_ROWS, TooManyRowsError } from "@/lib/imports/limits";

const importError = (message: string) => new AppError("bad_request:import", message);

/** The longest header read; a longer one is no column name a person wrote. */
export const MAX_HEADER_CHARS = 200;

/**
 * "mass [Msun]" or "D_L (kpc)": the unit in brackets at the end of a header, common practice in
 * catalogues. The opening bracket is the first one after the last closing bracket before the end.
 * Found by index, not a pattern: a lazy name, spaces and a lazy unit in one pattern backtrack
 * polynomially on a header of spaces and brackets (600 characters took seconds).
 */
function splitTrailingUnit(text: string): ImportColumn | undefined {
  if (!text.endsWith("]") && !text.endsWith(")")) return undefined;
  const body = text.slice(0, -1);
  const unitStart = Math.max(body.lastIndexOf("]"), body.lastIndexOf(")")) + 1;
  const openings = [body.indexOf("[", unitStart), body.indexOf("(", unitStart)].filter((at) => at >= 0);
  if (openings.length === 0) return undefined;
  const open = Math.min(...openings);
  const name = body.slice(0, open).trimEnd();
  const unit = body.slice(open + 1).trim();
  return name !== "" && unit !== "" ? { name, unit } : undefined;
}

export function columnFromHeader(header: string, index: number): ImportColumn {
  const text = header.trim();
  if (text === "") return { name: `column ${index + 1}` };
  if (text.length > MAX_HEADER_CHARS) {
    throw importError(`The header of column ${index + 1} is longer than ${MAX_HEADER_CHARS} characters; shorten it to the column's name.`);
  }
  return splitTrailingUnit(text) ?? { name: text };
}

/**
 * Reads a CSV target list (RFC 4180, with the delimiter detected among comma, tab, semicolon and
 * pipe as spreadsheets write them). The first row is the header. Blank lines are skipped. A quoted
 * field that is never closed or has text after its closing quote makes the whole file malformed
 * (RFC 4180 §2.5–2.7); a row with the wrong number of fields is left for row validation to report.
 * An ECSV file (a CSV under a "# %ECSV" YAML header) is read with its header's delimiter, and each
 * column takes the unit and UCD the header gives it.
 */
export function parseCsvTable(text: string): ImportTable {
  const ecsv = readEcsvHeader(text);
  // One row past the limit is enough to know the file is too long, without parsing the rest.
  const result = Papa.parse<string[]>(ecsv?.body ?? text, { skipEmptyLines: "greedy", preview: MAX_IMPORT_ROWS + 2, ...(ecsv ? { delimiter: ecsv.delimiter } : {}) });
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
    throw new TooManyRowsError();
  }
  return {
    format: "csv",
    columns: header.map((text, index) => ({ ...columnFromHeader(text, index), ...ecsv?.columns.get(text.trim()) })),
    rows: dataRows.map((cells, index) => ({ rowNumber: index + 1, cells })),
  };
}
