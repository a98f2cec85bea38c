import { XMLParser, XMLValidator } from "fast-xml-parser";
import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { buildProvenance, exportStampOf, PRODUCT_VERSION, provenanceHeaderValue, type Provenance } from "@/lib/exports/provenance";
import { tableColumnsQuerySchema } from "@/lib/exports/tables/columns";
import { targetTableCsv } from "@/lib/exports/tables/csv";
import { targetTableEcsv } from "@/lib/exports/tables/ecsv";
import { targetTableJson, type TargetTableJson } from "@/lib/exports/tables/json";
import { targetTableLatex } from "@/lib/exports/tables/latex";
import type { TargetTable } from "@/lib/exports/tables/table";
import { VOTABLE_NAMESPACE } from "@/lib/exports/tables/data-table";
import { targetTableVotable } from "@/lib/exports/tables/votable";
import { proposeColumnMapping } from "@/lib/imports/columns";
import { parseCsvTable } from "@/lib/imports/csv";
import { validateImportRows } from "@/lib/imports/rows";
import { parseVoTable } from "@/lib/imports/votable";
import type { TargetView } from "@/lib/workspace/target-view";
import packageJson from "@/package.json";
import { parse as parseYaml } from "yaml";
import { exportProvenance, exportRows } from "./fixtures";
import { bracesBalance } from "./latex-support";

const columns = tableColumnsQuerySchema.parse({
  columns: "name,raDeg,lensModel,einsteinRadiusMas,timeDelayDays,priority,tags,shadowDiameterMicroarcsec",
  digits: "einsteinRadiusMas:3,timeDelayDays:2",
});
const table: TargetTable = { title: "Arcs", columns, rows: exportRows, provenance: exportProvenance };
const hostileName = exportRows[1].name;

describe("export column query", () => {
  it("refuses unknown columns by name and digits outside 1–17 or for columns not chosen", () => {
    const unknown = tableColumnsQuerySchema.safeParse({ columns: "name,einsteinRadius,fooBar" });
    expect(unknown.success).toBe(false);
    expect(unknown.error?.issues[0].message).toContain("einsteinRadius, fooBar");
    expect(unknown.error?.issues[0].path).toEqual(["columns"]);
    expect(tableColumnsQuerySchema.safeParse({ columns: "name,raDeg", digits: "raDeg:0" }).success).toBe(false);
    expect(tableColumnsQuerySchema.safeParse({ columns: "name,raDeg", digits: "raDeg:18" }).success).toBe(false);
    expect(tableColumnsQuerySchema.safeParse({ columns: "name,raDeg", digits: "decDeg:3" }).success).toBe(false);
    expect(tableColumnsQuerySchema.safeParse({ columns: "name,name" }).success).toBe(false);
  });

  it("keeps the requested order, per-column digits over a bare default over the column's own", () => {
    const chosen = tableColumnsQuerySchema.parse({ columns: "einsteinRadiusMas,raDeg,magnificationTotal", digits: "3,raDeg:10" });
    expect(chosen.map((c) => [c.column.key, c.digits])).toEqual([
      ["einsteinRadiusMas", 3],
      ["raDeg", 10],
      ["magnificationTotal", 3],
    ]);
  });
});

