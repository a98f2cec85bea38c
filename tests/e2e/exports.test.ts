import { readFile } from "node:fs/promises";
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

describe("exports in the browser", () => {
  it("the demo PI downloads a bench figure as PNG and the target table as VOTable from the summary page", async () => {
    const { page } = await newPage(browser);
    await signInAsDemo(page, "pi");

    await page.goto("/bench?mass=0.8%20Msun");
    const [figure] = await Promise.all([page.waitForEvent("download"), page.getByRole("button", { name: "Download the deflection plot as PNG" }).click()]);
    expect(figure.suggestedFilename()).toBe("bench-deflection.png");
    const png = await readFile((await figure.path())!);
    // PNG signature (PNG 3rd ed. §5.2), then IHDR width 2000 px (the default).
    expect([...png.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
    expect(png.readUInt32BE(16)).toBe(2000);
    expect(png.toString("latin1")).toContain("0.8 Msun");

    await page.goto("/proposals");
    await page.getByRole("link", { name: demoProposalTitle }).click();
    await page.getByTestId("my-role").waitFor();
    const proposalPath = new URL(page.url()).pathname;
    await page.getByRole("link", { name: "Technical summary and exports" }).click();
    await page.waitForURL(`**${proposalPath}/summary`);
    await page.getByTestId("summary-table").waitFor();
    await page.getByLabel("Table format").selectOption("votable");
    const [table] = await Promise.all([page.waitForEvent("download"), page.getByRole("button", { name: "Download target table" }).click()]);
    expect(table.suggestedFilename()).toMatch(/-targets\.vot$/);
    const xml = await readFile((await table.path())!, "utf8");
    expect(xml).toContain('<VOTABLE version="1.4"');
    expect(xml).toContain('unit="mas" ucd="phys.angSize"');
    // The provenance's link back to the proposal, as an INFO of the RESOURCE.
    expect(xml).toMatch(new RegExp(`<INFO name="reproduceUrl" value="[^"]*${proposalPath}"`));

    // The summary PDF with a chosen target's night chart besides the season chart (ISO 32000-1 §7.5.2: "%PDF-").
    await page.getByLabel("Targets for night charts").selectOption({ label: "K-17 core" });
    const [summaryPdf] = await Promise.all([page.waitForEvent("download"), page.getByRole("button", { name: "Download the technical summary (PDF)" }).click()]);
    expect(summaryPdf.suggestedFilename()).toMatch(/\.pdf$/);
    const pdf = await readFile((await summaryPdf.path())!);
    expect(pdf.subarray(0, 5).toString("latin1")).toBe("%PDF-");
    expect(pdf.length).toBeGreaterThan(50_000);
  });
});
