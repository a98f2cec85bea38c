/**
 * A proposal's photometry settings: the telescope and detector the photon budget is computed for,
 * the band observed, the site's sky and extinction per band (typical dark-site values until the team
 * gives its own), the time lost per visit and the signal-to-noise the team asks of a visit. Stored as
 * one JSON document on the proposal (`proposals.photometry`) and read back through this schema, so a
 * setting added later takes its default in every stored proposal.
 *
 * Defaults: the telescope aperture has none (a photon budget needs the team's telescope); the
 * detector values are those of a typical scientific CCD (common practice, from memory: a few
 * electrons of read noise, ~10⁻³ e⁻/s/pixel of dark current when cooled, a full well of ~10⁵ e⁻);
 * S/N 50 (2% photometry) is common practice for microlensing light curves.
 */
import { z } from "zod";
import type { FieldErrors } from "@/lib/errors";
import { standardBand, standardBandIds, typicalDarkSiteConditions, validateCustomBand, type PhotometricBand } from "@/lib/photometry/bands";
import { KOLMOGOROV_MOFFAT_BETA, type PsfShape } from "@/lib/photometry/psf";
import type { BandSky } from "@/lib/photometry/visit-budget";
import { quantityField, type QuantitySpec } from "@/lib/workspace/quantity-field";

export const photometryQuantities = {
  apertureM: {
    label: "Telescope aperture",
    kind: "length",
    unit: "m",
    unitWords: "m",
    example: "1.0 m",
    range: { min: 0.01, max: 100 },
    rangeMessage: "The telescope aperture is from 0.01 m (1 cm) to 100 m.",
  },
  centralObstructionM: {
    label: "Central obstruction",
    kind: "length",
    unit: "m",
    unitWords: "m",
    example: "0.3 m",
    range: { min: 0, max: 99 },
    rangeMessage: "The central obstruction is from 0 m (none) to 99 m, smaller than the aperture.",
  },
  throughput: {
    label: "Total throughput",
    kind: "number",
    example: "0.5",
    range: { min: 0.001, max: 1 },
    rangeMessage: "The total throughput (optics, filter and detector together) is a share from 0.001 to 1.",
  },
  readNoiseElectrons: {
    label: "Read noise",
    kind: "number",
    example: "5 (electrons rms per pixel)",
    range: { min: 0, max: 1000 },
    rangeMessage: "The read noise is from 0 to 1000 electrons rms per pixel.",
  },
  darkElectronsPerSPerPixel: {
    label: "Dark current",
    kind: "number",
    example: "0.002 (electrons per second per pixel)",
    range: { min: 0, max: 10000 },
    rangeMessage: "The dark current is from 0 to 10\u202f000 electrons per second per pixel.",
  },
  gainElectronsPerAdu: {
    label: "Gain",
    kind: "number",
    example: "1.5 (electrons per ADU)",
    range: { min: 0.01, max: 1000 },
    rangeMessage: "The gain is from 0.01 to 1000 electrons per ADU.",
  },
  fullWellElectrons: {
    label: "Full well",
    kind: "number",
    example: "100000 (electrons)",
    range: { min: 100, max: 1e8 },
    rangeMessage: "The full well is from 100 to 100\u202f000\u202f000 electrons.",
  },
  pixelScaleArcsec: {
    label: "Pixel scale",
    kind: "angle",
    unit: "arcsec",
    unitWords: "″ per pixel",
    example: "0.4 arcsec",
    range: { min: 0.001, max: 600 },
    rangeMessage: "The pixel scale is from 0.001″ to 600″ (10′) per pixel.",
  },
  seeingFwhmArcsec: {
    label: "Seeing at the zenith",
    kind: "angle",
    unit: "arcsec",
    unitWords: "″",
    example: "1.0 arcsec",
    range: { min: 0.01, max: 30 },
    rangeMessage: "The seeing (FWHM at the zenith) is from 0.01″ to 30″.",
  },
  apertureRadiusFwhm: {
    label: "Photometric aperture radius",
    kind: "number",
    example: "1.0 (times the FWHM)",
    range: { min: 0.2, max: 10 },
    rangeMessage: "The photometric aperture radius is from 0.2 to 10 times the FWHM.",
  },
  overheadS: {
    label: "Overhead per visit",
    kind: "time",
    unit: "s",
    unitWords: "s",
    example: "60 s",
    range: { min: 0, max: 43200 },
    rangeMessage: "The overhead per visit is from 0 s to 43\u202f200 s (12 h).",
  },
  signalToNoiseGoal: {
    label: "Signal-to-noise goal",
    kind: "number",
    example: "50",
    range: { min: 1, max: 100000 },
    rangeMessage: "The signal-to-noise goal is from 1 to 100\u202f000.",
  },
  darkSkyMagPerArcsec2: {
    label: "Dark sky",
    kind: "number",
    example: "21.9 (mag/arcsec²)",
    range: { min: 5, max: 30 },
    rangeMessage: "The dark-sky brightness is from 5 to 30 mag/arcsec².",
  },
  extinctionMagPerAirmass: {
    label: "Extinction",
    kind: "number",
    example: "0.15 (mag per air mass)",
    range: { min: 0, max: 5 },
    rangeMessage: "The extinction is from 0 to 5 magnitudes per air mass.",
  },
} as const satisfies Record<string, QuantitySpec>;

