/**
 * What the simulated schedule accepts, checked once at its entry points. Site, target and sky limits
 * use the sky-windows schemas (`lib/astro/inputs.ts`); the cycle, the Moon constraint, the cadence,
 * the time per visit and the clear-night fraction are checked here. Failures are
 * `AppError("bad_request:sky")` naming the field, as for every sky input.
 */
import { z } from "zod";
import { AppError } from "@/lib/errors";
import {
  nightDateSchema,
  parseSkyInput,
  skyLimitsSchema,
  skySiteSchema,
  skyTargetSchema,
  type SkyLimits,
  type SkyLimitsInput,
  type SkySite,
  type SkySiteInput,
  type SkyTarget,
} from "@/lib/astro/inputs";
import { SEASON_MAX_TARGETS } from "@/lib/astro/season";
import { cycleTooLongMessage, nightCountInclusive, SEASON_MAX_NIGHTS } from "@/lib/astro/season-length";

const finite = (message: string) => z.number({ error: message }).finite(message);

/** Minimum Moon–target separation and largest Moon illumination; null (or absent) sets no such limit. */
export const moonConstraintSchema = z.object(
  {
    minSeparationDeg: finite("The minimum Moon separation must be a number of degrees.")
      .min(0, "The minimum Moon separation is 0 to 180 degrees.")
      .max(180, "The minimum Moon separation is 0 to 180 degrees.")
      .nullable()
      .default(null),
    maxIlluminatedFraction: finite("The largest Moon illumination must be a fraction from 0 to 1.")
      .min(0, "The largest Moon illumination is a fraction from 0 (new Moon only) to 1 (any Moon).")
      .max(1, "The largest Moon illumination is a fraction from 0 (new Moon only) to 1 (any Moon).")
      .nullable()
      .default(null),
  },
  { error: "The Moon constraint is a minimum separation in degrees and a largest illumination (a fraction), each optional." },
);

/** The cycle and the observing constraints; the site, limits and targets are read by their own schemas. */
export const scheduleConstraintsSchema = z
  .object(
    {
      cycleStartNightIso: nightDateSchema,
      cycleEndNightIso: nightDateSchema,
      moon: moonConstraintSchema.prefault({}),
      cadenceHours: finite("The cadence must be a number of hours.")
        .min(0.001, "The cadence is from 0.001 h (3.6 s) to 8760 h (a year).")
        .max(8760, "The cadence is from 0.001 h (3.6 s) to 8760 h (a year)."),
      visitMinutes: finite("The time per visit must be a number of minutes.")
        .min(0.1, "The time per visit is from 0.1 min (6 s) to 720 min (12 h).")
        .max(720, "The time per visit is from 0.1 min (6 s) to 720 min (12 h)."),
      clearNightFraction: finite("The clear-night fraction must be a number.")
        .gt(0, "The clear-night fraction is more than 0 and at most 1 (every night clear).")
        .max(1, "The clear-night fraction is more than 0 and at most 1 (every night clear).")
        .default(1),
    },
    { error: "The schedule request is missing: give the cycle, the cadence and the time per visit." },
  )
  .superRefine((value, context) => {
    const nights = nightCountInclusive(value.cycleStartNightIso, value.cycleEndNightIso);
    if (nights < 1) context.addIssue({ code: "custom", path: ["cycleEndNightIso"], message: "The last night of the cycle comes on or after the first." });
    else if (nights > SEASON_MAX_NIGHTS) {
      context.addIssue({ code: "custom", path: ["cycleEndNightIso"], message: cycleTooLongMessage(value.cycleStartNightIso) });
    }
  });

const targetListSchema = z
  .array(skyTargetSchema)
  .min(1, "Give at least one target.")
  .max(SEASON_MAX_TARGETS, `At most ${SEASON_MAX_TARGETS} targets at once.`);

export type MoonConstraintInput = z.input<typeof moonConstraintSchema>;

/** Everything a schedule needs except its targets. */
export interface ScheduleConditions {
  site: SkySiteInput;
  /** First and last night of the cycle (inclusive), by the local date of the evening, `YYYY-MM-DD`. */
  cycleStartNightIso: string;
  cycleEndNightIso: string;
  /** Airmass limit, safe Sun elongation (degrees) and sample step (minutes); defaults as `skyLimitsSchema`. */
  limits?: SkyLimitsInput;
  /** Moon constraint; absent: none. */
  moon?: MoonConstraintInput;
  /** Time from the start of one visit to the start of the next, hours. */
  cadenceHours: number;
  /** Length of one visit, minutes. */
  visitMinutes: number;
  /** Share of nights that are clear, (0, 1]; default 1 (every night). */
  clearNightFraction?: number;
}

export interface ScheduleRequest extends ScheduleConditions {
  /** ICRS right ascension and declination, degrees. */
  target: SkyTarget;
}

export interface SchedulesRequest extends ScheduleConditions {
  targets: SkyTarget[];
}

/** The conditions after validation, in the units the planner works in. */
export interface ScheduleSettings {
  site: SkySite;
  limits: SkyLimits;
  firstNightIso: string;
  nightCount: number;
  /** null: no such limit. */
  moonMinSeparationDeg: number | null;
  moonMaxIlluminatedFraction: number | null;
  cadenceDays: number;
  visitDays: number;
  clearNightFraction: number;
}

/** Validates the conditions; throws `AppError("bad_request:sky")` naming the first invalid field. */
export function parseScheduleConditions(request: ScheduleConditions): ScheduleSettings {
  if (typeof request !== "object" || request === null) throw new AppError("bad_request:sky", "The schedule request is missing.", { _: ["The schedule request is missing."] });
  const site = parseSkyInput(skySiteSchema, request.site, "site");
  const limits = parseSkyInput(skyLimitsSchema, request.limits ?? {}, "limits");
  const constraints = parseSkyInput(scheduleConstraintsSchema, {
    cycleStartNightIso: request.cycleStartNightIso,
    cycleEndNightIso: request.cycleEndNightIso,
    moon: request.moon,
    cadenceHours: request.cadenceHours,
    visitMinutes: request.visitMinutes,
    clearNightFraction: request.clearNightFraction,
  }, "");
  return {
    site,
    limits,
    firstNightIso: constraints.cycleStartNightIso,
    nightCount: nightCountInclusive(constraints.cycleStartNightIso, constraints.cycleEndNightIso),
    moonMinSeparationDeg: constraints.moon.minSeparationDeg,
    moonMaxIlluminatedFraction: constraints.moon.maxIlluminatedFraction,
    cadenceDays: constraints.cadenceHours / 24,
    visitDays: constraints.visitMinutes / 1440,
    clearNightFraction: constraints.clearNightFraction,
  };
}

/** Validates one target (ICRS degrees). */
export function parseScheduleTarget(target: unknown): SkyTarget {
  return parseSkyInput(skyTargetSchema, target, "target");
}

/** Validates a list of 1 to `SEASON_MAX_TARGETS` targets. */
export function parseScheduleTargets(targets: unknown): SkyTarget[] {
  return parseSkyInput(targetListSchema, targets, "targets");
}
