/**
 * Spreadsheet formula injection ("CSV injection", OWASP): a cell that starts with =, +, -, @, a tab
 * or a carriage return may be run as a formula when a CSV export is opened in a spreadsheet.
 * Imported values are stored as written; these functions neutralize them on the way out.
 */
import { PLAIN_NUMBER_SOURCE } from "@/lib/numbers/plain-number";

/**
 * A text that would start a formula: it leads with one of those characters and is not a plain
 * decimal number, which is inert in every spreadsheet (so "-12.5" is left as it is). A RegExp, so
 * papaparse's `escapeFormulae` can take it for text cells kept as text.
 */
export const FORMULA_CELL = new RegExp(String.raw`^(?!${PLAIN_NUMBER_SOURCE}$)[=+\-@\t\r]`);

/** Whether a text cell would start a formula in a spreadsheet. */
export function isFormulaLike(text: string): boolean {
  return FORMULA_CELL.test(text);
}

/** Prefixes a formula-like text with an apostrophe (OWASP), which spreadsheets show as plain text. */
export function neutralizeFormula(text: string): string {
  return isFormulaLike(text) ? `'${text}` : text;
}

/**
 * One CSV field for an export: numbers as written (never neutralized), text neutralized and then
 * quoted when it holds a comma, quote, CR or LF, with quotes doubled (RFC 4180 §2.6–2.7). null and
 * undefined are an empty field.
 */
export function toCsvField(value: string | number | null | undefined): string {
  if (value === null || value === undefined) return "";
  if (typeof value === "number") {
    if (!Number.isFinite(value)) throw new RangeError(`A CSV export cannot hold the number ${value}.`);
    return String(value);
  }
  const text = neutralizeFormula(value);
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}
