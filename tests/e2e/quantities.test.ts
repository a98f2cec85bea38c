import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { launchBrowser, newPage } from "./support/browser";
import { signInAsDemo } from "./support/demo";
import { echoOf } from "./support/quantity-echo";

let browser: Browser;

beforeAll(async () => {
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
});

const run = Date.now().toString(36);

/** The API's answer for a path, fetched by the signed-in page (its session cookie). */
function apiGet<T>(page: Page, path: string): Promise<T> {
  return page.evaluate(async (url) => (await fetch(url)).json(), path) as Promise<T>;
}

describe("quantities typed as astronomers type them (issue #15)", () => {
  it("the proposal forms and the target form take units, echo the value used, and store it in the stored unit", async () => {
    const { page, consoleErrors } = await newPage(browser);
    await signInAsDemo(page, "pi");

    // A new proposal of its own, so the demo proposal's instrument (other tests grade against it) stays as seeded.
    const form = page.getByRole("form", { name: "New proposal" });
    await form.getByLabel("Title").fill(`Units ${run}`);
    await form.getByLabel("Observing cycle").fill("2032B");
    await form.getByLabel("Site name").fill("Ridge Hollow test site");
    await form.getByLabel("Latitude (deg)").fill("-30.2 deg");
    await form.getByLabel("Longitude (deg, east +)").fill("-70.7");
    await expect(echoOf(page, "longitudeDeg", /a bare number is read in °/)).resolves.toBe("= −70.7° (a bare number is read in °)");
    await form.getByLabel("Elevation (m)").fill("2.2 km");
    await expect(echoOf(page, "elevationM", /2200/)).resolves.toBe("= 2200 m");
    await form.getByLabel("Resolution (mas)").fill("40 mas");
    await form.getByLabel("Cadence (hours)").fill("30 min");
    await expect(echoOf(page, "cadenceHours", /0\.5/)).resolves.toBe("= 0.5 h");
    await form.getByLabel("Campaign length (days)").fill("100 d");
    await form.getByRole("button", { name: "Create proposal" }).click();
    await page.waitForURL(/\/proposals\/[0-9a-f-]{36}$/);
    const proposalUrl = page.url();
    const proposalId = proposalUrl.split("/").pop()!;
    const created = await apiGet<{ proposal: { site: Record<string, number>; instrument: Record<string, number> } }>(page, `/api/proposals/${proposalId}`);
    expect(created.proposal.site).toMatchObject({ latitudeDeg: -30.2, longitudeDeg: -70.7, elevationM: 2200 });
    expect(created.proposal.instrument).toMatchObject({ resolutionMas: 40, cadenceHours: 0.5, campaignLengthDays: 100 });

    // The interferometer in the settings: 2.2 µm is 0.0022 mm (SI prefixes); 230 GHz is c/ν with
    // c = 299 792 458 m/s exactly (SI definition), 1.3034454695652173 mm, stored to 15 digits.
    await page.goto(`${proposalUrl}/settings`);
    const settings = page.getByRole("form", { name: "Proposal settings" });
    await settings.getByLabel("Longest baseline B (km)").fill("10700");
    await settings.getByLabel("Interferometer wavelength λ (mm)").fill("2.2 um");
    await expect(echoOf(page, "interferometerWavelengthMm", /0\.0022/)).resolves.toBe("= 0.0022 mm");
    await settings.getByRole("button", { name: "Save settings" }).click();
    await settings.getByRole("status").getByText(/^Saved at /).waitFor();
    const infrared = await apiGet<{ proposal: { instrument: Record<string, number> } }>(page, `/api/proposals/${proposalId}`);
    expect(infrared.proposal.instrument).toMatchObject({ interferometerWavelengthMm: 0.0022, interferometerBaselineKm: 10700 });

    await settings.getByLabel("Interferometer wavelength λ (mm)").fill("230 GHz");
    await expect(echoOf(page, "interferometerWavelengthMm", /1\.303/)).resolves.toBe("= 1.303 mm");
    await settings.getByRole("button", { name: "Save settings" }).click();
    await settings.getByRole("status").getByText(/^Saved at /).waitFor();
    const radio = await apiGet<{ proposal: { instrument: Record<string, number> } }>(page, `/api/proposals/${proposalId}`);
    expect(radio.proposal.instrument.interferometerWavelengthMm).toBe(1.30344546956522);

    // A mass typed as a distance is refused beside the field as the user types, and by the server.
    await page.goto(proposalUrl);
    const add = page.getByRole("form", { name: "Add a target" });
    await add.getByLabel("Target name").fill(`UNITS-${run}`);
    await add.getByLabel("Right ascension").fill("17 45 40.04");
    await add.getByLabel("Declination").fill("-29 00 28.1");
    await add.getByLabel("Lens mass (M☉)").fill("5 kpc");
    await expect(echoOf(page, "lensMassSolar", /^Lens mass: /)).resolves.toMatch(/^Lens mass: '5 kpc' is a distance, not a mass.*type e\.g\. 0\.3 Msun\.$/);
    // Thousands groups of three: 4,100,000 M☉, not 4,100 (issue #15).
    await add.getByLabel("Lens mass (M☉)").fill("4,100,000 Msun");
    await expect(echoOf(page, "lensMassSolar", /10⁶/)).resolves.toBe("= 4.1 × 10⁶ M☉");
    await add.getByLabel("Lens distance (pc)").fill("8 kpc");
    await add.getByLabel("Source distance (pc)").fill("8.5 kpc");
    await add.getByLabel("Relative proper motion (mas/yr)").fill("5 mas/yr");
    await add.getByRole("button", { name: "Add target" }).click();
    await page.getByTestId("added-target").waitFor();
    const list = await apiGet<{ rows: { name: string; lensMassSolar: number; lensDistancePc: number; sourceDistancePc: number; properMotionMasPerYr: number }[] }>(
      page,
      `/api/proposals/${proposalId}/targets`,
    );
    expect(list.rows.find((row) => row.name === `UNITS-${run}`)).toMatchObject({ lensMassSolar: 4.1e6, lensDistancePc: 8000, sourceDistancePc: 8500, properMotionMasPerYr: 5 });
    expect(consoleErrors).toEqual([]);
  });
});