describe("CSV export (RFC 4180, read back with papaparse)", () => {
  const csv = targetTableCsv(table);
  const parsed = Papa.parse<string[]>(csv, { skipEmptyLines: true });

  it("round-trips: header with units, numbers at their significant digits, empty where no value", () => {
    expect(parsed.errors).toEqual([]);
    const [header, first, second] = parsed.data;
    expect(header).toEqual(["Name", "RA (ICRS) [deg]", "RA (ICRS) hms", "Lens model", "Einstein radius [mas]", "Time delay [d]", "Priority", "Tags", "Shadow diameter [uas]"]);
    // Inputs as stored (RA to the last digit), computed quantities at their digits; RA also in hours.
    expect(first).toEqual(["TB-ML-0001", "269.301666667", "17:57:12.400", "point", "0.637", "1.2e-7", "2", "bulge; night-1", "0.005218"]);
    expect(second[4]).toBe("1030");
    expect(second[5]).toBe("");
    expect(csv.includes("\r\n")).toBe(true);
  });

  it("neutralizes a formula-like name with a leading apostrophe (OWASP CSV injection) and keeps its text", () => {
    expect(parsed.data[2][0]).toBe(`'${hostileName}`);
  });

  it("guards a formula followed by a line break too (papaparse's own pattern stops at the break)", () => {
    const rows = [{ ...exportRows[0], name: '=HYPERLINK("http://x.invalid")\nsecond line' }];
    const cells = Papa.parse<string[]>(targetTableCsv({ ...table, rows }), { skipEmptyLines: true }).data[1];
    expect(cells[0]).toBe(`'${rows[0].name}`);
  });

  it("quotes a name starting with #, which astropy's reader would drop as a comment line", () => {
    const rows = [{ ...exportRows[0], name: "#3 arc" }];
    expect(targetTableCsv({ ...table, rows }).split("\r\n")[1]).toMatch(/^"#3 arc",/);
  });

  it("is the table alone, header row first: a hostile title in the provenance never reaches a cell (it did through # lines)", () => {
    const hostileTitle = 'Arcs,=HYPERLINK("http://evil.example/?x"),=1+1';
    const provenance = buildProvenance({ subject: `Target table of the proposal "${hostileTitle}" (=1+1)`, reproduceUrl: "http://arcwright.test/proposals/x", inputs: { site: "@SUM(1,2)" } });
    const hostileCsv = targetTableCsv({ ...table, title: hostileTitle, provenance });
    const lines = hostileCsv.split("\r\n");
    expect(lines[0]).toBe(parsed.data[0].join(","));
    expect(lines.filter((line) => line.startsWith("#"))).toEqual([]);
    expect(hostileCsv).not.toContain("evil.example");
    expect(hostileCsv).not.toContain("@SUM");
    expect(hostileCsv).toBe(csv);
  });
});

describe("provenance of a download (the Arcwright-Provenance header, the CSV file name)", () => {
  it("is printable ASCII that JSON.parse turns back into the record, line breaks and any script included", () => {
    const record: Provenance = { ...exportProvenance, subject: 'Target table of "Arcs\r\nSet-Cookie: x=1" — Ω 🔭 \u007f', inputs: { site: "Cerro\u2028Velado\u0000" } };
    const value = provenanceHeaderValue(record);
    expect(value).toMatch(/^[\x20-\x7E]+$/);
    expect(() => new Headers({ "Arcwright-Provenance": value })).not.toThrow();
    expect(JSON.parse(value)).toEqual(record);
    expect(PRODUCT_VERSION).toBe(packageJson.version);
  });

  it("stamps the time of export in ISO 8601 basic form", () => {
    expect(exportStampOf(exportProvenance)).toBe("20310203T040506Z");
  });
});

describe("LaTeX export", () => {
  const tex = targetTableLatex(table);

  it("is a tabular whose braces balance, every row as many cells as the alignment has columns (labels, units, two targets)", () => {
    expect(bracesBalance(tex)).toBe(true);
    const alignment = /\\begin\{tabular\}\{([lrc]+)\}/.exec(tex)?.[1];
    // RA followed by its sexagesimal form.
    expect(alignment).toBe("lrrlrrrlr");
    const body = tex.slice(tex.indexOf("\\hline"), tex.lastIndexOf("\\end{tabular}"));
    const rows = body.split("\n").filter((line) => line.endsWith("\\\\"));
    expect(rows).toHaveLength(4);
    for (const row of rows) expect(row.replace(/\\&/g, "").split("&")).toHaveLength(alignment!.length);
    expect(rows[2]).toContain("$1.2\\times10^{-7}$");
    expect(rows[3]).toContain(" & -- & ");
  });

  it("carries the provenance as % comments", () => {
    expect(tex.split("\n")[0]).toBe('% Target table of the proposal "Arcs" (2031A)');
    expect(tex).toContain(`% Exported by Arcwright ${packageJson.version} at 2031-02-03T04:05:06.000Z`);
  });
});

