import { spawnSync } from "node:child_process";
import Papa from "papaparse";
import { XMLParser } from "fast-xml-parser";
import { afterAll, describe, expect, it } from "vitest";
import { dbClient } from "@/db/client";
import type { Actor } from "@/lib/server/actor";
import { targetTableExportRoutes } from "@/lib/exports/server/routes";
import { createWorld, pointTargetInput, proposalInput } from "./support/world";
import { createProposal } from "@/lib/server/proposals";
import { createTarget } from "@/lib/server/targets";
import type { Provenance } from "@/lib/exports/provenance";
import packageJson from "@/package.json";

afterAll(async () => {
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

  it("reads back with astropy's CSV reader when Debian's python3-astropy is installed (it refused the # lines before the header)", async () => {
    const world = await createWorld();
    const response = await download(world.actors.viewer, world.proposalId, "format=csv&columns=name,raDeg,einsteinRadiusMas,tags&digits=einsteinRadiusMas:3");
    const csv = await response.text();
    const script = "import sys; from astropy.io import ascii; t = ascii.read(sys.stdin.read(), format='csv'); print(len(t)); print('|'.join(t.colnames)); print(t[0]['Einstein radius [mas]'])";
    const run = spawnSync("/usr/bin/python3", ["-c", script], { input: csv, encoding: "utf8" });
    if (run.error !== undefined || /No module named 'astropy'/.test(run.stderr)) {
      console.info("astropy check not run: install Debian's python3-astropy to run it; the RFC 4180 checks above still ran.");
      return;
    }
    expect(run.stderr).toBe("");
    expect(run.stdout.trim().split("\n")).toEqual(["1", "Name|RA (ICRS) [deg]|Einstein radius [mas]|Tags", "0.638"]);
  });

  it("every table download carries its provenance header, the same record as the JSON export's", async () => {
    const world = await createWorld();
    for (const format of ["csv", "tex", "votable", "json"]) {
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
