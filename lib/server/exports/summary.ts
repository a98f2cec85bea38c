import "server-only";
import { z } from "zod";
import { nightDateSchema } from "@/lib/astro/inputs";
import { serverEnv } from "@/lib/env";
import type { PlotExport } from "@/lib/exports/figures/figure-response";
import { MAX_NIGHT_CHARTS, summaryFigures, summaryNightOf, technicalSummaryOf, type SummaryFigure } from "@/lib/exports/assembly/summary";
import type { Actor } from "@/lib/server/actor";
import { parseOrThrow } from "@/lib/server/http";
import { loadSkyFigure } from "./sky-figures";
import { loadTargetTable } from "./target-table";

const summaryQuerySchema = z.object({
  figures: z
    .string()
    .optional()
    .transform((text, ctx) => {
      // The season chart by default; night charts only when asked for, since they need chosen targets.
      const names = text === undefined || text.trim() === "" ? ["season"] : text.split(",").map((n) => n.trim());
      const unknown = [...new Set(names.filter((n) => !(summaryFigures as readonly string[]).includes(n)))];
      if (unknown.length > 0) {
        ctx.addIssue({ code: "custom", message: `Unknown figure: ${unknown.join(", ")}. Known: ${summaryFigures.join(", ")}.` });
        return z.NEVER;
      }
      // Each name is a whole chart (a season chart is the slowest part): a repeat would only redo the work.
      if (new Set(names).size !== names.length) {
        ctx.addIssue({ code: "custom", message: `Name each figure once (at most ${summaryFigures.length}: ${summaryFigures.join(", ")}).` });
        return z.NEVER;
      }
      return names as SummaryFigure[];
    }),
  /** Targets (ids, comma-separated) whose night charts the summary carries, with `figures=night`. */
  nightTargets: z
    .string()
    .optional()
    .transform((text) => (text === undefined || text.trim() === "" ? [] : text.split(",").map((id) => id.trim())))
    .pipe(
      z
        .array(z.uuid({ error: "Name each target by its id." }))
        .max(MAX_NIGHT_CHARTS, `At most ${MAX_NIGHT_CHARTS} night charts.`)
        .refine((ids) => new Set(ids).size === ids.length, "Name each target once."),
    ),
  /** The night (evening date) of those charts; checked here, so a bad one is refused under its own name. */
  night: nightDateSchema.optional(),
  columns: z.string().optional(),
  digits: z.string().optional(),
}).refine((q) => !q.figures.includes("night") || q.nightTargets.length > 0, {
  path: ["nightTargets"],
  message: "Choose at least one target for the night charts.",
});

/**
 * The technical summary PDF of a proposal: the target table (chosen columns) and the chosen figures.
 * Each part is loaded through its own authorized data-access function, so the same role rules hold.
 */
export async function technicalSummary(params: unknown, query: Record<string, string>, actor: Actor | null): Promise<{ pdf: Uint8Array; title: string }> {
  const { figures, nightTargets, night, columns, digits } = parseOrThrow(summaryQuerySchema, query, "summary");
  const { table } = await loadTargetTable(params, { format: "json", columns, digits }, actor);
  const plots: PlotExport[] = [];
  for (const figure of figures) {
    // A proposal without targets has no season to chart; the summary still carries its (empty) table.
    if (figure === "season" && table.rows.length > 0) plots.push(await loadSkyFigure({ ...(params as object), figure }, {}, actor));
    if (figure === "night") {
      const date = night ?? summaryNightOf(table);
      for (const targetId of nightTargets) plots.push(await loadSkyFigure({ ...(params as object), figure }, { targetId, date }, actor));
    }
  }
  return technicalSummaryOf(table, plots, { figures, nightTargets, night }, { author: actor?.name, appOrigin: serverEnv().NEXTAUTH_URL });
}
