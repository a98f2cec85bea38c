import "server-only";
import { and, asc, eq, inArray, type SQL } from "drizzle-orm";
import { z } from "zod";
import { dbClient, type Database } from "@/db/client";
import { noteAttachments, notes, targets, uploadedFiles } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { checkAttachment, servedFormOf, SIGNATURE_BYTES, type ServedForm } from "@/lib/imports/attachment-type";
import type { FitsHeader } from "@/lib/imports/fits-header";
import { MAX_ATTACHMENT_BYTES } from "@/lib/imports/limits";
import { noteParamsSchema } from "@/lib/workspace/ids";
import { authorize, parseIds } from "@/lib/server/access";
import { requireActor, type Actor } from "@/lib/server/actor";
import type { UploadOutcome } from "@/lib/workspace/upload-view";
import { deleteStoredFiles, fetchStoredBytes, openStoredFile, refuseOversize } from "@/lib/server/uploads";
import type { AttachmentView } from "@/lib/workspace/attachment-view";

type Queryable = Pick<Database, "select">;

/** What an attachment upload's middleware hands to its completion step. */
export type AttachmentUploadMetadata = {
  proposalId: string;
  targetId: string;
  noteId: string;
  userId: string;
};

const attachmentParamsSchema = noteParamsSchema.extend({ attachmentId: z.uuid() });

async function requireNote(db: Queryable, proposalId: string, targetId: string, noteId: string): Promise<void> {
  const [note] = await db
    .select({ id: notes.id })
    .from(notes)
    .innerJoin(targets, eq(targets.id, notes.targetId))
    .where(and(eq(notes.id, noteId), eq(notes.targetId, targetId), eq(targets.proposalId, proposalId)))
    .limit(1);
  if (!note) throw new AppError("not_found:note", "No such note on this target.");
}

/**
 * Runs in the upload route's middleware, before any URL is signed: validate the input, then the
 * session, then the role (Co-I or PI), then that the note belongs to the proposal, then the size.
 */
export async function authorizeAttachmentUpload(input: unknown, actor: Actor | null, files: readonly { size: number }[]): Promise<AttachmentUploadMetadata> {
  const ids = parseIds(noteParamsSchema, input, "note");
  const who = requireActor(actor);
  const { db } = dbClient();
  await authorize(db, ids.proposalId, who, "edit", "attachment");
  await requireNote(db, ids.proposalId, ids.targetId, ids.noteId);
  refuseOversize(files, MAX_ATTACHMENT_BYTES, "payload_too_large:attachment", "an attachment");
  return { ...ids, userId: who.userId };
}

/**
 * The recording part of an attachment upload's completion step (`completeUpload` re-checks the
 * uploader's role first and deletes the stored bytes when this throws): fetch the stored bytes, check
 * the type by content (PNG, JPEG, PDF, FITS with a readable header), then record the file and the
 * attachment in one transaction. A refusal throws an AppError with a message for the uploader.
 */
export async function recordAttachmentUpload(metadata: AttachmentUploadMetadata, file: { key: string; name: string }): Promise<UploadOutcome> {
  const checked = checkAttachment(await fetchStoredBytes(file.key, MAX_ATTACHMENT_BYTES));
  return dbClient().db.transaction(async (tx) => {
    // The note may have been deleted while the file was in flight.
    await requireNote(tx, metadata.proposalId, metadata.targetId, metadata.noteId);
    const [stored] = await tx
      .insert(uploadedFiles)
      .values({
        key: file.key,
        name: file.name.slice(0, 255),
        sizeBytes: checked.sizeBytes,
        contentType: checked.mimeType,
        proposalId: metadata.proposalId,
        uploadedBy: metadata.userId,
        purpose: "note_attachment",
      })
      .returning({ id: uploadedFiles.id });
    const [attachment] = await tx
      .insert(noteAttachments)
      .values({ noteId: metadata.noteId, fileId: stored.id, kind: checked.kind, fitsHeader: checked.fitsHeader ?? null, sizeBytes: checked.sizeBytes })
      .returning({ id: noteAttachments.id });
    return { ok: true as const, fileId: attachment.id };
  });
}

function selectAttachments(db: Queryable) {
  return db
    .select({
      id: noteAttachments.id,
      noteId: noteAttachments.noteId,
      name: uploadedFiles.name,
      key: uploadedFiles.key,
      fileId: uploadedFiles.id,
      kind: noteAttachments.kind,
      sizeBytes: noteAttachments.sizeBytes,
      fitsHeader: noteAttachments.fitsHeader,
      createdAt: noteAttachments.createdAt,
    })
    .from(noteAttachments)
    .innerJoin(uploadedFiles, eq(uploadedFiles.id, noteAttachments.fileId));
}

type AttachmentRow = Awaited<ReturnType<ReturnType<typeof selectAttachments>["where"]>>[number];

