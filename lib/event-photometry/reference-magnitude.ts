/**
 * The magnitude scale of the fit's fluxes, in a module of its own so the browser's fit panel and
 * figure read it without the photometry file reader.
 */

/**
 * The reference magnitude of the fit's fluxes (our choice): flux = 10^(−0.4 (m − 22)), so a flux of 1
 * is a 22 mag source. Any fixed value would do: the fit's source and blend fluxes scale with it.
 */
export const REFERENCE_MAGNITUDE = 22;

/** The magnitude of a flux on REFERENCE_MAGNITUDE's scale, m = 22 − 2.5 log10(F); NaN for F ≤ 0 (no magnitude). */
export function magnitudeOfFlux(flux: number): number {
  return flux > 0 ? REFERENCE_MAGNITUDE - 2.5 * Math.log10(flux) : Number.NaN;
}
