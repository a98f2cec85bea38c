import type { RayFate } from "@/lib/bench/assemble-bundle";

/**
 * How each ray fate is drawn, in the 3D view and its legend alike: an Okabe–Ito colour plus a dash
 * pattern (solid, long dashes, short dots), so fates stay apart in grayscale and for colour-blind
 * readers. Dash lengths are in units of M (the view's world unit) and, for the legend, in pixels.
 */
export const fateStyles: Record<RayFate, { label: string; color: string; opacity: number; dashM?: number; gapM?: number; legendDash?: string }> = {
  // Escaped rays are the many: faint, so the wavefronts and the rarer fates read through them.
  escaped: { label: "Escaped", color: "#56B4E9", opacity: 0.3 },
  captured: { label: "Captured (crosses the horizon)", color: "#D55E00", opacity: 0.6, dashM: 0.8, gapM: 0.5, legendDash: "8 5" },
  winding: { label: "Winding (circles the photon sphere)", color: "#F0E442", opacity: 1, dashM: 0.12, gapM: 0.25, legendDash: "2 4" },
  // Only a lens with a radius has this fate; long dashes with short gaps keep it apart from "captured".
  surface: { label: "Hit the lens's surface (b < R)", color: "#009E73", opacity: 0.8, dashM: 1.6, gapM: 0.3, legendDash: "14 3" },
};
