/** @jsxImportSource hastscript/svg */
import { line, scaleLinear, scaleLog, type ScaleContinuousNumeric } from "d3";
import type { Result } from "hastscript";
import { addDaysIso } from "@/lib/astro/time";
import type { TargetPhotonBudget } from "@/lib/lensing/photon-budget";
import type { EventTiming, ScienceCaseId } from "@/lib/lensing/science-case-inputs";
import { dateWords, dayWords, daysWords, numberWords } from "@/lib/lensing/science-case-words";
import type { LensSolution } from "@/lib/lensing/solution";
import { DAY_S } from "@/lib/physics/constants";
import type { ObservingSchedule, ScheduleGapReason } from "@/lib/schedule";
import { gapReasonLabels, nightRuns, nightSpans, scheduleSummary, visitMarks, type NightRun, type NightSpan } from "@/lib/schedule/timeline-plot";
import { svgElement, type FigureTree } from "./figure-tree";
import { defaultMargins, marker, plotAxes } from "./plot-axes";
import { dashPatterns, plotFont, plotPalette } from "./plot-palette";
import { signalToNoiseAxis, signalToNoiseMarks } from "./signal-to-noise-track";
import { delayedImagesTimeline, lightCurveTimeline, type TimelinePoint } from "./timeline-event";

export interface ScheduleTimelineInput {
  /** The target's simulated schedule over the proposal's cycle. */
  schedule: ObservingSchedule;
  /** The case the target is answered in; null when the hypothesis gives no lens solution. */
  caseId: ScienceCaseId | null;
  solution: LensSolution | null;
  /** t0, u0, ρ and limb darkening; null without a lens solution. */
  event: EventTiming | null;
  /** The target's photon budget: its S/N per visit is drawn as a track under the event; null or absent without one. */
  photonBudget?: TargetPhotonBudget | null;
  /** The figure's width (CSS px); its height follows from the panels drawn. */
  width?: number;
  /** Starts the ids of the figure's clip paths and hatch, which must be unique in the page (`url(#…)` finds the first). */
  idPrefix?: string;
}

/** The figure's width on the target page (CSS px). */
export const SCHEDULE_TIMELINE_WIDTH_PX = 760;
const LABEL_BASELINE = 44;
const BRACKET_Y = 49;
const PANEL_TOP = 56;
const EVENT_HEIGHT = 170;
const PANEL_GAP = 22;
const NIGHTS_HEIGHT = 140;
const SIGNAL_TO_NOISE_HEIGHT = 120;
/** Width of a character of the 11-px plot font, roughly (as plotLegend reckons it), and the space kept between labels. */
const CHAR_WIDTH_PX = 5.6;
const LABEL_SPACING_PX = 4;

/** Pixel coordinates to a tenth of a pixel: the page carries hundreds of shapes, and more digits draw nothing more. */
const tenth = (px: number) => Math.round(px * 10) / 10;

/** How each part of a night is drawn (the Sun's part hatched in its colour); daylight is the panel's ground. */
export const spanFill: Record<NightSpan["kind"], string> = {
  usable: plotPalette.bluishGreen,
  daylight: "#2c3446",
  "below-limit": plotPalette.skyBlue,
  sun: plotPalette.orange,
  moon: plotPalette.yellow,
  weather: plotPalette.reddishPurple,
};
const spanOpacity: Record<NightSpan["kind"], number> = { usable: 0.9, daylight: 1, "below-limit": 0.3, sun: 1, moon: 0.55, weather: 0.5 };

export type EventPanel =
  | { kind: "light-curve"; points: TimelinePoint[]; marks: TimelinePoint[]; peak: TimelinePoint | null; peakJdUtc: number; legend: string; note: string }
  | { kind: "delay"; leading: TimelinePoint[]; trailing: TimelinePoint[]; leadingMarks: TimelinePoint[]; trailingMarks: TimelinePoint[]; flareJdUtc: number; echoJdUtc: number; note: string };

