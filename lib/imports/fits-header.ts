import { AppError } from "@/lib/errors";
import { MAX_FITS_CARDS_PER_HDU, MAX_FITS_HDUS } from "@/lib/imports/limits";
import { PLAIN_MANTISSA_SOURCE } from "@/lib/numbers/plain-number";

/** FITS 4.0 §3.1: a file is a sequence of 2880-byte blocks; a header is 80-byte cards, 36 a block. */
export const FITS_BLOCK_BYTES = 2880;
const CARD_BYTES = 80;
const VALID_BITPIX = [8, 16, 32, 64, -32, -64];

export interface FitsKeyword {
  /** Columns 1–8, trimmed (FITS 4.0 §4.1.2.1); "" for a blank keyword; for a HIERARCH card (ESO convention) the words after HIERARCH, e.g. "ESO DET CHIP NAME". */
  key: string;
  /**
   * The value as written in the card (§4.2), e.g. "300.0", "1.5E-07", "T"; for a string, its text
   * without the quotes, '' read as ', trailing spaces dropped (§4.2.1.1) and CONTINUE parts joined
   * (§4.2.1.2); null for commentary or an undefined value.
   */
  text: string | null;
  /** Whether the value is a string (shown in quotes), as against a number, logical or complex value. */
  isString: boolean;
  /** The comment after the "/" of a value card (CONTINUE parts' comments joined), or the text of a commentary card (COMMENT, HISTORY, blank). */
  comment: string;
}

/** PRIMARY for the first HDU, else the XTENSION value (§7: IMAGE, TABLE, BINTABLE; others as written). */
export type FitsHduType = string;

export interface FitsHdu {
  type: FitsHduType;
  /** The header's cards in order, at most MAX_FITS_CARDS_PER_HDU of them. */
  keywords: FitsKeyword[];
  /** How many cards past MAX_FITS_CARDS_PER_HDU were read but not kept. */
  omittedCards: number;
  /** BITPIX: bits per data value; negative for IEEE floating point (§4.4.1.1, Table 8). */
  bitpix: number;
  /** NAXIS1, NAXIS2, ...: the length of each axis. */
  axes: number[];
  /** The header's size in bytes, a whole number of blocks. */
  headerBytes: number;
  /** The data's size in bytes before padding: |BITPIX|/8 × GCOUNT × (PCOUNT + ΠNAXISn) (§4.4.1.1 eq. 1, §4.4.1.2 eq. 2). */
  dataBytes: number;
}

export interface FitsHeader {
  /** The primary HDU then each extension, at most MAX_FITS_HDUS. */
  hdus: FitsHdu[];
  /** Whether reading stopped at MAX_FITS_HDUS with more of the file left. */
  hasMoreHdus: boolean;
  /** Whether the file is shorter than its last listed header plus data say it is. */
  isTruncated: boolean;
}

const fitsError = (message: string) => new AppError("bad_request:attachment", `The FITS file's header is not valid: ${message}`);

/** A string value (§4.2.1.1): between single quotes, '' for a quote. Returns the text with trailing spaces kept. */
function readString(field: string): { value: string; rest: string } {
  let value = "";
  for (let i = 1; i < field.length; i += 1) {
    if (field[i] === "'") {
      if (field[i + 1] === "'") {
        value += "'";
        i += 1;
        continue;
      }
      return { value, rest: field.slice(i + 1) };
    }
    value += field[i];
  }
  throw new Error("a string value has no closing quote");
}

// Trailing spaces are not significant (§4.2.1.1); the look-behind starts a match only at the first of
// them, so a long run of inner spaces is not rescanned from each of its positions.
const trimTrailingSpaces = (text: string) => text.replace(/(?<! ) +$/, "");

const INTEGER = /^[+-]?\d+$/;
// Real numbers may use D for the exponent (§4.2.4).
const REAL = new RegExp(String.raw`^[+-]?${PLAIN_MANTISSA_SOURCE}(?:[ED][+-]?\d+)?$`, "i");

function checkValueText(text: string): void {
  if (text === "" || text === "T" || text === "F" || INTEGER.test(text) || REAL.test(text) || /^\(.*\)$/.test(text)) return;
  throw new Error(`the value ${text} is not a FITS value`);
}

interface ValueField {
  text: string | null;
  isString: boolean;
  comment: string;
}

