import "server-only";
import type { GetActor } from "@/lib/server/actor";
import { endpoint, noContent, readJsonOfSignedIn } from "@/lib/server/api/endpoint";
import { acceptInvitation, createInvitation, listInvitations, revokeInvitation } from "@/lib/server/invitations";
import { changeMemberRole, listMembers, removeMember } from "@/lib/server/members";

type ProposalParams = { proposalId: string };

/** /api/proposals/[proposalId]/members */
export function memberCollectionRoutes(getActor: GetActor) {
  return {
    GET: endpoint<ProposalParams>(getActor, async ({ params, actor }) => Response.json({ members: await listMembers(params, actor) })),
  };
}

/** /api/proposals/[proposalId]/members/[userId] */
export function memberRoutes(getActor: GetActor) {
  type Params = ProposalParams & { userId: string };
  return {
    PATCH: endpoint<Params>(getActor, async ({ request, params, actor }) =>
      Response.json({ members: await changeMemberRole(params, await readJsonOfSignedIn(request, actor), actor) }),
    ),
    DELETE: endpoint<Params>(getActor, async ({ params, actor }) => {
      await removeMember(params, actor);
      return noContent();
    }),
  };
}

/** /api/proposals/[proposalId]/invitations */
export function invitationCollectionRoutes(getActor: GetActor) {
  return {
    GET: endpoint<ProposalParams>(getActor, async ({ params, actor }) =>
      Response.json({ invitations: await listInvitations(params, actor) }),
    ),
    POST: endpoint<ProposalParams>(getActor, async ({ request, params, actor }) =>
      Response.json({ invitation: await createInvitation(params, await readJsonOfSignedIn(request, actor), actor) }, { status: 201 }),
    ),
  };
}

/** /api/proposals/[proposalId]/invitations/[invitationId] */
export function invitationRoutes(getActor: GetActor) {
  return {
    DELETE: endpoint<ProposalParams & { invitationId: string }>(getActor, async ({ params, actor }) => {
      await revokeInvitation(params, actor);
      return noContent();
    }),
  };
}

/** /api/invitations/accept */
export function acceptInvitationRoutes(getActor: GetActor) {
  return {
    POST: endpoint(getActor, async ({ request, actor }) => Response.json(await acceptInvitation(await readJsonOfSignedIn(request, actor), actor))),
  };
}
