"use client";

import { useMemo, useState } from "react";
import { weekWithMostTargetsAtBest } from "@/lib/astro/season";
import { seasonChart } from "@/lib/figures/season-chart";
import { seasonViewOfSchedules, seasonWeekCount, weekRangeText } from "@/lib/figures/season-view";
import type { ScheduleConditions } from "@/lib/schedule";
import { FigureSvg } from "@/components/figures/figure-svg";
import { ScheduleSeasonTable } from "./schedule-season-table";
import { useProposalSchedules } from "./use-proposal-schedules";

/** Targets per page of the chart and table: SVG rows stay light and legible at this count. */
export const SEASON_PAGE_TARGETS = 25;

interface ProposalSeasonProps {
  /** The proposal's schedule conditions (`scheduleConditionsOf`): the same the verdicts count. */
  conditions: ScheduleConditions;
  targets: { id: string; name: string; raDeg: number; decDeg: number }[];
}

/**
 * A proposal's season: the simulated observing schedule of every target over the cycle, computed in
 * the schedule worker, shown a page of targets at a time, with the targets that get no visit named.
 */
export function ProposalSeason({ conditions, targets }: ProposalSeasonProps) {
  const request = useMemo(() => ({ ...conditions, targets: targets.map((t) => ({ name: t.name, raDeg: t.raDeg, decDeg: t.decDeg })) }), [conditions, targets]);
  const { status, value: schedules, error } = useProposalSchedules(request);
  const view = useMemo(() => (schedules ? seasonViewOfSchedules(targets.map((t) => t.name), schedules) : null), [schedules, targets]);
  const [page, setPage] = useState(0);
  const pageCount = Math.max(1, Math.ceil(targets.length / SEASON_PAGE_TARGETS));
  const pageIndices = useMemo(
    () => Array.from({ length: Math.min(SEASON_PAGE_TARGETS, targets.length - page * SEASON_PAGE_TARGETS) }, (_, i) => page * SEASON_PAGE_TARGETS + i),
    [page, targets.length],
  );
  // The list's headline week: the one in which the most targets are in one of their own best weeks.
  // A count of targets: hours of different targets are never added.
  const headline = useMemo(() => (view ? weekWithMostTargetsAtBest(view.rows, seasonWeekCount(view.nightDatesIso)) : null), [view]);
  const chart = useMemo(() => (view ? seasonChart({ view, targetIndices: pageIndices }) : null), [view, pageIndices]);

  if (status === "failed") return <p role="alert" className="text-alarm">The schedule could not be simulated: {error}</p>;
  if (!view) return <p className="text-dusk-dim">Simulating the schedule for {targets.length} targets…</p>;
  const empty = view.rows.filter((row) => row.isEmpty);
  return (
    <div className="space-y-4">
      <dl className="flex flex-wrap gap-x-8 gap-y-1 text-sm">
        <div>
          <dt className="inline text-dusk-dim">Week with the most targets at their best </dt>
          <dd className="inline font-mono text-glint" data-testid="best-week-overall">
            {headline ? `${weekRangeText(view.nightDatesIso, headline.weekIndex)} (${headline.targetCount} of ${view.rows.length} targets)` : "none"}
          </dd>
        </div>
        <div>
          <dt className="inline text-dusk-dim">No visit possible in the cycle </dt>
          <dd className={`inline ${empty.length > 0 ? "text-alarm" : "text-glint"}`} data-testid="never-observable">
            {empty.length === 0 ? "none" : empty.map((row) => row.name).join(", ")}
          </dd>
        </div>
      </dl>
      {status === "computing" ? <p className="text-dusk-dim">Recomputing…</p> : null}
      <nav aria-label="Season pages" className="flex items-center gap-3 text-sm">
        <button type="button" className="rounded border border-void-edge px-2 py-1 disabled:opacity-40" disabled={page <= 0} onClick={() => setPage((p) => p - 1)}>
          Previous targets
        </button>
        <span>
          Targets {page * SEASON_PAGE_TARGETS + 1}–{page * SEASON_PAGE_TARGETS + pageIndices.length} of {targets.length}
        </span>
        <button type="button" className="rounded border border-void-edge px-2 py-1 disabled:opacity-40" disabled={page >= pageCount - 1} onClick={() => setPage((p) => p + 1)}>
          Next targets
        </button>
      </nav>
      {chart ? <FigureSvg tree={chart} /> : null}
      <ScheduleSeasonTable view={view} targetIndices={pageIndices} />
    </div>
  );
}