export const psfShapeKinds = ["moffat", "gaussian"] as const;
export type PsfShapeKind = (typeof psfShapeKinds)[number];

/** The band id a proposal observes in: a built-in band, or the team's own (`customBand`). */
export const CUSTOM_BAND_ID = "custom";
/** Every band id a setting or a target may name: the built-in bands and `custom`. */
export const photometryBandIds: [string, ...string[]] = [CUSTOM_BAND_ID, ...standardBandIds];
const bandIds = photometryBandIds;

/** The site's sky and extinction in one band, as the team gives them (mag/arcsec², mag per air mass). */
const bandSkySchema = z.object(
  {
    darkSkyMagPerArcsec2: quantityField(photometryQuantities.darkSkyMagPerArcsec2),
    extinctionMagPerAirmass: quantityField(photometryQuantities.extinctionMagPerAirmass),
  },
  { error: "Each band's site values are a dark-sky brightness (mag/arcsec²) and an extinction (mag per air mass)." },
);

const customBandSchema = z.object(
  {
    label: z.string({ error: "Band name: give the band a name." }),
    effectiveWavelengthNm: z.number({ error: "Effective wavelength: a number of nm." }),
    widthNm: z.number({ error: "Band width: a number of nm." }),
    zeroPointWPerM2PerNm: z.number({ error: "Zero point: a number of W m⁻² nm⁻¹." }),
    zeroPointSystem: z.enum(["vega", "ab"], { error: "Magnitude system of the zero point: choose Vega or AB." }),
    abMinusVegaMag: z.number({ error: "AB − Vega offset: a number of magnitudes, or empty." }).nullable(),
  },
  { error: "The custom band is a name, an effective wavelength, a width, a zero point and its system." },
);

/** Every photometry setting, each with its default; the aperture stays null until the team gives it. */
export const photometrySettingsSchema = z.object(
  {
    apertureM: quantityField(photometryQuantities.apertureM).nullable().default(null),
    centralObstructionM: quantityField(photometryQuantities.centralObstructionM).default(0),
    throughput: quantityField(photometryQuantities.throughput).default(0.5),
    readNoiseElectrons: quantityField(photometryQuantities.readNoiseElectrons).default(5),
    darkElectronsPerSPerPixel: quantityField(photometryQuantities.darkElectronsPerSPerPixel).default(0.002),
    gainElectronsPerAdu: quantityField(photometryQuantities.gainElectronsPerAdu).default(1.5),
    fullWellElectrons: quantityField(photometryQuantities.fullWellElectrons).default(100_000),
    pixelScaleArcsec: quantityField(photometryQuantities.pixelScaleArcsec).default(0.4),
    seeingFwhmArcsec: quantityField(photometryQuantities.seeingFwhmArcsec).default(1.0),
    apertureRadiusFwhm: quantityField(photometryQuantities.apertureRadiusFwhm).default(1.0),
    psfShape: z.enum(psfShapeKinds, { error: "The PSF shape is Moffat or Gaussian." }).default("moffat"),
    overheadS: quantityField(photometryQuantities.overheadS).default(60),
    signalToNoiseGoal: quantityField(photometryQuantities.signalToNoiseGoal).default(50),
    bandId: z.enum(bandIds, { error: "The band is one of the built-in bands or your own." }).default("jc-i"),
    customBand: customBandSchema.nullable().default(null),
    /** The team's own sky and extinction, by band id; a band without an entry takes the typical dark site. */
    skyByBand: z.partialRecord(z.enum(bandIds, { error: "Site values are given for a built-in band or your own." }), bandSkySchema).default({}),
  },
  { error: "The photometry settings are a telescope, a detector, a band and the site's sky." },
);

