/** @jsxImportSource hastscript/svg */
import { area, bisectLeft, line, scaleLinear } from "d3";
import type { NightVisibility } from "@/lib/astro/visibility";
import { SUNRISE_GEOMETRIC_ALTITUDE_DEG, TWILIGHT_ALTITUDE_DEG } from "@/lib/astro/constants";
import { apparentAltitudeForAirmassDeg } from "@/lib/astro/airmass";
import { svgElement, type FigureTree } from "./figure-tree";
import { defaultMargins, marker, plotAxes, plotLegend } from "./plot-axes";
import { dashPatterns, plotFont, plotPalette, type PlotPalette } from "./plot-palette";
import { formatUtcClock } from "@/lib/astro/sky-format";
import { visitMarks } from "@/lib/schedule/timeline-plot";

/** The night's visits planned by the target's simulated schedule (lib/schedule). */
export interface PlannedVisits {
  /** Start times, JD UTC, ascending. */
  visitsJdUtc: readonly number[];
  visitLengthDays: number;
}

interface NightChartProps {
  visibility: NightVisibility;
  /** Drawn as bands over the visits' time with a mark on the target's curve; absent: none drawn. */
  plannedVisits?: PlannedVisits;
  /** Named in the title when given (a figure standing alone on a page says whose night it is). */
  targetName?: string;
  siteName?: string;
  width?: number;
  height?: number;
  /** The screen style unless given; exports draw in `printPalette`. */
  palette?: PlotPalette;
}

/** The Sun's altitude (deg) below which each shade of `PlotPalette.skyShades` begins: day to darkness. */
const skyShadeBelowDeg = [Infinity, SUNRISE_GEOMETRIC_ALTITUDE_DEG, TWILIGHT_ALTITUDE_DEG.civil, TWILIGHT_ALTITUDE_DEG.nautical, TWILIGHT_ALTITUDE_DEG.astronomical] as const;

function shadeIndex(sunAltitudeDeg: number): number {
  let index = 0;
  for (let i = 1; i < skyShadeBelowDeg.length; i++) if (sunAltitudeDeg <= skyShadeBelowDeg[i]) index = i;
  return index;
}

/** "TB-ML-0001 from Cerro Velado, night of 2031-06-15", with what is known of target and site. */
export function nightChartTitle(nightDateIso: string, targetName?: string, siteName?: string): string {
  const who = [targetName, siteName === undefined ? undefined : `from ${siteName}`].filter((part) => part !== undefined).join(" ");
  return who === "" ? `Night of ${nightDateIso}` : `${who}, night of ${nightDateIso}`;
}

const AIRMASS_TICKS = [1.1, 1.3, 1.5, 2, 3];
const HOUR = 1 / 24;

/**
 * Altitude of the target through one night (apparent, degrees) with its air mass on the right-hand
 * axis, the Moon's altitude, the altitude limit, transit, the sky shaded by twilight and, when
 * given, the visits the schedule plans that night. Times on the axis are UTC hours; the view spans
 * an hour before sunset to an hour after sunrise (the whole noon-to-noon window when the Sun does
 * not set or rise).
 */
