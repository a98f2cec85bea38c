import "server-only";
import { attachmentHeaders, fileSlug, tableDownload } from "@/lib/exports/download";
import { figureDataFile } from "@/lib/exports/figure-data/write";
import { isFigureDataFormat } from "@/lib/exports/figure-data/formats";
import type { Provenance } from "@/lib/exports/provenance";
import type { DataTable } from "@/lib/exports/tables/data-table";
import { bundledFontFaceCss } from "./bundled-font";
import type { FigureFormatQuery } from "./figure-format";
import { figurePdf } from "./pdf";
import { figurePng } from "./png";
import { standaloneSvg } from "./svg-document";

/** A rendered plot ready to export: its SVG markup, a title and file stem, its provenance and the table of what it draws. */
export interface PlotExport {
  markup: string;
  title: string;
  fileStem: string;
  provenance: Provenance;
  data: DataTable;
}

/**
 * The download of one plot in the requested format (SVG with the fonts inlined, PNG, or PDF), or of
 * the data it draws (CSV, ECSV, VOTable; a plain CSV, which holds no provenance, carries the time of
 * export in its name and the record in the provenance header, as the table exports do);
 * `author`, the signed-in person exporting it, becomes the PDF's Author.
 */
export async function figureResponse(plot: PlotExport, query: FigureFormatQuery, { author }: { author?: string } = {}): Promise<Response> {
  if (isFigureDataFormat(query.format)) {
    const file = figureDataFile(plot.data, query.format);
    return tableDownload(file.text, { fileStem: `${fileSlug(plot.fileStem)}-data`, file, provenance: plot.provenance });
  }
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
