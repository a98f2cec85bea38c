import { z } from "zod";
import { nameText, storedText } from "@/lib/workspace/stored-text";
import type { FieldErrors } from "@/lib/errors";
import { nightDateSchema, type SkySiteInput } from "@/lib/astro/inputs";
import { cycleTooLongMessage, nightCountInclusive, SEASON_MAX_NIGHTS } from "@/lib/astro/season-length";
import { quantityField, type QuantitySpec } from "@/lib/workspace/quantity-field";
import { photometrySettingsErrors, photometrySettingsSchema, type PhotometrySettings } from "@/lib/workspace/photometry-schema";

/**
 * The proposal's quantities: each a number in its stored unit (API clients) or typed text with a
 * unit, read by the one quantity parser and converted to the stored unit. Angles default to degrees
 * (sexagesimal is not read here), the elevation to metres.
 */
export const proposalQuantities = {
  latitudeDeg: {
    label: "Latitude",
    kind: "angle",
    unit: "deg",
    unitWords: "°",
    example: "-24.6 deg",
    range: { min: -90, max: 90 },
    rangeMessage: "Latitude is between -90 and 90 degrees.",
  },
  longitudeDeg: {
    label: "Longitude",
    kind: "angle",
    unit: "deg",
    unitWords: "°",
    example: "-70.4 deg (east positive)",
    range: { min: -180, max: 180 },
    rangeMessage: "Longitude is between -180 and 180 degrees (east positive).",
  },
  elevationM: {
    label: "Elevation",
    kind: "length",
    unit: "m",
    unitWords: "m",
    example: "2635 m",
    range: { min: -500, max: 9000 },
    rangeMessage: "Elevation is from -500 m to 9000 m.",
  },
  horizonLimitDeg: {
    label: "Horizon limit",
    kind: "angle",
    unit: "deg",
    unitWords: "°",
    example: "20 deg",
    range: { min: 0, max: 60 },
    rangeMessage: "The horizon limit is 0 to 60 degrees of altitude.",
  },
  // Lower bounds (our rule) keep every ratio the verdicts take finite: 0.1 µas is finer than any
  // interferometer reaches (about 20 µas on Earth-sized baselines), 3.6 s and 15 min shorter than any
  // lensing cadence or campaign. Upper bounds: the whole sky, a year, ten years.
  resolutionMas: {
    label: "Resolution",
    kind: "angle",
    unit: "mas",
    unitWords: "mas",
    example: "0.05 arcsec",
    range: { min: 1e-4, max: 3.6e6 },
    rangeMessage: "Resolution is from 0.0001 mas (0.1 µas) to 3\u202f600\u202f000 mas (1000°).",
  },
  cadenceHours: {
    label: "Cadence",
    kind: "time",
    unit: "h",
    unitWords: "h",
    example: "30 min",
    range: { min: 0.001, max: 24 * 365 },
    rangeMessage: "Cadence is from 0.001 h (3.6 s) to 8760 h (a year).",
  },
  campaignLengthDays: {
    label: "Campaign length",
    kind: "time",
    unit: "d",
    unitWords: "days",
    example: "90 d",
    range: { min: 0.01, max: 3653 },
    rangeMessage: "Campaign length is from 0.01 days (about 15 minutes) to 3653 days (ten years).",
  },
  airmassLimit: {
    label: "Airmass limit",
    kind: "number",
    example: "2",
    range: { min: 1, max: 10 },
    rangeMessage: "The airmass limit is from 1 (the zenith) to 10.",
  },
  interferometerWavelengthMm: {
    label: "Interferometer wavelength",
    kind: "wavelength",
    unit: "mm",
    unitWords: "mm",
    example: "1.3 mm or 230 GHz",
    range: { min: 1e-5, max: 1000 },
    rangeMessage: "The interferometer wavelength is from 0.00001 mm (10 nm) to 1000 mm.",
  },
  interferometerBaselineKm: {
    label: "Longest baseline",
    kind: "length",
    unit: "km",
    unitWords: "km",
    example: "10700 km",
    range: { min: 1e-3, max: 1e6 },
    rangeMessage: "The longest baseline is from 0.001 km (1 m) to 1\u202f000\u202f000 km.",
  },
  // The observing constraints of the simulated schedule (lib/schedule). Defaults: 30° from the Moon
  // and 20 min per visit are common practice for broad-band imaging; a clear-night fraction of 1
  // counts every night as clear until the team sets its site's statistics.
  moonMinSeparationDeg: {
    label: "Minimum Moon separation",
    kind: "angle",
    unit: "deg",
    unitWords: "°",
    example: "30 deg",
    range: { min: 0.1, max: 180 },
    rangeMessage: "The minimum Moon separation is from 0.1° to 180°; leave it empty for no Moon constraint.",
  },
  moonMaxIllumination: {
    label: "Largest Moon illumination",
    kind: "number",
    example: "0.5",
    range: { min: 0, max: 1 },
    rangeMessage: "The largest Moon illumination is a fraction from 0 (new Moon only) to 1 (any Moon).",
  },
  visitMinutes: {
    label: "Time per visit",
    kind: "time",
    unit: "min",
    unitWords: "min",
    example: "20 min",
    range: { min: 0.1, max: 720 },
    rangeMessage: "The time per visit is from 0.1 min (6 s) to 720 min (12 h).",
  },
  clearNightFraction: {
    label: "Clear-night fraction",
    kind: "number",
    example: "0.7",
    range: { min: 0.01, max: 1 },
    rangeMessage: "The clear-night fraction is from 0.01 to 1 (every night clear).",
  },
  astrometricPrecisionMas: {
    label: "Astrometric precision per epoch",
    kind: "angle",
    unit: "mas",
    unitWords: "mas",
    example: "0.1 mas or 100 uas",
    range: { min: 1e-4, max: 1e4 },
    rangeMessage: "The astrometric precision per epoch is from 0.0001 mas (0.1 µas) to 10\u202f000 mas.",
  },
  reachableContrast: {
    label: "Reachable contrast",
    kind: "number",
    example: "100 (a contrast of 5 mag)",
    range: { min: 1, max: 1e10 },
    rangeMessage: "The reachable contrast is a flux ratio from 1 to 10\u00b9\u2070 (25 mag).",
  },
  // The radial-velocity precision of one spectroscopic epoch, against which the relativistic-orbit
  // case grades the redshift at periapsis. Our rule: 0.001 km/s (1 m/s, the best stabilised
  // spectrographs, from memory) to 1000 km/s (coarser says nothing of any orbit's redshift).
  spectroscopicPrecisionKmPerS: {
    label: "Spectroscopic precision per epoch",
    kind: "velocity",
    unit: "km/s",
    unitWords: "km/s",
    example: "10 km/s",
    range: { min: 1e-3, max: 1e3 },
    rangeMessage: "The spectroscopic precision per epoch is from 0.001 km/s (1 m/s) to 1000 km/s.",
  },
} as const satisfies Record<string, QuantitySpec>;

