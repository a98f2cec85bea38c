import "server-only";
import type { Resvg as ResvgClass } from "@resvg/resvg-js";
import { nodeRequire } from "./node-require";
import extractChunks from "png-chunks-extract";
import encodeChunks from "png-chunks-encode";
import { encode as encodeText } from "png-chunk-text";
import { provenanceLines, type Provenance } from "@/lib/exports/provenance";
import { BUNDLED_FONT_FAMILY, bundledSfntFiles } from "./bundled-font";
import type { SvgFigure } from "./svg-document";

/** Keyword of the iTXt chunk that holds the provenance as JSON (PNG 3rd ed. §11.3.3.4: 1–79 Latin-1 bytes). */
export const PNG_PROVENANCE_KEYWORD = "arcwright:provenance";

/** Kept in a value so the bundler does not try to place resvg's native addon. */
export const RESVG_PACKAGE = ["@resvg", "resvg-js"].join("/");

const METRES_PER_INCH = 0.0254;

/** An iTXt chunk, uncompressed, no language tag (PNG 3rd ed. §11.3.3.4), for UTF-8 text. */
function internationalText(keyword: string, text: string): { name: string; data: Uint8Array } {
  const head = Buffer.from(`${keyword}\0\0\0\0\0`, "latin1");
  return { name: "iTXt", data: Buffer.concat([head, Buffer.from(text, "utf8")]) };
}

/** pHYs: pixels per metre on both axes, unit metre (PNG 3rd ed. §11.3.5.3), so the DPI travels with the file. */
function physicalSize(dpi: number): { name: string; data: Uint8Array } {
  const data = Buffer.alloc(9);
  const pixelsPerMetre = Math.round(dpi / METRES_PER_INCH);
  data.writeUInt32BE(pixelsPerMetre, 0);
  data.writeUInt32BE(pixelsPerMetre, 4);
  data.writeUInt8(1, 8);
  return { name: "pHYs", data };
}

/** Latin-1 only, as tEXt requires: other characters become "?" (the iTXt copy keeps them). */
const latin1 = (text: string) => text.replace(/[^\x20-\x7E\xA0-\xFF\n]/g, "?");

/**
 * Renders a figure to PNG with resvg at `widthPx` (height in proportion), drawing text in the bundled
 * Source Sans 3 (a system DejaVu Sans only for the few symbols it lacks), and writes the DPI into
 * pHYs and the provenance into tEXt (Title, Software, Creation Time, Source, Comment) and one iTXt
 * chunk with the whole record as JSON.
 */
export function figurePng(figure: SvgFigure, { widthPx, dpi, title, provenance }: { widthPx: number; dpi: number; title: string; provenance: Provenance }): Uint8Array {
  const { Resvg } = nodeRequire<{ Resvg: typeof ResvgClass }>(RESVG_PACKAGE);
  const rendered = new Resvg(figure.svg, {
    fitTo: { mode: "width", value: widthPx },
    font: { loadSystemFonts: false, fontFiles: bundledSfntFiles(), defaultFontFamily: BUNDLED_FONT_FAMILY, sansSerifFamily: BUNDLED_FONT_FAMILY },
    background: undefined,
  }).render();
  const chunks = extractChunks(rendered.asPng());
  const metadata = [
    physicalSize(dpi),
    encodeText("Title", latin1(title)),
    encodeText("Software", `${provenance.product} ${provenance.version}`),
    encodeText("Creation Time", provenance.exportedAt),
    encodeText("Source", provenance.reproduceUrl),
    encodeText("Comment", latin1(provenanceLines(provenance).join("\n"))),
    internationalText(PNG_PROVENANCE_KEYWORD, JSON.stringify(provenance)),
  ];
  const withoutPhys = chunks.filter((chunk) => chunk.name !== "pHYs");
  return encodeChunks([withoutPhys[0], ...metadata, ...withoutPhys.slice(1)]);
}
