import { readFile } from "node:fs/promises";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { criticalImpactParameter, einsteinRadius, MILLIARCSECOND_RAD } from "@/lib/physics";
import { benchLink, drawnMarks, waitForNextDrawnBundle } from "./support/bench-page";
import { launchBrowser, newPage } from "./support/browser";
import extractChunks from "png-chunks-extract";
import { decode as decodeText } from "png-chunk-text";
import { PNG_PROVENANCE_KEYWORD } from "@/lib/exports/png-text";

let browser: Browser;

beforeAll(async () => {
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
});

/** The Einstein radius as shown (default unit mas), as a number of milliarcseconds. */
async function shownThetaEMas(page: Page): Promise<number> {
  const text = (await page.getByTestId("result-theta-e").textContent()) ?? "";
  expect(text).toMatch(/ mas$/);
  return Number(text.replace(/ mas$/, ""));
}

describe("lens bench", () => {
  it("opens from a link with parameters and shows the Einstein radius the physics module computes", async () => {
    const { page, context } = await newPage(browser);
    // θ_E is 1.4″ here, shown in arcsec by default; the link's unit choice (mas) wins.
    await page.goto(benchLink({ mass: "4e6 Msun", dl: "8.1 kpc", ds: "16 kpc", units: "theta-e:mas" }));
    await expect(page.getByLabel("Lens mass").inputValue()).resolves.toBe("4e6 Msun");
    const expectedMas = einsteinRadius(4e6, 8100, 16_000) / MILLIARCSECOND_RAD;
    // Shown to 4 significant digits.
    expect(Math.abs((await shownThetaEMas(page)) / expectedMas - 1)).toBeLessThan(5e-4);
    await context.close();
  });

  it("updates the Einstein radius when the mass changes, and keeps the link in step", async () => {
    const { page, context } = await newPage(browser);
    await page.goto(benchLink({ mass: "4e6 Msun", dl: "8.1 kpc", ds: "16 kpc", units: "theta-e:mas" }));
    await page.getByLabel("Lens mass").fill("1e6 Msun");
    const expectedMas = einsteinRadius(1e6, 8100, 16_000) / MILLIARCSECOND_RAD;
    await page.waitForFunction((text) => document.querySelector('[data-testid="result-theta-e"]')?.textContent === text, `${Number(expectedMas.toPrecision(4))} mas`);
    expect(Math.abs((await shownThetaEMas(page)) / expectedMas - 1)).toBeLessThan(5e-4);
    expect(new URL(page.url()).searchParams.get("mass")).toBe("1e6 Msun");
    await context.close();
  });

  it("echoes the value a field uses as the user types: 4,100,000 Msun is 4.1 × 10⁶ M☉", async () => {
    const { page, context } = await newPage(browser);
    await page.goto(benchLink({}));
    await page.getByLabel("Lens mass").fill("4,100,000 Msun");
    await page.waitForFunction(() => document.querySelector('[data-testid="echo-mass"]')?.textContent?.includes("4.1 × 10⁶"));
    // The mass the results use is that one: θ_E grows as √M from the demo's 0.5 M☉.
    const expectedMas = einsteinRadius(4.1e6, 4000, 8000) / MILLIARCSECOND_RAD;
    await page.getByLabel("Unit for Einstein radius").selectOption("mas");
    expect(Math.abs((await shownThetaEMas(page)) / expectedMas - 1)).toBeLessThan(5e-4);
    expect(new URL(page.url()).searchParams.get("units")).toBe("theta-e:mas");
    await context.close();
  });

  it("shows a bad value's error beside its field and dims the last good results, saying whose they are", async () => {
    const { page, context } = await newPage(browser);
    await page.goto(benchLink({}));
    const before = await page.getByTestId("result-theta-e").textContent();
    await expect(page.getByTestId("bench-results").getAttribute("data-stale")).resolves.toBe("false");
    const massField = page.getByLabel("Lens mass");
    await massField.fill("45 uas");
    const fieldError = page.getByRole("alert").filter({ hasText: /^Lens mass: '45 uas' .*angle/ });
    await fieldError.waitFor();
    // The message belongs to the mass field: it is the first description of that input.
    const errorId = await fieldError.getAttribute("id");
    expect(((await massField.getAttribute("aria-describedby")) ?? "").split(" ")[0]).toBe(errorId);
    await expect(massField.getAttribute("aria-invalid")).resolves.toBe("true");
    await expect(page.getByTestId("result-theta-e").textContent()).resolves.toBe(before);
    await expect(page.getByTestId("stale-note").textContent()).resolves.toMatch(/belong to the last valid sketch/);
    // Numbers, verdicts and plots are dimmed, not merely annotated.
    for (const testId of ["bench-results", "bench-plots"]) {
      const frame = page.getByTestId(testId);
      await expect(frame.getAttribute("data-stale")).resolves.toBe("true");
      expect(Number(await frame.evaluate((element) => getComputedStyle(element).opacity))).toBeLessThan(0.5);
    }
    await massField.fill("0.5 Msun");
    await page.getByTestId("stale-note").waitFor({ state: "detached" });
    await expect(page.getByTestId("bench-results").getAttribute("data-stale")).resolves.toBe("false");
    await context.close();
  });

  it("traces 2,000 rays in workers, draws them on the 3D canvas and counts them by fate", async () => {
    const { page, context } = await newPage(browser);
    await page.goto(benchLink({ rays: "2000", bmin: "0.5", bmax: "15" }));
    // The link's own bundle is traced on arrival; then trace again by hand.
    await waitForNextDrawnBundle(page, 0);
    const marks = await drawnMarks(page);
    await page.getByRole("button", { name: "Trace rays" }).click();
    await waitForNextDrawnBundle(page, marks);

    const counts = {
      escaped: Number(await page.getByTestId("fate-count-escaped").textContent()),
      captured: Number(await page.getByTestId("fate-count-captured").textContent()),
      winding: Number(await page.getByTestId("fate-count-winding").textContent()),
    };
    expect(counts.escaped + counts.captured + counts.winding).toBe(2000);
    // Rays are spread evenly over b in [0.5, 15] M; only those with b < b_c can fall in.
    const criticalM = criticalImpactParameter(1);
    let belowCritical = 0;
    for (let i = 0; i < 2000; i++) if (0.5 + (14.5 * (i + 0.5)) / 2000 < criticalM) belowCritical += 1;
    expect(counts.captured).toBeLessThanOrEqual(belowCritical);
    expect(counts.captured).toBeGreaterThan(belowCritical - 50);
    expect(counts.escaped).toBeLessThanOrEqual(2000 - belowCritical);
    expect(counts.winding).toBeGreaterThan(0);

    // Read the WebGL canvas back through a 2D canvas and count pixels that are not the background.
    const pixels = await page.evaluate(() => {
      const source = document.querySelector<HTMLCanvasElement>('[data-testid="ray-bundle-canvas"] canvas');
      if (source === null) return { total: 0, lit: 0, blue: 0 };
      const copy = document.createElement("canvas");
      copy.width = source.width;
      copy.height = source.height;
      const context2d = copy.getContext("2d");
      if (context2d === null) return { total: 0, lit: 0, blue: 0 };
      context2d.drawImage(source, 0, 0);
      const data = context2d.getImageData(0, 0, copy.width, copy.height).data;
      let lit = 0;
      let blue = 0;
      for (let i = 0; i < data.length; i += 4) {
        const [r, g, b] = [data[i], data[i + 1], data[i + 2]];
        // The background is #05070c.
        if (Math.abs(r - 5) + Math.abs(g - 7) + Math.abs(b - 12) > 40) lit += 1;
        if (b > 100 && b > r + 30) blue += 1;
      }
      return { total: data.length / 4, lit, blue };
    });
    expect(pixels.total).toBeGreaterThan(100_000);
    expect(pixels.lit / pixels.total).toBeGreaterThan(0.1);
    // The escaped rays are drawn in sky blue: 4.7 % of the picture (22 % of what is lit) in the view
    // framed to the whole bundle, blended and dimmed as a 2,000-ray bundle is.
    expect(pixels.blue / pixels.total, JSON.stringify(pixels)).toBeGreaterThan(0.025);

    // The view saves as a PNG of the drawn bundle (a blank canvas compresses to a few kB), at 1×
    // and at 4× the canvas size on screen (IHDR width, PNG 3rd ed. §11.2.1, is bytes 16..19).
    const canvasWidthPx = await page.getByTestId("ray-bundle-canvas").locator("canvas").evaluate((c: HTMLCanvasElement) => c.width);
    const canvasHeightPx = await page.getByTestId("ray-bundle-canvas").locator("canvas").evaluate((c: HTMLCanvasElement) => c.height);
    for (const [scale, suffix] of [[1, ""], [4, "-4x"]] as const) {
      await page.getByLabel("PNG resolution").selectOption(String(scale));
      const download = page.waitForEvent("download");
      await page.getByRole("button", { name: "Save view as PNG" }).click();
      const saved = await download;
      expect(saved.suggestedFilename()).toBe(`arcwright-ray-bundle-2000-rays${suffix}.png`);
      const png = await readFile(await saved.path());
      expect(Array.from(png.subarray(0, 8))).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
      expect(png.readUInt32BE(16)).toBe(canvasWidthPx * scale);
      expect(png.length).toBeGreaterThan(20_000);
      // Provenance travels in the file like every exported figure's: tEXt Source is the bench link
      // that reproduces the view, and the iTXt record names the inputs (PNG 3rd ed. §11.3.4).
      const chunks = extractChunks(png);
      const texts = Object.fromEntries(chunks.filter((c) => c.name === "tEXt").map((c) => [decodeText(c.data).keyword, decodeText(c.data).text]));
      expect(new URL(texts.Source).pathname).toBe("/bench");
      expect(texts.Software).toMatch(/^Arcwright \d+\.\d+\.\d+$/);
      const record = chunks.find((c) => c.name === "iTXt" && Buffer.from(c.data).toString("latin1").startsWith(PNG_PROVENANCE_KEYWORD));
      const json = Buffer.from(record!.data).subarray(PNG_PROVENANCE_KEYWORD.length + 5).toString("utf8");
      expect(JSON.parse(json).inputs).toMatchObject({ drawnRays: 2000, pngScale: scale });

      // A figure for a page: it prints at its size on screen (pHYs, PNG 3rd ed. §11.3.5.3: pixels per
      // metre, unit 1 = metre; 96 DPI per scale, CSS 1px = 1/96 in) and carries its caption.
      const physical = chunks.find((c) => c.name === "pHYs");
      expect(physical).toBeDefined();
      const physicalData = Buffer.from(physical!.data);
      expect(Math.round(physicalData.readUInt32BE(0) * 0.0254)).toBe(96 * scale);
      expect(physicalData.readUInt32BE(4)).toBe(physicalData.readUInt32BE(0));
      expect(physicalData[8]).toBe(1);
      const description = chunks.find((c) => c.name === "iTXt" && Buffer.from(c.data).toString("latin1").startsWith("Description\0"));
      expect(description).toBeDefined();
      // 0.5 M☉: GM/c² = 0.5 × 1476.625 m (GM☉ IAU 2015 B3 nominal) = 738.3 m.
      expect(Buffer.from(description!.data).subarray("Description".length + 5).toString("utf8")).toMatch(
        /^Exact light paths past a Schwarzschild mass of 0\.5 M☉ \(lengths in units of M = GM\/c² = 738\.3 m\): 2000 rays in a planar fan, impact parameters b = 0\.5 to 15 M\. Arcwright \d+\.\d+\.\d+\.$/,
      );
      // White paper with dark ink: the view on a white ground, a caption band below it with text.
      const heightPx = png.readUInt32BE(20);
      expect(heightPx).toBeGreaterThan(canvasHeightPx * scale);
      const paper = await page.evaluate(
        async ({ base64, viewHeightPx }) => {
          const bitmap = await createImageBitmap(new Blob([Uint8Array.from(atob(base64), (c) => c.charCodeAt(0))], { type: "image/png" }));
          const copy = document.createElement("canvas");
          copy.width = bitmap.width;
          copy.height = bitmap.height;
          const context2d = copy.getContext("2d")!;
          context2d.drawImage(bitmap, 0, 0);
          const count = (top: number, bottom: number, test: (r: number, g: number, b: number) => boolean) => {
            const data = context2d.getImageData(0, top, copy.width, bottom - top).data;
            let hits = 0;
            for (let i = 0; i < data.length; i += 4) if (test(data[i], data[i + 1], data[i + 2])) hits += 1;
            return hits / (data.length / 4);
          };
          const white = (r: number, g: number, b: number) => r > 245 && g > 245 && b > 245;
          const dark = (r: number, g: number, b: number) => r + g + b < 200;
          // The screen's ground is #05070c; on paper only the horizon's disc is that dark.
          const night = (r: number, g: number, b: number) => r < 24 && g < 24 && b < 24;
          return {
            viewWhite: count(0, viewHeightPx, white),
            viewNight: count(0, viewHeightPx, night),
            captionWhite: count(viewHeightPx + 2, copy.height, white),
            captionInk: count(viewHeightPx + 2, copy.height, dark),
          };
        },
        { base64: png.toString("base64"), viewHeightPx: canvasHeightPx * scale },
      );
      expect(paper.viewWhite).toBeGreaterThan(0.3);
      expect(paper.viewNight).toBeLessThan(0.01);
      expect(paper.captionWhite).toBeGreaterThan(0.7);
      expect(paper.captionInk).toBeGreaterThan(0.005);
    }
    // Back at screen size and in the screen's ink (its background is #05070c) afterwards.
    expect(await page.getByTestId("ray-bundle-canvas").locator("canvas").evaluate((c: HTMLCanvasElement) => c.width)).toBe(canvasWidthPx);
    const corner = await page.getByTestId("ray-bundle-canvas").locator("canvas").evaluate((source: HTMLCanvasElement) => {
      const copy = document.createElement("canvas");
      copy.width = source.width;
      copy.height = source.height;
      const context2d = copy.getContext("2d")!;
      context2d.drawImage(source, 0, 0);
      return Array.from(context2d.getImageData(1, 1, 1, 1).data.subarray(0, 3));
    });
    expect(corner).toEqual([5, 7, 12]);
    await context.close();
  });

  it("grades the sketch by its science case, stating the inference, with the visits its simulated schedule collects", async () => {
    const { page, context } = await newPage(browser);
    await page.goto(benchLink({}));
    const sentence = (id: string) => page.getByTestId(`case-answer-${id}`).getByTestId("case-answer-sentence");
    await expect(page.getByTestId("bench-case").getAttribute("data-case")).resolves.toBe("photometric-microlensing");
    await expect(page.getByTestId("bench-case-reason").textContent()).resolves.toMatch(/blend within the PSF FWHM of 50 mas.*a photometric microlensing event\.$/);
    // The demo's southern site sees the bulge all night in July: the worker's schedule counts the visits.
    await page.waitForFunction(() => /^The schedule collects \d+ visits within t0 ± t_E/.test(document.querySelector('[data-testid="case-answer-event-visits"] [data-testid="case-answer-sentence"]')?.textContent ?? ""), undefined, { timeout: 30_000 });
    await expect(page.getByTestId("case-answer-event-visits").getAttribute("data-verdict")).resolves.toBe("feasible");
    await expect(sentence("peak-window").textContent()).resolves.toMatch(/^The peak \(t0 = 2027-07-10 00:00 UTC\) falls in a usable window/);
    // No image-resolution or time-delay question for a microlensing event.
    for (const id of ["image-separation", "delay-season"]) await expect(page.getByTestId(`case-answer-${id}`).count()).resolves.toBe(0);

    // The team's own case replaces the inferred one.
    await page.getByLabel("Science case").selectOption("resolved-images");
    await page.getByTestId("case-answer-image-separation").waitFor();
    await expect(page.getByTestId("bench-case-reason").count()).resolves.toBe(0);
    expect(new URL(page.url()).searchParams.get("case")).toBe("resolved-images");

    // Without cycle dates the sampling questions say what to set.
    await page.goto(benchLink({ cycleStart: "", cycleEnd: "" }));
    await expect(sentence("event-visits").textContent()).resolves.toMatch(/^Set the observing site and the cycle's first and last nights/);
    await expect(page.getByTestId("case-answer-event-visits").getAttribute("data-verdict")).resolves.toBe("unknown");
    await context.close();
  });

  it("warns about solar filters when the sketch is deflection by the Sun", async () => {
    const { page, context } = await newPage(browser);
    await page.goto(benchLink({ mass: "1 Msun", dl: "1 au" }));
    await expect(page.getByTestId("solar-caution").textContent()).resolves.toMatch(/Never point a telescope, finder, camera or binoculars at or near the Sun without a proper solar filter/);
    await page.goto(benchLink({}));
    await expect(page.getByTestId("solar-caution").count()).resolves.toBe(0);
    await context.close();
  });

  it("reads the Sun right: no shadow or relativistic images, the inner image occulted, the rays ending on its surface", async () => {
    const { page, context } = await newPage(browser);
    await page.goto(benchLink({ mass: "1 Msun", dl: "1 au", ds: "8 kpc", betaUnit: "angle", beta: "1 deg", radius: "1 Rsun", rays: "200" }));
    await page.getByTestId("result-note-no-photon-sphere").waitFor();
    for (const id of ["shadow", "photon-ring", "rel-plus", "r-ph"]) await expect(page.getByTestId(`result-${id}`).count()).resolves.toBe(0);
    await expect(page.getByTestId("result-theta-minus-note").textContent()).resolves.toMatch(/^behind the lens/);
    await expect(page.getByTestId("result-theta-plus-note").count()).resolves.toBe(0);
    await expect(page.getByTestId("result-note-occulted-image").textContent()).resolves.toMatch(/inner image lies behind the lens's body/);
    // 4GM☉/(c²R☉) = 1.7512″ for the ray grazing the limb (IAU 2015 B3 nominal GM☉ and R☉).
    await page.getByLabel("Unit for deflection angles").selectOption("arcsec");
    await expect(page.getByTestId("deflection-limb").textContent()).resolves.toMatch(/1\.751\d* arcsec/);
    await expect(page.getByTestId("solar-caution").isVisible()).resolves.toBe(true);
    await expect(page.getByTestId("echo-radius").textContent()).resolves.toMatch(/^=/);
    // Every traced ray (b ≤ 15 M) passes far inside R☉ = 4.7 × 10⁵ M: all end on the surface.
    await page.waitForFunction(() => document.querySelector('[data-testid="fate-count-surface"]')?.textContent === "200", undefined, { timeout: 60_000 });
    await expect(page.getByTestId("ray-bundle-surface-note").textContent()).resolves.toMatch(/no photon sphere, horizon or shadow/);
    await context.close();
  });
});
