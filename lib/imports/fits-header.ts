import { AppError } from "@/lib/errors";

/** FITS 4.0 §3.1: a file is a sequence of 2880-byte blocks; a header is 80-byte cards, 36 a block. */
export const FITS_BLOCK_BYTES = 2880;
const CARD_BYTES = 80;
const VALID_BITPIX = [8, 16, 32, 64, -32, -64];

export interface FitsKeyword {
  /** Columns 1–8, trimmed (FITS 4.0 §4.1.2.1); "" for a blank keyword. */
  key: string;
  /** Parsed per §4.2: text, integer or real number, logical; null for commentary or an undefined value; complex numbers as written. */
  value: string | number | boolean | null;
  /** The comment after the "/" of a value card, or the text of a commentary card (COMMENT, HISTORY, blank). */
  comment: string;
}

export interface FitsHeader {
  keywords: FitsKeyword[];
  /** BITPIX: bits per data value; negative for IEEE floating point (§4.4.1.1, Table 8). */
  bitpix: number;
  /** NAXIS1, NAXIS2, ...: the length of each axis. */
  axes: number[];
  /** The header's size in bytes, a whole number of blocks. */
  headerBytes: number;
  /** The primary data array's size in bytes: |BITPIX|/8 × GCOUNT × (PCOUNT + ΠNAXISn) (§4.4.1.1, eq. 1). */
  dataBytes: number;
  /** Whether the file is shorter than its header plus data say it is. */
  isTruncated: boolean;
}

const fitsError = (message: string) => new AppError("bad_request:attachment", `The FITS file's header is not valid: ${message}`);

/** A string value (§4.2.1.1): between single quotes, '' for a quote, trailing spaces not significant. */
function readString(field: string): { value: string; rest: string } {
  let value = "";
  let i = 1;
  for (; i < field.length; i += 1) {
    if (field[i] === "'") {
      if (field[i + 1] === "'") {
        value += "'";
        i += 1;
        continue;
      }
      // Trailing spaces are not significant (§4.2.1.1); the look-behind starts a match only at the first
      // of them, so a long run of inner spaces is not rescanned from each of its positions.
      return { value: value.replace(/(?<! ) +$/, ""), rest: field.slice(i + 1) };
    }
    value += field[i];
  }
  throw new Error("a string value has no closing quote");
}

function readValue(text: string): string | number | boolean | null {
  if (text === "") return null;
  if (text === "T") return true;
  if (text === "F") return false;
  if (/^[+-]?\d+$/.test(text)) {
    const integer = Number(text);
    return Number.isSafeInteger(integer) ? integer : text;
  }
  // Real numbers may use D for the exponent (§4.2.4).
  if (/^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[ED][+-]?\d+)?$/i.test(text)) return Number(text.replace(/d/i, "e"));
  if (/^\(.*\)$/.test(text)) return text;
  throw new Error(`the value ${text} is not a FITS value`);
}

/** One 80-character card; `= ` in columns 9–10 makes it a value card (§4.1.2.2), else commentary. */
function readCard(card: string): FitsKeyword {
  const key = card.slice(0, 8).trimEnd();
  if (!/^[A-Z0-9_-]*$/.test(key)) throw new Error(`the keyword "${key}" has characters other than A–Z, 0–9, - and _`);
  if (card.slice(8, 10) !== "= ") return { key, value: null, comment: card.slice(8).trim() };
  const field = card.slice(10).trimStart();
  if (field.startsWith("'")) {
    const { value, rest } = readString(field);
    return { key, value, comment: rest.replace(/^\s*\/?/, "").trim() };
  }
  const slash = field.indexOf("/");
  const valueText = (slash < 0 ? field : field.slice(0, slash)).trim();
  return { key, value: readValue(valueText), comment: slash < 0 ? "" : field.slice(slash + 1).trim() };
}

