import "server-only";
import { and, desc, eq, lt } from "drizzle-orm";
import { dbClient, type Database } from "@/db/client";
import { activity, users } from "@/db/schema";
import { proposalParamsSchema } from "@/lib/workspace/ids";
import { cursorQuerySchema } from "@/lib/workspace/target-query";
import { authorize, parseIds } from "@/lib/server/access";
import { requireActor, type Actor } from "@/lib/server/actor";
import { parseOrThrow } from "@/lib/server/http";
import type { ActivityAction, ActivityEntry } from "@/lib/workspace/activity-view";

type Writer = Pick<Database, "insert">;

/** Written inside the transaction of the change it describes, so the feed never lists what did not happen. */
export async function recordActivity(
  tx: Writer,
  entry: { proposalId: string; actorId: string; action: ActivityAction; subject: string },
): Promise<void> {
  await tx.insert(activity).values(entry);
}

/** The newest entries first, `limit` at a time; `before` is the id of the last entry already shown. */
export async function listActivity(params: unknown, query: unknown, actor: Actor | null): Promise<{ entries: ActivityEntry[]; nextBefore: number | null }> {
  const { proposalId } = parseIds(proposalParamsSchema, params, "proposal");
  const { limit, before } = parseOrThrow(cursorQuerySchema, query, "query");
  const { db } = dbClient();
  await authorize(db, proposalId, requireActor(actor), "read", "activity");
  const rows = await db
    .select({ id: activity.id, action: activity.action, subject: activity.subject, actorName: users.name, createdAt: activity.createdAt })
    .from(activity)
    .leftJoin(users, eq(users.id, activity.actorId))
    .where(and(eq(activity.proposalId, proposalId), before === undefined ? undefined : lt(activity.id, before)))
    .orderBy(desc(activity.id))
    .limit(limit);
  const entries = rows.map((r) => ({ ...r, action: r.action as ActivityAction, createdAt: r.createdAt.toISOString() }));
  return { entries, nextBefore: rows.length === limit ? rows[rows.length - 1].id : null };
}
