/**
 * Geometry of light rays in the Schwarzschild metric, equatorial plane, geometrized units
 * (G = c = 1): the mass M and every length (b, r) are given in one and the same unit of length.
 *
 * Conventions and formulas: b = r0 / sqrt(1 - 2M/r0) for a ray with closest approach r0; photon sphere
 * r = 3M; critical impact parameter b_c = 3 sqrt(3) M (C. Darwin 1959, Proc. R. Soc. A 249, 180;
 * S. Chandrasekhar 1983, The Mathematical Theory of Black Holes, ch. 3 sect. 20).
 */

import { domainError, requireFinite, requirePositive } from "./domain";

/** Splits a double for exact products (Veltkamp/Dekker; T. J. Dekker 1971, Numer. Math. 18, 224). */
const SPLITTER = 134_217_729; // 2^27 + 1

/**
 * Rounding error of product = fl(a*b), so that a*b = product + twoProductError(a, b, product) exactly
 * (Dekker 1971; |a|, |b| below ~1e300 so the split does not overflow). Shared with
 * relativistic-effects.ts for cancellation-free differences.
 */
export function twoProductError(a: number, b: number, product: number): number {
  const ca = SPLITTER * a;
  const aHi = ca - (ca - a);
  const aLo = a - aHi;
  const cb = SPLITTER * b;
  const bHi = cb - (cb - b);
  const bLo = b - bHi;
  return aHi * bHi - product + aHi * bLo + aLo * bHi + aLo * bLo;
}

/** 3 sqrt(3) as an unevaluated sum CRITICAL_HI + CRITICAL_LO, good to ~1e-32 relative. */
const CRITICAL_HI = 3 * Math.sqrt(3);
const CRITICAL_LO = (27 - CRITICAL_HI * CRITICAL_HI - twoProductError(CRITICAL_HI, CRITICAL_HI, CRITICAL_HI * CRITICAL_HI)) / (2 * CRITICAL_HI);

/** Newton polish steps for the closest-approach cubic; 3 suffice from the trigonometric start. */
const MAX_NEWTON_STEPS = 8;

/**
 * Photon-sphere radius 3M (Darwin 1959). Units: those of M. Domain: M finite, > 0. Exact.
 */
export function photonSphereRadius(M: number): number {
  requirePositive("M", M);
  return 3 * M;
}

/**
 * Critical impact parameter b_c = 3 sqrt(3) M (Darwin 1959): rays with b < b_c are captured, rays
 * with b > b_c escape. Units: those of M. Domain: M finite, > 0. Correctly rounded to 1 ulp.
 */
export function criticalImpactParameter(M: number): number {
  requirePositive("M", M);
  return CRITICAL_HI * M + CRITICAL_LO * M;
}

/** True when a ray of impact parameter |b| falls into the hole (|b| < b_c). Units: those of M. */
export function isCaptured(b: number, M: number): boolean {
  requireFinite("b", b);
  requirePositive("M", M);
  return criticalExcess(Math.abs(b), M) < 0;
}

/**
 * (b - b_c)/b_c computed without the cancellation of b - b_c: b_c is carried in double-double, so the
 * result is accurate to ~1 ulp relative even for b = b_c(1 + 1e-15). Units: b and M in one unit.
 * Domain: b finite >= 0, M finite > 0. Internal helper shared by the deflection formulas.
 */
export function criticalExcess(b: number, M: number): number {
  const product = CRITICAL_HI * M;
  const productError = twoProductError(CRITICAL_HI, M, product);
  const difference = b - product - productError - CRITICAL_LO * M;
  return difference / (product + CRITICAL_LO * M);
}

/**
 * eta = r0/(3M) - 1 for a ray of relative excess epsilon = b/b_c - 1 > 0, the largest root of
 * eta^3 + 3 eta^2 - 3 E eta - E = 0 with E = epsilon (2 + epsilon) (from b^2 = r0^3/(r0 - 2M)).
 * Method: Cardano's trigonometric root for a start, then Newton on the cubic in eta, which is well
 * conditioned even where r0 - 3M ~ sqrt(b - b_c) is not as a function of r0. Relative accuracy ~1 ulp.
 */
export function photonSphereExcessFromCriticalExcess(epsilon: number): number {
  if (!(epsilon > 0)) throw domainError("epsilon", epsilon, "> 0 (b > b_c)");
  if (epsilon === Infinity) return Infinity;
  const e = epsilon * (2 + epsilon);
  // Cardano: r0 = (2b/sqrt(3)) cos(acos(-b_c/b)/3), i.e. r0/(3M) = 2 (b/b_c) cos(acos(-b_c/b)/3).
  const ratio = 1 + epsilon;
  let eta = 2 * ratio * Math.cos(Math.acos(-1 / ratio) / 3) - 1;
  if (!(eta > 0) || epsilon < 1e-6) eta = Math.sqrt(e / 3);
  for (let i = 0; i < MAX_NEWTON_STEPS; i++) {
    const f = ((eta + 3) * eta - 3 * e) * eta - e;
    const df = (3 * eta + 6) * eta - 3 * e;
    const step = f / df;
    eta -= step;
    if (Math.abs(step) <= 4e-16 * eta) break;
  }
  return eta;
}

/**
 * Closest approach r0 of a ray with impact parameter b: the largest root of r^3 - b^2 r + 2 M b^2 = 0
 * (Darwin 1959). Units: b, M and the result in one unit of length. Domain: b > b_c (b <= b_c is
 * captured and has no turning point: RangeError), M > 0, b = +Infinity gives Infinity.
 * Method: see photonSphereExcessFromCriticalExcess; relative accuracy ~2 ulp for all b > b_c
 * (r0 - 3M ~ sqrt(b - b_c) is computed from b - b_c without cancellation).
 */
export function closestApproach(b: number, M: number): number {
  requirePositive("M", M);
  if (Number.isNaN(b) || b === -Infinity) throw domainError("b", b, `> b_c = 3 sqrt(3) M = ${criticalImpactParameter(M)}`);
  if (b === Infinity) return Infinity;
  const epsilon = criticalExcess(b, M);
  if (!(epsilon > 0)) {
    throw domainError("b", b, `> b_c = 3 sqrt(3) M = ${criticalImpactParameter(M)} (smaller b is captured)`);
  }
  if (epsilon > 1e6) {
    // r0/b = 1 - x - (3/2) x^2 - 4 x^3 - (105/8) x^4 - ..., x = M/b (the cubic's root as a series;
    // the next term is below 1e-33 here). Avoids overflow of the cubic's coefficients for huge b.
    const x = M / b;
    return b * (1 - x * (1 + x * (1.5 + x * (4 + x * 13.125))));
  }
  return 3 * M * (1 + photonSphereExcessFromCriticalExcess(epsilon));
}

/**
 * Impact parameter b = r0 / sqrt(1 - 2M/r0) of the ray whose closest approach is r0 (Darwin 1959).
 * Units: r0, M and the result in one unit. Domain: r0 > 2M (r0 in (2M, 3M) gives b > b_c for the
 * unstable inner branch that never reaches infinity), M > 0. Accuracy: ~2 ulp.
 */
export function impactParameterFromClosestApproach(r0: number, M: number): number {
  requirePositive("M", M);
  if (r0 === Infinity) return Infinity;
  if (!(r0 > 2 * M && Number.isFinite(r0))) throw domainError("r0", r0, `> 2M = ${2 * M}`);
  return r0 / Math.sqrt(1 - (2 * M) / r0);
}
