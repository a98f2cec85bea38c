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

describe("/sky", () => {
  it("shows the night chart and the dark-hours figure from the link, and both change with the date", async () => {
    const { page, context, consoleErrors } = await newPage(browser);
    // A northern site at midsummer: astronomical darkness is short, so a later night differs clearly.
    await page.goto("/sky?lat=40.5&lon=-4.2&elev=1500&horizon=10&ra=18h36m56.3s&dec=%2B38d47m01s&date=2022-06-21&airmass=2&nights=30");
    const chart = page.getByTestId("night-chart");
    await chart.waitFor();
    expect(await chart.getAttribute("data-night")).toBe("2022-06-21");
    const hours = page.getByTestId("hours-dark-above-limit");
    const firstHours = await hours.textContent();
    expect(firstHours).toMatch(/^\d+\.\d h$/);
    const firstDarkness = await page.getByTestId("darkness-span").textContent();

    await page.getByLabel("Night of (evening date)").fill("2022-09-21");
    await page.waitForFunction(() => document.querySelector("[data-testid=night-chart]")?.getAttribute("data-night") === "2022-09-21");
    expect(await page.getByTestId("darkness-span").textContent()).not.toBe(firstDarkness);
    expect(await hours.textContent()).not.toBe(firstHours);
    expect(new URL(page.url()).searchParams.get("date")).toBe("2022-09-21");

    await page.getByRole("button", { name: "Next night" }).click();
    await page.waitForFunction(() => document.querySelector("[data-testid=night-chart]")?.getAttribute("data-night") === "2022-09-22");

    // The season arrives from the worker.
    await page.getByTestId("season-table").waitFor();
    expect(await page.getByTestId("season-table").getByRole("row").count()).toBe(2);
    expect(consoleErrors.filter((message) => !message.includes("Failed to load resource"))).toEqual([]);
    await context.close();
  });

  it("names the field of a bad coordinate and shows no chart for it", async () => {
    const { page, context } = await newPage(browser);
    await page.goto("/sky?dec=95&date=2022-06-21");
    await expect(page.getByRole("alert").first().textContent()).resolves.toMatch(/Declination/);
    expect(await page.getByTestId("night-chart").count()).toBe(0);
    await context.close();
  });

  it("shows the Sun caution when the target is near the Sun", async () => {
    const { page, context } = await newPage(browser);
    // Midsummer Sun stands near RA 6h, Dec +23.4° (the June solstice point, common knowledge).
    await page.goto("/sky?lat=40.5&lon=-4.2&ra=06h00m00s&dec=%2B23d00m00s&date=2022-06-21&nights=7");
    await expect(page.getByTestId("sun-caution").textContent()).resolves.toMatch(/solar filter/);
    await context.close();
  });
});
