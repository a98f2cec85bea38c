/** @jsxImportSource hastscript/svg */
import { interpolateCividis, scaleLinear, scaleSequential } from "d3";
import { svgElement, type FigureTree } from "./figure-tree";
import { marker, plotAxes } from "./plot-axes";
import { plotFont, plotPalette, type PlotPalette } from "./plot-palette";
import type { SeasonView } from "./season-view";

interface SeasonChartProps {
  view: SeasonView;
  /** Which rows of the view are drawn (the chart stays legible and light at a few dozen rows). */
  targetIndices: number[];
  width?: number;
  /** The screen style unless given; exports draw in `printPalette`. */
  palette?: PlotPalette;
}

const ROW_HEIGHT = 16;
const LINE_HEIGHT = 12;
const LEGEND_Y = 24;
/** Width of one character of an 11 px label, a generous average for Source Sans 3 (px). */
const LABEL_CHAR_PX = 5.6;
/** Room right of a name for the ✕ of an empty row (px). */
const NAME_GAP_PX = 20;
/** The right margin holds half of the last tick's date. */
const margins = { top: 58, right: 34, bottom: 46 };
const MIN_LEFT_PX = 150;
/** The name column takes at most this share of the width; longer names wrap onto more lines. */
const MAX_LEFT_SHARE = 0.34;

/** A name cut into lines of at most `maxChars` characters, at spaces where it can be (a long word is cut). */
export function wrapName(name: string, maxChars: number): string[] {
  const lines: string[] = [];
  let line = "";
  for (const word of name.split(/\s+/)) {
    let rest = word;
    while (rest.length > 0) {
      const room = line === "" ? maxChars : maxChars - line.length - 1;
      if (rest.length <= room) {
        line = line === "" ? rest : `${line} ${rest}`;
        rest = "";
      } else if (line !== "") {
        lines.push(line);
        line = "";
      } else {
        lines.push(rest.slice(0, maxChars));
        rest = rest.slice(maxChars);
      }
    }
  }
  if (line !== "") lines.push(line);
  return lines.length === 0 ? [""] : lines;
}

/** "2031" or "2031–2032": the years the nights span, for the axis label. */
function yearSpan(nightDatesIso: readonly string[]): string {
  const first = nightDatesIso[0]?.slice(0, 4) ?? "";
  const last = nightDatesIso.at(-1)?.slice(0, 4) ?? first;
  return first === last ? first : `${first}–${last}`;
}

/**
 * Usable hours per night (columns) for each target (rows) of a season view (the sky page's dark
 * hours, or a proposal's schedule), shaded on the cividis scale from 0 to the view's
 * `scaleMaxHours` (Nuñez, Anderton & Renslow 2018, PLoS ONE 13, e0199239: monotonic in lightness,
 * so it reads in grayscale and for colour-blind readers). Nights too close to the Sun are hatched;
 * rows with nothing usable in the range are marked with a cross. Ticks carry full dates (the year
 * included); names are never cut: the name column widens to the longest, then long names wrap.
 */
