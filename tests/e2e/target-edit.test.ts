import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { baseUrl, launchBrowser, newPage } from "./support/browser";
import { demoProposalTitle, signInAsDemo } from "./support/demo";

let browser: Browser;

beforeAll(async () => {
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
});

const run = Date.now().toString(36);

/** Holds every target POST back for a moment, so the optimistic row can be seen before the answer. */
async function delayTargetPosts(page: Page, delayMs: number) {
  await page.route("**/api/proposals/*/targets", async (route) => {
    if (route.request().method() === "POST") await new Promise((resolve) => setTimeout(resolve, delayMs));
    await route.continue();
  });
}

describe("editing and deleting targets and proposals in the browser", () => {
  it("a Co-I adds a target optimistically, sees a refused one rolled back, edits and deletes a target", async () => {
    const { page, context, consoleErrors } = await newPage(browser);
    await signInAsDemo(page, "coi");
    await page.getByRole("link", { name: demoProposalTitle }).click();
    await page.getByTestId("my-role").waitFor();
    // Deleting a proposal is the PI's alone.
    expect(await page.getByRole("button", { name: "Delete proposal" }).count()).toBe(0);

    await delayTargetPosts(page, 1200);
    const add = page.getByRole("form", { name: "Add a target" });
    const name = `EDIT-${run}`;
    await add.getByLabel("Target name").fill(name);
    await add.getByLabel("Right ascension").fill("17 59 02.3");
    await add.getByLabel("Declination").fill("-29 33 10");
    await add.getByLabel("Lens mass (M☉)").fill("0.5");
    await add.getByLabel("Lens distance (pc)").fill("4000");
    await add.getByLabel("Source distance (pc)").fill("8000");
    await add.getByRole("button", { name: "Add target" }).click();
    // The row is in the table before the server has answered, without computed columns yet.
    const pendingRow = page.getByTestId("target-row").filter({ hasText: `${name} (saving…)` });
    await pendingRow.waitFor({ timeout: 1000 });
    await expect(pendingRow.locator('[data-column="einsteinRadiusMas"]').textContent()).resolves.toBe("—");
    // Then the server's row replaces it: θ_E for 0.5 M☉ at 4 kpc, source at 8 kpc is 0.7134 mas
    // (sqrt(4 GM/c² · D_LS/(D_L D_S)) with IAU 2015 GM☉ and the IAU 2012 au; see workspace.test.ts).
    await page.getByTestId("added-target").waitFor();
    const savedRow = page.getByTestId("target-row").filter({ hasText: name, hasNotText: "saving…" });
    await expect.poll(() => savedRow.locator('[data-column="einsteinRadiusMas"]').textContent(), { timeout: 10_000 }).toBe("0.7134");
    expect(await page.getByTestId("target-row").filter({ hasText: "(saving…)" }).count()).toBe(0);

    // A declination past the pole: the row shows, then goes again when the server refuses it.
    const refused = `REFUSED-${run}`;
    await add.getByLabel("Target name").fill(refused);
    await add.getByLabel("Right ascension").fill("17 59 02.3");
    await add.getByLabel("Declination").fill("-95 00 00");
    await add.getByLabel("Lens mass (M☉)").fill("0.5");
    await add.getByLabel("Lens distance (pc)").fill("4000");
    await add.getByLabel("Source distance (pc)").fill("8000");
    await add.getByRole("button", { name: "Add target" }).click();
    await page.getByTestId("target-row").filter({ hasText: refused }).waitFor({ timeout: 1000 });
    await add.getByLabel("Declination").and(page.locator('[aria-invalid="true"]')).waitFor();
    await expect(add.getByRole("alert").first().textContent()).resolves.toContain("Declination must be in [-90, 90] degrees (got -95)");
    await page.getByTestId("target-row").filter({ hasText: refused }).waitFor({ state: "detached" });
    await page.unroute("**/api/proposals/*/targets");

    // Edit: a bad mass is named beside its field; a good one recomputes θ_E.
    await savedRow.getByRole("link", { name }).click();
    await page.getByTestId("computed-einstein-radius").waitFor();
    await expect(page.getByTestId("computed-einstein-radius").textContent()).resolves.toBe("0.7134 mas");
    await page.getByRole("button", { name: "Edit target" }).click();
    const edit = page.getByRole("form", { name: "Edit target" });
    await expect(edit.getByLabel("Lens mass (M☉)").inputValue()).resolves.toBe("0.5");
    await edit.getByLabel("Lens mass (M☉)").fill("-2");
    await edit.getByRole("button", { name: "Save changes" }).click();
    await edit.getByLabel("Lens mass (M☉)").and(page.locator('[aria-invalid="true"]')).waitFor();
    await expect(edit.getByRole("alert").first().textContent()).resolves.toBe("The lens mass is from 1 × 10⁻¹⁵ to 1 × 10¹⁶ solar masses (an asteroid to ten times the largest galaxy cluster).");

    await edit.getByLabel("Lens mass (M☉)").fill("2");
    await edit.getByLabel("Right ascension").fill("18 00 00");
    await edit.getByLabel("Tags").fill("bulge, edited");
    await edit.getByRole("button", { name: "Save changes" }).click();
    await page.getByTestId("target-saved").waitFor();
    // θ_E ∝ sqrt(M): four times the mass doubles it, 2 × 0.71344 = 1.4269 mas, shown to four digits.
    await page.getByTestId("computed-einstein-radius").getByText("1.427 mas").waitFor();
    const hypothesis = page.getByRole("region", { name: "Lens hypothesis" });
    await hypothesis.getByText("18h00m00.00s (270°)").waitFor();
    await hypothesis.getByText("bulge, edited").waitFor();

    // Delete asks first, then the target is gone from the proposal's table.
    await page.getByRole("button", { name: "Delete target" }).click();
    const confirm = page.getByRole("alertdialog", { name: "Delete target" });
    await expect(confirm.textContent()).resolves.toContain(`${name} and all its observation notes`);
    await confirm.getByRole("button", { name: "Delete for good" }).click();
    await page.waitForURL(/\/proposals\/[0-9a-f-]{36}$/);
    await page.getByTestId("target-table").waitFor();
    await page.getByTestId("target-row").filter({ hasText: "Cinder Avocet" }).waitFor();
    expect(await page.getByTestId("target-row").filter({ hasText: name }).count()).toBe(0);
    const gone = await context.request.get(`${page.url().replace("/proposals/", "/api/proposals/")}/targets?q=${name}`);
    expect((await gone.json()).total).toBe(0);

    await context.close();
    expect(consoleErrors.filter((e) => !e.includes("Failed to load resource"))).toEqual([]);
  });

  it("the PI deletes a proposal only after typing its title", async () => {
    const { page, context } = await newPage(browser);
    await signInAsDemo(page, "pi");
    const title = `Short-lived proposal ${run}`;
    const created = await context.request.post(`${baseUrl}/api/proposals`, {
      data: {
        title,
        cycle: "2033A",
        site: { name: "Mesa Lucerna Station", latitudeDeg: -31.27, longitudeDeg: -68.93, elevationM: 2480, horizonLimitDeg: 20 },
        instrument: { resolutionMas: 50, cadenceHours: 12, campaignLengthDays: 90 },
      },
    });
    expect(created.status()).toBe(201);
    const { proposal } = (await created.json()) as { proposal: { id: string } };

    await page.goto(`/proposals/${proposal.id}`);
    await page.getByRole("button", { name: "Delete proposal" }).click();
    const confirm = page.getByRole("alertdialog", { name: "Delete proposal" });
    const button = confirm.getByRole("button", { name: "Delete for good" });
    await expect(button.isDisabled()).resolves.toBe(true);
    await confirm.getByLabel(/Type .* to confirm/).fill("Short-lived");
    await expect(button.isDisabled()).resolves.toBe(true);
    await confirm.getByLabel(/Type .* to confirm/).fill(title);
    await button.click();
    await page.waitForURL("**/proposals");
    expect(await page.getByRole("link", { name: title }).count()).toBe(0);
    const answer = await context.request.get(`${baseUrl}/api/proposals/${proposal.id}`);
    expect(answer.status()).toBe(404);
    await context.close();
  });
});
