/**
 * Applying a light-curve fit to a target, and undoing it: the request the target page sends and the
 * revisions it lists. Shared by the data-access layer (lib/server/target-revisions.ts), its routes and
 * the fit panel; imports nothing server-only.
 */

/** `POST /api/proposals/{proposalId}/targets/{targetId}/revisions`: the fit's values for the target. */
export interface ApplyFitRequest {
  /** The peak time t0 as a Julian date in UTC (days). */
  t0JdUtc: number;
  /** Impact parameter |u0| (θ_E), Einstein time t_E (days). */
  u0: number;
  einsteinTimeDays: number;
  /** Source radius ρ (θ_E) when the fit had a finite source; null otherwise. */
  rho: number | null;
  /** Microlens parallax (north, east) when the fit had parallax; null otherwise. */
  parallaxNorth: number | null;
  parallaxEast: number | null;
  /** The source's own magnitude and its share f_s of the baseline flux, from the dataset chosen as the target's band. */
  sourceMagnitude: number;
  blendFraction: number;
  /** The proposal's band id those refer to (null: the proposal's own band). */
  sourceBand: string | null;
  /** What the fit was, kept with the revision and shown in the activity feed. */
  summary: FitSummary;
}

export interface FitSummary {
  chi2: number;
  dof: number;
  pointCount: number;
  /** The dataset the source magnitude comes from, and every dataset fitted. */
  referenceDataset: string;
  datasets: string[];
  /** Each fitted parameter's 1σ error by its name in the fit's parameter order (t0Days, u0, tEDays, rho, piEN, piEE). */
  sigmas: Record<string, number>;
  /** Factor each dataset's errors were multiplied by. */
  errorScales: Record<string, number>;
}

/** The target fields a fit sets, by name (as in the target's view); a revision keeps their values before and after. */
export const fitRevisionFields = [
  "eventPeakJdUtc",
  "sourceOffsetThetaE",
  "einsteinTimeDays",
  "sourceRadiusThetaE",
  "parallaxNorth",
  "parallaxEast",
  "sourceMagnitude",
  "sourceBand",
  "blendFraction",
] as const;

export type FitRevisionField = (typeof fitRevisionFields)[number];
export type FitRevisionValues = Record<FitRevisionField, number | string | null>;

/** `GET …/revisions`: newest first. */
export interface TargetRevisionView {
  id: string;
  kind: "light_curve_fit" | "undo";
  before: FitRevisionValues;
  after: FitRevisionValues;
  summary: FitSummary | null;
  /** Who made it (null once their account is gone), when (ISO 8601, UTC), and when it was undone. */
  actorName: string | null;
  createdAt: string;
  undoneAt: string | null;
  /** True for the latest applied fit, not undone, while the target still holds its values. */
  canUndo: boolean;
}
