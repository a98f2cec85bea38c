/**
 * Magnification of a source disk by a point lens as a series in the source's radius, for a disk away
 * from the lens (u > ρ). Offsets and radii in units of θ_E. finite-source.ts uses it where its error
 * estimate allows and the quadrature elsewhere.
 *
 * Method, derived here:
 * - Mean over a circle. For a function f of the plane, analytic about the centre, the mean over the
 *   circle of radius r is Σ_k (r/2)^{2k} Δ^k f / (k!)² — the two-dimensional mean-value expansion
 *   (P. Pizzetti 1909, from memory; it is J₀(r√−Δ) f, J₀ the Bessel function, the angular average of
 *   the Taylor series, since the mean of (h·∇)^{2k} over the circle is (r²/4)^k (2k)! Δ^k/(k!)²).
 * - Mean over a disk of radius ρ with a radially symmetric brightness I(r): integrating the circle
 *   means with weight I(r) r dr gives Σ_k M_k ρ^{2k} Δ^k f / (4^k (k!)²), M_k = ⟨r^{2k}⟩/ρ^{2k} the
 *   brightness-weighted moment. For linear limb darkening I ∝ 1 − a(1 − √(1 − r²/ρ²)), with t = r²/ρ²,
 *   M_k = [(1 − a)/(k + 1) + a B(k + 1, 3/2)] / (1 − a/3), B the beta function: B(1, 3/2) = 2/3 and
 *   B(k + 1, 3/2) = B(k, 3/2) · 2k/(2k + 3). The uniform disk (a = 0) gives
 *   A + (ρ²/8)∇²A + (ρ⁴/192)∇⁴A + …, the quadrupole and hexadecapole terms of A. Gould 2008 (ApJ 681,
 *   1593) and O. Pejcha & D. Heyrovský 2009 (ApJ 690, 1772); limb darkening scales the quadrupole by
 *   (1 − 7a/15)/(1 − a/3), Gould's (1 − Γ/5) with Γ = 2a/(3 − a) (from memory).
 * - Powers of the Laplacian of the point-lens magnification A(u) = (u² + 2)/(u √(u² + 4)) (Paczyński
 *   1986, ApJ 304, 1), radial: with x = u², Δ = d²/du² + (1/u) d/du = 4 d/dx (x d/dx). Then
 *   Δ^k A = P_k(x) / (x^{k+1/2} (x + 4)^{2k+1/2}) with integer polynomials P_0 = x + 2 and, writing
 *   P = P_k, Q_k = x(x + 4) P′ − ((3k + 1)x + 4k + 2) P (so that x dΔ^kA/dx = Q_k / (x^{k−1/2}
 *   (x + 4)^{2k+3/2})),
 *   P_{k+1} = 4 [x(x + 4) Q_k′ − ((3k + 2)x + 4k + 2) Q_k];
 *   e.g. P_1 = 32(x + 1), the known ∇²A = 32(u² + 1)/(u³ (u² + 4)^{5/2}), and
 *   P_2 = 384(3x³ + 6x² + 14x + 12). P_k has degree 2k − 1 for k ≥ 1, and Δ^k A > 0 for all u > 0 (the
 *   fixture generator checks both against mpmath). It is evaluated as
 *   Δ^k A = x^{−k} R_k / (u √(u² + 4)), R_k = P_k(x)/(x + 4)^{2k} = Σ_j c_{k,j} 4^{j−2k} z^j w^{2k−j}
 *   with z = x/(x + 4), w = 4/(x + 4): every power lies in [0, 1], so nothing overflows at large u,
 *   and the sign changes of P_k's coefficients (from k = 4) cost at most a factor ~220 of rounding (k ≤ 16).
 *   The coefficients are computed once, exactly (BigInt), by the recurrence.
 * - Term k of the series is then T_k = M_k q^k R_k / (4^k (k!)² u √(u² + 4)), q = ρ²/u². The terms
 *   are positive and fall off about geometrically, their ratio tending to q (from below close to the
 *   lens, where A ≈ 1/u and T_k ∝ q^k (2k choose k)²/16^k·M_k; from above far out, where A − 1 ≈ 2/u⁴
 *   and T_k ∝ q^k (k + 1)² M_k); the expansion converges for ρ < u, the distance to the lens. The
 *   series is summed until the remainder, estimated from the last term as a geometric tail
 *   T_k r/(1 − r) with r = max(T_k/T_{k−1}, q), is below SERIES_TOLERANCE of the sum; when that has not
 *   happened by MAX_TERMS, the series gives no value.
 * Accuracy: where it gives a value, ≤ ~1e-10 relative (the tolerance); measured against mpmath disk
 * averages at 30 digits (tests/fixtures/generate_finite_source_series.py: worst 7e-11 over 180 points
 * from u = 2ρ to 1000ρ; generate_lensing.py: worst 8.5e-11). With MAX_TERMS = 16 it gives a value from
 * u ≈ 1.63ρ (uniform) to 1.58ρ (a = 1) outwards for ρ ≤ 0.1, 1.5–1.6ρ up to ρ = 3 (our rule: more
 * terms reach little closer, since the ratio q → 1, and each costs ~2k products). Cost
 * (scripts/bench/finite-source.ts): ~0.05 µs a call at u/ρ ≥ 5, ~1 µs close to the switch.
 */

