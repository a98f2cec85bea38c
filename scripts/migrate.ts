// Applies the committed drizzle-kit migrations to DATABASE_URL, re-derives every target computed by
// older rules (lib/workspace/derived.ts DERIVATION_VERSION), then exits.
import { drizzle } from "drizzle-orm/postgres-js";
import { migrate } from "drizzle-orm/postgres-js/migrator";
import postgres from "postgres";
import { parseServerEnv } from "@/lib/env";
import { rederiveStaleTargets } from "@/lib/server/derived-columns";

const env = parseServerEnv(process.env);
const sql = postgres(env.DATABASE_URL, { max: 1, onnotice: () => {} });
try {
  const db = drizzle(sql);
  await migrate(db, { migrationsFolder: "migrations" });
  console.log("[migrate] database schema is current");
  const rederived = await rederiveStaleTargets(db);
  if (rederived > 0) console.log(`[migrate] re-derived ${rederived} targets computed by older rules`);
} finally {
  await sql.end();
}
