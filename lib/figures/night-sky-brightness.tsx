/** @jsxImportSource hastscript/svg */
import { area, line, scaleLinear } from "d3";
import { formatUtcClock } from "@/lib/astro/sky-format";
import type { NightSkyBrightness } from "@/lib/photometry/night-sky";
import { svgElement, type FigureTree } from "./figure-tree";
import { defaultMargins, plotAxes, plotLegend } from "./plot-axes";
import { dashPatterns, plotFont, plotPalette, type PlotPalette } from "./plot-palette";

interface NightSkyBrightnessChartProps {
  sky: NightSkyBrightness;
  width?: number;
  height?: number;
  /** The screen style unless given; exports draw in `printPalette`. */
  palette?: PlotPalette;
  /** Starts the ids of the figure's clip path and hatch, which must be unique in the page or file (`url(#…)` finds the first). */
  idPrefix?: string;
}

/** One point of a drawn curve; null breaks the curve where the target is down between two samples. */
type CurvePoint = { hours: number; total: number; dark: number } | null;

/** The figure's title: target, site, band and night. */
export function nightSkyBrightnessTitle(sky: Pick<NightSkyBrightness, "target" | "site" | "bandLabel" | "nightDateIso">): string {
  const target = sky.target.name ?? `RA ${sky.target.raDeg.toFixed(3)}°, Dec ${sky.target.decDeg.toFixed(3)}°`;
  return `Sky at ${target} from ${sky.site.name ?? "the site"} in ${sky.bandLabel}, night of ${sky.nightDateIso}`;
}

/** Why the figure has no curve, in words; null when it has one. */
export function nightSkyEmptyReason(sky: NightSkyBrightness): string | null {
  if (sky.darkness === null) return "No astronomical darkness this night (the Sun stays above −18°), so there is no dark sky to draw.";
  if (sky.jdUtc.length === 0) return `The target is not above the site's horizon (${sky.site.horizonLimitDeg}°) during darkness this night.`;
  return null;
}

/** The figure in one sentence: its accessible name. */
export function nightSkyBrightnessSummary(sky: NightSkyBrightness): string {
  const empty = nightSkyEmptyReason(sky);
  if (empty !== null) return `${nightSkyBrightnessTitle(sky)}: ${empty}`;
  let faintest = -Infinity;
  let brightest = Infinity;
  for (let i = 0; i < sky.jdUtc.length; i++) {
    faintest = Math.max(faintest, sky.totalMagPerArcsec2[i]);
    brightest = Math.min(brightest, sky.totalMagPerArcsec2[i]);
  }
  const moon = sky.largestMoonBrighteningMag > 0.005 ? `the Moon brightens it by up to ${sky.largestMoonBrighteningMag.toFixed(2)} mag` : "no moonlight while the target is up";
  return `${nightSkyBrightnessTitle(sky)}: from ${brightest.toFixed(2)} to ${faintest.toFixed(2)} mag/arcsec²; ${moon}.`;
}

/**
 * The sky's surface brightness at a target through one night's darkness (mag/arcsec², brighter
 * up): the moonless sky at the target's zenith distance as a dashed line, the sky with the Moon as a
 * solid line, the Moon's added light shaded (and hatched) between them, and the Moon rising or
 * setting marked. Times on the axis are UTC hours; the view spans astronomical darkness.
 */
