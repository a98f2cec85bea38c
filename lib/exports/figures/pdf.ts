/// <reference types="pdfkit" />
import "server-only";
import type { Resvg as ResvgClass } from "@resvg/resvg-js";
import type PDFDocumentClass from "pdfkit";
import type SVGtoPDFFunction from "svg-to-pdfkit";
import { nodeRequire } from "./node-require";
import { RESVG_PACKAGE } from "./png";
import type { Provenance } from "@/lib/exports/provenance";
import { existsSync } from "node:fs";
import { BUNDLED_FONT_FAMILY, bundledPdfFont, bundledSfntFiles, bundledSubsets, FALLBACK_FONT_FILE, subsetHolds, type BundledSubset } from "./bundled-font";
import type { SvgFigure } from "./svg-document";

/** CSS pixels to PDF points (1 px = 1/96 in, 1 pt = 1/72 in). */
export const POINTS_PER_PX = 0.75;

export const PDF_FONT = "SourceSans3";
export const PDF_FONT_SEMIBOLD = "SourceSans3-Semibold";

type PdfWeight = 400 | 600;
const baseFontName: Record<PdfWeight, string> = { 400: PDF_FONT, 600: PDF_FONT_SEMIBOLD };
/** The registered name of a bundled subset at a weight; the Latin ones keep the names above. */
const subsetFontName = (weight: PdfWeight, subset: BundledSubset) => (subset === "latin" ? baseFontName[weight] : `${baseFontName[weight]}-${subset}`);
const FALLBACK_PDF_FONT = "Fallback";

/**
 * The figure's SVG with every glyph of its labels as outlines of the bundled font, laid out by resvg
 * exactly as in the PNG: svg-to-pdfkit then needs no font of its own for the plot, and characters
 * outside the font's Latin subset (α, θ) are drawn from the right subset file.
 */
export function outlinedSvg(figure: SvgFigure): string {
  const { Resvg } = nodeRequire<{ Resvg: typeof ResvgClass }>(RESVG_PACKAGE);
  return new Resvg(figure.svg, {
    font: { loadSystemFonts: false, fontFiles: bundledSfntFiles(), defaultFontFamily: BUNDLED_FONT_FAMILY, sansSerifFamily: BUNDLED_FONT_FAMILY },
  }).toString();
}

/** A new pdfkit document with the bundled font registered and the provenance in the info dictionary (ISO 32000-1 §14.3.3). */
export function provenancePdf(provenance: Provenance, title: string, size?: [number, number]): PDFKit.PDFDocument {
  const PDFDocument = nodeRequire<typeof PDFDocumentClass>(["pdf", "kit"].join(""));
  const doc = new PDFDocument({
    size: size ?? "A4",
    margin: size ? 0 : 56,
    font: bundledPdfFont(400) as unknown as string,
    info: {
      Title: title,
      Author: `${provenance.product} ${provenance.version}`,
      Subject: provenance.subject,
      Keywords: `provenance; ${provenance.reproduceUrl}`,
      Creator: `${provenance.product} ${provenance.version}`,
      Producer: `${provenance.product} ${provenance.version} (pdfkit)`,
      CreationDate: new Date(provenance.exportedAt),
    },
  });
  // Custom keys of the info dictionary are allowed (ISO 32000-1 §14.3.3) and read by pdf-parse and exiftool.
  Object.assign(doc.info, { ArcwrightProvenance: JSON.stringify(provenance), ArcwrightReproduce: provenance.reproduceUrl });
  for (const weight of [400, 600] as const) for (const subset of bundledSubsets) doc.registerFont(subsetFontName(weight, subset), bundledPdfFont(weight, subset));
  if (existsSync(FALLBACK_FONT_FILE)) doc.registerFont(FALLBACK_PDF_FONT, FALLBACK_FONT_FILE);
  return doc;
}

/**
 * A text cut into runs that one registered font each can draw: the Latin subset, else the Latin
 * extension (ń), else Greek (θ, λ, Δ), else the system fallback face (☉, ≥, √) when it is installed.
 * pdfkit draws a text in a single font, and a glyph its font lacks would be lost.
 */
