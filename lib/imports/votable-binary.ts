/**
 * The BINARY and BINARY2 serializations of a VOTable's data (IVOA VOTable 1.4 Recommendation,
 * 2019-10-21, §5): a base64 STREAM of rows, each the fields in order, every value big-endian; an
 * array of fixed size is its items in turn, one of variable size (`*`, `n*`) a 4-byte item count
 * first. BINARY2 opens each row with one null flag per field, most significant bit first (§5.2);
 * BINARY marks a null by the FIELD's VALUES/@null, NaN or an empty text (§5.1). Each cell becomes
 * the text TABLEDATA would hold, so the rest of the import reads both the same.
 */
import { AppError } from "@/lib/errors";
import { MAX_IMPORT_ROWS, TooManyRowsError } from "@/lib/imports/limits";

const importError = (message: string) => new AppError("bad_request:import", message);

/** What decoding needs of a FIELD. */
export interface BinaryField {
  /** The column as the user sees it, for messages. */
  name: string;
  datatype: string | undefined;
  arraysize: string | undefined;
  /** VALUES/@null: a value meaning "no value" for an integer column. */
  nullValue: string | undefined;
}

/** Bytes per item of each VOTable datatype the import reads (§2.1); bit arrays are packed separately. */
const ITEM_BYTES: Record<string, number> = {
  boolean: 1,
  unsignedByte: 1,
  short: 2,
  int: 4,
  long: 8,
  char: 1,
  unicodeChar: 2,
  float: 4,
  double: 8,
};

/** The bytes of a fixed array, or a variable one's item count prefix and its bound. */
type Shape = { isVariable: false; items: number } | { isVariable: true; maxItems: number | undefined };

/** A FIELD ready to decode: its item reader and array shape. */
interface FieldReader {
  field: BinaryField;
  datatype: string;
  shape: Shape;
}

// arraysize (§2.2): dimensions separated by "x", the last of which may be "*" or "n*"; absent means one item.
const ARRAYSIZE = /^(?:\d+x){0,7}(?:\d+\*?|\*)$/;

function shapeOf(field: BinaryField): Shape {
  const arraysize = field.arraysize?.trim();
  if (arraysize === undefined || arraysize === "") return { isVariable: false, items: 1 };
  if (!ARRAYSIZE.test(arraysize)) throw importError(`Column "${field.name}" gives its array size as "${arraysize}", which is not a VOTable array size (e.g. 8, 2x3 or *).`);
  const dimensions = arraysize.split("x");
  const last = dimensions.at(-1)!;
  if (last.endsWith("*")) {
    if (dimensions.length > 1) {
      throw importError(`Column "${field.name}" is a multi-dimensional array of variable size (${arraysize}), which the import does not read; leave that column out.`);
    }
    return { isVariable: true, maxItems: last === "*" ? undefined : Number(last.slice(0, -1)) };
  }
  return { isVariable: false, items: dimensions.reduce((product, size) => product * Number(size), 1) };
}

function readerOf(field: BinaryField): FieldReader {
  const datatype = field.datatype?.trim() ?? "";
  if (datatype === "") throw importError(`Column "${field.name}" declares no datatype, which binary VOTable data need.`);
  if (!(datatype in ITEM_BYTES) && datatype !== "bit") {
    throw importError(`Column "${field.name}" holds ${datatype} values, which the import does not read; leave that column out or export the table with TABLEDATA.`);
  }
  return { field, datatype, shape: shapeOf(field) };
}

/** The shortest decimal that reads back as the same 32-bit float ("0.1", not 0.10000000149011612). */
function float32Text(value: number): string {
  for (let digits = 1; digits < 9; digits += 1) {
    const text = value.toPrecision(digits);
    if (Math.fround(Number(text)) === value) return String(Number(text));
  }
  return String(value);
}

/** A number as TABLEDATA writes it; NaN (a float's null) as "". */
function numberText(value: number | bigint, isFloat32: boolean): string {
  if (typeof value === "bigint") return value.toString();
  if (Number.isNaN(value)) return "";
  if (value === Infinity) return "+Inf";
  if (value === -Infinity) return "-Inf";
  return isFloat32 ? float32Text(value) : String(value);
}

/** §2.1: T, t or 1 is true; F, f or 0 false; anything else (?, space, NUL) no value. */
function booleanText(byte: number): string {
  const character = String.fromCharCode(byte);
  if ("Tt1".includes(character)) return "true";
  if ("Ff0".includes(character)) return "false";
  return "";
}

/** Reads a STREAM's bytes in order, refusing a read past the end in words naming the row and column. */
class StreamCursor {
  private offset = 0;
  private readonly view: DataView;

  constructor(private readonly bytes: Uint8Array) {
    this.view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  }

  get isAtEnd(): boolean {
    return this.offset >= this.bytes.length;
  }

