/**
 * Standard photometric bands: effective wavelength, width, the flux of a zero-magnitude star and the
 * AB − Vega offset, each row with its source; the sky brightness and extinction of a typical dark site
 * per band as editable defaults; and the check of a band the user adds.
 *
 * Units: wavelengths and widths in nm; zero points as a spectral flux density f_λ in W m⁻² nm⁻¹ (the
 * energy of a 0-mag star per second, square metre and nanometre, in the magnitude system named by
 * `zeroPointSystem`), turned into photons by `zeroPointPhotonsPerSPerM2PerNm` at the effective
 * wavelength. Rows are written in the units of their paper and converted by the helpers below, so
 * each number can be read against its table.
 *
 * The photon rate of a star is taken as f_λ(λ_eff) × width (method: common practice for exposure time
 * estimates); it ignores the shape of the passband and the colour of the star, which moves the rate by
 * a few per cent for a star of colours unlike the zero-point star's.
 */
import { citationText } from "@/lib/citations/cite";
import type { FieldErrors } from "@/lib/errors";
import { PLANCK_CONSTANT_J_S, SPEED_OF_LIGHT_M_PER_S } from "@/lib/physics/constants";

/** A magnitude system: Vega (a 0-mag star is Vega-like) or AB (Oke & Gunn 1983, ApJ 266, 713). */
export type MagnitudeSystem = "vega" | "ab";

export const magnitudeSystemLabels: Record<MagnitudeSystem, string> = { vega: "Vega", ab: "AB" };

export interface PhotometricBand {
  /** Our id, stable in storage and links. */
  id: string;
  /** What a user reads: the trade's letter and the system it belongs to. */
  label: string;
  /** Effective wavelength, nm. */
  effectiveWavelengthNm: number;
  /** Width of the passband, nm (the width multiplied by f_λ gives the band's flux). */
  widthNm: number;
  /** f_λ of a zero-magnitude star at the effective wavelength, W m⁻² nm⁻¹. */
  zeroPointWPerM2PerNm: number;
  /** The system in which that star has magnitude 0 (the band's own system). */
  zeroPointSystem: MagnitudeSystem;
  /** m_AB − m_Vega in this band, mag; null when not known (a custom band without one). */
  abMinusVegaMag: number | null;
  /** Source of the wavelength, width and zero point. */
  source: string;
  /** Source of the AB − Vega offset. */
  offsetSource: string;
}

/** 1 erg s⁻¹ cm⁻² Å⁻¹ in W m⁻² nm⁻¹ (1e-7 J / 1e-4 m² / 0.1 nm). */
const ERG_PER_S_PER_CM2_PER_ANGSTROM_IN_W_PER_M2_PER_NM = 1e-2;
/** 1 W cm⁻² µm⁻¹ in W m⁻² nm⁻¹ (1e4 cm² per m², 1e3 nm per µm). */
const W_PER_CM2_PER_UM_IN_W_PER_M2_PER_NM = 10;
/** 1 Jy in W m⁻² Hz⁻¹. */
const JANSKY_W_PER_M2_PER_HZ = 1e-26;

/**
 * f_ν of a 0-mag AB source, Jy: 10^(−0.4 × 48.60) erg s⁻¹ cm⁻² Hz⁻¹ = 3631 Jy (Oke & Gunn 1983,
 * ApJ 266, 713; the definition of the AB system).
 */
export const AB_ZERO_POINT_JY = 10 ** (-0.4 * 48.6) / 1e-23;

function fromErgPerSPerCm2PerAngstrom(value: number): number {
  return value * ERG_PER_S_PER_CM2_PER_ANGSTROM_IN_W_PER_M2_PER_NM;
}

function fromWPerCm2PerUm(value: number): number {
  return value * W_PER_CM2_PER_UM_IN_W_PER_M2_PER_NM;
}

/** f_λ (W m⁻² nm⁻¹) at `wavelengthNm` of a flat f_ν source of `fluxDensityJy`: f_λ = f_ν c / λ². */
export function fLambdaFromJanskyWPerM2PerNm(fluxDensityJy: number, wavelengthNm: number): number {
  const wavelengthM = wavelengthNm * 1e-9;
  return (fluxDensityJy * JANSKY_W_PER_M2_PER_HZ * SPEED_OF_LIGHT_M_PER_S) / (wavelengthM * wavelengthM) * 1e-9;
}