describe("VOTable export (IVOA VOTable 1.4), read by a hardened XML parser", () => {
  const xml = targetTableVotable(table);
  const parser = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: "", processEntities: true, isArray: (name) => ["FIELD", "TR", "TD", "INFO"].includes(name), parseTagValue: false });

  it("is well-formed, has no DOCTYPE (no entity expansion), and declares version 1.4 in the 1.3 namespace", () => {
    expect(/<!DOCTYPE/i.test(xml)).toBe(false);
    expect(XMLValidator.validate(xml)).toBe(true);
    const doc = parser.parse(xml);
    expect(doc.VOTABLE.version).toBe("1.4");
    expect(doc.VOTABLE.xmlns).toBe(VOTABLE_NAMESPACE);
  });

  it("gives every FIELD its datatype, VOUnit and UCD (UCD1+ 1.5, VOUnits 1.0)", () => {
    const fields = parser.parse(xml).VOTABLE.RESOURCE.TABLE.FIELD as Record<string, string>[];
    const byName = Object.fromEntries(fields.map((f) => [f.name, f]));
    expect(byName.raDeg).toMatchObject({ datatype: "double", unit: "deg", ucd: "pos.eq.ra;meta.main", ref: "icrs" });
    expect(byName.einsteinRadiusMas).toMatchObject({ datatype: "double", unit: "mas", ucd: "phys.angSize", precision: "E3" });
    expect(byName.timeDelayDays).toMatchObject({ unit: "d", ucd: "time.interval" });
    expect(byName.shadowDiameterMicroarcsec.unit).toBe("uarcsec");
    // A whole number is a 64-bit long, as ECSV's int64.
    expect(byName.priority).toMatchObject({ datatype: "long", ucd: "meta.code.qual" });
    expect(byName.priority.unit).toBeUndefined();
    expect(byName.name).toMatchObject({ datatype: "char", arraysize: "*" });
  });

  it("declares precision as significant figures (E<n>), never decimal places (a bare 4 made astropy rewrite 1.752e-11 d as 0.0000)", () => {
    const all = tableColumnsQuerySchema.parse({ columns: "raDeg,lensMassSolar,timeDelayDays,shadowDiameterMicroarcsec" });
    const rows = [{ ...exportRows[0], timeDelayDays: 1.752e-11, shadowDiameterMicroarcsec: 6.3e-6 }];
    const doc = parser.parse(targetTableVotable({ ...table, columns: all, rows }));
    const fields = doc.VOTABLE.RESOURCE.TABLE.FIELD as Record<string, string>[];
    // Inputs are written as stored, so they declare no precision; computed columns their significant figures.
    expect(fields.map((f) => [f.name, f.precision])).toEqual([
      ["raDeg", undefined],
      ["raHms", undefined],
      ["lensMassSolar", undefined],
      ["timeDelayDays", "E4"],
      ["shadowDiameterMicroarcsec", "E4"],
    ]);
    expect((doc.VOTABLE.RESOURCE.TABLE.DATA.TABLEDATA.TR as { TD: string[] }[])[0].TD).toEqual(["269.301666667", "17:57:12.400", "0.4", "1.752e-11", "0.0000063"]);
  });

  it("escapes markup in cells and reads back the same values; provenance in INFO elements", () => {
    const resource = parser.parse(xml).VOTABLE.RESOURCE;
    const rows = resource.TABLE.DATA.TABLEDATA.TR as { TD: string[] }[];
    expect(rows[1].TD[0]).toBe(hostileName);
    expect(rows[0].TD[4]).toBe("0.637");
    expect(rows[1].TD[5]).toBe("");
    const infos = Object.fromEntries((resource.INFO as Record<string, string>[]).map((i) => [i.name, i.value]));
    expect(infos.product).toBe("Arcwright");
    expect(infos.version).toBe(packageJson.version);
    expect(infos.exportedAt).toBe("2031-02-03T04:05:06.000Z");
    expect(infos.reproduceUrl).toContain("/proposals/");
    expect(infos["constants.GM_sun.value"]).toBe("132712440000000000000");
    expect(infos["constants.GM_sun.unit"]).toBe("m3 s-2");
    expect(infos["cosmology.H0KmPerSPerMpc"]).toBe(String(exportProvenance.cosmology.H0KmPerSPerMpc));
  });
});

/** The YAML of an ECSV file's header (its `# ` lines after `# %ECSV 1.0`) and its CSV body. */
function splitEcsv(ecsv: string): { header: Record<string, unknown>; body: string[][] } {
  const lines = ecsv.split("\n");
  const firstBodyLine = lines.findIndex((line) => !line.startsWith("#"));
  const yamlText = lines.slice(1, firstBodyLine).map((line) => line.slice(2)).join("\n");
  // YAML 1.1, as astropy's and STILTS's loaders read it.
  const header = parseYaml(yamlText, { version: "1.1" }) as Record<string, unknown>;
  return { header, body: Papa.parse<string[]>(lines.slice(firstBodyLine).join("\n"), { skipEmptyLines: true }).data };
}

