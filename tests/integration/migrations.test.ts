import { eq, sql } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { dbClient } from "@/db/client";
import { seedRuns } from "@/db/schema";
import { runSeedOnce } from "@/db/seed/run-once";

const { db, sql: connection } = dbClient();

afterAll(async () => {
  await connection.end();
});

describe("migrations on the test database", () => {
  it("recorded every committed migration in drizzle's journal", async () => {
    const journal = (await import("@/migrations/meta/_journal.json")).default as { entries: unknown[] };
    const applied = await db.execute<{ count: string }>(sql`select count(*)::text as count from drizzle.__drizzle_migrations`);
    expect(Number(applied[0].count)).toBe(journal.entries.length);
  });

  it("round-trips a row through the seed_runs table", async () => {
    const name = `round-trip-${Date.now()}`;
    await db.insert(seedRuns).values({ name });
    const [row] = await db.select().from(seedRuns).where(eq(seedRuns.name, name));
    expect(row.name).toBe(name);
    expect(row.appliedAt).toBeInstanceOf(Date);
    expect(Date.now() - row.appliedAt.getTime()).toBeLessThan(60_000);
    await db.delete(seedRuns).where(eq(seedRuns.name, name));
  });

  it("applies a seed set once, and a failing seed leaves no marker behind", async () => {
    const name = `once-${Date.now()}`;
    let calls = 0;
    expect(await runSeedOnce(db, name, async () => void calls++)).toBe(true);
    expect(await runSeedOnce(db, name, async () => void calls++)).toBe(false);
    expect(calls).toBe(1);

    const failing = `${name}-failing`;
    await expect(
      runSeedOnce(db, failing, async () => {
        throw new Error("seed broke halfway");
      }),
    ).rejects.toThrow("seed broke halfway");
    expect(await db.select().from(seedRuns).where(eq(seedRuns.name, failing))).toHaveLength(0);
  });
});
