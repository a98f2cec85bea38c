/** @jsxImportSource hastscript/svg */
import { scaleLinear } from "d3";
import type { LensPlaneLayout } from "@/lib/bench/compute-results";
import type { FigureTree } from "./figure-tree";
import { defaultMargins, marker, plotAxes, plotLegend, plotSurface } from "./plot-axes";
import { dashPatterns, plotPalette, type PlotPalette } from "./plot-palette";

interface LensPlaneDiagramProps {
  layout: LensPlaneLayout;
  /** θ_E in the axis unit, so the diagram reads in that unit. */
  thetaEInUnit: number;
  unitLabel: string;
  width: number;
  height: number;
  /** The screen style unless given; exports draw in `printPalette`. */
  palette?: PlotPalette;
}

/**
 * The lens plane to scale: lens at the origin, Einstein ring, true source position and the images
 * along the lens–source line. Image marker area ∝ |μ|; filled for even parity, hollow for inverted.
 */
export function lensPlaneDiagram({ layout, thetaEInUnit, unitLabel, width, height, palette = plotPalette }: LensPlaneDiagramProps): FigureTree {
  const margins = defaultMargins;
  const reach = Math.max(1.5, ...layout.images.map((image) => Math.abs(image.thetaThetaE) * 1.2), layout.betaThetaE * 1.2) * thetaEInUnit;
  const plotWidth = width - margins.left - margins.right;
  const plotHeight = height - margins.top - margins.bottom;
  const aspect = plotWidth / plotHeight;
  const x = scaleLinear().domain([-reach * aspect, reach * aspect]).range([margins.left, width - margins.right]);
  const y = scaleLinear().domain([-reach, reach]).range([height - margins.bottom, margins.top]);
  const ringRadiusPx = x(thetaEInUnit) - x(0);
  return plotSurface(
    { palette, width, height, label: "Lens-plane diagram" },
    <>
      {plotAxes({ palette, x, y, width, height, margins, xLabel: `angle along the lens–source line (${unitLabel})`, yLabel: `angle across it (${unitLabel})`, title: "Lens plane, to scale" })}
      <circle cx={x(0)} cy={y(0)} r={ringRadiusPx} fill="none" stroke={palette.skyBlue} strokeWidth={1.5} strokeDasharray={dashPatterns.dashed} />
      {marker({ shape: "cross", cx: x(0), cy: y(0), size: 10, color: palette.ink })}
      {marker({ shape: "diamond", cx: x(layout.betaThetaE * thetaEInUnit), cy: y(0), size: 9, color: palette.yellow, isHollow: true })}
      {layout.images.map((image) =>
        marker({
          shape: "circle",
          cx: x(image.thetaThetaE * thetaEInUnit),
          cy: y(0),
          size: Math.min(28, 6 * Math.sqrt(Math.abs(image.magnification))),
          color: palette.orange,
          isHollow: image.magnification < 0,
        }),
      )}
      {plotLegend({
        palette,
        x: margins.left + 8,
        y: margins.top + 6,
        entries: [
          { label: "lens", color: palette.ink, marker: "cross" },
          { label: "Einstein ring θ_E", color: palette.skyBlue, dash: dashPatterns.dashed },
          { label: "source (true position)", color: palette.yellow, marker: "diamond" },
          { label: "images (area ∝ |μ|, hollow: inverted)", color: palette.orange, marker: "circle" },
        ],
      })}
    </>,
  );
}
