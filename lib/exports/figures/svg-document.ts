import type { Provenance } from "@/lib/exports/provenance";
import { escapeXml } from "@/lib/exports/tables/xml";

/** Namespace of the provenance element inside an exported SVG's <metadata>. */
export const PROVENANCE_NAMESPACE = "https://arcwright.invalid/ns/provenance/1";

export interface SvgFigure {
  /** The finished, self-contained SVG document. */
  svg: string;
  widthPx: number;
  heightPx: number;
}

/**
 * Turns a plot's SVG markup into a standalone figure: a pixel size from its viewBox (the on-screen
 * charts are drawn at width 100%), an XML declaration, a <title>, the provenance as JSON inside
 * <metadata>, and optional @font-face rules so the font travels with the file.
 */
export function standaloneSvg(markup: string, { title, provenance, fontFaceCss }: { title: string; provenance: Provenance; fontFaceCss?: string }): SvgFigure {
  const open = /^<svg\b[^>]*>/.exec(markup);
  if (!open) throw new Error("A plot must render one <svg> root element.");
  const viewBox = /viewBox="0 0 ([\d.]+) ([\d.]+)"/.exec(open[0]);
  if (!viewBox) throw new Error("A plot's <svg> must have a viewBox of the form 0 0 w h.");
  const widthPx = Number(viewBox[1]);
  const heightPx = Number(viewBox[2]);
  const root = open[0]
    .replace(/\s(width|height)="[^"]*"/g, "")
    .replace(/\sdata-[a-z-]+="[^"]*"/g, "")
    .replace(/^<svg/, `<svg width="${widthPx}" height="${heightPx}"`);
  const head = [
    `<title>${escapeXml(title)}</title>`,
    `<metadata><arcwright:provenance xmlns:arcwright="${PROVENANCE_NAMESPACE}">${escapeXml(JSON.stringify(provenance))}</arcwright:provenance></metadata>`,
    fontFaceCss === undefined ? "" : `<style>${fontFaceCss}</style>`,
  ].join("");
  const svg = `<?xml version="1.0" encoding="UTF-8"?>\n${root}${head}${markup.slice(open[0].length)}\n`;
  return { svg, widthPx, heightPx };
}
