import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { baseUrl, launchBrowser, newPage } from "./support/browser";

let browser: Browser;

beforeAll(async () => {
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
});

describe("landing page", () => {
  it("shows the product name, says what it does, and renders in the bundled Source Sans 3", async () => {
    const { page, context } = await newPage(browser);
    await page.goto("/");
    await expect(page.getByRole("heading", { level: 1 }).textContent()).resolves.toBe("Arcwright");
    expect(await page.title()).toContain("Arcwright");
    await expect(page.getByRole("navigation", { name: "Main" }).isVisible()).resolves.toBe(true);

    // The face is served by the app itself (no font service) and actually used, not a fallback.
    await page.evaluate(() => document.fonts.ready);
    const fontCheck = await page.evaluate(() => ({
      loaded: document.fonts.check('16px "Source Sans 3"'),
      faces: [...document.fonts].filter((f) => f.family.replace(/"/g, "") === "Source Sans 3" && f.status === "loaded").length,
      family: getComputedStyle(document.body).fontFamily,
    }));
    expect(fontCheck.family).toMatch(/^"?Source Sans 3"?/);
    expect(fontCheck.faces).toBeGreaterThan(0);
    expect(fontCheck.loaded).toBe(true);
    await context.close();
  });

  it("loads its font files from its own origin", async () => {
    const { page, context } = await newPage(browser);
    const fontRequests: string[] = [];
    page.on("request", (request) => {
      if (request.resourceType() === "font") fontRequests.push(request.url());
    });
    await page.goto("/");
    await page.evaluate(() => document.fonts.ready);
    expect(fontRequests.length).toBeGreaterThan(0);
    for (const url of fontRequests) expect(new URL(url).origin).toBe(new URL(baseUrl).origin);
    await context.close();
  });
});

describe("GET /api/health", () => {
  it("answers ok after a real database query", async () => {
    const response = await fetch(`${baseUrl}/api/health`);
    expect(response.status).toBe(200);
    const body = await response.json();
    expect(body).toMatchObject({ status: "ok", database: "ok" });
    expect(typeof body.latencyMs).toBe("number");
  });
});
