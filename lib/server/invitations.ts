import "server-only";
import { and, desc, eq, gt, isNull, sql } from "drizzle-orm";
import { dbClient } from "@/db/client";
import { invitations, proposalMembers, proposals, users } from "@/db/schema";
import { hashLinkToken, newLinkToken } from "@/lib/auth/tokens";
import { AppError } from "@/lib/errors";
import { invitationParamsSchema, proposalParamsSchema } from "@/lib/workspace/ids";
import { acceptInvitationSchema, createInvitationSchema, tokenSchema } from "@/lib/workspace/member-schema";
import { roleLabels, type ProposalRole } from "@/lib/workspace/roles";
import { authorize, parseIds } from "@/lib/server/access";
import { recordActivity } from "@/lib/server/activity";
import { requireActor, type Actor } from "@/lib/server/actor";
import { parseOrThrow } from "@/lib/server/http";
import { appLink, linkMail, sendMail } from "@/lib/server/mailer";
import type { InvitationView } from "@/lib/workspace/member-view";

export const invitationLifetimeDays = 7;

/** What the person holding an invitation link may see before accepting it. */
export interface InvitationPreview {
  proposalId: string;
  proposalTitle: string;
  email: string;
  role: ProposalRole;
  invitedByName: string | null;
  expiresAt: string;
  state: "open" | "accepted" | "expired" | "revoked";
}

const open = and(isNull(invitations.acceptedAt), isNull(invitations.revokedAt), gt(invitations.expiresAt, sql`now()`));

/** PI only: the invitations not yet accepted, revoked or expired. */
export async function listInvitations(params: unknown, actor: Actor | null): Promise<InvitationView[]> {
  const { proposalId } = parseIds(proposalParamsSchema, params, "proposal");
  const { db } = dbClient();
  await authorize(db, proposalId, requireActor(actor), "manage", "invitation");
  const rows = await db
    .select({
      id: invitations.id,
      email: invitations.email,
      role: invitations.role,
      invitedByName: users.name,
      expiresAt: invitations.expiresAt,
      createdAt: invitations.createdAt,
    })
    .from(invitations)
    .leftJoin(users, eq(users.id, invitations.invitedBy))
    .where(and(eq(invitations.proposalId, proposalId), open))
    .orderBy(desc(invitations.createdAt))
    .limit(200);
  return rows.map((r) => ({ ...r, expiresAt: r.expiresAt.toISOString(), createdAt: r.createdAt.toISOString() }));
}

/**
 * PI only. Records the invitation and e-mails its link in one transaction: if the mail cannot be sent,
 * no invitation is left behind that nobody received.
 */
export async function createInvitation(params: unknown, input: unknown, actor: Actor | null): Promise<InvitationView> {
  const { proposalId } = parseIds(proposalParamsSchema, params, "proposal");
  const who = requireActor(actor);
  const { email, role } = parseOrThrow(createInvitationSchema, input, "invitation");
  return dbClient().db.transaction(async (tx) => {
    const { proposal } = await authorize(tx, proposalId, who, "manage", "invitation");
    const [existing] = await tx
      .select({ userId: proposalMembers.userId })
      .from(proposalMembers)
      .innerJoin(users, eq(users.id, proposalMembers.userId))
      .where(and(eq(proposalMembers.proposalId, proposalId), eq(users.email, email)))
      .limit(1);
    if (existing) throw new AppError("conflict:invitation", `${email} is already a member.`, { email: ["Already a member."] });
    const { token, tokenHash } = newLinkToken();
    const [invitation] = await tx
      .insert(invitations)
      .values({ proposalId, email, role, tokenHash, invitedBy: who.userId, expiresAt: sql`now() + make_interval(days => ${invitationLifetimeDays})` })
      .returning();
    await recordActivity(tx, { proposalId, actorId: who.userId, action: "invitation.sent", subject: `${email} as ${roleLabels[role]}` });
    await sendMail(
      linkMail(
        email,
        `${who.name} invites you to “${proposal.title}” on Arcwright`,
        [
          `${who.name} invites you to join the proposal “${proposal.title}” (${proposal.cycle}) as ${roleLabels[role]}.`,
          `The invitation is valid for ${invitationLifetimeDays} days. Sign in or create an account with this e-mail address to accept it.`,
        ],
        { label: "Open the invitation", url: appLink(`/proposals/invitations/${token}`) },
      ),
    );
    return {
      id: invitation.id,
      email,
      role,
      invitedByName: who.name,
      expiresAt: invitation.expiresAt.toISOString(),
      createdAt: invitation.createdAt.toISOString(),
    };
  });
}