/** What the event panel draws for the case, or a sentence saying why it draws nothing. */
function eventPanelOf(input: ScheduleTimelineInput, markJdUtc: number[]): EventPanel | string | null {
  const { schedule, caseId, solution, event } = input;
  const span = schedule.cycle;
  if (caseId === "photometric-microlensing" || caseId === "astrometric-microlensing") {
    const missing = [
      event?.peakJdUtc == null ? "the event's peak date (t0)" : null,
      solution?.einsteinTimeS == null ? "the relative proper motion (for t_E)" : null,
      event?.impactParameterThetaE == null ? "the impact parameter u0" : null,
    ].filter((words) => words !== null);
    if (missing.length > 0 || solution == null || event == null) {
      const list = missing.length > 1 ? `${missing.slice(0, -1).join(", ")} and ${missing.at(-1)}` : missing[0];
      return `Set ${list} to draw the light curve over the schedule.`;
    }
    const rho = event.sourceRadiusThetaE;
    const hasDisk = rho !== null && rho > 0;
    const curve = lightCurveTimeline(
      { peakJdUtc: event.peakJdUtc!, einsteinTimeDays: solution.einsteinTimeS! / DAY_S, impactParameterThetaE: event.impactParameterThetaE!, sourceRadiusThetaE: rho, limbDarkeningU: event.limbDarkeningU },
      span,
      markJdUtc,
    );
    const source = hasDisk ? `finite source ρ = ${numberWords(rho)}${event.limbDarkeningU > 0 ? `, limb darkening ${numberWords(event.limbDarkeningU)}` : ""}` : "point source";
    const where = curve.peak === null && (event.peakJdUtc! < span.startJdUtc || event.peakJdUtc! > span.endJdUtc) ? ` t0 (${dateWords(event.peakJdUtc!)}) falls outside the cycle: the chart shows the part of the light curve within it.` : "";
    return {
      kind: "light-curve",
      ...curve,
      peakJdUtc: event.peakJdUtc!,
      legend: `A(t), ${source}`,
      note: `Top: the light curve A(t) (Paczyński 1986, ${source}; t_E = ${daysWords(solution.einsteinTimeS! / DAY_S)}, u0 = ${numberWords(event.impactParameterThetaE!)}), each visit marked at the magnification it would see.${where}`,
    };
  }
  if (caseId === "time-delay") {
    if (solution?.timeDelayS == null || solution.fluxRatio === null) return "This lens forms one image here, so there is no delayed variation to draw.";
    const delayDays = solution.timeDelayS / DAY_S;
    // Flare and echo placed symmetrically in the cycle when both fit, else the flare a quarter in.
    const cycleDays = span.endJdUtc - span.startJdUtc;
    const flareJdUtc = span.startJdUtc + (delayDays < cycleDays ? (cycleDays - delayDays) / 2 : cycleDays / 4);
    const curves = delayedImagesTimeline(delayDays, solution.fluxRatio, flareJdUtc, span, markJdUtc);
    const echo = curves.echoJdUtc > span.endJdUtc ? `${dayWords(curves.echoJdUtc)}, after the cycle ends` : delayDays < 1 ? "too close to separate at this scale" : dayWords(curves.echoJdUtc);
    return {
      kind: "delay",
      ...curves,
      note: `Top, illustrative only (not a model of the source): a flare of the source as the brighter image shows it on ${dayWords(flareJdUtc)} and the fainter image Δt = ${daysWords(delayDays)} later (${echo}), ${numberWords(-curves.trailingOffsetMag)} mag fainter (flux ratio ${numberWords(solution.fluxRatio)}); visits marked on both.`,
    };
  }
  return null;
}

/**
 * Where the named runs' labels go: longest runs first, each centred over its run (kept inside the
 * plot), with its full name, else its reason alone, else none where it would overlap a label
 * already placed.
 */
function placeGapLabels(runs: NightRun[], x: ScaleContinuousNumeric<number, number>): { x: number; text: string; reason: ScheduleGapReason }[] {
  const [x0, x1] = x.range();
  const placed: { x: number; text: string; reason: ScheduleGapReason; left: number; right: number }[] = [];
  const named = runs.filter((run) => run.label !== null && run.reason !== null).sort((a, b) => b.nightCount - a.nightCount);
  for (const run of named) {
    const centre = (x(run.firstNight) + x(run.firstNight + run.nightCount)) / 2;
    for (const text of [run.label!, gapReasonLabels[run.reason!]]) {
      const half = (text.length * CHAR_WIDTH_PX) / 2;
      const at = Math.min(Math.max(centre, x0 + half), x1 - half);
      const [left, right] = [at - half - LABEL_SPACING_PX, at + half + LABEL_SPACING_PX];
      if (placed.every((other) => right <= other.left || left >= other.right)) {
        placed.push({ x: at, text, reason: run.reason!, left, right });
        break;
      }
    }
  }
  return placed;
}