describe("ECSV export (Astropy's Enhanced CSV 1.0, APE6)", () => {
  const ecsv = targetTableEcsv(table);
  const { header, body } = splitEcsv(ecsv);

  it("opens with the version line and a YAML header of columns (name, unit, datatype, description, UCD), comma delimiter and provenance", () => {
    expect(ecsv.split("\n").slice(0, 2)).toEqual(["# %ECSV 1.0", "# ---"]);
    expect(header.delimiter).toBe(",");
    const datatype = header.datatype as Record<string, unknown>[];
    expect(datatype.map((c) => c.name)).toEqual(["name", "raDeg", "raHms", ...columns.slice(2).map((c) => c.column.key)]);
    expect(datatype[1]).toEqual({ name: "raDeg", unit: "deg", datatype: "float64", description: "RA (ICRS) (input)", meta: { ucd: "pos.eq.ra;meta.main" } });
    expect(datatype.find((c) => c.name === "shadowDiameterMicroarcsec")).toMatchObject({ unit: "uarcsec", datatype: "float64" });
    expect(datatype.find((c) => c.name === "priority")).toMatchObject({ datatype: "int64" });
    expect(datatype.find((c) => c.name === "priority")).not.toHaveProperty("unit");
    expect(datatype[0]).toMatchObject({ name: "name", datatype: "string" });
    expect(header.meta).toEqual(exportProvenance);
  });

  it("keeps texts that YAML 1.1 would read as booleans or dates as texts in the provenance", () => {
    const provenance = { ...exportProvenance, subject: "no", inputs: { site: "yes", cycleStartDate: "2031-02-03", resolutionMas: 60 } };
    expect(splitEcsv(targetTableEcsv({ ...table, provenance })).header.meta).toEqual(provenance);
  });

  it("has a body of the column names, then every value as stored (no apostrophe: it is for table tools), empty where no value", () => {
    expect(body[0]).toEqual(["name", "raDeg", "raHms", ...columns.slice(2).map((c) => c.column.key)]);
    expect(body[1]).toEqual(["TB-ML-0001", "269.301666667", "17:57:12.400", "point", "0.637", "1.2e-7", "2", "bulge; night-1", "0.005218"]);
    expect(body[2][0]).toBe(hostileName);
    expect(body[2][5]).toBe("");
  });

  it("quotes a name starting with #, so the row is not read as a comment line", () => {
    const rows = [{ ...exportRows[0], name: "#3 arc" }];
    expect(targetTableEcsv({ ...table, rows }).split("\n").at(-2)).toMatch(/^"#3 arc",/);
  });
});

describe("JSON export", () => {
  it("rounds numbers to the chosen digits, keeps nulls, describes columns and carries the provenance", () => {
    const body = JSON.parse(targetTableJson(table)) as TargetTableJson;
    expect(body.rows[0].einsteinRadiusMas).toBe(0.637);
    expect(body.rows[1].timeDelayDays).toBeNull();
    expect(body.rows[1].name).toBe(hostileName);
    expect(body.columns.find((c) => c.key === "einsteinRadiusMas")).toMatchObject({ unit: "mas", ucd: "phys.angSize", digits: 3, origin: "computed" });
    expect(body.provenance.version).toBe(packageJson.version);
    expect(body.provenance.constants.map((c) => c.name)).toContain("GM_sun");
  });

  it("follows RA and Dec with their sexagesimal forms, as every table format does", () => {
    const body = JSON.parse(targetTableJson({ ...table, columns: tableColumnsQuerySchema.parse({ columns: "name,raDeg,decDeg" }) })) as TargetTableJson;
    expect(body.columns.map((c) => c.key)).toEqual(["name", "raDeg", "raHms", "decDeg", "decDms"]);
    // 269.301667 deg = 17 h 57 min 12.400 s; -29.2013889 deg = -29 deg 12 arcmin 05.00 arcsec (15 deg an hour, 60 to each).
    expect(body.rows[0]).toMatchObject({ raHms: "17:57:12.400", decDms: "-29:12:05.00" });
  });
});

