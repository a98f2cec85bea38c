import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { launchBrowser, newPage } from "./support/browser";
import { createOwnTarget, signInAsDemo } from "./support/demo";

let browser: Browser;

beforeAll(async () => {
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
});

const run = Date.now().toString(36);

/** Hours at the start of a time request ("20.8 h (exposures …" on the proposal page, "20.8 h over 78 visits" on a target). */
function hoursOf(text: string | null): number {
  const match = /^([\d.]+) h /.exec(text ?? "");
  if (match === null) throw new Error(`no hours in "${text}"`);
  return Number(match[1]);
}

describe("the photon budget on the proposal and target pages (issue #17)", () => {
  it("a smaller telescope asks for more hours: the proposal's time request follows the aperture typed in the settings", async () => {
    const { page, context, consoleErrors } = await newPage(browser);
    await signInAsDemo(page, "pi");
    // A proposal of its own (the demo proposal stays as seeded): a bulge event seen from the demo site.
    const { proposalId, targetId } = await createOwnTarget(
      context.request,
      {
        title: `Time request ${run}`,
        cycle: "2031A",
        cycleStartDate: "2031-05-01",
        cycleEndDate: "2031-07-31",
        instrument: { resolutionMas: 800, cadenceHours: 24, campaignLengthDays: 90 },
        photometry: { apertureM: 4, centralObstructionM: 1, bandId: "jc-i" },
      },
      {
        name: `FAINT-${run}`, ra: "17 55 02.3", dec: "-30 02 44", lensModel: "point", lensMassSolar: 0.5, lensDistancePc: 4000, sourceDistancePc: 8000,
        sourceOffsetThetaE: 0.3, properMotionMasPerYr: 5, eventPeakJdUtc: "2031-06-15 04:00", sourceMagnitude: 21, blendFraction: 0.5, priority: 1,
      },
    );

    await page.goto(`/proposals/${proposalId}`);
    const withFourMetres = hoursOf(await page.getByTestId("time-request").textContent());
    expect(await page.getByTestId("time-request").textContent()).toContain("for 1 of 1 targets");

    // The settings page: a 1 m telescope instead of 4 m (the obstruction scaled with it).
    await page.goto(`/proposals/${proposalId}/settings`);
    const settings = page.getByRole("form", { name: "Proposal settings" });
    await settings.getByLabel("Telescope aperture (m)").fill("100 cm");
    await settings.getByLabel("Central obstruction (m)").fill("0.25 m");
    await settings.getByRole("button", { name: "Save settings" }).click();
    await settings.getByRole("status").getByText(/^Saved at /).waitFor();

    await page.goto(`/proposals/${proposalId}`);
    const withOneMetre = hoursOf(await page.getByTestId("time-request").textContent());
    // A sixteenth of the light: the same visits need longer exposures, so more hours are asked for.
    expect(withOneMetre).toBeGreaterThan(withFourMetres);

    // The target page shows the budget: its hours, every visit, and the depth answer at the worst visit.
    await page.goto(`/proposals/${proposalId}/targets/${targetId}`);
    await page.getByTestId("photon-budget").waitFor();
    expect(hoursOf(await page.getByTestId("target-time-request").textContent())).toBeCloseTo(withOneMetre, 1);
    expect(await page.getByTestId("case-answer-depth").getAttribute("data-verdict")).toMatch(/^(feasible|marginal|infeasible)$/);
    expect(await page.getByTestId("case-answer-depth").getByTestId("case-answer-sentence").textContent()).toMatch(
      /^At the worst of the \d+ visits the case needs \(2031-\d\d-\d\d, air mass [\d.]+, Moon (down|\d+% lit \d+° away)\) the magnified source with its blend in I \(Johnson–Cousins\)/,
    );
    expect(consoleErrors).toEqual([]);
  });
});
