/**
 * The number at the start of a typed quantity, read by one set of rules for every field of the
 * product (bare numbers and quantities alike), so that no number is misread by a factor of 1,000:
 *
 * - A point is always the decimal point: `8.125` is 8.125. More than one point is refused.
 * - Thousands commas are read only when every group after the first has exactly three digits and the
 *   first has one to three: `4,100,000` is 4.1e6, `1,234,567` is 1234567. Groups of other sizes
 *   (`1,23,456`) are refused.
 * - A lone comma followed by exactly three digits, after one to three digits (`8,125`, `0,125`), or
 *   after space-grouped digits (`4 100,125`), reads both as a thousands comma and as a decimal comma,
 *   so it is refused with both readings offered.
 *   Any other lone comma is a decimal comma: `8,1` is 8.1, `12345,678` is 12345.678.
 * - Commas and a point together are read only in the English form, thousands groups before one
 *   decimal point (`1,234.5`): no locale writes a decimal point after a decimal comma, so the form
 *   has a single reading. A point before a comma (`1.234,5`, the European form) contradicts the
 *   first rule and is refused, offering the European reading.
 * - Digits grouped by spaces, as the SI Brochure and the IAU style manual write them (`4 100 000`,
 *   thin or no-break spaces too), are read when every group after the first has three digits; a comma
 *   or point after such groups can only be the decimal sign (`4 100 000,5`).
 * - Powers of ten: `4e6`, `4E+06`, `4×10^6`, `4 x 10^6`, `4*10**6`, `4·10^6`, `4 × 10⁶` (superscript
 *   digits and signs).
 * - Signs: `+`, `-` and the minus sign U+2212.
 *
 * Written as a scanner over the characters (no regular expressions), so its time is linear in the
 * length of the text.
 */

/**
 * A number read from the start of a text, or what is wrong with it in the user's words; `hasDigits`
 * is false when the text does not start with a number at all, which the caller words for its field.
 */
export type NumberReading = { ok: true; value: number; length: number } | { ok: false; problem: string; hasDigits: boolean };

const SUPERSCRIPT_DIGITS = "⁰¹²³⁴⁵⁶⁷⁸⁹";
const MINUS_SIGNS = "-\u2212";

function isDigit(character: string | undefined): boolean {
  return character !== undefined && character >= "0" && character <= "9";
}

/** Reads a run of ASCII or superscript digits (not mixed) at `start`; its value as ASCII text. */
function readExponentDigits(text: string, start: number, superscript: boolean): { digits: string; end: number } {
  let end = start;
  let digits = "";
  for (;;) {
    const character = text[end];
    const index = character === undefined ? -1 : SUPERSCRIPT_DIGITS.indexOf(character);
    if (superscript && index >= 0) digits += String(index);
    else if (!superscript && isDigit(character)) digits += character;
    else break;
    end += 1;
  }
  return { digits, end };
}

/** `e6`, `E+06`, `e-3` at `start`: the exponent and the index after it, or undefined. */
function readExponentSuffix(text: string, start: number): { exponent: string; end: number } | undefined {
  if (text[start] !== "e" && text[start] !== "E") return undefined;
  let index = start + 1;
  let sign = "";
  if (text[index] === "+" || MINUS_SIGNS.includes(text[index] ?? "+")) {
    sign = text[index] === "+" ? "" : "-";
    index += 1;
  }
  const { digits, end } = readExponentDigits(text, index, false);
  return digits === "" ? undefined : { exponent: `${sign}${digits}`, end };
}

/**
 * `×10^6`, ` x 10**-3`, `*10^6`, `·10⁶` at `start` (one optional space either side of the sign):
 * the exponent and the index after it; undefined when no times sign follows; a problem when a times
 * sign and 10 are followed by no exponent.
 */
