import { afterAll, describe, expect, it, vi } from "vitest";

vi.mock("server-only", () => ({}));

import { dbClient } from "@/db/client";
import { listActivity } from "@/lib/server/activity";
import { getProposal } from "@/lib/server/proposals";
import { changeMemberRole, listMembers, removeMember } from "@/lib/server/members";
import { createWorld } from "./support/world";

afterAll(async () => {
  await dbClient().sql.end();
});

describe("members", () => {
  it("never leaves a proposal without a PI", async () => {
    const world = await createWorld();
    const { proposalId } = world;
    const pi = world.actors.pi;
    await expect(changeMemberRole({ proposalId, userId: pi.userId }, { role: "coi" }, pi)).rejects.toMatchObject({ code: "conflict:member" });
    await expect(removeMember({ proposalId, userId: pi.userId }, pi)).rejects.toMatchObject({ code: "conflict:member" });

    // With a second PI the first may step down, and then has only a Co-I's rights.
    await changeMemberRole({ proposalId, userId: world.actors.coi.userId }, { role: "pi" }, pi);
    await changeMemberRole({ proposalId, userId: pi.userId }, { role: "coi" }, pi);
    await expect(getProposal({ proposalId }, pi)).resolves.toMatchObject({ role: "coi", permissions: { canManage: false } });
    const roles = Object.fromEntries((await listMembers({ proposalId }, pi)).map((m) => [m.name, m.role]));
    expect(roles).toEqual({ pi: "coi", coi: "pi", viewer: "viewer" });
  });

  it("a removed member can no longer see the proposal (404), and the feed says who removed whom", async () => {
    const world = await createWorld();
    const { proposalId } = world;
    await removeMember({ proposalId, userId: world.actors.viewer.userId }, world.actors.pi);
    await expect(getProposal({ proposalId }, world.actors.viewer)).rejects.toMatchObject({ code: "not_found:proposal" });
    const feed = await listActivity({ proposalId }, {}, world.actors.coi);
    expect(feed.entries[0]).toMatchObject({ action: "member.removed", subject: "viewer", actorName: "pi" });
  });
});
