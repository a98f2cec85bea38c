/**
 * What the sky-windows core accepts, checked once at its entry points. Every failure is an
 * `AppError` with code `bad_request:sky` whose message and `fields` name the offending field, so a
 * form can show it beside the input.
 */
import { z } from "zod";
import { AppError, type FieldErrors } from "@/lib/errors";
import { DEFAULT_AIRMASS_LIMIT, DEFAULT_SAFE_SUN_ELONGATION_DEG, DEFAULT_STEP_MINUTES } from "./constants";

const finite = (message: string) => z.number({ error: message }).finite(message);

/** An observing site: geodetic latitude, longitude east of Greenwich, height above sea level. */
export const skySiteSchema = z.object({
  name: z.string().trim().max(120, "The site name is at most 120 characters.").optional(),
  latitudeDeg: finite("Latitude must be a number of degrees.")
    .min(-90, "Latitude is between -90 and 90 degrees.")
    .max(90, "Latitude is between -90 and 90 degrees."),
  longitudeEastDeg: finite("Longitude must be a number of degrees.")
    .min(-180, "Longitude is between -180 and 180 degrees (east positive).")
    .max(180, "Longitude is between -180 and 180 degrees (east positive)."),
  elevationM: finite("Elevation must be a number of metres.")
    .min(-500, "Elevation is at least -500 m.")
    .max(9000, "Elevation is at most 9000 m."),
  horizonLimitDeg: finite("The horizon limit must be a number of degrees.")
    .min(0, "The horizon limit is 0 to 60 degrees of altitude.")
    .max(60, "The horizon limit is 0 to 60 degrees of altitude.")
    .default(0),
});

/** A fixed target: ICRS right ascension and declination in degrees. */
export const skyTargetSchema = z.object({
  name: z.string().trim().max(120, "The target name is at most 120 characters.").optional(),
  raDeg: finite("Right ascension must be a number of degrees.")
    .min(0, "Right ascension is in [0, 360) degrees.")
    .lt(360, "Right ascension is in [0, 360) degrees."),
  decDeg: finite("Declination must be a number of degrees.")
    .min(-90, "Declination is between -90 and 90 degrees.")
    .max(90, "Declination is between -90 and 90 degrees."),
});

/** A night named by the local calendar date of its evening, `YYYY-MM-DD`, years 1900–2200. */
export const nightDateSchema = z
  .string({ error: "The date must be written YYYY-MM-DD." })
  .regex(/^\d{4}-\d{2}-\d{2}$/, "The date must be written YYYY-MM-DD.")
  .refine((text) => {
    const [year, month, day] = text.split("-").map(Number);
    const date = new Date(Date.UTC(year, month - 1, day));
    return year >= 1900 && year <= 2200 && date.getUTCMonth() === month - 1 && date.getUTCDate() === day;
  }, "The date must be a real calendar date between 1900 and 2200.");

/** Limits that decide when a target counts as observable. */
export const skyLimitsSchema = z.object({
  airmassLimit: finite("The airmass limit must be a number.")
    .min(1, "The airmass limit is at least 1 (the zenith).")
    .max(10, "The airmass limit is at most 10.")
    .default(DEFAULT_AIRMASS_LIMIT),
  safeSunElongationDeg: finite("The safe Sun elongation must be a number of degrees.")
    .min(0, "The safe Sun elongation is 0 to 90 degrees.")
    .max(90, "The safe Sun elongation is 0 to 90 degrees.")
    .default(DEFAULT_SAFE_SUN_ELONGATION_DEG),
  stepMinutes: finite("The time step must be a number of minutes.")
    .min(1, "The time step is 1 to 30 minutes.")
    .max(30, "The time step is 1 to 30 minutes.")
    .default(DEFAULT_STEP_MINUTES),
});

export type SkySite = z.output<typeof skySiteSchema>;
export type SkySiteInput = z.input<typeof skySiteSchema>;
export type SkyTarget = z.output<typeof skyTargetSchema>;
export type SkyLimits = z.output<typeof skyLimitsSchema>;
export type SkyLimitsInput = z.input<typeof skyLimitsSchema>;

/**
 * Validates `input` against `schema`; on failure throws `AppError("bad_request:sky")` whose message
 * names the first offending field (prefixed by `subject`, e.g. "site.latitudeDeg") and whose `fields`
 * holds every message by field path.
 */
export function parseSkyInput<S extends z.ZodType>(schema: S, input: unknown, subject: string): z.output<S> {
  const result = schema.safeParse(input);
  if (result.success) return result.data;
  const fields: FieldErrors = {};
  for (const issue of result.error.issues) {
    const path = [subject, ...issue.path.map(String)].filter(Boolean).join(".");
    (fields[path] ??= []).push(issue.message);
  }
  const [firstField, [firstMessage]] = Object.entries(fields)[0];
  throw new AppError("bad_request:sky", `${firstField}: ${firstMessage}`, fields);
}
