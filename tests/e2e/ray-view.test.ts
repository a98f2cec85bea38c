import { readFile } from "node:fs/promises";
import extractChunks from "png-chunks-extract";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { benchLink, drawnMarks, waitForNextDrawnBundle } from "./support/bench-page";
import { launchBrowser, newPage } from "./support/browser";

let browser: Browser;

beforeAll(async () => {
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
});

interface RayPixels {
  width: number;
  height: number;
  /** Ray pixels in the outermost `edgePx` rows and columns. */
  onEdge: number;
  /** Ray pixels inside the edge but within `nearShare` of the width (left, right) or height (top, bottom) from it. */
  nearTop: number;
  nearBottom: number;
  nearLeft: number;
  nearRight: number;
  total: number;
}

/**
 * Reads the WebGL canvas back (its drawing buffer is preserved) and counts the escaped rays' pixels:
 * sky blue (#56B4E9) added onto the night ground #05070c, so blue well above red and green above red.
 * The scale's rings are grey and the wavefronts and the observer's axis near white: not counted.
 */
function rayPixels(page: Page, edgePx = 3, nearShare = 0.12): Promise<RayPixels> {
  return page.evaluate(
    ({ edgePx, nearShare }) => {
      const source = document.querySelector<HTMLCanvasElement>('[data-testid="ray-bundle-canvas"] canvas')!;
      const copy = document.createElement("canvas");
      copy.width = source.width;
      copy.height = source.height;
      const context2d = copy.getContext("2d")!;
      context2d.drawImage(source, 0, 0);
      const { width, height } = copy;
      const data = context2d.getImageData(0, 0, width, height).data;
      const nearX = Math.round(nearShare * width);
      const nearY = Math.round(nearShare * height);
      const counts = { width, height, onEdge: 0, nearTop: 0, nearBottom: 0, nearLeft: 0, nearRight: 0, total: 0 };
      for (let y = 0; y < height; y++) {
        for (let x = 0; x < width; x++) {
          const i = 4 * (y * width + x);
          const [r, g, b] = [data[i], data[i + 1], data[i + 2]];
          if (!(b > 50 && b - r > 25 && g > r)) continue;
          counts.total += 1;
          if (x < edgePx || y < edgePx || x >= width - edgePx || y >= height - edgePx) {
            counts.onEdge += 1;
            continue;
          }
          if (y < nearY) counts.nearTop += 1;
          if (y >= height - nearY) counts.nearBottom += 1;
          if (x < nearX) counts.nearLeft += 1;
          if (x >= width - nearX) counts.nearRight += 1;
        }
      }
      return counts;
    },
    { edgePx, nearShare },
  );
}

/** Sets the time slider (a range input, which Playwright cannot fill) as a user's drag would. */
async function setTimeSlider(page: Page, step: number): Promise<void> {
  await page.getByLabel("Coordinate time").evaluate((input: HTMLInputElement, value) => {
    Object.getOwnPropertyDescriptor(HTMLInputElement.prototype, "value")!.set!.call(input, String(value));
    input.dispatchEvent(new Event("input", { bubbles: true }));
  }, step);
}

/** The non-white share of a saved PNG's view (above the caption band), read back in the page. */
function inkedShare(page: Page, png: Buffer, viewHeightPx: number): Promise<number> {
  return page.evaluate(
    async ({ base64, viewHeightPx }) => {
      const bitmap = await createImageBitmap(new Blob([Uint8Array.from(atob(base64), (c) => c.charCodeAt(0))], { type: "image/png" }));
      const copy = document.createElement("canvas");
      copy.width = bitmap.width;
      copy.height = bitmap.height;
      const context2d = copy.getContext("2d")!;
      context2d.drawImage(bitmap, 0, 0);
      const data = context2d.getImageData(0, 0, copy.width, viewHeightPx).data;
      let inked = 0;
      for (let i = 0; i < data.length; i += 4) if (data[i] < 245 || data[i + 1] < 245 || data[i + 2] < 245) inked += 1;
      return inked / (data.length / 4);
    },
    { base64: png.toString("base64"), viewHeightPx },
  );
}

