/**
 * The plain decimal number as files and fields hold it: an optional sign, digits with an optional
 * decimal point (or a point and digits), an optional e-exponent: "8000.5", "-1.2e3", ".5", "5.".
 * No thousands separators, no "NaN", "Infinity" or hex; exactly the decimal literals `Number` reads,
 * so a text that matches converts without surprise. The quantity parser (lib/physics/quantity-text)
 * reads a wider language, with units, commas and "× 10⁶"; this is the strict form for table cells.
 */

/** The mantissa without its sign: "12", "12.", "12.5" or ".5". A RegExp source, for patterns built on it. */
export const PLAIN_MANTISSA_SOURCE = String.raw`(?:\d+(?:\.\d*)?|\.\d+)`;

/** A whole plain number (sign, mantissa, e-exponent) as a RegExp source, unanchored, for patterns built on it. */
export const PLAIN_NUMBER_SOURCE = String.raw`[+-]?${PLAIN_MANTISSA_SOURCE}(?:[eE][+-]?\d+)?`;

/** A text that is one plain number and nothing else. */
export const PLAIN_NUMBER = new RegExp(`^${PLAIN_NUMBER_SOURCE}$`);

/** The value of `text` when it is one plain number (see the module comment), else undefined; no trimming. */
export function readPlainNumber(text: string): number | undefined {
  return PLAIN_NUMBER.test(text) ? Number(text) : undefined;
}