/** A y scale for magnifications: logarithmic when they span more than a factor of ten. */
function magnificationScale(points: TimelinePoint[], top: number, bottom: number): ScaleContinuousNumeric<number, number> {
  let high = 1;
  for (const point of points) high = Math.max(high, point.value);
  if (high > 10) return scaleLog().domain([1, high * 1.2]).range([bottom, top]).clamp(true);
  return scaleLinear().domain([1, Math.max(1.01, high * 1.05)]).nice().range([bottom, top]);
}
/** The schedule's figure and what its caption and legend say about it. */
export interface ScheduleTimelineFigure {
  tree: FigureTree;
  /** What the event panel draws, a sentence saying why it draws nothing, or null for a case without one. */
  panel: EventPanel | string | null;
  /** The photon budget whose S/N track is drawn; null when none is. */
  budget: TargetPhotonBudget | null;
  /** The kinds of night span drawn (the legend names only these, and daylight). */
  shownKinds: ReadonlySet<NightSpan["kind"]>;
}

/**
 * The target's simulated schedule over the proposal's cycle, as one SVG: on top the event (the
 * light curve of a microlensing event, or an illustrative delayed variation of two images) with the
 * visits marked and the nights with usable time shaded; below, every night of the cycle in local
 * mean time with its usable windows, its gaps coloured by reason and its visits; above both, long
 * runs of nights without usable time named by their reason.
 */
