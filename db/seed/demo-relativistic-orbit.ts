import { and, eq, isNull } from "drizzle-orm";
import type { Database } from "@/db/client";
import { proposals, users } from "@/db/schema";
import { insertDemoTargets } from "@/db/seed/demo-targets";
import { runSeedOnce } from "@/db/seed/run-once";
import { demoAccounts, demoProposal, orbitingStar } from "@/db/seed/demo-scenario";

/**
 * Gives the demo proposal its spectroscopic precision and adds the orbiting star (Larkspur-3 b, the
 * relativistic-orbit case), once. A database seeded before the case existed gets the same scenario a
 * new one starts with; a PI's later precision is kept (set only while there is none).
 */
export async function seedDemoRelativisticOrbit(db: Database): Promise<boolean> {
  return runSeedOnce(db, "demo-relativistic-orbit-v1", async (tx) => {
    const piEmail = demoAccounts.find((a) => a.key === "pi")!.email;
    const [pi] = await tx.select({ id: users.id }).from(users).where(eq(users.email, piEmail)).limit(1);
    if (!pi) return;
    const [main] = await tx.select().from(proposals).where(and(eq(proposals.createdBy, pi.id), eq(proposals.title, demoProposal.title))).limit(1);
    if (!main) return;
    await tx
      .update(proposals)
      .set({ spectroscopicPrecisionKmPerS: demoProposal.instrument.spectroscopicPrecisionKmPerS })
      .where(and(eq(proposals.id, main.id), isNull(proposals.spectroscopicPrecisionKmPerS)));
    // Inserted at derivation version 0: the startup re-derivation answers its case.
    await insertDemoTargets(tx, main.id, [orbitingStar], [pi.id]);
  });
}
