import type { NeverObservableReason, SeasonWindows } from "@/lib/astro/season";
import { addDaysIso } from "@/lib/astro/time";
import { SEASON_WEEK_NIGHTS } from "@/lib/astro/season";
import { formatHours } from "@/lib/astro/sky-format";

const reasonText: Record<NeverObservableReason, string> = {
  "below-limit": "never reaches the altitude limit here",
  "no-dark-time": "above the limit only in daylight or twilight",
  sun: "too close to the Sun whenever it is up in darkness",
};

/** "2031-06-10 – 2031-06-16": the nights of block `week` (the last block may be shorter). */
export function weekRange(season: SeasonWindows, week: number): string {
  const start = season.weekStartDatesIso[week];
  const nights = Math.min(SEASON_WEEK_NIGHTS, season.nightDatesIso.length - week * SEASON_WEEK_NIGHTS);
  return `${start} – ${addDaysIso(start, nights - 1)}`;
}

/**
 * One row per target: total usable dark hours, the best weeks (7-night blocks within 90% of the best),
 * the best single night and the never-observable flag with its reason.
 */
export function SeasonTable({ season, targetIndices }: { season: SeasonWindows; targetIndices: number[] }) {
  return (
    <table className="w-full text-left text-sm" data-testid="season-table">
      <caption className="mb-2 text-left text-dusk-dim">
        Usable dark hours from {season.nightDatesIso[0]} for {season.nightDatesIso.length} nights (Sun below −18°, above{" "}
        {season.limit.apparentDeg.toFixed(1)}°, at least {season.safeSunElongationDeg}° from the Sun)
      </caption>
      <thead className="text-dusk-dim">
        <tr>
          <th scope="col" className="py-1 pr-3">Target</th>
          <th scope="col" className="py-1 pr-3">Total</th>
          <th scope="col" className="py-1 pr-3">Best weeks</th>
          <th scope="col" className="py-1 pr-3">Best night</th>
          <th scope="col" className="py-1">Observable</th>
        </tr>
      </thead>
      <tbody>
        {targetIndices.map((index) => {
          const target = season.targets[index];
          let bestNight = 0;
          for (let night = 1; night < target.hoursDarkPerNight.length; night++) {
            if (target.hoursDarkPerNight[night] > target.hoursDarkPerNight[bestNight]) bestNight = night;
          }
          return (
            <tr key={index} className="border-t border-void-edge">
              <th scope="row" className="py-1 pr-3 font-normal text-dusk">{target.name ?? `target ${index + 1}`}</th>
              <td className="py-1 pr-3 font-mono text-glint">{formatHours(target.totalHoursDark)}</td>
              <td className="py-1 pr-3 font-mono text-glint">
                {target.bestWeekIndices.slice(0, 3).map((week) => weekRange(season, week)).join("; ") || "—"}
              </td>
              <td className="py-1 pr-3 font-mono text-glint">
                {target.isNeverObservable ? "—" : `${season.nightDatesIso[bestNight]} (${formatHours(target.hoursDarkPerNight[bestNight])})`}
              </td>
              <td className={`py-1 ${target.isNeverObservable ? "text-alarm" : "text-dusk"}`}>
                {target.neverObservableReason ? `Never: ${reasonText[target.neverObservableReason]}` : "yes"}
              </td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}
