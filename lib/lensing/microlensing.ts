/**
 * Microlensing event quantities: the peak magnification and the microlens parallax. Offsets in units
 * of θ_E, distances in parsecs, angles in radians.
 */

import { AU_M, PARSEC_M } from "@/lib/physics/constants";
import { pointLensMagnification } from "@/lib/physics/point-lens";
import { finiteSourceMagnification } from "./finite-source";

function describe(value: number): string {
  return Number.isNaN(value) ? "NaN" : String(value);
}

/**
 * Peak magnification of an event of impact parameter `u0` (θ_E): for a point source (ρ = 0) the
 * Paczyński 1986 (ApJ 304, 1) value (u0² + 2)/(u0 √(u0² + 4)), else the finite-source magnification of
 * a disk of radius `rho` (θ_E) with linear limb darkening `limbDarkeningU` at u0 (finite-source.ts).
 * Domain: u0 ≥ 0, ρ ≥ 0, not both 0 (a point source behind the lens has no finite peak). Accuracy:
 * a few ulp for a point source; 1e-6 relative for a disk.
 */
export function peakMagnification(u0: number, rho = 0, limbDarkeningU = 0): number {
  if (!(Number.isFinite(u0) && u0 >= 0)) throw new RangeError(`The impact parameter (in Einstein radii) must be a finite number of at least 0, got ${describe(u0)}`);
  if (!(Number.isFinite(rho) && rho >= 0)) throw new RangeError(`The source's radius (in Einstein radii) must be a finite number of at least 0, got ${describe(rho)}`);
  if (rho > 0) return finiteSourceMagnification(u0, rho, limbDarkeningU);
  if (!(limbDarkeningU >= 0 && limbDarkeningU <= 1)) throw new RangeError(`The limb-darkening coefficient must lie between 0 and 1, got ${describe(limbDarkeningU)}`);
  if (u0 === 0) throw new RangeError("A point source exactly behind the lens has no finite peak magnification: give an impact parameter above 0 or the source's radius");
  return pointLensMagnification(u0);
}

/** Relative change of A below which limb darkening is not worth its cost (a 0.01-pixel move on a 100-pixel-tall curve, 0.1 mmag). */
const LIMB_DARKENING_SKIP_PRECISION = 1e-4;

/**
 * A(u) of an event's source at lens–source offset `u` (θ_E, ≥ 0): the finite-source magnification of
 * a disk of radius ρ (uniform or linearly limb-darkened, finite-source.ts) when ρ > 0, else the
 * point-lens magnification (Paczyński 1986, ApJ 304, 1); Infinity for a point source at u = 0. Where
 * the uniform disk's value is within LIMB_DARKENING_SKIP_PRECISION of the point source's, it is taken
 * for a limb-darkened disk too: limb darkening weights the disk's centre and moves A less than the
 * uniform disk does, and the limb-darkened quadrature costs about 40 times as much.
 */
export function eventMagnificationAtOffset(u: number, source: { sourceRadiusThetaE: number | null; limbDarkeningU: number }): number {
  const rho = source.sourceRadiusThetaE;
  if (rho === null || rho <= 0) return pointLensMagnification(u);
  const uniform = finiteSourceMagnification(u, rho);
  if (source.limbDarkeningU === 0 || (u > 0 && Math.abs(uniform / pointLensMagnification(u) - 1) < LIMB_DARKENING_SKIP_PRECISION)) return uniform;
  return finiteSourceMagnification(u, rho, source.limbDarkeningU);
}

/**
 * Microlens parallax π_E = π_rel / θ_E, dimensionless, with the relative parallax
 * π_rel = au (1/D_L − 1/D_S) in radians (A. Gould 2000, ApJ 542, 785, eq. 2–4). Units: distances in
 * parsecs, θ_E in radians. Domain: 0 < D_L < D_S finite, θ_E > 0 finite. Accuracy: a few ulp.
 */
export function microlensParallax(dLensPc: number, dSourcePc: number, thetaERad: number): number {
  if (!(Number.isFinite(dLensPc) && dLensPc > 0)) throw new RangeError(`The lens's distance must be a finite number of parsecs above 0, got ${describe(dLensPc)}`);
  if (!(Number.isFinite(dSourcePc) && dSourcePc > dLensPc)) throw new RangeError(`The source's distance must be a finite number of parsecs beyond the lens's, got ${describe(dSourcePc)}`);
  if (!(Number.isFinite(thetaERad) && thetaERad > 0)) throw new RangeError(`The Einstein radius must be a finite angle above 0, got ${describe(thetaERad)}`);
  const relativeParallaxRad = (AU_M / PARSEC_M) * ((dSourcePc - dLensPc) / (dLensPc * dSourcePc));
  return relativeParallaxRad / thetaERad;
}

/**
 * The source's angular radius in units of θ_E, ρ = (R_* / D_S) / θ_E (small angles; for a redshift
 * sketch D_S is the angular-diameter distance). Units: metres, parsecs, radians; all > 0.
 */
export function sourceRadiusInThetaE(sourceRadiusM: number, dSourcePc: number, thetaERad: number): number {
  return sourceRadiusM / (dSourcePc * PARSEC_M) / thetaERad;
}
