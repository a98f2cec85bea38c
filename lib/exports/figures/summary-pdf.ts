import "server-only";
import { provenanceLines, type Provenance } from "@/lib/exports/provenance";
import { timeRequestOf, timeRequestSentence } from "@/lib/workspace/time-request";
import { summaryCaseOf } from "@/lib/exports/case-summary";
import { cellOf, cellTextForPeople, headerOf } from "@/lib/exports/tables/columns";
import type { TargetTable } from "@/lib/exports/tables/table";
import type { PlotExport } from "./figure-response";
import { drawFigure, PDF_FONT, PDF_FONT_SEMIBOLD, pdfBytes, provenancePdf, writePdfText } from "./pdf";
import { standaloneSvg } from "./svg-document";

/** Rows of the table printed in the summary; the full list is in the table exports. */
export const SUMMARY_MAX_ROWS = 200;

/**
 * The proposal's technical summary as an A4 PDF (pdfkit, Source Sans 3 embedded): the target table
 * with the chosen columns, each target's science case answered in sentences (verdict, number, source),
 * then each chosen figure on its own page, then the provenance of each part. `author`, the person
 * exporting it, becomes the PDF's Author.
 */
export async function technicalSummaryPdf(table: TargetTable, figures: PlotExport[], provenance: Provenance, { author }: { author?: string } = {}): Promise<Uint8Array> {
  const doc = provenancePdf(provenance, `Technical summary: ${table.title}`, { author });
  doc.addPage();
  const width = doc.page.width - 2 * doc.page.margins.left;
  doc.fontSize(16).fillColor("#000000");
  writePdfText(doc, `Technical summary: ${table.title}`, 600);
  doc.moveDown(0.5).fontSize(9);
  writePdfText(doc, provenance.subject, 400);
  doc.moveDown(0.3);
  writePdfText(doc, `Time requested: ${timeRequestSentence(timeRequestOf(table.rows))}.`, 400, { width });
  doc.moveDown();
  const columnWidth = width / table.columns.length;
  const drawRow = (cells: string[], isHeader: boolean) => {
    const y = doc.y;
    doc.font(isHeader ? PDF_FONT_SEMIBOLD : PDF_FONT).fontSize(7);
    const heights = cells.map((cell, i) => doc.heightOfString(cell, { width: columnWidth - 4 }));
    if (y + Math.max(...heights) > doc.page.height - doc.page.margins.bottom) doc.addPage();
    const top = doc.y;
    cells.forEach((cell, i) => writePdfText(doc, cell, isHeader ? 600 : 400, { width: columnWidth - 4 }, { x: doc.page.margins.left + i * columnWidth, y: top }));
    doc.x = doc.page.margins.left;
    doc.y = top + Math.max(...heights) + 3;
    doc.moveTo(doc.page.margins.left, doc.y - 1.5).lineTo(doc.page.margins.left + width, doc.y - 1.5).lineWidth(0.3).stroke("#888888");
  };
  drawRow(table.columns.map(({ column }) => headerOf(column)), true);
  for (const row of table.rows.slice(0, SUMMARY_MAX_ROWS)) drawRow(table.columns.map((chosen) => cellTextForPeople(cellOf(row, chosen.column), chosen) || "–"), false);
  if (table.rows.length > SUMMARY_MAX_ROWS) doc.moveDown().text(`${table.rows.length - SUMMARY_MAX_ROWS} more targets are in the table exports.`);
  doc.x = doc.page.margins.left;
  doc.moveDown().font(PDF_FONT_SEMIBOLD).fontSize(11).text("Science cases", { width });
  // The answers speak in θ_E, λ/B, Δt and name authors such as Paczyński: written in runs per font.
  for (const target of table.rows.slice(0, SUMMARY_MAX_ROWS).map(summaryCaseOf)) {
    doc.moveDown(0.6).fontSize(9);
    writePdfText(doc, target.targetName, 600, { width });
    doc.fontSize(8);
    writePdfText(doc, target.caseText, 400, { width });
    for (const answer of target.answers) {
      doc.moveDown(0.2).fontSize(7.5);
      writePdfText(doc, `${answer.question}: ${answer.verdictText}. `, 600, { width, continued: true });
      writePdfText(doc, `${answer.sentence} Rule: ${answer.source}`, 400, { width });
    }
  }
  for (const plot of figures) {
    doc.addPage();
    doc.fontSize(11);
    writePdfText(doc, plot.title, 600, { width });
    doc.moveDown(0.5);
    const height = drawFigure(doc, standaloneSvg(plot.markup, { title: plot.title, provenance: plot.provenance }), doc.page.margins.left, doc.y, width);
    doc.y += height + 8;
    doc.font(PDF_FONT).fontSize(7).text("Reproduce: ", doc.page.margins.left, doc.y, { width, continued: true });
    doc.text(plot.provenance.reproduceUrl, { width, link: plot.provenance.reproduceUrl });
  }
  doc.addPage();
  doc.font(PDF_FONT_SEMIBOLD).fontSize(11).text("Provenance");
  for (const record of [table.provenance, ...figures.map((f) => f.provenance)]) {
    doc.moveDown().fontSize(7);
    writePdfText(doc, provenanceLines(record).join("\n"), 400, { width });
  }
  return pdfBytes(doc);
}
