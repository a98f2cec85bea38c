import "server-only";
import type { GetActor } from "@/lib/server/actor";
import { endpoint, noContent, queryOf, readJsonOfSignedIn } from "@/lib/server/api/endpoint";
import { createNote, deleteNote, getNoteHistory, listNotes, updateNote } from "@/lib/server/notes";
import { createTarget, deleteTarget, getTarget, listTargets, updateTarget } from "@/lib/server/targets";

type ProposalParams = { proposalId: string };
type TargetParams = ProposalParams & { targetId: string };
type NoteParams = TargetParams & { noteId: string };

/** /api/proposals/[proposalId]/targets */
export function targetCollectionRoutes(getActor: GetActor) {
  return {
    GET: endpoint<ProposalParams>(getActor, async ({ request, params, actor }) =>
      Response.json(await listTargets(params, queryOf(request), actor)),
    ),
    POST: endpoint<ProposalParams>(getActor, async ({ request, params, actor }) =>
      Response.json({ target: await createTarget(params, await readJsonOfSignedIn(request, actor), actor) }, { status: 201 }),
    ),
  };
}

/** /api/proposals/[proposalId]/targets/[targetId] */
export function targetRoutes(getActor: GetActor) {
  return {
    GET: endpoint<TargetParams>(getActor, async ({ params, actor }) => Response.json({ target: await getTarget(params, actor) })),
    PATCH: endpoint<TargetParams>(getActor, async ({ request, params, actor }) =>
      Response.json({ target: await updateTarget(params, await readJsonOfSignedIn(request, actor), actor) }),
    ),
    DELETE: endpoint<TargetParams>(getActor, async ({ params, actor }) => {
      await deleteTarget(params, actor);
      return noContent();
    }),
  };
}

/** /api/proposals/[proposalId]/targets/[targetId]/notes */
export function noteCollectionRoutes(getActor: GetActor) {
  return {
    GET: endpoint<TargetParams>(getActor, async ({ params, actor }) => Response.json({ notes: await listNotes(params, actor) })),
    POST: endpoint<TargetParams>(getActor, async ({ request, params, actor }) =>
      Response.json({ note: await createNote(params, await readJsonOfSignedIn(request, actor), actor) }, { status: 201 }),
    ),
  };
}

/** /api/proposals/[proposalId]/targets/[targetId]/notes/[noteId] */
export function noteRoutes(getActor: GetActor) {
  return {
    GET: endpoint<NoteParams>(getActor, async ({ params, actor }) => Response.json(await getNoteHistory(params, actor))),
    PATCH: endpoint<NoteParams>(getActor, async ({ request, params, actor }) =>
      Response.json({ note: await updateNote(params, await readJsonOfSignedIn(request, actor), actor) }),
    ),
    DELETE: endpoint<NoteParams>(getActor, async ({ params, actor }) => {
      await deleteNote(params, actor);
      return noContent();
    }),
  };
}