// The sources in words, from the references' one home (lib/citations).
const BESSELL_2005 = `${citationText("bessell2005")}, Table 1 (zero points of ${citationText("bessell1998")}, Table A2); widths from memory`;
const FUKUGITA_1996 = `${citationText("fukugita1996")}, Table 2 (effective wavelength and FWHM, from memory); zero point 3631 Jy by the AB definition (${citationText("oke1983")})`;
const COHEN_2003 = `${citationText("cohen2003")}, Table 2 (isophotal wavelength, bandwidth, F_λ)`;
const BLANTON_ROWEIS_2007 = `${citationText("blanton2007")}, Table 1`;

/** A built-in row before the offset's source is added; every built-in band has a known offset. */
type BandRow = Omit<PhotometricBand, "offsetSource" | "abMinusVegaMag"> & { abMinusVegaMag: number };

function johnsonCousins(letter: string, wavelengthUm: number, widthUm: number, fLambdaErg: number, abMinusVegaMag: number): BandRow {
  return {
    id: `jc-${letter.toLowerCase()}`,
    label: `${letter} (Johnson–Cousins)`,
    effectiveWavelengthNm: wavelengthUm * 1000,
    widthNm: widthUm * 1000,
    zeroPointWPerM2PerNm: fromErgPerSPerCm2PerAngstrom(fLambdaErg),
    zeroPointSystem: "vega",
    abMinusVegaMag,
    source: BESSELL_2005,
  };
}

function sdss(letter: string, wavelengthAngstrom: number, fwhmAngstrom: number, abMinusVegaMag: number): BandRow {
  const effectiveWavelengthNm = wavelengthAngstrom / 10;
  return {
    id: `sdss-${letter}`,
    label: `${letter} (SDSS)`,
    effectiveWavelengthNm,
    widthNm: fwhmAngstrom / 10,
    zeroPointWPerM2PerNm: fLambdaFromJanskyWPerM2PerNm(AB_ZERO_POINT_JY, effectiveWavelengthNm),
    zeroPointSystem: "ab",
    abMinusVegaMag,
    source: FUKUGITA_1996,
  };
}

function twoMass(letter: string, wavelengthUm: number, bandwidthUm: number, fLambdaWPerCm2PerUm: number, abMinusVegaMag: number): BandRow {
  return {
    id: `2mass-${letter.toLowerCase()}`,
    label: `${letter} (2MASS)`,
    effectiveWavelengthNm: wavelengthUm * 1000,
    widthNm: bandwidthUm * 1000,
    zeroPointWPerM2PerNm: fromWPerCm2PerUm(fLambdaWPerCm2PerUm),
    zeroPointSystem: "vega",
    abMinusVegaMag,
    source: COHEN_2003,
  };
}

const rows: readonly BandRow[] = [
  // λ_eff (µm), Δλ (µm), f_λ (erg s⁻¹ cm⁻² Å⁻¹), AB − Vega (mag)
  johnsonCousins("U", 0.366, 0.065, 417.5e-11, 0.79),
  johnsonCousins("B", 0.438, 0.089, 632.0e-11, -0.09),
  johnsonCousins("V", 0.545, 0.084, 363.1e-11, 0.02),
  johnsonCousins("R", 0.641, 0.158, 217.7e-11, 0.21),
  johnsonCousins("I", 0.798, 0.154, 112.6e-11, 0.45),
  // λ_eff (Å), FWHM (Å), AB − Vega (mag)
  sdss("u", 3557, 599, 0.91),
  sdss("g", 4825, 1379, -0.08),
  sdss("r", 6261, 1382, 0.16),
  sdss("i", 7672, 1535, 0.37),
  sdss("z", 9097, 1370, 0.54),
  // λ_iso (µm), bandwidth (µm), F_λ (W cm⁻² µm⁻¹), AB − Vega (mag)
  twoMass("J", 1.235, 0.162, 3.129e-13, 0.91),
  twoMass("H", 1.662, 0.251, 1.133e-13, 1.39),
  twoMass("Ks", 2.159, 0.262, 4.283e-14, 1.85),
];

