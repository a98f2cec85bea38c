import { describe, expect, it } from "vitest";
import { proposeColumnMapping } from "@/lib/imports/columns";
import { columnFromHeader, parseCsvTable } from "@/lib/imports/csv";
import { planImport, type ExistingTarget } from "@/lib/imports/plan";
import { validateImportRows } from "@/lib/imports/rows";
import { sourceBandOfText } from "@/lib/imports/source-band";
import { parseVoTable } from "@/lib/imports/votable";
import { existingPointTarget, LENS, LENS_CELLS } from "./existing-target";

const fromHeaders = (...headers: string[]) => proposeColumnMapping(headers.map(columnFromHeader));

function readCsv(text: string) {
  const table = parseCsvTable(text);
  const mapping = proposeColumnMapping(table.columns);
  return { mapping, preview: validateImportRows(table, mapping, { priority: 2, sourceOffsetThetaE: 0.2 }) };
}


describe("the source's photometry in an imported list (magnitude, band, blend fraction f_s)", () => {
  it("maps a light-curve fit's headers (I_s, f_s; common practice) and assumes magnitudes in mag when the file names no unit", () => {
    expect(fromHeaders("name", "I_s", "band", "f_s")).toEqual({
      name: { column: 0 },
      sourceMagnitude: { column: 1, unit: "mag", isUnitAssumed: true },
      sourceBand: { column: 2 },
      blendFraction: { column: 3 },
    });
    expect(fromHeaders("source_mag [mag]", "filter", "fbl")).toEqual({ sourceMagnitude: { column: 0, unit: "mag" }, sourceBand: { column: 1 }, blendFraction: { column: 2 } });
    expect(fromHeaders("Is", "Blending").sourceMagnitude).toEqual({ column: 0, unit: "mag", isUnitAssumed: true });
    expect(fromHeaders("mag").sourceMagnitude).toEqual({ column: 0, unit: "mag", isUnitAssumed: true });
  });

  it("maps our own CSV headers, and a VOTable's UCDs for f_s (phot.flux;arith.ratio) and the filter (meta.id;instr.filter) but never phot.mag alone", () => {
    expect(fromHeaders("Source magnitude [mag]", "Source band", "Blend fraction f_s")).toEqual({
      sourceMagnitude: { column: 0, unit: "mag" },
      sourceBand: { column: 1 },
      blendFraction: { column: 2 },
    });
    const byUcd = proposeColumnMapping([
      { name: "col1", ucd: "phot.mag", unit: "mag" },
      { name: "col2", ucd: "meta.id;instr.filter" },
      { name: "col3", ucd: "phot.flux;arith.ratio" },
      { name: "col4", ucd: "phot.flux", unit: "Jy" },
    ]);
    expect(byUcd).toEqual({ sourceBand: { column: 1 }, blendFraction: { column: 2 } });
  });

  it("reads a band as our id, our label, a letter with its system in either order, or a letter by the trade's case convention", () => {
    const cases: [string, string][] = [
      ["jc-i", "jc-i"],
      ["SDSS-R", "sdss-r"],
      ["2mass-ks", "2mass-ks"],
      ["I (Johnson–Cousins)", "jc-i"],
      ["I (Johnson-Cousins)", "jc-i"],
      ["i (SDSS)", "sdss-i"],
      ["Ks (2MASS)", "2mass-ks"],
      ["SDSS r", "sdss-r"],
      ["r SDSS", "sdss-r"],
      ["Cousins I", "jc-i"],
      ["Johnson V", "jc-v"],
      ["I band", "jc-i"],
      ["I", "jc-i"],
      ["i", "sdss-i"],
      ["V", "jc-v"],
      ["z", "sdss-z"],
      ["Ks", "2mass-ks"],
      ["K_s", "2mass-ks"],
      ["H", "2mass-h"],
      ["custom", "custom"],
    ];
    expect(cases.map(([text]) => [text, sourceBandOfText(text)])).toEqual(cases);
    // Gaia's G, UKIRT's Z, a Johnson I (not Cousins I: another filter) and a bare K are none of ours.
    expect(["G", "Gaia G", "Z", "Johnson I", "K", "I (Gaia)"].map(sourceBandOfText)).toEqual([undefined, undefined, undefined, undefined, undefined, undefined]);
  });

  it("reads each row's magnitude, band and f_s into the target; an empty band is the proposal's", () => {
    const { preview } = readCsv(`${LENS},I_s,band,f_s\n${LENS_CELLS},19.5,I,0.6\nOB-2,268.2,-29.7,0.3,4000,8000,21.25,,1\n`);
    expect(preview.rows.map((row) => row.errors)).toEqual([[], []]);
    expect(preview.rows[0].target).toMatchObject({ sourceMagnitude: 19.5, sourceBand: "jc-i", blendFraction: 0.6 });
    expect(preview.rows[1].target).toMatchObject({ sourceMagnitude: 21.25, blendFraction: 1 });
    expect(preview.rows[1].target!.sourceBand).toBeUndefined();
  });

  it("refuses an unknown band per row in words naming the row, the field and the file's column", () => {
    const { preview } = readCsv(`${LENS},I_s,filter\n${LENS_CELLS},19.5,Gaia G\n`);
    expect(preview.rows[0].errors).toEqual([
      'row 1: Source band Gaia G (column "filter") is not a band we know: write a band id such as jc-i, sdss-r or 2mass-ks, a letter with its system such as "I (Johnson–Cousins)" or "i (SDSS)", "custom" for the proposal\'s own band, or leave the cell empty for the proposal\'s band.',
    ]);
  });

  it("refuses a magnitude column in a unit that is no magnitude, and an f_s outside (0, 1] with the target's range", () => {
    const flux = readCsv(`${LENS},mag [Jy]\n${LENS_CELLS},0.002\n`).preview.rows[0];
    expect(flux.errors).toEqual([
      `row 1: Source magnitude 0.002 (column "mag") is in Jy; the source magnitude is a magnitude (unit mag) in its band's own system: Vega for Johnson–Cousins and 2MASS, AB for SDSS.`,
    ]);
    const blends = readCsv(`${LENS},fs\n${LENS_CELLS},0\n${LENS_CELLS},1.5\n`).preview.rows;
    for (const row of blends) expect(row.errors[0]).toContain("The blend fraction f_s (the lensed source's share of the baseline flux) is from 0.001 to 1 (no blended light).");
  });

  it("reads our own VOTable's magnitude (unit mag) to the last digit and its band id as written", () => {
    const table = parseVoTable(`<VOTABLE><RESOURCE><TABLE>
      <FIELD name="name" ucd="meta.id;meta.main"/><FIELD name="raDeg" unit="deg"/><FIELD name="decDeg" unit="deg"/><FIELD name="lensMassSolar" unit="solMass" ucd="phys.mass"/>
      <FIELD name="lensDistancePc" unit="pc"/><FIELD name="sourceDistancePc" unit="pc"/><FIELD name="sourceOffsetThetaE"/><FIELD name="priority"/>
      <FIELD name="sourceMagnitude" unit="mag" ucd="phot.mag"/><FIELD name="sourceBand" ucd="meta.id;instr.filter"/><FIELD name="blendFraction" ucd="phot.flux;arith.ratio"/>
      <FIELD name="timeRequestHours" unit="h" ucd="time.duration;obs"/><FIELD name="peakSignalToNoise" ucd="stat.snr"/>
      <DATA><TABLEDATA><TR><TD>A</TD><TD>1</TD><TD>2</TD><TD>0.3</TD><TD>4000</TD><TD>8000</TD><TD>0.1</TD><TD>1</TD><TD>19.123456789012344</TD><TD>2mass-ks</TD><TD>0.37</TD><TD>12.5</TD><TD>88</TD></TR></TABLEDATA></DATA>
    </TABLE></RESOURCE></VOTABLE>`);
    const mapping = proposeColumnMapping(table.columns);
    expect(mapping).toMatchObject({ sourceMagnitude: { column: 8, unit: "mag" }, sourceBand: { column: 9 }, blendFraction: { column: 10 } });
    // The photon budget's columns are computed: they fill no field.
    expect(Object.values(mapping).filter((assignment) => assignment!.column >= 11)).toEqual([]);
    const { rows } = validateImportRows(table, mapping);
    expect(rows[0].errors).toEqual([]);
    expect(rows[0].target).toMatchObject({ sourceMagnitude: 19.123456789012344, sourceBand: "2mass-ks", blendFraction: 0.37 });
  });
});