function readTimesTen(text: string, start: number): { exponent: string; end: number } | { problem: string } | undefined {
  let index = start;
  if (text[index] === " ") index += 1;
  if (!"x×*·".includes(text[index] ?? "?")) return undefined;
  index += 1;
  if (text[index] === " ") index += 1;
  if (text[index] !== "1" || text[index + 1] !== "0") return undefined;
  index += 2;
  const problem = { problem: "has a power of ten without its exponent; type e.g. 4e6 or 4×10^6" };
  if (text[index] === "^" || (text[index] === "*" && text[index + 1] === "*")) {
    index += text[index] === "^" ? 1 : 2;
    let sign = "";
    if (text[index] === "+" || MINUS_SIGNS.includes(text[index] ?? "+")) {
      sign = text[index] === "+" ? "" : "-";
      index += 1;
    }
    const { digits, end } = readExponentDigits(text, index, false);
    return digits === "" ? problem : { exponent: `${sign}${digits}`, end };
  }
  let sign = "";
  if (text[index] === "⁺" || text[index] === "⁻") {
    sign = text[index] === "⁻" ? "-" : "";
    index += 1;
  }
  const { digits, end } = readExponentDigits(text, index, true);
  return digits === "" ? problem : { exponent: `${sign}${digits}`, end };
}

/**
 * True when the character at `index` is a space between digit groups, as the SI Brochure (5.4.4) and
 * the IAU style manual group digits: after a digit and before exactly three digits ("4 100 000").
 */
function isGroupSpace(text: string, index: number): boolean {
  return text[index] === " " && isDigit(text[index - 1]) && isDigit(text[index + 1]) && isDigit(text[index + 2]) && isDigit(text[index + 3]) && !isDigit(text[index + 4]);
}

/**
 * A mantissa with digits grouped by spaces: the groups must be thousands groups, and a comma or point
 * after them can only be the decimal sign ("4 100 000,5" and "4 100 000.5" are 4100000.5).
 */
function spacedMantissaText(run: string): { text: string } | { problem: string } {
  const commaIndex = run.indexOf(",");
  const pointIndex = run.indexOf(".");
  const cut = commaIndex < 0 ? pointIndex : pointIndex < 0 ? commaIndex : Math.min(commaIndex, pointIndex);
  const integerPart = cut < 0 ? run : run.slice(0, cut);
  const fraction = cut < 0 ? "" : run.slice(cut + 1);
  if (!isThousandsGrouping(integerPart.split(" ")) || [...fraction].some((character) => !isDigit(character))) {
    return { problem: "has spaces, commas or points inside its number that are not thousands groups of three digits and one decimal sign; type it without spaces, e.g. 4100000.5" };
  }
  const digits = integerPart.split(" ").join("");
  if (run[cut] === "," && fraction.length === 3) return { problem: ambiguousComma(digits, fraction) };
  return { text: `${digits}${cut < 0 ? "" : `.${fraction}`}` };
}

/** True when `groups` are thousands groups: the first of one to three digits, each other of three. */
function isThousandsGrouping(groups: string[]): boolean {
  return groups[0].length >= 1 && groups[0].length <= 3 && groups.slice(1).every((group) => group.length === 3);
}

/** The refusal of a comma before exactly three digits, with both readings. */
function ambiguousComma(before: string, after: string): string {
  const thousands = plainDigits(`${before}${after}`);
  const decimal = `${plainDigits(before)}.${after}`;
  return `could be ${thousands} or ${decimal}: the comma may separate thousands or decimals; type ${thousands} or ${decimal}`;
}

/** Digits without leading zeros, for a reading offered in a message ("0125" → "125"). */
function plainDigits(digits: string): string {
  let start = 0;
  while (start < digits.length - 1 && digits[start] === "0") start += 1;
  return digits.slice(start);
}

/**
 * The mantissa as JavaScript reads it ("4100000", "8.1"), from a run of digits, commas and points;
 * or the problem, per the rules in the module comment.
 */
