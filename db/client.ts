import { drizzle } from "drizzle-orm/postgres-js";
import postgres from "postgres";
import { serverEnv } from "@/lib/env";
import * as schema from "@/db/schema";

/**
 * One bounded connection pool per process. `connect_timeout` and the server-side
 * `statement_timeout` make every query fail fast when PostgreSQL is away, instead of hanging a request.
 * A zero `backoff` reconnects at once: postgres.js otherwise waits up to 20 s between attempts, and the
 * queries queued behind a connection wait with it, which hung requests through an outage and kept the
 * pool away for seconds after PostgreSQL was back. Each attempt is made for a waiting query, so an
 * outage costs one refused connection per query, answered as 503.
 */
function createClient() {
  const env = serverEnv();
  const sql = postgres(env.DATABASE_URL, {
    max: env.DATABASE_POOL_MAX,
    connect_timeout: env.DATABASE_TIMEOUT_SECONDS,
    idle_timeout: 30,
    backoff: () => 0,
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
