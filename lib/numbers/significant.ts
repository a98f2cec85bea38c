/**
 * Numbers rounded to significant digits, in the two forms the product writes them:
 *
 * - for people (`formatSignificant`): the screens, the verdict words, the PDFs. Plain from 0.001 to
 *   below a million, else "1.2 × 10⁻³" with a superscript exponent, as astronomers write a power of
 *   ten; trailing zeros dropped; a real minus sign (U+2212); "—" where there is no value, "∞" and
 *   "−∞" for infinities. The quantity parser reads every one of these back.
 * - for machines (`roundToSignificant`, `machineSignificantText`): the data files (CSV, ECSV,
 *   VOTable, JSON) and LaTeX's numbers, which readers such as astropy parse: the shortest decimal that
 *   holds the rounded double ("1.5e-7", ASCII minus), so a value read back is the double written.
 *
 * Rounding is of the exact binary value, a tie going to the larger magnitude (`toExponential`,
 * ECMA-262 §21.1.3.2): 9.995, stored as 9.99499999999999921…, is 9.99 at three digits; 0.125, stored
 * exactly, is 0.13 at two.
 */
import { format } from "d3";
import { superscript } from "@/lib/physics/quantity-vocabulary";

/** Digits a number for people has when the caller names none: what the results panel shows. */
export const DEFAULT_SIGNIFICANT_DIGITS = 4;

/** Powers of ten written plainly: from 10⁻³ to 10⁵ (0.001 up to 999 999 shows without an exponent). */
const PLAIN_EXPONENT_MIN = -3;
const PLAIN_EXPONENT_MAX = 5;

/**
 * `value` to `digits` significant digits (1 to 17) as people read it: "0.001235", "123 457" written
 * "123500" at 4 digits, "1.235 × 10⁶", "−4.1 × 10⁻⁷", "0" (also for −0); "—" for null, undefined and
 * NaN (no value), "∞" and "−∞". The choice between plain and power-of-ten form is made after
 * rounding, so 999 999.7 at four digits is "1 × 10⁶", not "1000000".
 */
export function formatSignificant(value: number | null | undefined, digits = DEFAULT_SIGNIFICANT_DIGITS): string {
  if (value === null || value === undefined || Number.isNaN(value)) return "—";
  if (!Number.isFinite(value)) return value > 0 ? "∞" : "−∞";
  if (value === 0) return "0";
  const sign = value < 0 ? "−" : "";
  const magnitude = Math.abs(value);
  // d3's "e" type is toExponential: the rounded mantissa and the exponent after rounding.
  const [mantissa, exponentText] = format(`.${digits - 1}~e`)(magnitude).split("e");
  const exponent = Number(exponentText);
  if (exponent >= PLAIN_EXPONENT_MIN && exponent <= PLAIN_EXPONENT_MAX) return `${sign}${format(`.${digits}~r`)(magnitude)}`;
  return `${sign}${mantissa} × 10${superscript(exponent)}`;
}

/**
 * `value` with every digit it holds, as people read it: the digits of JavaScript's shortest
 * round-trip text ("1e-6" → "1 × 10⁻⁶", "0.3" → "0.3"), so the quantity parser reads the same
 * double back. For bounds and limits a person may type back.
 */
export function formatExactForPeople(value: number): string {
  if (!Number.isFinite(value) || value === 0) return formatSignificant(value);
  const digitCount = value.toExponential().split("e")[0].replace(/[-.]/g, "").length;
  return formatSignificant(value, digitCount);
}

/** `value` rounded to `digits` significant digits (1 to 100) as a double: the nearest double to the rounded decimal. */
export function roundToSignificant(value: number, digits: number): number {
  return Number(value.toPrecision(digits));
}

/**
 * `value` rounded to `digits` significant digits as a data file writes it: JavaScript's shortest
 * round-trip text of the rounded double ("0.0001235", "1.235e-7", "-42"; "NaN" and "Infinity" as
 * JavaScript spells them, which the file writers replace by their own null).
 */
export function machineSignificantText(value: number, digits: number): string {
  return String(roundToSignificant(value, digits));
}
