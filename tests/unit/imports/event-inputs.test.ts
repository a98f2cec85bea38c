import { describe, expect, it } from "vitest";
import { AppError } from "@/lib/errors";
import { isComputedColumn, proposeColumnMapping } from "@/lib/imports/columns";
import { columnFromHeader, parseCsvTable } from "@/lib/imports/csv";
import { planImport, type ExistingTarget } from "@/lib/imports/plan";
import { checkColumnMapping, validateImportRows } from "@/lib/imports/rows";
import { parseVoTable } from "@/lib/imports/votable";
import { existingPointTarget, LENS, LENS_CELLS } from "./existing-target";

// 2027-06-15 04:30 UTC as a Julian date: JD 2461571.5 at 0h that day (Meeus, Astronomical
// Algorithms, ch. 7) + 4.5/24; astropy 5.2.1 Time("2027-06-15 04:30", scale="utc").jd gives the same.
const PEAK_JD = 2461571.6875;
const PEAK_MJD = PEAK_JD - 2400000.5;

const fromHeaders = (...headers: string[]) => proposeColumnMapping(headers.map(columnFromHeader));

function readCsv(text: string) {
  const table = parseCsvTable(text);
  return validateImportRows(table, proposeColumnMapping(table.columns), { priority: 2, sourceOffsetThetaE: 0.2 });
}


