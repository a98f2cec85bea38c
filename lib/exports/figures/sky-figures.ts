import type { SkyLimitsInput, SkySiteInput, SkyTarget } from "@/lib/astro/inputs";
import { nightlyVisibility } from "@/lib/astro/visibility";
import { buildProvenance, type ProvenanceValue } from "@/lib/exports/provenance";
import { nightChart } from "@/lib/figures/night-chart";
import { nightSkyBrightnessChart, nightSkyBrightnessTitle } from "@/lib/figures/night-sky-brightness";
import { nightSkyBrightness } from "@/lib/photometry/night-sky";
import type { BandSky } from "@/lib/photometry/visit-budget";
import { printPalette } from "@/lib/figures/plot-palette";
import { seasonChart } from "@/lib/figures/season-chart";
import { seasonViewOfSchedules } from "@/lib/figures/season-view";
import { observingSchedules, type ScheduleConditions } from "@/lib/schedule";
import { skyQueryToString } from "@/lib/astro/sky-query";
import { nightData, nightSkyData, seasonData } from "@/lib/exports/figure-data/sky-data";
import { figureMarkup } from "./figure-markup";
import type { PlotExport } from "./figure-response";

export const skyFigureKinds = ["night", "season", "night-sky", "event-fit"] as const;
export type SkyFigureKind = (typeof skyFigureKinds)[number];

/** The sky views draw at these sizes (CSS px); the season chart grows one row per target. */
export const NIGHT_CHART_WIDTH_PX = 760;
export const NIGHT_CHART_HEIGHT_PX = 360;
export const NIGHT_SKY_CHART_HEIGHT_PX = 340;
export const SEASON_CHART_WIDTH_PX = 900;
/** Rows the season figure draws at most: beyond a few dozen the names stop being legible on a page. */
export const SEASON_FIGURE_MAX_ROWS = 60;

interface SkyContext {
  site: SkySiteInput & { name: string };
  limits: SkyLimitsInput & { airmassLimit: number };
  appOrigin: string;
  /** What the figure belongs to, for the provenance ("proposal 1234…: Arcs over the bulge"). */
  inputs: Record<string, ProvenanceValue>;
  exportedAt?: Date;
}

const siteInputs = ({ site, limits }: SkyContext) => ({
  site: site.name,
  latitudeDeg: site.latitudeDeg,
  longitudeEastDeg: site.longitudeEastDeg,
  elevationM: site.elevationM,
  horizonLimitDeg: site.horizonLimitDeg ?? 0,
  airmassLimit: limits.airmassLimit,
});

/**
 * The night chart of one target on one night, the same figure as the sky view's; the link back
 * opens the sky-windows page with the same site, target, night and limit.
 */
export function nightPlotExport(target: SkyTarget & { name: string }, nightDateIso: string, context: SkyContext): PlotExport {
  const visibility = nightlyVisibility(context.site, target, nightDateIso, context.limits);
  const markup = figureMarkup(nightChart({ visibility, targetName: target.name, siteName: context.site.name, width: NIGHT_CHART_WIDTH_PX, height: NIGHT_CHART_HEIGHT_PX, palette: printPalette }));
  const s = siteInputs(context);
  const query = skyQueryToString({
    site: s.site,
    lat: String(s.latitudeDeg),
    lon: String(s.longitudeEastDeg),
    elev: String(s.elevationM),
    horizon: String(s.horizonLimitDeg),
    ra: String(target.raDeg),
    dec: String(target.decDeg),
    date: nightDateIso,
    airmass: String(s.airmassLimit),
    nights: "183",
  });
  const title = `Altitude and air mass of ${target.name} through the night of ${nightDateIso}`;
  const provenance = buildProvenance({
    subject: `Night visibility: ${title}`,
    reproduceUrl: new URL(`/sky?${query}`, context.appOrigin).toString(),
    inputs: { figure: "night", ...context.inputs, target: target.name, raDeg: target.raDeg, decDeg: target.decDeg, nightDateIso, ...s, method: "astronomy-engine 2.1 Sun and Moon; Pickering 2002 air mass" },
    references: ["astronomyengine", "pickering2002", "saemundsson1986", "okabe2008"],
    exportedAt: context.exportedAt,
  });
  return { markup, title, fileStem: `night-${target.name}-${nightDateIso}`, provenance, data: nightData({ visibility, provenance }) };
}

