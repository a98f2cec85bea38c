/**
 * Where a cadence places visits in a target's usable windows (our rule, stated below).
 */
import type { TimeSpanJd } from "./types";

/**
 * Start times (JD UTC, ascending) of the visits placed in `windows` (ascending, disjoint), our rule:
 * walking the windows in time order, the first visit starts at the first instant at which a whole
 * visit (`visitDays`) fits inside a window; each next visit starts a cadence (`cadenceDays`) after the
 * previous start if a whole visit fits in a window there, else at the start of the next window that
 * can hold a whole visit. A visit never starts before the previous one ends (a cadence shorter than a
 * visit places visits back to back) and never runs past the end of its window.
 * The loop places one visit or passes one window per turn, so it ends after at most
 * (windows + total window time / max(cadence, visit)) turns.
 */
export function placeVisits(windows: readonly TimeSpanJd[], cadenceDays: number, visitDays: number): Float64Array {
  const spacingDays = Math.max(cadenceDays, visitDays);
  const visits: number[] = [];
  let earliestJdUtc = -Infinity;
  let w = 0;
  while (w < windows.length) {
    const window = windows[w];
    const startJdUtc = Math.max(earliestJdUtc, window.startJdUtc);
    if (startJdUtc + visitDays <= window.endJdUtc) {
      visits.push(startJdUtc);
      earliestJdUtc = startJdUtc + spacingDays;
    } else {
      w++;
    }
  }
  return Float64Array.from(visits);
}
