import { drizzle } from "drizzle-orm/postgres-js";
import postgres from "postgres";
import { serverEnv } from "@/lib/env";
import * as schema from "@/db/schema";

/**
 * One bounded connection pool per process. `connect_timeout` and the server-side
 * `statement_timeout` make every query fail fast when PostgreSQL is away, instead of hanging a request.
 */
function createClient() {
  const env = serverEnv();
  const sql = postgres(env.DATABASE_URL, {
    max: env.DATABASE_POOL_MAX,
    connect_timeout: env.DATABASE_TIMEOUT_SECONDS,
    idle_timeout: 30,
    onnotice: () => {},
    connection: { statement_timeout: Math.round(env.DATABASE_TIMEOUT_SECONDS * 1000) },
  });
  return { sql, db: drizzle(sql, { schema }) };
}

type Client = ReturnType<typeof createClient>;

const globalForDb = globalThis as unknown as { arcwrightDb?: Client };

/** The shared client; kept on `globalThis` so dev-server reloads do not open a new pool each time. */
export function dbClient(): Client {
  globalForDb.arcwrightDb ??= createClient();
  return globalForDb.arcwrightDb;
}

export type Database = Client["db"];
