import type { Browser, Page } from "playwright-core";
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

const run = Date.now().toString(36);
// A valid 1×1 PNG (one opaque pixel), so the browser can decode and lay it out.
const onePixelPng = Buffer.from("iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==", "base64");

async function openProposal(page: Page): Promise<string> {
  await page.getByRole("link", { name: demoProposalTitle }).click();
  await page.waitForURL(/\/proposals\/[0-9a-f-]{36}$/);
  return page.url().split("/").pop()!;
}

let proposalId = "";

describe("uploads in the browser through the upload service fake", () => {
  it("a Co-I imports a CSV through the dropzone, maps a unit, previews, commits and sees the computed columns", async () => {
    const { page, consoleErrors } = await newPage(browser);
    await signInAsDemo(page, "coi");
    proposalId = await openProposal(page);
    await page.getByRole("link", { name: "Import a target list (CSV or VOTable)" }).click();
    await page.waitForURL(`**/proposals/${proposalId}/import`);

    // D_L and D_S are in kpc without saying so: the mapping step assumes pc until the unit is changed.
    const csv = [`name,ra,dec,mass,D_L,D_S`, `UP-${run}-1,17:56:40.0,-29:30:00,0.5,4,8`, `UP-${run}-2,17:58:01.0,-29:20:00,0.3,3,8`].join("\n");
    await page.getByTestId("list-dropzone").locator('input[type="file"]').setInputFiles({ name: `list-${run}.csv`, mimeType: "text/csv", buffer: Buffer.from(csv) });
    await page.getByTestId("uploaded-list").waitFor();
    expect(await page.getByTestId("uploaded-list").textContent()).toBe(`list-${run}.csv · CSV · 2 rows`);
    expect(await page.getByTestId("preview-row").count()).toBe(2);
    expect(await page.getByTestId("preview-row").first().textContent()).toContain("D_L 4 pc");

    const mapping = page.getByRole("form", { name: "Column mapping" });
    // The file states no units: the page says which units are assumed, until the user sets them.
    expect(await page.getByTestId("unit-assumed-lensDistancePc").textContent()).toBe("assumed: the file gives no unit for this column; check it");
    await mapping.getByLabel("Lens distance unit").selectOption("kpc");
    expect(await page.getByTestId("unit-assumed-lensDistancePc").count()).toBe(0);
    await mapping.getByLabel("Source distance unit").selectOption("kpc");
    await mapping.getByRole("button", { name: "Read the rows again" }).click();
    await page.getByTestId("preview-row").first().filter({ hasText: "D_L 4000 pc" }).waitFor();
    expect(await page.getByTestId("import-counts").textContent()).toBe("2 to add · 0 to update · 0 to skip · 0 with errors");

    await page.getByRole("button", { name: "Import 2 targets" }).click();
    await page.getByTestId("import-result").waitFor();
    expect(await page.getByTestId("import-result").textContent()).toContain("Imported: 2 added, 0 updated, 0 skipped.");

    await page.getByRole("link", { name: "Back to the proposal" }).click();
    await page.waitForURL(/\/proposals\/[0-9a-f-]{36}$/);
    await page.getByRole("search", { name: "Filter targets" }).getByLabel("Name contains").fill(`UP-${run}-1`);
    // θ_E for 0.5 M☉ at 4 kpc, source at 8 kpc = 0.7134 mas (derivation in tests/e2e/workspace.test.ts).
    const radius = page.getByTestId("target-row").filter({ hasText: `UP-${run}-1` }).locator('[data-column="einsteinRadiusMas"]');
    await radius.waitFor();
    expect(await radius.textContent()).toBe("0.7134");
    expect(consoleErrors, consoleErrors.join("\n")).toEqual([]);
  });

  it("says why a list with no RA or Dec column cannot be read, instead of leaving the page blank", async () => {
    const { page } = await newPage(browser);
    await signInAsDemo(page, "coi");
    const id = await openProposal(page);
    await page.goto(`/proposals/${id}/import`);
    const csv = [`name,mass`, `NORA-${run},0.5`].join("\n");
    await page.getByTestId("list-dropzone").locator('input[type="file"]').setInputFiles({ name: `no-ra-${run}.csv`, mimeType: "text/csv", buffer: Buffer.from(csv) });
    const refusal = page.getByRole("alert").filter({ hasText: "Choose the column that holds the RA" });
    await refusal.waitFor();
    expect(await page.getByTestId("uploaded-list").count()).toBe(0);
  });

  it("a Co-I writes a note with math, sees it typeset, attaches a PNG and sees it previewed", async () => {
    const { page, consoleErrors } = await newPage(browser);
    await signInAsDemo(page, "coi");
    await openProposal(page);
    await page.getByRole("link", { name: "K-17 core" }).click();
    await page.waitForURL(/\/targets\/[0-9a-f-]{36}/);
    const noteText = `Finding chart ${run}`;
    const add = page.getByRole("form", { name: "Add a note" });
    await add.getByLabel("New note (Markdown)").fill(`${noteText}\n\nEinstein radius $\\theta_E = \\sqrt{4GM/c^2 \\cdot D}$\n\n$$\nA = \\frac{u^2+2}{u\\sqrt{u^2+4}}\n$$`);
    await add.getByRole("button", { name: "Add note" }).click();
    const note = page.getByTestId("note").filter({ hasText: noteText });
    await note.waitFor();

    // KaTeX typesets both formulas in the page, its fonts served by the app itself (font-src 'self').
    expect(await note.locator(".katex").count()).toBe(2);
    expect(await note.locator(".katex-display").count()).toBe(1);
    expect(await note.locator('annotation[encoding="application/x-tex"]').first().textContent()).toBe("\\theta_E = \\sqrt{4GM/c^2 \\cdot D}");
    const fontsLoaded = await page.evaluate(async () => {
      await document.fonts.ready;
      return [...document.fonts].filter((face) => face.family.replace(/"/g, "") === "KaTeX_Main" && face.status === "loaded").length;
    });
    expect(fontsLoaded).toBeGreaterThan(0);
    // No Content-Security-Policy report (a refused font or style) or any other error in the console.
    expect(consoleErrors, consoleErrors.join("\n")).toEqual([]);

    await note.getByTestId("note-attachments").locator('input[type="file"]').setInputFiles({ name: `chart-${run}.png`, mimeType: "image/png", buffer: onePixelPng });
    const image = note.getByRole("img", { name: `Attachment chart-${run}.png` });
    await image.waitFor();
    await page.waitForFunction((alt) => (document.querySelector(`img[alt="${alt}"]`) as HTMLImageElement | null)?.naturalWidth === 1, `Attachment chart-${run}.png`);
    expect(await note.getByTestId("attachment").getAttribute("data-kind")).toBe("png");
    // The picture comes from the app's access-checked route (same origin), never from the upload service.
    const source = (await image.getAttribute("src")) ?? "";
    expect(source).toMatch(/^\/api\/proposals\/[0-9a-f-]{36}\/targets\/[0-9a-f-]{36}\/notes\/[0-9a-f-]{36}\/attachments\/[0-9a-f-]{36}\/file$/);
    const served = await page.request.get(source);
    expect(served.headers()["content-type"]).toBe("image/png");
    expect(served.headers()["x-content-type-options"]).toBe("nosniff");
    expect(served.headers()["cache-control"]).toBe("private, no-store");
    expect(Buffer.from(await served.body()).equals(onePixelPng)).toBe(true);
  });

  it("the demo viewer sees no upload controls and the API answers 403", async () => {
    const { page } = await newPage(browser);
    await signInAsDemo(page, "viewer");
    const id = await openProposal(page);
    expect(await page.getByRole("link", { name: "Import a target list (CSV or VOTable)" }).count()).toBe(0);
    await page.goto(`/proposals/${id}/import`);
    await page.getByTestId("import-not-allowed").waitFor();
    expect(await page.getByTestId("list-dropzone").count()).toBe(0);

    const preview = await page.request.post(`/api/proposals/${id}/imports/preview`, { data: { fileId: "00000000-0000-4000-8000-000000000000" } });
    expect(preview.status()).toBe(403);
    expect(((await preview.json()) as { error: { code: string } }).error.code).toBe("forbidden:import");
    const presign = await page.request.post("/api/uploadthing?actionType=upload&slug=targetList", {
      data: { input: { proposalId: id }, files: [{ name: "x.csv", size: 10, type: "text/csv", lastModified: Date.now() }] },
    });
    expect(presign.status()).toBe(403);

    await page.goto(`/proposals/${id}`);
    await page.getByRole("link", { name: "K-17 core" }).click();
    await page.waitForURL(/\/targets\/[0-9a-f-]{36}/);
    await page.getByRole("heading", { name: "Observation notes" }).waitFor();
    expect(await page.getByText("Attach a PNG, JPEG, PDF or FITS file").count()).toBe(0);
  });
});
