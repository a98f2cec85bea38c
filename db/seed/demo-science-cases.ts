import { and, eq, inArray } from "drizzle-orm";
import type { Database } from "@/db/client";
import { proposals, targets, users } from "@/db/schema";
import { insertDemoTargets } from "@/db/seed/demo-targets";
import { runSeedOnce } from "@/db/seed/run-once";
import { compactObject, demoAccounts, demoProposal, demoShadowProposal, demoTargets, faintCore } from "@/db/seed/demo-scenario";

/**
 * Gives the demo targets (created by "demo-workspace-v1") their science cases, peak times and source
 * sizes, the demo proposal its astrometric precision and contrast, and adds the shadow request's
 * counter-case (Wick-4 core), once. A database seeded before science cases existed gets the same
 * scenario a new one starts with; a team's later edits are kept (only rows still without a case or
 * a peak time are touched).
 */
export async function seedDemoScienceCases(db: Database): Promise<boolean> {
  return runSeedOnce(db, "demo-science-cases-v1", async (tx) => {
    const piEmail = demoAccounts.find((a) => a.key === "pi")!.email;
    const [pi] = await tx.select({ id: users.id }).from(users).where(eq(users.email, piEmail)).limit(1);
    if (!pi) return;
    const owned = await tx
      .select()
      .from(proposals)
      .where(and(eq(proposals.createdBy, pi.id), inArray(proposals.title, [demoProposal.title, demoShadowProposal.title])));
    const main = owned.find((p) => p.title === demoProposal.title);
    const shadow = owned.find((p) => p.title === demoShadowProposal.title);
    if (main && main.astrometricPrecisionMas === null) {
      const { astrometricPrecisionMas, reachableContrast } = demoProposal.instrument;
      await tx.update(proposals).set({ astrometricPrecisionMas, reachableContrast }).where(eq(proposals.id, main.id));
    }
    for (const [proposal, list] of [
      [main, demoTargets],
      [shadow, [compactObject]],
    ] as const) {
      if (!proposal) continue;
      for (const t of list) {
        const fields = { scienceCase: t.scienceCase ?? null, eventPeakJdUtc: t.eventPeakJdUtc ?? null, sourceRadiusSolar: t.sourceRadiusSolar ?? null, limbDarkeningU: t.limbDarkeningU ?? null };
        const [row] = await tx.select().from(targets).where(and(eq(targets.proposalId, proposal.id), eq(targets.name, t.name))).limit(1);
        if (!row || row.scienceCase !== null || row.eventPeakJdUtc !== null) continue;
        // Version 0: the startup re-derivation computes the new answers.
        await tx.update(targets).set({ ...fields, derivationVersion: 0 }).where(eq(targets.id, row.id));
      }
    }
    if (shadow) await insertDemoTargets(tx, shadow.id, [faintCore], [pi.id]);
  });
}