describe("planImport with the source's photometry", () => {
  const existing: ExistingTarget = { ...existingPointTarget, sourceMagnitude: 19.5, sourceBand: "jc-i", blendFraction: 0.6 };
  const plan = (cells: string) => {
    const table = parseCsvTable(`${LENS},I_s,band,f_s\n${LENS_CELLS},${cells}\n`);
    const mapping = proposeColumnMapping(table.columns);
    return planImport(validateImportRows(table, mapping, { priority: 2, sourceOffsetThetaE: 0.2 }), mapping, [existing], 1).rows[0].action;
  };

  it("skips a row with the target's magnitude, band (in any spelling) and f_s; updates one whose band or f_s changed", () => {
    expect(plan("19.5,jc-i,0.6")).toMatchObject({ kind: "skip", reason: "unchanged" });
    expect(plan("19.5,I (Johnson–Cousins),0.6")).toMatchObject({ kind: "skip", reason: "unchanged" });
    expect(plan("19.5,i,0.6")).toMatchObject({ kind: "update", patch: { sourceBand: "sdss-i" } });
    expect(plan("19.5,jc-i,0.45")).toMatchObject({ kind: "update", patch: { blendFraction: 0.45 } });
  });

  it("keeps the target's magnitude, band and f_s where the file's cells are empty (a re-import never clears them)", () => {
    expect(plan(",,")).toMatchObject({ kind: "skip", reason: "unchanged" });
  });
});
