/**
 * The words, numbers and PNG chunks of the 3D view's saved figure: its DPI, the sketch's mass and the
 * caption (the scale's rings and bar are lib/ray-view/scale.ts). Pure (no DOM), for the browser.
 */

import { defaultUnits } from "@/lib/bench/parse-sketch";
import { lensSketches, type Sketch } from "@/lib/bench/sketch-state";
import { internationalTextChunk, type PngChunk } from "@/lib/exports/png-text";
import { PRODUCT_NAME, PRODUCT_VERSION } from "@/lib/exports/provenance";
import { physicalLengthText } from "@/lib/ray-view/scale";
import { parseMass } from "@/lib/physics";
import type { PngScale } from "./png-scale";
import { formatSignificant } from "@/lib/numbers/significant";

/** CSS pixels per inch: 1px = 1/96 in (CSS Values and Units Level 3, §5.2 absolute lengths). */
const CSS_PX_PER_INCH = 96;

/**
 * The DPI that prints the figure at its size on screen: the view is `scale` drawing-buffer pixels per
 * CSS pixel, so 96 DPI at 1×, 192 at 2×, 384 at 4×.
 */
export const figureDpi = (scale: PngScale): number => CSS_PX_PER_INCH * scale;

/** Keyword of the caption's text chunk (PNG 3rd ed. §11.3.4.2: "Description", a long description of the image). */
export const CAPTION_KEYWORD = "Description";

/** The caption as an iTXt chunk (PNG 3rd ed. §11.3.4.5), UTF-8 so M☉ survives. */
export const captionChunk = (caption: string): PngChunk => internationalTextChunk(CAPTION_KEYWORD, caption);

/** The sketch's lens mass in M☉ when its lens is a point mass and the field reads; else undefined. */
export function bundleMassSolar(sketch: Pick<Sketch, "lens" | "mass">): number | undefined {
  if (!lensSketches[sketch.lens].fields.includes("mass")) return undefined;
  try {
    return parseMass(sketch.mass, { defaultUnit: defaultUnits.mass }).massSolar;
  } catch {
    return undefined;
  }
}

export interface RayFigureCaptionRequest {
  /** Undefined when the lens has no mass of its own (an isothermal sphere) or the field does not read. */
  massSolar: number | undefined;
  bMinM: number;
  bMaxM: number;
  rayCount: number;
  layout: Sketch["layout"];
}

/** The caption printed under the figure and stored in its Description chunk. */
export function rayFigureCaption({ massSolar, bMinM, bMaxM, rayCount, layout }: RayFigureCaptionRequest): string {
  const mass =
    massSolar === undefined
      ? "a Schwarzschild mass M (lengths in units of M = GM/c²)"
      : `a Schwarzschild mass of ${formatSignificant(massSolar)} M☉ (lengths in units of M = GM/c² = ${physicalLengthText(1, massSolar)})`;
  const shape = layout === "fan" ? "a planar fan" : "a full cylinder";
  return `Exact light paths past ${mass}: ${rayCount} rays in ${shape}, impact parameters b = ${formatSignificant(bMinM)} to ${formatSignificant(bMaxM)} M. ${PRODUCT_NAME} ${PRODUCT_VERSION}.`;
}