/** The built-in bands, blue to red within each system. */
export const standardBands: readonly PhotometricBand[] = rows.map((row) => ({ ...row, offsetSource: BLANTON_ROWEIS_2007 }));

export const standardBandIds: readonly string[] = standardBands.map((band) => band.id);

const bandById = new Map(standardBands.map((band) => [band.id, band]));

/** The built-in band with this id, or undefined. */
export function standardBand(id: string): PhotometricBand | undefined {
  return bandById.get(id);
}

/**
 * Photons s⁻¹ m⁻² nm⁻¹ of a 0-mag star (in the band's own system): f_λ λ_eff / (h c), every photon
 * counted at the effective wavelength (the approximation named in the module comment).
 */
export function zeroPointPhotonsPerSPerM2PerNm(band: Pick<PhotometricBand, "zeroPointWPerM2PerNm" | "effectiveWavelengthNm">): number {
  const photonEnergyJ = (PLANCK_CONSTANT_J_S * SPEED_OF_LIGHT_M_PER_S) / (band.effectiveWavelengthNm * 1e-9);
  return band.zeroPointWPerM2PerNm / photonEnergyJ;
}

/** Dark-sky brightness and extinction of a site in one band: editable defaults. */
export interface SiteBandConditions {
  /** Zenith sky brightness on a moonless night, mag/arcsec², in the band's own system. */
  darkSkyMagPerArcsec2: number;
  /** Extinction coefficient, mag per unit air mass. */
  extinctionMagPerAirmass: number;
  /** Where the two numbers come from. */
  source: string;
}

const BENN_ELLISON_1998 =
  "typical dark site: sky from Benn & Ellison 1998, New Astron. Rev. 42, 503 (La Palma, solar minimum), from memory; extinction common practice, from memory";
const DARK_SITE_FROM_MEMORY = "typical dark site: common practice, from memory";

/**
 * Typical dark-site conditions per built-in band, keyed by band id: a starting point for a proposal's
 * site, to be replaced by the observatory's own figures.
 */
export const typicalDarkSiteConditions: Readonly<Record<string, SiteBandConditions>> = {
  "jc-u": { darkSkyMagPerArcsec2: 22.0, extinctionMagPerAirmass: 0.55, source: BENN_ELLISON_1998 },
  "jc-b": { darkSkyMagPerArcsec2: 22.7, extinctionMagPerAirmass: 0.25, source: BENN_ELLISON_1998 },
  "jc-v": { darkSkyMagPerArcsec2: 21.9, extinctionMagPerAirmass: 0.15, source: BENN_ELLISON_1998 },
  "jc-r": { darkSkyMagPerArcsec2: 21.0, extinctionMagPerAirmass: 0.1, source: BENN_ELLISON_1998 },
  "jc-i": { darkSkyMagPerArcsec2: 20.0, extinctionMagPerAirmass: 0.07, source: BENN_ELLISON_1998 },
  "sdss-u": { darkSkyMagPerArcsec2: 22.5, extinctionMagPerAirmass: 0.5, source: DARK_SITE_FROM_MEMORY },
  "sdss-g": { darkSkyMagPerArcsec2: 22.2, extinctionMagPerAirmass: 0.18, source: DARK_SITE_FROM_MEMORY },
  "sdss-r": { darkSkyMagPerArcsec2: 21.2, extinctionMagPerAirmass: 0.1, source: DARK_SITE_FROM_MEMORY },
  "sdss-i": { darkSkyMagPerArcsec2: 20.3, extinctionMagPerAirmass: 0.06, source: DARK_SITE_FROM_MEMORY },
  "sdss-z": { darkSkyMagPerArcsec2: 19.3, extinctionMagPerAirmass: 0.06, source: DARK_SITE_FROM_MEMORY },
  "2mass-j": { darkSkyMagPerArcsec2: 16.0, extinctionMagPerAirmass: 0.1, source: DARK_SITE_FROM_MEMORY },
  "2mass-h": { darkSkyMagPerArcsec2: 14.0, extinctionMagPerAirmass: 0.06, source: DARK_SITE_FROM_MEMORY },
  "2mass-ks": { darkSkyMagPerArcsec2: 13.0, extinctionMagPerAirmass: 0.08, source: DARK_SITE_FROM_MEMORY },
};

