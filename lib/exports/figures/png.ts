import "server-only";
import type { Resvg as ResvgClass } from "@resvg/resvg-js";
import { nodeRequire } from "./node-require";
import { physicalSizeChunk, provenanceChunks, withPngChunks } from "@/lib/exports/png-text";
import type { Provenance } from "@/lib/exports/provenance";
import { BUNDLED_FONT_FAMILY, bundledSfntFiles } from "./bundled-font";
import { resvgSvg } from "./resvg-text";
import type { SvgFigure } from "./svg-document";

/** Kept in a value so the bundler does not try to place resvg's native addon. */
export const RESVG_PACKAGE = ["@resvg", "resvg-js"].join("/");

/**
 * Renders a figure to PNG with resvg at `widthPx` (height in proportion), drawing text in the bundled
 * Source Sans 3 (Noto Sans Math for the symbols it lacks), and writes the DPI into
 * pHYs and the provenance into tEXt (Title, Software, Creation Time, Source, Comment) and one iTXt
 * chunk with the whole record as JSON.
 */
export function figurePng(figure: SvgFigure, { widthPx, dpi, title, provenance }: { widthPx: number; dpi: number; title: string; provenance: Provenance }): Uint8Array {
  const { Resvg } = nodeRequire<{ Resvg: typeof ResvgClass }>(RESVG_PACKAGE);
  const rendered = new Resvg(resvgSvg(figure.svg), {
    fitTo: { mode: "width", value: widthPx },
    font: { loadSystemFonts: false, fontFiles: bundledSfntFiles(), defaultFontFamily: BUNDLED_FONT_FAMILY, sansSerifFamily: BUNDLED_FONT_FAMILY },
    background: undefined,
  }).render();
  return withPngChunks(rendered.asPng(), [physicalSizeChunk(dpi), ...provenanceChunks(title, provenance)], ["pHYs"]);
}
