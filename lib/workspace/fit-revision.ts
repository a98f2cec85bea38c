/**
 * Applying a light-curve fit to a target, and undoing it: the request the target page sends and the
 * revisions it lists. Shared by the data-access layer (lib/server/target-revisions.ts), its routes and
 * the fit panel; imports nothing server-only.
 */
import { z } from "zod";
import { boundText, type AcceptedRange } from "@/lib/physics/accepted-ranges";
import { EARLIEST_PHOTOMETRY_JD, LATEST_PHOTOMETRY_JD } from "@/lib/event-photometry/event-time";
import { MAX_FIT_ROWS } from "@/lib/lensing/fit-input";
import { EVENT_PEAK_MAX_JD, EVENT_PEAK_MIN_JD } from "@/lib/workspace/event-peak";
import { photometryBandIds } from "@/lib/workspace/photometry-schema";
import { targetParamsSchema } from "@/lib/workspace/ids";
import { nameText, storedText } from "@/lib/workspace/stored-text";
import { targetQuantities } from "@/lib/workspace/target-schema";

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

/**
 * The revisions' URL: `GET` lists them (the revisions list's SWR key), `POST` applies a fit. A client
 * that applies one refreshes this key and the page's server data (`router.refresh()`).
 */
export function targetRevisionsUrl(proposalId: string, targetId: string): string {
  return `/api/proposals/${proposalId}/targets/${targetId}/revisions`;
}

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

/**
 * The accepted peak times of a fit, JD (UTC): within the photometry's span (EARLIEST/LATEST_PHOTOMETRY_JD
 * of lib/event-photometry/event-time.ts) and the span a target's event peak is stored in (from
 * EVENT_PEAK_MIN_JD, before EVENT_PEAK_MAX_JD: lib/workspace/event-peak.ts), so the applied t0 is one
 * the target form reads back.
 */
const FIT_T0_MIN_JD = Math.max(EARLIEST_PHOTOMETRY_JD, EVENT_PEAK_MIN_JD);
const FIT_T0_BEFORE_JD = Math.min(LATEST_PHOTOMETRY_JD, EVENT_PEAK_MAX_JD);

/** Our rule: a fit of more datasets than this is not one a team applies by hand. */
const MAX_FIT_DATASETS = 50;
/** Our rule: a dataset's name (a telescope or survey and a band, perhaps with a " (2)" suffix). */
const MAX_DATASET_CHARS = 120;
/** Our rule: a name in the summary's records (a parameter, "sourceFlux:<dataset>", or a dataset). */
const MAX_RECORD_NAME_CHARS = 140;
/** The fit's parameters (six at most) and two fluxes per dataset. */
const MAX_RECORD_ENTRIES = 6 + 2 * MAX_FIT_DATASETS;

/** A finite number (zod refuses ±Infinity), refused in words naming the field by `label`. */
const finiteNumber = (label: string) => z.number({ error: (issue) => (issue.input === undefined ? `${label} is missing.` : `${label} must be a number.`) });

/** A number the fit sent, in `range`. */
function fitNumber(label: string, range: AcceptedRange, rangeWords: string) {
  return finiteNumber(label).refine((value) => value >= range.min && value <= range.max, { error: `${label} is ${rangeWords}.` });
}

/** A whole count from `min` to `max`. */
function fitCount(label: string, min: number, max: number) {
  return z
    .number({ error: (issue) => (issue.input === undefined ? `${label} is missing.` : `${label} must be a whole number.`) })
    .refine((value) => Number.isInteger(value) && value >= min && value <= max, { error: `${label} is a whole number from ${boundText(min)} to ${boundText(max)}.` });
}

/**
 * A record of numbers by name (σ per parameter, a scale factor per dataset), checked as a whole so
 * that a refusal names the record, never one of its keys: each value finite and at least zero, or
 * above zero when `isPositive`.
 */
function numbersByName(label: string, isPositive: boolean) {
  const what = isPositive ? "positive numbers" : "numbers of zero or more";
  return z.unknown().transform((input, ctx) => {
    const refuse = (message: string) => {
      ctx.addIssue({ code: "custom", message });
      return z.NEVER;
    };
    if (typeof input !== "object" || input === null || Array.isArray(input)) return refuse(`${label} must be a group of ${what} by name.`);
    const entries = Object.entries(input);
    if (entries.length > MAX_RECORD_ENTRIES) return refuse(`${label} has at most ${MAX_RECORD_ENTRIES} entries.`);
    for (const [name, value] of entries) {
      if (name.length > MAX_RECORD_NAME_CHARS || !storedText(label).safeParse(name).success) return refuse(`${label} names something that is not a parameter or a dataset.`);
      if (typeof value !== "number" || !Number.isFinite(value) || value < 0 || (isPositive && value === 0)) return refuse(`${label} must be ${what}.`);
    }
    return Object.fromEntries(entries) as Record<string, number>;
  });
}

