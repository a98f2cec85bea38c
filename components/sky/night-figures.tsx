import type { NightVisibility } from "@/lib/astro/visibility";
import { formatHours, formatUtcClock } from "@/lib/astro/sky-format";
import { SunCaution } from "./sun-caution";

function Figure({ label, value, testId }: { label: string; value: string; testId?: string }) {
  return (
    <div className="flex justify-between gap-4 border-b border-void-edge py-1">
      <dt className="text-dusk-dim">{label}</dt>
      <dd className="font-mono text-glint" data-testid={testId}>
        {value}
      </dd>
    </div>
  );
}

function twilightPair(evening: number | null, morning: number | null, isAlwaysAbove: boolean, isAlwaysBelow: boolean): string {
  if (isAlwaysAbove) return "Sun never that low";
  if (isAlwaysBelow) return "all night";
  return `${formatUtcClock(evening)} – ${formatUtcClock(morning)}`;
}

/** The night's numbers beside the chart: hours usable, passages, twilight, Moon and Sun. Times UTC. */
export function NightFigures({ visibility }: { visibility: NightVisibility }) {
  const { passages, twilight, moon, sun, limit } = visibility;
  const horizonText = passages.isCircumpolar
    ? "circumpolar (never sets)"
    : passages.isNeverRising
      ? "never rises here"
      : `${formatUtcClock(passages.riseJdUtc)} / ${formatUtcClock(passages.setJdUtc)}`;
  return (
    <section aria-label="Night figures" className="space-y-3">
      {sun.isTooCloseToSun ? <SunCaution elongationDeg={sun.elongationDeg} safeElongationDeg={sun.safeElongationDeg} /> : null}
      <p className="text-lg">
        <span className="text-dusk-dim">Dark hours above the limit: </span>
        <strong className="font-mono text-2xl text-glint" data-testid="hours-dark-above-limit">
          {formatHours(visibility.hoursDarkAboveLimit)}
        </strong>
        <span className="text-dusk-dim"> of {formatHours(visibility.hoursDark)} astronomical darkness</span>
      </p>
      <dl className="text-sm">
        <Figure label={`Altitude limit (${limit.binding === "airmass" ? "air mass" : "site horizon"})`} value={`${limit.apparentDeg.toFixed(1)}°`} />
        <Figure label="Transit (UTC)" value={`${formatUtcClock(passages.transitJdUtc)} at ${passages.transitAltitudeDeg.toFixed(1)}°`} testId="transit-time" />
        <Figure label="Rise / set (UTC)" value={horizonText} />
        <Figure label="Sunset / sunrise" value={twilightPair(twilight.sunset.eveningJdUtc, twilight.sunset.morningJdUtc, twilight.sunset.isSunAlwaysAbove, twilight.sunset.isSunAlwaysBelow)} />
        <Figure label="Civil twilight ends / begins" value={twilightPair(twilight.civil.eveningJdUtc, twilight.civil.morningJdUtc, twilight.civil.isSunAlwaysAbove, twilight.civil.isSunAlwaysBelow)} />
        <Figure label="Nautical twilight ends / begins" value={twilightPair(twilight.nautical.eveningJdUtc, twilight.nautical.morningJdUtc, twilight.nautical.isSunAlwaysAbove, twilight.nautical.isSunAlwaysBelow)} />
        <Figure label="Astronomical darkness" value={twilightPair(twilight.astronomical.eveningJdUtc, twilight.astronomical.morningJdUtc, twilight.astronomical.isSunAlwaysAbove, twilight.astronomical.isSunAlwaysBelow)} testId="darkness-span" />
        <Figure label="Moon illuminated" value={`${Math.round(moon.illuminatedFraction * 100)}%`} testId="moon-illumination" />
        <Figure label="Moon–target separation" value={`${moon.separationDeg.toFixed(1)}°`} />
        <Figure label="Sun elongation" value={`${sun.elongationDeg.toFixed(1)}°`} />
      </dl>
    </section>
  );
}