/**
 * The sky brightness at one target through one night in its band (`nightSkyBrightness`), drawn by
 * the same figure as the target page's; the link back opens the target page on that night.
 */
export function nightSkyPlotExport(target: SkyTarget & { name: string }, nightDateIso: string, bandSky: BandSky, context: SkyContext & { reproducePath: string }): PlotExport {
  const sky = nightSkyBrightness({ site: context.site, target, nightDateIso, bandSky });
  const markup = figureMarkup(nightSkyBrightnessChart({ sky, width: NIGHT_CHART_WIDTH_PX, height: NIGHT_SKY_CHART_HEIGHT_PX, palette: printPalette }));
  const title = nightSkyBrightnessTitle(sky);
  const reproduceUrl = new URL(context.reproducePath, context.appOrigin);
  reproduceUrl.searchParams.set("night", nightDateIso);
  const provenance = buildProvenance({
    subject: `Sky brightness: ${title}`,
    reproduceUrl: reproduceUrl.toString(),
    inputs: {
      figure: "night-sky",
      ...context.inputs,
      target: target.name,
      raDeg: target.raDeg,
      decDeg: target.decDeg,
      nightDateIso,
      ...siteInputs(context),
      band: bandSky.band.label,
      darkSkyZenithMagPerArcsec2: bandSky.darkSkyZenithMagPerArcsec2,
      extinctionMagPerAirmass: bandSky.extinctionMagPerAirmass,
      extinctionV: bandSky.extinctionV,
      method: "Krisciunas & Schaefer 1991 eq. 2 dark sky and eq. 15 moonlight (V, carried to the band by the Sun's colour), summed in flux; astronomy-engine 2.1 Sun and Moon",
    },
    references: ["krisciunas1991", "willmer2018", "benn1998", "astronomyengine", "okabe2008"],
    exportedAt: context.exportedAt,
  });
  return { markup, title, fileStem: `sky-${target.name}-${nightDateIso}`, provenance, data: nightSkyData({ sky, provenance }) };
}

/**
 * A proposal's season as its view shows it: each target's usable hours per night of its simulated
 * observing schedule (darkness, the limits, the Sun rule and the Moon constraint), for up to
 * `SEASON_FIGURE_MAX_ROWS` targets over the conditions' nights. The link back opens the season view
 * (`reproducePath`) on the same window: `start` and `nights`.
 */
export function scheduleSeasonPlotExport(targets: (SkyTarget & { name: string })[], conditions: ScheduleConditions, context: SkyContext & { reproducePath: string }): PlotExport {
  const shown = targets.slice(0, SEASON_FIGURE_MAX_ROWS);
  const schedules = observingSchedules({ ...conditions, targets: shown });
  const view = seasonViewOfSchedules(shown.map((t) => t.name), schedules);
  const targetIndices = shown.map((_, index) => index);
  const markup = figureMarkup(seasonChart({ view, targetIndices, width: SEASON_CHART_WIDTH_PX, palette: printPalette }));
  const nightCount = view.nightDatesIso.length;
  const { cycleStartNightIso: startNightIso, moon } = conditions;
  const title = `Usable dark hours per night of the observing schedule from ${startNightIso} (${nightCount} nights)`;
  const reproduceUrl = new URL(context.reproducePath, context.appOrigin);
  reproduceUrl.searchParams.set("start", startNightIso);
  reproduceUrl.searchParams.set("nights", String(nightCount));
  const provenance = buildProvenance({
    subject: `Season chart: ${title}`,
    reproduceUrl: reproduceUrl.toString(),
    inputs: {
      figure: "season",
      ...context.inputs,
      startNightIso,
      nightCount,
      ...siteInputs(context),
      moonMinSeparationDeg: moon?.minSeparationDeg ?? null,
      moonMaxIlluminatedFraction: moon?.maxIlluminatedFraction ?? null,
      visitMinutes: conditions.visitMinutes,
      targets: shown.map((t) => `${t.name} (${t.raDeg}, ${t.decDeg})`).join("; "),
      targetsLeftOut: targets.length - shown.length,
    },
    references: ["astronomyengine", "pickering2002", "nunez2018"],
    exportedAt: context.exportedAt,
  });
  return { markup, title, fileStem: `season-${startNightIso}`, provenance, data: seasonData({ view, targetIndices, provenance }) };
}

