import { and, eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { dbClient } from "@/db/client";
import { proposalMembers } from "@/db/schema";
import { changeMemberRole, removeMember } from "@/lib/server/members";
import { createWorld } from "./support/world";

afterAll(async () => {
  await dbClient().sql.end();
});

/** A proposal with two PIs (the world's PI and its Co-I promoted), as the two racing callers. */
async function twoPis() {
  const world = await createWorld();
  const [first, second] = [world.actors.pi, world.actors.coi];
  await changeMemberRole({ proposalId: world.proposalId, userId: second.userId }, { role: "pi" }, first);
  return { proposalId: world.proposalId, first, second };
}

async function pisOf(proposalId: string): Promise<number> {
  const rows = await dbClient().db.select().from(proposalMembers).where(and(eq(proposalMembers.proposalId, proposalId), eq(proposalMembers.role, "pi")));
  return rows.length;
}

// Without the lock both transactions counted two PIs in their own snapshot and both demoted: none left.
describe("two PIs acting on each other at the same moment leave one PI", () => {
  it("demoting each other: one wins, the other is no longer PI and is refused (403)", async () => {
    for (let round = 0; round < 8; round++) {
      const { proposalId, first, second } = await twoPis();
      const outcomes = await Promise.allSettled([
        changeMemberRole({ proposalId, userId: second.userId }, { role: "coi" }, first),
        changeMemberRole({ proposalId, userId: first.userId }, { role: "coi" }, second),
      ]);
      expect(await pisOf(proposalId), `round ${round}`).toBe(1);
      expect(outcomes.filter((o) => o.status === "fulfilled")).toHaveLength(1);
      const refused = outcomes.find((o) => o.status === "rejected") as PromiseRejectedResult;
      expect(refused.reason).toMatchObject({ code: "forbidden:member" });
    }
  });

  it("removing each other: one wins, the other is refused", async () => {
    for (let round = 0; round < 8; round++) {
      const { proposalId, first, second } = await twoPis();
      const outcomes = await Promise.allSettled([removeMember({ proposalId, userId: second.userId }, first), removeMember({ proposalId, userId: first.userId }, second)]);
      expect(await pisOf(proposalId), `round ${round}`).toBe(1);
      expect(outcomes.filter((o) => o.status === "fulfilled")).toHaveLength(1);
    }
  });
});
