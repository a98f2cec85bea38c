import type { NeverObservableReason, SeasonWindows } from "@/lib/astro/season";
import { formatHours } from "@/lib/astro/sky-format";
import type { ReactNode } from "react";
import { bestWeeksText } from "@/lib/figures/season-view";

const reasonText: Record<NeverObservableReason, string> = {
  "below-limit": "never reaches the altitude limit here",
  "no-dark-time": "above the limit only in daylight or twilight",
  sun: "too close to the Sun whenever it is up in darkness",
};

/** A season table: the caption, the column headings (the first is the target's) and one row per target. */
export function SeasonTableFrame({ caption, columns, children }: { caption: ReactNode; columns: string[]; children: ReactNode }) {
  return (
    <table className="w-full text-left text-sm" data-testid="season-table">
      <caption className="mb-2 text-left text-dusk-dim">{caption}</caption>
      <thead className="text-dusk-dim">
        <tr>
          {columns.map((column, index) => (
            <th key={column} scope="col" className={index < columns.length - 1 ? "py-1 pr-3" : "py-1"}>
              {column}
            </th>
          ))}
        </tr>
      </thead>
      <tbody>{children}</tbody>
    </table>
  );
}

/**
 * The sky page's season (no proposal), one row per target: total usable dark hours, the best weeks
 * (7-night blocks within 90% of the best), the best single night and the never-observable flag with
 * its reason.
 */
export function SeasonTable({ season, targetIndices }: { season: SeasonWindows; targetIndices: number[] }) {
  const caption = (
    <>
      Usable dark hours from {season.nightDatesIso[0]} for {season.nightDatesIso.length} nights (Sun below −18°, above {season.limit.apparentDeg.toFixed(1)}°, at
      least {season.safeSunElongationDeg}° from the Sun)
    </>
  );
  return (
    <SeasonTableFrame caption={caption} columns={["Target", "Total", "Best weeks", "Best night", "Observable"]}>
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
            <td className="py-1 pr-3 font-mono text-glint">{bestWeeksText(season.nightDatesIso, target.bestWeekIndices)}</td>
            <td className="py-1 pr-3 font-mono text-glint">
              {target.isNeverObservable ? "—" : `${season.nightDatesIso[bestNight]} (${formatHours(target.hoursDarkPerNight[bestNight])})`}
            </td>
            <td className={`py-1 ${target.isNeverObservable ? "text-alarm" : "text-dusk"}`}>
              {target.neverObservableReason ? `Never: ${reasonText[target.neverObservableReason]}` : "yes"}
            </td>
          </tr>
        );
      })}
    </SeasonTableFrame>
  );
}
