import "server-only";
import type { Resvg as ResvgClass } from "@resvg/resvg-js";
import { nodeRequire } from "./node-require";
import { provenanceChunks, withPngChunks } from "@/lib/exports/png-text";
import type { Provenance } from "@/lib/exports/provenance";
import { BUNDLED_FONT_FAMILY, bundledSfntFiles } from "./bundled-font";
import { resvgSvg } from "./resvg-text";
import type { SvgFigure } from "./svg-document";

/** Kept in a value so the bundler does not try to place resvg's native addon. */
export const RESVG_PACKAGE = ["@resvg", "resvg-js"].join("/");

const METRES_PER_INCH = 0.0254;

/** pHYs: pixels per metre on both axes, unit metre (PNG 3rd ed. §11.3.5.3), so the DPI travels with the file. */
function physicalSize(dpi: number): { name: string; data: Uint8Array } {
  const data = Buffer.alloc(9);
  const pixelsPerMetre = Math.round(dpi / METRES_PER_INCH);
  data.writeUInt32BE(pixelsPerMetre, 0);
  data.writeUInt32BE(pixelsPerMetre, 4);
  data.writeUInt8(1, 8);
  return { name: "pHYs", data };
}

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
  return withPngChunks(rendered.asPng(), [physicalSize(dpi), ...provenanceChunks(title, provenance)], ["pHYs"]);
}
