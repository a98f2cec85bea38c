import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import Papa from "papaparse";
import { XMLParser } from "fast-xml-parser";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { dbClient } from "@/db/client";
import type { Actor } from "@/lib/server/actor";
import { targetTableExportRoutes } from "@/lib/server/api/export-routes";
import { demoTargets } from "@/db/seed/demo-scenario";
import { descriptionOf, exportColumnKeys, exportColumnOf, headerOf } from "@/lib/exports/tables/columns";
import type { TargetTableJson } from "@/lib/exports/tables/json";
import { DEC_SECOND_DECIMALS, RA_SECOND_DECIMALS, sexagesimalColumns } from "@/lib/exports/tables/table";
import { commitImport, previewImport } from "@/lib/server/imports";
import { targets } from "@/db/schema";
import { and, eq } from "drizzle-orm";
import { createWorld, pointTargetInput, proposalInput, type World } from "./support/world";
import { startUploadService, type UploadService } from "./support/upload-service";
import { createProposal, updateProposal } from "@/lib/server/proposals";
import { demoCycle } from "@/db/seed/demo-sky-cycle";
import { createTarget } from "@/lib/server/targets";
import type { Provenance } from "@/lib/exports/provenance";
import packageJson from "@/package.json";

let service: UploadService;

beforeAll(async () => {
  service = await startUploadService();
});

afterAll(async () => {
  await service.stop();
  await dbClient().sql.end();
});

async function download(actor: Actor, proposalId: string, query: string) {
  const request = new Request(`http://arcwright.test/api/proposals/${proposalId}/exports/targets?${query}`);
  return targetTableExportRoutes(async () => actor).GET(request, { params: Promise.resolve({ proposalId }) });
}