export function seasonChart({ view, targetIndices, width = 900, palette = plotPalette }: SeasonChartProps): FigureTree {
  const nightCount = view.nightDatesIso.length;
  const longest = Math.max(0, ...targetIndices.map((index) => view.rows[index].name.length));
  const left = Math.round(Math.min(width * MAX_LEFT_SHARE, Math.max(MIN_LEFT_PX, longest * LABEL_CHAR_PX + NAME_GAP_PX + 8)));
  const maxChars = Math.max(8, Math.floor((left - NAME_GAP_PX - 8) / LABEL_CHAR_PX));
  const names = targetIndices.map((index) => wrapName(view.rows[index].name, maxChars));
  const rowTops: number[] = [];
  let bottom = margins.top;
  for (const lines of names) {
    rowTops.push(bottom);
    bottom += ROW_HEIGHT + (lines.length - 1) * LINE_HEIGHT;
  }
  if (names.length === 0) bottom += ROW_HEIGHT;
  const height = bottom + margins.bottom;
  const chartMargins = { ...margins, left };
  const x = scaleLinear().domain([0, nightCount]).range([left, width - margins.right]);
  x.tickFormat = () => (value) => view.nightDatesIso[Math.min(nightCount - 1, Math.round(Number(value)))] ?? "";
  const maxHours = view.scaleMaxHours;
  const colour = scaleSequential(interpolateCividis).domain([0, Math.max(1, maxHours)]);
  const cellWidth = (width - left - margins.right) / nightCount;
  const legendStops = [0, 0.25, 0.5, 0.75, 1];
  return svgElement(
    <svg xmlns="http://www.w3.org/2000/svg" width="100%" viewBox={`0 0 ${width} ${height}`} role="img" aria-label="Usable dark hours per night for each target" data-testid="season-chart">
      <rect width={width} height={height} fill={palette.ground} />
      <defs>
        <pattern id="season-sun-hatch" width="4" height="4" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
          <line x1="0" y1="0" x2="0" y2="4" stroke={palette.ink} strokeWidth="1.5" />
        </pattern>
      </defs>
      {plotAxes({
        palette,
        x,
        y: scaleLinear().domain([0, 1]).range([height - margins.bottom, margins.top]),
        yTicks: 0,
        width,
        height,
        margins: chartMargins,
        xLabel: `night (evening date, ${yearSpan(view.nightDatesIso)})`,
        yLabel: "",
        title: "Usable dark hours per night",
      })}
      {targetIndices.map((targetIndex, row) => {
        const target = view.rows[targetIndex];
        const top = rowTops[row];
        const rowHeight = ROW_HEIGHT + (names[row].length - 1) * LINE_HEIGHT;
        return (
          <g>
            {Array.from(target.hoursPerNight, (hours, night) => (
              <rect
                x={x(night)}
                y={top + 1}
                width={cellWidth + 0.3}
                height={rowHeight - 2}
                fill={target.tooCloseToSunPerNight[night] ? "url(#season-sun-hatch)" : colour(hours)}
              />
            ))}
            <text x={left - NAME_GAP_PX} y={top + ROW_HEIGHT / 2 + 4} textAnchor="end" fontFamily={plotFont} fontSize={11} fill={target.isEmpty ? palette.vermillion : palette.text}>
              {names[row].map((line, index) => (
                <tspan x={left - NAME_GAP_PX} dy={index === 0 ? undefined : LINE_HEIGHT}>
                  {line}
                </tspan>
              ))}
            </text>
            {/* A drawn cross rather than the ✕ character, which no embedded font has. */}
            {target.isEmpty ? marker({ shape: "cross", cx: left - NAME_GAP_PX / 2, cy: top + ROW_HEIGHT / 2, size: 7, color: palette.vermillion }) : null}
          </g>
        );
      })}
      <g fontFamily={plotFont} fontSize={10} fill={palette.text}>
        {legendStops.map((stop, i) => (
          <g>
            <rect x={left + i * 46} y={LEGEND_Y} width={44} height={10} fill={colour(stop * Math.max(1, maxHours))} />
            <text x={left + i * 46} y={LEGEND_Y + 22}>{(stop * Math.max(1, maxHours)).toFixed(1)} h</text>
          </g>
        ))}
        <rect x={left + 5 * 46 + 10} y={LEGEND_Y} width={20} height={10} fill="url(#season-sun-hatch)" stroke={palette.grid} strokeWidth={0.5} />
        <text x={left + 5 * 46 + 34} y={LEGEND_Y + 9}>too close to the Sun</text>
        {marker({ shape: "cross", cx: left + 5 * 46 + 150, cy: LEGEND_Y + 5, size: 7, color: palette.vermillion })}
        <text x={left + 5 * 46 + 158} y={LEGEND_Y + 9}>no usable night</text>
      </g>
    </svg>,
  );
}