describe("the event's inputs in an imported list (science case, t0, source radius, limb darkening)", () => {
  it("maps catalogue headers for t0, ρ, the source radius, limb darkening and the case (common practice)", () => {
    const mapping = fromHeaders("name", "ra", "dec", "t_0", "rho", "LD", "Case", "R_star [Rsun]");
    expect(mapping.eventPeakJdUtc).toEqual({ column: 3, unit: "JD", isUnitAssumed: true });
    expect(mapping.sourceRadiusThetaE).toEqual({ column: 4 });
    expect(mapping.limbDarkeningU).toEqual({ column: 5 });
    expect(mapping.scienceCase).toEqual({ column: 6 });
    expect(mapping.sourceRadiusSolar).toEqual({ column: 7, unit: "Rsun" });
  });

  it("takes the day count of a t0 column from its header: HJD, t0_mjd, and MJD before a unit d", () => {
    expect(fromHeaders("HJD").eventPeakJdUtc).toEqual({ column: 0, unit: "HJD" });
    expect(fromHeaders("t0_mjd").eventPeakJdUtc).toEqual({ column: 0, unit: "MJD" });
    expect(fromHeaders("peak [d]").eventPeakJdUtc).toEqual({ column: 0, unit: "d" });
    expect(proposeColumnMapping([{ name: "MJD", unit: "d", ucd: "time.epoch" }]).eventPeakJdUtc).toEqual({ column: 0, unit: "MJD" });
  });

  it("maps VOTable UCDs (IVOA UCD1+ 1.5): time.epoch in days, phys.size.radius in solar radii, phot.limbDark; not an epoch in years or a radius in kpc", () => {
    const mapping = proposeColumnMapping([
      { name: "col1", ucd: "time.epoch", unit: "d" },
      { name: "col2", ucd: "phys.size.radius", unit: "solRad" },
      { name: "col3", ucd: "phot.limbDark" },
    ]);
    expect(mapping).toEqual({ eventPeakJdUtc: { column: 0, unit: "d" }, sourceRadiusSolar: { column: 1, unit: "solRad" }, limbDarkeningU: { column: 2 } });
    expect(proposeColumnMapping([{ name: "epoch", ucd: "time.epoch", unit: "yr" }, { name: "r_eff", ucd: "phys.size.radius", unit: "kpc" }])).toEqual({});
  });

  it("recognises our own export's columns: the inputs by name and UCD, the computed ones (answeredCase, caseVerdict, Einstein radius) never as inputs", () => {
    const table = parseVoTable(`<VOTABLE><RESOURCE><TABLE>
      <FIELD name="name" ucd="meta.id;meta.main"/><FIELD name="raDeg" unit="deg" ucd="pos.eq.ra;meta.main"/><FIELD name="decDeg" unit="deg" ucd="pos.eq.dec;meta.main"/>
      <FIELD name="eventPeakJdUtc" unit="d" ucd="time.epoch"/><FIELD name="sourceRadiusSolar" unit="solRad" ucd="phys.size.radius"/>
      <FIELD name="sourceRadiusThetaE" ucd="phys.angSize;arith.ratio"/><FIELD name="limbDarkeningU" ucd="phot.limbDark"/>
      <FIELD name="einsteinRadiusMas" unit="mas" ucd="phys.angSize"/><FIELD name="answeredCase" ucd="meta.code"/><FIELD name="caseVerdict" ucd="meta.code"/><FIELD name="caseAnswers" ucd="meta.note"/>
      <DATA><TABLEDATA><TR><TD>A</TD><TD>1</TD><TD>2</TD><TD>2461571.6875</TD><TD>1.4</TD><TD/><TD>0.6</TD><TD>0.6</TD><TD>time-delay</TD><TD>feasible</TD><TD/></TR></TABLEDATA></DATA>
    </TABLE></RESOURCE></VOTABLE>`);
    const mapping = proposeColumnMapping(table.columns);
    expect(mapping).toMatchObject({ eventPeakJdUtc: { column: 3, unit: "d" }, sourceRadiusSolar: { column: 4, unit: "solRad" }, sourceRadiusThetaE: { column: 5 }, limbDarkeningU: { column: 6 } });
    expect(Object.values(mapping).map((assignment) => assignment!.column).filter((column) => column >= 7)).toEqual([]);
    // Our CSV's header for the answered case is "Science case": computed, whatever a header alias says.
    expect(isComputedColumn(columnFromHeader("Science case", 0))).toBe(true);
    expect(fromHeaders("name", "Science case", "Case verdict", "Einstein radius [mas]")).toEqual({ name: { column: 0 } });
    let refusal: unknown;
    try {
      checkColumnMapping(table, { ...mapping, scienceCase: { column: 8 } });
    } catch (error) {
      refusal = error;
    }
    expect(refusal).toBeInstanceOf(AppError);
    expect((refusal as AppError).fields).toEqual({ scienceCase: ['Column "answeredCase" is computed from a target\'s inputs, not an input; it cannot fill Science case.'] });
  });

  it("reads ECSV headers (APE6): the units and UCDs of astropy's !!omap meta and of our own export's flow maps", () => {
    // As astropy 5.2.1 writes Table({"name": ["A"], "t0": [...]}) with t0.unit = d and meta ucd = time.epoch (space-delimited).
    const astropy = parseCsvTable(
      ["# %ECSV 1.0", "# ---", "# datatype:", "# - {name: name, datatype: string}", "# - name: t0", "#   unit: d", "#   datatype: float64", "#   meta: !!omap", "#   - {ucd: time.epoch}", "# schema: astropy-2.0", "name t0", `"OB 1" ${PEAK_JD}`].join("\n"),
    );
    expect(astropy.columns).toEqual([{ name: "name" }, { name: "t0", unit: "d", ucd: "time.epoch" }]);
    expect(astropy.rows[0].cells).toEqual(["OB 1", String(PEAK_JD)]);
    const ours = parseCsvTable(
      [
        "# %ECSV 1.0",
        "# ---",
        "# datatype:",
        "#   - {name: col1, datatype: float64, unit: solRad, description: Source radius (input), meta: {ucd: phys.size.radius}}",
        "#   - {name: col2, datatype: float64, description: Limb-darkening coefficient (input), meta: {ucd: phot.limbDark}}",
        "#   - {name: answeredCase, datatype: string, description: Science case (computed), meta: {ucd: meta.code}}",
        "# delimiter: ','",
        "# meta: {subject: Target table}",
        "col1,col2,answeredCase",
        "1.4,0.6,time-delay",
      ].join("\n"),
    );
    expect(proposeColumnMapping(ours.columns)).toEqual({ sourceRadiusSolar: { column: 0, unit: "solRad" }, limbDarkeningU: { column: 1 } });
    expect(() => parseCsvTable("# %ECSV 1.0\n# ---\n# datatype: [\nname\nA\n")).toThrow("The ECSV header (the lines starting with #) is not valid YAML. Export the table again.");
  });

  it("reads t0 written as a UTC date, a JD, an HJD and an MJD to the same Julian date, by the workspace's reader", () => {
    const { rows } = readCsv(`${LENS},t0\n${LENS_CELLS},2027-06-15 04:30\n${LENS_CELLS},${PEAK_JD}\n${LENS_CELLS},JD ${PEAK_JD}\n`);
    expect(rows.map((row) => row.errors)).toEqual([[], [], []]);
    expect(rows.map((row) => row.target!.eventPeakJdUtc)).toEqual([PEAK_JD, PEAK_JD, PEAK_JD]);
    const hjd = readCsv(`${LENS},HJD\n${LENS_CELLS},${PEAK_JD}\n`).rows[0];
    expect(hjd.target!.eventPeakJdUtc).toBe(PEAK_JD);
    const mjd = readCsv(`${LENS},t0 [MJD]\n${LENS_CELLS},${PEAK_MJD}\n${LENS_CELLS},2027-06-15 04:30\n`).rows;
    expect(mjd.map((row) => row.target!.eventPeakJdUtc)).toEqual([PEAK_JD, PEAK_JD]);
  });

  it("names the row, the field and the reader's reason for a t0 that is no date, or in a unit that is no day count", () => {
    const { rows } = readCsv(`${LENS},t0\n${LENS_CELLS},2027-02-30\n${LENS_CELLS},next June\n`);
    expect(rows[0].errors).toEqual(["row 1: Event peak t0 2027-02-30 — The event peak's date 2027-02-30 does not exist."]);
    expect(rows[1].errors[0]).toMatch(/^row 2: Event peak t0 next June — The event peak "next June" is not a date; type a UTC date such as 2027-06-15 04:30/);
    const years = readCsv(`${LENS},t0 [yr]\n${LENS_CELLS},2027.45\n`).rows[0];
    expect(years.errors).toEqual(['row 1: Event peak t0 2027.45 (column "t0") is in yr; a time is read as a Julian date (unit JD, HJD, MJD or d) or as a UTC date such as 2027-06-15 04:30.']);
  });

  it("reads the science case by id or label in any case, and refuses other text naming the row and column and listing the six cases", () => {
    const { rows } = readCsv(`${LENS},science_case\n${LENS_CELLS},Astrometric Microlensing\n${LENS_CELLS},TIME-DELAY\n${LENS_CELLS},\n${LENS_CELLS},light curve\n`);
    expect(rows.slice(0, 3).map((row) => row.target?.scienceCase)).toEqual(["astrometric-microlensing", "time-delay", undefined]);
    expect(rows[3].errors).toEqual([
      'row 4: Science case light curve (column "science_case") is not a science case: write one of photometric-microlensing (Photometric microlensing event), astrometric-microlensing (Astrometric microlensing), resolved-images (Resolved multiple images), time-delay (Time-delay monitoring), horizon-scale (Horizon-scale imaging), relativistic-orbit (Relativistic orbit), or leave the cell empty to use the inferred case.',
    ]);
  });

  it("reads the source radius in solar radii (a VOUnit solRad bare number as written), ρ and the limb-darkening coefficient, with the target's ranges", () => {
    const table = parseVoTable(`<VOTABLE><RESOURCE><TABLE>
      <FIELD name="name"/><FIELD name="ra" unit="deg"/><FIELD name="dec" unit="deg"/><FIELD name="mass" unit="solMass"/><FIELD name="D_L" unit="pc"/><FIELD name="D_S" unit="pc"/><FIELD name="u0"/><FIELD name="priority"/>
      <FIELD name="R" unit="solRad" ucd="phys.size.radius"/><FIELD name="rho"/><FIELD name="u_LD" ucd="phot.limbDark"/>
      <DATA><TABLEDATA>
        <TR><TD>A</TD><TD>1</TD><TD>2</TD><TD>0.3</TD><TD>4000</TD><TD>8000</TD><TD>0.1</TD><TD>1</TD><TD>1.2345678901234567</TD><TD/><TD>0.6</TD></TR>
        <TR><TD>B</TD><TD>1</TD><TD>3</TD><TD>0.3</TD><TD>4000</TD><TD>8000</TD><TD>0.1</TD><TD>1</TD><TD/><TD>0.002</TD><TD>1.5</TD></TR>
      </TABLEDATA></DATA>
    </TABLE></RESOURCE></VOTABLE>`);
    const { rows } = validateImportRows(table, proposeColumnMapping(table.columns));
    expect(rows[0].errors).toEqual([]);
    expect(rows[0].target).toMatchObject({ sourceRadiusSolar: 1.2345678901234567, limbDarkeningU: 0.6 });
    expect(rows[1].errors).toEqual(["row 2: Limb darkening 1.5 — The linear limb-darkening coefficient is from 0 (a uniform disk) to 1."]);
    const rjup = readCsv(`${LENS},R_star\n${LENS_CELLS},10 Rjup\n`).rows[0];
    // 10 R_J (IAU 2015 B3 nominal equatorial 7.1492e7 m) / R☉ (6.957e8 m) = 1.02763 R☉.
    expect(rjup.target!.sourceRadiusSolar).toBeCloseTo(1.027627, 6);
  });
});