describe("GET /api/proposals/:id/exports/targets", () => {
  it("a viewer downloads every target as CSV with the computed columns the server stored", async () => {
    const world = await createWorld();
    await createTarget({ proposalId: world.proposalId }, { ...pointTargetInput, name: "=cmd|' /C calc'!A0", priority: 1 }, world.actors.pi);
    const response = await download(world.actors.viewer, world.proposalId, "format=csv&columns=name,priority,einsteinRadiusMas&digits=einsteinRadiusMas:3");
    expect(response.status).toBe(200);
    expect(response.headers.get("content-type")).toContain("text/csv");
    expect(response.headers.get("content-disposition")).toMatch(/^attachment; filename="arcs-over-the-tessellate-bulge-field-targets-\d{8}T\d{6}Z\.csv"$/);
    expect(response.headers.get("cache-control")).toBe("private, no-store");
    const parsed = Papa.parse<string[]>(await response.text(), { skipEmptyLines: true });
    expect(parsed.data[0]).toEqual(["Name", "Priority", "Einstein radius [mas]"]);
    // Ordered by priority: the formula-like name (priority 1) first, neutralized.
    expect(parsed.data[1][0]).toBe("'=cmd|' /C calc'!A0");
    // 0.4 M☉ at D_L = 4 kpc, D_S = 8 kpc: θ_E = sqrt(4GM/c² · D_LS/(D_L D_S)) = 0.6381 mas (Paczyński 1986, eq. 1; recomputed by hand with IAU GM_sun).
    expect(parsed.data[2]).toEqual(["TB-ML-0001", "2", "0.638"]);
  });

  it("writes LaTeX, VOTable and JSON with the provenance pointing back at the proposal", async () => {
    const world = await createWorld();
    const tex = await download(world.actors.pi, world.proposalId, "format=tex");
    expect(tex.headers.get("content-disposition")).toContain(".tex");
    expect(await tex.text()).toContain("\\begin{tabular}");
    const vot = await download(world.actors.coi, world.proposalId, "format=votable");
    expect(vot.headers.get("content-type")).toContain("application/x-votable+xml");
    const doc = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: "" }).parse(await vot.text());
    expect(doc.VOTABLE.RESOURCE.TABLE.nrows).toBe("1");
    const json = await (await download(world.actors.pi, world.proposalId, "format=json")).json();
    expect(json.provenance.version).toBe(packageJson.version);
    expect(json.provenance.reproduceUrl).toMatch(new RegExp(`/proposals/${world.proposalId}$`));
    expect(json.provenance.inputs.resolutionMas).toBe(proposalInput.instrument.resolutionMas);
  });

  it("refuses an unknown column and an unknown format by name, with a 400 naming the field", async () => {
    const world = await createWorld();
    const bad = await download(world.actors.pi, world.proposalId, "format=csv&columns=name,thetaE");
    expect(bad.status).toBe(400);
    const { error } = await bad.json();
    expect(error.code).toBe("bad_request:export");
    expect(error.fields.columns[0]).toContain("thetaE");
    const format = await download(world.actors.pi, world.proposalId, "format=xlsx");
    expect(format.status).toBe(400);
    expect(Object.keys((await format.json()).error.fields)).toEqual(["format"]);
  });

  it("a hostile title, cycle and site name never reach the CSV body as formula cells (the # provenance lines carried them)", async () => {
    const world = await createWorld();
    const hostile = "Arcs,=HYPERLINK(\"http://evil.example/?x\"),=1+1";
    const proposal = await createProposal({ ...proposalInput, title: hostile, cycle: "=1+1", site: { ...proposalInput.site, name: "@SUM(1,2) =cmd|' /C calc'!A0" } }, world.actors.pi);
    await createTarget({ proposalId: proposal.id }, { ...pointTargetInput, name: "-2+3", priority: 1 }, world.actors.pi);
    const response = await download(world.actors.pi, proposal.id, "format=csv&columns=name,raDeg,decDeg,priority,tags");
    expect(response.status).toBe(200);
    const csv = await response.text();
    const lines = csv.split("\r\n");
    expect(lines[0]).toBe("Name,RA (ICRS) [deg],RA (ICRS) hms,Dec (ICRS) [deg],Dec (ICRS) dms,Priority,Tags");
    expect(lines.filter((line) => line.startsWith("#"))).toEqual([]);
    expect(csv).not.toContain("HYPERLINK");
    const parsed = Papa.parse<string[]>(csv, { skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    const cells = parsed.data.flat();
    // OWASP CSV injection: a cell starting with = + - @ tab or CR runs as a formula, unless it is a
    // plain decimal number ("-29.2") or a signed sexagesimal one ("-29:00:28.17"), which call nothing.
    expect(cells.filter((cell) => /^[=+\-@\t\r]/.test(cell) && !/^-?\d+(\.\d+)?(e[+-]?\d+)?$/i.test(cell) && !/^[+-]\d{2}:\d{2}:\d{2}\.\d+$/.test(cell))).toEqual([]);
    expect(parsed.data[1][0]).toBe("'-2+3");

    // The provenance moved to the download: an ASCII JSON header and the time of export in the file name.
    const provenance = JSON.parse(response.headers.get("arcwright-provenance")!) as Provenance;
    expect(provenance.subject).toBe(`Target table of the proposal "${hostile}" (=1+1)`);
    expect(provenance.inputs.site).toContain("@SUM(1,2) =cmd|' /C calc'!A0");
    expect(provenance.version).toBe(packageJson.version);
    const stamp = provenance.exportedAt.replace(/[-:]/g, "").replace(/\.\d+Z$/, "Z");
    expect(response.headers.get("content-disposition")).toBe(`attachment; filename="arcs-hyperlink-http-evil-example-x-1-1-targets-${stamp}.csv"`);
  });

  it("every table download carries its provenance header, the same record as the JSON export's", async () => {
    const world = await createWorld();
    for (const format of ["csv", "ecsv", "tex", "votable", "json"]) {
      const response = await download(world.actors.viewer, world.proposalId, `format=${format}`);
      const provenance = JSON.parse(response.headers.get("arcwright-provenance")!) as Provenance;
      expect(provenance.reproduceUrl, format).toMatch(new RegExp(`/proposals/${world.proposalId}$`));
      if (format === "json") expect(provenance).toEqual(((await response.json()) as { provenance: Provenance }).provenance);
    }
  });

  it("a refused export answers JSON that no cache may store", async () => {
    const world = await createWorld();
    const refused = await download(world.actors.pi, world.proposalId, "format=xlsx");
    expect(refused.status).toBe(400);
    expect(refused.headers.get("cache-control")).toBe("no-store");
  });
});

