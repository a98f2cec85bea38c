import "server-only";
import { existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import woffConverter from "woff2sfnt-sfnt2woff";
import { PRODUCT_VERSION } from "@/lib/exports/provenance";
import { nodeRequire } from "./node-require";
import { withFamilyName } from "./sfnt-tables";

/** The family name inside the bundled text files, as the plots' `font-family` asks for it. */
export const BUNDLED_FONT_FAMILY = "Source Sans 3";
/** The family of the bundled symbol face (∝, √, ☉, ≈, ≤ …), second in the plots' `font-family`. */
export const MATH_FONT_FAMILY = "Noto Sans Math";

/**
 * The @fontsource subsets of Source Sans 3 the labels need (Latin for text, Latin Extended for Ś, ī,
 * ā, ń, Greek for α, θ, Ω …), each with the unicode-range @fontsource itself declares for it, so a
 * browser picks the right file per character.
 */
const subsets = [
  { name: "latin", unicodeRange: "U+0000-00FF,U+0131,U+0152-0153,U+02BB-02BC,U+02C6,U+02DA,U+02DC,U+0304,U+0308,U+0329,U+2000-206F,U+20AC,U+2122,U+2191,U+2193,U+2212,U+2215,U+FEFF,U+FFFD" },
  { name: "latin-ext", unicodeRange: "U+0100-02BA,U+02BD-02C5,U+02C7-02CC,U+02CE-02D7,U+02DD-02FF,U+0304,U+0308,U+0329,U+1D00-1DBF,U+1E00-1E9F,U+1EF2-1EFF,U+2020,U+20A0-20AB,U+20AD-20C0,U+2113,U+2C60-2C7F,U+A720-A7FF" },
  { name: "greek", unicodeRange: "U+0370-0377,U+037A-037F,U+0384-038A,U+038C,U+038E-03A1,U+03A3-03FF" },
] as const;
export const bundledWeights = [400, 600] as const;
export type BundledWeight = (typeof bundledWeights)[number];

export type BundledSubset = (typeof subsets)[number]["name"];

/** The subsets in the order a character is looked up in. */
export const bundledSubsets: readonly BundledSubset[] = subsets.map((s) => s.name);

/** The code-point ranges of each subset, read once from its declared unicode-range. */
const subsetRanges = new Map<BundledSubset, [number, number][]>(
  subsets.map((subset) => [
    subset.name,
    subset.unicodeRange.split(",").map((part) => {
      const [low, high = low] = part.replace("U+", "").split("-");
      return [parseInt(low, 16), parseInt(high, 16)] as [number, number];
    }),
  ]),
);

/** Whether a subset's declared unicode-range holds a code point. */
export function subsetHolds(subset: BundledSubset, codePoint: number): boolean {
  return subsetRanges.get(subset)!.some(([low, high]) => codePoint >= low && codePoint <= high);
}

function sourceSansFile(subset: BundledSubset, weight: BundledWeight, extension: "woff" | "woff2"): string {
  return join(process.cwd(), "node_modules", "@fontsource", "source-sans-3", "files", `source-sans-3-${subset}-${weight}-normal.${extension}`);
}

/** Noto Sans Math ships one file (named "latin" by @fontsource, though it holds the mathematical symbols), weight 400. */
function mathFontFile(extension: "woff" | "woff2"): string {
  return join(process.cwd(), "node_modules", "@fontsource", "noto-sans-math", "files", `noto-sans-math-latin-400-normal.${extension}`);
}

const fontFace = (family: string, weight: number, woff2: Buffer, unicodeRange?: string) =>
  `@font-face{font-family:"${family}";font-style:normal;font-weight:${weight};` +
  `src:url(data:font/woff2;base64,${woff2.toString("base64")}) format("woff2");` +
  (unicodeRange === undefined ? "}" : `unicode-range:${unicodeRange};}`);

let cachedTextCss: string | undefined;
let cachedMathCss: string | undefined;

/**
 * @font-face rules with every subset and weight inlined as WOFF2 data, for a self-contained SVG; the
 * symbol face (270 kB) only when `text` has a character none of the text subsets declares.
 */
export function bundledFontFaceCss(text: string): string {
  cachedTextCss ??= bundledWeights.flatMap((weight) => subsets.map((subset) => fontFace(BUNDLED_FONT_FAMILY, weight, readFileSync(sourceSansFile(subset.name, weight, "woff2")), subset.unicodeRange))).join("");
  const needsMath = [...text].some((character) => !bundledSubsets.some((subset) => subsetHolds(subset, character.codePointAt(0)!)));
  if (!needsMath) return cachedTextCss;
  cachedMathCss ??= fontFace(MATH_FONT_FAMILY, 400, readFileSync(mathFontFile("woff2")));
  return cachedTextCss + cachedMathCss;
}

const sfntCache = new Map<string, Buffer>();

/**
 * A WOFF file as sfnt (TrueType/OpenType), converted once per process with zlib: resvg reads no WOFF,
 * and fontkit (pdfkit's reader) inflates WOFF in plain JavaScript, ten times slower.
 */
function sfntOf(woffPath: string): Buffer {
  let sfnt = sfntCache.get(woffPath);
  if (sfnt === undefined) {
    sfnt = Buffer.from(woffConverter.toSfnt(readFileSync(woffPath)));
    sfntCache.set(woffPath, sfnt);
  }
  return sfnt;
}

/**
 * The family each face answers to in resvg: `resvgSvg` (resvg-text.ts) names one face per run of
 * text, so each Source Sans 3 subset needs a family of its own (the renamed copies only draw
 * outlines; they are never embedded).
 */
const resvgFamily: Record<BundledSubset | "math", string> = {
  latin: BUNDLED_FONT_FAMILY,
  "latin-ext": "Arcwright Text Latin Ext",
  greek: "Arcwright Text Greek",
  math: MATH_FONT_FAMILY,
};

let cachedSfntFiles: string[] | undefined;

/**
 * Every bundled face as an sfnt file for resvg, each under its own family (`resvgFamily`): written
 * once per process into a versioned folder under the system temporary directory.
 */
export function bundledSfntFiles(): string[] {
  if (cachedSfntFiles) return cachedSfntFiles;
  const folder = join(tmpdir(), `arcwright-fonts-${PRODUCT_VERSION}`);
  mkdirSync(folder, { recursive: true });
  const paths = bundledWeights.flatMap((weight) =>
    bundledPdfFaces(weight).map((face) => {
      const path = join(folder, `${face.name}.sfnt`);
      const isOwnFamily = face.resvgFamily === BUNDLED_FONT_FAMILY || face.resvgFamily === MATH_FONT_FAMILY;
      if (!existsSync(path)) writeFileSync(path, isOwnFamily ? face.data : withFamilyName(face.data, face.resvgFamily, weight === 400 ? "Regular" : "Semibold"));
      return path;
    }),
  );
  // Noto Sans Math has one weight: the same file serves both.
  cachedSfntFiles = [...new Set(paths)];
  return cachedSfntFiles;
}

/** A face registered in a PDF: its pdfkit name, its sfnt data and the code points it has glyphs for. */
export interface PdfFace {
  name: string;
  /** The family it answers to in resvg (`resvgFamily`). */
  resvgFamily: string;
  /** The advance width of a text set in this face, in em. */
  widthEm: (text: string) => number;
  /** The face's ascent, in em (pdfkit places a text's top there). */
  ascentEm: number;
  data: Buffer;
  hasGlyph: (codePoint: number) => boolean;
}

interface FontkitFont {
  hasGlyphForCodePoint(codePoint: number): boolean;
  unitsPerEm: number;
  ascent: number;
  layout(text: string): { advanceWidth: number };
}

/** pdfkit's own font reader (fontkit), for the faces' character maps. */
const fontkit = () => nodeRequire<{ create(data: Buffer): FontkitFont }>("fontkit");

export const PDF_FONT = "SourceSans3";
export const PDF_FONT_SEMIBOLD = "SourceSans3-Semibold";
const PDF_MATH_FONT = "NotoSansMath";
const baseFontName: Record<BundledWeight, string> = { 400: PDF_FONT, 600: PDF_FONT_SEMIBOLD };
/** The registered name of a subset at a weight; the Latin ones keep the names above. */
const subsetFontName = (weight: BundledWeight, subset: BundledSubset) => (subset === "latin" ? baseFontName[weight] : `${baseFontName[weight]}-${subset}`);

let cachedPdfFaces: Map<BundledWeight, PdfFace[]> | undefined;

/**
 * The faces a PDF text is drawn in at a weight, in the order a character is looked up: Source Sans 3
 * Latin, Latin Extended, Greek, then Noto Sans Math (one weight) for the symbols. Whether a face has a
 * character is read from its own character map, not from a declared range.
 */
export function bundledPdfFaces(weight: BundledWeight): PdfFace[] {
  if (!cachedPdfFaces) {
    const face = (name: string, path: string, family: string): PdfFace => {
      const data = sfntOf(path);
      const font = fontkit().create(data);
      return { name, resvgFamily: family, data, hasGlyph: (codePoint) => font.hasGlyphForCodePoint(codePoint), widthEm: (text) => font.layout(text).advanceWidth / font.unitsPerEm, ascentEm: font.ascent / font.unitsPerEm };
    };
    const math = face(PDF_MATH_FONT, mathFontFile("woff"), resvgFamily.math);
    cachedPdfFaces = new Map(bundledWeights.map((w) => [w, [...bundledSubsets.map((subset) => face(subsetFontName(w, subset), sourceSansFile(subset, w, "woff"), resvgFamily[subset])), math]]));
  }
  return cachedPdfFaces.get(weight)!;
}
