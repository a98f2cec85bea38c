import { hashPassword } from "@/lib/auth/password";
import { rederiveStaleTargets } from "@/lib/server/derived-columns";
import type { Database } from "@/db/client";
import { activity, proposalMembers, proposals, users } from "@/db/schema";
import { seedDemoSkyCycle } from "@/db/seed/demo-sky-cycle";
import { seedDemoScienceCases } from "@/db/seed/demo-science-cases";
import { seedDemoPhotonBudget } from "@/db/seed/demo-photon-budget";
import { seedDemoRelativisticOrbit } from "@/db/seed/demo-relativistic-orbit";
import { insertDemoTargets } from "@/db/seed/demo-targets";
import { runSeedOnce, type SeedTransaction as Tx } from "@/db/seed/run-once";
import {
  compactObject,
  demoAccounts,
  demoMembers,
  demoProposal,
  demoShadowProposal,
  demoTargets,
} from "@/db/seed/demo-scenario";


async function insertProposal(tx: Tx, input: typeof demoProposal | typeof demoShadowProposal, createdBy: string) {
  const [proposal] = await tx
    .insert(proposals)
    .values({
      title: input.title,
      cycle: input.cycle,
      abstract: input.abstract,
      siteName: input.site.name,
      siteLatitudeDeg: input.site.latitudeDeg,
      siteLongitudeDeg: input.site.longitudeDeg,
      siteElevationM: input.site.elevationM,
      siteHorizonLimitDeg: input.site.horizonLimitDeg,
      ...input.instrument,
      createdBy,
    })
    .returning();
  return proposal;
}

/**
 * The invented demo scenario (accounts, proposals, targets, notes), then its later seed sets, each
 * applied once per database. True when the first set was applied now.
 */
export async function seedDemo(db: Database): Promise<boolean> {
  const applied = await seedDemoWorkspace(db);
  await seedDemoSkyCycle(db);
  await seedDemoScienceCases(db);
  await seedDemoPhotonBudget(db);
  await seedDemoRelativisticOrbit(db);
  // Targets are inserted without derived columns (version 0); derive them once the cycle is set.
  await rederiveStaleTargets(db);
  return applied;
}

async function seedDemoWorkspace(db: Database): Promise<boolean> {
  return runSeedOnce(db, "demo-workspace-v1", async (tx) => {
    const ids: Record<string, string> = {};
    for (const account of demoAccounts) {
      const [user] = await tx
        .insert(users)
        .values({ email: account.email, name: account.name, siteRole: account.siteRole, passwordHash: await hashPassword(account.password) })
        .returning();
      ids[account.key] = user.id;
    }
    const main = await insertProposal(tx, demoProposal, ids.pi);
    await tx.insert(proposalMembers).values(demoMembers.map(([key, role]) => ({ proposalId: main.id, userId: ids[key], role })));
    await tx.insert(activity).values({ proposalId: main.id, actorId: ids.pi, action: "proposal.created", subject: main.title });
    await insertDemoTargets(tx, main.id, demoTargets, [ids.pi, ids.coi]);

    const shadow = await insertProposal(tx, demoShadowProposal, ids.pi);
    await tx.insert(proposalMembers).values([
      { proposalId: shadow.id, userId: ids.pi, role: "pi" },
      { proposalId: shadow.id, userId: ids.coi, role: "viewer" },
    ]);
    await tx.insert(activity).values({ proposalId: shadow.id, actorId: ids.pi, action: "proposal.created", subject: shadow.title });
    await insertDemoTargets(tx, shadow.id, [compactObject], [ids.pi]);
  });
}