/** The value and comment after the value indicator (§4.1.2.3). */
function readValueField(field: string): ValueField {
  const trimmed = field.trimStart();
  if (trimmed.startsWith("'")) {
    const { value, rest } = readString(trimmed);
    return { text: value, isString: true, comment: rest.replace(/^\s*\/?/, "").trim() };
  }
  const slash = trimmed.indexOf("/");
  const text = (slash < 0 ? trimmed : trimmed.slice(0, slash)).trim();
  checkValueText(text);
  return { text: text === "" ? null : text, isString: false, comment: slash < 0 ? "" : trimmed.slice(slash + 1).trim() };
}

/**
 * One 80-character card. `= ` in columns 9–10 makes a value card (§4.1.2.2); "HIERARCH " opens an
 * ESO hierarchical keyword whose name runs to the first "="; anything else is commentary.
 */
function readCard(card: string): FitsKeyword {
  // Split at the first "=" by position (no regular expression: a card of spaces must not backtrack).
  const equals = card.startsWith("HIERARCH ") ? card.indexOf("=") : -1;
  if (equals > 0) return { key: card.slice(9, equals).trim(), ...readValueField(card.slice(equals + 1)) };
  const key = card.slice(0, 8).trimEnd();
  if (!/^[A-Z0-9_-]*$/.test(key)) throw new Error(`the keyword "${key}" has characters other than A–Z, 0–9, - and _`);
  if (card.slice(8, 10) !== "= ") return { key, text: null, isString: false, comment: card.slice(8).trim() };
  return { key, ...readValueField(card.slice(10)) };
}

/**
 * Appends a CONTINUE card to the long string before it (§4.2.1.2): the string ends in "&", the
 * CONTINUE card holds the next part as a string in columns 11–80. Returns false if the card is
 * not such a continuation.
 */
function continueString(previous: FitsKeyword | undefined, card: string): boolean {
  if (!previous?.isString || previous.text === null || !card.startsWith("CONTINUE  ")) return false;
  const before = trimTrailingSpaces(previous.text);
  if (!before.endsWith("&")) return false;
  const field = card.slice(10).trimStart();
  if (!field.startsWith("'")) return false;
  const { value, rest } = readString(field);
  const comment = rest.replace(/^\s*\/?/, "").trim();
  previous.text = before.slice(0, -1) + value;
  if (comment) previous.comment = previous.comment ? `${previous.comment} ${comment}` : comment;
  return true;
}

function integerKeyword(keywords: Map<string, FitsKeyword>, key: string, minimum: number, fallback?: number): number {
  const text = keywords.get(key)?.text;
  const value = text === undefined || text === null ? fallback : INTEGER.test(text) ? Number(text) : text;
  if (typeof value !== "number" || !Number.isSafeInteger(value) || value < minimum) {
    throw fitsError(`${key} must be an integer ≥ ${minimum}${value === undefined ? " and is missing" : ` (got ${String(value)})`}.`);
  }
  return value;
}

/** Reads the header at `start` up to END; throws on the first card that does not read. */
function readHeader(bytes: Uint8Array, start: number, hduNumber: number): { keywords: FitsKeyword[]; omittedCards: number; headerBytes: number } {
  const keywords: FitsKeyword[] = [];
  let omittedCards = 0;
  let last: FitsKeyword | undefined;
  const where = (cardNumber: number) => (hduNumber === 1 ? `card ${cardNumber}` : `HDU ${hduNumber}, card ${cardNumber}`);
  for (let offset = start; offset + CARD_BYTES <= bytes.length; offset += CARD_BYTES) {
    const raw = bytes.subarray(offset, offset + CARD_BYTES);
    const cardNumber = (offset - start) / CARD_BYTES + 1;
    // A header holds only printable ASCII, 0x20–0x7E (§4.1.1).
    if (raw.some((byte) => byte < 0x20 || byte > 0x7e)) throw fitsError(`${where(cardNumber)} holds a byte outside printable ASCII.`);
    const card = String.fromCharCode(...raw);
    if (/^END {77}$/.test(card)) {
      for (const keyword of keywords) if (keyword.isString && keyword.text !== null) keyword.text = trimTrailingSpaces(keyword.text);
      const headerBytes = Math.ceil((cardNumber * CARD_BYTES) / FITS_BLOCK_BYTES) * FITS_BLOCK_BYTES;
      return { keywords, omittedCards, headerBytes };
    }
    try {
      if (continueString(last, card)) continue;
      last = readCard(card);
      if (keywords.length < MAX_FITS_CARDS_PER_HDU) keywords.push(last);
      else omittedCards += 1;
    } catch (error) {
      throw fitsError(`${where(cardNumber)}: ${(error as Error).message}.`);
    }
  }
  throw fitsError(hduNumber === 1 ? "it has no END card." : `HDU ${hduNumber} has no END card.`);
}

