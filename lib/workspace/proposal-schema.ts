import { z } from "zod";
import { nameText, storedText } from "@/lib/workspace/stored-text";
import type { FieldErrors } from "@/lib/errors";
import { nightDateSchema, type SkySiteInput } from "@/lib/astro/inputs";
import { SEASON_MAX_NIGHTS } from "@/lib/astro/season";
import { addDaysIso } from "@/lib/astro/time";

/** The observing site: where the telescope stands and how low it can point. */
export const siteSchema = z.object({
  name: nameText().trim().min(1, "Name the site.").max(120, "A site name is at most 120 characters."),
  latitudeDeg: z.number().min(-90, "Latitude is between -90 and 90 degrees.").max(90, "Latitude is between -90 and 90 degrees."),
  longitudeDeg: z.number().min(-180, "Longitude is between -180 and 180 degrees (east positive).").max(180, "Longitude is between -180 and 180 degrees (east positive)."),
  elevationM: z.number().min(-500, "Elevation is at least -500 m.").max(9000, "Elevation is at most 9000 m."),
  horizonLimitDeg: z.number().min(0, "The horizon limit is 0 to 60 degrees of altitude.").max(60, "The horizon limit is 0 to 60 degrees of altitude."),
});

/** The lensing scales the stored verdicts compare each target with. */
const lensingInstrumentSchema = z.object({
  // Lower bounds (our rule) keep every ratio the verdicts take finite: 0.1 µas is finer than any
  // interferometer reaches (about 20 µas on Earth-sized baselines), 3.6 s and 15 min shorter than any
  // lensing cadence or campaign. Upper bounds: the whole sky, a year, ten years.
  resolutionMas: z
    .number("Resolution must be a number of milliarcseconds.")
    .min(1e-4, "Resolution is from 0.0001 mas (0.1 µas) to 3,600,000 mas (1,000°).")
    .max(3.6e6, "Resolution is from 0.0001 mas (0.1 µas) to 3,600,000 mas (1,000°)."),
  cadenceHours: z
    .number("Cadence must be a number of hours.")
    .min(0.001, "Cadence is from 0.001 h (3.6 s) to 8,760 h (a year).")
    .max(24 * 365, "Cadence is from 0.001 h (3.6 s) to 8,760 h (a year)."),
  campaignLengthDays: z
    .number("Campaign length must be a number of days.")
    .min(0.01, "Campaign length is from 0.01 days (about 15 minutes) to 3,653 days (ten years).")
    .max(3653, "Campaign length is from 0.01 days (about 15 minutes) to 3,653 days (ten years)."),
});

/**
 * All instrument defaults: the lensing scales, the airmass limit of the sky windows and, for a
 * shadow-imaging proposal, the interferometer's wavelength and longest baseline (both or neither).
 */
export const instrumentSchema = lensingInstrumentSchema.extend({
  airmassLimit: z
    .number("The airmass limit must be a number.")
    .min(1, "The airmass limit is at least 1 (the zenith).")
    .max(10, "The airmass limit is at most 10.")
    .default(2),
  interferometerWavelengthMm: z
    .number("The wavelength must be a number of millimetres.")
    .min(1e-5, "The wavelength is from 0.00001 mm (10 nm) to 1000 mm.")
    .max(1000, "The wavelength is from 0.00001 mm (10 nm) to 1000 mm.")
    .nullable()
    .default(null),
  interferometerBaselineKm: z
    .number("The baseline must be a number of kilometres.")
    .min(1e-3, "The baseline is from 0.001 km (1 m) to 1,000,000 km.")
    .max(1e6, "The baseline is from 0.001 km (1 m) to 1,000,000 km.")
    .nullable()
    .default(null),
});

const cycleDateSchema = nightDateSchema.nullable();

const proposalFields = {
  title: nameText().trim().min(1, "Give the proposal a title.").max(200, "A title is at most 200 characters."),
  cycle: nameText().trim().min(1, "Name the observing cycle (e.g. 2027B).").max(40, "A cycle name is at most 40 characters."),
  abstract: storedText().max(5000, "The abstract is at most 5000 characters."),
  /** First and last night of the cycle (local evening dates, inclusive); both or neither. */
  cycleStartDate: cycleDateSchema,
  cycleEndDate: cycleDateSchema,
  site: siteSchema,
  instrument: instrumentSchema,
};

export const proposalSchema = z.object({
  ...proposalFields,
  abstract: proposalFields.abstract.default(""),
  cycleStartDate: cycleDateSchema.default(null),
  cycleEndDate: cycleDateSchema.default(null),
});

export type ProposalInput = z.infer<typeof proposalSchema>;
/** The lensing scales `deriveTargetColumns` grades against. */
export type InstrumentDefaults = z.infer<typeof lensingInstrumentSchema>;
export type InstrumentSettings = z.infer<typeof instrumentSchema>;

export const createProposalSchema = proposalSchema;
/**
 * A PATCH changes only the fields it sends (no defaults here, so an omitted abstract is kept, not
 * emptied); `site` and `instrument` are sent complete or not at all.
 */
export const updateProposalSchema = z.object(proposalFields).partial();

/** Nights from `startIso` to `endIso` inclusive (both evening dates, `YYYY-MM-DD`). */
export function cycleNightCount(startIso: string, endIso: string): number {
  return Math.round((Date.parse(`${endIso}T00:00:00Z`) - Date.parse(`${startIso}T00:00:00Z`)) / 86_400_000) + 1;
}

/**
 * The checks across fields, on the proposal as it will be stored: cycle dates both or neither, in
 * order and at most `SEASON_MAX_NIGHTS` nights long (what the season view computes); wavelength and
 * baseline both or neither. Empty when all hold.
 */
export function proposalSettingsErrors(p: Pick<ProposalInput, "cycleStartDate" | "cycleEndDate"> & { instrument: Pick<InstrumentSettings, "interferometerWavelengthMm" | "interferometerBaselineKm"> }): FieldErrors {
  const fields: FieldErrors = {};
  const { cycleStartDate: start, cycleEndDate: end } = p;
  if ((start === null) !== (end === null)) {
    fields[start === null ? "cycleStartDate" : "cycleEndDate"] = ["Give both the first and the last night of the cycle, or neither."];
  } else if (start !== null && end !== null) {
    const nights = cycleNightCount(start, end);
    if (nights < 1) fields.cycleEndDate = ["The last night comes on or after the first."];
    else if (nights > SEASON_MAX_NIGHTS) fields.cycleEndDate = [`The cycle is at most ${SEASON_MAX_NIGHTS} nights (last night ${addDaysIso(start, SEASON_MAX_NIGHTS - 1)} at the latest).`];
  }
  const { interferometerWavelengthMm: wavelength, interferometerBaselineKm: baseline } = p.instrument;
  if ((wavelength === null) !== (baseline === null)) {
    fields[wavelength === null ? "instrument.interferometerWavelengthMm" : "instrument.interferometerBaselineKm"] = [
      "Give both the interferometer's wavelength and its baseline, or neither.",
    ];
  }
  return fields;
}

/** The proposal's site in the sky-windows core's terms (the stored longitude is east-positive). */
export function skySiteOf(site: ProposalInput["site"]): SkySiteInput {
  return { name: site.name, latitudeDeg: site.latitudeDeg, longitudeEastDeg: site.longitudeDeg, elevationM: site.elevationM, horizonLimitDeg: site.horizonLimitDeg };
}
