import { defineConfig } from "drizzle-kit";

// `drizzle-kit generate` needs no database; `migrate` is done by scripts/migrate.ts at start and in tests.
export default defineConfig({
  dialect: "postgresql",
  schema: "./db/schema.ts",
  out: "./migrations",
  dbCredentials: { url: process.env.DATABASE_URL ?? "postgres://localhost:5432/arcwright" },
});
