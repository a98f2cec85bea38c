/**
 * Deflection of light by a Schwarzschild mass, geometrized units (G = c = 1; b and M in one unit of
 * length; angles in radians).
 *
 * Exact: alpha(b) = 2 Integral_0^{u0} du / sqrt(1/b^2 - u^2 + 2 M u^3) - pi (C. Darwin 1959,
 * Proc. R. Soc. A 249, 180). With eta = r0/(3M) - 1, s = 1 + 3 eta, p = sqrt(s (3 + eta)/3) the
 * integral reduces (Carlson 1995, Numer. Algorithms 10, 13, cubic with three real roots, one limit at a
 * root) to
 *   alpha = 4 sqrt(1 + eta) R_F((s + p)/2, 4 s eta/(3 (s + p)), 2 eta) - pi,
 * whose arguments keep full relative accuracy as b -> b_c (eta -> 0). For b >= SERIES_MIN_B_OVER_M M the
 * subtraction of pi would cost digits, so alpha is summed from its power series in M/b instead,
 *   alpha = sum_k A_k (M/b)^k,  A_k = 2^(k+1) ((k+1)/2)_k / k! * W_k,  W_k = Integral_0^1 s^k/sqrt(1-s^2) ds,
 * (A_1..A_3 = 4, 15 pi/4, 128/3 as in C. R. Keeton & A. O. Petters 2005, Phys. Rev. D 72, 104006; the
 * general term follows from Lagrange inversion of s^2 = w^2 - 2 (M/b) w^3 in the integral above.)
 */

import { carlsonRF } from "./carlson";
import { domainError, requirePositive } from "./domain";
import { closestApproach, criticalExcess, photonSphereExcessFromCriticalExcess } from "./schwarzschild";

/**
 * Above this b/M the series is used. The closed form returns alpha = (~pi) - pi, so its relative
 * error grows like pi/alpha: 3e-15 below 10 M but 1.5e-14 at 40 M, where the switch used to be
 * (measured against tests/fixtures/physics/deflection-dense.json).
 */
const SERIES_MIN_B_OVER_M = 10;

/** Series terms kept: A_{k+1}/A_k -> 3 sqrt(3), so at b = 10 M term 65 is ~ 1e-18 of the first. */
const SERIES_TERMS = 64;

/** From b = 40 M on, 24 terms suffice (term 25 is ~ 1e-21 of the first): fewer multiplications. */
const FAR_SERIES_MIN_B_OVER_M = 40;
const FAR_SERIES_TERMS = 24;

/** A_k of the weak-field series, index k-1 (see the module comment). */
const SERIES_COEFFICIENTS: Float64Array = (() => {
  const coefficients = new Float64Array(SERIES_TERMS);
  // W_k by the Wallis recurrence W_k = (k-1)/k W_{k-2}, W_0 = pi/2, W_1 = 1.
  let wPrevious = Math.PI / 2;
  let wCurrent = 1;
  for (let k = 1; k <= SERIES_TERMS; k++) {
    if (k >= 2) {
      const wNext = ((k - 1) / k) * wPrevious;
      wPrevious = wCurrent;
      wCurrent = wNext;
    }
    // 2^(k+1) ((k+1)/2)_k / k! as a running product of (k+1 + 2j)/(j+1), j = 0..k-1.
    let factor = 2;
    for (let j = 0; j < k; j++) factor *= (k + 1 + 2 * j) / (j + 1);
    coefficients[k - 1] = factor * wCurrent;
  }
  return coefficients;
})();

const CRITICAL_IMPACT_OVER_M = 3 * Math.sqrt(3);

/** ln(216 (7 - 4 sqrt 3)) - pi, the constant of the Schwarzschild strong-deflection limit (Bozza 2002). */
const STRONG_FIELD_CONSTANT = Math.log(216 * (7 - 4 * Math.sqrt(3))) - Math.PI;

/**
 * Coefficient A_k of the weak-field series alpha = sum_k A_k (M/b)^k, k = 1..64 (A_1 = 4,
 * A_2 = 15 pi/4, A_3 = 128/3; Keeton & Petters 2005). Exact formula, evaluated to ~2 ulp.
 */
export function weakFieldSeriesCoefficient(k: number): number {
  if (!(Number.isInteger(k) && k >= 1 && k <= SERIES_TERMS)) {
    throw domainError("k", k, `an integer in 1..${SERIES_TERMS}`);
  }
  return SERIES_COEFFICIENTS[k - 1];
}

function checkImpactParameter(b: number, M: number): void {
  requirePositive("M", M);
  if (Number.isNaN(b) || !(b > 0)) throw domainError("b", b, "> 0 (a positive impact parameter, or +Infinity)");
}