/** The data size from BITPIX, NAXISn, PCOUNT and GCOUNT (§4.4.1), for the primary HDU (with random groups, §6) or an extension (§7). */
function readDataSize(keywords: FitsKeyword[], isPrimary: boolean): { bitpix: number; axes: number[]; dataBytes: number } {
  const byKey = new Map<string, FitsKeyword>();
  for (const keyword of keywords) if (!byKey.has(keyword.key)) byKey.set(keyword.key, keyword);
  const bitpixText = byKey.get("BITPIX")?.text;
  const bitpix = Number(bitpixText);
  if (!bitpixText || !VALID_BITPIX.includes(bitpix)) {
    throw fitsError(`BITPIX must be one of ${VALID_BITPIX.join(", ")} (got ${bitpixText ?? "none"}).`);
  }
  const naxis = integerKeyword(byKey, "NAXIS", 0);
  if (naxis > 999) throw fitsError(`NAXIS is at most 999 (got ${naxis}).`);
  const axes = Array.from({ length: naxis }, (_, i) => integerKeyword(byKey, `NAXIS${i + 1}`, 0));
  // Random groups (§6): NAXIS1 = 0 and GROUPS = T; the first axis then holds no data.
  const isRandomGroups = isPrimary && naxis > 0 && axes[0] === 0 && byKey.get("GROUPS")?.text === "T";
  const gcount = integerKeyword(byKey, "GCOUNT", 0, 1);
  const pcount = integerKeyword(byKey, "PCOUNT", 0, 0);
  const counted = isRandomGroups ? axes.slice(1) : axes;
  const elements = naxis === 0 ? 0 : counted.reduce((product, length) => product * length, 1);
  const dataBytes = naxis === 0 ? 0 : (Math.abs(bitpix) / 8) * gcount * (pcount + elements);
  if (!Number.isSafeInteger(dataBytes)) throw fitsError("NAXISn declare a data array too large to exist.");
  return { bitpix, axes, dataBytes };
}

const padToBlocks = (bytes: number) => Math.ceil(bytes / FITS_BLOCK_BYTES) * FITS_BLOCK_BYTES;

/**
 * Reads every header of a FITS file (FITS Standard 4.0): the primary HDU and each extension after it,
 * skipping each HDU's data (padded to whole blocks) to find the next header. Stops after
 * MAX_FITS_HDUS HDUs, at the end of the file, at a truncated data unit, or where the next block does
 * not start with XTENSION (trailing special records, §3.5). Throws an AppError
 * (`bad_request:attachment`) naming the first problem.
 */
export function parseFitsHeader(bytes: Uint8Array): FitsHeader {
  if (bytes.length < FITS_BLOCK_BYTES) throw fitsError(`a FITS file is at least one ${FITS_BLOCK_BYTES}-byte block.`);
  const hdus: FitsHdu[] = [];
  let offset = 0;
  while (true) {
    const isPrimary = hdus.length === 0;
    const { keywords, omittedCards, headerBytes } = readHeader(bytes, offset, hdus.length + 1);
    if (isPrimary && (keywords[0]?.key !== "SIMPLE" || keywords[0].text !== "T")) throw fitsError("the first card must be SIMPLE = T.");
    const type = isPrimary ? "PRIMARY" : (keywords[0].text ?? "");
    const hdu: FitsHdu = { type, keywords, omittedCards, ...readDataSize(keywords, isPrimary), headerBytes };
    hdus.push(hdu);
    const dataStart = offset + headerBytes;
    if (bytes.length < dataStart + hdu.dataBytes) return { hdus, hasMoreHdus: false, isTruncated: true };
    offset = dataStart + padToBlocks(hdu.dataBytes);
    const next = String.fromCharCode(...bytes.subarray(offset, offset + 10));
    if (offset + FITS_BLOCK_BYTES > bytes.length || next !== "XTENSION= ") return { hdus, hasMoreHdus: false, isTruncated: false };
    if (hdus.length === MAX_FITS_HDUS) return { hdus, hasMoreHdus: true, isTruncated: false };
  }
}
