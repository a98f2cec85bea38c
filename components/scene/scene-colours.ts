/**
 * The colours of the 3D view in its two inks, free of three.js so the bench page can read them (for
 * its legend and the saved figure's key) without loading the view, which it imports on demand. The
 * view draws in the screen ink; the saved figure (ray-figure, a 2D drawing) in the print ink.
 */
import { plotPalette, printPalette } from "@/lib/figures/plot-palette";

/**
 * The two looks of the 3D view: "screen", light lines on the night background (dark adaptation at
 * the telescope), and "print", dark ink on white for a saved figure that goes on a proposal's page.
 */
export type SceneInk = "screen" | "print";

export interface InkColour {
  color: string;
  opacity: number;
}

export type Inked = Record<SceneInk, InkColour>;

/** The screen's ground is darker than the plots' (the view is a window into space), the print's is the page. */
export const sceneBackground: Record<SceneInk, string> = { screen: "#05070c", print: printPalette.ground };

/** The colours of the wavefronts, the lens and the scale in each ink (the rays' are in fate-styles). */
export const sceneInks = {
  wavefront: { screen: { color: plotPalette.ink, opacity: 1 }, print: { color: printPalette.frame, opacity: 1 } },
  horizon: { screen: { color: "#000000", opacity: 1 }, print: { color: printPalette.ink, opacity: 1 } },
  horizonWire: { screen: { color: plotPalette.frame, opacity: 0.35 }, print: { color: printPalette.frame, opacity: 0.35 } },
  photonSphere: { screen: { color: plotPalette.reddishPurple, opacity: 0.35 }, print: { color: printPalette.reddishPurple, opacity: 0.5 } },
  // A light disc on paper, so the rays that end on it show against it.
  surface: { screen: { color: "#3a3a3a", opacity: 1 }, print: { color: printPalette.grid, opacity: 1 } },
  // Rings of the scale and the axis toward the observer: present, quieter than the rays.
  scale: { screen: { color: plotPalette.frame, opacity: 0.45 }, print: { color: printPalette.frame, opacity: 0.6 } },
  // Rays without the chosen quantity (captured, winding, ended on the surface): grey, in their fate's dash.
  noValue: { screen: { color: plotPalette.frame, opacity: 1 }, print: { color: printPalette.frame, opacity: 1 } },
} satisfies Record<string, Inked>;
