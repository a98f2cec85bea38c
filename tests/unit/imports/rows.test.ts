import { describe, expect, it } from "vitest";
import { AppError } from "@/lib/errors";
import { proposeColumnMapping, type ColumnMapping } from "@/lib/imports/columns";
import { parseCsvTable } from "@/lib/imports/csv";
import { validateImportRows } from "@/lib/imports/rows";
import { parseVoTable } from "@/lib/imports/votable";

const HEADER = "name,ra,dec,mass [Msun],D_L [kpc],D_S [kpc],u0,mu_rel,priority,tags";

function preview(body: string, header = HEADER) {
  const table = parseCsvTable(`${header}\n${body}`);
  return validateImportRows(table, proposeColumnMapping(table.columns));
}

describe("validateImportRows", () => {
  it("turns a complete row into a typed candidate target with ICRS degrees and the fields' units", () => {
    const { rows, validRowCount, invalidRowCount } = preview("Cinder Avocet,17 52 31.8,-29 41 07,0.32,5.2,8.1,0.12,6.1,1,high-mag;remnant");
    expect(rows[0].errors).toEqual([]);
    expect(rows[0].target).toEqual({
      name: "Cinder Avocet",
      ra: (17 + 52 / 60 + 31.8 / 3600) * 15,
      dec: -(29 + 41 / 60 + 7 / 3600),
      lensModel: "point",
      lensMassSolar: 0.32,
      lensDistancePc: 5200,
      sourceDistancePc: 8100,
      sourceOffsetThetaE: 0.12,
      properMotionMasPerYr: 6.1,
      priority: 1,
      tags: ["high-mag", "remnant"],
    });
    expect([validRowCount, invalidRowCount]).toEqual([1, 0]);
  });

  it('reports "row 17: Dec +95:00:00" outside −90..+90 with the row number and field', () => {
    const body = Array.from({ length: 17 }, (_, i) => `T${i + 1},10.0,${i === 16 ? "+95:00:00" : "-10"},0.5,4,8,0.2,5,2,`).join("\n");
    const { rows, invalidRowCount } = preview(body);
    expect(invalidRowCount).toBe(1);
    expect(rows[16].target).toBeUndefined();
    expect(rows[16].errors).toEqual(["row 17: Dec +95:00:00 — Declination must be in [-90, 90] degrees (got 95)."]);
  });

  it("reads RA in sexagesimal hours or in degrees, and decimal hours when the column's unit is h", () => {
    const degrees = preview("A,266.4168,-29.0078,0.5,4,8,0.2,5,2,").rows[0].target!;
    const hours = preview("A,17h45m40.04s,-29d00m28.1s,0.5,4,8,0.2,5,2,").rows[0].target!;
    expect(degrees.ra).toBe(266.4168);
    expect(hours.ra).toBeCloseTo(266.41683, 5);
    const decimalHours = preview("A,17.5,-29,0.5,4,8,0.2,5,2,", "name,ra [h],dec,mass [Msun],D_L [kpc],D_S [kpc],u0,mu_rel,priority,tags");
    expect(decimalHours.rows[0].target!.ra).toBe(262.5);
  });

  it("reads a unit written in the cell, overriding the column's (lib/physics/units)", () => {
    const target = preview("A,10,10,2e30 kg,4000 pc,8,0.2,5,2,").rows[0].target!;
    expect(target.lensMassSolar).toBeCloseTo(1.0055, 3);
    expect(target.lensDistancePc).toBe(4000);
  });

  it("names the field and the text of a cell that is not a quantity or the wrong kind", () => {
    const { rows } = preview("A,10,10,heavy,4 km/s,8,0.2,5,2,");
    // Each refusal says what to type instead (issue #15), with the parser's examples for the kind.
    expect(rows[0].errors).toEqual([
      'row 1: Lens distance 4 km/s (column "D_L") is a velocity, not a distance; type e.g. 8 kpc or 2.5e4 ly.',
      'row 1: Lens mass heavy (column "mass") is not a number followed by a unit; type e.g. 4e6 Msun, 1 Mjup or 3 Mearth.',
    ]);
  });

  it("reports the checks across fields (lens behind source) from the workspace's target rules", () => {
    const { rows } = preview("A,10,10,0.5,9,8,0.2,5,2,");
    expect(rows[0].errors).toEqual(["row 1: Source distance — The source must lie behind the lens (farther than it)."]);
  });

  it("infers an isothermal lens from a velocity dispersion and reads VOUnit km.s-1 (IVOA VOUnits 1.0)", () => {
    const table = parseVoTable(`<VOTABLE><RESOURCE><TABLE>
      <FIELD name="name"/><FIELD name="ra" unit="deg"/><FIELD name="dec" unit="deg"/>
      <FIELD name="sigma" unit="km.s-1"/><FIELD name="z_l"/><FIELD name="z_s"/><FIELD name="beta"/><FIELD name="priority"/>
      <DATA><TABLEDATA><TR><TD>Lantern Arc</TD><TD>63.04</TD><TD>-15.56</TD><TD>245</TD><TD>0.42</TD><TD>1.85</TD><TD>0.35</TD><TD>1</TD></TR></TABLEDATA></DATA>
    </TABLE></RESOURCE></VOTABLE>`);
    const { rows } = validateImportRows(table, proposeColumnMapping(table.columns));
    expect(rows[0].errors).toEqual([]);
    expect(rows[0].target).toMatchObject({ lensModel: "sis", velocityDispersionKmPerS: 245, lensRedshift: 0.42, sourceRedshift: 1.85 });
  });

  it("reads VOUnit spellings through the one parser, with no rewriting of its own (mas.yr-1, km.s**-1)", () => {
    const table = parseCsvTable("name,ra,dec,mass [Msun],D_L [pc],D_S [pc],mu [mas.yr-1],u0,priority\nA,10,10,0.5,4000,8000,5,0.3,2\n");
    const { rows } = validateImportRows(table, proposeColumnMapping(table.columns));
    expect(rows[0].errors).toEqual([]);
    expect(rows[0].target?.properMotionMasPerYr).toBeCloseTo(5, 12);
    const sigma = parseCsvTable("name,ra,dec,sigma,z_l,z_s,u0,priority\nB,10,10,245 km.s**-1,0.42,1.85,0.3,1\n");
    expect(validateImportRows(sigma, proposeColumnMapping(sigma.columns)).rows[0].target?.velocityDispersionKmPerS).toBe(245);
  });

  it("reads redshifts and priorities with the parser's comma rules, and names a bad one in words", () => {
    const table = parseCsvTable('name,ra,dec,sigma,z_l,z_s,u0,priority\nB,10,10,245,"0,42",1.85,0.3,1\nC,10,10,245,0.42,far,0.3,1\n');
    const { rows } = validateImportRows(table, proposeColumnMapping(table.columns));
    expect(rows[0].target?.lensRedshift).toBe(0.42);
    expect(rows[1].errors).toEqual([expect.stringMatching(/^row 2: Source redshift: 'far' is not a (?:plain )?number; type a number, e\.g\. 2\.$/)]);
  });

  it("fills priority and offset for every row from the user's values where the file has none", () => {
    const table = parseCsvTable("name,ra,dec,mass [Msun],D_L [pc],D_S [pc]\nA,10,10,0.5,4000,8000\nB,11,11,0.7,,8000\n");
    const { rows } = validateImportRows(table, proposeColumnMapping(table.columns), { priority: 3, sourceOffsetThetaE: 0.5 });
    expect(rows[0].target).toMatchObject({ priority: 3, sourceOffsetThetaE: 0.5 });
    expect(rows[1].errors).toEqual(["row 2: Lens distance — Give the lens distance in parsecs, or both redshifts."]);
  });

  it("says which required value is missing, and treats NaN, null and -- as empty (common practice)", () => {
    const { rows } = preview("A,10,10,NaN,4,8,null,5,--,");
    expect(rows[0].errors).toEqual([
      "row 1: Lens model is missing (give a lens mass for a point mass or a velocity dispersion for a singular isothermal sphere).",
      "row 1: Source offset (θ_E) is missing.",
      "row 1: Priority is missing.",
    ]);
  });

  it("reports a row with the wrong number of fields (RFC 4180 §2.4) and still reads the others", () => {
    const { rows, validRowCount } = preview("A,10,10,0.5,4,8,0.2,5,2\nB,10,10,0.5,4,8,0.2,5,2,");
    expect(rows[0].errors).toEqual(["row 1: has 9 fields, but the header has 10."]);
    expect(validRowCount).toBe(1);
  });

  it("keeps a formula-like name verbatim in the target (it is neutralized on export, not on import)", () => {
    expect(preview('"=cmd|\' /C calc\'!A0",10,10,0.5,4,8,0.2,5,2,').rows[0].target!.name).toBe("=cmd|' /C calc'!A0");
  });

  it("refuses a mapping that lacks a required field or uses a column twice, naming each field", () => {
    const table = parseCsvTable("name,ra,dec\nA,1,2\n");
    const mapping: ColumnMapping = { name: { column: 0 }, ra: { column: 0 } };
    let error: unknown;
    try {
      validateImportRows(table, mapping);
    } catch (caught) {
      error = caught;
    }
    expect(error).toBeInstanceOf(AppError);
    expect((error as AppError).fields).toEqual({
      ra: ['Column "name" is already used for Name.'],
      dec: ["Choose the column that holds the Dec."],
    });
    expect(() => validateImportRows(table, { name: { column: 0 }, ra: { column: 1 }, dec: { column: 7 } })).toThrow("Dec: there is no column 8.");
  });

  it("follows a user's override of the proposal", () => {
    const table = parseCsvTable("id,alpha,delta,label\nA,10,20,B-name\n");
    const { rows } = validateImportRows(table, { name: { column: 3 }, ra: { column: 1 }, dec: { column: 2 } }, { lensModel: "point", priority: 2, sourceOffsetThetaE: 1 });
    expect(rows[0].cells).toEqual({ name: "B-name", ra: "10", dec: "20" });
    expect(rows[0].errors).toContain("row 1: Lens mass — A point-mass lens needs its mass in solar masses.");
  });
});
