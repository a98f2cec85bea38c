import "server-only";
import type { GetActor } from "@/lib/server/actor";
import { endpoint, noContent, readJson } from "@/lib/server/api/endpoint";
import { attachmentFileUrl, deleteAttachment, listAttachments } from "@/lib/server/attachments";
import { commitImport, previewImport } from "@/lib/server/imports";

type ProposalParams = { proposalId: string };
type NoteParams = ProposalParams & { targetId: string; noteId: string };
type AttachmentParams = NoteParams & { attachmentId: string };

/** /api/proposals/[proposalId]/imports — commit an import of an uploaded target list. */
export function importCollectionRoutes(getActor: GetActor) {
  return {
    POST: endpoint<ProposalParams>(getActor, async ({ request, params, actor }) =>
      Response.json({ import: await commitImport(params, await readJson(request), actor) }, { status: 201 }),
    ),
  };
}

/** /api/proposals/[proposalId]/imports/preview — what a commit would do, row by row; writes nothing. */
export function importPreviewRoutes(getActor: GetActor) {
  return {
    POST: endpoint<ProposalParams>(getActor, async ({ request, params, actor }) => Response.json(await previewImport(params, await readJson(request), actor))),
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

/** .../attachments/[attachmentId]/file — checks access, then sends the browser to the stored bytes. */
export function attachmentFileRoutes(getActor: GetActor) {
  return {
    GET: endpoint<AttachmentParams>(getActor, async ({ params, actor }) =>
      Response.redirect(await attachmentFileUrl(params, actor), 302),
    ),
  };
}
