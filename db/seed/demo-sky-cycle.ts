import { and, eq, isNull } from "drizzle-orm";
import type { Database } from "@/db/client";
import { proposals, users } from "@/db/schema";
import { runSeedOnce } from "@/db/seed/run-once";
import { demoAccounts, demoProposal, demoShadowProposal } from "@/db/seed/demo-scenario";

/**
 * Cycle 2031A of the demo proposals: 183 nights from the evening of 1 February to that of
 * 2 August 2031, the season view's span.
 */
export const demoCycle = { cycleStartDate: "2031-02-01", cycleEndDate: "2031-08-02" };

/**
 * The invented millimetre array the shadow request is written for: 1.3 mm on a 10,700 km longest
 * baseline, λ/B ≈ 25 µas (the figure the demo's K-17 note quotes).
 */
export const demoInterferometer = { interferometerWavelengthMm: 1.3, interferometerBaselineKm: 10_700 };

/**
 * Gives the demo proposals (created by "demo-workspace-v1") their cycle dates and interferometer,
 * once. Only proposals still without cycle dates are touched, so a PI's later edits stay.
 */
export async function seedDemoSkyCycle(db: Database): Promise<boolean> {
  return runSeedOnce(db, "demo-sky-cycle-v1", async (tx) => {
    const piEmail = demoAccounts.find((a) => a.key === "pi")!.email;
    const [pi] = await tx.select({ id: users.id }).from(users).where(eq(users.email, piEmail)).limit(1);
    if (!pi) return;
    for (const title of [demoProposal.title, demoShadowProposal.title]) {
      await tx
        .update(proposals)
        .set({ ...demoCycle, ...demoInterferometer })
        .where(and(eq(proposals.title, title), eq(proposals.createdBy, pi.id), isNull(proposals.cycleStartDate)));
    }
  });
}
