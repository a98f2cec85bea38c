/** @jsxImportSource hastscript/svg */
import { area, line, scaleLinear } from "d3";
import { dateFromJdUtc } from "@/lib/astro/time";
import type { EventFitView } from "./event-fit-view";
import type { FigureTree } from "./figure-tree";
import { marker, plotAxes, plotLegend, plotSurface, type LegendEntry, type PlotMargins } from "./plot-axes";
import { dashPatterns, plotPalette, type PlotPalette } from "./plot-palette";

/** The figure's size (CSS px) on the target page and in the exports. */
export const EVENT_FIT_WIDTH_PX = 760;
export const EVENT_FIT_HEIGHT_PX = 460;

/** The figure's title, the same on the page and in every export. */
export function eventFitTitle(targetName: string, fit: { chi2: number; dof: number }): string {
  return `Light curve of ${targetName} with its point-lens fit (χ²/dof = ${(fit.chi2 / fit.dof).toFixed(2)})`;
}

interface EventFitPlotProps {
  view: EventFitView;
  /** Plain text; the figure's accessible name too. */
  title: string;
  width: number;
  height: number;
  /** The screen style unless given; exports draw in `printPalette`. */
  palette?: PlotPalette;
  /** Starts the ids of the figure's clip paths, which must be unique in the page or file (`url(#…)` finds the first). */
  idPrefix?: string;
}

/** Share of the height the light-curve panel takes; the residual panel has the rest. */
const MAIN_PANEL_SHARE = 0.72;
const margins: PlotMargins = { top: 28, right: 16, bottom: 20, left: 62 };
const residualMargins: PlotMargins = { top: 6, right: 16, bottom: 46, left: 62 };
/** Height of a schedule visit's tick at the foot of the light-curve panel, px. */
const VISIT_TICK_PX = 9;

/** The time axis: days from the view's origin (a midnight UTC), labelled with the calendar date UTC. */
function timeScale(view: EventFitView, width: number, withLabels: boolean) {
  const [from, to] = view.timeDomainJdUtc;
  const x = scaleLinear()
    .domain([from - view.originJdUtc, to - view.originJdUtc])
    .range([margins.left, width - margins.right]);
  // plotAxes labels ticks through the scale's own tickFormat: whole days from a midnight are dates.
  x.tickFormat = () => (value) => (withLabels ? dateFromJdUtc(view.originJdUtc + Number(value)).toISOString().slice(0, 10) : "");
  return x;
}

/**
 * A microlensing event's photometry with its point-lens fit (event-fit-view.ts): every dataset on the
 * reference dataset's magnitudes with its error bars and its own marker and colour, the model, the
 * prediction's 68 % band over the next days with the site's usable windows shaded and the schedule's
 * visits ticked at the foot, and the residuals below against calendar dates (UTC).
 */
