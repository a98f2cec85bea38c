import "server-only";
import { z } from "zod";
import { serverEnv } from "@/lib/env";
import type { PlotExport } from "@/lib/exports/figures/figure-response";
import { technicalSummaryPdf } from "@/lib/exports/figures/summary-pdf";
import { buildProvenance } from "@/lib/exports/provenance";
import type { Actor } from "@/lib/server/actor";
import { parseOrThrow } from "@/lib/server/http";
import { loadSkyFigure } from "./sky-figures";
import { loadTargetTable } from "./target-table";

const summaryFigures = ["season"] as const;

const summaryQuerySchema = z.object({
  figures: z
    .string()
    .optional()
    .transform((text, ctx) => {
      const names = text === undefined || text.trim() === "" ? [...summaryFigures] : text.split(",").map((n) => n.trim());
      const unknown = names.filter((n) => !(summaryFigures as readonly string[]).includes(n));
      if (unknown.length > 0) {
        ctx.addIssue({ code: "custom", message: `Unknown figure: ${unknown.join(", ")}. Known: ${summaryFigures.join(", ")}.` });
        return z.NEVER;
      }
      return names as (typeof summaryFigures)[number][];
    }),
  columns: z.string().optional(),
  digits: z.string().optional(),
});

/**
 * The technical summary PDF of a proposal: the target table (chosen columns) and the chosen figures.
 * Each part is loaded through its own authorized data-access function, so the same role rules hold.
 */
export async function technicalSummary(params: unknown, query: Record<string, string>, actor: Actor | null): Promise<{ pdf: Uint8Array; title: string }> {
  const { figures, columns, digits } = parseOrThrow(summaryQuerySchema, query, "summary");
  const { table } = await loadTargetTable(params, { format: "json", columns, digits }, actor);
  const plots: PlotExport[] = [];
  for (const figure of figures) {
    // A proposal without targets has no season to chart; the summary still carries its (empty) table.
    if (figure === "season" && table.rows.length > 0) plots.push(await loadSkyFigure({ ...(params as object), figure }, {}, actor));
  }
  const proposalId = String(table.provenance.inputs.proposalId);
  const provenance = buildProvenance({
    subject: `Technical summary of the proposal "${table.title}"`,
    reproduceUrl: new URL(`/proposals/${proposalId}/summary`, serverEnv().NEXTAUTH_URL).toString(),
    inputs: { ...table.provenance.inputs, figures: figures.join(",") },
  });
  return { pdf: await technicalSummaryPdf(table, plots, provenance), title: table.title };
}
