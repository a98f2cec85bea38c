"use client";

import { useEffect, useId, useMemo, useState } from "react";
import type { SkySiteInput } from "@/lib/astro/inputs";
import { nightlyVisibility } from "@/lib/astro/visibility";
import { nightChart } from "@/lib/figures/night-chart";
import { nightSkyBrightnessChart } from "@/lib/figures/night-sky-brightness";
import { nightSkyBrightness } from "@/lib/photometry/night-sky";
import type { BandSky } from "@/lib/photometry/visit-budget";
import { NightSkyFigureDownloads } from "@/components/exports/sky-figure-downloads";
import { FigureSvg } from "@/components/figures/figure-svg";
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
  /** The target's band with the site's sky in it (the proposal's photometry settings), or why there is none, in words. */
  bandSky: { sky: BandSky } | { missing: string };
  /** Where the sky brightness figure is exported from; absent: no download buttons. */
  figureExport?: { proposalId: string; targetId: string };
}

/**
 * One target's night from its proposal's site: chart, figures (with the Sun caution when it applies),
 * the visits the target's schedule plans that night (read from the whole cycle's schedule, so a
 * cadence longer than a night carries over from the nights before) and the date control. The night
 * lives in the address bar (`?night=`), so a link reopens it.
 */
export function TargetNightPanel({ site, target, airmassLimit, initialNightIso, schedule, bandSky, figureExport }: TargetNightPanelProps) {
  const [nightIso, setNightIso] = useState(initialNightIso);
  const result = useMemo(() => {
    try {
      return { visibility: nightlyVisibility(site, target, nightIso, { airmassLimit }), error: null };
    } catch (error) {
      return { visibility: null, error: error instanceof Error ? error.message : String(error) };
    }
  }, [site, target, nightIso, airmassLimit]);
  const plan = useMemo(() => nightPlan(schedule, nightIso), [schedule, nightIso]);
  const nightSky = useMemo(() => {
    if ("missing" in bandSky) return { sky: null, error: bandSky.missing };
    try {
      return { sky: nightSkyBrightness({ site, target, nightDateIso: nightIso, bandSky: bandSky.sky }), error: null };
    } catch (error) {
      return { sky: null, error: `The sky brightness could not be computed: ${error instanceof Error ? error.message : String(error)}` };
    }
  }, [site, target, nightIso, bandSky]);
  const nightTree = useMemo(
    () => (result.visibility ? nightChart({ visibility: result.visibility, plannedVisits: schedule === null ? undefined : { visitsJdUtc: plan.visitsJdUtc, visitLengthDays: schedule.visitLengthDays } }) : null),
    [result, schedule, plan],
  );
  // Ids unique on the page: url(#…) resolves to the first element of that id in the document.
  const skyIdPrefix = `night-sky-${useId().replace(/[^A-Za-z0-9-]/g, "")}`;
  const skyTree = useMemo(() => (nightSky.sky !== null ? nightSkyBrightnessChart({ sky: nightSky.sky, idPrefix: skyIdPrefix }) : null), [nightSky, skyIdPrefix]);

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
      {result.visibility && nightTree ? (
        <div className="grid gap-6 lg:grid-cols-[2fr_1fr]">
          <div className="rounded-md border border-void-edge">
            <FigureSvg tree={nightTree} />
            <p className="px-3 pt-2 text-sm" data-testid="night-planned-visits" data-count={plan.visitsJdUtc.length}>
              {plan.sentence}
            </p>
            <p className="px-3 py-2 text-xs text-dusk-dim">
              Sky shading from light to dark: day, civil, nautical and astronomical twilight, darkness (Sun below −18°).
              Green fill: dark time above the limit (air mass ≤ {airmassLimit}, Pickering 2002; site horizon {site.horizonLimitDeg}°). White bands and diamonds: the visits the simulated schedule plans. Times UTC.
            </p>
          </div>
          <NightFigures visibility={result.visibility} />
          <div className="rounded-md border border-void-edge lg:col-span-2" data-testid="night-sky-panel">
            {skyTree !== null ? (
              <>
                <FigureSvg tree={skyTree} />
                <p className="px-3 py-2 text-xs text-dusk-dim">
                  Sky surface brightness at the target in its band through astronomical darkness while it is up (brighter up): the dark sky at the target&apos;s zenith distance (the site&apos;s zenith value,
                  Krisciunas &amp; Schaefer 1991 eq. 2) dashed, and with the Moon&apos;s light added (K&amp;S eq. 15 in V, carried to the band by the Sun&apos;s colour), the Moon&apos;s share hatched
                  between them. The model adds the Moon&apos;s light from the moment its centre clears the horizon, hence the step at moonrise. The same sky the photon budget grades
                  each visit under. Times UTC.
                </p>
                {figureExport !== undefined ? (
                  <div className="px-3 pb-2">
                    <NightSkyFigureDownloads proposalId={figureExport.proposalId} targetId={figureExport.targetId} nightIso={nightIso} />
                  </div>
                ) : null}
              </>
            ) : (
              <p className="px-3 py-2 text-sm text-dusk-dim" data-testid="night-sky-missing">
                No sky brightness figure: {nightSky.error}
              </p>
            )}
          </div>
        </div>
      ) : (
        <p role="alert" className="text-alarm">
          The night could not be computed: {result.error}
        </p>
      )}
    </section>
  );
}
