/**
 * Magnification of a finite source disk by a point lens. Offsets and radii in units of θ_E.
 *
 * Method (stated here because the contract names it):
 * - Away from the lens (from u ≈ 1.6ρ outwards, where it converges to 1e-10 within 16 terms): the
 *   disk average as a series in the source's radius, finite-source-series.ts — the two-dimensional
 *   mean-value expansion A + (ρ²/8)∇²A + (ρ⁴/192)∇⁴A + … of a uniform disk, each term weighted by the
 *   limb-darkened profile's moment ⟨r^{2k}⟩, ∇^{2k}A in closed form; its first terms are the quadrupole
 *   and hexadecapole of A. Gould 2008 (ApJ 681, 1593) and O. Pejcha & D. Heyrovský 2009 (ApJ 690,
 *   1772). It is summed until its remainder, estimated from the last terms, is below 1e-10 of A.
 * - Closer (the disk over or near the lens), and everywhere in finiteSourceMagnificationExact, a
 *   quadrature along the lines through the lens. With polar coordinates (r, θ) about the lens and r
 *   signed, the magnified area element along a line is f(r) dr dθ, f(r) = A(|r|)|r| = (r² + 2)/√(r² + 4),
 *   analytic in r (the point lens's 1/r is cancelled by the area element). A line at angle θ crosses
 *   the disk on the chord of centre m = u cos θ and half-length h = √(ρ² − u² sin²θ), for θ ∈ [0, π)
 *   when u < ρ, |θ| ≤ arcsin(ρ/u) when u > ρ.
 *   - Uniform disk: f has the antiderivative G(r)/2, G(r) = r √(r² + 4), so
 *     A₀(u, ρ) = (1/πρ²) ∫ [G(m + h) − G(m − h)]/2 dθ — the same 1-D reduction as Lee et al. 2009
 *     (ApJ 695, 200) eq. 7–9 — by tanh-sinh quadrature, with variables chosen so that nothing cancels or
 *     blows up: for u > ρ, sin θ = (ρ/u) sin ψ removes the square-root end at the tangent ray; for
 *     u < ρ the interval is split at θ = π/2, where the chord's end varies fastest when u is close to ρ.
 *     At u = ρ (the source's edge on the caustic) the value is finite and the chord is 2ρ cos θ.
 *   - Linear limb darkening I(d) ∝ 1 − a + (a/ρ)√(ρ² − d²), d the distance from the disk's centre:
 *     A_a = [(1 − a) A₀ + a J/(πρ³)] / (1 − a/3), J = ∫∫ √(ρ² − d²) A dA. Along a chord
 *     ρ² − d² = h² − (r − m)², so J = ∫ h² ∫₋₁¹ f(m + h x) √(1 − x²) dx dθ: the inner integral by
 *     Gauss–Chebyshev quadrature of the second kind (its weight is exactly the limb's square root; f's
 *     nearest singularities, r = ±2i, set the nodes for 1e-13), the outer by tanh-sinh. Both are
 *     analytic in θ up to the tangent ray (h² is, and the inner integral is even in h), so neither needs
 *     a split at the caustic.
 * Accuracy: ≤ 1e-9 relative for 1e-4 ≤ ρ ≤ 10, 0 ≤ u ≤ 100 and for 1e-4 ≤ ρ ≤ 0.5, 1.1ρ ≤ u ≤ 1000ρ,
 * 0 ≤ a ≤ 1; measured against mpmath quadrature at 30 digits (tests/fixtures/generate_lensing.py, 396
 * points, and generate_finite_source_series.py, 225 points across the switch): worst 8.5e-11, set by
 * the series; the quadrature alone agrees to 9e-15. Cost (scripts/bench/finite-source.ts, u from 0.05
 * to 3, ρ = 0.01, where the series is used): ~0.05 µs a call, uniform or limb darkened, against ~2 µs
 * (uniform) and ~7 µs (limb darkened) by the quadrature alone; close to the lens ~4–8 µs by quadrature.
 */

import { finiteSourceSeries } from "./finite-source-series";
import { integrateTanhSinh } from "./tanh-sinh";

/** How the finite-source magnification is computed, as the pages name the method. */
export const FINITE_SOURCE_METHOD =
  "finite source by the series in the source's radius away from the lens (Gould 2008, ApJ 681, 1593; Pejcha & Heyrovský 2009, ApJ 690, 1772) and near it by quadrature along the chords through the lens (the uniform disk in one dimension as Lee et al. 2009, ApJ 695, 200; Witt & Mao 1994, ApJ 430, 505), linear limb darkening by Gauss–Chebyshev quadrature along the same chords";

