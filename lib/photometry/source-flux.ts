/**
 * Photon rates at the detector from magnitudes, and the flux of a lensed source blended with other
 * light. Rates are electrons per second for a detector that turns every photon reaching it into one
 * electron: the total throughput (atmosphere excluded, optics, filter and quantum efficiency included)
 * says which share of the photons at the telescope that is.
 *
 *   rate (e⁻/s) = 10^(−0.4 m) × N₀ × W × A × T
 *
 * with m the magnitude in the band's own system, N₀ the band's photon zero point (photons s⁻¹ m⁻²
 * nm⁻¹, ./bands), W its width (nm), A the collecting area (m²) and T the throughput (method: the
 * definition of a magnitude; common practice in exposure time estimates, e.g. Howell, Handbook of
 * CCD Astronomy, 2nd ed. 2006, ch. 4).
 */
import { requireFinite, requireNonNegative, requirePositive, domainError } from "@/lib/physics/domain";
import { magnitudeSystemLabels, zeroPointPhotonsPerSPerM2PerNm, type MagnitudeSystem, type PhotometricBand } from "./bands";

/** The light-gathering part of an instrument. */
export interface TelescopeOptics {
  /** Diameter of the primary mirror, m (> 0). */
  apertureM: number;
  /** Diameter of the central obstruction (secondary mirror and baffle), m, in [0, aperture). */
  centralObstructionM: number;
  /** Total system throughput, (0, 1]: optics, filter and detector quantum efficiency together. */
  throughput: number;
}

/**
 * Collecting area, m²: π/4 (D² − d²) for aperture D and central obstruction d (m). Refuses a zero or
 * negative aperture and an obstruction as large as the aperture, naming the field.
 */
export function collectingAreaM2({ apertureM, centralObstructionM }: Pick<TelescopeOptics, "apertureM" | "centralObstructionM">): number {
  requirePositive("Telescope aperture (m)", apertureM);
  requireNonNegative("Central obstruction (m)", centralObstructionM);
  if (centralObstructionM >= apertureM) {
    throw domainError("Central obstruction (m)", centralObstructionM, `smaller than the telescope aperture (${apertureM} m)`);
  }
  return (Math.PI / 4) * (apertureM * apertureM - centralObstructionM * centralObstructionM);
}

function requireThroughput(throughput: number): void {
  if (!(Number.isFinite(throughput) && throughput > 0 && throughput <= 1)) {
    throw domainError("Total throughput", throughput, "a share between 0 (excluded) and 1");
  }
}

/**
 * A magnitude in `system` expressed in the band's own system (the one its zero point is for), using
 * the band's AB − Vega offset: m_AB = m_Vega + (AB − Vega). Throws, in words, for a band with no
 * known offset asked for the other system.
 */
export function magnitudeInBandSystem(band: PhotometricBand, magnitude: number, system: MagnitudeSystem): number {
  requireFinite("Magnitude", magnitude);
  if (system === band.zeroPointSystem) return magnitude;
  if (band.abMinusVegaMag === null) {
    throw new RangeError(
      `Magnitude system: the band ${band.label} has no AB − Vega offset, so give the magnitude in ${magnitudeSystemLabels[band.zeroPointSystem]}.`,
    );
  }
  return system === "vega" ? magnitude + band.abMinusVegaMag : magnitude - band.abMinusVegaMag;
}

/** Photons s⁻¹ m⁻² through the band above the atmosphere from a source of `magnitude` in `system`. */
function bandPhotonFluxPerSPerM2(band: PhotometricBand, magnitude: number, system: MagnitudeSystem): number {
  const bandMagnitude = magnitudeInBandSystem(band, magnitude, system);
  return 10 ** (-0.4 * bandMagnitude) * zeroPointPhotonsPerSPerM2PerNm(band) * band.widthNm;
}

/**
 * Electrons per second from a point source of `magnitude` (in `magnitudeSystem`, default the band's
 * own) in `band`, through `optics`. The magnitude is the one arriving at the telescope: add the
 * extinction with `magnitudeThroughAtmosphere` first.
 */