function mantissaText(run: string): { text: string } | { problem: string } {
  if (run.includes(" ")) return spacedMantissaText(run);
  const pointCount = run.split(".").length - 1;
  const groups = run.split(",");
  if (pointCount > 1) {
    return { problem: "has more than one point (a point is the decimal point here); type one decimal point and no thousands separator, e.g. 1234.5" };
  }
  if (groups.length === 1) return { text: run };
  if (groups.some((group) => group === "" || group.startsWith(".") || (group.endsWith(".") && group !== groups.at(-1)))) {
    return { problem: "has a comma in the wrong place; type the number with a decimal point, e.g. 8.1" };
  }
  const pointIndex = run.indexOf(".");
  if (pointIndex >= 0) {
    if (pointIndex < run.lastIndexOf(",")) {
      const european = groups[0].split(".");
      const reading = isThousandsGrouping(european) && groups.length === 2 ? `${plainDigits(european.join(""))}.${groups[1]}` : undefined;
      const offer = reading === undefined ? "" : ` ${reading} if that is the number, with`;
      return { problem: `mixes a point and a comma, which reads two ways; type${offer} a decimal point and no thousands separator` };
    }
    const [integerPart, fraction] = run.split(".");
    const integerGroups = integerPart.split(",");
    if (!isThousandsGrouping(integerGroups)) {
      return { problem: "has commas before its decimal point that are not thousands groups of three digits; type it without commas, e.g. 1234.5" };
    }
    return { text: `${integerGroups.join("")}.${fraction}` };
  }
  if (groups.length === 2) {
    if (groups[1].length === 3 && groups[0].length <= 3) {
      return { problem: ambiguousComma(groups[0], groups[1]) };
    }
    return { text: `${groups[0]}.${groups[1]}` };
  }
  if (!isThousandsGrouping(groups)) {
    return { problem: `has commas that are not thousands groups of three digits (like 4,100,000); type it without commas, e.g. ${plainDigits(groups.join(""))}` };
  }
  return { text: groups.join("") };
}

/**
 * Reads the number at the start of `text` (already trimmed, white space folded to single spaces) by
 * the rules in the module comment: its value and the number of characters it took, or the problem.
 * Text that does not start with a number gives a problem too.
 */
export function readLeadingNumber(text: string): NumberReading {
  let index = 0;
  let sign = "";
  if (text[0] === "+" || MINUS_SIGNS.includes(text[0] ?? "+")) {
    sign = text[0] === "+" ? "" : "-";
    index = 1;
  }
  const runStart = index;
  let hasDigit = false;
  while (index < text.length && (isDigit(text[index]) || text[index] === "," || text[index] === "." || isGroupSpace(text, index))) {
    hasDigit ||= isDigit(text[index]);
    index += 1;
  }
  // "8, kpc" could be a slip for either separator; "5." is a number.
  let run = text.slice(runStart, index);
  if (run.endsWith(",")) return { ok: false, problem: "has a comma after its number; type e.g. 8.1 or 8", hasDigits: true };
  if (!hasDigit) return { ok: false, problem: "does not start with a number", hasDigits: false };
  const mantissa = mantissaText(run);
  if ("problem" in mantissa) return { ok: false, problem: mantissa.problem, hasDigits: true };
  run = mantissa.text;
  let exponent = "0";
  const suffix = readExponentSuffix(text, index);
  if (suffix !== undefined) {
    exponent = suffix.exponent;
    index = suffix.end;
  } else {
    const times = readTimesTen(text, index);
    if (times !== undefined && "problem" in times) return { ok: false, problem: times.problem, hasDigits: true };
    if (times !== undefined) {
      exponent = times.exponent;
      index = times.end;
    }
  }
  const value = Number(`${sign}${run}e${exponent}`);
  if (Number.isNaN(value)) return { ok: false, problem: "is not a number; type e.g. 0.3 or 2e3", hasDigits: true };
  return { ok: true, value, length: index };
}
