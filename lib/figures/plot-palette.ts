/**
 * Colours and strokes for every plot: the Okabe–Ito palette (M. Okabe & K. Ito 2008, "Color Universal
 * Design"), each series also given its own dash pattern or marker shape so plots read in grayscale
 * and for colour-blind readers. Plots are self-contained SVG on their own dark ground.
 */
export const plotPalette = {
  ground: "#0b0f17",
  frame: "#8f8a80",
  text: "#c9c2b4",
  grid: "#222b3d",
  orange: "#E69F00",
  skyBlue: "#56B4E9",
  bluishGreen: "#009E73",
  yellow: "#F0E442",
  vermillion: "#D55E00",
  reddishPurple: "#CC79A7",
  white: "#f4f1ea",
} as const;

/** Dash patterns, most to least ink, for series drawn together. */
export const dashPatterns = {
  solid: undefined,
  dashed: "7 4",
  dotted: "1.5 3.5",
  dashDot: "8 3 2 3",
  longDash: "14 5",
} as const;

export const plotFont = '"Source Sans 3", system-ui, sans-serif';
