/**
 * One writer per data format for any table the product exports (targets, the data behind a figure):
 * CSV (RFC 4180), ECSV 1.0 and VOTable 1.4 TABLEDATA, each written by a library (papaparse, yaml,
 * fast-xml-parser's builder), never by string concatenation.
 */
import { XMLBuilder } from "fast-xml-parser";
import Papa from "papaparse";
import { Document, isMap, isSeq, visit } from "yaml";
import type { Provenance } from "@/lib/exports/provenance";
import { roundToSignificant } from "@/lib/numbers/significant";
import { xmlCharacters } from "./xml";

export interface DataColumn {
  /** Machine name: VOTable FIELD name, ECSV/CSV header. */
  name: string;
  /** Words, for descriptions and captions. */
  label: string;
  /** Unit as a reader sees it; "" for none. */
  unit: string;
  /** IVOA VOUnits 1.0 string; "" for none. */
  voUnit: string;
  /** IVOA UCD1+ word(s). */
  ucd: string;
  kind: "double" | "int" | "text";
  description: string;
  /** Significant digits a double is written with; undefined: written as stored (shortest form that round-trips). */
  digits?: number;
}

/** A cell: a number, a text, or nothing (null; NaN in a double column is nothing too). */
export type DataCell = number | string | null;

export interface DataTable {
  /** Table name (VOTable TABLE name, ECSV table meta). */
  name: string;
  /** One line saying what the table holds. */
  title: string;
  columns: DataColumn[];
  rows: DataCell[][];
  provenance: Provenance;
}

/** "Einstein radius [mas]": a column's label with its unit, as a reader sees it in a header. */
export function headerOf(column: Pick<DataColumn, "label" | "unit">): string {
  return column.unit === "" ? column.label : `${column.label} [${column.unit}]`;
}

/**
 * A cell as the data formats hold it: a double at its column's significant digits, NaN as nothing,
 * a whole number as it is, a text as it is.
 */
function writtenCell(value: DataCell, column: DataColumn): DataCell {
  if (typeof value !== "number") return value;
  if (Number.isNaN(value)) return null;
  if (column.kind === "double" && column.digits !== undefined && Number.isFinite(value)) return roundToSignificant(value, column.digits);
  return value;
}

const writtenRows = (t: DataTable): DataCell[][] => t.rows.map((row) => t.columns.map((column, i) => writtenCell(row[i] ?? null, column)));

// papaparse's own guard pattern (`^[=+\-@\t\r].*$`) fails on a formula followed by a line break,
// since `.` stops there; the lead character alone decides. A text that is a signed sexagesimal or
// decimal number and nothing else ("-29:00:28.17") calls nothing and is written as it is, so table
// readers parse it (our rule, within OWASP's aim: formulas, not signed numbers).
const FORMULA_LEAD = /^(?![+-]\d+(?::\d+){0,2}(?:\.\d+)?$)[=+\-@\t\r]/;

/** Quotes a text starting with #, which astropy's CSV and ECSV readers take for a comment line when it opens a row. */
export const quoteCommentLike = (value: unknown): boolean => typeof value === "string" && value.startsWith("#");

export interface CsvOptions {
  /** What the header row says: each column's machine `name` (the default) or its label with its unit ("Einstein radius [mas]"). */
  header?: "name" | "label";
}

/**
 * The table as plain CSV (RFC 4180: the header row first, CRLF line ends, quoted fields where
 * needed), as spreadsheets and astropy's and STILTS's CSV readers take it, written by papaparse.
 * The body holds the table alone (no comment lines, which break those readers); the ECSV carries
 * units and provenance inside the file. papaparse's formula guard is on: a text cell starting with
 * = + - @ tab or CR gets a leading apostrophe (OWASP CSV injection), while numbers, which a
 * spreadsheet reads as numbers, are written as they are. An empty field is a cell with no value.
 */
export function dataTableCsv(t: DataTable, { header = "name" }: CsvOptions = {}): string {
  const fields = t.columns.map((column) => (header === "name" ? column.name : headerOf(column)));
  return `${Papa.unparse({ fields, data: writtenRows(t) }, { newline: "\r\n", escapeFormulae: FORMULA_LEAD, quotes: quoteCommentLike })}\r\n`;
}

/** ECSV's name for each column kind (ECSV 1.0 allowed datatypes, APE6 as revised 2021). */
const ecsvDatatypes = { double: "float64", int: "int64", text: "string" } as const;

