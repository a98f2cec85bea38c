/**
 * Moonlight in bands other than V. The model of Krisciunas & Schaefer 1991 (PASP 103, 1033;
 * ./moon-sky) gives the scattered moonlight in V only. Here it is carried to any band by the colour
 * of sunlight:
 *   m_band,moon = V_moon − (M_☉,V − M_☉,band),
 * M_☉ the Sun's absolute magnitude in each band, in the band's own system (so the result is in the
 * band's own system, like the band's zero point and dark sky).
 *
 * Approximation (our rule): moonlight is taken to have the Sun's colour. Two effects are ignored:
 * the Moon reflects slightly more red than blue light (its albedo rises with wavelength), and the sky
 * scatters the blue more (Rayleigh ∝ λ⁻⁴), which makes the scattered light bluer than sunlight. They
 * pull opposite ways; neither is in K&S 1991, which is fitted to V data alone. Expect errors of a few
 * tenths of a magnitude in U and in the infrared, less near V.
 */
import { standardBands, type PhotometricBand } from "./bands";

/**
 * The Sun's absolute magnitude per built-in band (band id → mag, in the band's own system: Vega for
 * Johnson–Cousins and 2MASS, AB for SDSS), Willmer 2018, ApJS 236, 47, Table 3. Values from memory of
 * the table; to be checked against the printed page.
 */
export const SOLAR_ABSOLUTE_MAGNITUDES: Readonly<Record<string, number>> = {
  "jc-u": 5.61,
  "jc-b": 5.44,
  "jc-v": 4.81,
  "jc-r": 4.43,
  "jc-i": 4.1,
  "sdss-u": 6.39,
  "sdss-g": 5.11,
  "sdss-r": 4.65,
  "sdss-i": 4.53,
  "sdss-z": 4.5,
  "2mass-j": 3.67,
  "2mass-h": 3.32,
  "2mass-ks": 3.27,
};

export const SOLAR_ABSOLUTE_MAGNITUDES_SOURCE = "Willmer 2018, ApJS 236, 47, Table 3 (from memory)";

const V_BAND_ID = "jc-v";

/** The built-in band nearest in log wavelength to `wavelengthNm` (nm, > 0). */
function nearestStandardBand(wavelengthNm: number): PhotometricBand {
  let nearest = standardBands[0];
  let best = Number.POSITIVE_INFINITY;
  for (const band of standardBands) {
    const distance = Math.abs(Math.log(wavelengthNm / band.effectiveWavelengthNm));
    if (distance < best) [nearest, best] = [band, distance];
  }
  return nearest;
}

/**
 * The Sun's absolute magnitude in `band`, in the band's own system (mag). A built-in band reads its
 * row of `SOLAR_ABSOLUTE_MAGNITUDES`. A band the team added takes, by our rule, the value of the
 * built-in band nearest in log wavelength, turned into the added band's system with that built-in
 * band's AB − Vega offset when the two systems differ. A narrow band far from every built-in one
 * (mid infrared, far ultraviolet) inherits the error of that distance.
 */
export function solarAbsoluteMagnitude(band: PhotometricBand): number {
  const own = SOLAR_ABSOLUTE_MAGNITUDES[band.id];
  if (own !== undefined) return own;
  const nearest = nearestStandardBand(band.effectiveWavelengthNm);
  const value = SOLAR_ABSOLUTE_MAGNITUDES[nearest.id];
  if (nearest.zeroPointSystem === band.zeroPointSystem) return value;
  // Every built-in band has an offset (bands.ts); m_AB = m_Vega + (AB − Vega).
  const offset = nearest.abMinusVegaMag ?? 0;
  return band.zeroPointSystem === "ab" ? value + offset : value - offset;
}

/** V − band colour of sunlight (mag): M_☉,V − M_☉,band, band in its own system (0 for V itself). */
export function sunColourVMinusBandMag(band: PhotometricBand): number {
  return SOLAR_ABSOLUTE_MAGNITUDES[V_BAND_ID] - solarAbsoluteMagnitude(band);
}

/**
 * Surface brightness of moonlight in `band` (mag/arcsec², the band's own system) from its V value
 * `vMoonMagPerArcsec2` (K&S 1991; +Infinity, no moonlight, stays +Infinity), by the colour of
 * sunlight (see the module comment): V_moon − (M_☉,V − M_☉,band).
 */
export function moonMagPerArcsec2InBand(vMoonMagPerArcsec2: number, band: PhotometricBand): number {
  return vMoonMagPerArcsec2 - sunColourVMinusBandMag(band);
}