export function eventFitPlot({ view, title, width, height, palette = plotPalette, idPrefix: idBase = "event-fit" }: EventFitPlotProps): FigureTree {
  const mainHeight = Math.round(height * MAIN_PANEL_SHARE);
  const residualHeight = height - mainHeight;
  const x = timeScale(view, width, false);
  const xResidual = timeScale(view, width, true);
  const at = (jdUtc: number) => x(jdUtc - view.originJdUtc);
  const y = scaleLinear().domain(view.magnitudeDomain).range([mainHeight - margins.bottom, margins.top]);
  const yResidual = scaleLinear()
    .domain([view.residualLimitMag, -view.residualLimitMag])
    .range([residualHeight - residualMargins.bottom, residualMargins.top]);
  const top = margins.top;
  const bottom = mainHeight - margins.bottom;
  const isDrawn = (value: number) => Number.isFinite(value);
  const curve = line<number>()
    .defined((k) => isDrawn(view.model.magnitude[k]))
    .x((k) => at(view.model.tJdUtc[k]))
    .y((k) => y(view.model.magnitude[k]));
  const { prediction } = view;
  const band = prediction
    ? area<number>()
        .defined((k) => isDrawn(prediction.bright[k]) && isDrawn(prediction.faint[k]))
        .x((k) => at(prediction.tJdUtc[k]))
        .y0((k) => y(prediction.faint[k]))
        .y1((k) => y(prediction.bright[k]))
    : null;
  const bandEdge = (values: Float64Array) =>
    line<number>()
      .defined((k) => isDrawn(values[k]))
      .x((k) => at(prediction!.tJdUtc[k]))
      .y((k) => y(values[k]))(Array.from(values, (_, k) => k)) ?? "";
  const predictionIndices = prediction ? Array.from(prediction.tJdUtc, (_, k) => k) : [];
  const legend: LegendEntry[] = [
    ...view.datasets.map((d) => ({ label: d.errorScale === 1 ? d.name : `${d.name} (errors × ${d.errorScale.toFixed(2)})`, color: palette[d.colour], marker: d.marker })),
    { label: `model (on ${view.referenceDataset})`, color: palette.ink },
    ...(prediction ? [{ label: "prediction, 68 % band", color: palette.ink, dash: dashPatterns.dotted }] : []),
    ...(view.windows.length > 0 ? [{ label: "site's usable windows (shaded)", color: palette.bluishGreen, marker: "square" as const }] : []),
    ...(view.visitsJdUtc.length > 0 ? [{ label: "schedule visits (ticks at the foot)", color: palette.vermillion, dash: dashPatterns.dashDot }] : []),
  ];
  return plotSurface(
    { palette, width, height, label: title },
    <>
      <defs>
        <clipPath id={`${idBase}-main`}>
          <rect x={margins.left} y={top} width={width - margins.left - margins.right} height={bottom - top} />
        </clipPath>
        <clipPath id={`${idBase}-residual`}>
          <rect x={residualMargins.left} y={residualMargins.top} width={width - residualMargins.left - residualMargins.right} height={residualHeight - residualMargins.top - residualMargins.bottom} />
        </clipPath>
      </defs>
      {view.windows.map((w) => (
        <rect x={at(w.startJdUtc)} width={Math.max(0.5, at(w.endJdUtc) - at(w.startJdUtc))} y={top} height={bottom - top} fill={palette.bluishGreen} fillOpacity={0.18} />
      ))}
      {plotAxes({ palette, x, y, width, height: mainHeight, margins, xLabel: "", yLabel: `magnitude (${view.referenceDataset} scale)`, title })}
      <g clipPath={`url(#${idBase}-main)`}>
        {band && prediction ? (
          <>
            <path d={band(predictionIndices) ?? ""} fill={palette.ink} fillOpacity={0.12} stroke="none" />
            <path d={bandEdge(prediction.bright)} fill="none" stroke={palette.ink} strokeWidth={1} strokeDasharray={dashPatterns.dotted} />
            <path d={bandEdge(prediction.faint)} fill="none" stroke={palette.ink} strokeWidth={1} strokeDasharray={dashPatterns.dotted} />
          </>
        ) : null}
        {view.datasets.map((d) => (
          <g stroke={palette[d.colour]}>
            {Array.from(d.magnitude, (m, k) =>
              isDrawn(m) && isDrawn(d.magnitudeError[k]) ? <line x1={at(d.tJdUtc[k])} x2={at(d.tJdUtc[k])} y1={y(m - d.magnitudeError[k])} y2={y(m + d.magnitudeError[k])} strokeWidth={1} /> : null,
            )}
            {Array.from(d.magnitude, (m, k) => (isDrawn(m) ? marker({ shape: d.marker, cx: at(d.tJdUtc[k]), cy: y(m), size: 5, color: palette[d.colour] }) : null))}
          </g>
        ))}
        <path d={curve(Array.from(view.model.tJdUtc, (_, k) => k)) ?? ""} fill="none" stroke={palette.ink} strokeWidth={1.5} />
        {Array.from(view.visitsJdUtc, (t) => (
          <line x1={at(t)} x2={at(t)} y1={bottom} y2={bottom - VISIT_TICK_PX} stroke={palette.vermillion} strokeWidth={1} />
        ))}
      </g>
      {plotLegend({ palette, x: margins.left + 8, y: top + 6, entries: legend })}
      <g transform={`translate(0 ${mainHeight})`}>
        {plotAxes({ palette, x: xResidual, y: yResidual, width, height: residualHeight, margins: residualMargins, xLabel: "date (UTC)", yLabel: "data − model (mag)", yTicks: 3, title: "" })}
        <g clipPath={`url(#${idBase}-residual)`}>
          <line x1={residualMargins.left} x2={width - residualMargins.right} y1={yResidual(0)} y2={yResidual(0)} stroke={palette.ink} strokeWidth={1} />
          {view.datasets.map((d) => (
            <g stroke={palette[d.colour]}>
              {Array.from(d.residualMag, (r, k) =>
                isDrawn(r) ? (
                  <g>
                    {isDrawn(d.magnitudeError[k]) ? <line x1={at(d.tJdUtc[k])} x2={at(d.tJdUtc[k])} y1={yResidual(r - d.magnitudeError[k])} y2={yResidual(r + d.magnitudeError[k])} strokeWidth={1} /> : null}
                    {marker({ shape: d.marker, cx: at(d.tJdUtc[k]), cy: yResidual(r), size: 4, color: palette[d.colour] })}
                  </g>
                ) : null,
              )}
            </g>
          ))}
        </g>
      </g>
    </>,
  );
}
