import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { launchBrowser, newPage } from "./support/browser";

let browser: Browser;

beforeAll(async () => {
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
});

const run = Date.now().toString(36);
const demoProposalTitle = "Bending starlight in the Cinder bulge window";
// A link like the target page's "Open in the lens bench": a 0.5 M☉ point lens at 4 kpc, source at 8 kpc,
// in the bulge; the keys it leaves out (site, cycle, event peak, source) take the bench's demo values.
const benchQuery = new URLSearchParams({
  lens: "point",
  mass: "0.5 Msun",
  geometry: "distance",
  dl: "4 kpc",
  ds: "8 kpc",
  beta: "0.3",
  betaUnit: "thetaE",
  mu: "5 mas/yr",
  ra: "17 59 02.3",
  dec: "-29 33 10",
  case: "photometric-microlensing",
  fwhm: "60 mas",
  cadence: "6 h",
  campaign: "120 d",
});

describe("lens bench → proposal", () => {
  it("signed out asks for sign-in and returns to the sketch; the demo Co-I saves it to the demo proposal", async () => {
    const { page, context, consoleErrors } = await newPage(browser);
    await page.goto(`/bench?${benchQuery}`);
    const signInLink = page.getByRole("link", { name: "Sign in to save it" });
    await signInLink.waitFor();
    await signInLink.click();
    const form = page.getByRole("form", { name: "Sign in with password" });
    await form.getByLabel("E-mail").fill("tomas.brenneke@tessellate.example");
    await form.getByLabel("Password").fill("brenneke-demo-arcs");
    await form.getByRole("button", { name: "Sign in" }).click();
    // Back on the bench with the same sketch.
    await page.waitForURL("**/bench?**");
    const back = new URL(page.url()).searchParams;
    expect([back.get("mass"), back.get("dl"), back.get("ds"), back.get("beta")]).toEqual(["0.5 Msun", "4 kpc", "8 kpc", "0.3"]);

    const save = page.getByRole("form", { name: "Save as target" });
    await save.waitFor();
    const option = save.locator("option", { hasText: demoProposalTitle });
    await option.waitFor({ state: "attached" });
    await save.getByLabel("Proposal").selectOption((await option.getAttribute("value"))!);
    // The target has no lens-radius field: the form says so rather than dropping it silently.
    await expect(save.getByTestId("save-target-radius-hint").textContent()).resolves.toMatch(/no field for the lens radius/);
    const name = `BENCH-${run}`;
    await save.getByLabel("Target name").fill(name);
    await save.getByRole("button", { name: "Save as target" }).click();
    // θ_E = sqrt(4 GM/c² · D_LS/(D_L D_S)) for 0.5 M☉, D_L = 4 kpc, D_S = 8 kpc: 0.7134 mas
    // (IAU 2015 nominal GM☉, IAU 2012 au; the same case as tests/e2e/workspace.test.ts).
    await page.getByTestId("saved-target").waitFor();
    await expect(page.getByTestId("saved-target").textContent()).resolves.toContain(`Saved ${name}: Einstein radius 0.7134 mas`);

    await page.getByTestId("saved-target").getByRole("link", { name: "Open the proposal" }).click();
    await page.getByTestId("target-table").waitFor();
    await page.getByRole("search", { name: "Filter targets" }).getByLabel("Name contains").fill(name);
    const row = page.getByTestId("target-row").filter({ hasText: name });
    await row.waitFor();
    await expect(row.locator('[data-column="einsteinRadiusMas"]').textContent()).resolves.toBe("0.7134");
    // The bench's β and proper motion came along: the target page shows them as saved.
    await row.getByRole("link", { name }).click();
    const hypothesis = page.getByRole("region", { name: "Lens hypothesis" });
    await hypothesis.getByText("0.3 θE").waitFor();
    await hypothesis.getByText("5 mas/yr").waitFor();
    await hypothesis.getByText("4000 pc / 8000 pc").waitFor();

    await context.close();
    expect(consoleErrors.filter((e) => !e.includes("Failed to load resource"))).toEqual([]);
  });
});