export function nightChart({ visibility, plannedVisits, targetName, siteName, width = 760, height = 360, palette = plotPalette }: NightChartProps): FigureTree {
  const { samples, twilight, passages, limit } = visibility;
  const margins = { ...defaultMargins, right: 56 };
  const count = samples.jdUtc.length;
  const windowStart = samples.jdUtc[0];
  const windowEnd = samples.jdUtc[count - 1];
  const from = twilight.sunset.eveningJdUtc !== null ? Math.max(windowStart, twilight.sunset.eveningJdUtc - HOUR) : windowStart;
  const to = twilight.sunset.morningJdUtc !== null ? Math.min(windowEnd, twilight.sunset.morningJdUtc + HOUR) : windowEnd;
  // Hours on the axis count from 0 UTC of the window's first day, so labels read as UTC clock hours.
  const dayZero = Math.floor(windowStart - 0.5) + 0.5;
  const toHours = (jd: number) => (jd - dayZero) * 24;
  const x = scaleLinear().domain([toHours(from), toHours(to)]).range([margins.left, width - margins.right]);
  // plotAxes labels ticks through the scale's own tickFormat: give it clock hours modulo 24.
  x.tickFormat = () => (value) => `${String(((Number(value) % 24) + 24) % 24).padStart(2, "0")}h`;
  const y = scaleLinear().domain([0, 90]).range([height - margins.bottom, margins.top]);
  const [x0, x1] = x.range();
  const [y0, y1] = y.range();

  const indices = Array.from({ length: count }, (_, k) => k).filter((k) => samples.jdUtc[k] >= from - 0.01 && samples.jdUtc[k] <= to + 0.01);
  const bands: { start: number; end: number; shade: number }[] = [];
  for (const k of indices) {
    const shade = shadeIndex(samples.sunAltitudeDeg[k]);
    const last = bands.at(-1);
    if (last && last.shade === shade) last.end = samples.jdUtc[k];
    else bands.push({ start: samples.jdUtc[k], end: samples.jdUtc[k], shade });
  }
  const curve = (values: Float64Array) =>
    line<number>()
      .defined((k) => values[k] > -5)
      .x((k) => x(toHours(samples.jdUtc[k])))
      .y((k) => y(Math.max(-5, values[k])))(indices) ?? "";
  const darkAbove = area<number>()
    .defined((k) => samples.sunAltitudeDeg[k] <= TWILIGHT_ALTITUDE_DEG.astronomical && samples.altitudeDeg[k] >= limit.apparentDeg)
    .x((k) => x(toHours(samples.jdUtc[k])))
    .y0(y(limit.apparentDeg))
    .y1((k) => y(samples.altitudeDeg[k]))(indices) ?? "";
  const transitX = x(toHours(passages.transitJdUtc));
  const isTransitShown = passages.transitJdUtc >= from && passages.transitJdUtc <= to;
  const clipId = `night-clip-${visibility.nightDateIso}`;
  // Visits closer than a pixel are drawn as one band; the mark sits on the altitude curve at its middle.
  const daysPerPx = (to - from) / (x1 - x0);
  const visits = plannedVisits === undefined ? [] : visitMarks(plannedVisits.visitsJdUtc, plannedVisits.visitLengthDays, daysPerPx);
  const altitudeAt = (jdUtc: number) => {
    const k = Math.min(count - 1, Math.max(1, bisectLeft(samples.jdUtc, jdUtc)));
    const [ja, jb] = [samples.jdUtc[k - 1], samples.jdUtc[k]];
    return samples.altitudeDeg[k - 1] + ((samples.altitudeDeg[k] - samples.altitudeDeg[k - 1]) * (jdUtc - ja)) / (jb - ja);
  };

  return svgElement(
    <svg xmlns="http://www.w3.org/2000/svg" width="100%" viewBox={`0 0 ${width} ${height}`} role="img" aria-label={`Altitude and air mass through the night of ${visibility.nightDateIso}`} data-testid="night-chart" data-night={visibility.nightDateIso}>
      <rect width={width} height={height} fill={palette.ground} />
      <defs>
        <clipPath id={clipId}>
          <rect x={x0} y={y1} width={x1 - x0} height={y0 - y1} />
        </clipPath>
      </defs>
      <g clipPath={`url(#${clipId})`}>
        {bands.map((band) => (
          <rect x={x(toHours(band.start))} width={Math.max(0, x(toHours(band.end + 1 / 288)) - x(toHours(band.start)))} y={y1} height={y0 - y1} fill={palette.skyShades[band.shade]} />
        ))}
      </g>
      {plotAxes({ palette, x, y, width, height, margins, xLabel: "time (UTC)", yLabel: "apparent altitude (°)", yTicks: 6, title: nightChartTitle(visibility.nightDateIso, targetName, siteName) })}
      <g clipPath={`url(#${clipId})`}>
        <path d={darkAbove} fill={palette.bluishGreen} fillOpacity={0.3} />
        <line x1={x0} x2={x1} y1={y(limit.apparentDeg)} y2={y(limit.apparentDeg)} stroke={palette.orange} strokeDasharray={dashPatterns.dashed} strokeWidth={1.5} />
        <path d={curve(samples.moonAltitudeDeg)} fill="none" stroke={palette.yellow} strokeDasharray={dashPatterns.dotted} strokeWidth={2} />
        {visits.map((visit) => (
          <rect x={x(toHours(visit.startJdUtc))} width={Math.max(1.5, x(toHours(visit.endJdUtc)) - x(toHours(visit.startJdUtc)))} y={y1} height={y0 - y1} fill={palette.ink} fillOpacity={0.12} />
        ))}
        <path d={curve(samples.altitudeDeg)} fill="none" stroke={palette.skyBlue} strokeWidth={2.5} />
        {visits.map((visit) => {
          const middle = (visit.startJdUtc + visit.endJdUtc) / 2;
          return marker({ shape: "diamond", cx: x(toHours(middle)), cy: y(altitudeAt(middle)), size: 8, color: palette.ink });
        })}
        {isTransitShown ? (
          <g>
            <line x1={transitX} x2={transitX} y1={y0} y2={y1} stroke={palette.ink} strokeDasharray={dashPatterns.dashDot} strokeWidth={1} />
            <text x={transitX + 4} y={y1 + 14} fontFamily={plotFont} fontSize={11} fill={palette.ink}>
              transit {formatUtcClock(passages.transitJdUtc)}
            </text>
          </g>
        ) : null}
      </g>
      <g fontFamily={plotFont} fontSize={11} fill={palette.text}>
        {AIRMASS_TICKS.map((airmass) => {
          // Each label sits where Pickering's air mass (not sec z) takes that value.
          const exact = apparentAltitudeForAirmassDeg(airmass);
          return (
            <g>
              <line x1={x1} x2={x1 + 4} y1={y(exact)} y2={y(exact)} stroke={palette.frame} />
              <text x={x1 + 7} y={y(exact) + 4}>{airmass}</text>
            </g>
          );
        })}
        <text transform={`translate(${width - 10} ${(y0 + y1) / 2}) rotate(90)`} textAnchor="middle" fontSize={12}>
          air mass
        </text>
      </g>
      {plotLegend({
        palette,
        x: x0 + 8,
        y: y1 + 22,
        entries: [
          { label: "target", color: palette.skyBlue },
          { label: "Moon", color: palette.yellow, dash: dashPatterns.dotted },
          { label: `limit ${limit.apparentDeg.toFixed(1)}° (${limit.binding})`, color: palette.orange, dash: dashPatterns.dashed },
          { label: "transit", color: palette.ink, dash: dashPatterns.dashDot },
          ...(visits.length > 0 ? [{ label: "planned visit", color: palette.ink, marker: "diamond" as const }] : []),
        ],
      })}
    </svg>,
  );
}

