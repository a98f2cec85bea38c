/** @jsxImportSource hastscript/svg */
import { line, scaleLinear } from "d3";
import type { SkyPoint } from "@/lib/lensing/relativistic-orbit";
import type { OrbitSkyView } from "./orbit-sky-view";
import type { FigureTree } from "./figure-tree";
import { marker, plotAxes, plotLegend, plotSurface, type LegendEntry, type PlotMargins } from "./plot-axes";
import { dashPatterns, plotPalette, type PlotPalette } from "./plot-palette";

/** The figure's size (CSS px) on the target page: square, so both axes keep one scale. */
export const ORBIT_SKY_SIZE_PX = 520;

interface OrbitSkyPlotProps {
  view: OrbitSkyView;
  /** Plain text; the figure's accessible name too. */
  title: string;
  size: number;
  palette?: PlotPalette;
}

const margins: PlotMargins = { top: 28, right: 16, bottom: 46, left: 62 };

/**
 * The star's orbit on the sky (orbit-sky-view.ts), north up and east to the left, in mas at the lens
 * distance: the Newtonian ellipse, the exact precessing orbit over it, and the precession's departure
 * magnified by the labelled factor; the compact mass, the periapsis, the apoapsis and the advanced
 * periapsis marked, each with its own marker shape.
 */
export function orbitSkyPlot({ view, title, size, palette = plotPalette }: OrbitSkyPlotProps): FigureTree {
  // The plot area is made square: the same pixels per mas on both axes.
  const side = size - Math.max(margins.left + margins.right, margins.top + margins.bottom);
  const x = scaleLinear().domain(view.eastDomainMas).range([margins.left, margins.left + side]);
  const y = scaleLinear().domain(view.northDomainMas).range([margins.top + side, margins.top]);
  const path = (points: SkyPoint[]) =>
    line<SkyPoint>()
      .x((p) => x(p.eastMas))
      .y((p) => y(p.northMas))(points) ?? "";
  const isMagnified = view.magnification > 1;
  const legend: LegendEntry[] = [
    { label: "Newtonian ellipse", color: palette.ink },
    { label: "precessing orbit (exact)", color: palette.orange, dash: dashPatterns.dashed },
    ...(isMagnified ? [{ label: `precession magnified × ${view.magnification.toLocaleString("en-GB")}`, color: palette.skyBlue, dash: dashPatterns.dotted }] : []),
    { label: "compact mass", color: palette.ink, marker: "cross" as const },
    { label: "periapsis", color: palette.vermillion, marker: "circle" as const },
    { label: "apoapsis", color: palette.bluishGreen, marker: "square" as const },
    { label: isMagnified ? "next periapsis (magnified)" : "next periapsis", color: palette.skyBlue, marker: "diamond" as const },
  ];
  const at = (p: SkyPoint) => ({ cx: x(p.eastMas), cy: y(p.northMas) });
  return plotSurface(
    { palette, width: margins.left + side + margins.right, height: margins.top + side + margins.bottom, label: title },
    <>
      {plotAxes({ palette, x, y, width: margins.left + side + margins.right, height: margins.top + side + margins.bottom, margins, xLabel: "east offset (mas)", yLabel: "north offset (mas)", title })}
      <path d={path(view.newtonian)} fill="none" stroke={palette.ink} strokeWidth={1.5} data-testid="orbit-sky-newtonian" />
      <path d={path(view.precessing)} fill="none" stroke={palette.orange} strokeWidth={1.5} strokeDasharray={dashPatterns.dashed} data-testid="orbit-sky-precessing" />
      {isMagnified ? <path d={path(view.magnified)} fill="none" stroke={palette.skyBlue} strokeWidth={1.5} strokeDasharray={dashPatterns.dotted} data-testid="orbit-sky-magnified" /> : null}
      {marker({ shape: "cross", ...at({ eastMas: 0, northMas: 0 }), size: 9, color: palette.ink })}
      {marker({ shape: "circle", ...at(view.periapsis), size: 7, color: palette.vermillion })}
      {marker({ shape: "square", ...at(view.apoapsis), size: 7, color: palette.bluishGreen })}
      {marker({ shape: "diamond", ...at(view.advancedPeriapsis), size: 8, color: palette.skyBlue, isHollow: true })}
      {plotLegend({ palette, x: margins.left + 6, y: margins.top + 6, entries: legend })}
    </>,
  );
}
