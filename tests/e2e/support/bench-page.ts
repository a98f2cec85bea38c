import type { Page } from "playwright-core";
import { demoSketch, sketchToQueryString, type Sketch } from "@/lib/bench/sketch-state";

/** The lens bench's address for the demo sketch with `changes`. */
export const benchLink = (changes: Partial<Sketch>) => `/bench?${sketchToQueryString({ ...demoSketch, ...changes })}`;

/** How many bundles the page's 3D view has reported drawn ("bench:bundle-drawn" performance marks). */
export const drawnMarks = (page: Page) => page.evaluate(() => performance.getEntriesByName("bench:bundle-drawn").length);

/** Resolves once the scene reports a newly drawn bundle (one more "bundle drawn" mark than before). */
export async function waitForNextDrawnBundle(page: Page, marksBefore: number): Promise<void> {
  await page.waitForFunction((count) => performance.getEntriesByName("bench:bundle-drawn").length > count, marksBefore, { timeout: 60_000 });
}