/** Tolerance between successive quadrature levels; the result's error is far smaller (~its square). */
const QUADRATURE_TOLERANCE = 1e-9;
/** Digits (natural log of the error's inverse) the Gauss–Chebyshev rule along a chord aims at, and its node cap. */
const LIMB_RULE_DIGITS = 30;
const CHEBYSHEV_MAX_HALF_NODES = 64;

/** G(r) = r √(r² + 4): twice the antiderivative of A(r) r. */
function g(r: number): number {
  return r * Math.sqrt(r * r + 4);
}

/** Uniform disk of radius ρ at offset u (both > 0 or u = 0), by quadrature. */
function uniformDiskQuadrature(u: number, rho: number): number {
  if (u === 0) return Math.sqrt(1 + 4 / (rho * rho));
  const area = Math.PI * rho * rho;
  if (u === rho) {
    return integrateTanhSinh((theta) => g(2 * rho * Math.cos(theta)), 0, Math.PI / 2, QUADRATURE_TOLERANCE) / area;
  }
  // ρ² − u² sin²θ, written so that neither u ≈ ρ nor θ ≈ π/2 cancels.
  const rhoSquaredMinusUSquared = (rho - u) * (rho + u);
  if (u < rho) {
    const farEnd = (theta: number, cosTheta: number) => {
      const half = Math.sqrt(rhoSquaredMinusUSquared + u * u * cosTheta * cosTheta);
      // Past π/2 the lens-side term is negative: the product of the roots gives the end without cancelling.
      return cosTheta >= 0 ? u * cosTheta + half : rhoSquaredMinusUSquared / (half - u * cosTheta);
    };
    const nearHalf = integrateTanhSinh((theta, _fromStart, toHalfPi) => g(farEnd(theta, Math.sin(toHalfPi))), 0, Math.PI / 2, QUADRATURE_TOLERANCE);
    const farHalf = integrateTanhSinh((theta, fromHalfPi) => g(farEnd(theta, -Math.sin(fromHalfPi))), Math.PI / 2, Math.PI, QUADRATURE_TOLERANCE);
    return (nearHalf + farHalf) / area;
  }
  // u > ρ: sin θ = (ρ/u) sin ψ, ψ ∈ [0, π/2]; dθ = (ρ/u) cos ψ dψ / cos θ.
  const ratio = rho / u;
  const oneMinusRatioSquared = ((u - rho) * (u + rho)) / (u * u);
  const chordIntegrand = (psi: number, _fromStart: number, toHalfPi: number) => {
    const cosPsi = Math.sin(toHalfPi);
    const cosTheta = Math.sqrt(oneMinusRatioSquared + ratio * ratio * cosPsi * cosPsi);
    const half = rho * cosPsi;
    const middle = u * cosTheta;
    const far = middle + half;
    const near = -rhoSquaredMinusUSquared / far;
    // G(far) − G(near) = (far² − near²)(far² + near² + 4) / (G(far) + G(near)), far² − near² = 4 half middle.
    const difference = (4 * half * middle * (far * far + near * near + 4)) / (g(far) + g(near));
    return (difference * ratio * cosPsi) / cosTheta;
  };
  return integrateTanhSinh(chordIntegrand, 0, Math.PI / 2, QUADRATURE_TOLERANCE) / area;
}

/** f(r) = A(|r|) |r| = (r² + 2)/√(r² + 4): the magnified area element along a line through the lens, analytic in r. */
function magnifiedLineDensity(r: number): number {
  const r2 = r * r;
  return (r2 + 2) / Math.sqrt(r2 + 4);
}

/**
 * Nodes cos(iπ/(M + 1)) (i = 1…M/2, the other half mirrored) and weights π/(M + 1) sin²(iπ/(M + 1)) of
 * M-point Gauss–Chebyshev quadrature of the second kind, ∫₋₁¹ F(x) √(1 − x²) dx, for even M.
 */
function chebyshevSecondKind(m: number): { x: Float64Array; w: Float64Array } {
  const x = new Float64Array(m / 2);
  const w = new Float64Array(m / 2);
  for (let i = 1; i <= m / 2; i++) {
    const angle = (i * Math.PI) / (m + 1);
    x[i - 1] = Math.cos(angle);
    w[i - 1] = (Math.PI / (m + 1)) * Math.sin(angle) ** 2;
  }
  return { x, w };
}