function integerKeyword(keywords: Map<string, FitsKeyword>, key: string, minimum: number, fallback?: number): number {
  const value = keywords.get(key)?.value ?? fallback;
  if (typeof value !== "number" || !Number.isSafeInteger(value) || value < minimum) {
    throw fitsError(`${key} must be an integer ≥ ${minimum}${value === undefined ? " and is missing" : ` (got ${String(value)})`}.`);
  }
  return value;
}

/**
 * Reads the primary header of a FITS file (FITS Standard 4.0): every card up to END as a keyword with
 * its value and comment, and the data size from BITPIX, NAXIS and NAXISn (with GCOUNT/PCOUNT for
 * random groups). Throws an AppError (`bad_request:attachment`) naming the first problem.
 */
export function parseFitsHeader(bytes: Uint8Array): FitsHeader {
  if (bytes.length < FITS_BLOCK_BYTES) throw fitsError(`a FITS file is at least one ${FITS_BLOCK_BYTES}-byte block.`);
  const keywords: FitsKeyword[] = [];
  let endCard = -1;
  for (let offset = 0; offset + CARD_BYTES <= bytes.length; offset += CARD_BYTES) {
    const raw = bytes.subarray(offset, offset + CARD_BYTES);
    const cardNumber = offset / CARD_BYTES + 1;
    // A header holds only printable ASCII, 0x20–0x7E (§4.1.1).
    if (raw.some((byte) => byte < 0x20 || byte > 0x7e)) throw fitsError(`card ${cardNumber} holds a byte outside printable ASCII.`);
    const card = String.fromCharCode(...raw);
    if (/^END {77}$/.test(card)) {
      endCard = cardNumber;
      break;
    }
    try {
      keywords.push(readCard(card));
    } catch (error) {
      throw fitsError(`card ${cardNumber}: ${(error as Error).message}.`);
    }
  }
  if (endCard < 0) throw fitsError("it has no END card.");
  if (keywords[0]?.key !== "SIMPLE" || keywords[0].value !== true) throw fitsError("the first card must be SIMPLE = T.");
  const byKey = new Map<string, FitsKeyword>();
  for (const keyword of keywords) if (!byKey.has(keyword.key)) byKey.set(keyword.key, keyword);
  const bitpix = byKey.get("BITPIX")?.value;
  if (typeof bitpix !== "number" || !VALID_BITPIX.includes(bitpix)) {
    throw fitsError(`BITPIX must be one of ${VALID_BITPIX.join(", ")} (got ${String(bitpix ?? "none")}).`);
  }
  const naxis = integerKeyword(byKey, "NAXIS", 0);
  if (naxis > 999) throw fitsError(`NAXIS is at most 999 (got ${naxis}).`);
  const axes = Array.from({ length: naxis }, (_, i) => integerKeyword(byKey, `NAXIS${i + 1}`, 0));
  // Random groups (§6): NAXIS1 = 0 and GROUPS = T; the first axis then holds no data.
  const isRandomGroups = naxis > 0 && axes[0] === 0 && byKey.get("GROUPS")?.value === true;
  const gcount = integerKeyword(byKey, "GCOUNT", 0, 1);
  const pcount = integerKeyword(byKey, "PCOUNT", 0, 0);
  const counted = isRandomGroups ? axes.slice(1) : axes;
  const elements = naxis === 0 ? 0 : counted.reduce((product, length) => product * length, 1);
  const dataBytes = naxis === 0 ? 0 : (Math.abs(bitpix) / 8) * gcount * (pcount + elements);
  if (!Number.isSafeInteger(dataBytes)) throw fitsError("NAXISn declare a data array too large to exist.");
  const headerBytes = Math.ceil(endCard / (FITS_BLOCK_BYTES / CARD_BYTES)) * FITS_BLOCK_BYTES;
  return { keywords, bitpix, axes, headerBytes, dataBytes, isTruncated: bytes.length < headerBytes + dataBytes };
}
