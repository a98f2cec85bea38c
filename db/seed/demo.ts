import { hashPassword } from "@/lib/auth/password";
import { parseDeclinationDeg, parseRightAscensionDeg } from "@/lib/workspace/coordinates";
import { deriveTargetColumns } from "@/lib/workspace/derived";
import type { Database } from "@/db/client";
import { activity, noteRevisions, notes, proposalMembers, proposals, targets, users } from "@/db/schema";
import { seedDemoSkyCycle } from "@/db/seed/demo-sky-cycle";
import { runSeedOnce, type SeedTransaction as Tx } from "@/db/seed/run-once";
import {
  compactObject,
  demoAccounts,
  demoMembers,
  demoProposal,
  demoShadowProposal,
  demoTargets,
  type DemoTarget,
} from "@/db/seed/demo-scenario";


async function insertProposal(tx: Tx, input: typeof demoProposal, createdBy: string) {
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

async function insertTargets(tx: Tx, proposal: { id: string; instrument: typeof demoProposal.instrument }, list: DemoTarget[], authorIds: string[]) {
  for (const [index, { ra, dec, notes: texts, ...t }] of list.entries()) {
    const h = {
      ...t,
      lensMassSolar: t.lensMassSolar ?? null,
      velocityDispersionKmPerS: t.velocityDispersionKmPerS ?? null,
      lensDistancePc: t.lensDistancePc ?? null,
      sourceDistancePc: t.sourceDistancePc ?? null,
      lensRedshift: t.lensRedshift ?? null,
      sourceRedshift: t.sourceRedshift ?? null,
      properMotionMasPerYr: t.properMotionMasPerYr ?? null,
    };
    const author = authorIds[index % authorIds.length];
    const [target] = await tx
      .insert(targets)
      .values({
        ...h,
        proposalId: proposal.id,
        raDeg: parseRightAscensionDeg(ra),
        decDeg: parseDeclinationDeg(dec),
        ...deriveTargetColumns(h, proposal.instrument),
        createdBy: author,
      })
      .returning();
    await tx.insert(activity).values({ proposalId: proposal.id, actorId: author, action: "target.added", subject: target.name });
    for (const body of texts) {
      const [note] = await tx.insert(notes).values({ targetId: target.id, body, authorId: author, updatedBy: author }).returning();
      await tx.insert(noteRevisions).values({ noteId: note.id, version: 1, body, editedBy: author });
    }
  }
}

/**
 * The invented demo scenario (accounts, proposals, targets, notes), then its later seed sets, each
 * applied once per database. True when the first set was applied now.
 */
export async function seedDemo(db: Database): Promise<boolean> {
  const applied = await seedDemoWorkspace(db);
  await seedDemoSkyCycle(db);
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
    await insertTargets(tx, { id: main.id, instrument: demoProposal.instrument }, demoTargets, [ids.pi, ids.coi]);

    const shadow = await insertProposal(tx, demoShadowProposal, ids.pi);
    await tx.insert(proposalMembers).values([
      { proposalId: shadow.id, userId: ids.pi, role: "pi" },
      { proposalId: shadow.id, userId: ids.coi, role: "viewer" },
    ]);
    await tx.insert(activity).values({ proposalId: shadow.id, actorId: ids.pi, action: "proposal.created", subject: shadow.title });
    await insertTargets(tx, { id: shadow.id, instrument: demoShadowProposal.instrument }, [compactObject], [ids.pi]);
  });
}
