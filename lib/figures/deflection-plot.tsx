/** @jsxImportSource hastscript/svg */
import { line, scaleLog } from "d3";
import type { CurvePoint, DeflectionCurves } from "@/lib/bench/plot-data";
import type { FigureTree } from "./figure-tree";
import { defaultMargins, plotAxes, plotLegend, plotSurface } from "./plot-axes";
import { plotText } from "./plot-text";
import { dashPatterns, plotFont, plotPalette, type PlotPalette } from "./plot-palette";

interface DeflectionPlotProps {
  curves: DeflectionCurves;
  width: number;
  height: number;
  /** The screen style unless given; exports draw in `printPalette`. */
  palette?: PlotPalette;
}

/** Deflection α against impact parameter b/M on log axes: exact, weak-field orders 1–3, strong-deflection limit, b_c. */
export function deflectionPlot({ curves, width, height, palette = plotPalette }: DeflectionPlotProps): FigureTree {
  const margins = defaultMargins;
  const x = scaleLog().domain([curves.criticalBOverM * 0.9, curves.exact[curves.exact.length - 1].x]).range([margins.left, width - margins.right]);
  const y = scaleLog().domain([curves.exact[curves.exact.length - 1].y * 0.7, 20]).range([height - margins.bottom, margins.top]).clamp(true);
  const path = line<CurvePoint>().x((point) => x(point.x)).y((point) => y(point.y));
  const series = [
    { label: "exact", points: curves.exact, color: palette.ink, dash: dashPatterns.solid, width: 2.2 },
    { label: "weak field, 4M/b", points: curves.weakField[1], color: palette.skyBlue, dash: dashPatterns.dashed, width: 1.6 },
    { label: "weak field, 2nd order", points: curves.weakField[2], color: palette.bluishGreen, dash: dashPatterns.dashDot, width: 1.6 },
    { label: "weak field, 3rd order", points: curves.weakField[3], color: palette.orange, dash: dashPatterns.longDash, width: 1.6 },
    { label: "strong-deflection limit", points: curves.strongField, color: palette.reddishPurple, dash: dashPatterns.dotted, width: 2.2 },
  ];
  const xCritical = x(curves.criticalBOverM);
  return plotSurface(
    { palette, width, height, label: "Deflection angle against impact parameter" },
    <>
      {plotAxes({ palette, x, y, width, height, margins, xLabel: "impact parameter b / M (M = GM/c²)", yLabel: "deflection α (rad)", title: "Deflection angle", xTicks: 5, yTicks: 5 })}
      <g clipPath="url(#deflection-clip)">
        <clipPath id="deflection-clip">
          <rect x={margins.left} y={margins.top} width={width - margins.left - margins.right} height={height - margins.top - margins.bottom} />
        </clipPath>
        {series.map((entry) => (
          <path d={path(entry.points) ?? ""} fill="none" stroke={entry.color} strokeWidth={entry.width} strokeDasharray={entry.dash} />
        ))}
      </g>
      <line x1={xCritical} x2={xCritical} y1={margins.top} y2={height - margins.bottom} stroke={palette.vermillion} strokeWidth={1.5} strokeDasharray="3 2" />
      <text x={xCritical + 4} y={height - margins.bottom - 6} fontFamily={plotFont} fontSize={11} fill={palette.vermillion}>
        {plotText({ text: "b_c = 3√3 M", fontSize: 11 })}
      </text>
      {plotLegend({ palette, x: width - margins.right - 170, y: margins.top + 6, entries: series.map(({ label, color, dash }) => ({ label, color, dash })) })}
    </>,
  );
}
