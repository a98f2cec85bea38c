/**
 * A target's observing seasons in the cycle: runs of nights that can hold a visit, short
 * interruptions bridged (our rule).
 */
import { addDaysIso } from "@/lib/astro/time";
import type { TargetTimeline } from "./timeline";
import type { ObservingSeason } from "./types";

/**
 * Longest run of nights without a visit that still counts as inside one season (our rule). The
 * nights around full Moon, when a Moon constraint removes whole nights, last under half a synodic
 * month (29.5 days), so they never split a season; the gap around conjunction with the Sun lasts
 * months and always does.
 */
export const SEASON_BRIDGE_NIGHTS = 14;

/**
 * The seasons of `timeline` (its nights tallied as if clear: weather does not end a season; it is
 * lost time inside one). A night is in season when its longest window can hold one visit
 * (`visitDays`); runs of such nights separated by at most `SEASON_BRIDGE_NIGHTS` nights join.
 * Night i is the evening `firstNightIso` + i days.
 */
export function observingSeasons(timeline: TargetTimeline, visitDays: number, firstNightIso: string): ObservingSeason[] {
  const { longestClearRunDays, firstClearJdUtc, lastClearJdUtc } = timeline;
  const seasons: ObservingSeason[] = [];
  let first = -1;
  let last = -1;
  let usableNightCount = 0;
  const close = () => {
    if (first < 0) return;
    const startJdUtc = firstClearJdUtc[first];
    const endJdUtc = lastClearJdUtc[last];
    seasons.push({
      startJdUtc,
      endJdUtc,
      nightCount: last - first + 1,
      usableNightCount,
      firstNightIso: addDaysIso(firstNightIso, first),
      lastNightIso: addDaysIso(firstNightIso, last),
      lengthDays: endJdUtc - startJdUtc,
    });
  };
  for (let night = 0; night < longestClearRunDays.length; night++) {
    if (!(longestClearRunDays[night] >= visitDays)) continue;
    if (first >= 0 && night - last - 1 > SEASON_BRIDGE_NIGHTS) {
      close();
      first = -1;
    }
    if (first < 0) {
      first = night;
      usableNightCount = 0;
    }
    last = night;
    usableNightCount++;
  }
  close();
  return seasons;
}
