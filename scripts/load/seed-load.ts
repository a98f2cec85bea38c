// Seeds the load run's scenario into an empty throwaway database and writes what the run needs (the
// proposal, its target ids, the members and their passwords) as JSON to the file named by --out.
//
//   tsx scripts/load/seed-load.ts --out <file>
import { writeFileSync } from "node:fs";
import { dbClient } from "@/db/client";
import { noteRevisions, notes, proposalMembers, proposals, targets, users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { createTargetSchema } from "@/lib/workspace/target-schema";
import { rederiveTargets } from "@/lib/server/derived-columns";
import { loadMembers, loadNotes, loadProposal, loadTargets } from "./load-scenario";

/** What run.mjs reads back. */
interface LoadSeed {
  proposalId: string;
  targetIds: string[];
  members: { email: string; password: string; role: string }[];
}

const insertChunkRows = 250;

const outAt = process.argv.indexOf("--out");
const outFile = outAt >= 0 ? process.argv[outAt + 1] : undefined;
if (!outFile) throw new Error("usage: tsx scripts/load/seed-load.ts --out <file>");

const { db, sql } = dbClient();
try {
  const seed = await db.transaction(async (tx) => {
    const userIds: string[] = [];
    for (const member of loadMembers) {
      const [user] = await tx
        .insert(users)
        .values({ email: member.email, name: member.name, passwordHash: await hashPassword(member.password) })
        .returning({ id: users.id });
      userIds.push(user.id);
    }
    const piId = userIds[loadMembers.findIndex((m) => m.role === "pi")];
    const [proposal] = await tx
      .insert(proposals)
      .values({
        title: loadProposal.title,
        cycle: loadProposal.cycle,
        abstract: loadProposal.abstract,
        siteName: loadProposal.site.name,
        siteLatitudeDeg: loadProposal.site.latitudeDeg,
        siteLongitudeDeg: loadProposal.site.longitudeDeg,
        siteElevationM: loadProposal.site.elevationM,
        siteHorizonLimitDeg: loadProposal.site.horizonLimitDeg,
        ...loadProposal.instrument,
        createdBy: piId,
      })
      .returning();
    await tx.insert(proposalMembers).values(loadMembers.map((m, i) => ({ proposalId: proposal.id, userId: userIds[i], role: m.role })));

    // Each target goes through the API's own create schema, as an added one would.
    const rows = loadTargets().map(({ input, status }, i) => {
      const { ra, dec, ...data } = createTargetSchema.parse(input);
      const hypothesis = {
        ...data,
        lensMassSolar: data.lensMassSolar ?? null,
        velocityDispersionKmPerS: data.velocityDispersionKmPerS ?? null,
        lensDistancePc: data.lensDistancePc ?? null,
        sourceDistancePc: data.sourceDistancePc ?? null,
        lensRedshift: data.lensRedshift ?? null,
        sourceRedshift: data.sourceRedshift ?? null,
        properMotionMasPerYr: data.properMotionMasPerYr ?? null,
      };
      return { ...hypothesis, status, raDeg: ra, decDeg: dec, proposalId: proposal.id, createdBy: userIds[i % userIds.length] };
    });
    const targetIds: string[] = [];
    for (let start = 0; start < rows.length; start += insertChunkRows) {
      const inserted = await tx.insert(targets).values(rows.slice(start, start + insertChunkRows)).returning({ id: targets.id });
      targetIds.push(...inserted.map((t) => t.id));
    }
    // The derived columns by the same code as every stored target (one shared schedule computation).
    await rederiveTargets(tx, proposal);

    for (const [i, body] of loadNotes.entries()) {
      const [note] = await tx.insert(notes).values({ targetId: targetIds[i], body, authorId: piId, updatedBy: piId }).returning({ id: notes.id });
      await tx.insert(noteRevisions).values({ noteId: note.id, version: 1, body, editedBy: piId });
    }
    return { proposalId: proposal.id, targetIds, members: loadMembers.map(({ email, password, role }) => ({ email, password, role })) };
  });
  writeFileSync(outFile, `${JSON.stringify(seed satisfies LoadSeed)}\n`);
  console.log(`[seed] load scenario: 1 proposal, ${seed.targetIds.length} targets, ${seed.members.length} members, ${loadNotes.length} notes`);
} finally {
  await sql.end();
}
