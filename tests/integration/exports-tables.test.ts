import Papa from "papaparse";
import { XMLParser } from "fast-xml-parser";
import { afterAll, describe, expect, it } from "vitest";
import { dbClient } from "@/db/client";
import type { Actor } from "@/lib/server/actor";
import { targetTableExportRoutes } from "@/lib/exports/server/routes";
import { createWorld, pointTargetInput, proposalInput } from "./support/world";
import { createTarget } from "@/lib/server/targets";
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
    expect(response.headers.get("content-disposition")).toBe('attachment; filename="arcs-over-the-tessellate-bulge-field-targets.csv"');
    const parsed = Papa.parse<string[]>(await response.text(), { comments: "#", skipEmptyLines: true });
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
});