/** The peak of the event added to the demo-like world: a JD with every digit a double holds. */
const EXTRA_EVENT_PEAK_JD = 2462668.8337962963;
const EXTRA_EVENT_NAME = "OB-31-0042";
/** The event's source: a magnitude with every digit a double holds, in a band other than the proposal's. */
const EXTRA_EVENT_SOURCE = { sourceMagnitude: 19.123456789012344, sourceBand: "sdss-i", blendFraction: 0.37 };
/** What a light-curve fit applied to it measured: t_E and the parallax vector, with every digit. */
const EXTRA_EVENT_FIT = { einsteinTimeDays: 27.612345678901234, parallaxNorth: 0.123456789012345, parallaxEast: -0.0543210987654321 };
/** The demo targets' sources: magnitudes 16.5, 16.9, … in the proposal's band (I), every third one blended. */
const demoSourceOf = (index: number) => ({ sourceMagnitude: 16.5 + 0.4 * index, ...(index % 3 === 0 ? { blendFraction: 0.55 } : {}) });

/**
 * The test world with the demo scenario's targets added (bulge point lenses, whose time delays are
 * ~1e-11 d and shadows ~1e-5 µas, galaxy lenses, the compact object; events with their peak t0, a
 * source radius and limb darkening, chosen science cases), plus a name with a true minus sign and Ω
 * as copied from papers that starts with #, which a CSV reader could take for a comment, and an event
 * whose source is given as ρ with a 17-digit t0 and a chosen case. The proposal has the demo cycle
 * and a 2 m telescope in I, and every target a source magnitude, so the photon budget's columns hold
 * values (the galaxy lenses' cases ask for no visits and keep them empty).
 */
async function demoLikeWorld(): Promise<World> {
  const world = await createWorld();
  await updateProposal({ proposalId: world.proposalId }, { ...demoCycle, photometry: { apertureM: 2, bandId: "jc-i" } }, world.actors.pi);
  const extra = { ...demoTargets[0], name: "#2 HE 0435−1223 Ω", ra: "04 38 14.9", dec: "-12 17 14" };
  const event = {
    ...demoTargets.find((target) => target.eventPeakJdUtc !== undefined)!,
    name: EXTRA_EVENT_NAME,
    ra: "17 59 02.6",
    dec: "-29 05 41",
    eventPeakJdUtc: EXTRA_EVENT_PEAK_JD,
    sourceRadiusSolar: undefined,
    sourceRadiusThetaE: 0.0021,
    limbDarkeningU: 0.55,
    scienceCase: "photometric-microlensing" as const,
    ...EXTRA_EVENT_SOURCE,
    ...EXTRA_EVENT_FIT,
  };
  for (const [index, { notes: _notes, status: _status, ...target }] of [...demoTargets, extra, event].entries()) {
    await createTarget({ proposalId: world.proposalId }, { ...demoSourceOf(index), ...target }, world.actors.pi);
  }
  return world;
}

const allColumns = `columns=${exportColumnKeys.join(",")}`;

/** Uploads a target list as the Co-I and previews its import with the proposed mapping. */
async function previewOf(world: World, text: string, name = "targets.vot") {
  const type = name.endsWith(".vot") ? "application/x-votable+xml" : "text/csv";
  const upload = await service.uploadAs(world.actors.coi, "targetList", { proposalId: world.proposalId }, { name, bytes: new TextEncoder().encode(text), type });
  if (upload.stage !== "stored" || !upload.serverData.ok) throw new Error(`upload refused: ${JSON.stringify(upload)}`);
  return previewImport({ proposalId: world.proposalId }, { fileId: upload.serverData.fileId }, world.actors.coi);
}