export function sourceElectronsPerS({
  band,
  magnitude,
  magnitudeSystem,
  optics,
}: {
  band: PhotometricBand;
  magnitude: number;
  magnitudeSystem?: MagnitudeSystem;
  optics: TelescopeOptics;
}): number {
  requireThroughput(optics.throughput);
  const areaM2 = collectingAreaM2(optics);
  return bandPhotonFluxPerSPerM2(band, magnitude, magnitudeSystem ?? band.zeroPointSystem) * areaM2 * optics.throughput;
}

/**
 * Electrons per second per pixel from a sky of surface brightness `skyMagPerArcsec2` (mag/arcsec², in
 * `magnitudeSystem`, default the band's own), on square pixels of `pixelScaleArcsec` (arcsec per
 * pixel): the rate of a source of that magnitude times the pixel's solid angle in arcsec².
 */
export function skyElectronsPerSPerPixel({
  band,
  skyMagPerArcsec2,
  magnitudeSystem,
  pixelScaleArcsec,
  optics,
}: {
  band: PhotometricBand;
  skyMagPerArcsec2: number;
  magnitudeSystem?: MagnitudeSystem;
  pixelScaleArcsec: number;
  optics: TelescopeOptics;
}): number {
  requireFinite("Sky brightness (mag/arcsec²)", skyMagPerArcsec2);
  requirePositive("Pixel scale (arcsec per pixel)", pixelScaleArcsec);
  const perArcsec2 = sourceElectronsPerS({ band, magnitude: skyMagPerArcsec2, magnitudeSystem, optics });
  return perArcsec2 * pixelScaleArcsec * pixelScaleArcsec;
}

/**
 * Magnitude below the atmosphere: m + k X for extinction coefficient k (mag per air mass, ≥ 0) and air
 * mass X (≥ 1). Method: Bouguer's law, the first-order extinction correction (common practice).
 */
export function magnitudeThroughAtmosphere(magnitude: number, extinctionMagPerAirmass: number, airmass: number): number {
  requireFinite("Magnitude", magnitude);
  requireNonNegative("Extinction (mag per air mass)", extinctionMagPerAirmass);
  if (!(Number.isFinite(airmass) && airmass >= 1)) throw domainError("Air mass", airmass, "a number of at least 1");
  return magnitude + extinctionMagPerAirmass * airmass;
}

function requireBlendFraction(blendFraction: number): void {
  if (!(Number.isFinite(blendFraction) && blendFraction > 0 && blendFraction <= 1)) {
    throw domainError("Blend fraction f_s (share of the baseline flux from the lensed source)", blendFraction, "a share above 0 and at most 1");
  }
}

function requireMagnification(magnification: number): void {
  if (!(Number.isFinite(magnification) && magnification > 0)) {
    throw domainError("Magnification", magnification, "a finite number above 0");
  }
}

/**
 * Flux of a blended lensed source in units of the baseline (unmagnified) flux: A f_s + (1 − f_s), for
 * magnification A (> 0) and blend fraction f_s in (0, 1], the share of the baseline flux that comes
 * from the lensed source (the standard blending model of microlensing photometry, e.g. Wozniak &
 * Paczyński 1997, ApJ 487, 55, from memory).
 */
export function blendedFluxInBaselineUnits(magnification: number, blendFraction: number): number {
  requireMagnification(magnification);
  requireBlendFraction(blendFraction);
  return magnification * blendFraction + (1 - blendFraction);
}

/** Magnitude of the blend (source plus blended light) when the source has `sourceMagnitude` alone: m_s + 2.5 log₁₀ f_s. */
export function baselineMagnitude(sourceMagnitude: number, blendFraction: number): number {
  requireFinite("Source magnitude", sourceMagnitude);
  requireBlendFraction(blendFraction);
  return sourceMagnitude + 2.5 * Math.log10(blendFraction);
}

/**
 * Magnitude of the blend at magnification A: m_base − 2.5 log₁₀(A f_s + 1 − f_s), where m_base is the
 * baseline magnitude of source and blend together (`baselineMagnitude` from the source's own).
 */
export function magnifiedBlendMagnitude(baselineMag: number, magnification: number, blendFraction: number): number {
  requireFinite("Baseline magnitude", baselineMag);
  return baselineMag - 2.5 * Math.log10(blendedFluxInBaselineUnits(magnification, blendFraction));
}
