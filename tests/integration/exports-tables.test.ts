import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import Papa from "papaparse";
import { XMLParser } from "fast-xml-parser";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { dbClient } from "@/db/client";
import type { Actor } from "@/lib/server/actor";
import { targetTableExportRoutes } from "@/lib/exports/server/routes";
import { demoTargets } from "@/db/seed/demo-scenario";
import { descriptionOf, exportColumnKeys, exportColumnOf, headerOf } from "@/lib/exports/tables/columns";
import type { TargetTableJson } from "@/lib/exports/tables/json";
import { previewImport } from "@/lib/server/imports";
import { createWorld, pointTargetInput, proposalInput, type World } from "./support/world";
import { startUploadService, type UploadService } from "./support/upload-service";
import { createProposal } from "@/lib/server/proposals";
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
    expect(lines[0]).toBe("Name,RA (ICRS) [deg],Dec (ICRS) [deg],Priority,Tags");
    expect(lines.filter((line) => line.startsWith("#"))).toEqual([]);
    expect(csv).not.toContain("HYPERLINK");
    const parsed = Papa.parse<string[]>(csv, { skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    const cells = parsed.data.flat();
    // OWASP CSV injection: a cell starting with = + - @ tab or CR runs as a formula, unless it is a
    // plain decimal number ("-29.2"), which every spreadsheet reads as a number.
    expect(cells.filter((cell) => /^[=+\-@\t\r]/.test(cell) && !/^-?\d+(\.\d+)?(e[+-]?\d+)?$/i.test(cell))).toEqual([]);
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

/**
 * The test world with the demo scenario's targets added (bulge point lenses, whose time delays are
 * ~1e-11 d and shadows ~1e-5 µas, galaxy lenses, the compact object), plus a name with a true minus
 * sign and Ω as copied from papers that starts with #, which a CSV reader could take for a comment.
 */
async function demoLikeWorld(): Promise<World> {
  const world = await createWorld();
  const extra = { ...demoTargets[0], name: "#2 HE 0435−1223 Ω", ra: "04 38 14.9", dec: "-12 17 14" };
  for (const { notes: _notes, status: _status, ...target } of [...demoTargets, extra]) {
    await createTarget({ proposalId: world.proposalId }, target, world.actors.pi);
  }
  return world;
}

const allColumns = `columns=${exportColumnKeys.join(",")}`;

describe("table exports read by astropy and STILTS (tests/validators/check_tables.py)", () => {
  it("VOTable, CSV and ECSV parse, survive astropy's rewrite and STILTS with every value to 1e-9 and their units (VOTable precision='4' rewrote 1.752e-11 d as 0.0000)", async () => {
    const world = await demoLikeWorld();
    const get = (format: string) => download(world.actors.viewer, world.proposalId, `format=${format}&${allColumns}`);
    // The values every file must hold: the JSON export's, the same numbers at the same digits.
    const json = (await (await get("json")).json()) as TargetTableJson;
    const values = json.rows.map((row) => exportColumnKeys.map((key) => (row[key] === "" ? null : row[key])));
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
      const expected = {
        files: {
          votable: { path: "targets.vot", columns: columnsAs((key) => key, true), rows: values },
          csv: { path: "targets.csv", columns: columnsAs((key) => headerOf(exportColumnOf(key)), false), rows: csvValues },
          ecsv: { path: "targets.ecsv", columns: columnsAs((key) => key, true), rows: values },
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
  });

  it("our own VOTable of every column re-imports with every unchanged target unchanged (9-digit RA/Dec made 16 of 20 an update)", async () => {
    const world = await demoLikeWorld();
    const votable = await (await download(world.actors.coi, world.proposalId, `format=votable&${allColumns}`)).text();
    const upload = await service.uploadAs(world.actors.coi, "targetList", { proposalId: world.proposalId }, { name: "targets.vot", bytes: new TextEncoder().encode(votable), type: "application/x-votable+xml" });
    if (upload.stage !== "stored" || !upload.serverData.ok) throw new Error(`upload refused: ${JSON.stringify(upload)}`);
    const preview = await previewImport({ proposalId: world.proposalId }, { fileId: upload.serverData.fileId }, world.actors.coi);
    expect(preview.rows).toHaveLength(demoTargets.length + 2);
    expect(preview.rows.filter((row) => row.action !== "skip").map((row) => `row ${row.rowNumber}: ${row.action}, ${row.detail}`)).toEqual([]);
    expect(preview.counts).toEqual({ added: 0, updated: 0, skipped: demoTargets.length + 2, invalid: 0 });
  });
});