const viewOf = (ids: { proposalId: string; targetId: string }, row: AttachmentRow): AttachmentView => ({
  id: row.id,
  noteId: row.noteId,
  name: row.name,
  kind: row.kind,
  sizeBytes: row.sizeBytes,
  // A header stored before every HDU was listed (no `hdus`, values re-typed) is not shown rather than misread.
  fitsHeader: row.fitsHeader !== null && typeof row.fitsHeader === "object" && "hdus" in row.fitsHeader ? (row.fitsHeader as FitsHeader) : null,
  fileUrl: `/api/proposals/${ids.proposalId}/targets/${ids.targetId}/notes/${row.noteId}/attachments/${row.id}/file`,
  createdAt: row.createdAt.toISOString(),
});

/** Any member: a note's attachments, oldest first. */
export async function listAttachments(params: unknown, actor: Actor | null): Promise<AttachmentView[]> {
  const ids = parseIds(noteParamsSchema, params, "note");
  const { db } = dbClient();
  await authorize(db, ids.proposalId, requireActor(actor), "read", "attachment");
  await requireNote(db, ids.proposalId, ids.targetId, ids.noteId);
  const rows = await selectAttachments(db).where(eq(noteAttachments.noteId, ids.noteId)).orderBy(asc(noteAttachments.createdAt)).limit(100);
  return rows.map((row) => viewOf(ids, row));
}

async function loadAttachment(db: Queryable, ids: z.infer<typeof attachmentParamsSchema>): Promise<AttachmentRow> {
  await requireNote(db, ids.proposalId, ids.targetId, ids.noteId);
  const [row] = await selectAttachments(db)
    .where(and(eq(noteAttachments.id, ids.attachmentId), eq(noteAttachments.noteId, ids.noteId)))
    .limit(1);
  if (!row) throw new AppError("not_found:attachment", "No such attachment on this note.");
  return row;
}

export interface AttachmentFile extends ServedForm {
  name: string;
  body: ReadableStream<Uint8Array>;
  sizeBytes: number | null;
}

/**
 * Any member, or a site admin auditing: the stored bytes, streamed through the app. Membership is
 * checked at every read (the file is private in the upload service, so no URL outlives a removal),
 * and the type is read from the bytes themselves, never taken from the uploader.
 */
export async function openAttachmentFile(params: unknown, actor: Actor | null): Promise<AttachmentFile> {
  const ids = parseIds(attachmentParamsSchema, params, "attachment");
  const { db } = dbClient();
  await authorize(db, ids.proposalId, requireActor(actor), "read", "attachment");
  const row = await loadAttachment(db, ids);
  const { head, body, sizeBytes } = await openStoredFile(row.key, SIGNATURE_BYTES);
  return { name: row.name, body, sizeBytes, ...servedFormOf(head) };
}

/**
 * Co-I or PI. Removes the attachment and its file record in one transaction; the stored bytes are
 * deleted through the upload service after the commit.
 */
export async function deleteAttachment(params: unknown, actor: Actor | null): Promise<void> {
  const ids = parseIds(attachmentParamsSchema, params, "attachment");
  const who = requireActor(actor);
  const key = await dbClient().db.transaction(async (tx) => {
    await authorize(tx, ids.proposalId, who, "edit", "attachment");
    const row = await loadAttachment(tx, ids);
    await tx.delete(uploadedFiles).where(eq(uploadedFiles.id, row.fileId));
    return row.key;
  });
  await deleteStoredFiles([key]);
}

/**
 * Inside the transaction that deletes a note: forgets the file records of its attachments and
 * returns their keys, for `deleteStoredFiles` once that transaction has committed.
 */
export function forgetNoteFiles(tx: FileForgetter, noteId: string): Promise<string[]> {
  return forgetAttachedFiles(tx, eq(noteAttachments.noteId, noteId));
}

/** The same for every note of a target, inside the transaction that deletes the target. */
export function forgetTargetFiles(tx: FileForgetter, targetId: string): Promise<string[]> {
  return forgetAttachedFiles(tx, eq(notes.targetId, targetId));
}

type FileForgetter = Pick<Database, "select" | "delete">;

async function forgetAttachedFiles(tx: FileForgetter, which: SQL): Promise<string[]> {
  const rows = await tx
    .select({ id: uploadedFiles.id, key: uploadedFiles.key })
    .from(noteAttachments)
    .innerJoin(uploadedFiles, eq(uploadedFiles.id, noteAttachments.fileId))
    .innerJoin(notes, eq(notes.id, noteAttachments.noteId))
    .where(which);
  if (rows.length > 0) await tx.delete(uploadedFiles).where(inArray(uploadedFiles.id, rows.map((row) => row.id)));
  return rows.map((row) => row.key);
}
