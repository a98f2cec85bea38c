"use client";

import { useEffect, useMemo, useState } from "react";
import type { SkySiteInput } from "@/lib/astro/inputs";
import { nightlyVisibility } from "@/lib/astro/visibility";
import { NightChart } from "@/lib/figures/night-chart";
import type { ObservingSchedule } from "@/lib/schedule";
import { nightPlan } from "@/lib/schedule/timeline-plot";
import { NightDateControl } from "./night-date-control";
import { NightFigures } from "./night-figures";

interface TargetNightPanelProps {
  site: SkySiteInput;
  target: { name: string; raDeg: number; decDeg: number };
  airmassLimit: number;
  /** The night shown first, `YYYY-MM-DD` (the page picks it from the address bar or the cycle). */
  initialNightIso: string;
  /** The target's simulated schedule over the proposal's cycle (computed on the server); null without cycle dates. */
  schedule: ObservingSchedule | null;
}

/**
 * One target's night from its proposal's site: chart, figures (with the Sun caution when it applies),
 * the visits the target's schedule plans that night (read from the whole cycle's schedule, so a
 * cadence longer than a night carries over from the nights before) and the date control. The night
 * lives in the address bar (`?night=`), so a link reopens it.
 */
export function TargetNightPanel({ site, target, airmassLimit, initialNightIso, schedule }: TargetNightPanelProps) {
  const [nightIso, setNightIso] = useState(initialNightIso);
  const result = useMemo(() => {
    try {
      return { visibility: nightlyVisibility(site, target, nightIso, { airmassLimit }), error: null };
    } catch (error) {
      return { visibility: null, error: error instanceof Error ? error.message : String(error) };
    }
  }, [site, target, nightIso, airmassLimit]);
  const plan = useMemo(() => nightPlan(schedule, nightIso), [schedule, nightIso]);

  useEffect(() => {
    const url = new URL(window.location.href);
    if (url.searchParams.get("night") === nightIso) return;
    url.searchParams.set("night", nightIso);
    window.history.replaceState(window.history.state, "", url);
  }, [nightIso]);

  return (
    <section aria-labelledby="night-heading" className="space-y-3">
      <h2 id="night-heading" className="text-xl font-semibold">
        Night from {site.name}
      </h2>
      <NightDateControl value={nightIso} onChange={setNightIso} />
      {result.visibility ? (
        <div className="grid gap-6 lg:grid-cols-[2fr_1fr]">
          <div className="rounded-md border border-void-edge">
            <NightChart visibility={result.visibility} plannedVisits={schedule === null ? undefined : { visitsJdUtc: plan.visitsJdUtc, visitLengthDays: schedule.visitLengthDays }} />
            <p className="px-3 pt-2 text-sm" data-testid="night-planned-visits" data-count={plan.visitsJdUtc.length}>
              {plan.sentence}
            </p>
            <p className="px-3 py-2 text-xs text-dusk-dim">
              Sky shading from light to dark: day, civil, nautical and astronomical twilight, darkness (Sun below −18°).
              Green fill: dark time above the limit (air mass ≤ {airmassLimit}, Pickering 2002; site horizon {site.horizonLimitDeg}°). White bands and diamonds: the visits the simulated schedule plans. Times UTC.
            </p>
          </div>
          <NightFigures visibility={result.visibility} />
        </div>
      ) : (
        <p role="alert" className="text-alarm">
          The night could not be computed: {result.error}
        </p>
      )}
    </section>
  );
}