export function nightSkyBrightnessChart({ sky, width = 760, height = 340, palette = plotPalette, idPrefix: idBase = "night-sky" }: NightSkyBrightnessChartProps): FigureTree {
  const margins = { ...defaultMargins, top: 46 };
  const [x0, x1] = [margins.left, width - margins.right];
  const [y0, y1] = [height - margins.bottom, margins.top];
  const title = nightSkyBrightnessTitle(sky);
  const empty = nightSkyEmptyReason(sky);
  const label = nightSkyBrightnessSummary(sky);
  // Hours count from 0 UTC of the evening's day, so labels read as UTC clock hours.
  const dayZero = Math.floor((sky.darkness?.startJdUtc ?? 0.5) - 0.5) + 0.5;
  const toHours = (jdUtc: number) => (jdUtc - dayZero) * 24;
  const from = sky.darkness === null ? 0 : toHours(sky.darkness.startJdUtc);
  const to = sky.darkness === null ? 12 : toHours(sky.darkness.endJdUtc);
  const x = scaleLinear().domain([from, to]).range([x0, x1]);
  x.tickFormat = () => (value) => `${String(((Number(value) % 24) + 24) % 24).padStart(2, "0")}h`;

  let faintest = 22;
  let brightest = 20;
  if (sky.jdUtc.length > 0) {
    faintest = -Infinity;
    brightest = Infinity;
    for (let i = 0; i < sky.jdUtc.length; i++) {
      faintest = Math.max(faintest, sky.darkMagPerArcsec2[i]);
      brightest = Math.min(brightest, sky.totalMagPerArcsec2[i]);
    }
  }
  // Brighter (smaller magnitudes) up.
  const y = scaleLinear().domain([faintest + 0.15, brightest - 0.15]).nice().range([y0, y1]);

  const points: CurvePoint[] = [];
  for (let i = 0; i < sky.jdUtc.length; i++) {
    if (i > 0 && sky.jdUtc[i] - sky.jdUtc[i - 1] > sky.stepDays * 1.01) points.push(null);
    points.push({ hours: toHours(sky.jdUtc[i]), total: sky.totalMagPerArcsec2[i], dark: sky.darkMagPerArcsec2[i] });
  }
  const defined = (point: CurvePoint) => point !== null;
  const curve = (value: (point: NonNullable<CurvePoint>) => number) =>
    line<CurvePoint>()
      .defined(defined)
      .x((point) => x(point!.hours))
      .y((point) => y(value(point!)))
      .digits(1)(points) ?? "";
  const moonShare =
    area<CurvePoint>()
      .defined(defined)
      .x((point) => x(point!.hours))
      .y0((point) => y(point!.dark))
      .y1((point) => y(point!.total))
      .digits(1)(points) ?? "";
  const clipId = `${idBase}-clip`;
  const hatchId = `${idBase}-moon`;

  return svgElement(
    <svg xmlns="http://www.w3.org/2000/svg" width="100%" viewBox={`0 0 ${width} ${height}`} role="img" aria-label={label} data-testid="night-sky-brightness" data-night={sky.nightDateIso}>
      <rect width={width} height={height} fill={palette.ground} />
      <defs>
        <clipPath id={clipId}>
          <rect x={x0} y={y1} width={x1 - x0} height={y0 - y1} />
        </clipPath>
        <pattern id={hatchId} width="5" height="5" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
          <rect width="5" height="5" fill={palette.yellow} fillOpacity={0.35} />
          <line x1="0" y1="0" x2="0" y2="5" stroke={palette.yellow} strokeWidth="1.2" />
        </pattern>
      </defs>
      {plotAxes({ palette, x, y, width, height, margins, xLabel: "time (UTC), astronomical darkness", yLabel: "sky brightness (mag/arcsec²)", yTicks: 5, title })}
      {empty !== null ? (
        <text x={(x0 + x1) / 2} y={(y0 + y1) / 2} textAnchor="middle" fontFamily={plotFont} fontSize={12} fill={palette.text}>
          {empty}
        </text>
      ) : (
        <>
          <g clipPath={`url(#${clipId})`}>
            <path d={moonShare} fill={`url(#${hatchId})`} stroke="none" />
            <path d={curve((point) => point.total)} fill="none" stroke={palette.ink} strokeWidth={2} />
            <path d={curve((point) => point.dark)} fill="none" stroke={palette.skyBlue} strokeWidth={2} strokeDasharray={dashPatterns.dashed} />
            {sky.moonCrossings.map((crossing) => (
              <g>
                <line x1={x(toHours(crossing.jdUtc))} x2={x(toHours(crossing.jdUtc))} y1={y0} y2={y1} stroke={palette.yellow} strokeDasharray={dashPatterns.dotted} strokeWidth={1.5} />
                <text x={x(toHours(crossing.jdUtc)) + (crossing.kind === "rise" ? 4 : -4)} y={y0 - 8} textAnchor={crossing.kind === "rise" ? "start" : "end"} fontFamily={plotFont} fontSize={11} fill={palette.yellow}>
                  {crossing.kind === "rise" ? "Moon rises" : "Moon sets"} {formatUtcClock(crossing.jdUtc)}
                </text>
              </g>
            ))}
          </g>
          {plotLegend({
            palette,
            isRow: true,
            x: x0 - 6,
            y: 19,
            entries: [
              { label: "sky with the Moon", color: palette.ink },
              { label: "dark sky (no Moon)", color: palette.skyBlue, dash: dashPatterns.dashed },
              { label: "Moon's added light (hatched)", color: palette.yellow, marker: "square" },
              ...(sky.moonCrossings.length > 0 ? [{ label: "Moon rises or sets", color: palette.yellow, dash: dashPatterns.dotted }] : []),
            ],
          })}
        </>
      )}
    </svg>,
  );
}
