import "server-only";
import type { GetActor } from "@/lib/server/actor";
import { endpoint, readJsonOfSignedIn } from "@/lib/server/api/endpoint";
import { applyFit, listRevisions, undoRevision } from "@/lib/server/target-revisions";

type TargetParams = { proposalId: string; targetId: string };
type RevisionParams = TargetParams & { revisionId: string };

/** /api/proposals/[proposalId]/targets/[targetId]/revisions — the target's revisions; apply a light-curve fit. */
export function revisionCollectionRoutes(getActor: GetActor) {
  return {
    GET: endpoint<TargetParams>(getActor, async ({ params, actor }) => Response.json({ revisions: await listRevisions(params, actor) })),
    POST: endpoint<TargetParams>(getActor, async ({ request, params, actor }) =>
      Response.json(await applyFit(params, await readJsonOfSignedIn(request, actor), actor), { status: 201 }),
    ),
  };
}

/** .../revisions/[revisionId]/undo — undo the latest applied fit while the target still holds it. */
export function revisionUndoRoutes(getActor: GetActor) {
  return {
    POST: endpoint<RevisionParams>(getActor, async ({ params, actor }) => Response.json(await undoRevision(params, actor), { status: 201 })),
  };
}
