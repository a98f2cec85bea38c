/**
 * An angle typed in degrees, arcminutes and arcseconds together: `12°30′`, `-24° 37′ 38.5″`, `1′30″`,
 * `0°0'1.2''` (the ASCII apostrophe and quote, or two apostrophes, for the prime signs). Sexagesimal
 * notation of angles is common practice in astronomy (e.g. the IAU style manual, Wilkins 1989, §5.14).
 * A written-out sign applies to the whole angle (`-0° 30′` is half a degree south); only the first
 * part may carry it, and every later part is below 60. Only the last part may have a fraction.
 * A single part (`1.2″`) is an ordinary quantity, read by ./units.
 */

import { readLeadingNumber } from "./quantity-text";

/** The parts' units, by rank: degrees, arcminutes, arcseconds; the value of each in arcseconds. */
const ARCSEC_PER_RANK = [3600, 60, 1] as const;
const MINUS_SIGNS = ["-", "\u2212"];

/**
 * Degrees for a compound angle; a problem (in the user's words, with what to type) for text that is
 * one but breaks a rule; undefined for text that is not a compound angle (fewer than two parts, or
 * words after the last sign).
 */
export type CompoundAngleReading = { ok: true; degrees: number } | { ok: false; fault: string; advice: string } | undefined;

interface AnglePart {
  text: string;
  rank: 0 | 1 | 2;
}

/** The rank of the sign at `index` and the characters it takes, or undefined for another character. */
function signAt(text: string, index: number): { rank: 0 | 1 | 2; length: number } | undefined {
  const character = text[index];
  if (character === "°") return { rank: 0, length: 1 };
  if (character === "′" || character === "'" || character === "’") {
    const next = text[index + 1];
    return next === "'" || next === "’" ? { rank: 2, length: 2 } : { rank: 1, length: 1 };
  }
  if (character === "″" || character === '"' || character === "”") return { rank: 2, length: 1 };
  return undefined;
}

function splitParts(text: string): { parts: AnglePart[]; rest: string } {
  const parts: AnglePart[] = [];
  let start = 0;
  let index = 0;
  while (index < text.length) {
    const sign = signAt(text, index);
    if (sign === undefined) {
      index += 1;
      continue;
    }
    parts.push({ text: text.slice(start, index).trim(), rank: sign.rank });
    index += sign.length;
    start = index;
  }
  return { parts, rest: text.slice(start).trim() };
}

const ADVICE = "e.g. 12°30′ or -24° 37′ 38.5″";

/** Reads `text` (trimmed, white space folded) as a compound angle; see CompoundAngleReading. */
export function readCompoundAngle(text: string): CompoundAngleReading {
  const { parts, rest } = splitParts(text);
  // "12° 30" lost its minute sign; read as one quantity it would be nonsense.
  if (parts.length > 0 && rest !== "" && readLeadingNumber(rest).ok && parts[parts.length - 1].rank < 2) {
    return { ok: false, fault: `has '${rest}' with no ′ or ″ after it`, advice: ADVICE };
  }
  if (parts.length < 2 || rest !== "") return undefined;
  const isNegative = MINUS_SIGNS.includes(parts[0].text[0] ?? "");
  let totalArcsec = 0;
  for (const [position, part] of parts.entries()) {
    if (position > 0 && part.rank <= parts[position - 1].rank) return { ok: false, fault: "has its degrees, arcminutes and arcseconds out of order", advice: ADVICE };
    const unsigned = position === 0 && (isNegative || part.text[0] === "+") ? part.text.slice(1).trim() : part.text;
    const number = readLeadingNumber(unsigned);
    if (!number.ok || number.length !== unsigned.length || !(number.value >= 0)) return { ok: false, fault: `has '${part.text}' where a number of ${["degrees", "arcminutes", "arcseconds"][part.rank]} goes`, advice: ADVICE };
    if (position > 0 && number.value >= 60) return { ok: false, fault: "has arcminutes or arcseconds of 60 or more", advice: ADVICE };
    if (position < parts.length - 1 && !Number.isInteger(number.value)) return { ok: false, fault: "has a fraction before its last part", advice: ADVICE };
    totalArcsec += number.value * ARCSEC_PER_RANK[part.rank];
  }
  const degrees = totalArcsec / 3600;
  return { ok: true, degrees: isNegative ? -degrees : degrees };
}
