/**
 * The upload routes as the browser sees them: each route's input and what its completion step
 * answers. Types only, shared by the routes themselves (lib/server/upload-router.ts, whose router is
 * checked against this declaration) and the dropzone that uploads through them, so the browser's code
 * names no server module.
 */
import type { FileRoute } from "uploadthing/types";

/** A completion step's answer: the recorded file's id, or the refusal in words (the file is deleted). */
export type UploadOutcome = { ok: true; fileId: string } | { ok: false; message: string };

/** One upload route: its input (ids naming where the file goes) and its completion's answer. */
type UploadRoute<Input> = FileRoute<{ input: Input; output: UploadOutcome; errorShape: unknown }>;

export type UploadRouter = {
  targetList: UploadRoute<{ proposalId: string }>;
  noteAttachment: UploadRoute<{ proposalId: string; targetId: string; noteId: string }>;
  eventPhotometry: UploadRoute<{ proposalId: string; targetId: string }>;
};
