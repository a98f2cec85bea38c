import { and, count, eq, like, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { dbClient } from "@/db/client";
import { activity, imports, noteRevisions, notes, targets } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { commitImport, previewImport } from "@/lib/server/imports";
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

async function uploadList(world: World, name: string, text: string): Promise<string> {
  const attempt = await service.uploadAs(world.actors.coi, "targetList", { proposalId: world.proposalId }, { name, bytes: new TextEncoder().encode(text), type: "text/csv" });
  if (attempt.stage !== "stored" || !attempt.serverData.ok) throw new Error(`upload refused: ${JSON.stringify(attempt)}`);
  return attempt.serverData.fileId;
}

const targetNames = async (proposalId: string) =>
  (await db.select({ name: targets.name }).from(targets).where(eq(targets.proposalId, proposalId))).map((t) => t.name).sort();

// Two good rows, a declination past the pole and a row one field short.
const mixed = [
  "name,ra,dec,mass [Msun],D_L [pc],D_S [pc]",
  "PART-1,17:56:40.0,-29:30:00,0.5,4000,8000",
  "PART-2,18:02:00,+95:00:00,0.5,4000,8000",
  "PART-3,17:58:01.0,-29:20:00,0.3,3000,8000",
  "PART-4,18:01:30.2,-28:55:10,0.8",
].join("\n");

describe("partial import: the good rows only, by the user's explicit choice", () => {
  it("stores the good rows, not the refused ones, in one commit with the counts right; the preview carries the refused rows' cells", async () => {
    const world = await createWorld();
    const params = { proposalId: world.proposalId };
    const fileId = await uploadList(world, "mixed.csv", mixed);
    const preview = await previewImport(params, { fileId }, world.actors.coi);
    expect(preview.counts).toEqual({ added: 2, updated: 0, skipped: 0, invalid: 2 });
    expect(preview.rows.filter((row) => row.action === "error").map((row) => [row.rowNumber, row.fileCells])).toEqual([
      [2, ["PART-2", "18:02:00", "+95:00:00", "0.5", "4000", "8000"]],
      [4, ["PART-4", "18:01:30.2", "-28:55:10", "0.8"]],
    ]);
    expect(preview.rows.find((row) => row.action === "add")?.fileCells).toBeUndefined();
    const before = await targetNames(world.proposalId);

    // Without the choice, nothing is written and the refusal names the way out.
    const whole = await commitImport(params, { fileId, mapping: preview.mapping }, world.actors.coi).catch((e: unknown) => e);
    expect(whole).toBeInstanceOf(AppError);
    expect((whole as AppError).message).toMatch(/^2 of 4 rows cannot be imported, so nothing was imported; fix them, or choose to import the other rows without them\. row 2: Dec/);
    expect(await targetNames(world.proposalId)).toEqual(before);

    const result = await commitImport(params, { fileId, mapping: preview.mapping, leaveOutRefusedRows: 2 }, world.actors.coi);
    expect(result).toMatchObject({ added: 2, updated: 0, skipped: 0, leftOut: 2 });
    expect(await targetNames(world.proposalId)).toEqual([...before, "PART-1", "PART-3"].sort());
    const [record] = await db.select().from(imports).where(eq(imports.id, result.importId));
    expect(record).toMatchObject({ addedCount: 2, updatedCount: 0, skippedCount: 0 });
    const [entry] = await db.select().from(activity).where(eq(activity.proposalId, world.proposalId)).orderBy(sql`${activity.id} desc`).limit(1);
    expect(entry.subject).toBe("targets from mixed.csv (2 added, 0 updated, 0 skipped, 2 refused rows left out)");
  });

  it("a count of refused rows other than the preview's refuses the commit whole (409), writing nothing", async () => {
    const world = await createWorld();
    const params = { proposalId: world.proposalId };
    const fileId = await uploadList(world, "mixed.csv", mixed);
    const { mapping } = await previewImport(params, { fileId }, world.actors.coi);
    const [{ n: before }] = await db.select({ n: count() }).from(targets).where(eq(targets.proposalId, world.proposalId));
    const stale = await commitImport(params, { fileId, mapping, leaveOutRefusedRows: 1 }, world.actors.coi).catch((e: unknown) => e);
    expect(stale).toMatchObject({ code: "conflict:import", fields: { leaveOutRefusedRows: ["The preview is out of date: 2 rows would be left out now."] } });
    expect((stale as AppError).message).toMatch(/^The file now has 2 rows that cannot be imported, not 1 row as the preview showed/);
    const bad = await commitImport(params, { fileId, mapping, leaveOutRefusedRows: 0 }, world.actors.coi).catch((e: unknown) => e);
    expect(bad).toMatchObject({ fields: { leaveOutRefusedRows: ["The number of refused rows to leave out must be the count the preview showed."] } });
    const [{ n: after }] = await db.select({ n: count() }).from(targets).where(eq(targets.proposalId, world.proposalId));
    expect(after).toBe(before);
  });
});

describe("a notes column becomes the first note of each new target", () => {
  it("proposes the notes column, stores each new target's note with revision 1 in the commit, and none for a row without text", async () => {
    const world = await createWorld();
    const params = { proposalId: world.proposalId };
    const list = ["name,ra,dec,mass,D_L,D_S,comments", "NOTE-1,17:56:40.0,-29:30:00,0.5,4000,8000,Seen by OGLE; check =1+1", "NOTE-2,17:58:01.0,-29:20:00,0.3,3000,8000,"].join("\n");
    const fileId = await uploadList(world, "with notes.csv", list);
    const preview = await previewImport(params, { fileId }, world.actors.coi);
    expect(preview.noteColumn).toBe(6);
    await commitImport(params, { fileId, mapping: preview.mapping, noteColumn: preview.noteColumn }, world.actors.coi);
    const stored = await db
      .select({ name: targets.name, body: notes.body, version: notes.version, revision: noteRevisions.version })
      .from(notes)
      .innerJoin(targets, eq(targets.id, notes.targetId))
      .innerJoin(noteRevisions, eq(noteRevisions.noteId, notes.id))
      .where(and(eq(targets.proposalId, world.proposalId), like(targets.name, "NOTE-%")));
    expect(stored).toEqual([{ name: "NOTE-1", body: "Seen by OGLE; check =1+1", version: 1, revision: 1 }]);

    // Chosen as none, or as a column a field uses: no notes, or a refusal naming the notes column.
    const again = await uploadList(world, "with notes.csv", list.replace(/NOTE-/g, "NOTE-B"));
    expect((await previewImport(params, { fileId: again, mapping: preview.mapping, noteColumn: null }, world.actors.coi)).noteColumn).toBeNull();
    await expect(previewImport(params, { fileId: again, mapping: preview.mapping, noteColumn: 0 }, world.actors.coi)).rejects.toMatchObject({
      fields: { noteColumn: ['Column "name" is already used for Name; it cannot also be the notes.'] },
    });
  });
});