describe("planImport with the event's inputs", () => {
  const existing: ExistingTarget = { ...existingPointTarget, scienceCase: "photometric-microlensing", eventPeakJdUtc: PEAK_JD, sourceRadiusSolar: 1.4, limbDarkeningU: 0.6 };
  const plan = (cells: string) => {
    const table = parseCsvTable(`${LENS},t0,case,R_star,LD\n${LENS_CELLS},${cells}\n`);
    const mapping = proposeColumnMapping(table.columns);
    return planImport(validateImportRows(table, mapping, { priority: 2, sourceOffsetThetaE: 0.2 }), mapping, [existing], 1).rows[0].action;
  };

  it("skips a row whose t0, case, radius and limb darkening are the target's, and updates one whose t0 changed", () => {
    expect(plan(`${PEAK_JD},photometric-microlensing,1.4,0.6`)).toMatchObject({ kind: "skip", reason: "unchanged" });
    expect(plan(`2027-06-15 04:30,Photometric microlensing event,1.4,0.6`)).toMatchObject({ kind: "skip", reason: "unchanged" });
    expect(plan(`${PEAK_JD + 2},photometric-microlensing,1.4,0.6`)).toMatchObject({ kind: "update", targetId: "t1", patch: { eventPeakJdUtc: PEAK_JD + 2 } });
    expect(plan(`${PEAK_JD},time-delay,1.4,0.6`)).toMatchObject({ kind: "update", patch: { scienceCase: "time-delay" } });
  });

  it("keeps the target's t0 and case where the file's cells are empty (a re-import never clears them)", () => {
    expect(plan(",,1.4,0.6")).toMatchObject({ kind: "skip", reason: "unchanged" });
  });
});
