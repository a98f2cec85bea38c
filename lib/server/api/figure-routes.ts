import "server-only";
import { z } from "zod";
import { sketchFromSearchParams } from "@/lib/bench/sketch-state";
import { serverEnv } from "@/lib/env";
import { AppError } from "@/lib/errors";
import { benchFigureKinds, benchPlotExport } from "@/lib/exports/figures/bench-figures";
import { figureFormatQuerySchema, type FigureFormatQuery } from "@/lib/exports/figures/figure-format";
import { MAX_PNG_WIDTH_PX, MAX_SIGNED_OUT_PNG_WIDTH_PX } from "@/lib/exports/figures/png-limits";
import { figureResponse } from "@/lib/exports/figures/figure-response";
import { parseIds } from "@/lib/server/access";
import { endpoint, queryOf } from "@/lib/server/api/endpoint";
import { handle, parseOrThrow } from "@/lib/server/http";
import type { RouteContext } from "@/lib/server/api/endpoint";
import type { GetActor } from "@/lib/server/actor";
import { loadSkyFigure } from "@/lib/server/exports/sky-figures";

const benchFigureParamsSchema = z.object({ figure: z.enum(benchFigureKinds) });

/**
 * Refuses a PNG wider than a signed-out caller may ask for. The session is read only for such a
 * width, so the open bench's usual exports never touch it.
 */
async function checkSignedOutWidth(format: FigureFormatQuery, request: Request, getActor: GetActor): Promise<void> {
  if (format.format !== "png" || format.width <= MAX_SIGNED_OUT_PNG_WIDTH_PX) return;
  if ((await getActor(request)) !== null) return;
  const message = `Without signing in, the width is at most ${MAX_SIGNED_OUT_PNG_WIDTH_PX} px; sign in for up to ${MAX_PNG_WIDTH_PX} px.`;
  throw new AppError("bad_request:figure", message, { width: [message] });
}

/**
 * /api/bench/exports/[figure]?format=svg|png|pdf&width=&dpi=&<bench parameters>. The bench is open
 * without signing in, so its figures are too, a PNG at most MAX_SIGNED_OUT_PNG_WIDTH_PX wide; the
 * sketch keys are the bench page's own (a missing or malformed key takes the demo value, as on the page).
 */
export function benchFigureRoutes(getActor: GetActor) {
  return {
    GET: handle(async (request: Request, context: RouteContext<{ figure: string }>) => {
      const { figure } = parseIds(benchFigureParamsSchema, await context.params, "figure");
      const query = queryOf(request);
      const format = parseOrThrow(figureFormatQuerySchema, { format: query.format, width: query.width, dpi: query.dpi }, "figure");
      await checkSignedOutWidth(format, request, getActor);
      const plot = benchPlotExport(figure, sketchFromSearchParams(query), serverEnv().NEXTAUTH_URL);
      // A PDF names who exported it; the session is read for that only (none: no Author).
      const author = format.format === "pdf" ? (await getActor(request))?.name : undefined;
      return figureResponse(plot, format, { author });
    }),
  };
}

/** /api/proposals/[proposalId]/exports/figures/[figure]?format=…: night (targetId, date) or season (start, nights). */
export function skyFigureRoutes(getActor: GetActor) {
  return {
    GET: endpoint<{ proposalId: string; figure: string }>(getActor, async ({ request, params, actor }) => {
      const query = queryOf(request);
      const format = parseOrThrow(figureFormatQuerySchema, { format: query.format, width: query.width, dpi: query.dpi }, "figure");
      return figureResponse(await loadSkyFigure(params, query, actor), format, { author: actor?.name });
    }),
  };
}
