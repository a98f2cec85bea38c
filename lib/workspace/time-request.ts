/**
 * A proposal's time request: the hours its targets' photon budgets ask for (exposures and overheads
 * over the visits each science case needs), and the sentence the proposal page, the technical summary
 * and its PDF write for it.
 */
import { formatSignificant } from "@/lib/numbers/significant";

export interface ProposalTimeRequest {
  /** Σ of the targets' time requests, h. */
  totalHours: number;
  /** Targets with a photon budget (the rest lack an input it needs: the aperture, a source magnitude, the cycle). */
  budgetedTargets: number;
  targetCount: number;
}

/** The time request summed over targets as the table rows carry them. */
export function timeRequestOf(rows: readonly { timeRequestHours: number | null }[]): ProposalTimeRequest {
  let totalHours = 0;
  let budgetedTargets = 0;
  for (const row of rows) {
    if (row.timeRequestHours === null) continue;
    totalHours += row.timeRequestHours;
    budgetedTargets += 1;
  }
  return { totalHours, budgetedTargets, targetCount: rows.length };
}

/** "42.5 h (exposures and overheads over the visits each case needs) for 8 of 10 targets; 2 without a photon budget". */
export function timeRequestSentence(request: ProposalTimeRequest): string {
  if (request.budgetedTargets === 0) {
    return "no photon budget yet: set the telescope aperture in the proposal settings and each target's source magnitude";
  }
  const unbudgeted = request.targetCount - request.budgetedTargets;
  const hours = `${formatSignificant(request.totalHours, 3)} h (exposures and overheads over the visits each case needs) for ${request.budgetedTargets} of ${request.targetCount} targets`;
  return unbudgeted > 0 ? `${hours}; ${unbudgeted} without a photon budget (see each target's depth answer)` : hours;
}
