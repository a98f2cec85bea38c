import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { orbitingStar } from "@/db/seed/demo-scenario";
import { demoCycle } from "@/db/seed/demo-sky-cycle";
import { baseUrl, launchBrowser, newPage } from "./support/browser";
import { createOwnTarget, demoProposalTitle, signInAsDemo } from "./support/demo";
import { echoOf } from "./support/quantity-echo";

let browser: Browser;

beforeAll(async () => {
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
});

const sentenceOf = (page: Page, id: string) => page.getByTestId(`case-answer-${id}`).getByTestId("case-answer-sentence").textContent();
const rowOf = (page: Page, id: string) => page.getByTestId(`orbit-${id}`).textContent();

// The demo's invented orbiting star (db/seed/demo-scenario.ts: a = 700 au, e = 0.93 about 5.2 × 10⁶ M☉
// at 8.3 kpc, periapsis 2031-05-20 in the demo cycle); its answers are worked in
// tests/unit/workspace/demo-relativistic-orbit.test.ts and tests/integration/relativistic-orbit.test.ts.
describe("a relativistic orbit on the target page", () => {
  it("a Co-I reads the orbiting star's case, its exact and first-order values, its orbit on the sky and in 3D", async () => {
    const { page, consoleErrors } = await newPage(browser);
    await signInAsDemo(page, "coi");
    await page.getByRole("link", { name: demoProposalTitle }).click();
    await page.waitForURL(/\/proposals\/[0-9a-f-]{36}$/);
    await page.getByRole("link", { name: orbitingStar.name, exact: true }).click();
    await page.waitForURL(/\/targets\/[0-9a-f-]{36}/);
    await page.getByTestId("science-case").waitFor();
    expect(await page.getByTestId("science-case").getAttribute("data-case")).toBe("relativistic-orbit");

    // The case's questions: the passage in the season, and the redshift against the 15 km/s spectrograph.
    expect(await page.getByTestId("case-answer-periapsis-season").getAttribute("data-verdict")).toBe("feasible");
    expect(await page.getByTestId("case-answer-redshift-signal").getAttribute("data-verdict")).toBe("feasible");
    expect(await sentenceOf(page, "redshift-signal")).toMatch(/617 km\/s/);

    // The section: exact and first order side by side, each with its formula.
    const section = page.getByRole("region", { name: "The orbiting star" });
    await section.waitFor();
    expect(await rowOf(page, "periapsis")).toMatch(/49 au = 955 M/);
    // Advance per orbit: 0.01026 rad exact = 35.3′, 0.01023 rad to first order = 35.2′ (6πGM/(c² a (1 − e²))).
    expect(await rowOf(page, "precession")).toMatch(/35\.3′ \(2\s?120″\).*35\.2′ \(2\s?110″\).*6πGM\/\(c² a \(1 − e²\)\)/);
    expect(await rowOf(page, "redshift-combined")).toMatch(/617 km\/s: the sum, first post-Newtonian order/);
    expect(await rowOf(page, "redshift-gravitational")).toMatch(/314 km\/s: GM\/\(c r_p\)/);
    expect(await rowOf(page, "apoapsis-shift")).toMatch(/1\s?590 µas, projected/);
    expect(await page.getByTestId("orbit-next-periapsis").textContent()).toMatch(/^Next periapsis: \d{4}-\d{2}-\d{2}/);

    // The sky figure: Newtonian and precessing tracks, and the precession magnified by a labelled factor.
    const sky = page.getByTestId("orbit-sky");
    expect(await sky.getAttribute("data-magnification")).toBe("5");
    expect(await sky.getByTestId("orbit-sky-newtonian").count()).toBe(1);
    expect(await sky.getByTestId("orbit-sky-precessing").count()).toBe(1);
    expect(await sky.getByTestId("orbit-sky-magnified").count()).toBe(1);
    expect(await sky.locator("svg").textContent()).toContain("precession magnified × 5");
    expect(await sky.getByRole("img").getAttribute("aria-label")).toBe(`The star's orbit about ${orbitingStar.name} on the sky, one period`);

    // The 3D view of the orbit from the physics core's tracer: a canvas that draws something.
    const canvas = page.getByTestId("orbit-canvas").locator("canvas");
    await canvas.waitFor({ timeout: 30_000 });
    await expect
      .poll(
        () =>
          canvas.evaluate((element: HTMLCanvasElement) => {
            const copy = document.createElement("canvas");
            copy.width = element.width;
            copy.height = element.height;
            const context = copy.getContext("2d");
            if (context === null) return 0;
            context.drawImage(element, 0, 0);
            const data = context.getImageData(0, 0, copy.width, copy.height).data;
            let lit = 0;
            for (let k = 0; k < data.length; k += 4) if (data[k] + data[k + 1] + data[k + 2] > 120) lit += 1;
            return lit;
          }),
        { timeout: 30_000 },
      )
      .toBeGreaterThan(200);
    expect(consoleErrors).toEqual([]);
  });

  it("the edit form reads the semi-major axis in au or as an angle, and refuses an unbound orbit and an isothermal sphere in words beside the fields", async () => {
    const { page, consoleErrors } = await newPage(browser);
    await signInAsDemo(page, "pi");
    const { proposalId, targetId } = await createOwnTarget(
      page.request,
      { title: `Orbit form ${Date.now()}`, cycle: "2031A", ...demoCycle, instrument: { resolutionMas: 50, cadenceHours: 24, campaignLengthDays: 90, spectroscopicPrecisionKmPerS: "500 m/s" } },
      {
        name: "Tallowmere b",
        ra: "17 46 10",
        dec: "-29 05 00",
        lensModel: "point",
        lensMassSolar: "5.2e6 Msun",
        lensDistancePc: "8.3 kpc",
        sourceDistancePc: "9 kpc",
        sourceOffsetThetaE: "2",
        scienceCase: "relativistic-orbit",
        orbitSemiMajorAxisMas: "0.08434 arcsec",
        orbitEccentricity: "0.93",
        orbitPeriapsisJdUtc: "2031-05-20 12:00",
        orbitInclinationDeg: "122",
        orbitNodeDeg: "61",
        orbitPeriapsisArgumentDeg: "248",
        priority: 1,
      },
    );
    await page.goto(`${baseUrl}/proposals/${proposalId}/targets/${targetId}`);
    await page.getByRole("region", { name: "The orbiting star" }).waitFor();
    await page.getByRole("button", { name: "Edit target" }).click();
    const edit = page.getByRole("form", { name: "Edit target" });
    const orbit = edit.getByRole("group", { name: "Orbiting star" });
    // Stored as an angle (84.34 mas), shown back with its unit.
    await expect(orbit.getByLabel("Semi-major axis a").inputValue()).resolves.toBe("84.34 mas");
    await orbit.getByLabel("Semi-major axis a").fill("700");
    expect(await echoOf(page, "orbitSemiMajorAxis", /au/)).toMatch(/^= 700 au \(a bare number is read in au\)$/);
    await orbit.getByLabel("Semi-major axis a").fill("2 deg");
    expect(await echoOf(page, "orbitSemiMajorAxis", /from/)).toMatch(/^The semi-major axis as an angle is from 0\.001 to 1\s000\s000 mas/);
    await orbit.getByLabel("Semi-major axis a").fill("700 au");
    await orbit.getByLabel("Eccentricity e").fill("1");
    await edit.getByRole("button", { name: "Save changes" }).click();
    await orbit.getByLabel("Eccentricity e").and(page.locator('[aria-invalid="true"]')).waitFor();
    await expect(orbit.getByRole("alert").first().textContent()).resolves.toBe("The eccentricity is from 0 (a circle) to 0.9999: a bound orbit has e below 1.");

    // An isothermal sphere has no orbiting star: refused in words beside the orbit's first field.
    await orbit.getByLabel("Eccentricity e").fill("0.93");
    await edit.getByLabel("Lens model").selectOption("sis");
    await edit.getByLabel("Velocity dispersion (km/s)").fill("250");
    await edit.getByRole("button", { name: "Save changes" }).click();
    await orbit.getByRole("alert").first().waitFor();
    await expect(orbit.getByRole("alert").first().textContent()).resolves.toMatch(/^An orbiting star's elements describe an orbit around a compact mass: this target has a singular isothermal sphere lens\./);

    // Back to the point mass, with the axis now in au: saved, and the section shows the new orbit.
    await edit.getByLabel("Lens model").selectOption("point");
    await edit.getByLabel("Lens mass (M☉)").fill("5.2e6");
    await edit.getByRole("button", { name: "Save changes" }).click();
    await page.getByTestId("target-saved").waitFor();
    await page.getByTestId("orbit-orbit").getByText(/^700 au, e = 0\.93/).waitFor();
    // The browser logs the server's answers to the two refused saves (400); nothing else.
    expect(consoleErrors).toEqual([expect.stringContaining("status of 400"), expect.stringContaining("status of 400")]);
  });
});
