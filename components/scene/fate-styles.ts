import type { RayFate } from "@/lib/ray-view/assemble-bundle";
import { plotPalette, printPalette } from "@/lib/figures/plot-palette";
import type { InkColour } from "./scene-colours";

/**
 * How each ray fate is drawn, in the 3D view and its legend alike: an Okabe–Ito colour plus a dash
 * pattern (solid, long dashes, short dots), so fates stay apart in grayscale and for colour-blind
 * readers. Dash lengths are in units of M (the view's world unit) and, for the legend, in pixels.
 * `print` is the ink on a saved figure's white page (the figures' print palette, where yellow is drawn
 * in blue), with the faint escaped rays a little stronger than on the dark screen.
 */
export const fateStyles: Record<RayFate, { label: string; color: string; opacity: number; print: InkColour; dashM?: number; gapM?: number; legendDash?: string }> = {
  // Escaped rays are the many: faint, so the wavefronts and the rarer fates read through them.
  escaped: { label: "Escaped", color: plotPalette.skyBlue, opacity: 0.3, print: { color: printPalette.skyBlue, opacity: 0.35 } },
  captured: { label: "Captured (crosses the horizon)", color: plotPalette.vermillion, opacity: 0.6, print: { color: printPalette.vermillion, opacity: 0.8 }, dashM: 0.8, gapM: 0.5, legendDash: "8 5" },
  winding: { label: "Winding (circles the photon sphere)", color: plotPalette.yellow, opacity: 1, print: { color: printPalette.yellow, opacity: 1 }, dashM: 0.12, gapM: 0.25, legendDash: "2 4" },
  // Only a lens with a radius has this fate; long dashes with short gaps keep it apart from "captured".
  surface: { label: "Hit the lens's surface (b < R)", color: plotPalette.bluishGreen, opacity: 0.8, print: { color: printPalette.bluishGreen, opacity: 0.9 }, dashM: 1.6, gapM: 0.3, legendDash: "14 3" },
};