function ecsvColumnOf(column: DataColumn) {
  return {
    name: column.name,
    // VOUnit strings (solMass, mas/yr, uarcsec) parse as astropy units.
    ...(column.voUnit !== "" ? { unit: column.voUnit } : {}),
    datatype: ecsvDatatypes[column.kind],
    description: column.description,
    meta: { ucd: column.ucd },
  };
}

/**
 * The YAML header: `datatype` (one line per column), the comma delimiter and the provenance as
 * `meta`. Written as YAML 1.1, the version astropy's and STILTS's loaders read, so a text such as
 * "no" or an ISO time is quoted and comes back as the same text, not a boolean or a date.
 */
function ecsvHeaderOf(t: DataTable): string {
  const header = new Document({ datatype: t.columns.map(ecsvColumnOf), delimiter: ",", meta: t.provenance }, { version: "1.1" });
  const columns = header.get("datatype");
  if (isSeq(columns)) for (const item of columns.items) if (isMap(item)) item.flow = true;
  // STILTS 3.4 reads the header's bytes as Latin-1, and its YAML parser then refuses a character
  // whose UTF-8 bytes fall in 0x80–0x9F (U+2212 in "HE 0435−1223", en dashes, Ś): every text with a
  // character outside ASCII is written double-quoted, where YAML spells it as an escape (YAML 1.1, escape sequences).
  visit(header, {
    Scalar(_, node) {
      if (typeof node.value === "string" && NON_ASCII.test(node.value)) node.type = "QUOTE_DOUBLE";
    },
  });
  return header.toString({ lineWidth: 0 }).replace(NON_ASCII_ALL, yamlEscape);
}

const NON_ASCII = /[^\x00-\x7F]/;
const NON_ASCII_ALL = /[^\x00-\x7F]/gu;

/** A character as a YAML double-quoted escape: \uXXXX, or \UXXXXXXXX beyond the Basic Multilingual Plane. */
function yamlEscape(character: string): string {
  const codePoint = character.codePointAt(0)!;
  return codePoint > 0xffff ? `\\U${codePoint.toString(16).toUpperCase().padStart(8, "0")}` : `\\u${codePoint.toString(16).toUpperCase().padStart(4, "0")}`;
}

/**
 * The table as ECSV 1.0 (Astropy's Enhanced Character Separated Values, APE6): a `# `-prefixed YAML
 * header giving each column's name, unit, datatype, description and UCD and the provenance as the
 * table's meta, then the table as comma-separated values, header row first (written by papaparse).
 * astropy and STILTS read it with its units and provenance; any CSV reader reads its body. Text is
 * written exactly as stored: unlike the plain CSV, no apostrophe guards a formula-like cell, since
 * the file is for table tools and must read back the same. An empty field is a cell with no value.
 */
export function dataTableEcsv(t: DataTable): string {
  const yamlLines = ecsvHeaderOf(t).trimEnd().split("\n");
  const body = Papa.unparse({ fields: t.columns.map((column) => column.name), data: writtenRows(t) }, { newline: "\n", quotes: quoteCommentLike });
  return ["# %ECSV 1.0", "# ---", ...yamlLines.map((line) => `# ${line}`), body, ""].join("\n");
}

/** VOTable 1.4 keeps the 1.3 namespace (IVOA VOTable 1.4 Recommendation, 2019-10-21, §1). */
export const VOTABLE_NAMESPACE = "http://www.ivoa.net/xml/VOTable/v1.3";

export interface VotableOptions {
  /** Names of the columns whose positions are ICRS (RA, Dec): their FIELDs refer to a COOSYS of system ICRS. */
  icrsColumns?: readonly string[];
}

/** The COOSYS ID the ICRS columns refer to. */
const ICRS_ID = "icrs";

/** The VALUES/@null of a whole-number column with missing cells: the least 64-bit integer. */
const LONG_NULL = "-9223372036854775808";

const isAscii = (text: string) => /^[\x20-\x7E]*$/.test(text);

/** A double as TABLEDATA writes it (VOTable 1.4 §6: NaN, +Inf, -Inf; an empty cell is null). */
function tableDataText(value: DataCell): string {
  if (value === null) return "";
  if (value === Infinity) return "+Inf";
  if (value === -Infinity) return "-Inf";
  return xmlCharacters(String(value));
}