/** The series at x = M/b <= 1/SERIES_MIN_B_OVER_M, by Horner's rule over the terms it needs. */
function seriesDeflection(x: number): number {
  const terms = x <= 1 / FAR_SERIES_MIN_B_OVER_M ? FAR_SERIES_TERMS : SERIES_TERMS;
  let sum = SERIES_COEFFICIENTS[terms - 1];
  for (let k = terms - 2; k >= 0; k--) sum = sum * x + SERIES_COEFFICIENTS[k];
  return sum * x;
}

/** 4 sqrt(1+eta) R_F(...) - pi for a ray with photon-sphere excess eta = r0/(3M) - 1 > 0. */
function closedFormDeflection(eta: number): number {
  const s = 1 + 3 * eta;
  const p = Math.sqrt((s * (3 + eta)) / 3);
  const a = 0.5 * (s + p);
  return 4 * Math.sqrt(1 + eta) * carlsonRF(a, (2 * s * eta) / (3 * a), 2 * eta) - Math.PI;
}

/**
 * Exact deflection angle of a light ray passing a Schwarzschild mass, radians (positive: toward the
 * mass). Units: b and M in one unit of length. Domain: M finite > 0; b > b_c = 3 sqrt(3) M, or
 * +Infinity (returns 0); b <= b_c, NaN, b <= 0 throw RangeError (the ray is captured; see isCaptured).
 * (b_c is irrational, so no double equals it; alpha grows like -ln(b/b_c - 1), ~37.7 at the double
 * nearest b_c.)
 * Method: closed form in Carlson's R_F for b < 10 M, the exact power series in M/b above (module
 * comment). Accuracy: 3.5e-15 relative or better for b from b_c (1 + 1e-15) to 1e200 M (below 10 M;
 * 3e-16 above), measured against mpmath (tests/fixtures/physics/deflection.json, deflection-dense.json
 * with 801 b from 5.3 M to 80 M, far-rays.json); relative to the exact value at
 * the given double b (near b_c the condition number ~1/ln(b/b_c - 1)/(b/b_c - 1) is inherent).
 * Source: Darwin 1959; Carlson 1995; Keeton & Petters 2005.
 */
export function exactDeflection(b: number, M: number): number {
  checkImpactParameter(b, M);
  if (b === Infinity) return 0;
  if (b >= SERIES_MIN_B_OVER_M * M) return seriesDeflection(M / b);
  const epsilon = criticalExcess(b, M);
  if (!(epsilon > 0)) throw domainError("b", b, `> b_c = 3 sqrt(3) M (smaller b is captured)`);
  return deflectionFromCriticalExcess(epsilon);
}

/**
 * Exact deflection as a function of epsilon = b/b_c - 1 > 0, radians (as exactDeflection, which it
 * serves; this form keeps full accuracy where b/b_c - 1 is known better than b, e.g. in lens-equation
 * solvers that work in ln(b/b_c - 1)). Domain: epsilon > 0, or +Infinity (returns 0).
 */
export function deflectionFromCriticalExcess(epsilon: number): number {
  if (!(epsilon > 0)) throw domainError("epsilon", epsilon, "> 0 (b > b_c)");
  const bOverM = CRITICAL_IMPACT_OVER_M * (1 + epsilon);
  if (bOverM >= SERIES_MIN_B_OVER_M) return seriesDeflection(1 / bOverM);
  return closedFormDeflection(photonSphereExcessFromCriticalExcess(epsilon));
}

/**
 * Weak-field deflection to the given order in M/b: order 1 is Einstein's 4M/b; orders 2 and 3 add
 * (15 pi/4)(M/b)^2 and (128/3)(M/b)^3 (Keeton & Petters 2005, eq. for Schwarzschild). Radians.
 * Units: b and M in one unit. Domain: b > 0 (or +Infinity), M > 0, order in {1, 2, 3}.
 * Error against exactDeflection: the first omitted term, relative ~ A_{n+1}/4 (M/b)^n, i.e.
 * 2.9 (M/b), 2.7 (M/b)^2, 10.6 (M/b)^3 for orders 1, 2, 3 (tested). Invalid for b < b_c.
 */
export function weakFieldDeflection(b: number, M: number, order: 1 | 2 | 3 = 1): number {
  checkImpactParameter(b, M);
  if (order !== 1 && order !== 2 && order !== 3) throw domainError("order", order, "1, 2 or 3");
  const x = M / b;
  let sum = 0;
  for (let k = order - 1; k >= 0; k--) sum = sum * x + SERIES_COEFFICIENTS[k];
  return sum * x;
}

/**
 * Strong-deflection limit alpha ~ -ln(b/b_c - 1) + ln(216 (7 - 4 sqrt 3)) - pi for b -> b_c+
 * (V. Bozza 2002, Phys. Rev. D 66, 103001, Schwarzschild case: abar = 1, bbar = -0.4002). Radians.
 * Units: b and M in one unit. Domain: b > b_c (RangeError otherwise).
 * Error against exactDeflection: O((b/b_c - 1) ln(b/b_c - 1)): 7e-9, 5e-6 and 3.1e-3 rad at
 * b/b_c - 1 = 1e-9, 1e-6, 1e-3 (tested); b/b_c - 1 is computed without cancellation.
 */
