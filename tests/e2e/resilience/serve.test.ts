import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoAccounts, demoProposal } from "@/db/seed/demo-scenario";
import { childPids } from "@/scripts/lib/proc.mjs";
import { startCluster, startInstance, tailOf, type AppInstance, type TestCluster } from "./support/instances";
import { proposalIdByTitle, signIn } from "./support/members";

// scripts/serve.mjs, the launcher `npm start` serves the app with: several `next start` processes
// on one port. What it promises: every process serves, a process that dies is replaced while the
// others keep answering, and no process outlives the launcher, whether it is stopped or killed.

let cluster: TestCluster | undefined;
let databaseUrl = "";
const launched: AppInstance[] = [];

beforeAll(async () => {
  cluster = await startCluster();
  databaseUrl = await cluster.prepareDatabase("arcwright_serve", { seedDemo: true });
});

afterAll(async () => {
  await Promise.all(launched.map((instance) => instance.stop()));
  cluster?.destroy();
});

async function launch(name: string): Promise<AppInstance> {
  const instance = await startInstance({ databaseUrl, logDir: cluster!.root, name, webProcesses: 2 });
  launched.push(instance);
  return instance;
}

const isAlive = (pid: number) => {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
};

async function waitFor(what: string, condition: () => boolean | Promise<boolean>, timeoutMs = 30_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (await condition()) return;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  throw new Error(`timed out waiting for ${what}`);
}

/** `count` requests on fresh connections (the launcher deals connections out, not requests). */
async function healthStatuses(url: string, count: number): Promise<number[]> {
  const statuses: number[] = [];
  for (let i = 0; i < count; i++) {
    const response = await fetch(`${url}/api/health`, { headers: { Connection: "close" }, signal: AbortSignal.timeout(10_000) });
    statuses.push(response.status);
  }
  return statuses;
}

describe("the multi-process launcher (scripts/serve.mjs)", () => {
  it("serves one app from two processes: a member signed in through one is known to both", async () => {
    const app = await launch("serve-shared");
    const launcherPid = app.process.pid!;
    await waitFor("two next start processes", () => childPids(launcherPid).length === 2);
    const pi = demoAccounts.find((account) => account.key === "pi")!;
    const cookie = await signIn(app.url, pi);
    // Twenty fresh connections are dealt round-robin over both processes; every one knows the session.
    const ids = await Promise.all(Array.from({ length: 20 }, () => proposalIdByTitle(app.url, cookie, demoProposal.title)));
    expect(new Set(ids).size).toBe(1);
  });

  it("replaces a process that dies while the other keeps answering", async () => {
    const app = await launch("serve-replace");
    const launcherPid = app.process.pid!;
    await waitFor("two next start processes", () => childPids(launcherPid).length === 2);
    const [victim, survivor] = childPids(launcherPid);
    process.kill(victim, "SIGKILL");
    await waitFor(`process ${victim} to be gone`, () => !isAlive(victim));
    // Give the launcher a moment to hear of the exit, so no new connection is dealt to the dead process.
    await new Promise((resolve) => setTimeout(resolve, 300));
    expect(await healthStatuses(app.url, 10)).toEqual(Array(10).fill(200));
    await waitFor("a replacement process", () => childPids(launcherPid).length === 2);
    const replacement = childPids(launcherPid).find((pid) => pid !== survivor)!;
    expect(replacement).not.toBe(victim);
    await waitFor("the replacement to serve", async () => (await healthStatuses(app.url, 4)).every((status) => status === 200));
    expect(tailOf(app.logFile)).toContain("exited (SIGKILL); starting another");
    expect(app.hasExited).toBe(false);
  });

  it("stops every process on SIGTERM and exits 0", async () => {
    const app = await launch("serve-stop");
    const launcherPid = app.process.pid!;
    await waitFor("two next start processes", () => childPids(launcherPid).length === 2);
    const processes = childPids(launcherPid);
    const exit = new Promise<number | null>((resolve) => app.process.once("exit", (code) => resolve(code)));
    app.process.kill("SIGTERM");
    expect(await exit).toBe(0);
    await waitFor("every next start process to exit", () => processes.every((pid) => !isAlive(pid)), 10_000);
  });

  it("leaves no process behind when the launcher itself is killed", async () => {
    const app = await launch("serve-killed");
    const launcherPid = app.process.pid!;
    await waitFor("two next start processes", () => childPids(launcherPid).length === 2);
    const processes = childPids(launcherPid);
    await app.kill();
    // An orphaned cluster worker exits on losing its channel to the launcher (node:cluster).
    await waitFor("every next start process to exit", () => processes.every((pid) => !isAlive(pid)), 10_000);
  });
});
