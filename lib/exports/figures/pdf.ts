/// <reference types="pdfkit" />
import "server-only";
import type { Resvg as ResvgClass } from "@resvg/resvg-js";
import type PDFDocumentClass from "pdfkit";
import type SVGtoPDFFunction from "svg-to-pdfkit";
import { nodeRequire } from "./node-require";
import { RESVG_PACKAGE } from "./png";
import type { Provenance } from "@/lib/exports/provenance";
import { BUNDLED_FONT_FAMILY, bundledPdfFaces, bundledSfntFiles, bundledWeights, PDF_FONT, PDF_FONT_SEMIBOLD, type BundledWeight } from "./bundled-font";
import { resvgSvg } from "./resvg-text";
import { raisedPowerParts } from "@/lib/physics/quantity-vocabulary";
import type { SvgFigure } from "./svg-document";

export { PDF_FONT, PDF_FONT_SEMIBOLD };

/** CSS pixels to PDF points (1 px = 1/96 in, 1 pt = 1/72 in). */
export const POINTS_PER_PX = 0.75;

/**
 * The figure's SVG with every glyph of its labels as outlines of the bundled fonts, laid out by resvg
 * exactly as in the PNG: svg-to-pdfkit then needs no font of its own for the plot, and characters
 * outside Source Sans 3's Latin subset (α, θ, ∝, √) are drawn from the face that has them.
 */
export function outlinedSvg(figure: SvgFigure): string {
  const { Resvg } = nodeRequire<{ Resvg: typeof ResvgClass }>(RESVG_PACKAGE);
  return new Resvg(resvgSvg(figure.svg), {
    font: { loadSystemFonts: false, fontFiles: bundledSfntFiles(), defaultFontFamily: BUNDLED_FONT_FAMILY, sansSerifFamily: BUNDLED_FONT_FAMILY },
  }).toString();
}

/**
 * A new pdfkit document, without a page yet (pages added, and the flow's page breaks, take `size` and
 * `margin` in pt), with the bundled faces registered and the provenance in
 * the info dictionary (ISO 32000-1 §14.3.3): Author is the person who exported it (left out when
 * nobody is signed in), Creator and Producer the software.
 */
export function provenancePdf(provenance: Provenance, title: string, { author, size = "A4", margin = 56 }: { author?: string; size?: string | [number, number]; margin?: number } = {}): PDFKit.PDFDocument {
  const PDFDocument = nodeRequire<typeof PDFDocumentClass>(["pdf", "kit"].join(""));
  const software = `${provenance.product} ${provenance.version}`;
  const doc = new PDFDocument({
    autoFirstPage: false,
    size,
    margin,
    font: bundledPdfFaces(400)[0].data as unknown as string,
    info: {
      Title: title,
      ...(author === undefined || author.trim() === "" ? {} : { Author: author }),
      Subject: provenance.subject,
      Keywords: `provenance; ${provenance.reproduceUrl}`,
      Creator: software,
      Producer: `${software} (pdfkit)`,
      CreationDate: new Date(provenance.exportedAt),
    },
  });
  // Custom keys of the info dictionary are allowed (ISO 32000-1 §14.3.3) and read by pdf-parse and exiftool.
  Object.assign(doc.info, { ArcwrightProvenance: JSON.stringify(provenance), ArcwrightReproduce: provenance.reproduceUrl });
  for (const weight of bundledWeights) for (const face of bundledPdfFaces(weight)) doc.registerFont(face.name, face.data);
  return doc;
}

/**
 * A text cut into runs that one registered face each can draw: the first of Source Sans 3 Latin,
 * Latin Extended (ń, Ś), Greek (θ, Ω) and Noto Sans Math (☉, √, ∝) that has the glyph; a character
 * none has stays in the text face (its missing-glyph box, not dropped). pdfkit draws a text in a
 * single font, and a glyph its font lacks would be lost.
 */
