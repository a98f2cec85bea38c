import { randomUUID } from "node:crypto";
import { dbClient } from "@/db/client";
import { invitations, proposalMembers, users } from "@/db/schema";
import { newLinkToken } from "@/lib/auth/tokens";
import type { ProposalRole } from "@/lib/workspace/roles";
import type { Actor } from "@/lib/server/actor";
import { actorOf } from "@/lib/server/accounts";
import { createNote } from "@/lib/server/notes";
import { createProposal } from "@/lib/server/proposals";
import { createTarget } from "@/lib/server/targets";

export const proposalInput = {
  title: "Arcs over the Tessellate bulge field",
  cycle: "2031A",
  abstract: "Point-lens candidates and two galaxy-scale lenses.",
  site: { name: "Cerro Velado test site", latitudeDeg: -24.6, longitudeDeg: -70.4, elevationM: 2635, horizonLimitDeg: 20 },
  instrument: { resolutionMas: 60, cadenceHours: 6, campaignLengthDays: 120 },
};

export const pointTargetInput = {
  name: "TB-ML-0001",
  ra: "17 57 12.4",
  dec: "-29 12 05",
  lensModel: "point",
  lensMassSolar: 0.4,
  lensDistancePc: 4000,
  sourceDistancePc: 8000,
  sourceOffsetThetaE: 0.3,
  properMotionMasPerYr: 5,
  priority: 2,
  tags: ["bulge"],
};

export async function createUser(label: string, siteRole: "admin" | "member" = "member"): Promise<Actor> {
  const email = `${label}-${randomUUID().slice(0, 8)}@example.org`;
  const [user] = await dbClient().db.insert(users).values({ email, name: label, siteRole }).returning();
  return actorOf(user);
}

/** The five kinds of caller of the authorization matrix. */
export const callers = ["signedOut", "outsider", "viewer", "coi", "pi"] as const;
export type Caller = (typeof callers)[number];

export interface World {
  actors: Record<Exclude<Caller, "signedOut">, Actor>;
  proposalId: string;
  targetId: string;
  noteId: string;
  invitationId: string;
}

/** A fresh proposal with one member per role, a target, a note and an open invitation. */
export async function createWorld(): Promise<World> {
  const [pi, coi, viewer, outsider] = await Promise.all(["pi", "coi", "viewer", "outsider"].map((l) => createUser(l)));
  const proposal = await createProposal(proposalInput, pi);
  const roles: [Actor, ProposalRole][] = [
    [coi, "coi"],
    [viewer, "viewer"],
  ];
  await dbClient().db.insert(proposalMembers).values(roles.map(([a, role]) => ({ proposalId: proposal.id, userId: a.userId, role })));
  const target = await createTarget({ proposalId: proposal.id }, pointTargetInput, pi);
  const note = await createNote({ proposalId: proposal.id, targetId: target.id }, { body: "First look: *baseline flat*." }, coi);
  const [invitation] = await dbClient()
    .db.insert(invitations)
    .values({
      proposalId: proposal.id,
      email: `guest-${randomUUID().slice(0, 8)}@example.org`,
      role: "viewer",
      tokenHash: newLinkToken().tokenHash,
      invitedBy: pi.userId,
      expiresAt: new Date(Date.now() + 86_400_000),
    })
    .returning();
  return { actors: { pi, coi, viewer, outsider }, proposalId: proposal.id, targetId: target.id, noteId: note.id, invitationId: invitation.id };
}

export const actorFor = (world: World, caller: Caller): Actor | null => (caller === "signedOut" ? null : world.actors[caller]);
