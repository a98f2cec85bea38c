import type { Metadata } from "next";
import Link from "next/link";
import { NightFigureDownloads, SeasonFigureDownloads } from "@/components/exports/sky-figure-downloads";
import { TableDownloads } from "@/components/exports/table-downloads";
import { verdictClass } from "@/components/shared/format";
import { summaryCaseOf } from "@/lib/exports/case-summary";
import { cellOf, cellText, headerOf } from "@/lib/exports/tables/columns";
import { provenanceLines } from "@/lib/exports/provenance";
import { loadTargetTable } from "@/lib/server/exports/target-table";
import { loadForPage } from "@/lib/server/page-access";
import { timeRequestOf, timeRequestSentence } from "@/lib/workspace/time-request";
import { SummaryPdfDownload } from "@/components/exports/summary-pdf-download";

export const metadata: Metadata = { title: "Technical summary" };

/**
 * A proposal's technical summary (the target table, then each target's science case answered in
 * sentences with their verdicts, numbers and sources), printable (white paper, black text, controls hidden, the table
 * kept whole where it fits) and downloadable as a PDF built on the server; any member may open it.
 */
export default async function SummaryPage({ params }: { params: Promise<{ proposalId: string }> }) {
  const { proposalId } = await params;
  const { table } = await loadForPage(`/proposals/${proposalId}/summary`, (actor) => loadTargetTable({ proposalId }, { format: "json" }, actor));
  const today = new Date().toISOString().slice(0, 10);
  return (
    <article className="summary-sheet space-y-6">
      <style>{`@media print {
  @page { size: A4; margin: 16mm; }
  html, body, .summary-sheet { background: #fff !important; color: #000 !important; }
  .summary-sheet * { color: #000 !important; border-color: #666 !important; background: transparent !important; }
  header[role="banner"], nav, .summary-controls { display: none !important; }
  .summary-table { page-break-inside: auto; }
  .summary-table tr, .summary-case { page-break-inside: avoid; }
  .summary-provenance { page-break-before: always; }
}`}</style>
      <header className="space-y-1">
        <p className="summary-controls text-sm text-dusk-dim">
          <Link href={`/proposals/${proposalId}`}>Back to the proposal</Link>
        </p>
        <h1 className="text-3xl font-bold">Technical summary: {table.title}</h1>
        <p className="text-sm text-dusk-dim">{table.provenance.inputs.site} · resolution {table.provenance.inputs.resolutionMas} mas · cadence {table.provenance.inputs.cadenceHours} h · campaign {table.provenance.inputs.campaignLengthDays} d</p>
        <p className="text-sm" data-testid="summary-time-request">
          Time requested: {timeRequestSentence(timeRequestOf(table.rows))}
        </p>
      </header>
      <div className="summary-controls space-y-3">
        <SummaryPdfDownload proposalId={proposalId} targets={table.rows.map((row) => ({ id: row.id, name: row.name }))} initialNightIso={today} />
        <TableDownloads proposalId={proposalId} />
        <SeasonFigureDownloads proposalId={proposalId} />
        {table.rows[0] ? <NightFigureDownloads proposalId={proposalId} targetId={table.rows[0].id} initialDateIso={today} /> : null}
      </div>
      <table className="summary-table w-full border-collapse text-sm" data-testid="summary-table">
        <thead>
          <tr>
            {table.columns.map(({ column }) => (
              <th key={column.key} scope="col" className="border-b border-void-edge px-2 py-1 text-left">{headerOf(column)}</th>
            ))}
          </tr>
        </thead>
        <tbody>
          {table.rows.map((row) => (
            <tr key={row.id}>
              {table.columns.map((chosen) => (
                <td key={chosen.column.key} className={`border-b border-void-edge px-2 py-1 ${chosen.column.kind === "text" ? "" : "text-right tabular-nums"}`}>
                  {cellText(cellOf(row, chosen.column), chosen) || "—"}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
      <section aria-labelledby="summary-cases-heading" className="space-y-4" data-testid="summary-cases">
        <h2 id="summary-cases-heading" className="text-xl font-semibold">
          Science cases
        </h2>
        {table.rows.map(summaryCaseOf).map((target) => (
          <section key={target.targetId} aria-label={target.targetName} className="summary-case space-y-1 text-sm" data-testid="summary-case">
            <h3 className="font-semibold">{target.targetName}</h3>
            <p data-testid="science-case">{target.caseText}</p>
            <ul className="space-y-1 pl-4">
              {target.answers.map((answer) => (
                <li key={answer.question}>
                  <span className="text-dusk-dim">{answer.question}: </span>
                  <span className={`font-semibold ${verdictClass[answer.verdict]}`}>{answer.verdictText}.</span> {answer.sentence}{" "}
                  <span className="text-xs text-dusk-dim">Rule: {answer.source}</span>
                </li>
              ))}
            </ul>
          </section>
        ))}
      </section>
      <section aria-label="Provenance" className="summary-provenance text-xs text-dusk-dim">
        <h2 className="mb-1 text-base font-semibold text-dusk">Provenance</h2>
        <ul>
          {provenanceLines(table.provenance).map((line) => (
            <li key={line}>{line}</li>
          ))}
        </ul>
      </section>
    </article>
  );
}
