import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { proposeColumnMapping } from "@/lib/imports/columns";
import { MAX_IMPORT_ROWS } from "@/lib/imports/limits";
import { readImportFile } from "@/lib/imports/read-import-file";
import { validateImportRows } from "@/lib/imports/rows";
import { parseVoTable } from "@/lib/imports/votable";
import { refusal } from "./refusal";

/** Written by tests/fixtures/generate_import_tables.py (astropy, STILTS); `source` names their versions. */
const FIXTURES = "tests/fixtures/import-tables";
const expected = JSON.parse(readFileSync(`${FIXTURES}/expected.json`, "utf8")) as {
  source: string;
  files: string[];
  rows: Record<string, string | number | null>[];
  nVisitsCells: string[];
  relativeTolerance: Record<string, number>;
};
/** The fixture's keys as the target's fields. */
const fieldOf = (key: string) => ({ raDeg: "ra", decDeg: "dec" })[key] ?? key;

describe(`target lists written by astropy and STILTS import with every row and value (${expected.source})`, () => {
  it.each(expected.files)("%s", (file) => {
    const table = readImportFile(readFileSync(`${FIXTURES}/${file}`));
    expect(table.rows).toHaveLength(expected.rows.length);
    const nVisits = table.columns.findIndex((column) => column.name === "n_visits");
    expect(table.rows.map((row) => row.cells[nVisits])).toEqual(expected.nVisitsCells);
    const preview = validateImportRows(table, proposeColumnMapping(table.columns));
    expect(preview.rows.flatMap((row) => row.errors)).toEqual([]);
    for (const [index, row] of preview.rows.entries()) {
      const target = row.target as Record<string, unknown>;
      for (const [key, value] of Object.entries(expected.rows[index])) {
        const actual = target[fieldOf(key)];
        if (value === null) expect(actual, `${file} row ${index + 1} ${key}`).toBeUndefined();
        else if (typeof value === "string") expect(actual, `${file} row ${index + 1} ${key}`).toBe(value);
        else {
          const tolerance = expected.relativeTolerance[key] ?? expected.relativeTolerance.default;
          expect(Math.abs((actual as number) - value), `${file} row ${index + 1} ${key}: ${String(actual)}`).toBeLessThanOrEqual(tolerance * Math.abs(value));
        }
      }
    }
  });
});

/** A VOTable of `fields` whose data are `stream` (bytes) as BINARY or BINARY2. */
function binaryVotable(fields: string, stream: Uint8Array | string, serialization: "BINARY" | "BINARY2" = "BINARY2"): string {
  const base64 = typeof stream === "string" ? stream : Buffer.from(stream).toString("base64").replace(/(.{60})/g, "$1\n");
  return `<?xml version="1.0"?><VOTABLE version="1.4"><RESOURCE><TABLE>${fields}<DATA><${serialization}><STREAM encoding="base64">\n${base64}\n</STREAM></${serialization}></DATA></TABLE></RESOURCE></VOTABLE>`;
}

/** Big-endian bytes, as VOTable binary data are written (VOTable 1.4 §5.1). */
function bytes(...parts: (number[] | { f64: number } | { f32: number } | { i32: number } | { i16: number } | { i64: bigint })[]): Uint8Array {
  const out: number[] = [];
  for (const part of parts) {
    if (Array.isArray(part)) out.push(...part);
    else {
      const view = new DataView(new ArrayBuffer(8));
      if ("f64" in part) view.setFloat64(0, part.f64);
      else if ("f32" in part) view.setFloat32(0, part.f32);
      else if ("i32" in part) view.setInt32(0, part.i32);
      else if ("i16" in part) view.setInt16(0, part.i16);
      else view.setBigInt64(0, part.i64);
      const size = "f64" in part || "i64" in part ? 8 : "f32" in part || "i32" in part ? 4 : 2;
      out.push(...new Uint8Array(view.buffer).slice(0, size));
    }
  }
  return Uint8Array.from(out);
}

const ascii = (text: string) => [...text].map((c) => c.charCodeAt(0));

