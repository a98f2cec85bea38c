import "server-only";
import { z } from "zod";
import { sketchFromSearchParams } from "@/lib/bench/sketch-state";
import { serverEnv } from "@/lib/env";
import { benchFigureKinds, benchPlotExport } from "@/lib/exports/figures/bench-figures";
import { figureFormatQuerySchema } from "@/lib/exports/figures/figure-format";
import { figureResponse } from "@/lib/exports/figures/figure-response";
import { parseIds } from "@/lib/server/access";
import { endpoint, queryOf } from "@/lib/server/api/endpoint";
import { handle, parseOrThrow } from "@/lib/server/http";
import type { RouteContext } from "@/lib/server/api/endpoint";
import type { GetActor } from "@/lib/server/actor";
import { loadSkyFigure } from "./sky-figures";

const benchFigureParamsSchema = z.object({ figure: z.enum(benchFigureKinds) });

/**
 * /api/bench/exports/[figure]?format=svg|png|pdf&width=&dpi=&<bench parameters>. The bench is open
 * without signing in, so its figures are too; the sketch keys are the bench page's own (a missing or
 * malformed key takes the demo value, as on the page).
 */
export function benchFigureRoutes() {
  return {
    GET: handle(async (request: Request, context: RouteContext<{ figure: string }>) => {
      const { figure } = parseIds(benchFigureParamsSchema, await context.params, "figure");
      const query = queryOf(request);
      const format = parseOrThrow(figureFormatQuerySchema, { format: query.format, width: query.width, dpi: query.dpi }, "figure");
      const plot = benchPlotExport(figure, sketchFromSearchParams(query), serverEnv().NEXTAUTH_URL);
      return figureResponse(plot, format);
    }),
  };
}

/** /api/proposals/[proposalId]/exports/figures/[figure]?format=…: night (targetId, date) or season (start, nights). */
export function skyFigureRoutes(getActor: GetActor) {
  return {
    GET: endpoint<{ proposalId: string; figure: string }>(getActor, async ({ request, params, actor }) => {
      const query = queryOf(request);
      const format = parseOrThrow(figureFormatQuerySchema, { format: query.format, width: query.width, dpi: query.dpi }, "figure");
      return figureResponse(await loadSkyFigure(params, query, actor), format);
    }),
  };
}