/**
 * What a user types to add a band of their own (numbers already in the band's units); an AB − Vega
 * offset of null means magnitudes are taken in the band's own system only.
 */
export type CustomBandInput = Pick<
  PhotometricBand,
  "label" | "effectiveWavelengthNm" | "widthNm" | "zeroPointWPerM2PerNm" | "zeroPointSystem" | "abMinusVegaMag"
>;

/** Accepted range of a custom band's effective wavelength, nm (our rule: far UV to mid infrared). */
export const CUSTOM_BAND_WAVELENGTH_RANGE_NM = { min: 100, max: 30_000 } as const;
/** Largest |AB − Vega| accepted, mag (our rule: the standard bands stay within 2 mag, mid-IR bands within 7). */
export const CUSTOM_BAND_MAX_OFFSET_MAG = 10;
const CUSTOM_BAND_LABEL_MAX_CHARS = 60;

function isFiniteNumber(value: unknown): value is number {
  return typeof value === "number" && Number.isFinite(value);
}

/**
 * Checks a custom band; returns the band (id `custom`, source "entered by the team") or the field
 * errors, each in words naming the field.
 */
export function validateCustomBand(input: CustomBandInput): { band: PhotometricBand } | { fieldErrors: FieldErrors } {
  const fieldErrors: FieldErrors = {};
  const fail = (field: keyof CustomBandInput, message: string) => {
    fieldErrors[field] = [...(fieldErrors[field] ?? []), message];
  };
  const label = typeof input.label === "string" ? input.label.trim() : "";
  if (label === "") fail("label", "Band name: give the band a name, e.g. “Hα narrow”.");
  else if (label.length > CUSTOM_BAND_LABEL_MAX_CHARS) fail("label", `Band name: at most ${CUSTOM_BAND_LABEL_MAX_CHARS} characters.`);

  const { min, max } = CUSTOM_BAND_WAVELENGTH_RANGE_NM;
  const wavelength = input.effectiveWavelengthNm;
  if (!isFiniteNumber(wavelength) || wavelength < min || wavelength > max) {
    fail("effectiveWavelengthNm", `Effective wavelength: must be between ${min} nm and ${max} nm.`);
  }
  const width = input.widthNm;
  if (!isFiniteNumber(width) || width <= 0) fail("widthNm", "Band width: must be a number above 0 nm.");
  else if (isFiniteNumber(wavelength) && width >= wavelength) {
    fail("widthNm", "Band width: must be narrower than the effective wavelength.");
  }
  if (!isFiniteNumber(input.zeroPointWPerM2PerNm) || input.zeroPointWPerM2PerNm <= 0) {
    fail("zeroPointWPerM2PerNm", "Zero point: must be the flux of a 0-mag star, a number above 0 W m⁻² nm⁻¹.");
  }
  if (input.zeroPointSystem !== "vega" && input.zeroPointSystem !== "ab") {
    fail("zeroPointSystem", "Magnitude system of the zero point: choose Vega or AB.");
  }
  const offset = input.abMinusVegaMag;
  if (offset !== null && (!isFiniteNumber(offset) || Math.abs(offset) > CUSTOM_BAND_MAX_OFFSET_MAG)) {
    fail("abMinusVegaMag", `AB − Vega offset: must be between −${CUSTOM_BAND_MAX_OFFSET_MAG} and ${CUSTOM_BAND_MAX_OFFSET_MAG} mag, or left empty.`);
  }
  if (Object.keys(fieldErrors).length > 0) return { fieldErrors };
  return {
    band: {
      id: "custom",
      label,
      effectiveWavelengthNm: wavelength,
      widthNm: width,
      zeroPointWPerM2PerNm: input.zeroPointWPerM2PerNm,
      zeroPointSystem: input.zeroPointSystem,
      abMinusVegaMag: offset,
      source: "entered by the team",
      offsetSource: offset === null ? "not given" : "entered by the team",
    },
  };
}