export function strongFieldDeflection(b: number, M: number): number {
  checkImpactParameter(b, M);
  const epsilon = criticalExcess(b, M);
  if (!(epsilon > 0)) throw domainError("b", b, "> b_c = 3 sqrt(3) M");
  return -Math.log(epsilon) + STRONG_FIELD_CONSTANT;
}

/** Above this b/b_c - 1 the photon-sphere excess comes from closestApproach's series (the cubic in
 * eta would overflow beyond ~1e100). */
const FAR_RAY_CRITICAL_EXCESS = 1e6;

/** Largest b/M of sweptAngleFromInfinity: keeps 3 (1 + 3 eta) and its neighbours finite. */
const MAX_SWEPT_B_OVER_M = 1e300;

/**
 * Polar angle swept by a ray of impact parameter b (> b_c) from infinity in to radius r >= r0 on
 * either leg: Integral_0^{1/r} du / sqrt(1/b^2 - u^2 + 2 M u^3), radians. Units: r, b, M in one unit.
 * Method: Carlson 1995 R_F for the incomplete integral with three real roots u_- < 0 < u0 < u3 of the
 * cubic, 2 R_F(U12^2, U13^2, U23^2), with every U scaled by b/r (the cubic at u = 0 is 1/b^2), so the
 * arguments are O(1) ratios: rho1 = sqrt(1 - r0/r), rho2 = sqrt(1 - u/u3), rho3 = sqrt(1 + u/|u_-|),
 *   angle = 2 (b/r) R_F((rho1 rho2 + rho3)^2, (rho1 rho3 + rho2)^2, (rho2 rho3 + rho1)^2).
 * The roots are written without cancellation: with eta = r0/(3M) - 1 and q = sqrt(3 (1 + 3 eta)(3 + eta)),
 * (u3 - u0) r0 = (q + 3 eta - 3)/4 (from q^2 - (3 eta - 3)^2 = 48 eta) with q - 3 = 3 eta (3 eta + 10)/(q + 3),
 * and |u_-| r0 = 2 (1 + 3 eta)/(1 + 3 eta + q); nothing overflows or underflows for b up to 1e300 M,
 * the domain's limit (beyond it, and for r <= 0 or r < r0, RangeError naming b or r).
 * Accuracy: 4e-16 relative for b from b_c to 1e200 M at r >= 2b, measured against mpmath quadrature
 * (tests/fixtures/physics/far-rays.json, deflection.json); as r -> r0 the angle's condition number
 * grows like 1/sqrt(1 - r0/r), and the error with it. Used to extend a ray traced between finite radii
 * to its asymptotic deflection.
 */
export function sweptAngleFromInfinity(r: number, b: number, M: number): number {
  requirePositive("M", M);
  const epsilon = criticalExcess(b, M);
  if (!(epsilon > 0 && b / M <= MAX_SWEPT_B_OVER_M)) throw domainError("b", b, `> b_c = 3 sqrt(3) M and <= 1e300 M = ${MAX_SWEPT_B_OVER_M * M}`);
  if (!(r > 0)) throw domainError("r", r, "a radius >= the closest approach r0");
  if (r === Infinity) return 0;
  const eta = epsilon > FAR_RAY_CRITICAL_EXCESS ? closestApproach(b, M) / (3 * M) - 1 : photonSphereExcessFromCriticalExcess(epsilon);
  const r0 = 3 * M * (1 + eta);
  const rootRatio = r0 / r; // u/u0
  if (!(rootRatio <= 1 + 1e-15)) throw domainError("r", r, `>= the closest approach r0 = ${r0}`);
  const q = Math.sqrt(3 * (1 + 3 * eta)) * Math.sqrt(3 + eta);
  const upperGap = 0.75 * eta * ((3 * eta + 10) / (q + 3) + 1); // (u3 - u0) r0
  const negativeRoot = (2 * (1 + 3 * eta)) / (1 + 3 * eta + q); // |u_-| r0
  const rho1Squared = Math.max(0, 1 - rootRatio);
  const rho1 = Math.sqrt(rho1Squared);
  const rho2 = Math.sqrt((upperGap + rho1Squared) / (1 + upperGap));
  const rho3 = Math.sqrt(1 + rootRatio / negativeRoot);
  const a = rho1 * rho2 + rho3;
  const c = rho1 * rho3 + rho2;
  const d = rho2 * rho3 + rho1;
  return 2 * (b / r) * carlsonRF(a * a, c * c, d * d);
}