describe("the science case's columns", () => {
  const caseColumns = tableColumnsQuerySchema.parse({ columns: "name,answeredCase,caseVerdict,caseAnswers,eventPeakJdUtc,sourceRadiusSolar,limbDarkeningU" });
  const caseTable: TargetTable = { ...table, columns: caseColumns };

  it("are in the default columns (the case and its worst verdict; the answers on request), the old verdict columns gone", () => {
    const defaults = tableColumnsQuerySchema.parse({}).map((c) => c.column.key);
    expect(defaults).toContain("answeredCase");
    expect(defaults).toContain("caseVerdict");
    expect(defaults).not.toContain("caseAnswers");
    expect(tableColumnsQuerySchema.safeParse({ columns: "name,resolutionVerdict" }).success).toBe(false);
  });

  it("write every answer in one CSV cell, question, verdict and figure, and nothing for a target without answers", () => {
    const [header, first, second] = Papa.parse<string[]>(targetTableCsv(caseTable), { skipEmptyLines: true }).data;
    expect(header).toEqual(["Name", "Science case", "Case verdict", "Case answers", "Event peak t0 (JD, UTC) [d]", "Source radius [Rsun]", "Limb-darkening coefficient"]);
    expect(first.slice(1, 4)).toEqual([
      "photometric-microlensing",
      "infeasible",
      "Peak magnification: Feasible (A = 3.437); Visits over the event (t0 ± t_E): Marginal (6 visits); Peak in usable time: Not feasible",
    ]);
    // Inputs are written as stored: t0 to the last digit, so a re-import keeps it.
    expect(first.slice(4)).toEqual(["2461571.6875", "1.2", "0.6"]);
    expect(second.slice(1, 5)).toEqual(["resolved-images", "unknown", "", ""]);
  });

  it("declare t0 an epoch in days and the source radius in solar radii (VOTable units and UCDs)", () => {
    const doc = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: "" }).parse(targetTableVotable(caseTable));
    const fields = doc.VOTABLE.RESOURCE.TABLE.FIELD as { name: string; unit?: string; ucd: string }[];
    expect(fields.find((f) => f.name === "eventPeakJdUtc")).toMatchObject({ unit: "d", ucd: "time.epoch" });
    expect(fields.find((f) => f.name === "sourceRadiusSolar")).toMatchObject({ unit: "solRad", ucd: "phys.size.radius" });
    expect(fields.find((f) => f.name === "caseVerdict")).toMatchObject({ ucd: "meta.code" });
  });

  it("wrap the answers in a paragraph column in LaTeX, escaped", () => {
    const tex = targetTableLatex(caseTable);
    expect(tex).toContain("\\begin{tabular}{lllp{7cm}rrr}");
    expect(tex).toContain("Visits over the event (t0 $\\pm$ t\\_E): Marginal (6 visits)");
    expect(bracesBalance(tex)).toBe(true);
  });
});