export type PhotometrySettings = z.infer<typeof photometrySettingsSchema>;
export type PhotometrySettingsInput = z.input<typeof photometrySettingsSchema>;

/** The defaults of every setting: what a new proposal starts with. */
export const defaultPhotometrySettings: PhotometrySettings = photometrySettingsSchema.parse({});

/**
 * Settings as stored: a document written by an older version, or edited by hand, is read through the
 * schema; anything it refuses falls back to the defaults (the settings page then shows them).
 */
export function storedPhotometrySettings(stored: unknown): PhotometrySettings {
  const parsed = photometrySettingsSchema.safeParse(stored ?? {});
  return parsed.success ? parsed.data : defaultPhotometrySettings;
}

/** The checks across fields: the obstruction smaller than the aperture, the custom band complete and valid. */
export function photometrySettingsErrors(p: PhotometrySettings): FieldErrors {
  const fields: FieldErrors = {};
  if (p.apertureM !== null && p.centralObstructionM >= p.apertureM) {
    fields["photometry.centralObstructionM"] = [`The central obstruction must be smaller than the telescope aperture (${p.apertureM} m).`];
  }
  if (p.customBand !== null) {
    const checked = validateCustomBand(p.customBand);
    if ("fieldErrors" in checked) {
      for (const [field, messages] of Object.entries(checked.fieldErrors)) fields[`photometry.customBand.${field}`] = messages;
    }
  }
  if (p.bandId === CUSTOM_BAND_ID && p.customBand === null) fields["photometry.bandId"] = ["Describe your own band before choosing it, or choose a built-in band."];
  return fields;
}

/** The band with this id under these settings (the custom band when `custom`); undefined when unknown. */
export function photometryBandOf(p: Pick<PhotometrySettings, "customBand">, bandId: string): PhotometricBand | undefined {
  if (bandId !== CUSTOM_BAND_ID) return standardBand(bandId);
  if (p.customBand === null) return undefined;
  const checked = validateCustomBand(p.customBand);
  return "band" in checked ? checked.band : undefined;
}

/** The site's dark sky and extinction in a band: the team's values, else the typical dark site; null for a custom band without values. */
export function siteSkyOf(p: Pick<PhotometrySettings, "skyByBand">, bandId: string): { darkSkyMagPerArcsec2: number; extinctionMagPerAirmass: number; isTypical: boolean } | null {
  const own = p.skyByBand[bandId];
  if (own !== undefined) return { ...own, isTypical: false };
  const typical = typicalDarkSiteConditions[bandId];
  return typical === undefined ? null : { darkSkyMagPerArcsec2: typical.darkSkyMagPerArcsec2, extinctionMagPerAirmass: typical.extinctionMagPerAirmass, isTypical: true };
}

/** The band whose extinction the moonlit-sky model (V only) reads. */
const V_BAND_ID = "jc-v";

/**
 * The band `bandId` (a target's source band, else the proposal's) with the site's sky in it, as the
 * photometry layer reads them, or the missing setting in words: a custom band not described yet, or
 * a custom band without the site's dark sky and extinction in it.
 */
export function bandSkyOf(p: Pick<PhotometrySettings, "customBand" | "skyByBand">, bandId: string): { sky: BandSky } | { missing: string } {
  const band = photometryBandOf(p, bandId);
  if (band === undefined) return { missing: "Set the proposal's own band in the photometry settings (the source's magnitude is given in it), or choose a built-in band for the source." };
  const sky = siteSkyOf(p, bandId);
  if (sky === null) return { missing: `Set the site's dark sky and extinction in ${band.label} in the photometry settings.` };
  return {
    sky: {
      band,
      darkSkyZenithMagPerArcsec2: sky.darkSkyMagPerArcsec2,
      extinctionMagPerAirmass: sky.extinctionMagPerAirmass,
      extinctionV: siteSkyOf(p, V_BAND_ID)!.extinctionMagPerAirmass,
    },
  };
}

/** The PSF model of the settings (Moffat with the Kolmogorov β, or Gaussian). */
export function psfShapeOf(kind: PsfShapeKind): PsfShape {
  return kind === "gaussian" ? { kind: "gaussian" } : { kind: "moffat", beta: KOLMOGOROV_MOFFAT_BETA };
}