  /** Takes `length` bytes, or refuses with `where` ("row 3, column \"ra\"") when fewer remain. */
  take(length: number, where: () => string): { view: DataView; at: number; bytes: Uint8Array } {
    if (length > this.bytes.length - this.offset) {
      throw importError(`The VOTable's binary data end in the middle of ${where()}: the file is cut short or its FIELDs do not describe its data. Export the table again.`);
    }
    const at = this.offset;
    this.offset += length;
    return { view: this.view, at, bytes: this.bytes.subarray(at, at + length) };
  }
}

/** One item of a numeric or boolean datatype at byte `at`, as text. */
function itemText(datatype: string, view: DataView, at: number): string {
  switch (datatype) {
    case "boolean":
      return booleanText(view.getUint8(at));
    case "unsignedByte":
      return String(view.getUint8(at));
    case "short":
      return String(view.getInt16(at));
    case "int":
      return String(view.getInt32(at));
    case "long":
      return numberText(view.getBigInt64(at), false);
    case "float":
      return numberText(view.getFloat32(at), true);
    default:
      return numberText(view.getFloat64(at), false);
  }
}

// char is ASCII (§2.1); read as UTF-8, which ASCII is, so a writer that put UTF-8 there loses nothing.
const utf8 = new TextDecoder("utf-8");
// unicodeChar is UCS-2, big-endian: UTF-16BE without surrogate pairs.
const utf16 = new TextDecoder("utf-16be");

/** The text of `bytes` up to its first NUL character (`width` bytes each). */
function textBefore(bytes: Uint8Array, width: 1 | 2, decoder: TextDecoder): string {
  let end = 0;
  while (end + width <= bytes.length && (bytes[end] !== 0 || (width === 2 && bytes[end + 1] !== 0))) end += width;
  return decoder.decode(bytes.subarray(0, end));
}

/** The value of one field in one row, as TABLEDATA text: items separated by spaces, a text as its characters. */
function readCell(reader: FieldReader, cursor: StreamCursor, where: () => string): string {
  const { datatype, shape } = reader;
  let items: number;
  if (shape.isVariable) {
    const { view, at } = cursor.take(4, where);
    items = view.getUint32(at);
    if (shape.maxItems !== undefined && items > shape.maxItems) {
      throw importError(`The VOTable's binary data give ${where()} ${items} items where its FIELD allows at most ${shape.maxItems}. Export the table again.`);
    }
  } else items = shape.items;
  if (datatype === "bit") {
    const { bytes } = cursor.take(Math.ceil(items / 8), where);
    return Array.from({ length: items }, (_, bit) => ((bytes[bit >> 3] >> (7 - (bit & 7))) & 1 ? "1" : "0")).join("");
  }
  const size = ITEM_BYTES[datatype];
  // A count from the file is bounded by the bytes that remain before anything is read or allocated.
  const { view, at, bytes } = cursor.take(items * size, where);
  // A fixed-size text is padded with NULs (§2.1): it ends at the first one.
  if (datatype === "char") return textBefore(bytes, 1, utf8);
  if (datatype === "unicodeChar") return textBefore(bytes, 2, utf16);
  return Array.from({ length: items }, (_, i) => itemText(datatype, view, at + i * size)).join(" ");
}

// White space between base64 characters is allowed (XML Schema base64Binary); it is dropped first.
const BASE64 = /^[A-Za-z0-9+/]*={0,2}$/;

/**
 * The rows of a BINARY (`hasNullFlags` false) or BINARY2 (true) STREAM's base64 text, each cell as
 * TABLEDATA would write it and "" for no value. Refused in words: a STREAM that is not base64 text,
 * a datatype or array size the import does not read (naming the column), data cut short (naming the
 * row and column), no rows, or more than MAX_IMPORT_ROWS rows.
 */
export function decodeBinaryStream(base64: string, fields: BinaryField[], hasNullFlags: boolean): string[][] {
  const readers = fields.map(readerOf);
  const compact = base64.replace(/\s+/g, "");
  if (!BASE64.test(compact)) throw importError("The VOTable's binary data are not base64 text. Export the table again.");
  const cursor = new StreamCursor(Buffer.from(compact, "base64"));
  const flagBytes = hasNullFlags ? Math.ceil(fields.length / 8) : 0;
  const rows: string[][] = [];
  while (!cursor.isAtEnd) {
    if (rows.length === MAX_IMPORT_ROWS) {
      throw new TooManyRowsError();
    }
    const rowNumber = rows.length + 1;
    const flags = cursor.take(flagBytes, () => `row ${rowNumber}`).bytes;
    rows.push(
      readers.map((reader, column) => {
        const text = readCell(reader, cursor, () => `row ${rowNumber}, column "${reader.field.name}"`);
        const isFlaggedNull = hasNullFlags && (flags[column >> 3] & (0x80 >> (column & 7))) !== 0;
        return isFlaggedNull || (reader.field.nullValue !== undefined && text === reader.field.nullValue.trim()) ? "" : text;
      }),
    );
  }
  return rows;
}
