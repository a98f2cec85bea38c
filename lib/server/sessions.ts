import "server-only";
import { and, eq, gt, lt, sql } from "drizzle-orm";
import { z } from "zod";
import { dbClient, type Database } from "@/db/client";
import { userSessions, users } from "@/db/schema";
import { requireActor, type Actor } from "@/lib/server/actor";

/** A session lasts this long from its sign-in, however often it is used (the cookie's own lifetime too). */
export const sessionLifetimeSeconds = 30 * 24 * 60 * 60;

/** What the session cookie's JWT carries: the user (`sub`) and the session row (`sid`). */
export interface SessionClaims {
  sub?: unknown;
  sid?: unknown;
}

const claimsSchema = z.object({ sub: z.uuid(), sid: z.uuid() });

/** Records a new session for `userId` and returns its id, for the cookie. Drops the user's expired sessions on the way. */
export async function startSession(userId: string): Promise<string> {
  const { db } = dbClient();
  await db.delete(userSessions).where(and(eq(userSessions.userId, userId), lt(userSessions.expiresAt, sql`now()`)));
  const [session] = await db
    .insert(userSessions)
    .values({ userId, expiresAt: sql`now() + make_interval(secs => ${sessionLifetimeSeconds})` })
    .returning({ id: userSessions.id });
  return session.id;
}

/**
 * The actor a session cookie speaks for: null unless its session row still exists, belongs to that
 * user and has not expired. One query, so every request sees a sign-out, a reset or a removed account
 * at once, whatever copy of the cookie it carries.
 */
export async function sessionOwner(claims: SessionClaims | null): Promise<Actor | null> {
  const parsed = claimsSchema.safeParse(claims ?? {});
  if (!parsed.success) return null;
  const [row] = await dbClient()
    .db.select({ userId: users.id, email: users.email, name: users.name, siteRole: users.siteRole })
    .from(userSessions)
    .innerJoin(users, eq(users.id, userSessions.userId))
    .where(and(eq(userSessions.id, parsed.data.sid), eq(userSessions.userId, parsed.data.sub), gt(userSessions.expiresAt, sql`now()`)))
    .limit(1);
  return row ?? null;
}

/**
 * Sign-out: ends every session of the account whose live session the cookie names, so that no copy
 * of any of its cookies keeps working. A cookie whose session has already ended ends nothing (a stolen
 * old cookie cannot sign its owner out elsewhere).
 */
export async function endSession(claims: SessionClaims | null): Promise<void> {
  const parsed = claimsSchema.safeParse(claims ?? {});
  if (!parsed.success) return;
  await dbClient().db.transaction(async (tx) => {
    const ended = await tx
      .delete(userSessions)
      .where(and(eq(userSessions.id, parsed.data.sid), eq(userSessions.userId, parsed.data.sub)))
      .returning({ id: userSessions.id });
    if (ended.length > 0) await endAllSessions(parsed.data.sub, tx);
  });
}

/** Ends every session of a user (a password reset, "sign out everywhere"); `db` may be a transaction. */
export async function endAllSessions(userId: string, db: Pick<Database, "delete"> = dbClient().db): Promise<void> {
  await db.delete(userSessions).where(eq(userSessions.userId, userId));
}

/** DELETE /api/account/sessions: the signed-in person ends all their sessions, this one included. */
export async function signOutEverywhere(actor: Actor | null): Promise<void> {
  const who = requireActor(actor);
  await endAllSessions(who.userId);
}
