/**
 * The two styles every plot is drawn in, one home for both: `plotPalette`, the night-screen look of
 * the app (a dark ground), and `printPalette`, the publication style of every export (white ground,
 * dark ink, no app chrome) that prints on a proposal's white page.
 *
 * Series take the Okabe–Ito palette (M. Okabe & K. Ito 2008, "Color Universal Design"), each series
 * also given its own dash pattern or marker shape so plots read in grayscale and for colour-blind
 * readers. On white paper Okabe–Ito's yellow all but vanishes, so the print style draws that role in
 * the palette's own blue (#0072B2), darker than its sky blue so the two still differ in grayscale.
 */
export interface PlotPalette {
  /** The plot's ground (background). */
  ground: string;
  frame: string;
  text: string;
  grid: string;
  /** The strongest ink: exact curves, the lens, transit; white on the screen, black on paper. */
  ink: string;
  orange: string;
  skyBlue: string;
  bluishGreen: string;
  yellow: string;
  vermillion: string;
  reddishPurple: string;
  /** The sky's shade by the Sun's altitude: day, civil, nautical, astronomical twilight, darkness. */
  skyShades: readonly [string, string, string, string, string];
}

const okabeIto = {
  orange: "#E69F00",
  skyBlue: "#56B4E9",
  bluishGreen: "#009E73",
  yellow: "#F0E442",
  blue: "#0072B2",
  vermillion: "#D55E00",
  reddishPurple: "#CC79A7",
} as const;

export const plotPalette: PlotPalette = {
  ground: "#0b0f17",
  frame: "#8f8a80",
  text: "#c9c2b4",
  grid: "#222b3d",
  ink: "#f4f1ea",
  orange: okabeIto.orange,
  skyBlue: okabeIto.skyBlue,
  bluishGreen: okabeIto.bluishGreen,
  yellow: okabeIto.yellow,
  vermillion: okabeIto.vermillion,
  reddishPurple: okabeIto.reddishPurple,
  skyShades: ["#3a4356", "#2c3446", "#212838", "#171d2a", "#0b0f17"],
};

export const printPalette: PlotPalette = {
  ground: "#ffffff",
  frame: "#4d4d4d",
  text: "#1a1a1a",
  grid: "#e3e3e3",
  ink: "#000000",
  orange: okabeIto.orange,
  skyBlue: okabeIto.skyBlue,
  bluishGreen: okabeIto.bluishGreen,
  yellow: okabeIto.blue,
  vermillion: okabeIto.vermillion,
  reddishPurple: okabeIto.reddishPurple,
  // Night is the shaded part on paper: darker grey for a darker sky, light enough to carry curves.
  skyShades: ["#ffffff", "#f2f2f2", "#e6e6e6", "#dadada", "#cfcfcf"],
};

/** Dash patterns, most to least ink, for series drawn together. */
export const dashPatterns = {
  solid: undefined,
  dashed: "7 4",
  dotted: "1.5 3.5",
  dashDot: "8 3 2 3",
  longDash: "14 5",
} as const;

/** Source Sans 3 for text, Noto Sans Math for the symbols it lacks (∝, √, ☉); both travel with exports. */
export const plotFont = '"Source Sans 3", "Noto Sans Math", system-ui, sans-serif';