import { pointLensMagnification } from "@/lib/physics/point-lens";

/** Largest power of the Laplacian the series takes (our rule: see the file's comment). */
const MAX_TERMS = 16;

/** The remainder the series may leave, relative to the magnification. */
export const SERIES_TOLERANCE = 1e-10;

/** P_k's coefficients (ascending powers of x) scaled as c_{k,j} 4^{j−2k}, k = 1…MAX_TERMS. */
const SCALED_LAPLACIAN_COEFFICIENTS: Float64Array[] = [];
/** 1/(4^k (k!)²) times the uniform disk's moment 1/(k + 1) and times B(k + 1, 3/2), k = 0…MAX_TERMS. */
const UNIFORM_WEIGHT = new Float64Array(MAX_TERMS + 1);
const LIMB_WEIGHT = new Float64Array(MAX_TERMS + 1);

{
  // Exact integer arithmetic: the coefficients pass 2^53 from k = 7 and the recurrence subtracts them.
  const times = (p: bigint[], linear: bigint, constant: bigint) => {
    // (linear x + constant) p
    const result = new Array<bigint>(p.length + 1).fill(0n);
    p.forEach((c, j) => {
      result[j + 1] += linear * c;
      result[j] += constant * c;
    });
    return result;
  };
  const xTimesXPlus4Derivative = (p: bigint[]) => {
    // x (x + 4) p′
    const result = new Array<bigint>(p.length + 1).fill(0n);
    for (let j = 1; j < p.length; j++) {
      result[j + 1] += BigInt(j) * p[j];
      result[j] += 4n * BigInt(j) * p[j];
    }
    return result;
  };
  const minus = (p: bigint[], r: bigint[]) => r.map((c, j) => (p[j] ?? 0n) - c);
  const trim = (p: bigint[]) => {
    let degree = p.length - 1;
    while (degree > 0 && p[degree] === 0n) degree -= 1;
    return p.slice(0, degree + 1);
  };
  let p = [2n, 1n];
  for (let k = 0; k < MAX_TERMS; k++) {
    const big = BigInt(k);
    const q = trim(minus(xTimesXPlus4Derivative(p), times(p, 3n * big + 1n, 4n * big + 2n)));
    p = trim(minus(xTimesXPlus4Derivative(q), times(q, 3n * big + 2n, 4n * big + 2n)).map((c) => 4n * c));
    SCALED_LAPLACIAN_COEFFICIENTS.push(Float64Array.from(p, (c, j) => Number(c) * 4 ** (j - 2 * (k + 1))));
  }
  let factorial = 1;
  let beta = 2 / 3;
  for (let k = 0; k <= MAX_TERMS; k++) {
    if (k > 0) {
      factorial *= k;
      beta *= (2 * k) / (2 * k + 3);
    }
    const scale = 1 / (4 ** k * factorial * factorial);
    UNIFORM_WEIGHT[k] = scale / (k + 1);
    LIMB_WEIGHT[k] = scale * beta;
  }
}

