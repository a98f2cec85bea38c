import "server-only";
import { attachmentHeaders, fileSlug } from "@/lib/exports/download";
import type { Provenance } from "@/lib/exports/provenance";
import { bundledFontFaceCss } from "./bundled-font";
import type { FigureFormatQuery } from "./figure-format";
import { figurePdf } from "./pdf";
import { figurePng } from "./png";
import { standaloneSvg } from "./svg-document";

/** A rendered plot ready to export: its SVG markup, a title and file stem, and its provenance. */
export interface PlotExport {
  markup: string;
  title: string;
  fileStem: string;
  provenance: Provenance;
}

/**
 * The download of one plot in the requested format (SVG with the fonts inlined, PNG, or PDF);
 * `author`, the signed-in person exporting it, becomes the PDF's Author.
 */
export async function figureResponse(plot: PlotExport, query: FigureFormatQuery, { author }: { author?: string } = {}): Promise<Response> {
  const fileName = `${fileSlug(plot.fileStem)}.${query.format}`;
  if (query.format === "svg") {
    const { svg } = standaloneSvg(plot.markup, { title: plot.title, provenance: plot.provenance, fontFaceCss: bundledFontFaceCss(plot.markup) });
    return new Response(svg, { headers: attachmentHeaders(fileName, "image/svg+xml; charset=utf-8") });
  }
  // Raster and PDF are laid out by resvg from the same SVG, with the font loaded from files instead.
  const figure = standaloneSvg(plot.markup, { title: plot.title, provenance: plot.provenance });
  if (query.format === "png") {
    const png = figurePng(figure, { widthPx: query.width, dpi: query.dpi, title: plot.title, provenance: plot.provenance });
    return new Response(Buffer.from(png), { headers: attachmentHeaders(fileName, "image/png") });
  }
  const pdf = await figurePdf(figure, { title: plot.title, provenance: plot.provenance, author });
  return new Response(Buffer.from(pdf), { headers: attachmentHeaders(fileName, "application/pdf") });
}