function fieldOf(column: DataColumn, index: number, rows: DataCell[][], icrsColumns: readonly string[]) {
  const field: Record<string, string | object> = { "@_name": column.name };
  if (column.kind === "double") {
    field["@_datatype"] = "double";
    // A bare number (or F) would be decimal places (VOTable 1.4 §4.2): a reader rewriting the file,
    // astropy among them, then prints 1.752e-11 d as 0.0000. E<n> is significant figures; a value
    // written as stored has no precision to declare.
    if (column.digits !== undefined) field["@_precision"] = `E${column.digits}`;
  } else if (column.kind === "int") field["@_datatype"] = "long";
  else {
    // "char" is for ASCII; a column holding other characters is declared unicodeChar (VOTable 1.4 §2.1).
    const isAllAscii = rows.every((row) => isAscii(String(row[index] ?? "")));
    field["@_datatype"] = isAllAscii ? "char" : "unicodeChar";
    field["@_arraysize"] = "*";
  }
  if (column.voUnit !== "") field["@_unit"] = column.voUnit;
  field["@_ucd"] = column.ucd;
  if (icrsColumns.includes(column.name)) field["@_ref"] = ICRS_ID;
  field.DESCRIPTION = xmlCharacters(column.description);
  // An empty TD is null in TABLEDATA, but a reader rewriting the file as BINARY or BINARY2, astropy
  // among them, needs a null value for a whole-number column with missing cells (after DESCRIPTION:
  // the schema's order).
  if (column.kind === "int" && rows.some((row) => row[index] === null)) field.VALUES = { "@_null": LONG_NULL };
  return field;
}

/**
 * The provenance as INFO elements, whatever fields it has: a value per leaf, named by its path
 * (`cosmology.H0KmPerSPerMpc`, `inputs.site`); an element of a list is named by its own `name` when
 * it has one (`constants.GM_sun.value`), else by its position. Numbers are written in their shortest
 * form that reads back the same, so nothing is lost.
 */
function provenanceInfos(node: unknown, path: string): { "@_name": string; "@_value": string }[] {
  if (Array.isArray(node)) {
    return node.flatMap((item, index) => {
      const named = typeof item === "object" && item !== null && typeof (item as Record<string, unknown>).name === "string";
      if (!named) return provenanceInfos(item, `${path}.${index}`);
      const { name, ...rest } = item as Record<string, unknown>;
      return provenanceInfos(rest, `${path}.${String(name).replace(/\s+/g, "_")}`);
    });
  }
  if (typeof node === "object" && node !== null) {
    return Object.entries(node).flatMap(([key, value]) => provenanceInfos(value, path === "" ? key : `${path}.${key}`));
  }
  return [{ "@_name": path, "@_value": xmlCharacters(node === null || node === undefined ? "" : String(node)) }];
}

const votableBuilder = new XMLBuilder({
  ignoreAttributes: false,
  attributeNamePrefix: "@_",
  format: true,
  indentBy: "  ",
  suppressEmptyNode: false,
  // An INFO value "true" or "" is an attribute value like any other, never a bare attribute name.
  suppressBooleanAttributes: false,
  processEntities: true,
});

/**
 * The table as an IVOA VOTable 1.4 document (TABLEDATA serialization), written with fast-xml-parser's
 * builder: one FIELD per column with its datatype, VOUnit, UCD and description; positions through a
 * COOSYS (`icrsColumns`); the provenance as INFO elements of the RESOURCE (`provenanceInfos`). A cell
 * with no value is an empty TD (null, VOTable 1.4 §6); `precision="E<n>"` states the significant
 * digits of a rounded column. Text is declared char when ASCII, else unicodeChar.
 */
export function dataTableVotable(t: DataTable, { icrsColumns = [] }: VotableOptions = {}): string {
  const rows = writtenRows(t);
  const usesIcrs = t.columns.some((column) => icrsColumns.includes(column.name));
  const document = {
    "?xml": { "@_version": "1.0", "@_encoding": "UTF-8" },
    VOTABLE: {
      "@_version": "1.4",
      "@_xmlns": VOTABLE_NAMESPACE,
      "@_xmlns:xsi": "http://www.w3.org/2001/XMLSchema-instance",
      "@_xsi:schemaLocation": `${VOTABLE_NAMESPACE} http://www.ivoa.net/xml/VOTable/votable-1.4.xsd`,
      ...(usesIcrs ? { COOSYS: { "@_ID": ICRS_ID, "@_system": "ICRS" } } : {}),
      RESOURCE: {
        "@_type": "results",
        DESCRIPTION: xmlCharacters(t.provenance.subject),
        INFO: provenanceInfos(t.provenance, ""),
        TABLE: {
          "@_name": t.name,
          "@_nrows": String(rows.length),
          DESCRIPTION: xmlCharacters(t.title),
          FIELD: t.columns.map((column, index) => fieldOf(column, index, rows, icrsColumns)),
          DATA: { TABLEDATA: { TR: rows.map((row) => ({ TD: row.map(tableDataText) })) } },
        },
      },
    },
  };
  return votableBuilder.build(document);
}
