import { runSeedOnce } from "@/db/seed/run-once";
import type { Database } from "@/db/client";

/** The invented demo scenario, applied once per database. */
export async function seedDemo(db: Database): Promise<boolean> {
  return runSeedOnce(db, "demo-v1", async () => {});
}
