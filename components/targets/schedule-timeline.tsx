import { useId } from "react";
import { FigureSvg } from "@/components/figures/figure-svg";
import { plotPalette } from "@/lib/figures/plot-palette";
import { SCHEDULE_TIMELINE_WIDTH_PX, scheduleTimelinePlot, spanFill, type EventPanel } from "@/lib/figures/schedule-timeline-plot";
import type { TargetPhotonBudget } from "@/lib/lensing/photon-budget";
import type { EventTiming, ScienceCaseId } from "@/lib/lensing/science-case-inputs";
import { dateWords, numberWords } from "@/lib/lensing/science-case-words";
import type { LensSolution } from "@/lib/lensing/solution";
import { emptyScheduleMessage, type ObservingSchedule } from "@/lib/schedule";
import { gapReasonLabels, gapReasons, NO_CYCLE_SCHEDULE_SENTENCE, scheduleSummary } from "@/lib/schedule/timeline-plot";

interface ScheduleTimelineProps {
  /** The target's simulated schedule; null while the proposal has no cycle dates. */
  schedule: ObservingSchedule | null;
  /** The case the target is answered in; null when the hypothesis gives no lens solution. */
  caseId: ScienceCaseId | null;
  solution: LensSolution | null;
  /** t0, u0, ρ and limb darkening; null without a lens solution. */
  event: EventTiming | null;
  /** The target's photon budget: its S/N per visit is drawn as a track under the event; null or absent without one. */
  photonBudget?: TargetPhotonBudget | null;
  width?: number;
}

/**
 * The target's simulated schedule over the proposal's cycle, as one SVG: on top the event (the
 * light curve of a microlensing event, or an illustrative delayed variation of two images) with the
 * visits marked and the nights with usable time shaded; below, every night of the cycle in local
 * mean time with its usable windows, its gaps coloured by reason and its visits; above both, long
 * runs of nights without usable time named by their reason (the figure of scheduleTimelinePlot), with
 * its caption and legend. Server-rendered; no client code.
 */
export function ScheduleTimeline(props: ScheduleTimelineProps) {
  const { schedule, width = SCHEDULE_TIMELINE_WIDTH_PX } = props;
  return (
    <section aria-labelledby="schedule-heading" className="space-y-3" data-testid="schedule-timeline">
      <h2 id="schedule-heading" className="text-xl font-semibold">
        Simulated observing schedule
      </h2>
      {schedule === null ? (
        <p className="text-sm text-dusk-dim" data-testid="schedule-message">
          {NO_CYCLE_SCHEDULE_SENTENCE}
        </p>
      ) : (
        <ScheduleFigure {...props} schedule={schedule} width={width} />
      )}
    </section>
  );
}

function ScheduleFigure(props: ScheduleTimelineProps & { schedule: ObservingSchedule; width: number }) {
  const { schedule } = props;
  // Ids unique on the page: url(#…) resolves to the first element of that id in the document.
  const idPrefix = `schedule-${useId().replace(/[^A-Za-z0-9-]/g, "")}`;
  const { tree, panel, budget, shownKinds } = scheduleTimelinePlot({ ...props, idPrefix });
  const hasCurve = panel !== null && typeof panel !== "string";

  return (
    <>
      {schedule.emptyReason !== null ? (
        <p role="status" className="text-sm text-alarm" data-testid="schedule-message">
          {emptyScheduleMessage(schedule.emptyReason)}
        </p>
      ) : null}
      <figure className="space-y-2">
        <FigureSvg tree={tree} />
        <figcaption className="space-y-1 text-xs text-dusk-dim">
          <p>{scheduleSummary(schedule)}</p>
          {typeof panel === "string" ? <p>{panel}</p> : panel !== null ? <p>{panel.note}</p> : null}
          {budget !== null ? <p data-testid="schedule-snr-note">{signalToNoiseNote(budget, hasCurve)}</p> : null}
          <p>
            {hasCurve ? "Top: nights with usable time shaded green; long runs of nights without any are named above the chart. Bottom: each" : "Long runs of nights without usable time are named above the chart. Each"}{" "}
            night of the cycle as a column, from evening (top) to morning in local mean time: usable windows in green, the rest coloured by why it is lost, visits in white.
          </p>
        </figcaption>
        <ul className="flex flex-wrap gap-x-4 gap-y-1 text-xs" aria-label="Legend">
          {hasCurve ? eventLegend(panel).map((entry) => <LegendItem key={entry.label} {...entry} />) : null}
          {budget !== null ? signalToNoiseLegend(budget).map((entry) => <LegendItem key={entry.label} {...entry} />) : null}
          <LegendItem shape="area" color={spanFill.usable} label="usable window" />
          <LegendItem shape="area" color={plotPalette.ink} label="visit (nights below)" />
          {gapReasons.map((reason) => (reason === "daylight" || shownKinds.has(reason) ? <LegendItem key={reason} shape="area" color={spanFill[reason]} label={gapReasonLabels[reason]} /> : null))}
        </ul>
      </figure>
    </>
  );
}

