import "server-only";
import { sql } from "drizzle-orm";
import { dbClient, type Database } from "@/db/client";

export type DatabaseHealth = { ok: true; latencyMs: number } | { ok: false; reason: string };

/**
 * Runs a real query against PostgreSQL (the app's pool unless another is given), bounded by the
 * pool's connect and statement timeouts.
 */
export async function checkDatabase(db: Database = dbClient().db): Promise<DatabaseHealth> {
  const started = performance.now();
  try {
    const rows = await db.execute<{ one: number }>(sql`select 1 as one`);
    if (Number(rows[0]?.one) !== 1) return { ok: false, reason: "unexpected answer to select 1" };
    return { ok: true, latencyMs: Math.round((performance.now() - started) * 10) / 10 };
  } catch (error) {
    const code = (error as { code?: string }).code;
    return { ok: false, reason: code ? `database error ${code}` : "database unreachable" };
  }
}
