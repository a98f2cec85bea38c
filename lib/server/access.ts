import "server-only";
import { and, eq } from "drizzle-orm";
import type { Database } from "@/db/client";
import { proposalMembers, proposals, type Proposal } from "@/db/schema";
import type { z } from "zod";
import { AppError } from "@/lib/errors";
import { auditorRole, roleCan, siteRoleCan, type Capability, type ProposalRole } from "@/lib/workspace/roles";
import type { Actor } from "@/lib/server/actor";

type Queryable = Pick<Database, "select">;

export interface Access {
  proposal: Proposal;
  role: ProposalRole;
  /** A site admin reading a proposal they are not a member of: a viewer's rights, nothing more. */
  isAudit: boolean;
}

/**
 * Loads a proposal together with the actor's role on it. A proposal the actor is not a member of
 * answers exactly like one that does not exist (404), so ids cannot be probed. A site admin who is
 * not a member reads it as an auditor (the viewer role); a member's own role always comes first.
 */
export async function loadAccess(db: Queryable, proposalId: string, actor: Actor): Promise<Access> {
  const [row] = await db
    .select({ proposal: proposals, role: proposalMembers.role })
    .from(proposals)
    .leftJoin(proposalMembers, and(eq(proposalMembers.proposalId, proposals.id), eq(proposalMembers.userId, actor.userId)))
    .where(eq(proposals.id, proposalId))
    .limit(1);
  if (row?.role) return { proposal: row.proposal, role: row.role, isAudit: false };
  if (row && siteRoleCan(actor.siteRole, "audit")) return { proposal: row.proposal, role: auditorRole, isAudit: true };
  throw new AppError("not_found:proposal", "No such proposal.");
}

/** 403 naming the subject when the member's role does not allow `capability`. */
export function requireCapability(access: Access, capability: Capability, subject: string): void {
  if (!roleCan(access.role, capability)) {
    const why = access.isAudit ? "A site admin reads proposals they are not on as an auditor and cannot change them" : `Your role on this proposal (${access.role}) does not allow this`;
    throw new AppError(`forbidden:${subject}`, `${why}.`);
  }
}

/** load + role check in one call, the shape almost every data-access function starts with. */
export async function authorize(db: Queryable, proposalId: string, actor: Actor, capability: Capability, subject: string) {
  const access = await loadAccess(db, proposalId, actor);
  requireCapability(access, capability, subject);
  return access;
}

/** Route ids that do not parse (not UUIDs) name nothing that exists: 404, like a missing record. */
export function parseIds<T extends z.ZodType>(schema: T, params: unknown, subject: string): z.infer<T> {
  const result = schema.safeParse(params);
  if (!result.success) throw new AppError(`not_found:${subject}`, `No such ${subject}.`);
  return result.data;
}
