import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import extractChunks from "png-chunks-extract";
import { PDFParse } from "pdf-parse";
import { eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { dbClient } from "@/db/client";
import { targets } from "@/db/schema";
import { PRODUCT_NAME, PRODUCT_VERSION, PROVENANCE_HEADER, type Provenance } from "@/lib/exports/provenance";
import { tableWriters } from "@/lib/exports/tables/formats";
import type { Actor } from "@/lib/server/actor";
import { benchFigureRoutes, skyFigureRoutes } from "@/lib/server/api/figure-routes";
import { technicalSummaryRoutes } from "@/lib/server/api/export-routes";
import { createWorld } from "./support/world";

afterAll(async () => {
  await dbClient().sql.end();
});

const base = (proposalId: string) => `http://arcwright.test/api/proposals/${proposalId}/exports`;

function skyFigure(actor: Actor | null, proposalId: string, figure: string, query: string) {
  return skyFigureRoutes(async () => actor).GET(new Request(`${base(proposalId)}/figures/${figure}?${query}`), { params: Promise.resolve({ proposalId, figure }) });
}

function summary(actor: Actor | null, proposalId: string, query = "") {
  return technicalSummaryRoutes(async () => actor).GET(new Request(`${base(proposalId)}/summary?${query}`), { params: Promise.resolve({ proposalId }) });
}

function benchFigure(actor: Actor | null, figure: string, query: string) {
  return benchFigureRoutes(async () => actor).GET(new Request(`http://arcwright.test/api/bench/exports/${figure}?${query}`), { params: Promise.resolve({ figure }) });
}

/** The reproduce link in an exported SVG's provenance metadata. */
const reproduceUrlOf = (svg: string) => /&quot;reproduceUrl&quot;:&quot;([^&]+(?:&amp;[^&]+)*)&quot;/.exec(svg)![1].replace(/&amp;/g, "&");

const fieldsOf = async (response: Response) => ((await response.json()) as { error: { fields: Record<string, string[]> } }).error.fields;
const pngWidthPx = async (response: Response) => Buffer.from(extractChunks(new Uint8Array(await response.arrayBuffer()))[0].data).readUInt32BE(0);

describe("figure and summary exports: the same role rules as the views", () => {
  it("night chart: signed out 401, non-member 404, viewer gets the SVG with the target and night in its provenance", async () => {
    const world = await createWorld();
    const query = `targetId=${world.targetId}&date=2031-06-15&format=svg`;
    expect((await skyFigure(null, world.proposalId, "night", query)).status).toBe(401);
    expect((await skyFigure(world.actors.outsider, world.proposalId, "night", query)).status).toBe(404);
    const response = await skyFigure(world.actors.viewer, world.proposalId, "night", query);
    expect(response.status).toBe(200);
    expect(response.headers.get("content-disposition")).toBe('attachment; filename="night-tb-ml-0001-2031-06-15.svg"');
    const svg = await response.text();
    // The figure names its target and site (it stands alone on a page).
    expect(svg).toContain("TB-ML-0001 from Cerro Velado test site, night of 2031-06-15");
    const url = new URL(reproduceUrlOf(svg));
    expect(url.pathname).toBe("/sky");
    // The site of the test proposal (world.ts): latitude −24.6°, horizon 20°.
    expect(url.searchParams.get("lat")).toBe("-24.6");
    expect(url.searchParams.get("date")).toBe("2031-06-15");
  });

  it("a bad night or a target of another proposal is refused by name", async () => {
    const world = await createWorld();
    const other = await createWorld();
    const bad = await skyFigure(world.actors.pi, world.proposalId, "night", `targetId=${world.targetId}&date=2031-02-30`);
    expect(bad.status).toBe(400);
    expect(Object.keys((await bad.json()).error.fields)).toEqual(["date"]);
    expect((await skyFigure(world.actors.pi, world.proposalId, "night", `targetId=${other.targetId}&date=2031-06-15`)).status).toBe(404);
    expect((await skyFigure(world.actors.pi, world.proposalId, "sunrise", "")).status).toBe(404);
  });

  it("season chart as PNG at the chosen width", async () => {
    const world = await createWorld();
    const response = await skyFigure(world.actors.coi, world.proposalId, "season", "start=2031-03-01&nights=60&format=png&width=900&dpi=150");
    expect(response.status).toBe(200);
    const chunks = extractChunks(new Uint8Array(await response.arrayBuffer()));
    expect(Buffer.from(chunks[0].data).readUInt32BE(0)).toBe(900);
  });

  it("bench figure: open without signing in, like the bench; a bad sketch field is named", async () => {
    const ok = await benchFigure(null, "light-curve", "format=svg&mass=0.3%20Msun");
    expect(ok.status).toBe(200);
    expect(await ok.text()).toContain("magnification");
    const bad = await benchFigure(null, "lens-plane", "format=svg&dl=far");
    expect(bad.status).toBe(400);
    expect(Object.keys((await bad.json()).error.fields)).toEqual(["dl"]);
  });

  it("the data behind a figure downloads as ECSV, VOTable and CSV through the figure's own route, with its roles and provenance", async () => {
    const world = await createWorld();
    const query = `targetId=${world.targetId}&date=2031-06-15`;
    expect((await skyFigure(world.actors.outsider, world.proposalId, "night", `${query}&format=ecsv`)).status).toBe(404);
    const night = await skyFigure(world.actors.viewer, world.proposalId, "night", `${query}&format=ecsv`);
    expect(night.status).toBe(200);
    expect(night.headers.get("content-disposition")).toBe('attachment; filename="night-tb-ml-0001-2031-06-15-data.ecsv"');
    const ecsv = await night.text();
    // ECSV 1.0 (Astropy APE 6): the version line, then the YAML header naming each column with its unit.
    expect(ecsv.startsWith("# %ECSV 1.0\n")).toBe(true);
    expect(ecsv).toMatch(/# +- \{ ?name: altitude, unit: deg,/);
    const provenance = JSON.parse(night.headers.get(PROVENANCE_HEADER)!) as Provenance;
    expect(provenance.inputs.target).toBe("TB-ML-0001");
    // The figure's own methods are cited beside the constants' (lib/citations): air mass and ephemerides.
    expect(provenance.references.map((reference) => reference.key)).toEqual(expect.arrayContaining(["pickering2002", "astronomyengine", "hogg1999"]));

    const season = await skyFigure(world.actors.coi, world.proposalId, "season", "start=2031-03-01&nights=7&format=votable");
    expect(season.status).toBe(200);
    expect(season.headers.get("content-type")).toBe(tableWriters.votable.contentType);
    const votable = await season.text();
    // One row per target and night: the one target of the test proposal over 7 nights.
    expect(votable.match(/<TR>/g)).toHaveLength(7);

    // A plain CSV holds no provenance: its name carries the time of export (as the table exports do).
    const csv = await benchFigure(null, "deflection", "format=csv&mass=0.3%20Msun");
    expect(csv.status).toBe(200);
    expect(csv.headers.get("content-disposition")).toMatch(/^attachment; filename="bench-deflection-data-\d{8}T\d{6}Z\.csv"$/);
    const [header, ...rows] = (await csv.text()).trim().split("\r\n");
    expect(header).toContain("[rad]");
    expect(rows.length).toBeGreaterThan(100);
  });

  it("technical summary PDF: viewer may download it; it holds the target table and the season figure", async () => {
    const world = await createWorld();
    expect((await summary(null, world.proposalId)).status).toBe(401);
    expect((await summary(world.actors.outsider, world.proposalId)).status).toBe(404);
    expect((await summary(world.actors.pi, world.proposalId, "figures=sky")).status).toBe(400);
    const response = await summary(world.actors.viewer, world.proposalId, "columns=name,einsteinRadiusMas&digits=einsteinRadiusMas:3");
    expect(response.status).toBe(200);
    expect(response.headers.get("content-type")).toBe("application/pdf");
    const parser = new PDFParse({ data: new Uint8Array(await response.arrayBuffer()) });
    const { text, total } = await parser.getText();
    // The table, the season figure, and the provenance (one page or more, as its references grow).
    expect(total).toBeGreaterThanOrEqual(3);
    expect(text).toContain("Einstein radius [mas]");
    // θ_E of the world's point lens (0.4 M☉, 4 kpc / 8 kpc): 0.6381 mas, at 3 digits.
    expect(text).toContain("TB-ML-0001");
    expect(text).toContain("0.638");
    // The target's science case in words: a compact lens whose images blend within 60 mas is an event to watch.
    expect(text).toContain("Science cases");
    expect(text).toContain("Photometric microlensing event (inferred from the model and numbers)");
    expect(text).toContain("Peak magnification: Feasible");
    expect(text).toContain("Usable dark hours per night");
    expect(text).toContain("Constant GM_sun");
    await parser.destroy();
  });

  it("technical summary PDF bundles the night charts of chosen targets, and names a bad choice", async () => {
    const world = await createWorld();
    const chosen = `figures=season,night&nightTargets=${world.targetId}&night=2031-06-15`;
    const response = await summary(world.actors.viewer, world.proposalId, chosen);
    expect(response.status).toBe(200);
    const parser = new PDFParse({ data: new Uint8Array(await response.arrayBuffer()) });
    const { text, total } = await parser.getText();
    // More pages than the table + season + provenance summary (3): the night chart is in it too.
    expect(total).toBeGreaterThan(3);
    expect(text).toContain("Altitude and air mass of TB-ML-0001 through the night of 2031-06-15");
    expect(text).toContain("Usable dark hours per night");
    await parser.destroy();

    const missingTargets = await summary(world.actors.viewer, world.proposalId, "figures=night");
    expect(missingTargets.status).toBe(400);
    expect(((await missingTargets.json()) as { error: { fields: Record<string, string[]> } }).error.fields.nightTargets).toEqual(["Choose at least one target for the night charts."]);
    const badId = await summary(world.actors.viewer, world.proposalId, "figures=night&nightTargets=nope");
    expect(badId.status).toBe(400);
  });

  it("bench PNG wider than 2000 px signed out is refused naming the width (was rendered at 8000 px for anyone)", async () => {
    const world = await createWorld();
    const wide = await benchFigure(null, "deflection", "format=png&width=8000");
    expect(wide.status).toBe(400);
    expect(wide.headers.get("cache-control")).toBe("no-store");
    expect(await fieldsOf(wide)).toEqual({ width: ["Without signing in, the width is at most 2000 px; sign in for up to 8000 px."] });
    const signedOut = await benchFigure(null, "deflection", "format=png&width=2000&dpi=72");
    expect(signedOut.status).toBe(200);
    expect(await pngWidthPx(signedOut)).toBe(2000);
    const signedIn = await benchFigure(world.actors.viewer, "deflection", "format=png&width=2400&dpi=72");
    expect(signedIn.status).toBe(200);
    expect(await pngWidthPx(signedIn)).toBe(2400);
    const beyondAll = await benchFigure(world.actors.viewer, "deflection", "format=png&width=8001");
    expect(beyondAll.status).toBe(400);
    expect(await fieldsOf(beyondAll)).toEqual({ width: ["The width is at most 8000 px."] });
  });

  it("technical summary refuses a repeated figure or night target naming the field (figures=season x8 took 4.6 s)", async () => {
    const world = await createWorld();
    const repeated = await summary(world.actors.viewer, world.proposalId, `figures=${Array(8).fill("season").join(",")}`);
    expect(repeated.status).toBe(400);
    expect(Object.keys(await fieldsOf(repeated))).toEqual(["figures"]);
    const twice = await summary(world.actors.viewer, world.proposalId, `figures=night,season,night&nightTargets=${world.targetId}`);
    expect(Object.keys(await fieldsOf(twice))).toEqual(["figures"]);
    const sameTarget = await summary(world.actors.viewer, world.proposalId, `figures=night&nightTargets=${world.targetId},${world.targetId}`);
    expect(sameTarget.status).toBe(400);
    expect(await fieldsOf(sameTarget)).toEqual({ nightTargets: ["Name each target once."] });
  });

  it("figure and summary downloads are private and never stored by a cache", async () => {
    const world = await createWorld();
    const figure = await skyFigure(world.actors.viewer, world.proposalId, "night", `targetId=${world.targetId}&date=2031-06-15&format=svg`);
    expect(figure.headers.get("cache-control")).toBe("private, no-store");
    expect((await benchFigure(null, "deflection", "format=svg")).headers.get("cache-control")).toBe("private, no-store");
    expect((await summary(world.actors.viewer, world.proposalId)).headers.get("cache-control")).toBe("private, no-store");
  });
});

describe("figure exports read by qpdf, poppler and pngcheck (tests/validators/check_figures.py)", () => {
  it("PDFs: sound, every font embedded, a Unicode target name extracted intact, the whole link, the exporter as Author; PNGs: sound with their DPI", async () => {
    const world = await createWorld();
    const name = "Śrī Ωmega−1";
    await dbClient().db.update(targets).set({ name }).where(eq(targets.id, world.targetId));
    const exporter = { ...world.actors.viewer, name: "Łucja Ōta" };
    const night = `targetId=${world.targetId}&date=2031-06-15`;
    const directory = mkdtempSync(join(tmpdir(), "arcwright-figures-"));
    const save = async (fileName: string, response: Response) => {
      expect(response.status).toBe(200);
      const path = join(directory, fileName);
      writeFileSync(path, new Uint8Array(await response.arrayBuffer()));
      return path;
    };
    const nightLink = reproduceUrlOf(await (await skyFigure(exporter, world.proposalId, "night", `${night}&format=svg`)).text());
    const benchLink = reproduceUrlOf(await (await benchFigure(null, "deflection", "format=svg&mass=0.3%20Msun")).text());
    const seasonSvg = await (await skyFigure(exporter, world.proposalId, "season", "start=2031-03-01&nights=30&format=svg")).text();
    // The season figure's link opens the season view on the window it was drawn for, not just the proposal.
    const seasonLink = new URL(reproduceUrlOf(seasonSvg));
    expect(seasonLink.pathname).toBe(`/proposals/${world.proposalId}/sky`);
    expect(Object.fromEntries(seasonLink.searchParams)).toEqual({ start: "2031-03-01", nights: "30" });
    const software = `${PRODUCT_NAME} ${PRODUCT_VERSION}`;
    const expected = {
      pdf: [
        { path: await save("night.pdf", await skyFigure(exporter, world.proposalId, "night", `${night}&format=pdf`)), texts: [name], links: [nightLink], author: "Łucja Ōta", software },
        { path: await save("bench.pdf", await benchFigure(null, "deflection", "format=pdf&mass=0.3%20Msun")), texts: ["Deflection angle against impact parameter"], links: [benchLink], author: null, software },
        { path: await save("bench-signed-in.pdf", await benchFigure(exporter, "deflection", "format=pdf&mass=0.3%20Msun")), texts: [], links: [benchLink], author: "Łucja Ōta", software },
        { path: await save("summary.pdf", await summary(exporter, world.proposalId, `figures=night&nightTargets=${world.targetId}&night=2031-06-15`)), texts: [name], links: [], author: "Łucja Ōta", software },
      ],
      png: [
        { path: await save("season.png", await skyFigure(exporter, world.proposalId, "season", "start=2031-03-01&nights=30&format=png&width=900&dpi=150")), dpi: 150 },
        { path: await save("bench.png", await benchFigure(null, "lens-plane", "format=png&width=1200&dpi=300")), dpi: 300 },
      ],
    };
    writeFileSync(join(directory, "expected.json"), JSON.stringify(expected));
    const run = spawnSync("/usr/bin/python3", ["tests/validators/check_figures.py", directory], { encoding: "utf8" });
    const report = JSON.parse(run.stdout) as { problems: string[]; checked: Record<string, { fonts?: { name: string }[] }> };
    expect(report.problems).toEqual([]);
    expect(run.status).toBe(0);
    // The caption's and the summary's text faces: Source Sans 3 (Latin, Latin Extended, Greek) at least.
    expect(report.checked["night.pdf"].fonts!.length).toBeGreaterThanOrEqual(3);
    // Ten exports and the validators: about 5 s on an idle machine; room for a loaded one.
  }, 60_000);
});