describe("table exports read by astropy and STILTS (tests/validators/check_tables.py)", () => {
  it("VOTable, CSV and ECSV parse, survive astropy's rewrite and STILTS with every value to 1e-9 and their units (VOTable precision='4' rewrote 1.752e-11 d as 0.0000)", async () => {
    const world = await demoLikeWorld();
    const get = (format: string) => download(world.actors.viewer, world.proposalId, `format=${format}&${allColumns}`);
    // The values every file must hold: the JSON export's, the same numbers at the same digits.
    const json = (await (await get("json")).json()) as TargetTableJson;
    const values = json.rows.map((row) => exportColumnKeys.map((key) => (row[key] === "" ? null : row[key])));
    // The photon budget's columns carry the stored budgets, and the provenance the band an empty source band means.
    expect(json.rows.filter((row) => typeof row.timeRequestHours === "number" && typeof row.peakSignalToNoise === "number").length).toBeGreaterThan(0);
    expect(json.provenance.inputs).toMatchObject({ photometryBandId: "jc-i", apertureM: 2 });
    // A CSV text cell starting like a formula carries the guard's apostrophe (OWASP CSV injection).
    const csvValues = values.map((row) => row.map((v) => (typeof v === "string" && /^[=+\-@\t\r]/.test(v) ? `'${v}` : v)));
    const columnsAs = (name: (key: (typeof exportColumnKeys)[number]) => string, withUnits: boolean) =>
      exportColumnKeys.map((key) => {
        const column = exportColumnOf(key);
        return { name: name(key), unit: withUnits && column.voUnit !== "" ? column.voUnit : null, description: descriptionOf(column) };
      });
    const directory = mkdtempSync(join(tmpdir(), "arcwright-tables-"));
    try {
      const provenanceOf: Record<string, unknown> = {};
      for (const [format, file] of [["votable", "targets.vot"], ["csv", "targets.csv"], ["ecsv", "targets.ecsv"]]) {
        const response = await get(format);
        provenanceOf[format] = JSON.parse(response.headers.get("arcwright-provenance")!);
        writeFileSync(join(directory, file), Buffer.from(await response.arrayBuffer()));
      }
      // RA and Dec in sexagesimal beside their degrees, parsed back by astropy's Angle within half their last digit.
      const sexagesimalAs = (csv: boolean) =>
        sexagesimalColumns.map(({ after, column }) => ({
          text: csv ? headerOf(column) : column.name,
          degrees: csv ? headerOf(exportColumnOf(after)) : after,
          unit: after === "raDeg" ? "hourangle" : "deg",
          precision: after === "raDeg" ? RA_SECOND_DECIMALS : DEC_SECOND_DECIMALS,
        }));
      const expected = {
        files: {
          votable: { path: "targets.vot", columns: columnsAs((key) => key, true), rows: values, sexagesimal: sexagesimalAs(false) },
          csv: { path: "targets.csv", columns: columnsAs((key) => headerOf(exportColumnOf(key)), false), rows: csvValues, sexagesimal: sexagesimalAs(true) },
          ecsv: { path: "targets.ecsv", columns: columnsAs((key) => key, true), rows: values, sexagesimal: sexagesimalAs(false) },
        },
        // The ECSV header's meta is the record its download was sent with.
        provenance: provenanceOf.ecsv,
      };
      writeFileSync(join(directory, "expected.json"), JSON.stringify(expected));
      // The provenance states the digits written: inputs as stored (17), computed quantities at 4.
      expect((provenanceOf.ecsv as Provenance).inputs.digits).toMatch(/^raDeg:17,decDeg:17,.*,timeDelayDays:4,/);
      const startedAt = Date.now();
      const run = spawnSync("/usr/bin/python3", ["tests/validators/check_tables.py", directory], { encoding: "utf8" });
      console.info(`table validators: ${Date.now() - startedAt} ms for ${values.length} rows`);
      expect(run.error).toBeUndefined();
      const report = JSON.parse(run.stdout) as { problems: string[] };
      expect(report.problems).toEqual([]);
      expect(run.status).toBe(0);
    } finally {
      rmSync(directory, { recursive: true, force: true });
    }
    // Four JVMs (STILTS) and astropy beside the database: 3 s on an idle machine, several times that under load.
  }, 90_000);

  it("our own VOTable (and ECSV) of every column re-imports with every unchanged target unchanged, t0, source size, limb darkening, the source's magnitude, band and f_s, a fit's t_E and π_E and chosen cases included (9-digit RA/Dec made 16 of 20 an update)", async () => {
    const world = await demoLikeWorld();
    const votable = await (await download(world.actors.coi, world.proposalId, `format=votable&${allColumns}`)).text();
    const preview = await previewOf(world, votable);
    expect(preview.rows).toHaveLength(demoTargets.length + 3);
    // The event's inputs are read back as inputs; the computed columns (answeredCase, verdicts, θ_E) fill nothing.
    const mappedNames = Object.entries(preview.mapping).map(([field, assignment]) => `${field}: ${preview.columns[assignment!.column].name}`);
    expect(mappedNames).toEqual(
      expect.arrayContaining([
        "eventPeakJdUtc: eventPeakJdUtc",
        "sourceRadiusSolar: sourceRadiusSolar",
        "sourceRadiusThetaE: sourceRadiusThetaE",
        "limbDarkeningU: limbDarkeningU",
        "sourceMagnitude: sourceMagnitude",
        "sourceBand: sourceBand",
        "blendFraction: blendFraction",
        "einsteinTimeDays: einsteinTimeDays",
        "parallaxNorth: parallaxNorth",
        "parallaxEast: parallaxEast",
      ]),
    );
    expect(mappedNames.filter((entry) => /answeredCase|caseVerdict|caseAnswers|einsteinRadiusMas|timeRequestHours|peakSignalToNoise/.test(entry))).toEqual([]);
    const event = preview.rows.find((row) => row.cells.name === EXTRA_EVENT_NAME)!;
    expect(event.values).toMatchObject({ eventPeakJdUtc: EXTRA_EVENT_PEAK_JD, sourceRadiusThetaE: 0.0021, limbDarkeningU: 0.55, ...EXTRA_EVENT_SOURCE, ...EXTRA_EVENT_FIT });
    expect(preview.rows.filter((row) => row.values?.sourceRadiusSolar != null && row.values.eventPeakJdUtc != null)).toHaveLength(1);
    expect(preview.rows.filter((row) => row.action !== "skip").map((row) => `row ${row.rowNumber}: ${row.action}, ${row.detail}`)).toEqual([]);
    expect(preview.counts).toEqual({ added: 0, updated: 0, skipped: demoTargets.length + 3, invalid: 0 });
    // The ECSV export carries the same units and UCDs in its YAML header, and reads back the same.
    const ecsv = await (await download(world.actors.coi, world.proposalId, `format=ecsv&${allColumns}`)).text();
    const fromEcsv = await previewOf(world, ecsv, "targets.ecsv");
    expect(fromEcsv.mapping).toEqual(preview.mapping);
    expect(fromEcsv.counts).toEqual(preview.counts);
  });

  it("our own VOTable with one event's t0 edited updates that target alone, and the commit stores the new t0", async () => {
    const world = await demoLikeWorld();
    const votable = await (await download(world.actors.coi, world.proposalId, `format=votable&${allColumns}`)).text();
    const cell = `<TD>${EXTRA_EVENT_PEAK_JD}</TD>`;
    expect(votable.split(cell)).toHaveLength(2);
    const edited = votable.replace(cell, `<TD>${EXTRA_EVENT_PEAK_JD + 3}</TD>`);
    const preview = await previewOf(world, edited);
    expect(preview.rows.filter((row) => row.action !== "skip").map((row) => `${row.action}: ${row.detail}`)).toEqual([`update: updates ${EXTRA_EVENT_NAME} (same name)`]);
    expect(preview.counts).toEqual({ added: 0, updated: 1, skipped: demoTargets.length + 2, invalid: 0 });
    await commitImport({ proposalId: world.proposalId }, { fileId: preview.file.id, mapping: preview.mapping, toleranceArcsec: 1 }, world.actors.coi);
    const [stored] = await dbClient()
      .db.select({ eventPeakJdUtc: targets.eventPeakJdUtc, sourceRadiusThetaE: targets.sourceRadiusThetaE, scienceCase: targets.scienceCase })
      .from(targets)
      .where(and(eq(targets.proposalId, world.proposalId), eq(targets.name, EXTRA_EVENT_NAME)));
    expect(stored).toEqual({ eventPeakJdUtc: EXTRA_EVENT_PEAK_JD + 3, sourceRadiusThetaE: 0.0021, scienceCase: "photometric-microlensing" });
  });
});
