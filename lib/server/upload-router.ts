import "server-only";
import { createUploadthing, type FileRouter } from "uploadthing/next";
import { UploadThingError } from "uploadthing/server";
import { z } from "zod";
import { AppError } from "@/lib/errors";
import type { GetActor } from "@/lib/server/actor";
import { authorizeAttachmentUpload, recordAttachmentUpload } from "@/lib/server/attachments";
import { authorizePhotometryUpload, recordPhotometryUpload } from "@/lib/server/event-photometry";
import { crossSiteError } from "@/lib/security/same-origin";
import { errorResponse } from "@/lib/server/http";
import { authorizeTargetListUpload, recordTargetListUpload } from "@/lib/server/imports";
import { sessionActor } from "@/lib/server/session";
import { completeUpload } from "@/lib/server/upload-completion";
import type { UploadRouter } from "@/lib/workspace/upload-view";

const f = createUploadthing();

const uploadCodes = { bad_request: "BAD_REQUEST", not_found: "NOT_FOUND", forbidden: "FORBIDDEN", unauthorized: "FORBIDDEN", payload_too_large: "TOO_LARGE" } as const;

/** The product's refusals as the SDK's errors, so the uploader gets the status and the message. */
async function asUploadError<T>(check: () => Promise<T>): Promise<T> {
  try {
    return await check();
  } catch (error) {
    if (error instanceof AppError && error.kind in uploadCodes) {
      throw new UploadThingError({ code: uploadCodes[error.kind as keyof typeof uploadCodes], message: error.message });
    }
    throw error;
  }
}

// The SDK's sizes are powers of two: these bound the signed size; the product's limits (5 MB for a
// list or a photometry file, 16 MB for an attachment) are checked in the middleware on the declared
// size and on the bytes. Every kind is stored private: the service serves them only to a URL signed
// with the api key, which only this server makes (the hosted service must allow a route to set its
// ACL: the app's "allow overriding ACL" setting). Members read attachments through the app's
// access-checked route.
const targetListConfig = { blob: { maxFileSize: "8MB", maxFileCount: 1, acl: "private" } } as const;
const attachmentConfig = { blob: { maxFileSize: "16MB", maxFileCount: 1, acl: "private" } } as const;

/**
 * The upload routes. Each middleware checks session and role (Co-I or PI of the proposal) through the
 * data-access layer before the SDK signs any URL; each completion checks that role again (the URL may
 * be used after a removal), fetches the bytes, checks the type by content and records the file,
 * answering `{ ok: false, message }` (file deleted) when it is refused.
 */
export function makeUploadRouter(getActor: GetActor): UploadRouter {
  return {
    targetList: f(targetListConfig)
      .input(z.object({ proposalId: z.string() }))
      .middleware(({ req, input, files }) => asUploadError(async () => authorizeTargetListUpload(input, await getActor(req), files)))
      .onUploadComplete(({ metadata, file }) => completeUpload(metadata, file, "import", recordTargetListUpload)),
    noteAttachment: f(attachmentConfig)
      .input(z.object({ proposalId: z.string(), targetId: z.string(), noteId: z.string() }))
      .middleware(({ req, input, files }) => asUploadError(async () => authorizeAttachmentUpload(input, await getActor(req), files)))
      .onUploadComplete(({ metadata, file }) => completeUpload(metadata, file, "attachment", recordAttachmentUpload)),
    eventPhotometry: f(targetListConfig)
      .input(z.object({ proposalId: z.string(), targetId: z.string() }))
      .middleware(({ req, input, files }) => asUploadError(async () => authorizePhotometryUpload(input, await getActor(req), files)))
      .onUploadComplete(({ metadata, file }) => completeUpload(metadata, file, "photometry", recordPhotometryUpload)),
  } satisfies FileRouter;
}

export const uploadRouter = makeUploadRouter(sessionActor);

/**
 * A cross-site request answers 403 and a signed-out upload request 401, in the product's error shape,
 * before the SDK runs (the SDK has no 401). The service's signed callbacks carry no session and pass through to the SDK, which
 * verifies their signature.
 */
export function withSignInCheck<R extends Request>(getActor: GetActor, handler: (request: R) => Promise<Response>) {
  return async (request: R): Promise<Response> => {
    const refusal = crossSiteError(request);
    if (refusal) return errorResponse(refusal);
    if (new URL(request.url).searchParams.get("actionType") === "upload" && !(await getActor(request))) {
      return errorResponse(new AppError("unauthorized:session", "Sign in to continue."));
    }
    return handler(request);
  };
}
