import "server-only";
import { asc, count, eq, ilike, inArray, or } from "drizzle-orm";
import { dbClient } from "@/db/client";
import { proposalMembers, proposals, users } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { accountListQuerySchema, accountParamsSchema, changeSiteRoleSchema } from "@/lib/workspace/admin-schema";
import { siteRoleCan, siteRoleLabels } from "@/lib/workspace/roles";
import { parseIds } from "@/lib/server/access";
import { requireActor, type Actor } from "@/lib/server/actor";
import { parseOrThrow } from "@/lib/server/http";
import { likePattern } from "@/lib/server/targets";
import type { AccountMembership, AccountPage, AccountView } from "@/lib/workspace/account-view";

/**
 * 401 signed out, 403 for anyone but a site admin. The admin area is no secret (the header link is
 * hidden, the page says who may use it), so a member is told "not allowed", not "not found".
 */
export function requireSiteAdmin(actor: Actor | null): Actor {
  const who = requireActor(actor);
  if (!siteRoleCan(who.siteRole, "manageAccounts")) throw new AppError("forbidden:admin", "Only a site admin may do this.");
  return who;
}

type Queryable = Pick<ReturnType<typeof dbClient>["db"], "select">;

async function membershipsOf(db: Queryable, userIds: string[]): Promise<Map<string, AccountMembership[]>> {
  const byUser = new Map<string, AccountMembership[]>();
  if (userIds.length === 0) return byUser;
  const rows = await db
    .select({ userId: proposalMembers.userId, proposalId: proposals.id, title: proposals.title, cycle: proposals.cycle, role: proposalMembers.role })
    .from(proposalMembers)
    .innerJoin(proposals, eq(proposals.id, proposalMembers.proposalId))
    .where(inArray(proposalMembers.userId, userIds))
    .orderBy(asc(proposals.title));
  for (const { userId, ...membership } of rows) {
    const list = byUser.get(userId) ?? [];
    list.push(membership);
    byUser.set(userId, list);
  }
  return byUser;
}

/** Site admin only: one page of accounts by name, each with its site role and its proposals. */
export async function listAccounts(query: unknown, actor: Actor | null): Promise<AccountPage> {
  const q = parseOrThrow(accountListQuerySchema, query, "query");
  requireSiteAdmin(actor);
  const { db } = dbClient();
  const where = q.q ? or(ilike(users.name, likePattern(q.q)), ilike(users.email, likePattern(q.q))) : undefined;
  const [rows, [{ total }]] = await Promise.all([
    db
      .select({ userId: users.id, name: users.name, email: users.email, siteRole: users.siteRole, createdAt: users.createdAt })
      .from(users)
      .where(where)
      .orderBy(asc(users.name), asc(users.id))
      .limit(q.pageSize)
      .offset((q.page - 1) * q.pageSize),
    db.select({ total: count() }).from(users).where(where),
  ]);
  const memberships = await membershipsOf(db, rows.map((r) => r.userId));
  const accounts = rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString(), proposals: memberships.get(r.userId) ?? [] }));
  return { accounts, total, page: q.page, pageSize: q.pageSize };
}

/**
 * Site admin only. The site always keeps one admin: the admin rows are locked first, so two admins
 * demoting each other at the same moment cannot leave none.
 */
export async function changeSiteRole(params: unknown, input: unknown, actor: Actor | null): Promise<AccountView> {
  const { userId } = parseIds(accountParamsSchema, params, "account");
  const who = requireSiteAdmin(actor);
  const { siteRole } = parseOrThrow(changeSiteRoleSchema, input, "account");
  return dbClient().db.transaction(async (tx) => {
    // Re-check the caller inside the transaction: their own admin role may just have been taken away.
    const admins = await tx.select({ id: users.id }).from(users).where(eq(users.siteRole, "admin")).for("update");
    if (!admins.some((a) => a.id === who.userId)) throw new AppError("forbidden:admin", "Only a site admin may do this.");
    const [account] = await tx.select().from(users).where(eq(users.id, userId)).for("update").limit(1);
    if (!account) throw new AppError("not_found:account", "No such account.");
    if (account.siteRole === "admin" && siteRole !== "admin" && admins.length <= 1) {
      throw new AppError("conflict:admin", "The site needs at least one admin; make someone else a site admin first.", {
        siteRole: ["This is the last site admin."],
      });
    }
    let updated = account;
    if (account.siteRole !== siteRole) {
      [updated] = await tx.update(users).set({ siteRole }).where(eq(users.id, userId)).returning();
      // Site roles belong to no proposal, so no proposal's feed records them; the server log does.
      console.info(`site role: ${who.email} made ${account.email} ${siteRoleLabels[siteRole]}`);
    }
    const memberships = await membershipsOf(tx, [userId]);
    return {
      userId: updated.id,
      name: updated.name,
      email: updated.email,
      siteRole: updated.siteRole,
      createdAt: updated.createdAt.toISOString(),
      proposals: memberships.get(userId) ?? [],
    };
  });
}

/** What the header may offer: the admin link for site admins. Signed out is simply "no". */
export function siteAccessOf(actor: Actor | null): { isAdmin: boolean } {
  return { isAdmin: actor !== null && siteRoleCan(actor.siteRole, "manageAccounts") };
}