/** PI only. */
export async function revokeInvitation(params: unknown, actor: Actor | null): Promise<void> {
  const { proposalId, invitationId } = parseIds(invitationParamsSchema, params, "invitation");
  const who = requireActor(actor);
  await dbClient().db.transaction(async (tx) => {
    await authorize(tx, proposalId, who, "manage", "invitation");
    const [revoked] = await tx
      .update(invitations)
      .set({ revokedAt: sql`now()` })
      .where(and(eq(invitations.id, invitationId), eq(invitations.proposalId, proposalId), open))
      .returning({ email: invitations.email });
    if (!revoked) throw new AppError("not_found:invitation", "No open invitation with this id.");
    await recordActivity(tx, { proposalId, actorId: who.userId, action: "invitation.revoked", subject: revoked.email });
  });
}

function parseToken(token: unknown): string {
  const result = tokenSchema.safeParse(token);
  if (!result.success) throw new AppError("not_found:invitation", "This invitation link is not valid.");
  return result.data;
}

/** The invitation behind a link, for anyone holding the link (the token is the secret). */
export async function previewInvitation(token: unknown): Promise<InvitationPreview> {
  const tokenHash = hashLinkToken(parseToken(token));
  const [row] = await dbClient()
    .db.select({ invitation: invitations, proposalTitle: proposals.title, invitedByName: users.name, isExpired: sql<boolean>`${invitations.expiresAt} <= now()` })
    .from(invitations)
    .innerJoin(proposals, eq(proposals.id, invitations.proposalId))
    .leftJoin(users, eq(users.id, invitations.invitedBy))
    .where(eq(invitations.tokenHash, tokenHash))
    .limit(1);
  if (!row) throw new AppError("not_found:invitation", "This invitation link is not valid.");
  const { invitation } = row;
  const state = invitation.acceptedAt ? "accepted" : invitation.revokedAt ? "revoked" : row.isExpired ? "expired" : "open";
  return {
    proposalId: invitation.proposalId,
    proposalTitle: row.proposalTitle,
    email: invitation.email,
    role: invitation.role,
    invitedByName: row.invitedByName,
    expiresAt: invitation.expiresAt.toISOString(),
    state,
  };
}

/**
 * Accepts an open invitation as the signed-in actor, whose e-mail must be the invited one (a
 * forwarded link does not let someone else in). Creates the membership; spends the invitation.
 */
export async function acceptInvitation(input: unknown, actor: Actor | null): Promise<{ proposalId: string; role: ProposalRole }> {
  const who = requireActor(actor);
  const { token } = parseOrThrow(acceptInvitationSchema, input, "invitation");
  return dbClient().db.transaction(async (tx) => {
    const [invitation] = await tx
      .select()
      .from(invitations)
      .where(and(eq(invitations.tokenHash, hashLinkToken(token)), open))
      .for("update")
      .limit(1);
    if (!invitation) {
      const message = "This invitation has expired, was revoked or was already used.";
      throw new AppError("bad_request:invitation", message, { token: [message] });
    }
    if (invitation.email !== who.email) {
      throw new AppError("forbidden:invitation", `This invitation was sent to ${invitation.email}; sign in with that address to accept it.`);
    }
    await tx
      .insert(proposalMembers)
      .values({ proposalId: invitation.proposalId, userId: who.userId, role: invitation.role })
      // Someone who is already a member keeps their role: an invitation never demotes a PI.
      .onConflictDoNothing();
    await tx.update(invitations).set({ acceptedAt: sql`now()`, acceptedBy: who.userId }).where(eq(invitations.id, invitation.id));
    await recordActivity(tx, {
      proposalId: invitation.proposalId,
      actorId: who.userId,
      action: "member.joined",
      subject: `${who.name} as ${roleLabels[invitation.role]}`,
    });
    return { proposalId: invitation.proposalId, role: invitation.role };
  });
}
