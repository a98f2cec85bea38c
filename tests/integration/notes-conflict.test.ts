import { afterAll, describe, expect, it, vi } from "vitest";

vi.mock("server-only", () => ({}));

import { dbClient } from "@/db/client";
import { noteRoutes } from "@/lib/server/api/target-routes";
import { getNoteHistory, updateNote } from "@/lib/server/notes";
import { createWorld } from "./support/world";

afterAll(async () => {
  await dbClient().sql.end();
});

describe("concurrent note edits", () => {
  it("of two saves from the same version one wins and the other answers 409 with the current text", async () => {
    const world = await createWorld();
    const params = { proposalId: world.proposalId, targetId: world.targetId, noteId: world.noteId };
    const save = (actor: typeof world.actors.pi, body: string) =>
      noteRoutes(async () => actor).PATCH(
        new Request("http://arcwright.test/api/notes", { method: "PATCH", body: JSON.stringify({ body, version: 1 }) }),
        { params: Promise.resolve(params) },
      );
    const [a, b] = await Promise.all([save(world.actors.pi, "PI: seeing 0.7″, flat baseline."), save(world.actors.coi, "Co-I: rise started on night 3.")]);
    const statuses = [a.status, b.status].sort();
    expect(statuses).toEqual([200, 409]);

    const loser = a.status === 409 ? a : b;
    const winner = a.status === 200 ? a : b;
    const { note: saved } = (await winner.json()) as { note: { body: string; version: number } };
    const { error } = (await loser.json()) as { error: { code: string; details: { current: { body: string; version: number } } } };
    expect(error.code).toBe("conflict:note");
    expect(saved.version).toBe(2);
    // The stale save learns what it would have overwritten, so the UI can show both texts.
    expect(error.details.current).toMatchObject({ body: saved.body, version: 2 });

    const { note, revisions } = await getNoteHistory(params, world.actors.viewer);
    expect(note.body).toBe(saved.body);
    expect(revisions.map((r) => r.version)).toEqual([2, 1]);
    expect(revisions[1].body).toBe("First look: *baseline flat*.");
  });

  it("a save from the current version after a conflict succeeds (the merge path)", async () => {
    const world = await createWorld();
    const params = { proposalId: world.proposalId, targetId: world.targetId, noteId: world.noteId };
    await updateNote(params, { body: "second", version: 1 }, world.actors.pi);
    await expect(updateNote(params, { body: "stale", version: 1 }, world.actors.coi)).rejects.toMatchObject({ code: "conflict:note" });
    const merged = await updateNote(params, { body: "second\n\nstale", version: 2 }, world.actors.coi);
    expect(merged).toMatchObject({ version: 3, body: "second\n\nstale", updatedByName: "coi" });
  });
});
