import { readFileSync } from "node:fs";
import { join } from "node:path";
import { and, count, desc, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { dbClient } from "@/db/client";
import { activity, eventPhotometry, uploadedFiles } from "@/db/schema";
import type { PhotometryCommitResult, PhotometryPreviewView, TargetPhotometryView } from "@/lib/event-photometry/views";
import { photometryCollectionRoutes, photometryFileRoutes, photometryPreviewRoutes } from "@/lib/server/api/photometry-routes";
import type { Actor } from "@/lib/server/actor";
import { createTarget, deleteTarget } from "@/lib/server/targets";
import { createWorld, type World } from "./support/world";
import { startUploadService, type UploadService } from "./support/upload-service";

const { db, sql: connection } = dbClient();
let service: UploadService;

beforeAll(async () => {
  service = await startUploadService();
});

afterAll(async () => {
  await service.stop();
  await connection.end();
});

const encode = (text: string) => new TextEncoder().encode(text);
const base = (world: World) => `http://arcwright.test/api/proposals/${world.proposalId}/targets/${world.targetId}/photometry`;
const targetParams = (world: World) => ({ proposalId: world.proposalId, targetId: world.targetId });

type Answer<T> = { status: number; body: T & { error?: { code: string; message: string; fields?: Record<string, string[]> } } };

/** One request through the app's route handler, as the browser sends it. */
async function call<T>(routes: Record<string, unknown>, method: string, actor: Actor | null, url: string, params: Record<string, string>, body?: unknown): Promise<Answer<T>> {
  const handler = routes[method] as (request: Request, context: { params: Promise<Record<string, string>> }) => Promise<Response>;
  const response = await handler(new Request(url, { method, ...(body === undefined ? {} : { body: JSON.stringify(body) }) }), { params: Promise.resolve(params) });
  return { status: response.status, body: response.status === 204 ? ({} as Answer<T>["body"]) : await response.json() };
}

const as = (actor: Actor | null) => async () => actor;
const preview = (world: World, actor: Actor, body: unknown) => call<PhotometryPreviewView>(photometryPreviewRoutes(as(actor)), "POST", actor, `${base(world)}/preview`, targetParams(world), body);
const commit = (world: World, actor: Actor, body: unknown) => call<PhotometryCommitResult>(photometryCollectionRoutes(as(actor)), "POST", actor, base(world), targetParams(world), body);
const read = (world: World, actor: Actor) => call<TargetPhotometryView>(photometryCollectionRoutes(as(actor)), "GET", actor, base(world), targetParams(world));
const remove = (world: World, actor: Actor, photometryId: string) =>
  call<object>(photometryFileRoutes(as(actor)), "DELETE", actor, `${base(world)}/${photometryId}`, { ...targetParams(world), photometryId });

/** A rising light curve as a survey writes it: HJD − 2450000 (2031-06), I magnitude, its error, the telescope. */
function survey(rows: number, { scale = "", telescope = "Halcyon" }: { scale?: string; telescope?: string } = {}): string {
  const lines = [`HJD-2450000${scale === "" ? "" : ` (${scale})`},I,sigma_I,telescope`];
  for (let i = 0; i < rows; i += 1) lines.push(`${(13_000 + i * 0.5).toFixed(5)},${(18 - i * 0.01).toFixed(3)},0.012,${telescope}`);
  return lines.join("\n");
}

async function upload(world: World, name: string, text: string, actor: Actor = world.actors.coi): Promise<{ fileId: string; key: string }> {
  const attempt = await service.uploadAs(actor, "eventPhotometry", targetParams(world), { name, bytes: encode(text), type: "text/csv" });
  if (attempt.stage !== "stored" || !attempt.serverData.ok) throw new Error(`upload refused: ${JSON.stringify(attempt)}`);
  return { fileId: attempt.serverData.fileId, key: attempt.key };
}

describe("a target's photometry through the upload service and its routes", () => {
  it("uploads, proposes the mapping, refuses an unset time scale naming the time column, keeps, reads and deletes the file", async () => {
    const world = await createWorld();
    const { fileId, key } = await upload(world, "halcyon 2031.csv", survey(40));
    expect(await db.select({ n: count() }).from(eventPhotometry).where(eq(eventPhotometry.targetId, world.targetId))).toEqual([{ n: 0 }]);

    const proposed = await preview(world, world.actors.coi, { fileId });
    expect(proposed.status).toBe(200);
    expect(proposed.body.mapping).toEqual({ timeColumn: 0, timeKind: "HJD", timeOffsetDays: 2_450_000, brightnessKind: "magnitude", valueColumn: 1, errorColumn: 2, band: "I", datasetColumn: 3 });
    expect(proposed.body.mappingProblems).toEqual(["Say which time scale the times are in: UTC, TT or TDB."]);
    expect(proposed.body.summary).toBeNull();
    expect(proposed.body.datasetName).toBe("halcyon 2031");

    const unset = await commit(world, world.actors.coi, { fileId, mapping: proposed.body.mapping });
    expect(unset.status).toBe(400);
    expect(unset.body.error?.fields).toEqual({ "mapping.timeScale": ["Choose the time scale of the time column (UTC, TT or TDB): the file does not say."] });

    const mapping = { ...proposed.body.mapping, timeScale: "UTC" };
    const readable = await preview(world, world.actors.coi, { fileId, mapping });
    expect(readable.body.summary).toBe("40 points in 1 dataset (Halcyon I: 40)");
    expect(readable.body.rows.every((row) => row.isKept && row.errors.length === 0)).toBe(true);

    const kept = await commit(world, world.actors.coi, { fileId, mapping });
    expect(kept.status).toBe(201);
    expect(kept.body.file).toMatchObject({ fileName: "halcyon 2031.csv", timeFormat: "HJD − 2450000 (UTC)", pointCount: 40, refusedRowCount: 0, addedBy: "coi", datasets: [{ name: "Halcyon I", band: "I", pointCount: 40, wasSorted: false }] });
    expect(kept.body.message).toBe("Kept 40 points in 1 dataset (Halcyon I: 40) from halcyon 2031.csv.");
    const [entry] = await db.select().from(activity).where(eq(activity.proposalId, world.proposalId)).orderBy(desc(activity.id)).limit(1);
    expect(entry).toMatchObject({ action: "target.updated", subject: "TB-ML-0001: photometry from halcyon 2031.csv (40 points in 1 dataset)" });

    // A viewer reads what a Co-I kept; a non-member finds nothing.
    const view = await read(world, world.actors.viewer);
    expect(view.status).toBe(200);
    expect(view.body.files.map((file) => file.id)).toEqual([kept.body.file.id]);
    expect(view.body.points).toHaveLength(40);
    // The HJD is the geocentric time plus the light time from the Earth to the Sun along the line of
    // sight, at most 1 au / c = 499 s = 0.00578 d (IAU 2012 au); 18 mag is flux 10^(−0.4 (18 − 22)) = 39.81.
    expect(Math.abs(view.body.points[0].tDays - 2_463_000)).toBeLessThan(0.0058);
    expect(view.body.points[0]).toMatchObject({ dataset: "Halcyon I", flux: expect.closeTo(39.81, 2) });
    expect(view.body.points.every((point, i, all) => i === 0 || point.tDays > all[i - 1].tDays)).toBe(true);
    expect((await read(world, world.actors.outsider)).status).toBe(404);

    expect((await remove(world, world.actors.viewer, kept.body.file.id)).status).toBe(403);
    expect((await remove(world, world.actors.coi, kept.body.file.id)).status).toBe(204);
    expect((await read(world, world.actors.pi)).body).toEqual({ files: [], points: [] });
    expect(await db.select().from(uploadedFiles).where(eq(uploadedFiles.id, fileId))).toEqual([]);
    expect(await service.isStored(key, 2_000)).toBe(false);
    const [removal] = await db.select().from(activity).where(eq(activity.proposalId, world.proposalId)).orderBy(desc(activity.id)).limit(1);
    expect(removal.subject).toBe("TB-ML-0001: photometry halcyon 2031.csv removed");
  });

  it("a viewer cannot upload; a target that is not a point lens is refused in words; a refused file leaves no record", async () => {
    const world = await createWorld();
    const file = { name: "lc.csv", bytes: encode(survey(10, { scale: "UTC" })), type: "text/csv" };
    expect(await service.uploadAs(world.actors.viewer, "eventPhotometry", targetParams(world), file)).toMatchObject({ stage: "presign", status: 403 });
    expect(await service.uploadAs(world.actors.outsider, "eventPhotometry", targetParams(world), file)).toMatchObject({ stage: "presign", status: 404 });
    const galaxy = await createTarget({ proposalId: world.proposalId }, { name: "GAL-1", ra: "10 00 00", dec: "+02 00 00", lensModel: "sis", velocityDispersionKmPerS: 250, lensRedshift: 0.3, sourceRedshift: 1.5, sourceOffsetThetaE: 0.3, priority: 3 }, world.actors.pi);
    const refused = await service.uploadAs(world.actors.coi, "eventPhotometry", { proposalId: world.proposalId, targetId: galaxy.id }, file);
    expect(refused).toMatchObject({ stage: "presign", status: 400, message: expect.stringMatching(/^Photometry is fitted with a point lens: GAL-1 has a .+ lens\./) });

    const before = await db.select({ n: count() }).from(uploadedFiles).where(eq(uploadedFiles.proposalId, world.proposalId));
    const binary = await service.uploadAs(world.actors.coi, "eventPhotometry", targetParams(world), { name: "lc.csv", bytes: new Uint8Array([0xff, 0xfe, 0x00, 0x81, 0x90]), type: "text/csv" });
    expect(binary).toMatchObject({ stage: "stored", serverData: { ok: false, message: expect.stringMatching(/not UTF-8 text/) } });
    expect(await db.select({ n: count() }).from(uploadedFiles).where(eq(uploadedFiles.proposalId, world.proposalId))).toEqual(before);
    if (binary.stage === "stored") expect(await service.isStored(binary.key, 3_000)).toBe(false);
  });

  it("a dataset name another file of the target uses is kept with a suffix, and the answer says so", async () => {
    const world = await createWorld();
    for (const expected of ["Halcyon I", "Halcyon I (2)"]) {
      const { fileId } = await upload(world, "halcyon.csv", survey(8, { scale: "UTC" }));
      const { body } = await preview(world, world.actors.pi, { fileId });
      const kept = await commit(world, world.actors.pi, { fileId, mapping: body.mapping });
      expect(kept.body.file.datasets.map((dataset) => dataset.name)).toEqual([expected]);
    }
    const view = await read(world, world.actors.coi);
    expect(view.body.files[1].datasets[0].name).toBe("Halcyon I (2)");
    expect(new Set(view.body.points.map((point) => point.dataset))).toEqual(new Set(["Halcyon I", "Halcyon I (2)"]));
    const [last] = await db.select().from(eventPhotometry).where(eq(eventPhotometry.targetId, world.targetId)).orderBy(desc(eventPhotometry.createdAt)).limit(1);
    expect(last.datasetIndices).toEqual(new Array(8).fill(0));
  });

  it("the demo event's file: two datasets from one file, proposed whole, read back grouped by dataset and sorted by time", async () => {
    const world = await createWorld();
    const demo = readFileSync(join(process.cwd(), "public", "demo", "cinder-avocet-photometry.csv"), "utf8");
    const { fileId } = await upload(world, "cinder-avocet-photometry.csv", demo);
    const { body } = await preview(world, world.actors.coi, { fileId });
    expect(body.mappingProblems).toEqual([]);
    expect(body.summary).toBe("310 points in 2 datasets (Halcyon Survey I: 256, Mesa Lucerna V: 54)");
    expect((await commit(world, world.actors.coi, { fileId, mapping: body.mapping })).status).toBe(201);
    const { points } = (await read(world, world.actors.viewer)).body;
    const order = points.map((point) => point.dataset).filter((name, i, all) => name !== all[i - 1]);
    expect(order).toEqual(["Halcyon Survey I", "Mesa Lucerna V"]);
    expect(points.every((point, i, all) => i === 0 || point.dataset !== all[i - 1].dataset || point.tDays > all[i - 1].tDays)).toBe(true);
  });

  it("deleting the target removes its photometry files from the upload service", async () => {
    const world = await createWorld();
    const { fileId, key } = await upload(world, "lc.csv", survey(6, { scale: "TT" }));
    const { body } = await preview(world, world.actors.coi, { fileId });
    expect((await commit(world, world.actors.coi, { fileId, mapping: body.mapping })).status).toBe(201);
    await deleteTarget(targetParams(world), world.actors.pi);
    expect(await db.select().from(uploadedFiles).where(and(eq(uploadedFiles.id, fileId)))).toEqual([]);
    expect(await service.isStored(key, 2_000)).toBe(false);
  });
});

describe("hostile photometry files (issue 19, item 6), through the upload and preview routes", () => {
  const header = "HJD-2450000 (UTC),I,sigma_I,telescope";
  const rows = (cells: string[]) => [header, ...cells].join("\n");
  const good = (i: number) => `${(13_000 + i).toFixed(1)},18.0,0.01,Halcyon`;

  async function previewOf(world: World, name: string, text: string) {
    const { fileId } = await upload(world, name, text);
    const answer = await preview(world, world.actors.coi, { fileId });
    expect(answer.status).toBe(200);
    return { fileId, view: answer.body };
  }

  it("NaN, zero and negative errors are refused naming the row and the column; the other rows are kept", async () => {
    const world = await createWorld();
    const { fileId, view } = await previewOf(world, "bad cells.csv", rows([good(0), "13001.0,NaN,0.01,Halcyon", good(2), "13003.0,18.0,0,Halcyon", "13004.0,18.0,-0.02,Halcyon", good(5), good(6), good(7), good(8)]));
    const refused = view.rows.filter((row) => !row.isKept);
    expect(refused.map((row) => [row.rowNumber, row.errors])).toEqual([
      [2, [{ column: "I", message: "Row 2, column “I”: “NaN” is not a number." }]],
      [4, [{ column: "sigma_I", message: "Row 4, column “sigma_I”: the magnitude error must be above 0 (got 0)." }]],
      [5, [{ column: "sigma_I", message: "Row 5, column “sigma_I”: the magnitude error must be above 0 (got -0.02)." }]],
    ]);
    expect(view.summary).toBe("6 points in 1 dataset (Halcyon I: 6); 3 rows refused");
    const kept = await commit(world, world.actors.coi, { fileId, mapping: view.mapping });
    expect(kept.body.file).toMatchObject({ pointCount: 6, refusedRowCount: 3 });
  });

  it("unsorted times are sorted and said; a repeated time refuses both rows, naming them", async () => {
    const world = await createWorld();
    const { view } = await previewOf(world, "order.csv", rows([good(3), good(1), good(2), good(0), good(4), "13004.0,17.9,0.01,Halcyon", good(5)]));
    expect(view.fileProblems).toEqual(["The rows of dataset “Halcyon I” were not in time order: they are sorted."]);
    expect(view.datasets).toEqual([{ name: "Halcyon I", band: "I", pointCount: 5, wasSorted: true }]);
    const duplicate = "Rows 5 and 6, column “HJD-2450000”: dataset “Halcyon I” has two points at the same time; remove one.";
    expect(view.rows.filter((row) => !row.isKept).map((row) => [row.rowNumber, row.errors.map((error) => error.message)])).toEqual([
      [5, [duplicate]],
      [6, [duplicate]],
    ]);
  });

  it("fewer points than the fit's parameters: the dataset is left out, and a file with nothing else to keep is refused whole", async () => {
    const world = await createWorld();
    const { fileId, view } = await previewOf(world, "three.csv", rows([good(0), good(1), good(2)]));
    expect(view.fileProblems).toEqual(["Dataset “Halcyon I” has 3 usable points; a dataset needs at least 5 to be fitted, so it is left out."]);
    expect(view.rows.map((row) => row.errors[0]?.message)).toEqual(new Array(3).fill(view.fileProblems[0]));
    const before = await db.select({ n: count() }).from(activity).where(eq(activity.proposalId, world.proposalId));
    const refused = await commit(world, world.actors.coi, { fileId, mapping: view.mapping });
    expect(refused.status).toBe(400);
    expect(refused.body.error?.message).toBe("No row of three.csv can be kept, so nothing was kept: No points to fit; 3 rows refused. Dataset “Halcyon I” has 3 usable points; a dataset needs at least 5 to be fitted, so it is left out.");
    expect(await db.select({ n: count() }).from(eventPhotometry).where(eq(eventPhotometry.targetId, world.targetId))).toEqual([{ n: 0 }]);
    expect(await db.select({ n: count() }).from(activity).where(eq(activity.proposalId, world.proposalId))).toEqual(before);
  });

  it("10⁶ rows are refused quickly without reading them all (times printed, not asserted)", async () => {
    const world = await createWorld();
    const row = "13000.12345,18.123,0.012,Halcyon\n";
    const started = performance.now();
    const whole = encode(`${header}\n${row.repeat(1_000_000)}`);
    const built = performance.now();
    const bySize = await service.uploadAs(world.actors.coi, "eventPhotometry", targetParams(world), { name: "million.csv", bytes: whole, type: "text/csv" });
    const sizeMs = performance.now() - built;
    expect(bySize).toEqual({ stage: "presign", status: 413, message: "The file is larger than 5 MB, the limit for a photometry file." });
    // 10⁶ one-cell rows fit under 5 MB: the upload is stored, and its completion refuses it by its row count.
    const narrow = encode(`t\n${"1\n".repeat(1_000_000)}`);
    const uploadStarted = performance.now();
    const byRows = await service.uploadAs(world.actors.coi, "eventPhotometry", targetParams(world), { name: "narrow.csv", bytes: narrow, type: "text/csv" });
    const rowsMs = performance.now() - uploadStarted;
    expect(byRows).toMatchObject({ stage: "stored", serverData: { ok: false, message: expect.stringMatching(/^The photometry file has more than 10,000 rows, the most one upload reads: bin the light curve/) } });
    console.log(
      `10⁶ photometry rows: ${(whole.length / 2 ** 20).toFixed(1)} MiB built in ${(built - started).toFixed(0)} ms, refused at the presign in ${sizeMs.toFixed(0)} ms; ` +
        `${(narrow.length / 2 ** 20).toFixed(1)} MiB of one-cell rows uploaded and refused by the completion step in ${rowsMs.toFixed(0)} ms`,
    );
  });
});
