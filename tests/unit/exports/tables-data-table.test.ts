import { XMLParser, XMLValidator } from "fast-xml-parser";
import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { parse as parseYaml } from "yaml";
import { dataTableCsv, dataTableEcsv, dataTableVotable, type DataTable } from "@/lib/exports/tables/data-table";
import { exportProvenance } from "./fixtures";

/** A figure's data as another part of the product writes it: a light curve with a gap, an infinity and a label in Greek. */
const lightCurve: DataTable = {
  name: "light_curve",
  title: "Magnification of TB-ML-0001 through its event",
  columns: [
    { name: "timeJdUtc", label: "Time (JD, UTC)", unit: "d", voUnit: "d", ucd: "time.epoch", kind: "double", description: "Time of the sample" },
    { name: "magnification", label: "Magnification A", unit: "", voUnit: "", ucd: "arith.factor", kind: "double", description: "Total magnification", digits: 3 },
    { name: "visits", label: "Visits", unit: "", voUnit: "", ucd: "meta.number", kind: "int", description: "Visits that night" },
    { name: "note", label: "Note", unit: "", voUnit: "", ucd: "meta.note", kind: "text", description: "θ_E crossing" },
  ],
  rows: [
    [2461571.6875123456, 3.437035, 2, "=peak"],
    [2461572.5, Number.NaN, null, "Ω\u0007 wing"],
    [2461573.5, Number.POSITIVE_INFINITY, 0, null],
  ],
  // A field added to the record later (a bibliography) is written like every other.
  provenance: { ...exportProvenance, references: [{ name: "Paczynski 1986", bibcode: "1986ApJ...304....1P" }] } as unknown as DataTable["provenance"],
};

const parser = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: "", parseTagValue: false, isArray: (name) => ["FIELD", "TR", "TD", "INFO"].includes(name) });

describe("generic data table writers (figure data, target tables)", () => {
  it("CSV: machine names in the header by default, doubles as stored or at their digits, NaN empty, the formula guard on", () => {
    const [header, first, second, third] = Papa.parse<string[]>(dataTableCsv(lightCurve), { skipEmptyLines: true }).data;
    expect(header).toEqual(["timeJdUtc", "magnification", "visits", "note"]);
    expect(first).toEqual(["2461571.6875123456", "3.44", "2", "'=peak"]);
    expect(second).toEqual(["2461572.5", "", "", "Ω\u0007 wing"]);
    expect(third).toEqual(["2461573.5", "Infinity", "0", ""]);
    expect(Papa.parse<string[]>(dataTableCsv(lightCurve, { header: "label" })).data[0]).toEqual(["Time (JD, UTC) [d]", "Magnification A", "Visits", "Note"]);
  });

  it("ECSV: one YAML line per column with unit, datatype, description and UCD; the provenance, new fields included, as meta", () => {
    const ecsv = dataTableEcsv(lightCurve);
    const lines = ecsv.split("\n");
    const firstBodyLine = lines.findIndex((line) => !line.startsWith("#"));
    const header = parseYaml(lines.slice(1, firstBodyLine).map((line) => line.slice(2)).join("\n"), { version: "1.1" }) as Record<string, unknown>;
    expect(header.datatype).toEqual([
      { name: "timeJdUtc", unit: "d", datatype: "float64", description: "Time of the sample", meta: { ucd: "time.epoch" } },
      { name: "magnification", datatype: "float64", description: "Total magnification", meta: { ucd: "arith.factor" } },
      { name: "visits", datatype: "int64", description: "Visits that night", meta: { ucd: "meta.number" } },
      { name: "note", datatype: "string", description: "θ_E crossing", meta: { ucd: "meta.note" } },
    ]);
    expect(header.meta).toEqual(lightCurve.provenance);
    // No apostrophe in ECSV: it is for table tools and reads back the same text.
    expect(lines[firstBodyLine + 1]).toBe("2461571.6875123456,3.44,2,=peak");
  });

  it("VOTable: written by the XML builder, well-formed; precision E<n> only where digits are given; +Inf, empty for null and NaN; unicodeChar for non-ASCII text", () => {
    const xml = dataTableVotable(lightCurve);
    expect(XMLValidator.validate(xml)).toBe(true);
    const doc = parser.parse(xml);
    const table = doc.VOTABLE.RESOURCE.TABLE;
    expect(table.name).toBe("light_curve");
    expect(table.nrows).toBe("3");
    expect(table.DESCRIPTION).toBe(lightCurve.title);
    const fields = table.FIELD as Record<string, string>[];
    expect(fields.map((f) => [f.name, f.datatype, f.precision, f.unit, f.ucd, f.ref])).toEqual([
      ["timeJdUtc", "double", undefined, "d", "time.epoch", undefined],
      ["magnification", "double", "E3", undefined, "arith.factor", undefined],
      ["visits", "long", undefined, undefined, "meta.number", undefined],
      ["note", "unicodeChar", undefined, undefined, "meta.note", undefined],
    ]);
    const rows = (table.DATA.TABLEDATA.TR as { TD: string[] }[]).map((tr) => tr.TD);
    // The BEL character, which XML 1.0 does not allow, is dropped; no COOSYS without positions.
    expect(rows).toEqual([
      ["2461571.6875123456", "3.44", "2", "=peak"],
      ["2461572.5", "", "", "Ω wing"],
      ["2461573.5", "+Inf", "0", ""],
    ]);
    expect(doc.VOTABLE.COOSYS).toBeUndefined();
    // The whole-number column with a missing cell names a null value, after its DESCRIPTION, so astropy can rewrite it as BINARY2.
    expect(fields[2].VALUES).toEqual({ null: "-9223372036854775808" });
    expect(xml.indexOf("<VALUES", xml.indexOf('name="visits"'))).toBeGreaterThan(xml.indexOf("<DESCRIPTION>Visits that night</DESCRIPTION>"));
  });

  it("VOTable: the provenance as INFO elements named by path, whatever fields the record has", () => {
    const infos = Object.fromEntries((parser.parse(dataTableVotable(lightCurve)).VOTABLE.RESOURCE.INFO as Record<string, string>[]).map((i) => [i.name, i.value]));
    expect(infos["references.Paczynski_1986.bibcode"]).toBe("1986ApJ...304....1P");
    expect(infos["constants.Julian_year.value"]).toBe("31557600");
    expect(infos["inputs.site"]).toBe(String(exportProvenance.inputs.site));
    expect(infos["cosmology.source"]).toBe(exportProvenance.cosmology.source);
  });

  it("VOTable: columns named as ICRS positions refer to an ICRS COOSYS", () => {
    const positions: DataTable = {
      ...lightCurve,
      columns: [{ name: "raDeg", label: "RA", unit: "deg", voUnit: "deg", ucd: "pos.eq.ra", kind: "double", description: "RA" }],
      rows: [[266.4]],
    };
    const doc = parser.parse(dataTableVotable(positions, { icrsColumns: ["raDeg"] }));
    expect(doc.VOTABLE.COOSYS).toMatchObject({ ID: "icrs", system: "ICRS" });
    expect(doc.VOTABLE.RESOURCE.TABLE.FIELD[0].ref).toBe("icrs");
  });
});