describe("BINARY and BINARY2 data (VOTable 1.4 §5)", () => {
  const fields = `<FIELD name="name" datatype="char" arraysize="*"/><FIELD name="ra" datatype="double" unit="deg"/><FIELD name="n" datatype="int"><VALUES null="-1"/></FIELD>`;

  it("BINARY2: leading null flags (most significant bit first) empty a cell; variable text has its 4-byte length first", () => {
    const stream = bytes([0x00], { i32: 2 }, ascii("A1"), { f64: 266.4168 }, { i32: 7 }, [0x40], { i32: 1 }, ascii("B"), { f64: 0 }, { i32: 9 });
    const table = parseVoTable(binaryVotable(fields, stream));
    expect(table.rows).toEqual([
      { rowNumber: 1, cells: ["A1", "266.4168", "7"] },
      { rowNumber: 2, cells: ["B", "", "9"] },
    ]);
  });

  it("BINARY: a null is the FIELD's VALUES/@null for an integer and NaN for a float; fixed text ends at its first NUL", () => {
    const fixed = `<FIELD name="name" datatype="char" arraysize="4"/><FIELD name="ra" datatype="float"/><FIELD name="n" datatype="int"><VALUES null="-1"/></FIELD>`;
    const stream = bytes(ascii("AB"), [0, 0], { f32: Number.NaN }, { i32: -1 }, ascii("WXYZ"), { f32: 0.1 }, { i32: 3 });
    expect(parseVoTable(binaryVotable(fixed, stream, "BINARY")).rows.map((row) => row.cells)).toEqual([
      ["AB", "", ""],
      ["WXYZ", "0.1", "3"],
    ]);
  });

  it("reads every datatype a target list uses: boolean, bit, unsignedByte, short, long, unicodeChar and arrays", () => {
    const all = [
      `<FIELD name="ok" datatype="boolean"/>`,
      `<FIELD name="bits" datatype="bit" arraysize="10"/>`,
      `<FIELD name="byte" datatype="unsignedByte"/>`,
      `<FIELD name="short" datatype="short"/>`,
      `<FIELD name="long" datatype="long"/>`,
      `<FIELD name="label" datatype="unicodeChar" arraysize="*"/>`,
      `<FIELD name="pair" datatype="double" arraysize="2"/>`,
    ].join("");
    const stream = bytes([0x00], ascii("T"), [0b10100000, 0b01000000], [255], { i16: -300 }, { i64: 9007199254740993n }, { i32: 2 }, [0x03, 0xa9, 0x22, 0x12], { f64: 1.5 }, { f64: -2 });
    expect(parseVoTable(binaryVotable(all, stream)).rows[0].cells).toEqual(["true", "1010000001", "255", "-300", "9007199254740993", "Ω−", "1.5 -2"]);
  });

  it("refuses data cut short, naming the row and the column", () => {
    const stream = bytes([0x00], { i32: 1 }, ascii("A"), { f64: 1 }, { i32: 1 }, [0x00], { i32: 5 }, ascii("B"));
    expect(refusal(() => parseVoTable(binaryVotable(fields, stream))).message).toBe(
      'The VOTable\'s binary data end in the middle of row 2, column "name": the file is cut short or its FIELDs do not describe its data. Export the table again.',
    );
  });

  it("refuses a length prefix larger than the data that remain before allocating it (a 4 GB text in a 9-byte stream)", () => {
    const stream = bytes([0x00], [0xff, 0xff, 0xff, 0xff], ascii("AAAA"));
    expect(refusal(() => parseVoTable(binaryVotable(fields, stream))).message).toMatch(/end in the middle of row 1, column "name"/);
  });

  it("refuses a datatype the import does not read and a malformed array size, naming the column", () => {
    const complex = `<FIELD name="visibility" datatype="doubleComplex"/>`;
    expect(refusal(() => parseVoTable(binaryVotable(complex, bytes({ f64: 1 }, { f64: 2 })))).message).toBe(
      'Column "visibility" holds doubleComplex values, which the import does not read; leave that column out or export the table with TABLEDATA.',
    );
    const malformed = `<FIELD name="name" datatype="char" arraysize="**"/>`;
    expect(refusal(() => parseVoTable(binaryVotable(malformed, bytes(ascii("A"))))).message).toMatch(/^Column "name" gives its array size as "\*\*"/);
  });

  it(`refuses more than ${MAX_IMPORT_ROWS.toLocaleString("en-US")} rows while decoding, and a stream that is not base64 or lives in another file`, () => {
    const oneByteRows = `<FIELD name="b" datatype="unsignedByte"/>`;
    expect(refusal(() => parseVoTable(binaryVotable(oneByteRows, new Uint8Array(MAX_IMPORT_ROWS + 1), "BINARY"))).message).toMatch(/more than 10,000 data rows/);
    expect(parseVoTable(binaryVotable(oneByteRows, new Uint8Array(3), "BINARY")).rows).toHaveLength(3);
    expect(refusal(() => parseVoTable(binaryVotable(oneByteRows, "AA$A"))).message).toBe("The VOTable's binary data are not base64 text. Export the table again.");
    const remote = `<VOTABLE><RESOURCE><TABLE>${oneByteRows}<DATA><BINARY><STREAM href="http://example.invalid/x.bin"/></BINARY></DATA></TABLE></RESOURCE></VOTABLE>`;
    expect(refusal(() => parseVoTable(remote)).message).toMatch(/in another file/);
  });
});
