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

const windowStartOf = (windowSeconds: number) => sql`to_timestamp(floor(extract(epoch from now()) / ${windowSeconds}) * ${windowSeconds})`;

/**
 * Counts one attempt in a fixed window: the window's count (this one included) and the seconds until
 * it closes. The upsert is one statement, so concurrent attempts from several app instances all count.
 */
async function countAttempt({ bucket, windowSeconds }: RateLimit): Promise<{ hits: number; secondsLeft: number }> {
  const { db } = dbClient();
  const windowStartSql = windowStartOf(windowSeconds);
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
  return row;
}

/**
 * Counts one attempt and throws `rate_limited:<subject>` once the window's limit is passed, with
 * `details.retryAfterSeconds` (the rest of the window; the answer's Retry-After header). Returns the
 * window's count, this attempt included.
 */
export async function consumeAttempt(limit: RateLimit, subject: string): Promise<number> {
  const { hits, secondsLeft } = await countAttempt(limit);
  if (hits > limit.limit) {
    throw new AppError(`rate_limited:${subject}`, "Too many attempts; wait a few minutes and try again.", undefined, {
      retryAfterSeconds: secondsLeft,
    });
  }
  return hits;
}

/** Counts one use and says whether it is within the window's limit, for a limit whose excess is dropped without a refusal. */
export async function isWithinLimit(limit: RateLimit): Promise<boolean> {
  return (await countAttempt(limit)).hits <= limit.limit;
}

/**
 * Takes back one attempt counted in the current window, for a limit on failures: the attempt is
 * counted before its outcome is known (so parallel attempts cannot overrun the limit) and given back
 * when it succeeds.
 */
export async function refundAttempt({ bucket, windowSeconds }: RateLimit): Promise<void> {
  await dbClient()
    .db.update(rateLimitCounters)
    .set({ hits: sql`greatest(${rateLimitCounters.hits} - 1, 0)` })
    .where(and(eq(rateLimitCounters.bucket, bucket), eq(rateLimitCounters.windowStart, windowStartOf(windowSeconds))));
}

/**
 * Clears a bucket's counts, for a limit that guards against guessing: after a successful sign-in the
 * account's failed attempts no longer count (common practice, so a team signing in all evening is
 * never locked out by its own successes).
 */
export async function forgiveAttempts(bucket: string): Promise<void> {
  await dbClient().db.delete(rateLimitCounters).where(eq(rateLimitCounters.bucket, bucket));
}
