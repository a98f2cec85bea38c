import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { baseUrl, launchBrowser, newPage } from "./support/browser";
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

describe("the photon budget's settings and a target's source brightness (issue #17)", () => {
  it("saves the telescope aperture typed with a unit, names a bad obstruction beside it, and stores a target's magnitude and blend", async () => {
    const { page, context, consoleErrors } = await newPage(browser);
    await signInAsDemo(page, "pi");
    // A proposal of its own, so the demo proposal (other tests grade against it) stays as seeded.
    const created = await context.request.post(`${baseUrl}/api/proposals`, {
      data: {
        title: `Photon budget ${run}`,
        cycle: "2033A",
        site: { name: "Mesa Lucerna Station", latitudeDeg: -31.27, longitudeDeg: -68.93, elevationM: 2480, horizonLimitDeg: 20 },
        instrument: { resolutionMas: 50, cadenceHours: 12, campaignLengthDays: 90 },
      },
    });
    expect(created.status()).toBe(201);
    const { proposal } = (await created.json()) as { proposal: { id: string } };
    const proposalApi = `${baseUrl}/api/proposals/${proposal.id}`;
    const stored = async () => ((await (await context.request.get(proposalApi)).json()) as { proposal: { photometry: Record<string, unknown> } }).proposal.photometry;

    // A new proposal has no aperture, and the page says the photon budget needs it.
    await page.goto(`/proposals/${proposal.id}/settings`);
    await page.getByTestId("aperture-needed").waitFor();
    await expect(page.getByTestId("aperture-needed").textContent()).resolves.toContain("the photon budget needs it");
    const settings = page.getByRole("form", { name: "Proposal settings" });
    await settings.getByLabel("Telescope aperture (m)").fill("1.0 m");
    await expect(echoOf(page, "photometry.apertureM", /= 1 m/)).resolves.toBe("= 1 m");
    await settings.getByRole("button", { name: "Save settings" }).click();
    await settings.getByRole("status").getByText(/^Saved at /).waitFor();
    // Every other setting keeps its default (lib/workspace/photometry-schema.ts): the section is sent complete.
    await expect(stored()).resolves.toMatchObject({ apertureM: 1, centralObstructionM: 0, throughput: 0.5, bandId: "jc-i", skyByBand: {} });

    await page.reload();
    const reloaded = page.getByRole("form", { name: "Proposal settings" });
    await expect(reloaded.getByLabel("Telescope aperture (m)").inputValue()).resolves.toBe("1");
    await expect(echoOf(page, "photometry.apertureM", /= 1 m/)).resolves.toBe("= 1 m (a bare number is read in m)");
    expect(await page.getByTestId("aperture-needed").count()).toBe(0);

    // An obstruction wider than the mirror is refused beside its field, in words, and nothing is stored.
    await reloaded.getByLabel("Central obstruction (m)").fill("150 cm");
    await expect(echoOf(page, "photometry.centralObstructionM", /1\.5/)).resolves.toBe("= 1.5 m");
    await reloaded.getByRole("button", { name: "Save settings" }).click();
    const obstruction = reloaded.getByLabel("Central obstruction (m)");
    await obstruction.and(page.locator('[aria-invalid="true"]')).waitFor();
    const described = (await obstruction.getAttribute("aria-describedby")) ?? "";
    const errorText = await page.locator(`[id="${described.split(" ").pop()}"]`).textContent();
    expect(errorText).toBe("The central obstruction must be smaller than the telescope aperture (1 m).");
    await expect(stored()).resolves.toMatchObject({ apertureM: 1, centralObstructionM: 0 });

    // A target's source: its magnitude, band and blend fraction are saved from the edit form.
    const added = await context.request.post(`${proposalApi}/targets`, {
      data: { name: `PHOT-${run}`, ra: "17 59 02.3", dec: "-29 33 10", lensModel: "point", lensMassSolar: 0.5, lensDistancePc: 4000, sourceDistancePc: 8000, sourceOffsetThetaE: 0.3, priority: 3 },
    });
    expect(added.status()).toBe(201);
    const { target } = (await added.json()) as { target: { id: string; sourceMagnitude: number | null } };
    expect(target.sourceMagnitude).toBeNull();
    await page.goto(`/proposals/${proposal.id}/targets/${target.id}`);
    await page.getByRole("button", { name: "Edit target" }).click();
    const edit = page.getByRole("form", { name: "Edit target" });
    await edit.getByLabel("Source magnitude").fill("19.5");
    await edit.getByLabel("Source band").selectOption({ label: "I (Johnson–Cousins)" });
    await edit.getByLabel("Blend fraction f_s").fill("0,6");
    await expect(echoOf(page, "blendFraction", /0\.6/)).resolves.toBe("= 0.6");
    await edit.getByRole("button", { name: "Save changes" }).click();
    await page.getByTestId("target-saved").waitFor();
    const saved = (await (await context.request.get(`${proposalApi}/targets/${target.id}`)).json()) as { target: Record<string, unknown> };
    expect(saved.target).toMatchObject({ sourceMagnitude: 19.5, sourceBand: "jc-i", blendFraction: 0.6 });

    // Opened again on a fresh page, the form shows the stored values.
    await page.reload();
    await page.getByRole("button", { name: "Edit target" }).click();
    await expect(edit.getByLabel("Source magnitude").inputValue()).resolves.toBe("19.5");
    await expect(edit.getByLabel("Blend fraction f_s").inputValue()).resolves.toBe("0.6");
    await expect(edit.getByLabel("Source band").inputValue()).resolves.toBe("jc-i");

    await context.close();
    // The refused save is a 400 the browser logs as a failed resource; nothing else may be.
    expect(consoleErrors.filter((e) => !e.includes("Failed to load resource"))).toEqual([]);
  });
});
