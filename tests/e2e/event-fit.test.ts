import { readFileSync } from "node:fs";
import type { Browser, Page } from "playwright-core";
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
/** The demo event's photometry as a user downloads it (scripts/demo/generate_demo_photometry.py writes it). */
const demoPhotometryFile = "public/demo/cinder-avocet-photometry.csv";

/** Every case answer on the target page: its id, verdict and sentence. */
async function caseAnswers(page: Page): Promise<string[]> {
  const answers = page.getByTestId("case-answers").locator("li[data-verdict]");
  await answers.first().waitFor();
  return answers.evaluateAll((items) => items.map((li) => `${li.getAttribute("data-testid")} ${li.getAttribute("data-verdict")}: ${li.querySelector('[data-testid="case-answer-sentence"]')?.textContent ?? ""}`));
}

/** The days in "25.4 d" (the computed crossing time) or "28.47 ± 1.6 d" (the fitted t_E). */
function daysOf(text: string | null): number {
  const match = /^([\d.]+)/.exec(text ?? "");
  if (match === null) throw new Error(`no days in "${text}"`);
  return Number(match[1]);
}

describe("an ongoing event: photometry, fit, apply and undo (issue #19)", () => {
  it("a PI drops the demo event's photometry on its target, fits it, applies the fit and sees the verdicts follow; undo restores them", async () => {
    const { page, context, consoleErrors } = await newPage(browser);
    await signInAsDemo(page, "pi");
    // A copy of the demo event Cinder Avocet in a proposal of the test's own.
    const { proposalId, targetId } = await createOwnTarget(
      context.request,
      {
        title: `Live event ${run}`,
        cycle: "2031A",
        cycleStartDate: "2031-05-01",
        cycleEndDate: "2031-07-31",
        instrument: { resolutionMas: 50, cadenceHours: 4, campaignLengthDays: 90, astrometricPrecisionMas: 0.1, reachableContrast: 100 },
        photometry: { apertureM: 4, centralObstructionM: 1, bandId: "jc-i" },
      },
      {
        name: `LIVE-${run}`, ra: "17 52 31.8", dec: "-29 41 07", lensModel: "point", lensMassSolar: 0.32, lensDistancePc: 5200, sourceDistancePc: 8100,
        sourceOffsetThetaE: 0.12, properMotionMasPerYr: 6.1, eventPeakJdUtc: "2031-06-11 04:00", sourceMagnitude: 17.8, blendFraction: 0.7, priority: 1,
      },
    );

    await page.goto(`/proposals/${proposalId}/targets/${targetId}`);
    const before = await caseAnswers(page);
    const crossingBefore = daysOf(await page.getByTestId("computed-crossing-time").textContent());

    // Upload through the dropzone; the mapping is proposed whole, the time scale from the header ("HJD-2450000 (UTC)").
    const section = page.getByTestId("event-photometry");
    await section.getByRole("button", { name: "Add photometry" }).click();
    await section.getByTestId("photometry-dropzone").locator('input[type="file"]').setInputFiles({
      name: "cinder-avocet-photometry.csv",
      mimeType: "text/csv",
      buffer: readFileSync(demoPhotometryFile),
    });
    await section.getByTestId("uploaded-photometry").waitFor({ timeout: 30_000 });
    expect(await section.getByLabel("Time scale").inputValue()).toBe("UTC");
    await section.getByTestId("photometry-summary").filter({ hasText: "310 points in 2 datasets" }).waitFor();
    await section.getByRole("button", { name: "Keep photometry" }).click();
    await section.getByTestId("photometry-kept").waitFor();
    // The list of kept files is fetched again after the keep.
    await section.getByTestId("photometry-file").first().waitFor();
    expect(await section.getByTestId("photometry-file").count()).toBe(1);

    // The fit runs in a worker; the demo file was drawn from t0 2031-06-13 10:00 UTC, u0 0.08, t_E 28 d.
    const fit = page.getByTestId("event-fit");
    await fit.getByText("310 points in 2 datasets").waitFor();
    await fit.getByRole("button", { name: "Fit light curve" }).click();
    await fit.getByTestId("fit-result").waitFor({ timeout: 60_000 });
    expect(await fit.getByTestId("fit-t0Days").textContent()).toMatch(/^2031-06-1\d /);
    const fittedTeDays = daysOf(await fit.getByTestId("fit-tEDays").textContent());
    expect(Math.abs(fittedTeDays - 28)).toBeLessThan(5);
    expect(await fit.getByTestId("fit-prediction").textContent()).toMatch(/2031-06-1\d/);

    await fit.getByRole("button", { name: "Apply fit to target" }).click();
    await fit.getByRole("status").filter({ hasText: /^Applied: / }).waitFor();
    // The page's verdicts, schedule and budget come from the fitted event: t_E is the fit's now.
    await expect.poll(async () => daysOf(await page.getByTestId("computed-crossing-time").textContent()), { timeout: 30_000 }).not.toBe(crossingBefore);
    expect(Math.abs(daysOf(await page.getByTestId("computed-crossing-time").textContent()) - fittedTeDays)).toBeLessThan(0.5);
    const after = await caseAnswers(page);
    expect(after).not.toEqual(before);

    // Undo restores the values before the fit, and the verdicts with them.
    const revisions = page.getByTestId("fit-revisions");
    await revisions.getByRole("button", { name: "Undo fit" }).click();
    await expect.poll(async () => daysOf(await page.getByTestId("computed-crossing-time").textContent()), { timeout: 30_000 }).toBe(crossingBefore);
    expect(await caseAnswers(page)).toEqual(before);
    expect(consoleErrors).toEqual([]);
  }, 180_000);
});