const CHEBYSHEV_RULES = new Map<number, { x: Float64Array; w: Float64Array }>();

/**
 * ∫∫ √(ρ² − d²) A dA over the disk (d the distance from the disk's centre), along the chords through
 * the lens: J = 2 ∫₀^{θ_end} h² ∫₋₁¹ f(m + h x) √(1 − x²) dx dθ, m = u cos θ, h² = ρ² − u² sin²θ.
 */
function limbWeightedIntegral(u: number, rho: number): number {
  // f's nearest singularities are r = ±2i; on a chord of half-length h ≤ ρ they lie outside the Bernstein
  // ellipse of parameter (2 + √(4 + ρ²))/ρ, so M nodes leave ~that^(−2M): M for 1e-13.
  const ellipse = Math.log((2 + Math.sqrt(4 + rho * rho)) / rho);
  const m = 2 * Math.min(CHEBYSHEV_MAX_HALF_NODES, Math.max(2, Math.ceil(LIMB_RULE_DIGITS / (4 * ellipse))));
  let rule = CHEBYSHEV_RULES.get(m);
  if (rule === undefined) {
    rule = chebyshevSecondKind(m);
    CHEBYSHEV_RULES.set(m, rule);
  }
  const { x, w } = rule;
  const thetaEnd = u > rho ? Math.asin(rho / u) : Math.PI / 2;
  const integrand = (theta: number) => {
    const sinTheta = Math.sin(theta);
    const h2 = (rho - u * sinTheta) * (rho + u * sinTheta);
    const h = Math.sqrt(Math.max(h2, 0));
    const middle = u * Math.cos(theta);
    let sum = 0;
    for (let i = 0; i < x.length; i++) sum += w[i] * (magnifiedLineDensity(middle + h * x[i]) + magnifiedLineDensity(middle - h * x[i]));
    return h2 * sum;
  };
  return 2 * integrateTanhSinh(integrand, 0, thetaEnd, QUADRATURE_TOLERANCE);
}

/** The disk by quadrature: the uniform disk by its chords' antiderivative, the limb's weight by Gauss–Chebyshev along them. */
function quadratureMagnification(u: number, rho: number, limbDarkeningU: number): number {
  const uniform = uniformDiskQuadrature(u, rho);
  if (limbDarkeningU === 0) return uniform;
  const limb = limbWeightedIntegral(u, rho) / (Math.PI * rho * rho * rho);
  return ((1 - limbDarkeningU) * uniform + limbDarkeningU * limb) / (1 - limbDarkeningU / 3);
}

function requireArgument(isValid: boolean, words: string, value: number): void {
  if (!isValid) throw new RangeError(`${words}, got ${Number.isNaN(value) ? "NaN" : String(value)}`);
}

function requireArguments(u: number, rho: number, limbDarkeningU: number): void {
  requireArgument(Number.isFinite(u) && u >= 0, "The source's offset from the lens (in Einstein radii) must be a finite number of at least 0", u);
  requireArgument(Number.isFinite(rho) && rho > 0, "The source's radius (in Einstein radii) must be a finite number above 0", rho);
  requireArgument(limbDarkeningU >= 0 && limbDarkeningU <= 1, "The limb-darkening coefficient must lie between 0 and 1", limbDarkeningU);
}

/**
 * Magnification of a source disk of radius `rho` at offset `u` from a point lens (both in units of
 * θ_E), with linear limb darkening of coefficient `limbDarkeningU` (0: uniform). Dimensionless.
 * Domain: u ≥ 0 finite, ρ > 0 finite, 0 ≤ a ≤ 1. Method, accuracy and cost: see the file's comment.
 */
export function finiteSourceMagnification(u: number, rho: number, limbDarkeningU = 0): number {
  requireArguments(u, rho, limbDarkeningU);
  return finiteSourceSeries(u, rho, limbDarkeningU) ?? quadratureMagnification(u, rho, limbDarkeningU);
}

/**
 * The same magnification by the quadrature alone, at every offset (no series): the reference the
 * series is measured against in the bench. Same arguments, domain and accuracy; slower far from the lens.
 */
export function finiteSourceMagnificationExact(u: number, rho: number, limbDarkeningU = 0): number {
  requireArguments(u, rho, limbDarkeningU);
  return quadratureMagnification(u, rho, limbDarkeningU);
}