const datasetName = (label: string) => nameText(label).min(1, { error: `${label} is empty.` }).max(MAX_DATASET_CHARS, { error: `${label} is at most ${MAX_DATASET_CHARS} characters.` });

/** What the fit was, as kept with the revision. */
export const fitSummarySchema = z.object(
  {
    chi2: fitNumber("The fit's χ²", { min: 0, max: Number.MAX_VALUE }, "a number of zero or more"),
    dof: fitCount("The fit's degrees of freedom", 1, MAX_FIT_ROWS),
    pointCount: fitCount("The fit's number of points", 1, MAX_FIT_ROWS),
    referenceDataset: datasetName("The reference dataset"),
    datasets: z
      .array(datasetName("Each fitted dataset's name"), { error: "The fitted datasets must be a list of dataset names." })
      .min(1, { error: "The fitted datasets name at least one dataset." })
      .max(MAX_FIT_DATASETS, { error: `The fitted datasets are at most ${MAX_FIT_DATASETS}.` }),
    sigmas: numbersByName("The fit's 1σ errors", false),
    errorScales: numbersByName("The fit's error scale factors", true),
  },
  { error: "The request's fit summary must say χ², the degrees of freedom, the points and the datasets of the fit." },
);

const { sourceOffsetThetaE, einsteinTimeDays, sourceRadiusThetaE, parallaxNorth, sourceMagnitude, blendFraction } = targetQuantities;

/**
 * `ApplyFitRequest` as the server reads it. The ranges are the target's own (targetQuantities of
 * lib/workspace/target-schema.ts, from lib/physics/accepted-ranges.ts where they are there), so an
 * applied fit is a target the form accepts; u0 may come signed (a parallax fit's) and is kept as |u0|.
 */
export const applyFitRequestSchema = z
  .object(
    {
      t0JdUtc: finiteNumber("The fit's peak time t0").refine((jd) => jd >= FIT_T0_MIN_JD && jd < FIT_T0_BEFORE_JD, {
        error: `The fit's peak time t0 is a Julian date (UTC) from ${FIT_T0_MIN_JD} (the year 2000) to before ${FIT_T0_BEFORE_JD} (2100).`,
      }),
      u0: finiteNumber("The fit's impact parameter u0")
        .transform((u0) => Math.abs(u0))
        .refine((u0) => u0 >= sourceOffsetThetaE.range.min && u0 <= sourceOffsetThetaE.range.max, {
          error: `The fit's impact parameter u0 is from ${boundText(sourceOffsetThetaE.range.min)} to ${boundText(sourceOffsetThetaE.range.max)} Einstein radii in size (either sign).`,
        }),
      einsteinTimeDays: fitNumber("The fit's Einstein time t_E", einsteinTimeDays.range, `from ${boundText(einsteinTimeDays.range.min)} to ${boundText(einsteinTimeDays.range.max)} days`),
      rho: fitNumber("The fit's source radius ρ", sourceRadiusThetaE.range, `from ${boundText(sourceRadiusThetaE.range.min)} to ${boundText(sourceRadiusThetaE.range.max)} Einstein radii, or null without a finite source`).nullable(),
      parallaxNorth: fitNumber("The fit's microlens parallax π_E,N", parallaxNorth.range, "from −100 to 100, or null without parallax").nullable(),
      parallaxEast: fitNumber("The fit's microlens parallax π_E,E", parallaxNorth.range, "from −100 to 100, or null without parallax").nullable(),
      sourceMagnitude: fitNumber("The source magnitude from the fit", sourceMagnitude.range, `from ${sourceMagnitude.range.min} to ${sourceMagnitude.range.max}`),
      blendFraction: fitNumber("The blend fraction f_s from the fit", blendFraction.range, `from ${boundText(blendFraction.range.min)} to 1 (the source's share of the baseline flux)`),
      sourceBand: z.enum(photometryBandIds, { error: "The source's band is one of the built-in bands or the proposal's own, or null for the proposal's band." }).nullable(),
      summary: fitSummarySchema,
    },
    { error: "The request must give the fit to apply: t0, u0, t_E, the source's magnitude and f_s, and the fit's summary." },
  )
  .superRefine((body, ctx) => {
    if ((body.parallaxNorth === null) !== (body.parallaxEast === null)) {
      ctx.addIssue({ code: "custom", path: [body.parallaxNorth === null ? "parallaxNorth" : "parallaxEast"], message: "The fit's microlens parallax needs both components, π_E,N and π_E,E, or neither." });
    }
    if (!body.summary.datasets.includes(body.summary.referenceDataset)) {
      ctx.addIssue({ code: "custom", path: ["summary", "referenceDataset"], message: "The reference dataset must be one of the fitted datasets." });
    }
  });

/** Route parameters of `…/revisions/{revisionId}/undo`: a revision id that is not a UUID names nothing (404). */
export const revisionParamsSchema = targetParamsSchema.extend({ revisionId: z.uuid("The revision names nothing here.") });