export function scheduleTimelinePlot(input: ScheduleTimelineInput): ScheduleTimelineFigure {
  const { schedule, width = SCHEDULE_TIMELINE_WIDTH_PX, idPrefix: idBase = "schedule" } = input;
  const { nightCount, firstNightIso } = schedule;
  const margins = { ...defaultMargins, top: PANEL_TOP };
  const [x0, x1] = [margins.left, width - margins.right];
  const daysPerPx = nightCount / (x1 - x0);
  const toDay = (jdUtc: number) => jdUtc - schedule.cycle.startJdUtc;
  const x = scaleLinear().domain([0, nightCount]).range([x0, x1]);
  x.tickFormat = () => (value) => addDaysIso(firstNightIso, Math.round(Number(value))).slice(5);
  const xGrid = x.copy();
  xGrid.tickFormat = () => () => "";

  // One mark per pixel column on the curve: visits closer than a pixel are drawn once, at their middle.
  const curveMarks = visitMarks(schedule.visitsJdUtc, schedule.visitLengthDays, daysPerPx);
  const panel = eventPanelOf(input, curveMarks.map((mark) => (mark.startJdUtc + mark.endJdUtc) / 2));
  const hasCurve = panel !== null && typeof panel !== "string";
  const budget = input.photonBudget != null && input.photonBudget.visitsJdUtc.length > 0 ? input.photonBudget : null;
  const signalToNoiseTop = hasCurve ? PANEL_TOP + EVENT_HEIGHT + PANEL_GAP : PANEL_TOP;
  const nightsTop = budget !== null ? signalToNoiseTop + SIGNAL_TO_NOISE_HEIGHT + PANEL_GAP : signalToNoiseTop;
  const nightsBottom = nightsTop + NIGHTS_HEIGHT;
  const height = nightsBottom + margins.bottom;

  const spans = nightSpans(schedule);
  const runs = nightRuns(schedule);
  let firstHour = 24;
  let lastHour = 0;
  for (const span of spans) {
    firstHour = Math.min(firstHour, span.fromDay * 24);
    lastHour = Math.max(lastHour, span.toDay * 24);
  }
  // Hours from local mean noon; half an hour of daylight either side of the darkest span drawn.
  const hourDomain = firstHour < lastHour ? [Math.max(0, firstHour - 0.5), Math.min(24, lastHour + 0.5)] : [6, 18];
  const y = scaleLinear().domain(hourDomain).range([nightsTop, nightsBottom]);
  y.tickFormat = () => (value) => `${String((12 + Number(value)) % 24).padStart(2, "0")}h`;
  const cellWidth = (x1 - x0) / nightCount;
  const hoursPerPx = (hourDomain[1] - hourDomain[0]) / NIGHTS_HEIGHT;
  const nightMarks = visitMarks(schedule.visitsJdUtc, schedule.visitLengthDays, hoursPerPx / 24);
  const shownKinds = new Set<NightSpan["kind"]>(spans.map((span) => span.kind));
  const clipId = `${idBase}-nights`;
  const hatchId = `${idBase}-sun`;
  const title = panel !== null && typeof panel !== "string" && panel.kind === "delay" ? "Delayed images (illustrative) and the schedule" : hasCurve ? "Light curve and the schedule" : budget !== null ? "S/N per visit and the schedule" : "Usable windows and visits";
  const lastNightYear = addDaysIso(firstNightIso, nightCount - 1).slice(0, 4);
  const years = lastNightYear !== firstNightIso.slice(0, 4) ? `${firstNightIso.slice(0, 4)}–${lastNightYear}` : firstNightIso.slice(0, 4);

  const tree = svgElement(
    <svg xmlns="http://www.w3.org/2000/svg" width="100%" viewBox={`0 0 ${width} ${height}`} role="img" aria-label={`Simulated observing schedule: ${scheduleSummary(schedule)}`}>
      <rect width={width} height={height} fill={plotPalette.ground} />
      <defs>
        <pattern id={hatchId} width="4" height="4" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
          <line x1="0" y1="0" x2="0" y2="4" stroke={plotPalette.orange} strokeWidth="1.5" />
        </pattern>
        <clipPath id={clipId}>
          <rect x={x0} y={nightsTop} width={x1 - x0} height={NIGHTS_HEIGHT} />
        </clipPath>
      </defs>
      {runs
        .filter((run) => run.label !== null)
        .map((run) => (
          <line x1={x(run.firstNight) + 1} x2={x(run.firstNight + run.nightCount) - 1} y1={BRACKET_Y} y2={BRACKET_Y} stroke={spanFill[run.reason!]} strokeWidth={2} />
        ))}
      <g fontFamily={plotFont} fontSize={11} fill={plotPalette.text}>
        {placeGapLabels(runs, x).map((label) => (
          <text x={label.x} y={LABEL_BASELINE} textAnchor="middle" data-testid={`schedule-gap-${label.reason}`}>
            {label.text}
          </text>
        ))}
      </g>
      {hasCurve ? eventPlot({ panel, x, xGrid, width, height, toDay, runs, clipId: `${idBase}-event` }) : null}
      {budget !== null ? signalToNoisePlot({ budget, schedule, x, xGrid, width, height, top: signalToNoiseTop, toDay, daysPerPx, clipId: `${idBase}-snr` }) : null}
      {plotAxes({ x, y, width, height, margins: { ...margins, top: nightsTop }, xLabel: `night (evening date, ${years})`, yLabel: "local mean time", yTicks: 4, title })}
      <g clipPath={`url(#${clipId})`}>
        <rect x={x0} y={nightsTop} width={x1 - x0} height={NIGHTS_HEIGHT} fill={spanFill.daylight} fillOpacity={0.6} />
        {spans.map((span) => (
          <rect
            x={tenth(x(span.night))}
            width={tenth(cellWidth + 0.3)}
            y={tenth(y(span.fromDay * 24))}
            height={tenth(Math.max(0.5, y(span.toDay * 24) - y(span.fromDay * 24)))}
            fill={span.kind === "sun" ? `url(#${hatchId})` : spanFill[span.kind]}
            fillOpacity={spanOpacity[span.kind]}
          />
        ))}
        {nightMarks.map((mark) => {
          const day = toDay(mark.startJdUtc);
          const night = Math.floor(day);
          return (
            <rect
              x={tenth(x(night) + cellWidth * 0.15)}
              width={tenth(Math.max(0.8, cellWidth * 0.7))}
              y={tenth(y((day - night) * 24))}
              height={tenth(Math.max(1.5, y((toDay(mark.endJdUtc) - night) * 24) - y((day - night) * 24)))}
              fill={plotPalette.ink}
            />
          );
        })}
      </g>
    </svg>,
  );
  return { tree, panel, budget, shownKinds };
}

interface EventPlotInput {
  panel: EventPanel;
  x: ScaleContinuousNumeric<number, number>;
  xGrid: ScaleContinuousNumeric<number, number>;
  width: number;
  height: number;
  toDay: (jdUtc: number) => number;
  runs: NightRun[];
  clipId: string;
}

