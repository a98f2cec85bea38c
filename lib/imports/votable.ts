import { XMLParser, XMLValidator } from "fast-xml-parser";
import { AppError } from "@/lib/errors";
import type { ImportColumn, ImportRow, ImportTable } from "@/lib/imports/import-table";
import { MAX_IMPORT_ROWS, TooManyRowsError } from "@/lib/imports/limits";
import { decodeBinaryStream, type BinaryField } from "@/lib/imports/votable-binary";

const importError = (message: string) => new AppError("bad_request:import", message);

// A DOCTYPE is how an XML file declares entities: the "billion laughs" bomb and external entities
// that read local files or URLs both need one. A VOTable never needs a DTD (IVOA VOTable 1.4 is
// defined by an XML Schema), so any declaration refuses the file before a parser sees it.
const DECLARATION = /<!(?:DOCTYPE|ENTITY)/i;

// The five predefined entities and character references (XML 1.0 §4.1, §4.6) are escapes of single
// characters, not expansions; the parser leaves them alone (processEntities: false), we decode them.
const REFERENCE = /&(?:#(\d{1,7})|#x([0-9a-f]{1,6})|(lt|gt|amp|quot|apos));/gi;
const PREDEFINED: Record<string, string> = { lt: "<", gt: ">", amp: "&", quot: '"', apos: "'" };

function decodeReferences(text: string): string {
  return text.replace(REFERENCE, (whole, decimal: string | undefined, hex: string | undefined, name: string | undefined) => {
    if (name !== undefined) return PREDEFINED[name.toLowerCase()];
    const codePoint = decimal !== undefined ? Number(decimal) : parseInt(hex!, 16);
    return codePoint <= 0x10ffff ? String.fromCodePoint(codePoint) : whole;
  });
}

// How deeply elements may nest, the root counted as level 1. A VOTable's own structure is a handful of levels (VOTABLE > RESOURCE >
// TABLE > DATA > TABLEDATA > TR > TD) plus nested RESOURCEs and GROUPs; 64 leaves ample room while a
// file of nothing but nested tags is refused before it costs the parser (or `tablesIn`) anything.
export const MAX_VOTABLE_DEPTH = 64;

const parser = new XMLParser({
  // The parser counts the levels below the root element.
  maxNestedTags: MAX_VOTABLE_DEPTH - 1,
  ignoreAttributes: false,
  attributeNamePrefix: "@_",
  removeNSPrefix: true,
  processEntities: false,
  parseTagValue: false,
  parseAttributeValue: false,
  trimValues: false,
  isArray: (name) => ["RESOURCE", "TABLE", "FIELD", "TR", "TD"].includes(name),
});

type XmlNode = Record<string, unknown>;

const asNodes = (value: unknown): XmlNode[] => (Array.isArray(value) ? value.filter((v): v is XmlNode => typeof v === "object" && v !== null) : []);

function attribute(node: XmlNode, name: string): string | undefined {
  const value = node[`@_${name}`];
  return typeof value === "string" ? decodeReferences(value) : undefined;
}

/** Every TABLE, depth first, in RESOURCEs nested to any depth (IVOA VOTable 1.4 §3.1). */
function tablesIn(resources: XmlNode[]): XmlNode[] {
  return resources.flatMap((resource) => [...asNodes(resource.TABLE), ...tablesIn(asNodes(resource.RESOURCE))]);
}

function cellText(td: unknown): string {
  if (typeof td === "string") return decodeReferences(td);
  if (typeof td === "object" && td !== null && typeof (td as XmlNode)["#text"] === "string") return decodeReferences((td as XmlNode)["#text"] as string);
  return "";
}

/** The rows of a TABLEDATA element, each cell as written; a cell equal to its FIELD's VALUES/@null is empty (§4.5). */
function tableDataRows(tableData: XmlNode, nullValues: (string | undefined)[]): string[][] {
  const trs = asNodes(tableData.TR);
  if (trs.length > MAX_IMPORT_ROWS) {
    throw new TooManyRowsError();
  }
  return trs.map((tr) =>
    (Array.isArray(tr.TD) ? tr.TD : []).map((td, column) => {
      const value = cellText(td);
      return nullValues[column] !== undefined && value.trim() === nullValues[column] ? "" : value;
    }),
  );
}

/** The base64 text of a BINARY or BINARY2 element's inline STREAM (§5); a STREAM elsewhere (href) or compressed is refused. */
function streamText(serialization: XmlNode, name: string): string {
  const stream = serialization.STREAM;
  if (typeof stream === "string") return stream;
  if (typeof stream !== "object" || stream === null || Array.isArray(stream)) throw importError(`The VOTable's ${name} data hold no STREAM.`);
  const node = stream as XmlNode;
  if (attribute(node, "href") !== undefined) throw importError(`The VOTable's ${name} data are in another file (a STREAM with href); export the table with its data inside the file.`);
  const encoding = attribute(node, "encoding")?.trim();
  if (encoding !== undefined && encoding !== "base64") throw importError(`The VOTable's ${name} data are encoded as "${encoding}"; export them as base64 or TABLEDATA.`);
  return typeof node["#text"] === "string" ? node["#text"] : "";
}

/**
 * Reads a VOTable target list (IVOA VOTable 1.4): the one TABLE it holds, its FIELDs as columns (with
 * `unit` and `ucd`) and its rows, from TABLEDATA or from a base64 BINARY or BINARY2 stream
 * (`decodeBinaryStream`). A cell equal to its FIELD's VALUES/@null is read as empty (§4.5).
 * Refused with a clear message: a DOCTYPE or ENTITY declaration, malformed XML, elements nested
 * more than MAX_VOTABLE_DEPTH deep, a root other than VOTABLE, more than one table, the FITS
 * serialization, no rows, or too many rows.
 */
export function parseVoTable(text: string): ImportTable {
  if (DECLARATION.test(text)) {
    throw importError("The XML file declares a DOCTYPE or entities, which a VOTable never needs; it is refused for safety. Export the table again without a DTD.");
  }
  const validation = XMLValidator.validate(text);
  if (validation !== true) {
    throw importError(`The XML is malformed at line ${validation.err.line}, column ${validation.err.col}: ${validation.err.msg}`);
  }
  let document: XmlNode;
  try {
    document = parser.parse(text) as XmlNode;
  } catch (error) {
    // The validator accepted the XML; the parser's own refusal is its nesting bound (its message is
    // fast-xml-parser's "Maximum nested tags exceeded", never shown).
    if (error instanceof Error && /nested/i.test(error.message)) {
      throw importError(`The XML nests its elements more than ${MAX_VOTABLE_DEPTH} levels deep, far more than a VOTable needs; it is refused. Export the table again.`);
    }
    throw importError("The XML file could not be read as a VOTable. Export the table again.");
  }
  const root = document.VOTABLE;
  if (typeof root !== "object" || root === null) throw importError("The XML file is not a VOTable (its root element is not VOTABLE).");
  const tables = tablesIn(asNodes((root as XmlNode).RESOURCE));
  if (tables.length === 0) throw importError("The VOTable holds no TABLE.");
  if (tables.length > 1) throw importError(`The VOTable holds ${tables.length} tables; import one table per file.`);
  const table = tables[0];

  const fields = asNodes(table.FIELD);
  if (fields.length === 0) throw importError("The VOTable's TABLE declares no FIELD.");
  const nullValues = fields.map((field) => {
    const values = field.VALUES;
    return typeof values === "object" && values !== null ? attribute(values as XmlNode, "null") : undefined;
  });
  const columns: ImportColumn[] = fields.map((field, index) => ({
    name: attribute(field, "name")?.trim() || attribute(field, "ID")?.trim() || `column ${index + 1}`,
    ...(attribute(field, "unit") ? { unit: attribute(field, "unit") } : {}),
    ...(attribute(field, "ucd") ? { ucd: attribute(field, "ucd") } : {}),
  }));

  const data = (typeof table.DATA === "object" && table.DATA !== null ? table.DATA : {}) as XmlNode;
  if ("FITS" in data) throw importError("The VOTable's data are in FITS serialization; export it with TABLEDATA, BINARY or BINARY2.");
  const binaryName = (["BINARY2", "BINARY"] as const).find((name) => name in data);
  let cells: string[][];
  if (binaryName !== undefined) {
    const serialization = (typeof data[binaryName] === "object" && data[binaryName] !== null ? data[binaryName] : {}) as XmlNode;
    const binaryFields: BinaryField[] = fields.map((field, index) => ({
      name: columns[index].name,
      datatype: attribute(field, "datatype"),
      arraysize: attribute(field, "arraysize"),
      nullValue: nullValues[index],
    }));
    cells = decodeBinaryStream(decodeReferences(streamText(serialization, binaryName)), binaryFields, binaryName === "BINARY2");
  } else {
    cells = tableDataRows((typeof data.TABLEDATA === "object" && data.TABLEDATA !== null ? data.TABLEDATA : {}) as XmlNode, nullValues);
  }
  if (cells.length === 0) throw importError("The VOTable has its columns but no data rows.");
  const rows: ImportRow[] = cells.map((row, index) => ({ rowNumber: index + 1, cells: row }));
  return { format: "votable", columns, rows };
}
