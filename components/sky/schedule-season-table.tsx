import { bestWeeksText, observingSeasonsText, type ScheduleSeasonRow, type SeasonView } from "@/lib/figures/season-view";
import { SeasonTableFrame } from "./season-table";

/**
 * A proposal's season, one row per target, from its simulated observing schedule: the observing
 * seasons (first and last night, length), the visits planned in the cycle, the best weeks (7-night
 * blocks within 90% of the target's own best) and, for a target with no visit, why.
 */
export function ScheduleSeasonTable({ view, targetIndices }: { view: SeasonView<ScheduleSeasonRow>; targetIndices: number[] }) {
  const nights = view.nightDatesIso;
  const caption = `The proposal's observing schedule from ${nights[0]} to ${nights[nights.length - 1]} (${nights.length} nights)`;
  return (
    <SeasonTableFrame caption={caption} columns={["Target", "Observing seasons", "Planned visits", "Best weeks", "Observable"]}>
      {targetIndices.map((index) => {
        const row = view.rows[index];
        return (
          <tr key={index} className="border-t border-void-edge">
            <th scope="row" className="py-1 pr-3 font-normal text-dusk">{row.name}</th>
            <td className="py-1 pr-3 font-mono text-glint" data-testid="observing-seasons">{observingSeasonsText(row.seasons)}</td>
            <td className="py-1 pr-3 font-mono text-glint" data-testid="planned-visits">{row.visitCount}</td>
            <td className="py-1 pr-3 font-mono text-glint">{bestWeeksText(nights, row.bestWeekIndices)}</td>
            <td className={`py-1 ${row.emptyMessage ? "text-alarm" : "text-dusk"}`}>{row.emptyMessage ?? "yes"}</td>
          </tr>
        );
      })}
    </SeasonTableFrame>
  );
}
