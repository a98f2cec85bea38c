import "server-only";
import type { GetActor } from "@/lib/server/actor";
import { endpoint, noContent, readJsonOfSignedIn } from "@/lib/server/api/endpoint";
import { deleteAttachment, listAttachments, openAttachmentFile } from "@/lib/server/attachments";
import { commitImport, previewImport } from "@/lib/server/imports";

type ProposalParams = { proposalId: string };
type NoteParams = ProposalParams & { targetId: string; noteId: string };
type AttachmentParams = NoteParams & { attachmentId: string };

/** /api/proposals/[proposalId]/imports — commit an import of an uploaded target list. */
export function importCollectionRoutes(getActor: GetActor) {
  return {
    POST: endpoint<ProposalParams>(getActor, async ({ request, params, actor }) =>
      Response.json({ import: await commitImport(params, await readJsonOfSignedIn(request, actor), actor) }, { status: 201 }),
    ),
  };
}

/** /api/proposals/[proposalId]/imports/preview — what a commit would do, row by row; writes nothing. */
export function importPreviewRoutes(getActor: GetActor) {
  return {
    POST: endpoint<ProposalParams>(getActor, async ({ request, params, actor }) => Response.json(await previewImport(params, await readJsonOfSignedIn(request, actor), actor))),
  };
}

/** /api/proposals/[proposalId]/targets/[targetId]/notes/[noteId]/attachments */
export function attachmentCollectionRoutes(getActor: GetActor) {
  return {
    GET: endpoint<NoteParams>(getActor, async ({ params, actor }) => Response.json({ attachments: await listAttachments(params, actor) })),
  };
}

/** /api/proposals/[proposalId]/targets/[targetId]/notes/[noteId]/attachments/[attachmentId] */
export function attachmentRoutes(getActor: GetActor) {
  return {
    DELETE: endpoint<AttachmentParams>(getActor, async ({ params, actor }) => {
      await deleteAttachment(params, actor);
      return noContent();
    }),
  };
}

/**
 * `Content-Disposition` with the file's name (RFC 6266): an ASCII `filename` for old clients and the
 * exact name as UTF-8 in `filename*` (RFC 8187; encodeURIComponent leaves `'()*` bare, which that
 * grammar does not allow).
 */
function contentDisposition(disposition: "inline" | "attachment", fileName: string): string {
  const ascii = fileName.replace(/[^\x20-\x7e]|["\\]/g, "_");
  const encoded = encodeURIComponent(fileName).replace(/['()*]/g, (char) => `%${char.charCodeAt(0).toString(16).toUpperCase()}`);
  return `${disposition}; filename="${ascii}"; filename*=UTF-8''${encoded}`;
}

/**
 * .../attachments/[attachmentId]/file — the stored bytes, after the access check, as the type their
 * content shows: PNG and JPEG inline (the note shows them), everything else a download. `nosniff`
 * holds the browser to that type, and the sandbox policy keeps a body that a browser did render as a
 * page from running script or loading anything; the answer is never cached, so a removed member
 * cannot read it from a cache either.
 */
export function attachmentFileRoutes(getActor: GetActor) {
  return {
    GET: endpoint<AttachmentParams>(getActor, async ({ params, actor }) => {
      const file = await openAttachmentFile(params, actor);
      return new Response(file.body, {
        headers: {
          "Content-Type": file.mimeType,
          "Content-Disposition": contentDisposition(file.isInline ? "inline" : "attachment", file.name),
          "X-Content-Type-Options": "nosniff",
          "Cache-Control": "private, no-store",
          "Content-Security-Policy": "default-src 'none'; sandbox",
          ...(file.sizeBytes === null ? {} : { "Content-Length": String(file.sizeBytes) }),
        },
      });
    }),
  };
}
