import "server-only";
import { existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import woffConverter from "woff2sfnt-sfnt2woff";
import { PRODUCT_VERSION } from "@/lib/exports/provenance";

/** The family name inside the bundled files, as the plots' `font-family` asks for it. */
export const BUNDLED_FONT_FAMILY = "Source Sans 3";

/**
 * The @fontsource subsets the plots' labels need (Latin for text, Greek for α, θ, λ …), each with the
 * unicode-range @fontsource itself declares for it, so a browser picks the right file per character.
 */
const subsets = [
  { name: "latin", unicodeRange: "U+0000-00FF,U+0131,U+0152-0153,U+02BB-02BC,U+02C6,U+02DA,U+02DC,U+0304,U+0308,U+0329,U+2000-206F,U+20AC,U+2122,U+2191,U+2193,U+2212,U+2215,U+FEFF,U+FFFD" },
  { name: "latin-ext", unicodeRange: "U+0100-02BA,U+02BD-02C5,U+02C7-02CC,U+02CE-02D7,U+02DD-02FF,U+0304,U+0308,U+0329,U+1D00-1DBF,U+1E00-1E9F,U+1EF2-1EFF,U+2020,U+20A0-20AB,U+20AD-20C0,U+2113,U+2C60-2C7F,U+A720-A7FF" },
  { name: "greek", unicodeRange: "U+0370-0377,U+037A-037F,U+0384-038A,U+038C,U+038E-03A1,U+03A3-03FF" },
] as const;
const weights = [400, 600] as const;

/** A system face with the few symbols Source Sans 3 lacks (√, ☉, ✕), used only for those glyphs. */
export const FALLBACK_FONT_FILE = "/usr/share/fonts/truetype/dejavu/DejaVuSans.ttf";

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

function fontFile(subset: string, weight: number, extension: "woff" | "woff2"): string {
  return join(process.cwd(), "node_modules", "@fontsource", "source-sans-3", "files", `source-sans-3-${subset}-${weight}-normal.${extension}`);
}

let cachedCss: string | undefined;

/** @font-face rules with every subset and weight inlined as WOFF2 data, for a self-contained SVG. */
export function bundledFontFaceCss(): string {
  cachedCss ??= weights
    .flatMap((weight) =>
      subsets.map(
        (subset) =>
          `@font-face{font-family:"${BUNDLED_FONT_FAMILY}";font-style:normal;font-weight:${weight};` +
          `src:url(data:font/woff2;base64,${readFileSync(fontFile(subset.name, weight, "woff2")).toString("base64")}) format("woff2");` +
          `unicode-range:${subset.unicodeRange};}`,
      ),
    )
    .join("");
  return cachedCss;
}

let cachedSfntFiles: string[] | undefined;

/**
 * The bundled font as sfnt (TrueType/OpenType) files for resvg, which reads no WOFF: converted once
 * per process into a versioned folder under the system temporary directory.
 */
export function bundledSfntFiles(): string[] {
  if (cachedSfntFiles) return cachedSfntFiles;
  const folder = join(tmpdir(), `arcwright-fonts-${PRODUCT_VERSION}`);
  mkdirSync(folder, { recursive: true });
  const files = weights.flatMap((weight) =>
    subsets.map((subset) => {
      const path = join(folder, `source-sans-3-${subset.name}-${weight}.otf`);
      if (!existsSync(path)) writeFileSync(path, woffConverter.toSfnt(readFileSync(fontFile(subset.name, weight, "woff"))));
      return path;
    }),
  );
  cachedSfntFiles = existsSync(FALLBACK_FONT_FILE) ? [...files, FALLBACK_FONT_FILE] : files;
  return cachedSfntFiles;
}

/** A subset (Latin unless named) as WOFF for pdfkit (fontkit reads WOFF), at a weight. */
export function bundledPdfFont(weight: (typeof weights)[number], subset: BundledSubset = "latin"): Buffer {
  return readFileSync(fontFile(subset, weight, "woff"));
}