describe("the photon budget's columns (the source's magnitude, band and f_s; the time request and the S/N at the brightest visit)", () => {
  const budgetRows: TargetView[] = [
    { ...exportRows[0], sourceMagnitude: 19.123456789012344, sourceBand: "jc-i", blendFraction: 0.6, timeRequestHours: 12.3456, peakSignalToNoise: 143.21 },
    { ...exportRows[1], sourceMagnitude: null, sourceBand: null, blendFraction: null, timeRequestHours: null, peakSignalToNoise: null },
  ];
  const budgetColumns = tableColumnsQuerySchema.parse({
    columns: "name,raDeg,decDeg,lensModel,lensMassSolar,velocityDispersionKmPerS,lensDistancePc,sourceDistancePc,lensRedshift,sourceRedshift,sourceOffsetThetaE,priority,sourceMagnitude,sourceBand,blendFraction,timeRequestHours,peakSignalToNoise",
  });
  const budgetTable: TargetTable = { ...table, columns: budgetColumns, rows: budgetRows };
  const budgetKeys = ["sourceMagnitude", "sourceBand", "blendFraction", "timeRequestHours", "peakSignalToNoise"];

  it("put the time request among the default columns (what a technical justification shows)", () => {
    expect(tableColumnsQuerySchema.parse({}).map((c) => c.column.key)).toContain("timeRequestHours");
  });

  it("write CSV headers with units, inputs as stored and computed values at their digits, empty without a budget", () => {
    const [header, first, second] = Papa.parse<string[]>(targetTableCsv(budgetTable), { skipEmptyLines: true }).data;
    expect(header.slice(-5)).toEqual(["Source magnitude [mag]", "Source band", "Blend fraction f_s", "Time request [h]", "S/N at brightest visit"]);
    expect(first.slice(-5)).toEqual(["19.123456789012344", "jc-i", "0.6", "12.3", "143"]);
    expect(second.slice(-5)).toEqual(["", "", "", "", ""]);
  });

  it("declare VOUnits and UCD1+ words in the VOTable (phot.mag, meta.id;instr.filter, phot.flux;arith.ratio, time.duration;obs, stat.snr), precision only on the computed ones", () => {
    const doc = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: "" }).parse(targetTableVotable(budgetTable));
    const fields = doc.VOTABLE.RESOURCE.TABLE.FIELD as Record<string, string>[];
    const byName = Object.fromEntries(fields.map((f) => [f.name, f]));
    expect(budgetKeys.map((key) => [key, byName[key].datatype, byName[key].unit, byName[key].ucd, byName[key].precision])).toEqual([
      ["sourceMagnitude", "double", "mag", "phot.mag", undefined],
      ["sourceBand", "char", undefined, "meta.id;instr.filter", undefined],
      ["blendFraction", "double", undefined, "phot.flux;arith.ratio", undefined],
      ["timeRequestHours", "double", "h", "time.duration;obs", "E3"],
      ["peakSignalToNoise", "double", undefined, "stat.snr", "E3"],
    ]);
  });

  it("carry units and UCDs in the ECSV header", () => {
    const datatype = splitEcsv(targetTableEcsv(budgetTable)).header.datatype as Record<string, unknown>[];
    const byName = Object.fromEntries(datatype.map((c) => [c.name, c]));
    expect(byName.sourceMagnitude).toEqual({ name: "sourceMagnitude", unit: "mag", datatype: "float64", description: "Source magnitude (input)", meta: { ucd: "phot.mag" } });
    expect(byName.timeRequestHours).toEqual({ name: "timeRequestHours", unit: "h", datatype: "float64", description: "Time request (computed)", meta: { ucd: "time.duration;obs" } });
    expect(byName.blendFraction).not.toHaveProperty("unit");
  });

  it("typeset in LaTeX with their units in the header and an en dash without a budget", () => {
    const tex = targetTableLatex(budgetTable);
    expect(tex).toContain("Source band & \\begin{tabular}[b]{@{}r@{}}Blend \\\\ fraction f\\_s\\end{tabular} & Time request &");
    expect(tex).toContain(" & (mag) &  &  & (h) &  \\\\");
    const rows = tex.split("\n").filter((line) => line.endsWith("\\\\")).slice(2);
    expect(rows[0].endsWith("19.12 & jc-i & 0.6 & 12.3 & 143 \\\\")).toBe(true);
    expect(rows[1].endsWith("-- & -- & -- & -- & -- \\\\")).toBe(true);
  });

  it("re-import from our own VOTable and ECSV with the magnitude to the last digit, the band and f_s; the computed columns fill no field", () => {
    for (const imported of [parseVoTable(targetTableVotable(budgetTable)), parseCsvTable(targetTableEcsv(budgetTable))]) {
      const mapping = proposeColumnMapping(imported.columns);
      // RA and Dec in degrees (columns 1, 3), each followed by its sexagesimal text, which fills no field.
      expect(mapping).toMatchObject({ ra: { column: 1, unit: "deg" }, dec: { column: 3 } });
      expect(mapping).toMatchObject({ sourceMagnitude: { column: 14, unit: "mag" }, sourceBand: { column: 15 }, blendFraction: { column: 16 } });
      expect(Object.values(mapping).filter((assignment) => assignment!.column >= 17 || [2, 4].includes(assignment!.column))).toEqual([]);
      const { rows } = validateImportRows(imported, mapping);
      expect(rows[0].errors).toEqual([]);
      expect(rows[0].target).toMatchObject({ sourceMagnitude: 19.123456789012344, sourceBand: "jc-i", blendFraction: 0.6 });
      expect(rows[1].target).not.toHaveProperty("sourceMagnitude");
    }
  });
});
