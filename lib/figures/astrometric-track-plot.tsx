/** @jsxImportSource hastscript/svg */
import { line, scaleLinear } from "d3";
import type { AstrometricTrack, CurvePoint } from "@/lib/bench/plot-data";
import type { FigureTree } from "./figure-tree";
import { defaultMargins, marker, plotAxes, plotLegend, plotSurface } from "./plot-axes";
import { plotPalette, type PlotPalette } from "./plot-palette";

interface AstrometricTrackPlotProps {
  track: AstrometricTrack;
  /** Angle per θ_E in the axis unit (e.g. θ_E in µas), so axes read in that unit. */
  thetaEInUnit: number;
  unitLabel: string;
  width: number;
  height: number;
  /** The screen style unless given; exports draw in `printPalette`. */
  palette?: PlotPalette;
}

/** The centroid shift of the images on the sky through the event, to equal scale on both axes. */
export function astrometricTrackPlot({ track, thetaEInUnit, unitLabel, width, height, palette = plotPalette }: AstrometricTrackPlotProps): FigureTree {
  const margins = defaultMargins;
  // Centroid shift peaks at θ_E/(2√2) ≈ 0.354 θ_E (u = √2); ±0.4 θ_E holds the whole track.
  const half = 0.4 * thetaEInUnit;
  const plotWidth = width - margins.left - margins.right;
  const plotHeight = height - margins.top - margins.bottom;
  const aspect = plotWidth / plotHeight;
  const x = scaleLinear().domain([-half * aspect, half * aspect]).range([margins.left, width - margins.right]);
  const y = scaleLinear().domain([-half, half]).range([height - margins.bottom, margins.top]);
  const path = line<CurvePoint>().x((point) => x(point.x * thetaEInUnit)).y((point) => y(point.y * thetaEInUnit));
  return plotSurface(
    { palette, width, height, label: "Astrometric centroid track" },
    <>
      {plotAxes({ palette, x, y, width, height, margins, xLabel: `shift along the lens–source motion (${unitLabel})`, yLabel: `shift across it (${unitLabel})`, title: "Astrometric centroid shift" })}
      <path d={path(track.track) ?? ""} fill="none" stroke={palette.bluishGreen} strokeWidth={2} />
      {track.epochs.map((epoch) => marker({ shape: "square", cx: x(epoch.x * thetaEInUnit), cy: y(epoch.y * thetaEInUnit), size: 4, color: palette.orange, isHollow: true }))}
      {marker({ shape: "cross", cx: x(0), cy: y(0), size: 8, color: palette.ink })}
      {plotLegend({
        palette,
        x: margins.left + 8,
        y: margins.top + 6,
        entries: [
          { label: "centroid track, t_0 ± 6 t_E", color: palette.bluishGreen },
          { label: "epochs in the campaign", color: palette.orange, marker: "square" },
          { label: "unlensed source position", color: palette.ink, marker: "cross" },
        ],
      })}
    </>,
  );
}
