import { sql } from "drizzle-orm";
import type { PgDatabase, PgQueryResultHKT } from "drizzle-orm/pg-core";
import { seedRuns } from "@/db/schema";

type AnyPgDatabase = PgDatabase<PgQueryResultHKT, Record<string, unknown>>;
/** The transaction a seed set writes in. */
export type SeedTransaction = Parameters<Parameters<AnyPgDatabase["transaction"]>[0]>[0];

/**
 * Applies the seed set `name` exactly once: its rows and its `seed_runs` marker are written in one
 * transaction, so a second start neither duplicates nor wipes data, and a failed seed leaves nothing.
 * Returns true when the set was applied now, false when it had been applied before.
 */
export async function runSeedOnce(db: AnyPgDatabase, name: string, apply: (tx: SeedTransaction) => Promise<void>) {
  return db.transaction(async (tx) => {
    // Serializes concurrent starts against one database (two app instances seeding at once).
    await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${`seed:${name}`}))`);
    const inserted = await tx.insert(seedRuns).values({ name }).onConflictDoNothing().returning();
    if (inserted.length === 0) return false;
    await apply(tx);
    return true;
  });
}
