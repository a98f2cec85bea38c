import { afterAll, describe, expect, it } from "vitest";
import { eq, ne } from "drizzle-orm";
import { dbClient } from "@/db/client";
import { users } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { changeSiteRole, listAccounts } from "@/lib/server/admin";
import { accountCollectionRoutes } from "@/lib/server/api/admin-routes";
import { getProposal } from "@/lib/server/proposals";
import { listTargets, updateTarget } from "@/lib/server/targets";
import { createUser, createWorld } from "./support/world";

afterAll(async () => {
  await dbClient().sql.end();
});

const codeOf = (promise: Promise<unknown>) => promise.then(() => "resolved", (e: unknown) => (e instanceof AppError ? e.code : String(e)));

describe("site admin: accounts", () => {
  it("lists accounts with their site role and proposals, in bounded pages, never a password hash", async () => {
    const world = await createWorld();
    const admin = await createUser("auditor", "admin");
    const page = await listAccounts({ q: world.actors.coi.email, pageSize: "10" }, admin);
    expect(page.total).toBe(1);
    const [coi] = page.accounts;
    expect(coi).toMatchObject({ userId: world.actors.coi.userId, siteRole: "member" });
    expect(coi.proposals).toEqual([{ proposalId: world.proposalId, title: "Arcs over the Tessellate bulge field", cycle: "2031A", role: "coi" }]);
    expect(JSON.stringify(page)).not.toContain("passwordHash");

    const tooMany = await accountCollectionRoutes(async () => admin).GET(new Request("http://arcwright.test/api/admin/accounts?pageSize=500"), { params: Promise.resolve({}) });
    expect(tooMany.status).toBe(400);
    expect(((await tooMany.json()) as { error: { fields: Record<string, string[]> } }).error.fields.pageSize).toEqual(["The page size is at most 100 accounts."]);
    expect(await codeOf(listAccounts({}, world.actors.pi))).toBe("forbidden:admin");
    expect(await codeOf(listAccounts({}, null))).toBe("unauthorized:session");
  });

  it("never demotes the last site admin, and a demoted admin loses the admin area at once", async () => {
    const first = await createUser("first-admin", "admin");
    // Other test files leave admins behind; this case needs to be the only one.
    await dbClient().db.update(users).set({ siteRole: "member" }).where(ne(users.id, first.userId));
    expect(await codeOf(changeSiteRole({ userId: first.userId }, { siteRole: "member" }, first))).toBe("conflict:admin");

    const second = await createUser("second", "member");
    expect((await changeSiteRole({ userId: second.userId }, { siteRole: "admin" }, first)).siteRole).toBe("admin");
    // Two admins demoting each other at the same moment: the row lock lets one through, never both.
    const results = await Promise.all([
      codeOf(changeSiteRole({ userId: second.userId }, { siteRole: "member" }, first)),
      codeOf(changeSiteRole({ userId: first.userId }, { siteRole: "member" }, { ...second, siteRole: "admin" })),
    ]);
    expect(results.filter((r) => r === "resolved")).toHaveLength(1);
    const admins = await dbClient().db.select({ id: users.id }).from(users).where(eq(users.siteRole, "admin"));
    expect(admins).toHaveLength(1);

    const demoted = admins[0].id === first.userId ? second : first;
    // The caller's stale actor still says admin; the server checks the stored role inside the lock.
    expect(await codeOf(changeSiteRole({ userId: demoted.userId }, { siteRole: "admin" }, { ...demoted, siteRole: "admin" }))).toBe("forbidden:admin");
    expect(await codeOf(changeSiteRole({ userId: "not-a-uuid" }, { siteRole: "admin" }, first))).toBe("not_found:account");
    expect(await codeOf(changeSiteRole({ userId: first.userId }, { siteRole: "owner" }, first))).toBe("bad_request:account");
  });
});

describe("site admin: auditing proposals", () => {
  it("reads a proposal it is not on with a viewer's rights and cannot change it", async () => {
    const world = await createWorld();
    const admin = await createUser("auditor", "admin");
    const proposal = await getProposal({ proposalId: world.proposalId }, admin);
    expect(proposal.role).toBe("viewer");
    // The page says so rather than calling the admin a viewer of the team (a regression: it did).
    expect(proposal.isAudit).toBe(true);
    expect((await getProposal({ proposalId: world.proposalId }, world.actors.viewer)).isAudit).toBe(false);
    expect(proposal.permissions).toEqual({ canEdit: false, canManage: false, canDelete: false });
    expect((await listTargets({ proposalId: world.proposalId }, {}, admin)).total).toBe(1);
    const refused = await updateTarget({ proposalId: world.proposalId, targetId: world.targetId }, { priority: 1 }, admin).catch((e: AppError) => e);
    expect(refused).toBeInstanceOf(AppError);
    expect((refused as AppError).code).toBe("forbidden:target");
    expect((refused as AppError).message).toContain("as an auditor");
    // A member with a site role of member still gets 404 for a proposal they are not on.
    expect(await codeOf(getProposal({ proposalId: world.proposalId }, world.actors.outsider))).toBe("not_found:proposal");
  });
});