export function pdfTextRuns(text: string, weight: BundledWeight): PdfTextRun[] {
  const faces = bundledPdfFaces(weight);
  const runs: PdfTextRun[] = [];
  for (const { text: partText, isRaised } of raisedPowerParts(text)) {
    for (const character of partText) {
      const codePoint = character.codePointAt(0)!;
      const face = faces.find((each) => each.hasGlyph(codePoint)) ?? faces[0];
      const last = runs.at(-1);
      if (last?.font === face.name && last.isRaised === isRaised) last.text += character;
      else runs.push({ font: face.name, text: character, isRaised, ascentEm: face.ascentEm });
    }
  }
  return runs;
}

/** One run of a PDF text: drawn in one face, on the line or raised as a superscript. */
export interface PdfTextRun {
  font: string;
  text: string;
  /** A superscript ("10⁻⁷"'s "−7"), drawn in smaller type above the baseline. */
  isRaised: boolean;
  /** The face's ascent, em. */
  ascentEm: number;
}

/**
 * Powers are drawn as their characters on the line (`raisedPowerParts`) in smaller raised type:
 * none of the bundled faces has U+2070–U+207F (Google's subsets keep only ⁴), and a "10⁻⁷" printed
 * as "10" would misstate a number by orders of magnitude. The size and raise are the figures' own
 * (plot-text.ts).
 */
const SUPERSCRIPT_SCALE = 0.72;
const SUPERSCRIPT_RAISE_EM = 0.38;

/**
 * Writes a text at the current size, each run in the face that has its glyphs: in the flow, or from
 * `at` (a table cell); `continued` as in pdfkit.
 */
export function writePdfText(
  doc: PDFKit.PDFDocument,
  text: string,
  weight: BundledWeight,
  options: PDFKit.Mixins.TextOptions & { continued?: boolean } = {},
  at?: { x: number; y: number },
): void {
  const runs = pdfTextRuns(text, weight);
  // pdfkit keeps the current size privately; the callers set it before writing.
  const sizePt = (doc as unknown as { _fontSize: number })._fontSize;
  runs.forEach((run, index) => {
    const runOptions = { ...options, continued: index < runs.length - 1 || options.continued === true };
    // pdfkit places a run's top (its face's ascent) at the line's y, or offsets it by a numeric
    // `baseline`: a raised run's baseline sits SUPERSCRIPT_RAISE_EM above the line's.
    if (run.isRaised) Object.assign(runOptions, { baseline: SUPERSCRIPT_RAISE_EM * sizePt - run.ascentEm * sizePt });
    doc.font(run.font).fontSize(run.isRaised ? sizePt * SUPERSCRIPT_SCALE : sizePt);
    if (index === 0 && at !== undefined) doc.text(run.text, at.x, at.y, runOptions);
    else doc.text(run.text, runOptions);
  });
  doc.fontSize(sizePt);
}

/** The width of a text at the current size, measured run by run in the faces that draw it (pt). */
function runsWidthPt(doc: PDFKit.PDFDocument, text: string, weight: BundledWeight): number {
  return pdfTextRuns(text, weight).reduce((sum, run) => sum + doc.font(run.font).widthOfString(run.text) * (run.isRaised ? SUPERSCRIPT_SCALE : 1), 0);
}

/**
 * A text broken into lines no wider than `widthPt` at the current size: at spaces, and a word longer
 * than a line (a link) after one of / ? & = where it can be, else anywhere; nothing is cut off.
 */