/** The observing site: where the telescope stands and how low it can point. */
export const siteSchema = z.object(
  {
    name: nameText("The site name").trim().min(1, "Name the site.").max(120, "The site name is at most 120 characters."),
    latitudeDeg: quantityField(proposalQuantities.latitudeDeg),
    longitudeDeg: quantityField(proposalQuantities.longitudeDeg),
    elevationM: quantityField(proposalQuantities.elevationM),
    horizonLimitDeg: quantityField(proposalQuantities.horizonLimitDeg),
  },
  { error: "The observing site is missing: give its name, latitude, longitude, elevation and horizon limit." },
);

/** The lensing scales the stored verdicts compare each target with. */
const lensingInstrumentSchema = z.object(
  {
    resolutionMas: quantityField(proposalQuantities.resolutionMas),
    cadenceHours: quantityField(proposalQuantities.cadenceHours),
    campaignLengthDays: quantityField(proposalQuantities.campaignLengthDays),
  },
  { error: "The instrument defaults are missing: give the resolution, cadence and campaign length." },
);

/**
 * All instrument defaults: the lensing scales, the airmass limit of the sky windows, for a
 * shadow-imaging proposal the interferometer's wavelength and longest baseline (both or neither),
 * the observing constraints of the simulated schedule (Moon, time per visit, clear nights) and the
 * astrometric precision per epoch of an astrometric-microlensing proposal, the contrast (largest
 * flux ratio of two images) the instrument reaches, and the radial-velocity precision per epoch of a
 * relativistic-orbit proposal.
 */
