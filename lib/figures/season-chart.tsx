import { interpolateCividis, scaleLinear, scaleSequential } from "d3";
import { PlotAxes } from "./plot-axes";
import { plotFont, plotPalette } from "./plot-palette";
import type { SeasonView } from "./season-view";

interface SeasonChartProps {
  view: SeasonView;
  /** Which rows of the view are drawn (the chart stays legible and light at a few dozen rows). */
  targetIndices: number[];
  width?: number;
}

const ROW_HEIGHT = 16;
const LEGEND_Y = 24;
const margins = { top: 58, right: 16, bottom: 46, left: 150 };

/**
 * Usable hours per night (columns) for each target (rows) of a season view (the sky page's dark
 * hours, or a proposal's schedule), shaded on the cividis scale from 0 to the view's
 * `scaleMaxHours` (Nuñez, Anderton & Renslow 2018, PLoS ONE 13, e0199239: monotonic in lightness,
 * so it reads in grayscale and for colour-blind readers). Nights too close to the Sun are hatched;
 * rows with nothing usable in the range are marked ✕.
 */
export function SeasonChart({ view, targetIndices, width = 900 }: SeasonChartProps) {
  const nightCount = view.nightDatesIso.length;
  const height = margins.top + margins.bottom + Math.max(1, targetIndices.length) * ROW_HEIGHT;
  const x = scaleLinear().domain([0, nightCount]).range([margins.left, width - margins.right]);
  x.tickFormat = () => (value) => view.nightDatesIso[Math.min(nightCount - 1, Math.round(Number(value)))]?.slice(5) ?? "";
  const y = scaleLinear().domain([0, Math.max(1, targetIndices.length)]).range([margins.top, height - margins.bottom]);
  const maxHours = view.scaleMaxHours;
  const colour = scaleSequential(interpolateCividis).domain([0, Math.max(1, maxHours)]);
  const cellWidth = (width - margins.left - margins.right) / nightCount;
  const legendStops = [0, 0.25, 0.5, 0.75, 1];
  return (
    <svg xmlns="http://www.w3.org/2000/svg" width="100%" viewBox={`0 0 ${width} ${height}`} role="img" aria-label="Usable dark hours per night for each target" data-testid="season-chart">
      <rect width={width} height={height} fill={plotPalette.ground} />
      <defs>
        <pattern id="season-sun-hatch" width="4" height="4" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
          <line x1="0" y1="0" x2="0" y2="4" stroke={plotPalette.white} strokeWidth="1.5" />
        </pattern>
      </defs>
      <PlotAxes x={x} y={scaleLinear().domain([0, 1]).range([height - margins.bottom, margins.top])} yTicks={0} width={width} height={height} margins={margins} xLabel="night (month-day of the evening)" yLabel="" title="Usable dark hours per night" />
      {targetIndices.map((targetIndex, row) => {
        const target = view.rows[targetIndex];
        return (
          <g key={targetIndex}>
            {Array.from(target.hoursPerNight, (hours, night) => (
              <rect
                key={night}
                x={x(night)}
                y={y(row) + 1}
                width={cellWidth + 0.3}
                height={ROW_HEIGHT - 2}
                fill={target.tooCloseToSunPerNight[night] ? "url(#season-sun-hatch)" : colour(hours)}
              />
            ))}
            <text x={margins.left - 6} y={y(row) + ROW_HEIGHT / 2 + 4} textAnchor="end" fontFamily={plotFont} fontSize={11} fill={target.isEmpty ? plotPalette.vermillion : plotPalette.text}>
              {target.name.slice(0, 22)}
              {target.isEmpty ? " ✕" : ""}
            </text>
          </g>
        );
      })}
      <g fontFamily={plotFont} fontSize={10} fill={plotPalette.text}>
        {legendStops.map((stop, i) => (
          <g key={stop}>
            <rect x={margins.left + i * 46} y={LEGEND_Y} width={44} height={10} fill={colour(stop * Math.max(1, maxHours))} />
            <text x={margins.left + i * 46} y={LEGEND_Y + 22}>{(stop * Math.max(1, maxHours)).toFixed(1)} h</text>
          </g>
        ))}
        <rect x={margins.left + 5 * 46 + 10} y={LEGEND_Y} width={20} height={10} fill="url(#season-sun-hatch)" />
        <text x={margins.left + 5 * 46 + 34} y={LEGEND_Y + 9}>too close to the Sun</text>
      </g>
    </svg>
  );
}
