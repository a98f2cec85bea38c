/**
 * A stated approximation for the finite size of a microlensed source, until sketches carry a source
 * model: the source is a uniform disk of radius ρ (units of θ_E), and the point-source magnification
 * is capped at the disk's magnification when centred on the lens.
 *
 * The cap is exact at u = 0: the disk |β| < ρ maps to the annuli θ₋(ρ) < |θ| < 1 < |θ| < θ₊(ρ), of
 * total area π(θ₊² − θ₋²) = π ρ √(ρ² + 4), and surface brightness is conserved, so
 * A_max = √(ρ² + 4)/ρ = √(1 + 4/ρ²) (Witt & Mao 1994, ApJ 430, 505).
 */

import { PARSEC_M } from "./constants";
import { requireNonNegative, requirePositive } from "./domain";
import { pointLensMagnification } from "./point-lens";

/**
 * Largest relative error of `cappedMagnification` against the uniform disk's magnification, for any u
 * and any ρ: 0.252 (worst near u ≈ 0.9 ρ, where the disk straddles the lens; tests/fixtures/
 * generate_finite_source.py, mpmath quadrature, ρ from 1e-3 to 10). Exact at u = 0, and tending to
 * the point-source value for u ≫ ρ.
 */
export const CAPPED_MAGNIFICATION_MAX_ERROR = 0.26;

/**
 * Magnification of a uniform disk of radius `sourceRadiusThetaE` (ρ, units of θ_E) centred on a point
 * lens: √(1 + 4/ρ²), dimensionless (Witt & Mao 1994). Domain: ρ > 0. Accuracy: a few ulp.
 */
export function uniformDiskPeakMagnification(sourceRadiusThetaE: number): number {
  requirePositive("sourceRadiusThetaE", sourceRadiusThetaE);
  return Math.sqrt(1 + 4 / (sourceRadiusThetaE * sourceRadiusThetaE));
}

/**
 * The point-lens magnification at offset `u` (θ_E) capped at `uniformDiskPeakMagnification(ρ)`: an
 * approximation to a uniform disk's magnification within CAPPED_MAGNIFICATION_MAX_ERROR. Domain:
 * u ≥ 0, ρ > 0. `isCapped` says when the source's size, not the offset, sets the value.
 */
export function cappedMagnification(u: number, sourceRadiusThetaE: number): { magnification: number; isCapped: boolean } {
  requireNonNegative("u", u);
  const peak = uniformDiskPeakMagnification(sourceRadiusThetaE);
  const pointSource = pointLensMagnification(u);
  return pointSource > peak ? { magnification: peak, isCapped: true } : { magnification: pointSource, isCapped: false };
}

/**
 * The source's angular radius in units of θ_E, ρ = (R_* / D_S) / θ_E (small angles; for a redshift
 * sketch D_S is the angular-diameter distance). Units: metres, parsecs, radians; all > 0.
 */
export function sourceRadiusInThetaE(sourceRadiusM: number, dSourcePc: number, thetaERad: number): number {
  return sourceRadiusM / (dSourcePc * PARSEC_M) / thetaERad;
}