export function pdfTextLines(doc: PDFKit.PDFDocument, text: string, weight: BundledWeight, widthPt: number): string[] {
  const fits = (line: string) => runsWidthPt(doc, line, weight) <= widthPt;
  const lines: string[] = [];
  let line = "";
  for (const word of text.split(" ")) {
    const joined = line === "" ? word : `${line} ${word}`;
    if (fits(joined)) {
      line = joined;
      continue;
    }
    if (line !== "") lines.push(line);
    line = "";
    let rest = word;
    while (!fits(rest)) {
      // The longest head that fits, by bisection (each width is a shaping pass).
      let [low, high] = [1, rest.length - 1];
      while (low < high) {
        const middle = Math.ceil((low + high) / 2);
        if (fits(rest.slice(0, middle))) low = middle;
        else high = middle - 1;
      }
      let cut = low;
      const breakAfter = Math.max(...["/", "?", "&", "="].map((mark) => rest.lastIndexOf(mark, cut - 1)));
      if (breakAfter > cut / 2) cut = breakAfter + 1;
      lines.push(rest.slice(0, cut));
      rest = rest.slice(cut);
    }
    line = rest;
  }
  if (line !== "") lines.push(line);
  return lines;
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

/** Draws a figure at (x, y) `widthPt` wide and returns its height in points. */
export function drawFigure(doc: PDFKit.PDFDocument, figure: SvgFigure, x: number, y: number, widthPt: number): number {
  const heightPt = (widthPt * figure.heightPx) / figure.widthPx;
  const SVGtoPDF = nodeRequire<typeof SVGtoPDFFunction>(["svg-to-", "pdfkit"].join(""));
  SVGtoPDF(doc, outlinedSvg(figure), x, y, { width: widthPt, height: heightPt, assumePt: false, preserveAspectRatio: "xMidYMid meet" });
  return heightPt;
}

const CAPTION_MARGIN_PT = 6;
const CAPTION_TITLE_PT = 8;
const CAPTION_TEXT_PT = 6.5;
const CAPTION_LEADING = 1.25;

/**
 * One figure as a vector PDF page of the figure's own size (px → pt) with a caption below in the
 * embedded fonts naming the figure, the export and the whole reproduce link (wrapped onto as many
 * lines as it takes, and a link annotation over it), so the caption is also extractable text.
 */
export async function figurePdf(figure: SvgFigure, { title, provenance, author }: { title: string; provenance: Provenance; author?: string }): Promise<Uint8Array> {
  const widthPt = figure.widthPx * POINTS_PER_PX;
  const heightPt = figure.heightPx * POINTS_PER_PX;
  const textWidthPt = widthPt - 2 * CAPTION_MARGIN_PT;
  const doc = provenancePdf(provenance, title, { author, margin: 0 });
  const titleLines = pdfTextLines(doc.fontSize(CAPTION_TITLE_PT), title, 600, textWidthPt);
  const noteLines = pdfTextLines(doc.fontSize(CAPTION_TEXT_PT), `${provenance.product} ${provenance.version}, exported ${provenance.exportedAt}. Reproduce:`, 400, textWidthPt);
  const linkLines = pdfTextLines(doc, provenance.reproduceUrl, 400, textWidthPt);
  const titleLinePt = CAPTION_TITLE_PT * CAPTION_LEADING;
  const textLinePt = CAPTION_TEXT_PT * CAPTION_LEADING;
  const captionPt = 2 * CAPTION_MARGIN_PT + titleLines.length * titleLinePt + (noteLines.length + linkLines.length) * textLinePt;
  doc.addPage({ size: [widthPt, heightPt + captionPt], margin: 0 });
  drawFigure(doc, figure, 0, 0, widthPt);
  doc.rect(0, heightPt, widthPt, captionPt).fill("#ffffff");
  doc.fillColor("#000000");
  let y = heightPt + CAPTION_MARGIN_PT;
  doc.fontSize(CAPTION_TITLE_PT);
  for (const line of titleLines) {
    writePdfText(doc, line, 600, { lineBreak: false }, { x: CAPTION_MARGIN_PT, y });
    y += titleLinePt;
  }
  doc.fontSize(CAPTION_TEXT_PT);
  for (const line of noteLines) {
    writePdfText(doc, line, 400, { lineBreak: false }, { x: CAPTION_MARGIN_PT, y });
    y += textLinePt;
  }
  const linkTop = y;
  for (const line of linkLines) {
    writePdfText(doc, line, 400, { lineBreak: false }, { x: CAPTION_MARGIN_PT, y });
    y += textLinePt;
  }
  doc.link(CAPTION_MARGIN_PT, linkTop, textWidthPt, y - linkTop, provenance.reproduceUrl);
  return pdfBytes(doc);
}
