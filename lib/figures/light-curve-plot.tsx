/** @jsxImportSource hastscript/svg */
import { extent, line, scaleLinear } from "d3";
import type { CurvePoint, LightCurve } from "@/lib/bench/plot-data";
import type { FigureTree } from "./figure-tree";
import { defaultMargins, marker, plotAxes, plotLegend, plotSurface } from "./plot-axes";
import { dashPatterns, plotPalette, type PlotPalette } from "./plot-palette";

interface LightCurvePlotProps {
  lightCurve: LightCurve;
  width: number;
  height: number;
  /** The screen style unless given; exports draw in `printPalette`. */
  palette?: PlotPalette;
}

/** Point-lens magnification over the campaign, with the magnification seen at each epoch. */
export function lightCurvePlot({ lightCurve, width, height, palette = plotPalette }: LightCurvePlotProps): FigureTree {
  const margins = defaultMargins;
  const x = scaleLinear().domain([0, lightCurve.campaignDays]).range([margins.left, width - margins.right]);
  const [low, high] = extent(lightCurve.curve, (point) => point.y) as [number, number];
  const y = scaleLinear().domain([Math.min(1, low), high * 1.08]).nice().range([height - margins.bottom, margins.top]);
  const path = line<CurvePoint>().x((point) => x(point.x)).y((point) => y(point.y));
  const isPeakInCampaign = lightCurve.peakTimeDays >= 0 && lightCurve.peakTimeDays <= lightCurve.campaignDays;
  return plotSurface(
    { palette, width, height, label: "Microlensing light curve" },
    <>
      {plotAxes({ palette, x, y, width, height, margins, xLabel: "time from campaign start (d)", yLabel: "magnification A", title: "Light curve (point source, point lens)" })}
      {isPeakInCampaign ? (
        <line x1={x(lightCurve.peakTimeDays)} x2={x(lightCurve.peakTimeDays)} y1={margins.top} y2={height - margins.bottom} stroke={palette.frame} strokeDasharray={dashPatterns.dotted} />
      ) : null}
      <path d={path(lightCurve.curve) ?? ""} fill="none" stroke={palette.skyBlue} strokeWidth={2} />
      {lightCurve.epochs.map((epoch) => marker({ shape: "circle", cx: x(epoch.x), cy: y(epoch.y), size: 4, color: palette.orange, isHollow: true }))}
      {plotLegend({
        palette,
        x: margins.left + 8,
        y: margins.top + 6,
        entries: [
          { label: "A(t)", color: palette.skyBlue },
          { label: "visits of the schedule", color: palette.orange, marker: "circle" },
          { label: "peak t_0", color: palette.frame, dash: dashPatterns.dotted },
        ],
      })}
    </>,
  );
}
