import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { launchBrowser, newPage } from "./support/browser";
import { signInAsDemo } from "./support/demo";

let browser: Browser;

beforeAll(async () => {
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
});

const nightOf = (page: Page) => page.getByTestId("night-chart").getAttribute("data-night");

describe("sky windows of a proposal's targets", () => {
  it("a Co-I opens a demo target, sees its night and feasibility, changes the date, then opens the season view", async () => {
    const { page, consoleErrors } = await newPage(browser);
    await signInAsDemo(page, "coi");
    await page.getByRole("link", { name: "Bending starlight in the Cinder bulge window" }).click();
    await page.waitForURL(/\/proposals\/[0-9a-f-]{36}$/);
    const proposalUrl = page.url();
    // The demo cycle (seed set demo-sky-cycle-v1) is shown with the proposal.
    expect(await page.getByTestId("cycle-dates").textContent()).toContain("2031-02-01 – 2031-08-02");

    await page.getByRole("link", { name: "K-17 core" }).click();
    await page.waitForURL(/\/targets\/[0-9a-f-]{36}/);
    // The cycle lies ahead, so the first night shown is its first night.
    await page.getByTestId("night-chart").waitFor();
    expect(await nightOf(page)).toBe("2031-02-01");
    // Shadow ≈ 42 µas against λ/B = 1.3 mm / 10,700 km ≈ 25.1 µas (demo seed).
    expect(await page.getByTestId("science-case").textContent()).toContain("Horizon-scale imaging");
    expect(await page.getByTestId("case-answer-shadow").getAttribute("data-verdict")).toBe("feasible");
    expect(await page.getByTestId("case-answer-shadow").getByTestId("case-answer-sentence").textContent()).toMatch(/^The shadow is .* across, .*λ\/B = 25\.1 µas/);

    const firstHours = await page.getByTestId("hours-dark-above-limit").textContent();
    const firstTransit = await page.getByTestId("transit-time").textContent();
    await page.getByLabel("Night of (evening date)").fill("2031-06-15");
    await page.waitForFunction(() => document.querySelector("[data-testid=night-chart]")?.getAttribute("data-night") === "2031-06-15");
    // Mid-June the bulge transits near local midnight: the transit moves by hours and the dark hours grow.
    expect(await page.getByTestId("transit-time").textContent()).not.toBe(firstTransit);
    expect(await page.getByTestId("hours-dark-above-limit").textContent()).not.toBe(firstHours);
    expect(new URL(page.url()).searchParams.get("night")).toBe("2031-06-15");
    await page.getByRole("button", { name: "Next night" }).click();
    await page.waitForFunction(() => document.querySelector("[data-testid=night-chart]")?.getAttribute("data-night") === "2031-06-16");

    await page.goto(proposalUrl);
    await page.getByRole("link", { name: "Season view (sky windows)" }).click();
    await page.waitForURL(/\/sky$/);
    const table = page.getByTestId("season-table");
    await table.waitFor();
    // Every target of the proposal on one page (other browser tests may have added some), plus the header row.
    const proposalId = new URL(proposalUrl).pathname.split("/").pop();
    const listing = await page.request.get(`/api/proposals/${proposalId}/targets?pageSize=1`);
    const { total } = (await listing.json()) as { total: number };
    expect(total).toBeGreaterThanOrEqual(13);
    expect(await table.getByRole("row").count()).toBe(Math.min(total, 25) + 1);
    // The season view reads the proposal's simulated observing schedule, the one the verdicts count.
    expect(await page.getByTestId("season-conditions").textContent()).toMatch(/Moon.*clear-night fraction/);
    const k17 = table.getByRole("row", { name: /K-17 core/ });
    // Best weeks of the bulge from 31° S in a February–August cycle fall in the southern winter.
    expect(await k17.textContent()).toMatch(/2031-0[5-7]-\d\d – 2031-0[5-8]-\d\d/);
    // One season from mid-February (the bulge first clears airmass 2 before dawn) to the last night,
    // about 174 d in node with the seeded settings; visits at the 4 h cadence through it.
    expect(await k17.getByTestId("observing-seasons").textContent()).toMatch(/^2031-0[23]-\d\d – 2031-0[78]-\d\d \(1\d\d d\)$/);
    expect(Number(await k17.getByTestId("planned-visits").textContent())).toBeGreaterThan(100);
    expect(await page.getByTestId("never-observable").textContent()).toBe("none");
    // The list's headline week counts targets at their best; hours of different targets are never added.
    expect(await page.getByTestId("best-week-overall").textContent()).toMatch(/^2031-\d\d-\d\d – 2031-\d\d-\d\d \(\d+ of \d+ targets\)$/);
    expect(consoleErrors.filter((message) => !message.includes("Failed to load resource"))).toEqual([]);
  });
});
