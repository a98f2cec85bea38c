// Applies the committed drizzle-kit migrations to DATABASE_URL, then exits.
import { drizzle } from "drizzle-orm/postgres-js";
import { migrate } from "drizzle-orm/postgres-js/migrator";
import postgres from "postgres";
import { parseServerEnv } from "@/lib/env";

const env = parseServerEnv(process.env);
const sql = postgres(env.DATABASE_URL, { max: 1, onnotice: () => {} });
try {
  await migrate(drizzle(sql), { migrationsFolder: "migrations" });
  console.log("[migrate] database schema is current");
} finally {
  await sql.end();
}
