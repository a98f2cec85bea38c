import { AppError } from "@/lib/errors";
import { MAX_IMPORT_BYTES } from "@/lib/imports/limits";

/** One column of an imported table, with what the file says about it. */
export interface ImportColumn {
  /** The header text (CSV) or the FIELD name (VOTable), trimmed; "column 3" when the file gives none. */
  name: string;
  /** The unit the file declares: a VOTable `unit` attribute, or "[kpc]"/"(kpc)" after a CSV header. */
  unit?: string;
  /** The VOTable `ucd` attribute (IVOA UCD1+), e.g. "pos.eq.ra;meta.main". */
  ucd?: string;
}

/** One data row; `rowNumber` 1 is the first row after the header (CSV) or the first TR (VOTable). */
export interface ImportRow {
  rowNumber: number;
  /** The cells as written, not trimmed; a row may have more or fewer cells than there are columns. */
  cells: string[];
}

/** A target list read from a file, before any column is given a meaning. */
export interface ImportTable {
  format: "csv" | "votable";
  columns: ImportColumn[];
  rows: ImportRow[];
}

const importError = (message: string) => new AppError("bad_request:import", message);

/**
 * The text of an uploaded target list: at most MAX_IMPORT_BYTES, UTF-8 (a byte-order mark is
 * dropped), and not blank. Every refusal is an AppError with a message for the user.
 */
export function decodeImportText(bytes: Uint8Array): string {
  if (bytes.length > MAX_IMPORT_BYTES) {
    throw new AppError("payload_too_large:import", `The file is larger than ${formatMebibytes(MAX_IMPORT_BYTES)}, the limit for a target list.`);
  }
  let text: string;
  try {
    // fatal: a Latin-1 or binary file fails here instead of turning into replacement characters.
    text = new TextDecoder("utf-8", { fatal: true, ignoreBOM: false }).decode(bytes);
  } catch {
    throw importError("The file is not UTF-8 text. Save it as CSV (UTF-8) or as a VOTable.");
  }
  if (text.trim() === "") throw importError("The file is empty.");
  return text;
}

/** A VOTable is XML; anything else is read as CSV. */
export function looksLikeXml(text: string): boolean {
  return /^\s*</.test(text);
}

/** "5 MB" for a limit in bytes (binary megabytes, as file managers show sizes). */
export function formatMebibytes(bytes: number): string {
  return `${Number((bytes / (1024 * 1024)).toFixed(1))} MB`;
}
