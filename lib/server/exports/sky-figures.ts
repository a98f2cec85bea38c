import "server-only";
import { and, asc, eq } from "drizzle-orm";
import { z } from "zod";
import { dbClient } from "@/db/client";
import { targets } from "@/db/schema";
import { nightDateSchema } from "@/lib/astro/inputs";
import { seasonWindowQuerySchema } from "@/lib/figures/season-view";
import { AppError } from "@/lib/errors";
import { serverEnv } from "@/lib/env";
import type { PlotExport } from "@/lib/exports/figures/figure-response";
import { skyFigureKinds } from "@/lib/exports/figures/sky-figures";
import { nightFigureOf, seasonFigureOf, skyContextOf } from "@/lib/exports/assembly/sky-figures";
import { authorize, parseIds } from "@/lib/server/access";
import { requireActor, type Actor } from "@/lib/server/actor";
import { feasibilitySettingsOf } from "@/lib/server/derived-columns";
import { parseOrThrow } from "@/lib/server/http";
import { eventFitFigure, parseEventFitQuery } from "./event-fit-figure";

const skyFigureParamsSchema = z.object({ proposalId: z.uuid(), figure: z.enum(skyFigureKinds) });

const nightQuerySchema = z.object({
  targetId: z.uuid({ error: "Name the target by its id." }),
  date: nightDateSchema,
});

/**
 * A proposal's sky figure as any member sees it: `night` (one target, `targetId` and `date`),
 * `night-sky` (the sky brightness at one target through that night, in its band: the target's source
 * band, else the proposal's) or `season` (every target, from `start` for `nights` nights; defaults:
 * the proposal's cycle, else today: seasonFigureOf), or `event-fit` (a point-lens target's photometry
 * with its light-curve fit, `targetId` and the fit panel's choices: event-fit-figure.ts). Order:
 * validate → session → load and role → compute.
 */
export async function loadSkyFigure(params: unknown, query: Record<string, string>, actor: Actor | null): Promise<PlotExport> {
  const { proposalId, figure } = parseIds(skyFigureParamsSchema, params, "figure");
  const night = figure === "night" || figure === "night-sky" ? parseOrThrow(nightQuerySchema, { targetId: query.targetId, date: query.date }, "figure") : undefined;
  const season = figure === "season" ? parseOrThrow(seasonWindowQuerySchema, { start: query.start, nights: query.nights }, "figure") : undefined;
  const eventFit = figure === "event-fit" ? parseEventFitQuery(query) : undefined;
  const who = requireActor(actor);
  const { db } = dbClient();
  const { proposal } = await authorize(db, proposalId, who, "read", "figure");
  const context = skyContextOf(proposal, serverEnv().NEXTAUTH_URL);
  if (eventFit) return eventFitFigure(proposal, eventFit, who, context);
  if (night && (figure === "night" || figure === "night-sky")) {
    const [target] = await db.select().from(targets).where(and(eq(targets.id, night.targetId), eq(targets.proposalId, proposalId))).limit(1);
    if (!target) throw new AppError("not_found:target", "No such target in this proposal.");
    return nightFigureOf(proposal, target, figure, night.date, context);
  }
  const rows = await db
    .select({ name: targets.name, raDeg: targets.raDeg, decDeg: targets.decDeg })
    .from(targets)
    .where(eq(targets.proposalId, proposalId))
    .orderBy(asc(targets.priority), asc(targets.name), asc(targets.id));
  return seasonFigureOf(proposal, feasibilitySettingsOf(proposal), rows, season ?? {}, context);
}
