"use client";

import { useEffect, useId, useMemo, useState } from "react";
import { nightlyVisibility } from "@/lib/astro/visibility";
import { nightChart } from "@/lib/figures/night-chart";
import { FigureSvg } from "@/components/figures/figure-svg";
import { NightDateControl } from "./night-date-control";
import { NightFigures } from "./night-figures";
import { seasonChart } from "@/lib/figures/season-chart";
import { seasonViewOfWindows } from "@/lib/figures/season-view";
import { SeasonTable } from "./season-table";
import { parseSkyQuery, skyQuantitySpecs, skyQueryToString, type SkyQuery, type SkyQueryField } from "@/lib/astro/sky-query";
import { seasonNightsRangeWords } from "@/lib/astro/season-length";
import { quantityEcho } from "@/lib/workspace/quantity-field";
import { useSeason } from "./use-season";

/** The value a quantity field will use, shown beside it as the user types ("= −27.5°"); none for plain text. */
function echoOf(field: SkyQueryField, value: string): string | null {
  if (!(field in skyQuantitySpecs)) return null;
  const echo = quantityEcho(skyQuantitySpecs[field as keyof typeof skyQuantitySpecs], value);
  return echo?.ok ? echo.text : null;
}

function QueryField({ testId, label, hint, value, echo, error, onChange }: { testId: string; label: string; hint: string; value: string; echo: string | null; error?: string; onChange: (value: string) => void }) {
  const id = useId();
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-semibold text-dusk">{label}</label>
      <input
        id={id}
        type="text"
        spellCheck={false}
        autoComplete="off"
        value={value}
        onChange={(event) => onChange(event.target.value)}
        aria-invalid={error !== undefined}
        aria-describedby={`${id}-hint${error !== undefined ? ` ${id}-error` : ""}`}
        className={`rounded border bg-void px-2 py-1 font-mono text-sm text-dusk ${error !== undefined ? "border-alarm" : "border-void-edge"}`}
      />
      {echo !== null ? <p data-testid={`echo-${testId}`} className="font-mono text-xs text-glint" aria-live="polite">{echo}</p> : null}
      <p id={`${id}-hint`} className="text-xs text-dusk-dim">{hint}</p>
      {error !== undefined ? <p id={`${id}-error`} role="alert" className="text-sm text-alarm">{error}</p> : null}
    </div>
  );
}

const fieldLabels: { field: Exclude<SkyQueryField, "date">; label: string; hint: string }[] = [
  { field: "site", label: "Site name", hint: "for your own reference" },
  { field: "lat", label: "Latitude (°)", hint: "geodetic, north positive" },
  { field: "lon", label: "Longitude (°)", hint: "east positive, −180 to 180" },
  { field: "elev", label: "Elevation (m)", hint: "above sea level" },
  { field: "horizon", label: "Horizon limit (°)", hint: "lowest altitude the telescope reaches" },
  { field: "ra", label: "Right ascension", hint: "hh mm ss.s or degrees (ICRS)" },
  { field: "dec", label: "Declination", hint: "±dd mm ss or degrees (ICRS)" },
  { field: "airmass", label: "Air mass limit", hint: "2 ≈ 30° altitude" },
  { field: "nights", label: "Season length (nights)", hint: `from the chosen night, ${seasonNightsRangeWords}` },
];

/**
 * The standalone sky-windows planner: a site, a target and a night in, the night chart and its
 * figures out, and the season from that night computed in a worker. Every input lives in the address
 * bar, so a link reproduces the view.
 */
export function SkyPlanner({ initialQuery }: { initialQuery: SkyQuery }) {
  const [query, setQuery] = useState(initialQuery);
  const parsed = useMemo(() => parseSkyQuery(query), [query]);
  const visibility = useMemo(
    () => (parsed.value ? nightlyVisibility(parsed.value.site, parsed.value.target, parsed.value.nightDateIso, parsed.value.limits) : null),
    [parsed],
  );
  const seasonRequest = useMemo(
    () => (parsed.value ? { site: parsed.value.site, targets: [parsed.value.target], startNightIso: parsed.value.nightDateIso, nightCount: parsed.value.nightCount, limits: parsed.value.limits } : null),
    [parsed],
  );
  const season = useSeason(seasonRequest);
  const nightTree = useMemo(() => (visibility ? nightChart({ visibility }) : null), [visibility]);
  const seasonTree = useMemo(() => (season.value ? seasonChart({ view: seasonViewOfWindows(season.value), targetIndices: season.value.targets.map((_, index) => index) }) : null), [season.value]);

  useEffect(() => {
    const search = skyQueryToString(query);
    if (window.location.search.slice(1) !== search) window.history.replaceState(window.history.state, "", `?${search}`);
  }, [query]);

  const setField = (field: SkyQueryField, value: string) => setQuery((previous) => ({ ...previous, [field]: value }));
  const errors = parsed.errors ?? {};

  return (
    <div className="space-y-6">
      <form className="grid gap-4 rounded-md border border-void-edge bg-void-raised p-4 sm:grid-cols-3" onSubmit={(event) => event.preventDefault()} aria-label="Site and target">
        {fieldLabels.map(({ field, label, hint }) => (
          <QueryField key={field} testId={field} label={label} hint={hint} value={query[field]} echo={echoOf(field, query[field])} error={errors[field]} onChange={(value) => setField(field, value)} />
        ))}
        <div className="sm:col-span-3">
          <NightDateControl value={query.date} onChange={(date) => setField("date", date)} />
          {errors.date !== undefined ? <p role="alert" className="text-sm text-alarm">{errors.date}</p> : null}
        </div>
      </form>

      {visibility && nightTree ? (
        <div className="grid gap-6 lg:grid-cols-[2fr_1fr]">
          <div className="rounded-md border border-void-edge">
            <FigureSvg tree={nightTree} />
            <p className="px-3 py-2 text-xs text-dusk-dim">
              Sky shading from light to dark: day, civil, nautical and astronomical twilight, darkness (Sun below −18°).
              Green fill: dark time above the limit. Air mass: Pickering 2002. Times UTC.
            </p>
          </div>
          <NightFigures visibility={visibility} />
        </div>
      ) : (
        <p className="text-alarm">Correct the marked fields to see the night.</p>
      )}

      <section aria-label="Season" className="space-y-3">
        <h2 className="text-xl font-semibold text-dusk">Season</h2>
        {season.status === "failed" ? <p role="alert" className="text-alarm">The season could not be computed: {season.error}</p> : null}
        {season.status === "computing" ? <p className="text-dusk-dim">Computing the season…</p> : null}
        {season.value ? (
          <>
            {seasonTree ? <FigureSvg tree={seasonTree} /> : null}
            <SeasonTable season={season.value} targetIndices={season.value.targets.map((_, index) => index)} />
          </>
        ) : null}
      </section>
    </div>
  );
}
