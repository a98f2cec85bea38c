import "server-only";
import { aliasedTable, and, asc, desc, eq, sql } from "drizzle-orm";
import { dbClient, type Database } from "@/db/client";
import { noteRevisions, notes, targets, users } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { noteParamsSchema, targetParamsSchema } from "@/lib/workspace/ids";
import { createNoteSchema, updateNoteSchema } from "@/lib/workspace/note-schema";
import { authorize, parseIds } from "@/lib/server/access";
import { recordActivity } from "@/lib/server/activity";
import { forgetNoteFiles } from "@/lib/server/attachments";
import { requireActor, type Actor } from "@/lib/server/actor";
import { parseOrThrow } from "@/lib/server/http";
import { deleteStoredFiles } from "@/lib/server/uploads";
import type { NoteRevisionView, NoteView } from "@/lib/workspace/note-view";

type Queryable = Pick<Database, "select">;

const author = aliasedTable(users, "author");
const editor = aliasedTable(users, "editor");

function selectNotes(db: Queryable) {
  return db
    .select({
      id: notes.id,
      targetId: notes.targetId,
      body: notes.body,
      version: notes.version,
      authorName: author.name,
      updatedByName: editor.name,
      createdAt: notes.createdAt,
      updatedAt: notes.updatedAt,
    })
    .from(notes)
    .leftJoin(author, eq(author.id, notes.authorId))
    .leftJoin(editor, eq(editor.id, notes.updatedBy));
}

type NoteRow = Awaited<ReturnType<ReturnType<typeof selectNotes>["where"]>>[number];
const viewOf = (n: NoteRow): NoteView => ({ ...n, createdAt: n.createdAt.toISOString(), updatedAt: n.updatedAt.toISOString() });

async function requireTarget(db: Queryable, proposalId: string, targetId: string): Promise<string> {
  const [target] = await db
    .select({ name: targets.name })
    .from(targets)
    .where(and(eq(targets.id, targetId), eq(targets.proposalId, proposalId)))
    .limit(1);
  if (!target) throw new AppError("not_found:target", "No such target in this proposal.");
  return target.name;
}

async function loadNote(db: Queryable, targetId: string, noteId: string): Promise<NoteView> {
  const [note] = await selectNotes(db).where(and(eq(notes.id, noteId), eq(notes.targetId, targetId))).limit(1);
  if (!note) throw new AppError("not_found:note", "No such note on this target.");
  return viewOf(note);
}

/** A target's notes, oldest first (they read as a log of the observing work). */
export async function listNotes(params: unknown, actor: Actor | null): Promise<NoteView[]> {
  const { proposalId, targetId } = parseIds(targetParamsSchema, params, "target");
  const { db } = dbClient();
  await authorize(db, proposalId, requireActor(actor), "read", "note");
  await requireTarget(db, proposalId, targetId);
  const rows = await selectNotes(db).where(eq(notes.targetId, targetId)).orderBy(asc(notes.createdAt)).limit(500);
  return rows.map(viewOf);
}

export async function getNoteHistory(params: unknown, actor: Actor | null): Promise<{ note: NoteView; revisions: NoteRevisionView[] }> {
  const { proposalId, targetId, noteId } = parseIds(noteParamsSchema, params, "note");
  const { db } = dbClient();
  await authorize(db, proposalId, requireActor(actor), "read", "note");
  await requireTarget(db, proposalId, targetId);
  const note = await loadNote(db, targetId, noteId);
  const revisions = await db
    .select({ version: noteRevisions.version, body: noteRevisions.body, editedByName: users.name, editedAt: noteRevisions.editedAt })
    .from(noteRevisions)
    .leftJoin(users, eq(users.id, noteRevisions.editedBy))
    .where(eq(noteRevisions.noteId, noteId))
    .orderBy(desc(noteRevisions.version))
    .limit(200);
  return { note, revisions: revisions.map((r) => ({ ...r, editedAt: r.editedAt.toISOString() })) };
}

/**
 * The first note of each of many new targets, each kept as revision 1, inside the caller's
 * transaction (an import, which has checked the role and records its own activity entry).
 */
