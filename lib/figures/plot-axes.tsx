/** @jsxImportSource hastscript/svg */
import type { ScaleContinuousNumeric } from "d3";
import type { Result } from "hastscript";
import { svgElement, type FigureTree } from "./figure-tree";
import { plotFont, plotPalette, type PlotPalette } from "./plot-palette";
import { plainText, plotText } from "./plot-text";
import { axisTicks } from "./plot-ticks";

export interface PlotMargins {
  top: number;
  right: number;
  bottom: number;
  left: number;
}

export const defaultMargins: PlotMargins = { top: 28, right: 16, bottom: 46, left: 62 };

type Scale = ScaleContinuousNumeric<number, number>;

interface AxesProps {
  x: Scale;
  y: Scale;
  width: number;
  height: number;
  margins: PlotMargins;
  xLabel: string;
  yLabel: string;
  xTicks?: number;
  yTicks?: number;
  /** Plain text (it may carry a target's name); the axis labels take plotText's `_` and `^` scripts. */
  title: string;
  palette?: PlotPalette;
}

/** Frame, grid, ticks and axis labels (with units) drawn from d3 scales, as SVG elements. */
export function plotAxes({ x, y, width, height, margins, xLabel, yLabel, xTicks = 6, yTicks = 5, title, palette = plotPalette }: AxesProps): FigureTree {
  const [x0, x1] = [margins.left, width - margins.right];
  const [y0, y1] = [height - margins.bottom, margins.top];
  const xTickList = axisTicks(x, xTicks).filter((tick) => x(tick.value) >= x0 - 0.5 && x(tick.value) <= x1 + 0.5);
  const yTickList = axisTicks(y, yTicks).filter((tick) => y(tick.value) <= y0 + 0.5 && y(tick.value) >= y1 - 0.5);
  return svgElement(
    <g fontFamily={plotFont} fontSize={11} fill={palette.text}>
      <text x={margins.left} y={16} fontSize={13} fontWeight={600}>
        {title}
      </text>
      {xTickList.map((tick) => (
        <g>
          {tick.label === null ? null : <line x1={x(tick.value)} x2={x(tick.value)} y1={y0} y2={y1} stroke={palette.grid} />}
          <line x1={x(tick.value)} x2={x(tick.value)} y1={y0} y2={y0 + (tick.label === null ? 2.5 : 4)} stroke={palette.frame} />
          {tick.label === null ? null : (
            <text x={x(tick.value)} y={y0 + 16} textAnchor="middle">
              {plotText({ text: tick.label, fontSize: 11 })}
            </text>
          )}
        </g>
      ))}
      {yTickList.map((tick) => (
        <g>
          {tick.label === null ? null : <line x1={x0} x2={x1} y1={y(tick.value)} y2={y(tick.value)} stroke={palette.grid} />}
          <line x1={x0 - (tick.label === null ? 2.5 : 4)} x2={x0} y1={y(tick.value)} y2={y(tick.value)} stroke={palette.frame} />
          {tick.label === null ? null : (
            <text x={x0 - 7} y={y(tick.value) + 4} textAnchor="end">
              {plotText({ text: tick.label, fontSize: 11 })}
            </text>
          )}
        </g>
      ))}
      <rect x={x0} y={y1} width={x1 - x0} height={y0 - y1} fill="none" stroke={palette.frame} />
      <text x={(x0 + x1) / 2} y={height - 8} textAnchor="middle" fontSize={12}>
        {plotText({ text: xLabel, fontSize: 12 })}
      </text>
      <text transform={`translate(14 ${(y0 + y1) / 2}) rotate(-90)`} textAnchor="middle" fontSize={12}>
        {plotText({ text: yLabel, fontSize: 12 })}
      </text>
    </g>
  );
}

export interface LegendEntry {
  label: string;
  color: string;
  dash?: string;
  marker?: "circle" | "square" | "triangle" | "diamond" | "cross";
}

/** A marker shape centred on (cx, cy), so series differ by shape as well as colour. */
export function marker({ shape, cx, cy, size, color, isHollow = false }: { shape: NonNullable<LegendEntry["marker"]>; cx: number; cy: number; size: number; color: string; isHollow?: boolean }): FigureTree {
  const fill = isHollow ? "none" : color;
  const r = size / 2;
  switch (shape) {
    case "circle":
      return svgElement(<circle cx={cx} cy={cy} r={r} fill={fill} stroke={color} strokeWidth={1.5} />);
    case "square":
      return svgElement(<rect x={cx - r} y={cy - r} width={size} height={size} fill={fill} stroke={color} strokeWidth={1.5} />);
    case "triangle":
      return svgElement(<path d={`M${cx},${cy - r} L${cx + r},${cy + r} L${cx - r},${cy + r} Z`} fill={fill} stroke={color} strokeWidth={1.5} />);
    case "diamond":
      return svgElement(<path d={`M${cx},${cy - r} L${cx + r},${cy} L${cx},${cy + r} L${cx - r},${cy} Z`} fill={fill} stroke={color} strokeWidth={1.5} />);
    case "cross":
      return svgElement(<path d={`M${cx - r},${cy - r} L${cx + r},${cy + r} M${cx - r},${cy + r} L${cx + r},${cy - r}`} stroke={color} strokeWidth={2} />);
  }
}

/**
 * A legend at (x, y): a line sample (with its dash) and/or a marker per entry, in a box one entry a
 * row, or with `isRow` side by side without a box (for a strip between a title and its plot).
 */
export function plotLegend({ entries, x, y, isRow = false, palette = plotPalette }: { entries: LegendEntry[]; x: number; y: number; isRow?: boolean; palette?: PlotPalette }): FigureTree {
  const rowHeight = 15;
  const width = 12 + 30 + 6 + Math.max(...entries.map((entry) => plainText(entry.label).length)) * 5.6;
  let left = x;
  const places = entries.map((entry, index) => {
    if (!isRow) return { x, cy: y + 11 + index * rowHeight };
    const place = { x: left, cy: y + 11 };
    left += 48 + plainText(entry.label).length * 5.6;
    return place;
  });
  return svgElement(
    <g fontFamily={plotFont} fontSize={11} fill={palette.text}>
      {isRow ? null : <rect x={x} y={y} width={width} height={entries.length * rowHeight + 8} fill={palette.ground} fillOpacity={0.85} stroke={palette.grid} />}
      {entries.map((entry, index) => {
        const { x: at, cy } = places[index];
        return (
          <g>
            {entry.marker === undefined ? (
              <line x1={at + 6} x2={at + 36} y1={cy} y2={cy} stroke={entry.color} strokeWidth={2} strokeDasharray={entry.dash} />
            ) : (
              marker({ shape: entry.marker, cx: at + 21, cy, size: 7, color: entry.color })
            )}
            <text x={at + 42} y={cy + 4}>
              {plotText({ text: entry.label, fontSize: 11 })}
            </text>
          </g>
        );
      })}
    </g>
  );
}

/** The self-contained SVG of one plot, around `content`: its own size, its style's ground and accessible name. */
export function plotSurface({ width, height, label, palette = plotPalette }: { width: number; height: number; label: string; palette?: PlotPalette }, content: Result): FigureTree {
  return svgElement(
    <svg xmlns="http://www.w3.org/2000/svg" width={width} height={height} viewBox={`0 0 ${width} ${height}`} role="img" aria-label={label}>
      <rect width={width} height={height} fill={palette.ground} />
      {content}
    </svg>
  );
}