describe("ray view", () => {
  it("reframes to a new bundle with b up to 100 M: the outermost rays lie inside the picture, near its edge", async () => {
    const { page, context, consoleErrors } = await newPage(browser);
    // The demo bundle (b up to 15 M) is traced on arrival and frames the camera first.
    await page.goto(benchLink({}));
    await waitForNextDrawnBundle(page, 0);
    await page.getByLabel("Number of rays").fill("400");
    await page.getByLabel("Largest impact parameter b (M)").fill("100");
    const marks = await drawnMarks(page);
    await page.getByRole("button", { name: "Trace rays" }).click();
    await waitForNextDrawnBundle(page, marks);

    const fan = await rayPixels(page);
    expect(fan.total).toBeGreaterThan(2000);
    // No ray runs off the picture: none touches its outermost pixels.
    expect(fan.onEdge).toBe(0);
    // And the frame is tight: the outermost rays come within 12 % of the top or bottom edge
    // (a fan is wider than tall, so its height sets the frame; strongly bent rays reach its corners).
    expect(fan.nearTop + fan.nearBottom).toBeGreaterThan(0);

    // The full cylinder with the same impact parameters is framed too (seen obliquely by default).
    await page.getByRole("radio", { name: "Full cylinder" }).check();
    const cylinderMarks = await drawnMarks(page);
    await page.getByRole("button", { name: "Trace rays" }).click();
    await waitForNextDrawnBundle(page, cylinderMarks);
    const cylinder = await rayPixels(page);
    expect(cylinder.total).toBeGreaterThan(2000);
    expect(cylinder.onEdge).toBe(0);

    // Reset view frames the same bundle again from the default direction: still all inside.
    await page.getByRole("button", { name: "Reset view" }).click();
    await page.waitForTimeout(1500);
    expect((await rayPixels(page)).onEdge).toBe(0);
    // The view's shaders compiled and linked (three.js reports a failure as a console error).
    expect(consoleErrors.filter((message) => /THREE|WebGL|shader|uniform|attribute/i.test(message))).toEqual([]);
    await context.close();
  });

  it("labels the scale's rings in M and, for the mass, in km, the axis toward the observer, and a legend that names what colour shows", async () => {
    const { page, context } = await newPage(browser);
    // 0.5 M☉: GM/c² = 738.3 m (IAU 2015 B3 nominal GM☉), so 50 M = 36.92 km.
    await page.goto(benchLink({ rays: "400", bmax: "100" }));
    await waitForNextDrawnBundle(page, 0);
    const labels = page.getByTestId("ray-bundle-canvas").getByTestId("ray-view-scale-label");
    await expect.poll(() => labels.allTextContents()).toEqual(
      expect.arrayContaining(["horizon, r = 2 M = 1.477 km", "photon sphere, r = 3 M = 2.215 km", "50 M = 36.92 km", "100 M = 73.83 km", "to observer (+x)"]),
    );

    // By fate, every fate has its count and its line sample beside the words.
    for (const fate of ["escaped", "captured", "winding"]) await expect(page.getByTestId(`fate-count-${fate}`).textContent()).resolves.toMatch(/^\d+$/);
    await expect(page.getByRole("list", { name: "Rays by fate" }).textContent()).resolves.toMatch(/Wavefronts \(equal coordinate time\)/);

    // By deflection: a labelled scale in degrees (round values, increasing), and the view redrawn in it.
    const marksBefore = await drawnMarks(page);
    await page.getByLabel("Colour rays by").selectOption("deflection");
    const scale = page.getByTestId("ray-colour-scale");
    await expect(scale.textContent()).resolves.toMatch(/Deflection angle α, degrees/);
    const ticks = (await scale.getByTestId("ray-colour-scale-tick").allTextContents()).map(Number);
    expect(ticks.length).toBeGreaterThanOrEqual(2);
    expect(ticks.every((value, k) => k === 0 || value > ticks[k - 1])).toBe(true);
    // b = 100 M deflects by 4M/b ≈ 2.3° (weak-field limit): the scale starts near there.
    expect(ticks[0]).toBeGreaterThanOrEqual(2);
    expect(ticks[0]).toBeLessThan(10);
    expect(await drawnMarks(page)).toBe(marksBefore); // a new colouring is no new bundle
    await context.close();
  });

  it("draws each ray only as far as it has travelled at the slider's time", async () => {
    const { page, context } = await newPage(browser);
    await page.goto(benchLink({ rays: "400", bmax: "100" }));
    await waitForNextDrawnBundle(page, 0);
    const whole = await rayPixels(page);
    await expect(page.getByTestId("ray-time-reading").textContent()).resolves.toBe("all paths whole");
    await setTimeSlider(page, 100); // a quarter of the span
    await page.waitForFunction(() => /^t = [\d.]+ M \(.+\)$/.test(document.querySelector('[data-testid="ray-time-reading"]')?.textContent ?? ""));
    // The progressive draw redraws over a few frames.
    await page.waitForTimeout(2000);
    const early = await rayPixels(page);
    expect(early.total).toBeGreaterThan(0);
    expect(early.total).toBeLessThan(0.6 * whole.total);
    await setTimeSlider(page, 400);
    await page.waitForTimeout(2000);
    expect((await rayPixels(page)).total).toBeGreaterThan(0.9 * whole.total);
    await context.close();
  });

  it("saves the view at 2× and 4× with its DPI in pHYs and lines as wide, relative to the picture, as at 1×", async () => {
    const { page, context } = await newPage(browser);
    await page.goto(benchLink({ rays: "400", bmax: "100" }));
    await waitForNextDrawnBundle(page, 0);
    await page.getByRole("button", { name: "Save view as PNG" }).waitFor();
    const canvas = page.getByTestId("ray-bundle-canvas").locator("canvas");
    const viewHeightPx = await canvas.evaluate((c: HTMLCanvasElement) => c.height);
    const viewWidthPx = await canvas.evaluate((c: HTMLCanvasElement) => c.width);
    const inked: Record<number, number> = {};
    for (const scale of [1, 2, 4]) {
      await page.getByLabel("PNG resolution").selectOption(String(scale));
      const download = page.waitForEvent("download");
      await page.getByRole("button", { name: "Save view as PNG" }).click();
      const png = await readFile(await (await download).path());
      expect(png.readUInt32BE(16)).toBe(viewWidthPx * scale);
      const chunks = extractChunks(png);
      // pHYs (PNG 3rd ed. §11.3.5.3): pixels per metre on both axes, unit byte 1 = metre; 96 DPI per
      // scale (CSS 1px = 1/96 in): 96 / 0.0254 = 3780, 192 → 7559, 384 → 15118 pixels per metre.
      const physical = chunks.filter((chunk) => chunk.name === "pHYs");
      expect(physical).toHaveLength(1);
      const data = Buffer.from(physical[0].data);
      expect(data.readUInt32BE(0)).toBe({ 1: 3780, 2: 7559, 4: 15118 }[scale]);
      expect(data.readUInt32BE(4)).toBe(data.readUInt32BE(0));
      expect(data[8]).toBe(1);
      const caption = chunks.find((chunk) => chunk.name === "iTXt" && Buffer.from(chunk.data).toString("latin1").startsWith("Description\0"));
      expect(Buffer.from(caption!.data).toString("utf8")).toMatch(/impact parameters b = 0\.5 to 100 M/);
      inked[scale] = await inkedShare(page, png, viewHeightPx * scale);
    }
    // Lines and labels scale with the figure: 1-px lines at 4× would ink about a quarter of the 1× share.
    expect(inked[1]).toBeGreaterThan(0.02);
    expect(inked[2] / inked[1]).toBeGreaterThan(0.6);
    expect(inked[4] / inked[1]).toBeGreaterThan(0.6);
    await context.close();
  });
});