export async function insertFirstNotes(tx: Pick<Database, "insert">, authorId: string, entries: readonly { targetId: string; body: string }[]): Promise<void> {
  // 500 notes × 4 values stays far below PostgreSQL's 65,535 parameters per statement.
  for (let start = 0; start < entries.length; start += 500) {
    const chunk = entries.slice(start, start + 500);
    const inserted = await tx
      .insert(notes)
      .values(chunk.map(({ targetId, body }) => ({ targetId, body, authorId, updatedBy: authorId })))
      .returning({ id: notes.id, body: notes.body });
    await tx.insert(noteRevisions).values(inserted.map((note) => ({ noteId: note.id, version: 1, body: note.body, editedBy: authorId })));
  }
}

/** Co-I or PI. The first text is kept as revision 1. */
export async function createNote(params: unknown, input: unknown, actor: Actor | null): Promise<NoteView> {
  const { proposalId, targetId } = parseIds(targetParamsSchema, params, "target");
  const who = requireActor(actor);
  const { body } = parseOrThrow(createNoteSchema, input, "note");
  return dbClient().db.transaction(async (tx) => {
    await authorize(tx, proposalId, who, "edit", "note");
    const targetName = await requireTarget(tx, proposalId, targetId);
    const [note] = await tx.insert(notes).values({ targetId, body, authorId: who.userId, updatedBy: who.userId }).returning();
    await tx.insert(noteRevisions).values({ noteId: note.id, version: 1, body, editedBy: who.userId });
    await recordActivity(tx, { proposalId, actorId: who.userId, action: "note.added", subject: `note on ${targetName}` });
    return loadNote(tx, targetId, note.id);
  });
}

/**
 * Co-I or PI. Saves only if the note is still at the version the editor started from; otherwise
 * answers 409 `conflict:note` with the current text and version, so the UI can show both to merge.
 */
export async function updateNote(params: unknown, input: unknown, actor: Actor | null): Promise<NoteView> {
  const { proposalId, targetId, noteId } = parseIds(noteParamsSchema, params, "note");
  const who = requireActor(actor);
  const { body, version } = parseOrThrow(updateNoteSchema, input, "note");
  return dbClient().db.transaction(async (tx) => {
    await authorize(tx, proposalId, who, "edit", "note");
    const targetName = await requireTarget(tx, proposalId, targetId);
    // The version test and the increment are one statement: of two saves from the same version,
    // exactly one matches.
    const [saved] = await tx
      .update(notes)
      .set({ body, version: sql`${notes.version} + 1`, updatedBy: who.userId, updatedAt: new Date() })
      .where(and(eq(notes.id, noteId), eq(notes.targetId, targetId), eq(notes.version, version)))
      .returning({ version: notes.version });
    if (!saved) {
      const current = await loadNote(tx, targetId, noteId);
      throw new AppError(
        "conflict:note",
        `${current.updatedByName ?? "Someone"} saved this note while you were editing (now version ${current.version}); merge the two texts and save again.`,
        undefined,
        { current },
      );
    }
    await tx.insert(noteRevisions).values({ noteId, version: saved.version, body, editedBy: who.userId });
    await recordActivity(tx, { proposalId, actorId: who.userId, action: "note.edited", subject: `note on ${targetName}` });
    return loadNote(tx, targetId, noteId);
  });
}

export async function deleteNote(params: unknown, actor: Actor | null): Promise<void> {
  const { proposalId, targetId, noteId } = parseIds(noteParamsSchema, params, "note");
  const who = requireActor(actor);
  const storedKeys = await dbClient().db.transaction(async (tx) => {
    await authorize(tx, proposalId, who, "edit", "note");
    const targetName = await requireTarget(tx, proposalId, targetId);
    await loadNote(tx, targetId, noteId);
    const keys = await forgetNoteFiles(tx, noteId);
    await tx.delete(notes).where(eq(notes.id, noteId));
    await recordActivity(tx, { proposalId, actorId: who.userId, action: "note.removed", subject: `note on ${targetName}` });
    return keys;
  });
  // The attachments' bytes go only once the note is gone for certain.
  await deleteStoredFiles(storedKeys);
}
