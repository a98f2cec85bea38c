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

describe("the photon budget's plots on a target page (issue #17)", () => {
  it("draws the S/N per visit under the light curve, and the night's sky brightness in the target's band, which follows the night chosen", async () => {
    const { page, consoleErrors } = await newPage(browser);
    await signInAsDemo(page, "coi");
    await page.getByRole("link", { name: demoProposalTitle }).click();
    await page.waitForURL(/\/proposals\/[0-9a-f-]{36}$/);
    // The faint dwarf in a bright blend: every visit falls short of S/N 50 (demo-photon-budget.test.ts).
    await page.getByRole("link", { name: "Cinder Bunting" }).click();
    await page.waitForURL(/\/targets\/[0-9a-f-]{36}/);

    const timeline = page.getByTestId("schedule-timeline");
    await timeline.getByTestId("schedule-snr-track").waitFor();
    expect(await timeline.getByTestId("schedule-snr-goal").textContent()).toBe("S/N goal 50");
    expect(await timeline.getByTestId("schedule-snr-note").textContent()).toMatch(/short of it \(drawn as triangles\)/);
    expect(await timeline.getByRole("list", { name: "Legend" }).textContent()).toContain("visit S/N, below the goal");

    await page.goto(`${page.url().split("?")[0]}?night=2031-06-10`);
    const sky = page.getByTestId("night-sky-brightness");
    await sky.waitFor();
    expect(await sky.getAttribute("data-night")).toBe("2031-06-10");
    expect(await sky.getAttribute("aria-label")).toMatch(/^Sky at Cinder Bunting from .+ in Ks \(2MASS\), night of 2031-06-10: from [\d.]+ to [\d.]+ mag\/arcsec²/);
    await page.getByRole("button", { name: "Download the sky brightness figure as SVG" }).waitFor();
    expect(consoleErrors.filter((message) => !message.includes("Failed to load resource"))).toEqual([]);
  });
});