export function pdfTextRuns(text: string, weight: PdfWeight, hasFallback = existsSync(FALLBACK_FONT_FILE)): { font: string; text: string }[] {
  const runs: { font: string; text: string }[] = [];
  for (const character of text) {
    const codePoint = character.codePointAt(0)!;
    const subset = bundledSubsets.find((s) => subsetHolds(s, codePoint));
    const font = subset !== undefined ? subsetFontName(weight, subset) : hasFallback ? FALLBACK_PDF_FONT : baseFontName[weight];
    const last = runs.at(-1);
    if (last?.font === font) last.text += character;
    else runs.push({ font, text: character });
  }
  return runs;
}

/**
 * Writes a text at the current size, each run in the font that has its glyphs: in the flow, or from
 * `at` (a table cell); `continued` as in pdfkit.
 */
export function writePdfText(
  doc: PDFKit.PDFDocument,
  text: string,
  weight: PdfWeight,
  options: PDFKit.Mixins.TextOptions & { continued?: boolean } = {},
  at?: { x: number; y: number },
): void {
  const runs = pdfTextRuns(text, weight);
  runs.forEach((run, index) => {
    const runOptions = { ...options, continued: index < runs.length - 1 || options.continued === true };
    doc.font(run.font);
    if (index === 0 && at !== undefined) doc.text(run.text, at.x, at.y, runOptions);
    else doc.text(run.text, runOptions);
  });
}

/** Collects a finished pdfkit document into bytes. */
export function pdfBytes(doc: PDFKit.PDFDocument): Promise<Uint8Array> {
  return new Promise((resolve, reject) => {
    const parts: Buffer[] = [];
    doc.on("data", (part: Buffer) => parts.push(part));
    doc.on("end", () => resolve(Buffer.concat(parts)));
    doc.on("error", reject);
    doc.end();
  });
}

const CAPTION_HEIGHT_PT = 34;

/** Draws a figure at (x, y) `widthPt` wide and returns its height in points. */
export function drawFigure(doc: PDFKit.PDFDocument, figure: SvgFigure, x: number, y: number, widthPt: number): number {
  const heightPt = (widthPt * figure.heightPx) / figure.widthPx;
  const SVGtoPDF = nodeRequire<typeof SVGtoPDFFunction>(["svg-to-", "pdfkit"].join(""));
  SVGtoPDF(doc, outlinedSvg(figure), x, y, { width: widthPt, height: heightPt, assumePt: false, preserveAspectRatio: "xMidYMid meet" });
  return heightPt;
}

/**
 * One figure as a vector PDF page of the figure's own size (px → pt) with a caption band below in the
 * embedded Source Sans 3 naming the figure and how to reproduce it (so it is also extractable text).
 */
export async function figurePdf(figure: SvgFigure, { title, provenance }: { title: string; provenance: Provenance }): Promise<Uint8Array> {
  const widthPt = figure.widthPx * POINTS_PER_PX;
  const heightPt = figure.heightPx * POINTS_PER_PX;
  const doc = provenancePdf(provenance, title, [widthPt, heightPt + CAPTION_HEIGHT_PT]);
  drawFigure(doc, figure, 0, 0, widthPt);
  doc.rect(0, heightPt, widthPt, CAPTION_HEIGHT_PT).fill("#ffffff");
  doc.fillColor("#000000").font(PDF_FONT_SEMIBOLD).fontSize(8).text(title, 6, heightPt + 5, { width: widthPt - 12, lineBreak: false });
  doc
    .font(PDF_FONT)
    .fontSize(6.5)
    .text(`${provenance.product} ${provenance.version}, exported ${provenance.exportedAt}. Reproduce: ${provenance.reproduceUrl}`, 6, heightPt + 16, { width: widthPt - 12, height: CAPTION_HEIGHT_PT - 18, ellipsis: true });
  return pdfBytes(doc);
}
