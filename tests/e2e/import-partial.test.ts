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

const run = Date.now().toString(36);

describe("import page: refusals in words, units chosen per column, and the good rows imported without the refused ones", () => {
  it("a Co-I sees a no-name file refused in words, then imports the good rows of a mixed file and downloads the refused ones", async () => {
    const { page, consoleErrors } = await newPage(browser, { acceptDownloads: true });
    await signInAsDemo(page, "coi");
    await page.getByRole("link", { name: demoProposalTitle }).click();
    await page.waitForURL(/\/proposals\/[0-9a-f-]{36}$/);
    const proposalId = page.url().split("/").pop()!;
    await page.goto(`/proposals/${proposalId}/import`);
    const dropzone = page.getByTestId("list-dropzone").locator('input[type="file"]');

    // No name column: the preview's 400 is shown in words, never a blank page.
    await dropzone.setInputFiles({ name: `no-name-${run}.csv`, mimeType: "text/csv", buffer: Buffer.from("ra,dec\n10,-20\n") });
    const refusal = page.getByTestId("preview-refusal");
    await refusal.waitFor();
    expect(await refusal.textContent()).toContain("Choose the column that holds the Name");

    // Distances in kpc without a unit, a row past the pole, a magnitude beyond the one kept and a colour column.
    const csv = [
      "name,ra,dec,mass,D_L,D_S,mag,V_mag,colour",
      `PI-${run}-1,17:50:10.0,-30:10:00,0.5,4,8,18,19,red`,
      `PI-${run}-2,18:02:00,+95:00:00,0.5,4,8,18,19,=1+1`,
      `PI-${run}-3,17:52:20.0,-30:40:00,0.3,3,8,18,19,blue`,
    ].join("\n");
    await dropzone.setInputFiles({ name: `mixed-${run}.csv`, mimeType: "text/csv", buffer: Buffer.from(csv) });
    await page.getByTestId("uploaded-list").waitFor();
    expect(await page.getByTestId("uploaded-list").textContent()).toBe(`mixed-${run}.csv · CSV · 3 rows`);
    expect(await page.getByTestId("preview-refusal").count()).toBe(0);

    const mapping = page.getByRole("form", { name: "Column mapping" });
    expect(await page.getByTestId("unit-assumed-lensDistancePc").textContent()).toContain("assumed");
    // Choosing the unit reads the rows again at once.
    await mapping.getByLabel("Lens distance unit").selectOption("kpc");
    // 4 kpc against 8 pc: the re-read puts the source in front of the lens.
    await page.getByTestId("preview-row").first().filter({ hasText: "The source must lie behind the lens" }).waitFor();
    expect(await page.getByTestId("unit-assumed-lensDistancePc").count()).toBe(0);
    await mapping.getByLabel("Source distance unit").selectOption("kpc");
    await page.getByTestId("preview-row").first().filter({ hasText: "D_L 4000 pc · D_S 8000 pc" }).waitFor();

    const unmapped = await page.getByTestId("unmapped-columns").textContent();
    expect(unmapped).toContain("V_mag — a magnitude: a target keeps one source magnitude (with its band); not imported");
    expect(unmapped).toContain("colour — not imported");

    expect(await page.getByTestId("import-counts").textContent()).toBe("2 to add · 0 to update · 0 to skip · 1 with errors");
    const commit = page.getByRole("button", { name: "Import 2 targets without the 1 refused rows" });
    expect(await commit.isDisabled()).toBe(true);

    const [download] = await Promise.all([page.waitForEvent("download"), page.getByRole("button", { name: "Download the 1 refused rows with their reasons (CSV)" }).click()]);
    expect(download.suggestedFilename()).toBe(`mixed-${run} refused rows.csv`);
    const refusedCsv = await new Promise<string>((resolve, reject) => {
      void download.createReadStream().then((stream) => {
        const chunks: Buffer[] = [];
        stream.on("data", (chunk: Buffer) => chunks.push(chunk));
        stream.on("end", () => resolve(Buffer.concat(chunks).toString("utf8")));
        stream.on("error", reject);
      });
    });
    const [header, row] = refusedCsv.split("\r\n");
    expect(header).toBe("row in file,name,ra,dec,mass,D_L,D_S,mag,V_mag,colour,refused because");
    expect(row).toMatch(new RegExp(`^2,PI-${run}-2,18:02:00,"'\\+95:00:00",0\\.5,4,8,18,19,"'=1\\+1","row 2: Dec \\+95:00:00 — `));

    await page.getByLabel("Leave out the 1 refused rows and import the others").check();
    await commit.click();
    await page.getByTestId("import-result").waitFor();
    expect(await page.getByTestId("import-result").textContent()).toContain("Imported: 2 added, 0 updated, 0 skipped; 1 refused rows left out.");
    // The browser logs the refused preview's 400 itself; nothing else went wrong.
    expect(consoleErrors, consoleErrors.join("\n")).toEqual([expect.stringContaining("status of 400")]);
  });
});
