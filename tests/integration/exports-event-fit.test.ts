import { spawnSync } from "node:child_process";
import { randomUUID } from "node:crypto";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { dbClient } from "@/db/client";
import { eventPhotometry, proposals, targets, uploadedFiles } from "@/db/schema";
import { jdUtcFromDate } from "@/lib/astro/time";
import type { PhotometryMapping } from "@/lib/event-photometry/mapping";
import type { PhotometryDataset } from "@/lib/event-photometry/read-event-photometry";
import { eventFitFigure, parseEventFitQuery } from "@/lib/server/exports/event-fit-figure";
import { skyFigureRoutes } from "@/lib/server/api/figure-routes";
import { PRODUCT_NAME, PRODUCT_VERSION } from "@/lib/exports/provenance";
import { headerOf } from "@/lib/exports/tables/data-table";
import type { Actor } from "@/lib/server/actor";
import { pointLensMagnification } from "@/lib/physics/point-lens";
import { createWorld, type World } from "./support/world";

afterAll(async () => {
  await dbClient().sql.end();
});

function eventFit(actor: Actor | null, proposalId: string, query: string) {
  const url = `http://arcwright.test/api/proposals/${proposalId}/exports/figures/event-fit?${query}`;
  return skyFigureRoutes(async () => actor).GET(new Request(url), { params: Promise.resolve({ proposalId, figure: "event-fit" }) });
}

// A live event peaking on 2031-06-10 (the bulge is up at night from the test site then), seen by a
// survey in I over 60 days and a follow-up telescope in V over the last 12, up to 4 days after the
// peak; 1 % errors and a fixed pseudo-random noise.
const t0JdUtc = jdUtcFromDate(new Date("2031-06-10T04:00:00Z"));
const truth = { u0: 0.15, tEDays: 20, survey: { source: 3, blend: 1.5 }, site: { source: 1.2, blend: 0.2 } };

function photometryRows() {
  let state = 7;
  const noise = () => {
    state = (state * 16807) % 2147483647;
    return state / 2147483647 - 0.5;
  };
  const times: number[] = [];
  const fluxes: number[] = [];
  const errors: number[] = [];
  const indices: number[] = [];
  for (const [index, count, startDays, spanDays, f] of [
    [0, 150, -56, 60, truth.survey],
    [1, 60, -8, 12, truth.site],
  ] as const) {
    for (let i = 0; i < count; i++) {
      const t = t0JdUtc + startDays + (spanDays * i) / count;
      const clean = f.source * pointLensMagnification(Math.hypot(truth.u0, (t - t0JdUtc) / truth.tEDays)) + f.blend;
      times.push(t);
      fluxes.push(clean * (1 + 0.02 * noise()));
      errors.push(0.01 * clean);
      indices.push(index);
    }
  }
  return { times, fluxes, errors, indices };
}

/** The photometry as the upload would keep it (helper rows of uploaded_files and event_photometry). */
async function keepPhotometry(world: World): Promise<void> {
  const { db } = dbClient();
  await db.update(proposals).set({ cycleStartDate: "2031-05-01", cycleEndDate: "2031-08-31" }).where(eq(proposals.id, world.proposalId));
  const [file] = await db
    .insert(uploadedFiles)
    .values({ key: `event-${randomUUID()}`, name: "event.csv", sizeBytes: 9000, contentType: "text/csv", proposalId: world.proposalId, uploadedBy: world.actors.coi.userId, purpose: "event_photometry" })
    .returning();
  const mapping: PhotometryMapping = { timeColumn: 0, timeKind: "JD", timeOffsetDays: 0, timeScale: "UTC", brightnessKind: "flux", valueColumn: 1, errorColumn: 2, bandColumn: 3, datasetColumn: 4 };
  const datasets: PhotometryDataset[] = [
    { name: "Survey", band: "I", pointCount: 150, wasSorted: false },
    { name: "Site", band: "V", pointCount: 60, wasSorted: false },
  ];
  const rows = photometryRows();
  await db.insert(eventPhotometry).values({ targetId: world.targetId, fileId: file.id, mapping, datasets, timesJdUtc: rows.times, fluxes: rows.fluxes, fluxErrors: rows.errors, datasetIndices: rows.indices, addedBy: world.actors.coi.userId });
}

