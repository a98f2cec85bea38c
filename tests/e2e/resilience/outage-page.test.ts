import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoProposal } from "@/db/seed/demo-scenario";
import { launchBrowser, newPage } from "../support/browser";
import { signInAsDemo } from "../support/demo";
import { startCluster, startInstance, type AppInstance, type TestCluster } from "./support/instances";

// A page asked for while PostgreSQL is away: the API answers 503 then (faults.test.ts); a page can
// only answer with its error page, which must say in words what happened and recover by itself.

let cluster: TestCluster | undefined;
let app: AppInstance | undefined;
let browser: Browser | undefined;

beforeAll(async () => {
  cluster = await startCluster();
  const databaseUrl = await cluster.prepareDatabase("arcwright_outage_page", { seedDemo: true });
  app = await startInstance({ databaseUrl, logDir: cluster.root, name: "outage-page" });
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await app?.stop();
  cluster?.destroy();
});

describe("a page during a database outage", () => {
  it("says the page could not be loaded and that saved work is kept, then shows the page on 'Try again' once the database is back", async () => {
    const { page } = await newPage(browser!, { baseURL: app!.url });
    await signInAsDemo(page, "coi");
    const proposalLink = page.getByRole("link", { name: demoProposal.title });
    const proposalPath = await proposalLink.getAttribute("href");
    expect(proposalPath).toMatch(/^\/proposals\//);

    await cluster!.stopServer();
    const response = await page.goto(proposalPath!);
    expect(response?.status()).toBe(500);
    const alert = page.getByRole("alert").filter({ has: page.getByRole("heading", { name: "This page could not be loaded" }) });
    await alert.waitFor();
    await expect(alert.textContent()).resolves.toContain("what was already saved is kept");
    // The digest matches the server log's line for the error, for whoever looks into it.
    await expect(page.getByTestId("error-reference").textContent()).resolves.toMatch(/\S/);

    await cluster!.startServer();
    await page.getByRole("button", { name: "Try again" }).click();
    await page.getByRole("heading", { name: demoProposal.title }).waitFor({ timeout: 15_000 });
    await expect(page.getByRole("heading", { name: "This page could not be loaded" }).count()).resolves.toBe(0);
  });
});
