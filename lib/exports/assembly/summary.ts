/**
 * The technical summary PDF of a proposal, assembled from its target table and the figures the
 * data-access layer loaded (lib/server/exports/summary.ts).
 */
import type { PlotExport } from "@/lib/exports/figures/figure-response";
import { technicalSummaryPdf } from "@/lib/exports/figures/summary-pdf";
import { buildProvenance } from "@/lib/exports/provenance";
import type { TargetTable } from "@/lib/exports/tables/table";

/** The figures a summary may carry, by name. */
export const summaryFigures = ["season", "night"] as const;

export type SummaryFigure = (typeof summaryFigures)[number];

/** Night charts in one summary at most: a page each. */
export const MAX_NIGHT_CHARTS = 6;

/** The night of the summary's night charts when none is named: the cycle's first night when the table's proposal has one, else tonight (UTC date). */
export function summaryNightOf(table: TargetTable): string {
  const cycleStart = table.provenance.inputs.cycleStartDate;
  return typeof cycleStart === "string" && cycleStart !== "" ? cycleStart : new Date().toISOString().slice(0, 10);
}

/**
 * The summary of `table` with `plots` (in the order they were asked for), its provenance naming the
 * choices (`figures`, `nightTargets`, `night`) and the references of the table and of every figure;
 * `author` is who exports it, `appOrigin` the app's public origin.
 */
export async function technicalSummaryOf(
  table: TargetTable,
  plots: PlotExport[],
  choices: { figures: readonly SummaryFigure[]; nightTargets: readonly string[]; night: string | undefined },
  { author, appOrigin }: { author: string | undefined; appOrigin: string },
): Promise<{ pdf: Uint8Array; title: string }> {
  const proposalId = String(table.provenance.inputs.proposalId);
  const provenance = buildProvenance({
    subject: `Technical summary of the proposal "${table.title}"`,
    reproduceUrl: new URL(`/proposals/${proposalId}/summary`, appOrigin).toString(),
    inputs: { ...table.provenance.inputs, figures: choices.figures.join(","), nightTargets: choices.nightTargets.join(",") || null, night: choices.night ?? null },
    // The table's and every bundled figure's.
    references: [...table.provenance.references, ...plots.flatMap((plot) => plot.provenance.references)].map((reference) => reference.key),
  });
  return { pdf: await technicalSummaryPdf(table, plots, provenance, { author }), title: table.title };
}
