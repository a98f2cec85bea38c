import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoShadowProposal } from "@/db/seed/demo-scenario";
import { launchBrowser, newPage } from "./support/browser";
import { demoProposalTitle, signInAsDemo } from "./support/demo";

let browser: Browser;

beforeAll(async () => {
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
});

/** Opens a target of the proposal now shown and waits for its science case. */
async function openTarget(page: Page, proposalUrl: string, name: string) {
  await page.goto(proposalUrl);
  await page.getByRole("link", { name, exact: true }).click();
  await page.waitForURL(/\/targets\/[0-9a-f-]{36}/);
  await page.getByTestId("science-case").waitFor();
}

const sentenceOf = (page: Page, id: string) => page.getByTestId(`case-answer-${id}`).getByTestId("case-answer-sentence").textContent();

// The demo scenario (db/seed/demo-scenario.ts) from the invented southern site, cycle February–August
// 2031; the expected answers are worked in tests/unit/workspace/demo-science-cases.test.ts.
describe("the demo proposal answered by science case", () => {
  it("a Co-I reads each target's questions, answered from the nights the site offers", async () => {
    const { page, consoleErrors } = await newPage(browser);
    await signInAsDemo(page, "coi");
    await page.getByRole("link", { name: demoProposalTitle }).click();
    await page.waitForURL(/\/proposals\/[0-9a-f-]{36}$/);
    const proposalUrl = page.url();

    // A June bulge event: a photometric microlensing event, its peak in usable time; no question of
    // resolving its images or timing their delay is asked.
    await openTarget(page, proposalUrl, "Cinder Avocet");
    expect(await page.getByTestId("science-case").textContent()).toContain("Photometric microlensing event");
    expect(await sentenceOf(page, "peak-window")).toMatch(/falls in a usable window/);
    expect(await sentenceOf(page, "event-visits")).toMatch(/The schedule collects \d+ visits within t0 ± t_E/);
    expect(await page.getByTestId("case-answer-image-separation").count()).toBe(0);
    expect(await page.getByTestId("case-answer-delay-season").count()).toBe(0);

    // The same target opened in the lens bench: the bench grades it with the same code, from the same
    // inputs, site and cycle (its schedule computed in a worker), so every answer reads the same.
    // The depth question is the proposal's own (its camera); the bench, which has none, does not ask it.
    const onTarget = await page.getByTestId("case-answers").locator("li:not([data-testid='case-answer-depth'])").evaluateAll((items) =>
      items.map((item) => [item.getAttribute("data-testid"), item.getAttribute("data-verdict"), item.querySelector('[data-testid="case-answer-sentence"]')?.textContent]),
    );
    await page.getByRole("link", { name: "Open in the lens bench" }).click();
    await page.waitForURL(/\/bench\?/);
    expect(await page.getByTestId("bench-case").getAttribute("data-case")).toBe("photometric-microlensing");
    await page.waitForFunction(() => /^The schedule collects/.test(document.querySelector('[data-testid="case-answer-event-visits"] [data-testid="case-answer-sentence"]')?.textContent ?? ""), undefined, { timeout: 30_000 });
    const onBench = await page.getByTestId("case-answers").locator("li").evaluateAll((items) =>
      items.map((item) => [item.getAttribute("data-testid"), item.getAttribute("data-verdict"), item.querySelector('[data-testid="case-answer-sentence"]')?.textContent]),
    );
    expect(onBench).toEqual(onTarget);

    // Its peak in early February, before the bulge clears the morning twilight: the season gap.
    await openTarget(page, proposalUrl, "Cinder Godwit");
    expect(await sentenceOf(page, "peak-window")).toMatch(/season gap/);

    // A galaxy lens whose delay (about nine months) is longer than its observing season.
    await openTarget(page, proposalUrl, "Quillfeather Lens");
    expect(await page.getByTestId("science-case").textContent()).toContain("Time-delay monitoring");
    expect(await page.getByTestId("case-answer-delay-season").getAttribute("data-verdict")).toBe("infeasible");
    expect(await sentenceOf(page, "delay-season")).toMatch(/longer than the target's longest observing season/);

    // The technical summary states each target's case and its verdicts as sentences.
    await page.goto(`${proposalUrl}/summary`);
    const summary = await page.locator("article").textContent();
    expect(summary).toContain("Photometric microlensing event");
    expect(summary).toMatch(/longer than the target's longest observing season/);
    expect(summary).not.toMatch(/Resolution verdict/);
    expect(consoleErrors).toEqual([]);
  });

  it("the shadow request grades each nucleus against λ/B", async () => {
    const { page, consoleErrors } = await newPage(browser);
    await signInAsDemo(page, "pi");
    await page.getByRole("link", { name: demoShadowProposal.title }).click();
    await page.waitForURL(/\/proposals\/[0-9a-f-]{36}$/);
    const proposalUrl = page.url();
    await openTarget(page, proposalUrl, "K-17 core");
    expect(await page.getByTestId("case-answer-shadow").getAttribute("data-verdict")).toBe("feasible");
    // λ/B = 1.3 mm / 10,700 km ≈ 25.1 µas (demo seed).
    expect(await sentenceOf(page, "shadow")).toMatch(/25\.1 µas/);
    await openTarget(page, proposalUrl, "Wick-4 core");
    expect(await page.getByTestId("case-answer-shadow").getAttribute("data-verdict")).toBe("infeasible");
    expect(consoleErrors).toEqual([]);
  });
});
