import "server-only";
import { dbClient } from "@/db/client";
import { AppError } from "@/lib/errors";
import { authorize } from "@/lib/server/access";
import { findActor } from "@/lib/server/accounts";
import { requireActor } from "@/lib/server/actor";
import type { UploadOutcome } from "@/lib/workspace/upload-view";
import { deleteRefusedUpload } from "@/lib/server/uploads";

/** What every upload route's middleware hands on: who uploads, to which proposal. */
export interface UploaderMetadata {
  proposalId: string;
  userId: string;
}

/** The stored file as the service reports it to the completion step. */
export interface CompletedFile {
  key: string;
  name: string;
}

const UNRECORDED_MESSAGE = "The upload could not be recorded; try again.";

/**
 * The completion step of every upload route, around the route's own `record`. The uploader's role is
 * checked again first: a presigned URL outlives the middleware's check, so a member removed or
 * demoted after receiving one must not still add a file. Any refusal, and any unexpected failure,
 * deletes the stored bytes and answers `{ ok: false, message }` at once; a completion step that
 * threw would leave the file stored and the uploader waiting for the service's timeout.
 */
export async function completeUpload<M extends UploaderMetadata>(
  metadata: M,
  file: CompletedFile,
  subject: string,
  record: (metadata: M, file: CompletedFile) => Promise<UploadOutcome>,
): Promise<UploadOutcome> {
  try {
    const uploader = requireActor(await findActor(metadata.userId));
    await authorize(dbClient().db, metadata.proposalId, uploader, "edit", subject);
    return await record(metadata, file);
  } catch (error) {
    deleteRefusedUpload(file.key);
    const isForUser = error instanceof AppError && error.kind !== "internal";
    if (!isForUser) console.error(`upload ${file.key}: the completion step failed; the stored file is deleted.`, error);
    return { ok: false, message: isForUser ? error.message : UNRECORDED_MESSAGE };
  }
}