/** The event panel: usable nights shaded, the curve(s), the visits on them, t0 or the flare's two dates. */
function eventPlot({ panel, x, xGrid, width, height, toDay, runs, clipId }: EventPlotInput): FigureTree {
  const top = PANEL_TOP;
  const bottom = PANEL_TOP + EVENT_HEIGHT;
  const margins = { ...defaultMargins, top, bottom: height - bottom };
  const [x0, x1] = x.range();
  const path = (points: TimelinePoint[], y: ScaleContinuousNumeric<number, number>) =>
    line<TimelinePoint>()
      .x((point) => x(toDay(point.jdUtc)))
      .y((point) => y(point.value))
      .digits(1)(points) ?? "";
  const vertical = (jdUtc: number, text: string) =>
    toDay(jdUtc) >= 0 && toDay(jdUtc) <= x.domain()[1] ? (
      <g>
        <line x1={x(toDay(jdUtc))} x2={x(toDay(jdUtc))} y1={top} y2={bottom} stroke={plotPalette.frame} strokeDasharray={dashPatterns.dotted} />
        <text x={x(toDay(jdUtc)) + 4} y={bottom - 6} fontFamily={plotFont} fontSize={11} fill={plotPalette.text}>
          {text}
        </text>
      </g>
    ) : null;

  let y: ScaleContinuousNumeric<number, number>;
  let curves: Result;
  let yLabel: string;
  if (panel.kind === "light-curve") {
    y = magnificationScale([...panel.points, ...(panel.peak ? [panel.peak] : [])], top, bottom);
    yLabel = "magnification A";
    curves = (
      <>
        {vertical(panel.peakJdUtc, "t0")}
        <path d={path(panel.points, y)} fill="none" stroke={plotPalette.skyBlue} strokeWidth={2} />
        {panel.marks.map((mark) => marker({ shape: "circle", cx: tenth(x(toDay(mark.jdUtc))), cy: tenth(y(mark.value)), size: 4, color: plotPalette.orange, isHollow: true }))}
      </>
    );
  } else {
    const low = Math.min(...panel.trailing.map((point) => point.value), 0);
    y = scaleLinear().domain([low - 0.1, 0.4]).nice().range([bottom, top]);
    yLabel = "brightness (mag)";
    curves = (
      <>
        {vertical(panel.flareJdUtc, "flare")}
        {vertical(panel.echoJdUtc, "Δt later")}
        <path d={path(panel.leading, y)} fill="none" stroke={plotPalette.skyBlue} strokeWidth={2} />
        <path d={path(panel.trailing, y)} fill="none" stroke={plotPalette.vermillion} strokeWidth={2} strokeDasharray={dashPatterns.dashed} />
        {panel.leadingMarks.map((mark) => marker({ shape: "circle", cx: tenth(x(toDay(mark.jdUtc))), cy: tenth(y(mark.value)), size: 4, color: plotPalette.orange, isHollow: true }))}
        {panel.trailingMarks.map((mark) => marker({ shape: "diamond", cx: tenth(x(toDay(mark.jdUtc))), cy: tenth(y(mark.value)), size: 4, color: plotPalette.orange, isHollow: true }))}
      </>
    );
  }
  return svgElement(
    <g>
      <defs>
        <clipPath id={clipId}>
          <rect x={x0} y={top} width={x1 - x0} height={bottom - top} />
        </clipPath>
      </defs>
      {runs
        .filter((run) => run.isUsable)
        .map((run) => (
          <rect x={x(run.firstNight)} width={x(run.firstNight + run.nightCount) - x(run.firstNight)} y={top} height={bottom - top} fill={plotPalette.bluishGreen} fillOpacity={0.14} />
        ))}
      {plotAxes({ x: xGrid, y, width, height, margins, xLabel: "", yLabel, yTicks: 4, title: "" })}
      <g clipPath={`url(#${clipId})`}>{curves}</g>
    </g>,
  );
}

interface SignalToNoisePlotInput {
  budget: TargetPhotonBudget;
  schedule: ObservingSchedule;
  x: ScaleContinuousNumeric<number, number>;
  xGrid: ScaleContinuousNumeric<number, number>;
  width: number;
  height: number;
  top: number;
  toDay: (jdUtc: number) => number;
  daysPerPx: number;
  clipId: string;
}

/**
 * The S/N track: each visit the case needs at its middle, at the S/N it reaches in the time the
 * visit leaves (`series.signalToNoise`), the goal as a labelled dashed line, visits below it as
 * filled triangles and the others as hollow circles (the lowest and highest per pixel column), the
 * worst visit boxed and labelled; log axis when the S/N spans more than a factor of ten.
 */