export const instrumentSchema = lensingInstrumentSchema.extend({
  airmassLimit: quantityField(proposalQuantities.airmassLimit).default(2),
  interferometerWavelengthMm: quantityField(proposalQuantities.interferometerWavelengthMm).nullable().default(null),
  interferometerBaselineKm: quantityField(proposalQuantities.interferometerBaselineKm).nullable().default(null),
  moonMinSeparationDeg: quantityField(proposalQuantities.moonMinSeparationDeg).nullable().default(30),
  moonMaxIllumination: quantityField(proposalQuantities.moonMaxIllumination).nullable().default(null),
  visitMinutes: quantityField(proposalQuantities.visitMinutes).default(20),
  clearNightFraction: quantityField(proposalQuantities.clearNightFraction).default(1),
  astrometricPrecisionMas: quantityField(proposalQuantities.astrometricPrecisionMas).nullable().default(null),
  reachableContrast: quantityField(proposalQuantities.reachableContrast).nullable().default(null),
  spectroscopicPrecisionKmPerS: quantityField(proposalQuantities.spectroscopicPrecisionKmPerS).nullable().default(null),
});

const cycleDateSchema = nightDateSchema.nullable();

const proposalFields = {
  title: nameText("The title").trim().min(1, "Give the proposal a title.").max(200, "The title is at most 200 characters."),
  cycle: nameText("The observing cycle").trim().min(1, "Name the observing cycle (e.g. 2027B).").max(40, "The observing cycle is at most 40 characters."),
  abstract: storedText("The abstract").max(5000, "The abstract is at most 5000 characters."),
  /** First and last night of the cycle (local evening dates, inclusive); both or neither. */
  cycleStartDate: cycleDateSchema,
  cycleEndDate: cycleDateSchema,
  site: siteSchema,
  instrument: instrumentSchema,
  /** The photon budget's telescope, detector, band and site sky. */
  photometry: photometrySettingsSchema,
};

export const proposalSchema = z.object({
  ...proposalFields,
  abstract: proposalFields.abstract.default(""),
  cycleStartDate: cycleDateSchema.default(null),
  cycleEndDate: cycleDateSchema.default(null),
  photometry: photometrySettingsSchema.prefault({}),
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

/**
 * The checks across fields, on the proposal as it will be stored: cycle dates both or neither, in
 * order and at most `SEASON_MAX_NIGHTS` nights long (what the season view computes); wavelength and
 * baseline both or neither; the photometry's own (`photometrySettingsErrors`). Empty when all hold.
 */
export function proposalSettingsErrors(
  p: Pick<ProposalInput, "cycleStartDate" | "cycleEndDate"> & {
    instrument: Pick<InstrumentSettings, "interferometerWavelengthMm" | "interferometerBaselineKm" | "visitMinutes">;
    /** Null where there is no camera (the lens bench). */
    photometry: PhotometrySettings | null;
  },
): FieldErrors {
  const fields: FieldErrors = p.photometry === null ? {} : photometrySettingsErrors(p.photometry);
  if (p.photometry !== null && p.photometry.overheadS >= p.instrument.visitMinutes * 60) {
    fields["photometry.overheadS"] = [`The overhead per visit must be shorter than the time per visit (${p.instrument.visitMinutes} min), or no time is left to expose.`];
  }
  const { cycleStartDate: start, cycleEndDate: end } = p;
  if ((start === null) !== (end === null)) {
    fields[start === null ? "cycleStartDate" : "cycleEndDate"] = ["Give both the first and the last night of the cycle, or neither."];
  } else if (start !== null && end !== null) {
    const nights = nightCountInclusive(start, end);
    if (nights < 1) fields.cycleEndDate = ["The last night comes on or after the first."];
    else if (nights > SEASON_MAX_NIGHTS) fields.cycleEndDate = [cycleTooLongMessage(start)];
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
