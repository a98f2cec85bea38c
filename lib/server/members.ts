import "server-only";
import { and, asc, count, eq } from "drizzle-orm";
import { dbClient, type Database } from "@/db/client";
import { proposalMembers, users } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { memberParamsSchema, proposalParamsSchema } from "@/lib/workspace/ids";
import { changeRoleSchema } from "@/lib/workspace/member-schema";
import { roleLabels } from "@/lib/workspace/roles";
import { authorize, parseIds } from "@/lib/server/access";
import { recordActivity } from "@/lib/server/activity";
import { requireActor, type Actor } from "@/lib/server/actor";
import { parseOrThrow } from "@/lib/server/http";
import type { MemberView } from "@/lib/workspace/member-view";

type Tx = Pick<Database, "select">;

export async function listMembers(params: unknown, actor: Actor | null): Promise<MemberView[]> {
  const { proposalId } = parseIds(proposalParamsSchema, params, "proposal");
  const { db } = dbClient();
  await authorize(db, proposalId, requireActor(actor), "read", "member");
  const rows = await db
    .select({ userId: users.id, name: users.name, email: users.email, role: proposalMembers.role, joinedAt: proposalMembers.joinedAt })
    .from(proposalMembers)
    .innerJoin(users, eq(users.id, proposalMembers.userId))
    .where(eq(proposalMembers.proposalId, proposalId))
    .orderBy(asc(proposalMembers.role), asc(users.name))
    .limit(500);
  return rows.map((r) => ({ ...r, joinedAt: r.joinedAt.toISOString() }));
}

async function loadMember(tx: Tx, proposalId: string, userId: string) {
  const [member] = await tx
    .select({ role: proposalMembers.role, name: users.name })
    .from(proposalMembers)
    .innerJoin(users, eq(users.id, proposalMembers.userId))
    .where(and(eq(proposalMembers.proposalId, proposalId), eq(proposalMembers.userId, userId)))
    .for("update", { of: proposalMembers })
    .limit(1);
  if (!member) throw new AppError("not_found:member", "No such member of this proposal.");
  return member;
}

/**
 * Locks the proposal's PI rows (in one order, so two callers cannot deadlock) before the caller's role
 * is checked: a second PI demoting or removing the first waits here, then sees the first's change, so
 * two PIs demoting each other at once cannot leave none (the loser is no longer PI: 403).
 */
async function lockPiRows(tx: Tx, proposalId: string): Promise<void> {
  await tx
    .select({ userId: proposalMembers.userId })
    .from(proposalMembers)
    .where(and(eq(proposalMembers.proposalId, proposalId), eq(proposalMembers.role, "pi")))
    .orderBy(asc(proposalMembers.userId))
    .for("update");
}

/** A proposal always keeps a PI: someone must be able to manage it. */
async function requireAnotherPi(tx: Tx, proposalId: string): Promise<void> {
  const [{ pis }] = await tx
    .select({ pis: count() })
    .from(proposalMembers)
    .where(and(eq(proposalMembers.proposalId, proposalId), eq(proposalMembers.role, "pi")));
  if (pis <= 1) throw new AppError("conflict:member", "A proposal needs at least one PI; make someone else PI first.");
}

/** PI only. */
export async function changeMemberRole(params: unknown, input: unknown, actor: Actor | null): Promise<MemberView[]> {
  const { proposalId, userId } = parseIds(memberParamsSchema, params, "member");
  const who = requireActor(actor);
  const { role } = parseOrThrow(changeRoleSchema, input, "member");
  await dbClient().db.transaction(async (tx) => {
    await lockPiRows(tx, proposalId);
    await authorize(tx, proposalId, who, "manage", "member");
    const member = await loadMember(tx, proposalId, userId);
    if (member.role === role) return;
    if (member.role === "pi") await requireAnotherPi(tx, proposalId);
    await tx.update(proposalMembers).set({ role }).where(and(eq(proposalMembers.proposalId, proposalId), eq(proposalMembers.userId, userId)));
    await recordActivity(tx, { proposalId, actorId: who.userId, action: "member.role_changed", subject: `${member.name} → ${roleLabels[role]}` });
  });
  return listMembers({ proposalId }, actor);
}

/** PI only; never the last PI. */
export async function removeMember(params: unknown, actor: Actor | null): Promise<void> {
  const { proposalId, userId } = parseIds(memberParamsSchema, params, "member");
  const who = requireActor(actor);
  await dbClient().db.transaction(async (tx) => {
    await lockPiRows(tx, proposalId);
    await authorize(tx, proposalId, who, "manage", "member");
    const member = await loadMember(tx, proposalId, userId);
    if (member.role === "pi") await requireAnotherPi(tx, proposalId);
    await tx.delete(proposalMembers).where(and(eq(proposalMembers.proposalId, proposalId), eq(proposalMembers.userId, userId)));
    await recordActivity(tx, { proposalId, actorId: who.userId, action: "member.removed", subject: member.name });
  });
}
