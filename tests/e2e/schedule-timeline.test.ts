import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { launchBrowser, newPage } from "./support/browser";
import { demoProposalTitle, signInAsDemo } from "./support/demo";

let browser: Browser;

beforeAll(async () => {
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
});

describe("a target's simulated observing schedule", () => {
  it("shows the June bulge event's light curve with the cycle's visits and named gaps, and the night's planned visits", async () => {
    const { page, consoleErrors } = await newPage(browser);
    await signInAsDemo(page, "coi");
    await page.getByRole("link", { name: demoProposalTitle }).click();
    await page.waitForURL(/\/proposals\/[0-9a-f-]{36}$/);
    await page.getByRole("link", { name: "Cinder Avocet" }).click();
    await page.waitForURL(/\/targets\/[0-9a-f-]{36}/);

    const timeline = page.getByTestId("schedule-timeline");
    // The demo cycle (2031-02-01 to 2031-08-02, 183 nights) with a season opening in February.
    const chart = timeline.getByRole("img", { name: /visits planned over 183 nights \(2031-02-01 to 2031-08-02\); observing season: 2031-02/ });
    await chart.waitFor();
    expect(await timeline.textContent()).toContain("the light curve A(t)");
    // The proposal's default 30° Moon separation removes a few nights around each full Moon.
    expect(await timeline.getByTestId("schedule-gap-moon").first().textContent()).toMatch(/Moon$/);

    // Mid-June the bulge is up all night at the site: the night view lists that night's visits.
    await page.goto(`${page.url().split("?")[0]}?night=2031-06-10`);
    const planned = page.getByTestId("night-planned-visits");
    await planned.waitFor();
    expect(await planned.textContent()).toMatch(/^\d+ visits planned this night: \d\d:\d\d(, \d\d:\d\d)+ \(UTC\)\.$/);
    expect(consoleErrors.filter((message) => !message.includes("Failed to load resource"))).toEqual([]);
  });
});