function signalToNoisePlot({ budget, schedule, x, xGrid, width, height, top, toDay, daysPerPx, clipId }: SignalToNoisePlotInput): FigureTree {
  const bottom = top + SIGNAL_TO_NOISE_HEIGHT;
  const margins = { ...defaultMargins, top, bottom: height - bottom };
  const [x0, x1] = x.range();
  const { signalToNoise } = budget.series;
  const goal = budget.signalToNoiseGoal;
  const axis = signalToNoiseAxis(signalToNoise, goal);
  const y: ScaleContinuousNumeric<number, number> = axis.isLog
    ? scaleLog().domain([axis.low, axis.high]).range([bottom, top]).clamp(true)
    : scaleLinear().domain([axis.low, axis.high]).nice().range([bottom, top]);
  // On a log axis every 1–9 × 10ⁿ has a grid line; only 1, 2 and 5 × 10ⁿ are labelled, so the S/N range always carries numbers.
  if (axis.isLog) y.tickFormat = () => (value) => ([1, 2, 5].includes(Math.round(Number(value) / 10 ** Math.floor(Math.log10(Number(value)) + 1e-9))) ? numberWords(Number(value)) : "");
  const marks = signalToNoiseMarks(budget.visitsJdUtc, schedule.visitLengthDays, signalToNoise, goal, daysPerPx, schedule.cycle.startJdUtc);
  const worstJdUtc = budget.visitsJdUtc[budget.worstVisit] + schedule.visitLengthDays / 2;
  const worstX = tenth(x(toDay(worstJdUtc)));
  const worstY = tenth(y(signalToNoise[budget.worstVisit]));
  const worstText = `worst: S/N ${numberWords(signalToNoise[budget.worstVisit])}`;
  const isWorstOnRight = worstX > (x0 + x1) / 2;
  return svgElement(
    <g data-testid="schedule-snr-track">
      <defs>
        <clipPath id={clipId}>
          <rect x={x0} y={top} width={x1 - x0} height={bottom - top} />
        </clipPath>
      </defs>
      {plotAxes({ x: xGrid, y, width, height, margins, xLabel: "", yLabel: axis.isLog ? "S/N per visit (log)" : "S/N per visit", yTicks: 4, title: "" })}
      <g clipPath={`url(#${clipId})`}>
        <line x1={x0} x2={x1} y1={tenth(y(goal))} y2={tenth(y(goal))} stroke={plotPalette.orange} strokeWidth={1.5} strokeDasharray={dashPatterns.dashed} />
        <text x={x1 - 4} y={tenth(y(goal)) - 4} textAnchor="end" fontFamily={plotFont} fontSize={11} fill={plotPalette.orange} data-testid="schedule-snr-goal">
          S/N goal {numberWords(goal)}
        </text>
        {marks.map((mark) =>
          mark.isBelowGoal ? (
            <path
              d={`M${tenth(x(toDay(mark.jdUtc)) - 3.5)},${tenth(y(mark.signalToNoise) - 3)} L${tenth(x(toDay(mark.jdUtc)) + 3.5)},${tenth(y(mark.signalToNoise) - 3)} L${tenth(x(toDay(mark.jdUtc)))},${tenth(y(mark.signalToNoise) + 3.5)} Z`}
              fill={plotPalette.vermillion}
              data-below-goal="true"
            />
          ) : (
            marker({ shape: "circle", cx: tenth(x(toDay(mark.jdUtc))), cy: tenth(y(mark.signalToNoise)), size: 4, color: plotPalette.skyBlue, isHollow: true })
          ),
        )}
      </g>
      <g>
        <rect x={worstX - 6} y={worstY - 6} width={12} height={12} fill="none" stroke={plotPalette.ink} strokeWidth={1.5} data-testid="schedule-snr-worst" />
        <text
          x={isWorstOnRight ? worstX - 9 : worstX + 9}
          y={worstY + (worstY - top < 16 ? 14 : -8)}
          textAnchor={isWorstOnRight ? "end" : "start"}
          fontFamily={plotFont}
          fontSize={11}
          fill={plotPalette.ink}
          stroke={plotPalette.ground}
          strokeWidth={3}
          paintOrder="stroke"
        >
          {worstText}
        </text>
      </g>
    </g>,
  );
}
