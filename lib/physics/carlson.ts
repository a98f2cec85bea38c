/**
 * Carlson's symmetric elliptic integral of the first kind.
 *
 * Source: B. C. Carlson 1995, "Numerical computation of real or complex elliptic integrals",
 * Numer. Algorithms 10, 13, algorithm for R_F, with the degree-7 series of DLMF 19.36.1.
 */

import { domainError } from "./domain";

/** Duplication steps needed are at most ~30 even for argument ratios of 1e-300; this is the cap. */
const MAX_DUPLICATIONS = 64;

/**
 * Stop duplicating once every argument is within this relative distance of the mean: the neglected
 * degree-8 terms are then below 2e-17 (DLMF 19.36.1 error bound).
 */
const SERIES_RADIUS = 0.0075;

/**
 * R_F(x, y, z) = (1/2) Integral_0^inf dt / sqrt((t+x)(t+y)(t+z)).
 *
 * Domain: x, y, z finite and >= 0, at most one of them 0 (else the integral diverges; returns
 * Infinity when two are 0). Units: R_F is homogeneous of degree -1/2.
 * Method: Carlson duplication, then the DLMF 19.36.1 series to degree 7.
 * Accuracy: a few units in the last place (tested against mpmath elliprf at 30 digits).
 */
export function carlsonRF(x: number, y: number, z: number): number {
  if (!(x >= 0 && Number.isFinite(x))) throw domainError("x", x, "finite and >= 0");
  if (!(y >= 0 && Number.isFinite(y))) throw domainError("y", y, "finite and >= 0");
  if (!(z >= 0 && Number.isFinite(z))) throw domainError("z", z, "finite and >= 0");
  if ((x === 0 ? 1 : 0) + (y === 0 ? 1 : 0) + (z === 0 ? 1 : 0) >= 2) return Infinity;
  let xn = x;
  let yn = y;
  let zn = z;
  for (let i = 0; i < MAX_DUPLICATIONS; i++) {
    const mean = (xn + yn + zn) / 3;
    const spread = Math.max(Math.abs(mean - xn), Math.abs(mean - yn), Math.abs(mean - zn));
    if (spread <= SERIES_RADIUS * mean) break;
    const sx = Math.sqrt(xn);
    const sy = Math.sqrt(yn);
    const sz = Math.sqrt(zn);
    const lambda = sx * (sy + sz) + sy * sz;
    xn = 0.25 * (xn + lambda);
    yn = 0.25 * (yn + lambda);
    zn = 0.25 * (zn + lambda);
  }
  const mean = (xn + yn + zn) / 3;
  const dx = (mean - xn) / mean;
  const dy = (mean - yn) / mean;
  const dz = -(dx + dy);
  const e2 = dx * dy - dz * dz;
  const e3 = dx * dy * dz;
  const series =
    1 -
    e2 / 10 +
    e3 / 14 +
    (e2 * e2) / 24 -
    (3 * e2 * e3) / 44 -
    (5 * e2 * e2 * e2) / 208 +
    (3 * e3 * e3) / 104 +
    (e2 * e2 * e3) / 16;
  return series / Math.sqrt(mean);
}