const zPowers = new Float64Array(2 * MAX_TERMS + 1);
const wPowers = new Float64Array(2 * MAX_TERMS + 1);

/** Fills zPowers and wPowers up to 2k for x = u²; call with k = 1, 2, … in turn. */
function extendPowers(k: number, z: number, w: number): void {
  if (k === 1) {
    zPowers[0] = 1;
    wPowers[0] = 1;
  }
  for (let i = 2 * k - 1; i <= 2 * k; i++) {
    zPowers[i] = zPowers[i - 1] * z;
    wPowers[i] = wPowers[i - 1] * w;
  }
}

/** R_k = P_k(x)/(x + 4)^{2k} from the powers filled for k. */
function scaledLaplacian(k: number): number {
  const c = SCALED_LAPLACIAN_COEFFICIENTS[k - 1];
  let sum = 0;
  for (let j = 0; j < c.length; j++) sum += c[j] * zPowers[j] * wPowers[2 * k - j];
  return sum;
}

/**
 * Δ^k A(u), the k-th power of the plane's Laplacian of the point-lens magnification at offset `u`
 * (θ_E; result in θ_E^{−2k}). Domain: u > 0 finite, 0 ≤ k ≤ 16 whole. Method: the file's comment
 * (closed form by the recurrence for P_k); accuracy ~1e-13 relative
 * (worst 1.6e-15 measured against mpmath for k ≤ 12, u = 0.01…200).
 */
export function pointLensLaplacianPower(u: number, k: number): number {
  if (k === 0) return pointLensMagnification(u);
  const x = u * u;
  const z = x / (x + 4);
  const w = 4 / (x + 4);
  for (let i = 1; i <= k; i++) extendPowers(i, z, w);
  return scaledLaplacian(k) / (x ** k * u * Math.sqrt(x + 4));
}

/**
 * Magnification of a source disk of radius `rho` at offset `u` > `rho` from a point lens (θ_E), linear
 * limb-darkening coefficient `limbDarkeningU` (0..1), by the series in ρ; null where the series has not
 * reached SERIES_TOLERANCE within its terms (close to the lens: use the quadrature). Arguments are
 * not checked (finite-source.ts does). Method and accuracy: the file's comment.
 */
export function finiteSourceSeries(u: number, rho: number, limbDarkeningU: number): number | null {
  if (!(u > rho)) return null;
  const x = u * u;
  const z = x / (x + 4);
  const w = 4 / (x + 4);
  const q = (rho * rho) / x;
  const uniformShare = (1 - limbDarkeningU) / (1 - limbDarkeningU / 3);
  const limbShare = limbDarkeningU / (1 - limbDarkeningU / 3);
  const base = 1 / (u * Math.sqrt(x + 4));
  let sum = pointLensMagnification(u);
  let previous = 0;
  let qPower = 1;
  for (let k = 1; k <= MAX_TERMS; k++) {
    extendPowers(k, z, w);
    qPower *= q;
    const term = (uniformShare * UNIFORM_WEIGHT[k] + limbShare * LIMB_WEIGHT[k]) * qPower * scaledLaplacian(k) * base;
    sum += term;
    if (term === 0) return sum;
    if (k > 1) {
      const ratio = Math.max(term / previous, q);
      if (ratio < 1 && (term * ratio) / (1 - ratio) <= SERIES_TOLERANCE * sum) return sum;
    }
    previous = term;
  }
  return null;
}
