import "server-only";
import { and, asc, eq } from "drizzle-orm";
import { z } from "zod";
import { dbClient } from "@/db/client";
import { targets, type Proposal } from "@/db/schema";
import { nightDateSchema } from "@/lib/astro/inputs";
import { SEASON_DEFAULT_NIGHTS, SEASON_MAX_NIGHTS } from "@/lib/astro/season-length";
import { seasonWindowQuerySchema } from "@/lib/figures/season-view";
import { AppError } from "@/lib/errors";
import { serverEnv } from "@/lib/env";
import type { PlotExport } from "@/lib/exports/figures/figure-response";
import { nightPlotExport, nightSkyPlotExport, scheduleSeasonPlotExport, skyFigureKinds } from "@/lib/exports/figures/sky-figures";
import { addDaysIso } from "@/lib/astro/time";
import { scheduleConditionsOf } from "@/lib/workspace/derived";
import { bandSkyOf, storedPhotometrySettings } from "@/lib/workspace/photometry-schema";
import { feasibilitySettingsOf } from "@/lib/server/derived-columns";
import { authorize, parseIds } from "@/lib/server/access";
import { requireActor, type Actor } from "@/lib/server/actor";
import { parseOrThrow } from "@/lib/server/http";
import { eventFitFigure, parseEventFitQuery } from "./event-fit-figure";

const skyFigureParamsSchema = z.object({ proposalId: z.uuid(), figure: z.enum(skyFigureKinds) });

const nightQuerySchema = z.object({
  targetId: z.uuid({ error: "Name the target by its id." }),
  date: nightDateSchema,
});

function skyContextOf(p: Proposal) {
  return {
    site: { name: p.siteName, latitudeDeg: p.siteLatitudeDeg, longitudeEastDeg: p.siteLongitudeDeg, elevationM: p.siteElevationM, horizonLimitDeg: p.siteHorizonLimitDeg },
    limits: { airmassLimit: p.airmassLimit },
    appOrigin: serverEnv().NEXTAUTH_URL,
    inputs: { proposalId: p.id, proposal: p.title, cycle: p.cycle },
  };
}

const DAY_MS = 86_400_000;
const DEFAULT_SEASON_NIGHTS = SEASON_DEFAULT_NIGHTS;

/** Nights from the cycle's first to last night inclusive, bounded by the season limit. */
function cycleNights(p: Proposal): number | undefined {
  if (!p.cycleStartDate || !p.cycleEndDate) return undefined;
  const nights = Math.round((Date.parse(p.cycleEndDate) - Date.parse(p.cycleStartDate)) / DAY_MS) + 1;
  return Math.min(SEASON_MAX_NIGHTS, Math.max(1, nights));
}

/**
 * A proposal's sky figure as any member sees it: `night` (one target, `targetId` and `date`),
 * `night-sky` (the sky brightness at one target through that night, in its band: the target's source
 * band, else the proposal's) or `season` (every target, from `start` for `nights` nights; defaults:
 * the proposal's cycle, else today for 183 nights), or `event-fit` (a point-lens target's photometry
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
  const context = skyContextOf(proposal);
  if (eventFit) return eventFitFigure(proposal, eventFit, who, context);
  if (night) {
    const [target] = await db.select().from(targets).where(and(eq(targets.id, night.targetId), eq(targets.proposalId, proposalId))).limit(1);
    if (!target) throw new AppError("not_found:target", "No such target in this proposal.");
    if (figure === "night-sky") {
      const photometry = storedPhotometrySettings(proposal.photometry);
      const bandSky = bandSkyOf(photometry, target.sourceBand ?? photometry.bandId);
      if ("missing" in bandSky) throw new AppError("bad_request:figure", bandSky.missing, { _: [bandSky.missing] });
      const inputs = { ...context.inputs, targetId: target.id };
      return nightSkyPlotExport({ name: target.name, raDeg: target.raDeg, decDeg: target.decDeg }, night.date, bandSky.sky, { ...context, inputs, reproducePath: `/proposals/${proposal.id}/targets/${target.id}` });
    }
    return nightPlotExport({ name: target.name, raDeg: target.raDeg, decDeg: target.decDeg }, night.date, { ...context, inputs: { ...context.inputs, targetId: target.id } });
  }
  const rows = await db
    .select({ name: targets.name, raDeg: targets.raDeg, decDeg: targets.decDeg })
    .from(targets)
    .where(eq(targets.proposalId, proposalId))
    .orderBy(asc(targets.priority), asc(targets.name), asc(targets.id));
  if (rows.length === 0) {
    const message = "This proposal has no targets to chart yet.";
    throw new AppError("bad_request:figure", message, { _: [message] });
  }
  const start = season?.start ?? proposal.cycleStartDate ?? new Date().toISOString().slice(0, 10);
  const nights = season?.nights ?? cycleNights(proposal) ?? DEFAULT_SEASON_NIGHTS;
  // The proposal's schedule conditions over the requested nights (the cycle's by default).
  const conditions = scheduleConditionsOf({ ...feasibilitySettingsOf(proposal), cycleStartDate: start, cycleEndDate: addDaysIso(start, nights - 1) })!;
  return scheduleSeasonPlotExport(rows, conditions, { ...context, reproducePath: `/proposals/${proposal.id}/sky` });
}