interface LegendEntry {
  label: string;
  color: string;
  shape: "area" | "line" | "dashed" | "circle" | "diamond" | "triangle" | "square";
}

/** The event panel's entries: its curve(s), the visits on them and the dates marked. */
function eventLegend(panel: EventPanel): LegendEntry[] {
  const visit: LegendEntry = { label: "visit (on the curve)", color: plotPalette.orange, shape: "circle" };
  if (panel.kind === "light-curve") return [{ label: panel.legend, color: plotPalette.skyBlue, shape: "line" }, visit];
  return [
    { label: "brighter image (leads)", color: plotPalette.skyBlue, shape: "line" },
    { label: "fainter image (Δt later)", color: plotPalette.vermillion, shape: "dashed" },
    { ...visit, label: "visit, brighter image" },
    { label: "visit, fainter image", color: plotPalette.orange, shape: "diamond" },
  ];
}

function LegendItem({ color, label, shape }: LegendEntry) {
  const swatch =
    shape === "area" ? (
      <span className="inline-block h-3 w-3 rounded-sm" style={{ backgroundColor: color }} />
    ) : shape === "circle" ? (
      <span className="inline-block h-2 w-2 rounded-full border-2" style={{ borderColor: color }} />
    ) : shape === "diamond" ? (
      <span className="inline-block h-2 w-2 rotate-45 border-2" style={{ borderColor: color }} />
    ) : shape === "square" ? (
      <span className="inline-block h-2.5 w-2.5 border-2" style={{ borderColor: color }} />
    ) : shape === "triangle" ? (
      <svg width="10" height="10" viewBox="0 0 10 10">
        <path d="M1,1 L9,1 L5,9 Z" fill={color} />
      </svg>
    ) : (
      <span className="inline-block w-5 border-t-2" style={{ borderColor: color, borderTopStyle: shape === "dashed" ? "dashed" : "solid" }} />
    );
  return (
    <li className="flex items-center gap-1.5">
      <span aria-hidden="true" className="inline-flex w-5 justify-center">
        {swatch}
      </span>
      {label}
    </li>
  );
}

/** The S/N track's sentence for the caption: what is drawn and how many visits fall short. */
function signalToNoiseNote(budget: TargetPhotonBudget, hasCurve: boolean): string {
  const count = budget.visitsJdUtc.length;
  const worst = budget.series.signalToNoise[budget.worstVisit];
  const short = budget.shortVisits === 0 ? "every visit reaches the goal" : `${budget.shortVisits} of ${count} ${count === 1 ? "visit falls" : "visits fall"} short of it (drawn as triangles)`;
  return `${hasCurve ? "Middle" : "Top"}: the S/N each of the ${count} ${count === 1 ? "visit" : "visits"} the case needs reaches in ${budget.bandLabel} in the ${numberWords(budget.visitExposureS)} s a visit leaves after its overhead, under its own air mass and Moon (the photon budget), against the S/N goal of ${numberWords(budget.signalToNoiseGoal)}: ${short}; the worst visit (S/N ${numberWords(worst)}, ${dateWords(budget.visitsJdUtc[budget.worstVisit])}) is boxed.`;
}

/** The S/N track's legend entries (the states drawn): each by its own shape as well as its colour. */
function signalToNoiseLegend(budget: TargetPhotonBudget): LegendEntry[] {
  const count = budget.visitsJdUtc.length;
  return [
    ...(budget.shortVisits < count ? [{ label: "visit S/N, goal reached", color: plotPalette.skyBlue, shape: "circle" } as const] : []),
    ...(budget.shortVisits > 0 ? [{ label: "visit S/N, below the goal", color: plotPalette.vermillion, shape: "triangle" } as const] : []),
    { label: `S/N goal ${numberWords(budget.signalToNoiseGoal)}`, color: plotPalette.orange, shape: "dashed" },
    { label: "worst visit", color: plotPalette.ink, shape: "square" },
  ];
}
