/**
 * A proposal's sky figures assembled from what the data-access layer loaded
 * (lib/server/exports/sky-figures.ts): one target's night, or the season of the proposal's targets.
 */
import type { Proposal, Target } from "@/db/schema";
import { nightCountInclusive, SEASON_DEFAULT_NIGHTS, SEASON_MAX_NIGHTS, SEASON_MIN_NIGHTS } from "@/lib/astro/season-length";
import { addDaysIso } from "@/lib/astro/time";
import { AppError } from "@/lib/errors";
import type { PlotExport } from "@/lib/exports/figures/figure-response";
import { nightPlotExport, nightSkyPlotExport, scheduleSeasonPlotExport } from "@/lib/exports/figures/sky-figures";
import { scheduleConditionsOf, type FeasibilitySettings } from "@/lib/workspace/derived";
import { bandSkyOf, storedPhotometrySettings } from "@/lib/workspace/photometry-schema";

/** The site, limits and provenance inputs every sky figure of a proposal is drawn with; `appOrigin` is the app's public origin. */
export function skyContextOf(p: Proposal, appOrigin: string) {
  return {
    site: { name: p.siteName, latitudeDeg: p.siteLatitudeDeg, longitudeEastDeg: p.siteLongitudeDeg, elevationM: p.siteElevationM, horizonLimitDeg: p.siteHorizonLimitDeg },
    limits: { airmassLimit: p.airmassLimit },
    appOrigin,
    inputs: { proposalId: p.id, proposal: p.title, cycle: p.cycle },
  };
}

export type SkyFigureContext = ReturnType<typeof skyContextOf>;

/** Nights from the cycle's first to last night inclusive, bounded by the season limit. */
function cycleNights(p: Proposal): number | undefined {
  if (!p.cycleStartDate || !p.cycleEndDate) return undefined;
  return Math.min(SEASON_MAX_NIGHTS, Math.max(SEASON_MIN_NIGHTS, nightCountInclusive(p.cycleStartDate, p.cycleEndDate)));
}

/**
 * One target's night (`dateIso`, the evening's date): `night`, its altitude through the night, or
 * `night-sky`, the sky brightness at the target in its band (the target's source band, else the
 * proposal's). Refused in words when that band has no sky brightness.
 */
export function nightFigureOf(proposal: Proposal, target: Target, figure: "night" | "night-sky", dateIso: string, context: SkyFigureContext): PlotExport {
  const inputs = { ...context.inputs, targetId: target.id };
  const position = { name: target.name, raDeg: target.raDeg, decDeg: target.decDeg };
  if (figure === "night-sky") {
    const photometry = storedPhotometrySettings(proposal.photometry);
    const bandSky = bandSkyOf(photometry, target.sourceBand ?? photometry.bandId);
    if ("missing" in bandSky) throw new AppError("bad_request:figure", bandSky.missing, { _: [bandSky.missing] });
    return nightSkyPlotExport(position, dateIso, bandSky.sky, { ...context, inputs, reproducePath: `/proposals/${proposal.id}/targets/${target.id}` });
  }
  return nightPlotExport(position, dateIso, { ...context, inputs });
}

/**
 * The season chart of a proposal's targets (`rows` in priority, then name order; ICRS degrees) from
 * `window.start` for `window.nights` nights; defaults: the proposal's cycle, else today for
 * SEASON_DEFAULT_NIGHTS nights. `settings` are the proposal's schedule settings.
 */
export function seasonFigureOf(
  proposal: Proposal,
  settings: FeasibilitySettings,
  rows: { name: string; raDeg: number; decDeg: number }[],
  window: { start?: string; nights?: number },
  context: SkyFigureContext,
): PlotExport {
  if (rows.length === 0) {
    const message = "This proposal has no targets to chart yet.";
    throw new AppError("bad_request:figure", message, { _: [message] });
  }
  const start = window.start ?? proposal.cycleStartDate ?? new Date().toISOString().slice(0, 10);
  const nights = window.nights ?? cycleNights(proposal) ?? SEASON_DEFAULT_NIGHTS;
  // The proposal's schedule conditions over the requested nights (the cycle's by default).
  const conditions = scheduleConditionsOf({ ...settings, cycleStartDate: start, cycleEndDate: addDaysIso(start, nights - 1) })!;
  return scheduleSeasonPlotExport(rows, conditions, { ...context, reproducePath: `/proposals/${proposal.id}/sky` });
}