describe("light-curve fit figure export (format=svg|pdf|ecsv, the fit panel's choices as the query)", () => {
  it("signed out 401, non-member 404; a viewer gets the SVG of the fit with the default reference dataset (the one in the proposal's band) and its references, and the same fit's data read back by astropy and STILTS", async () => {
    const world = await createWorld();
    await keepPhotometry(world);
    const query = `targetId=${world.targetId}&rescale=1&finite=0&parallax=0`;
    expect((await eventFit(null, world.proposalId, `${query}&format=svg`)).status).toBe(401);
    expect((await eventFit(world.actors.outsider, world.proposalId, `${query}&format=svg`)).status).toBe(404);

    let startedAt = Date.now();
    const svgResponse = await eventFit(world.actors.viewer, world.proposalId, `${query}&format=svg`);
    const svgMs = Date.now() - startedAt;
    expect(svgResponse.status).toBe(200);
    expect(svgResponse.headers.get("content-disposition")).toBe('attachment; filename="light-curve-fit-tb-ml-0001.svg"');
    const svg = await svgResponse.text();
    expect(svg).toContain("Light curve of TB-ML-0001 with its point-lens fit (χ²/dof = ");
    // A new proposal observes in I (photometry-schema.ts defaults): the survey's I is the reference.
    expect(svg).toContain("model (on Survey)");
    expect(svg).toContain("magnitude (Survey scale)");
    for (const key of ["paczynski1986", "gould2004", "levenberg1944", "marquardt1963", "golub1973"]) expect(svg).toContain(`&quot;key&quot;:&quot;${key}&quot;`);
    expect(svg).toContain("&quot;rescaleErrors&quot;:true");
    // The prediction's 30 days from the last point (2031-06-14) fall in the cycle: the windows are shaded.
    expect(svg).toContain("usable windows (shaded)");

    startedAt = Date.now();
    const ecsvResponse = await eventFit(world.actors.viewer, world.proposalId, `${query}&format=ecsv`);
    const ecsvMs = Date.now() - startedAt;
    expect(ecsvResponse.status).toBe(200);
    const provenance = JSON.parse(ecsvResponse.headers.get("arcwright-provenance")!);
    const ecsv = await ecsvResponse.text();
    // The same fit computed again (a fixed seed for the prediction): the rows the file must hold.
    const plot = await eventFitFigure(
      (await dbClient().db.select().from(proposals).where(eq(proposals.id, world.proposalId)))[0],
      parseEventFitQuery({ targetId: world.targetId, rescale: "1", finite: "0", parallax: "0" }),
      world.actors.viewer,
      { appOrigin: "http://arcwright.test", inputs: {} },
    );
    const table = plot.data;
    expect(table.rows.length).toBe(210 + 301);
    const votable = await eventFit(world.actors.viewer, world.proposalId, `${query}&format=votable`);
    expect(votable.status).toBe(200);
    const pdfResponse = await eventFit(world.actors.viewer, world.proposalId, `${query}&format=pdf`);
    expect(pdfResponse.status).toBe(200);
    console.info(`event-fit export: svg ${svgMs} ms, ecsv ${ecsvMs} ms (210 points, 2 datasets, fit with error rescaling and a 1,000-draw prediction)`);

    const directory = mkdtempSync(join(tmpdir(), "arcwright-event-fit-"));
    try {
      writeFileSync(join(directory, "event-fit.ecsv"), ecsv);
      writeFileSync(join(directory, "event-fit.vot"), await votable.text());
      writeFileSync(join(directory, "event-fit.pdf"), new Uint8Array(await pdfResponse.arrayBuffer()));
      const expected = {
        tables: [
          {
            name: table.name,
            files: { ecsv: "event-fit.ecsv", votable: "event-fit.vot" },
            columns: table.columns.map((column) => ({ name: column.name, header: headerOf(column), unit: column.voUnit === "" ? null : column.voUnit, ucd: column.ucd, description: column.description })),
            rows: table.rows,
            csvRows: table.rows,
            provenance,
          },
        ],
      };
      writeFileSync(join(directory, "expected.json"), JSON.stringify(expected));
      const data = spawnSync("/usr/bin/python3", ["tests/validators/check_figure_data.py", directory], { encoding: "utf8" });
      expect(data.error).toBeUndefined();
      const dataReport = JSON.parse(data.stdout) as { problems: string[]; rows: number };
      expect(dataReport.problems).toEqual([]);
      expect(dataReport.rows).toBe(table.rows.length);

      // The plot is drawn as outlines in the PDF; its caption (title and link back) is the text.
      const figures = { pdf: [{ path: join(directory, "event-fit.pdf"), texts: ["TB-ML-0001"], links: [], author: world.actors.viewer.name, software: `${PRODUCT_NAME} ${PRODUCT_VERSION}` }], png: [] };
      writeFileSync(join(directory, "expected.json"), JSON.stringify(figures));
      const pdf = spawnSync("/usr/bin/python3", ["tests/validators/check_figures.py", directory], { encoding: "utf8" });
      const pdfReport = JSON.parse(pdf.stdout) as { problems: string[] };
      expect(pdfReport.problems).toEqual([]);
    } finally {
      rmSync(directory, { recursive: true, force: true });
    }
  }, 120_000);

  it("says in words why it cannot draw: a reference dataset the photometry lacks, no photometry, a target that is not a point lens, a bad switch", async () => {
    const world = await createWorld();
    const base = `targetId=${world.targetId}&format=svg`;
    const none = await eventFit(world.actors.viewer, world.proposalId, base);
    expect(none.status).toBe(400);
    expect((await none.json()).error.message).toBe("TB-ML-0001 has no photometry to fit yet: add a photometry file on its page.");
    await keepPhotometry(world);
    const unknown = await eventFit(world.actors.viewer, world.proposalId, `${base}&reference=Elsewhere`);
    expect(unknown.status).toBe(400);
    expect((await unknown.json()).error.fields.reference).toEqual(["The reference dataset “Elsewhere” is not among TB-ML-0001's datasets."]);
    const badSwitch = await eventFit(world.actors.viewer, world.proposalId, `${base}&parallax=yes`);
    expect(badSwitch.status).toBe(400);
    expect(Object.keys((await badSwitch.json()).error.fields)).toEqual(["parallax"]);
    await dbClient().db.update(targets).set({ lensModel: "sis" }).where(eq(targets.id, world.targetId));
    const sis = await eventFit(world.actors.viewer, world.proposalId, base);
    expect(sis.status).toBe(400);
    expect((await sis.json()).error.message).toBe("TB-ML-0001 is not a point-lens target: the light-curve fit is for point-lens events.");
  });
});
