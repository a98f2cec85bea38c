import "server-only";
import type { GetActor } from "@/lib/server/actor";
import { listActivity } from "@/lib/server/activity";
import { endpoint, noContent, queryOf, readJsonOfSignedIn } from "@/lib/server/api/endpoint";
import { createProposal, deleteProposal, getProposal, listProposals, updateProposal } from "@/lib/server/proposals";

type ProposalParams = { proposalId: string };

/** /api/proposals */
export function proposalCollectionRoutes(getActor: GetActor) {
  return {
    GET: endpoint(getActor, async ({ actor }) => Response.json({ proposals: await listProposals(actor) })),
    POST: endpoint(getActor, async ({ request, actor }) =>
      Response.json({ proposal: await createProposal(await readJsonOfSignedIn(request, actor), actor) }, { status: 201 }),
    ),
  };
}

/** /api/proposals/[proposalId] */
export function proposalRoutes(getActor: GetActor) {
  return {
    GET: endpoint<ProposalParams>(getActor, async ({ params, actor }) => Response.json({ proposal: await getProposal(params, actor) })),
    PATCH: endpoint<ProposalParams>(getActor, async ({ request, params, actor }) =>
      Response.json({ proposal: await updateProposal(params, await readJsonOfSignedIn(request, actor), actor) }),
    ),
    DELETE: endpoint<ProposalParams>(getActor, async ({ params, actor }) => {
      await deleteProposal(params, actor);
      return noContent();
    }),
  };
}

/** /api/proposals/[proposalId]/activity */
export function activityRoutes(getActor: GetActor) {
  return {
    GET: endpoint<ProposalParams>(getActor, async ({ request, params, actor }) =>
      Response.json(await listActivity(params, queryOf(request), actor)),
    ),
  };
}
