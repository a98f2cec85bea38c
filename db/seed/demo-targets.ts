import { parseDeclinationDeg, parseRightAscensionDeg } from "@/lib/workspace/coordinates";
import { activity, noteRevisions, notes, targets } from "@/db/schema";
import type { SeedTransaction as Tx } from "@/db/seed/run-once";
import type { DemoTarget } from "@/db/seed/demo-scenario";

/**
 * Inserts demo targets with their notes and activity. Their derived columns are left at version 0:
 * `rederiveStaleTargets` computes them once the proposal's settings are complete.
 */
export async function insertDemoTargets(tx: Tx, proposalId: string, list: DemoTarget[], authorIds: string[]) {
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
        proposalId: proposalId,
        raDeg: parseRightAscensionDeg(ra),
        decDeg: parseDeclinationDeg(dec),
        createdBy: author,
      })
      .returning();
    await tx.insert(activity).values({ proposalId: proposalId, actorId: author, action: "target.added", subject: target.name });
    for (const body of texts) {
      const [note] = await tx.insert(notes).values({ targetId: target.id, body, authorId: author, updatedBy: author }).returning();
      await tx.insert(noteRevisions).values({ noteId: note.id, version: 1, body, editedBy: author });
    }
  }
}
