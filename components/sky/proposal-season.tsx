"use client";

import { useMemo, useState } from "react";
import type { SkySiteInput } from "@/lib/astro/inputs";
import { weekWithMostTargetsAtBest } from "@/lib/astro/season";
import { SeasonChart } from "@/lib/figures/season-chart";
import { SeasonTable, weekRange } from "./season-table";
import { useSeason } from "./use-season";

/** Targets per page of the chart and table: SVG rows stay light and legible at this count. */
export const SEASON_PAGE_TARGETS = 25;

interface ProposalSeasonProps {
  site: SkySiteInput;
  targets: { id: string; name: string; raDeg: number; decDeg: number }[];
  startNightIso: string;
  nightCount: number;
  airmassLimit: number;
}

/**
 * A proposal's season: usable dark hours per night for every target over the cycle, computed in the
 * sky worker, shown a page of targets at a time, with the never-observable targets listed first.
 */
export function ProposalSeason({ site, targets, startNightIso, nightCount, airmassLimit }: ProposalSeasonProps) {
  const request = useMemo(
    () => ({ site, targets: targets.map((t) => ({ name: t.name, raDeg: t.raDeg, decDeg: t.decDeg })), startNightIso, nightCount, limits: { airmassLimit } }),
    [site, targets, startNightIso, nightCount, airmassLimit],
  );
  const { status, season, error } = useSeason(request);
  const [page, setPage] = useState(0);
  const pageCount = Math.max(1, Math.ceil(targets.length / SEASON_PAGE_TARGETS));
  const pageIndices = useMemo(
    () => Array.from({ length: Math.min(SEASON_PAGE_TARGETS, targets.length - page * SEASON_PAGE_TARGETS) }, (_, i) => page * SEASON_PAGE_TARGETS + i),
    [page, targets.length],
  );
  const never = season ? season.targets.flatMap((t, index) => (t.isNeverObservable ? [index] : [])) : [];
  // The list's headline week: the one in which the most targets are in one of their own best weeks.
  // A count of targets: hours of different targets are never added.
  const headline = useMemo(() => (season ? weekWithMostTargetsAtBest(season.targets, season.weekStartDatesIso.length) : null), [season]);

  if (status === "failed") return <p role="alert" className="text-alarm">The season could not be computed: {error}</p>;
  if (!season) return <p className="text-dusk-dim">Computing the season for {targets.length} targets…</p>;
  return (
    <div className="space-y-4">
      <dl className="flex flex-wrap gap-x-8 gap-y-1 text-sm">
        <div>
          <dt className="inline text-dusk-dim">Week with the most targets at their best </dt>
          <dd className="inline font-mono text-glint" data-testid="best-week-overall">
            {headline
              ? `${weekRange(season, headline.weekIndex)} (${headline.targetCount} of ${season.targets.length} targets)`
              : "none"}
          </dd>
        </div>
        <div>
          <dt className="inline text-dusk-dim">Never observable in the cycle </dt>
          <dd className={`inline ${never.length > 0 ? "text-alarm" : "text-glint"}`} data-testid="never-observable">
            {never.length === 0 ? "none" : never.map((index) => season.targets[index].name).join(", ")}
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
      <SeasonChart season={season} targetIndices={pageIndices} />
      <SeasonTable season={season} targetIndices={pageIndices} />
    </div>
  );
}
