import { readdir, readFile } from "node:fs/promises";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoAccounts, demoProposal, type DemoAccount } from "@/db/seed/demo-scenario";
import { signInLimits } from "@/lib/server/accounts";
import { startCluster, startInstance, type AppInstance, type TestCluster } from "./support/instances";
import { attemptSignIn, call, callOk, proposalIdByTitle, signIn } from "./support/members";

// Two app processes on different ports over one database, as behind a load balancer: nothing a
// member does may depend on which process answers (no per-process sessions, counters or tokens).

let cluster: TestCluster | undefined;
let a: AppInstance | undefined;
let b: AppInstance | undefined;
let proposalId = "";

const account = (key: DemoAccount["key"]) => demoAccounts.find((demo) => demo.key === key)!;

beforeAll(async () => {
  cluster = await startCluster();
  const databaseUrl = await cluster.prepareDatabase("arcwright_two", { seedDemo: true });
  [a, b] = await Promise.all([
    startInstance({ databaseUrl, logDir: cluster.root, name: "instance-a" }),
    startInstance({ databaseUrl, logDir: cluster.root, name: "instance-b" }),
  ]);
  const pi = account("pi");
  proposalId = await proposalIdByTitle(a.url, await signIn(a.url, pi), demoProposal.title);
});

afterAll(async () => {
  await Promise.all([a?.stop(), b?.stop()]);
  cluster?.destroy();
});

/** The invitation mail to `email` that the SMTP fake received after `since`, read from its folder. */
async function invitationMailTo(email: string, since: number): Promise<{ text: string }> {
  const dir = process.env.ARCWRIGHT_MAILBOX_DIR;
  if (!dir) throw new Error("ARCWRIGHT_MAILBOX_DIR is not set: run through npm test, which starts the mail fake");
  const deadline = Date.now() + 5_000;
  while (Date.now() < deadline) {
    for (const name of (await readdir(dir)).filter((n) => n.endsWith(".json")).reverse()) {
      const message = JSON.parse(await readFile(join(dir, name), "utf8")) as { to: string[]; subject: string; text: string; receivedAt: string };
      if (Date.parse(message.receivedAt) >= since && message.to.includes(email) && message.subject.includes("invites you")) return message;
    }
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`no invitation mail to ${email} within 5 s`);
}

describe("two app instances over one database behave as one", () => {
  it("a session cookie from instance A signs the member in on instance B", async () => {
    const coi = account("coi");
    const cookie = await signIn(a!.url, coi);
    const session = await callOk<{ user?: { email?: string } }>(b!.url, cookie, "/api/auth/session");
    expect(session.user?.email).toBe(coi.email);
    // Not only the cookie's signature: B loads the member's proposals with it.
    expect(await proposalIdByTitle(b!.url, cookie, demoProposal.title)).toBe(proposalId);
  });

  it("wrong passwords on A and on B count against one sign-in limit per account", async () => {
    const viewer = account("viewer");
    const errors: (string | null)[] = [];
    // Alternate instances: the limit is reached together only if both count in the same place.
    for (let attempt = 0; attempt < signInLimits.perAccount; attempt += 1) {
      const instance = attempt % 2 === 0 ? a! : b!;
      errors.push((await attemptSignIn(instance.url, { email: viewer.email, password: "not-the-password-at-all" })).error);
    }
    expect(errors).toEqual(Array(signInLimits.perAccount).fill("CredentialsSignin"));
    const overA = await attemptSignIn(a!.url, { email: viewer.email, password: "not-the-password-at-all" });
    expect(overA.error).toBe("RateLimited");
    // Past the limit even the right password is refused, on the other instance too.
    const overB = await attemptSignIn(b!.url, viewer);
    expect(overB.cookie).toBeNull();
    expect(overB.error).toBe("RateLimited");
  });

  it("an invitation sent from A is accepted on B", async () => {
    const pi = account("pi");
    const invitee = account("admin");
    const piCookie = await signIn(a!.url, pi);
    const sentAt = Date.now() - 1_000;
    await callOk(a!.url, piCookie, `/api/proposals/${proposalId}/invitations`, { method: "POST", body: { email: invitee.email, role: "viewer" }, status: 201 });
    const mail = await invitationMailTo(invitee.email, sentAt);
    const link = new URL(/https?:\/\/\S+\/proposals\/invitations\/[\w-]+/.exec(mail.text)![0]);
    expect(link.origin).toBe(a!.url);
    const token = link.pathname.split("/").pop()!;

    const inviteeCookie = await signIn(b!.url, invitee);
    const accepted = await callOk<{ proposalId: string; role: string }>(b!.url, inviteeCookie, "/api/invitations/accept", { method: "POST", body: { token } });
    expect(accepted).toMatchObject({ proposalId, role: "viewer" });
    const { members } = await callOk<{ members: { email: string; role: string }[] }>(a!.url, piCookie, `/api/proposals/${proposalId}/members`);
    expect(members.find((m) => m.email === invitee.email)?.role).toBe("viewer");
    // The link is spent for both instances.
    const again = await call(a!.url, inviteeCookie, "/api/invitations/accept", { method: "POST", body: { token } });
    expect(again.status).toBe(400);
  });

  it("a note written on A is read on B, and a stale edit on B gets 409 after an edit on A", async () => {
    const coi = account("coi");
    const pi = account("pi");
    const coiOnA = await signIn(a!.url, coi);
    const piOnB = await signIn(b!.url, pi);
    const { rows } = await callOk<{ rows: { id: string }[] }>(a!.url, coiOnA, `/api/proposals/${proposalId}/targets?pageSize=1`);
    const notesPath = `/api/proposals/${proposalId}/targets/${rows[0].id}/notes`;
    const body = `Seeing log from instance A ${Date.now().toString(36)}`;
    const { note } = await callOk<{ note: { id: string; version: number } }>(a!.url, coiOnA, notesPath, { method: "POST", body: { body }, status: 201 });

    const { notes } = await callOk<{ notes: { id: string; body: string; version: number }[] }>(b!.url, piOnB, notesPath);
    expect(notes.find((n) => n.id === note.id)).toMatchObject({ body, version: 1 });

    await callOk(a!.url, coiOnA, `${notesPath}/${note.id}`, { method: "PATCH", body: { body: `${body}, edited on A`, version: 1 } });
    const stale = await call(b!.url, piOnB, `${notesPath}/${note.id}`, { method: "PATCH", body: { body: `${body}, edited on B`, version: 1 } });
    expect(stale.status).toBe(409);
    expect(((await stale.json()) as { error: { code: string } }).error.code).toBe("conflict:note");
  });
});
