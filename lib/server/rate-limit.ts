import "server-only";
import { and, eq, lt, sql } from "drizzle-orm";
import { dbClient } from "@/db/client";
import { rateLimitCounters } from "@/db/schema";
import { AppError } from "@/lib/errors";

export interface RateLimit {
  /** Distinguishes counters, e.g. "sign-in:account:<email>". */
  bucket: string;
  limit: number;
  windowSeconds: number;
}

/**
 * Counts one attempt in a fixed window and throws `rate_limited:<subject>` once the window's limit is
 * passed, with `details.retryAfterSeconds` (the rest of the window; the answer's Retry-After header). The upsert is one statement, so concurrent attempts from several app instances all count.
 */
export async function consumeAttempt({ bucket, limit, windowSeconds }: RateLimit, subject: string): Promise<void> {
  const { db } = dbClient();
  const windowStartSql = sql`to_timestamp(floor(extract(epoch from now()) / ${windowSeconds}) * ${windowSeconds})`;
  const [row] = await db
    .insert(rateLimitCounters)
    .values({ bucket, windowStart: windowStartSql, hits: 1 })
    .onConflictDoUpdate({
      target: [rateLimitCounters.bucket, rateLimitCounters.windowStart],
      set: { hits: sql`${rateLimitCounters.hits} + 1` },
    })
    .returning({
      hits: rateLimitCounters.hits,
      // Seconds until this window closes, by the database clock that placed the window.
      secondsLeft: sql<number>`greatest(1, ceil(extract(epoch from ${rateLimitCounters.windowStart}) + ${windowSeconds} - extract(epoch from now())))::int`,
    });
  // The first attempt of a new window drops this bucket's older windows, so counters do not pile up.
  if (row.hits === 1) {
    await db.delete(rateLimitCounters).where(and(eq(rateLimitCounters.bucket, bucket), lt(rateLimitCounters.windowStart, windowStartSql)));
  }
  if (row.hits > limit) {
    throw new AppError(`rate_limited:${subject}`, "Too many attempts; wait a few minutes and try again.", undefined, {
      retryAfterSeconds: row.secondsLeft,
    });
  }
}

/**
 * Clears a bucket's counts, for a limit that guards against guessing: after a successful sign-in the
 * account's failed attempts no longer count (common practice, so a team signing in all evening is
 * never locked out by its own successes).
 */
export async function forgiveAttempts(bucket: string): Promise<void> {
  await dbClient().db.delete(rateLimitCounters).where(eq(rateLimitCounters.bucket, bucket));
}
