import { pgTable, text, timestamp } from "drizzle-orm/pg-core";

/** Which seed sets have been applied to this database, so seeding runs once and never duplicates. */
export const seedRuns = pgTable("seed_runs", {
  name: text("name").primaryKey(),
  appliedAt: timestamp("applied_at", { withTimezone: true }).notNull().defaultNow(),
});

export type SeedRun = typeof seedRuns.$inferSelect;
