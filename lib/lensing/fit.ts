/**
 * Least-squares fit of a point-lens model to the photometry of a microlensing event.
 *
 * Model: F(t) = F_s,d A(u(t)) + F_b,d for the points of dataset d, with the point-lens magnification
 * A(u) = (u² + 2)/(u √(u² + 4)) and u(t) = √(u0² + ((t − t0)/t_E)²) (B. Paczyński 1986, ApJ 304, 1);
 * with `finiteSource`, A is the magnification of a source disk of radius ρ (θ_E), finite-source.ts.
 *
 * Method:
 * - Levenberg–Marquardt (K. Levenberg 1944, Q. Appl. Math. 2, 164; D. W. Marquardt 1963, J. SIAM 11,
 *   431) by the `ml-levenberg-marquardt` package over the nonlinear parameters only (t0, u0, t_E, ρ),
 *   with every dataset's F_s and F_b solved by linear least squares at each evaluation ("variable
 *   projection", G. H. Golub & V. Pereyra 1973, SIAM J. Numer. Anal. 10, 413), and the Jacobian of the
 *   projected residuals in L. Kaufman's form (1975, BIT 15, 49), which gives the exact gradient. The
 *   package is given whitened data ((F/σ), model/σ, weights 1), because it weights the χ² it compares
 *   and the step it takes differently. It damps with λI, so each call gets the parameters scaled by
 *   their Jacobian column's norm (its λI then acts as Marquardt's λ diag(JᵀJ)). It has no convergence
 *   test of its own, so it runs in rounds of ROUND_ITERATIONS from the best point so far until the
 *   Gauss–Newton prediction of the remaining χ² decrease, gᵀ(JᵀJ)⁻¹g, is below CONVERGED_CHI2_DECREASE
 *   (each parameter within ~1e-5 σ of the minimum), or a round changes χ² by less than
 *   STATIONARY_CHI2_CHANGE with the prediction below STATIONARY_CHI2_DECREASE (the finite source's
 *   derivatives are numerical); a round that stalls with a larger prediction is reported as such.
 * - Starting points (our rule): t0 at the most significant brightening of each dataset, on a grid of u0
 *   and t_E; the profiled χ² is evaluated on the whole grid and LM runs from the best STARTS_KEPT; the
 *   lowest χ² wins. A finite-source fit starts from the point-source fit and from the best grid point,
 *   each with ρ = u0 and 3 u0.
 * - Covariance: (JᵀJ)⁻¹ of the weighted residuals at the best fit, J over all parameters including the
 *   fluxes, so the errors of t0, u0, t_E carry their correlation with the blending.
 * - `rescaleErrors` (common practice in microlensing, no single source): each dataset's errors are
 *   multiplied by k_d so that its χ² equals its share of the degrees of freedom,
 *   n_d − 2 − p·n_d/n (p the nonlinear parameters), then the fit is repeated with the scaled errors.
 * - `parallax`: annual microlens parallax (π_E,N, π_E,E) in the geocentric frame of A. Gould 2004
 *   (ApJ 606, 319, eq. 5; fit-parallax.ts), t0,par fixed (default: t0 of the fit without parallax);
 *   LM from that fit with both signs of u0 and π_E = 0 or 0.3 towards each direction.
 *
 * Accuracy: the best fit and covariance agree with scipy.optimize.least_squares (MINPACK LM, all
 * parameters free) to 1e-6 σ on synthetic events (tests/fixtures/generate_point_lens_fits.py); with
 * parallax to 0.02 σ, set by the 8e-6 au between astronomy-engine's Earth and ERFA's that scipy used.
 */

import { levenbergMarquardt } from "ml-levenberg-marquardt";
import { CholeskyDecomposition, Matrix } from "ml-matrix";
import { pointLensMagnification } from "@/lib/physics/point-lens";
import { finiteSourceMagnification } from "./finite-source";
import { checkPhotometry, FitInputError, type CheckedPhotometry, type PhotometryPoint } from "./fit-input";
import { parallaxOffsetsAu } from "./fit-parallax";
import { formatSignificant } from "@/lib/numbers/significant";

export { FitInputError, MAX_FIT_ROWS } from "./fit-input";
export type { PhotometryPoint } from "./fit-input";

export interface PointLensFitOptions {
  /**
   * Scale each dataset's errors so that its χ²/dof ≈ 1, and fit again (common practice). Default false.
   * Skipped (factors 1) when the fit with the stated errors does not converge.
   */
  rescaleErrors?: boolean;
  /** Fit the source's radius ρ (θ_E); `limbDarkeningU` is the linear limb-darkening coefficient (0..1, default 0). */
  finiteSource?: boolean | { limbDarkeningU?: number };
  /**
   * Fit the annual microlens parallax (π_E,N, π_E,E) for an event at right ascension `raDeg` and
   * declination `decDeg` (J2000, degrees); the points' times must then be Julian dates. `t0ParDays`
   * (default: t0 of the fit without parallax) is the reference time of Gould 2004's geocentric frame.
   * Both signs of u0 are tried.
   */
  parallax?: { raDeg: number; decDeg: number; t0ParDays?: number };
  /**
   * Called after every Levenberg–Marquardt round (ROUND_ITERATIONS iterations) and at the end of each
   * search, with the share of the planned searches done (0..1, never decreasing) and what the fit is
   * doing, in words.
   */
  onProgress?: (fraction: number, words: string) => void;
  /**
   * Checked before every round (an `AbortSignal` fits): once `aborted`, the fit stops and returns a
   * result with `cancelled: true`, `converged: false` and no parameters (NaN). A fit in a web worker
   * cannot see a flag set by the page while it runs (its loop never yields): the page ends the worker
   * instead (components/lensing/fit-client.ts).
   */
  signal?: { readonly aborted: boolean };
}

export interface DatasetFit {
  dataset: string;
  points: number;
  /** Flux of the lensed source and of the unlensed blend, in the dataset's flux unit. */
  sourceFlux: number;
  blendFlux: number;
  /** χ² of the dataset's points with the errors used (scaled when `rescaleErrors`). */
  chi2: number;
  /** Factor the dataset's errors were multiplied by (1 without `rescaleErrors`). */
  errorScale: number;
}

export interface PointLensFit {
  /** False when the fit did not reach a minimum; `reason` then says why in words. */
  converged: boolean;
  /** True when `signal` stopped the fit: `reason` says so, and every parameter is NaN. */
  cancelled?: boolean;
  reason: string | null;
  /**
   * Time of closest approach (days, the points' time scale), impact parameter (θ_E; ≥ 0 without
   * parallax, signed as in Gould 2004 with it), Einstein time (days).
   */
  t0Days: number;
  u0: number;
  tEDays: number;
  /** Source radius (θ_E), with `finiteSource`. */
  rho?: number;
  /** Microlens parallax components (north, east), dimensionless, with `parallax`; and the frame's reference time (days). */
  piEN?: number;
  piEE?: number;
  t0ParDays?: number;
  datasets: DatasetFit[];
  chi2: number;
  dof: number;
  /** Names of the covariance's rows and columns: t0Days, u0, tEDays, rho?, piEN?, piEE?, then sourceFlux:<dataset>, blendFlux:<dataset> per dataset. */
  parameterOrder: string[];
  /** (JᵀJ)⁻¹ of the weighted residuals, in the units of the parameters; empty when JᵀJ is singular. */
  covariance: number[][];
  /** Levenberg–Marquardt iterations over all starting points. */
  iterations: number;
}

/** Iterations per call of the package before the convergence test (it has none of its own). */
const ROUND_ITERATIONS = 10;
/** Rounds per starting point: 300 iterations in all (a point-lens fit needs ~10–30). */
const MAX_ROUNDS = 30;
/** Converged when the Gauss–Newton χ² decrease still predicted is below this (in units of χ²/dof when above 1). */
const CONVERGED_CHI2_DECREASE = 1e-10;
/**
 * Also converged when a whole round lowers χ² by less than this, relative (MINPACK's ftol test): where
 * the model's derivatives are numerical (finite source) the Gauss–Newton prediction carries their noise.
 */
const STATIONARY_CHI2_CHANGE = 1e-12;
/** …provided the predicted decrease is below this (a parameter within ~1e-2 σ of the minimum); else the search has stalled. */
const STATIONARY_CHI2_DECREASE = 1e-4;
/** Starting grid (our rule: spans the events a survey alerts on). */
const START_U0 = [0.01, 0.05, 0.15, 0.4, 1];
const START_TE_DAYS = [3, 8, 20, 50, 120];
const STARTS_KEPT = 3;
const START_RHO_PER_U0 = [1, 3];
/** Bounds of the search (our rule); a fit that ends on one is reported as not converged. */
const U0_MIN = 1e-5;
const U0_MAX = 10;
const TE_MIN_DAYS = 0.05;
const TE_MAX_DAYS = 3000;
const RHO_MIN = 1e-4;
const RHO_MAX = 10;
const PI_E_MAX = 5;
/** Parallax starts (our rule): none, and 0.3 towards each of the four directions, with each sign of u0. */
const START_PI_E = [
  [0, 0],
  [0.3, 0],
  [-0.3, 0],
  [0, 0.3],
  [0, -0.3],
];
/** Relative step of the finite-source magnification's numerical derivatives. */
const FINITE_SOURCE_STEP = 1e-5;

type Magnify = (u: number, rho: number) => number;

/** Nonlinear parameters inside the search: [(t0 − tRef)/tScale, u0, ln t_E, (ln ρ), (π_E,N, π_E,E)]. */
interface Frame {
  tRefDays: number;
  tScaleDays: number;
  finite: boolean;
  /** Gould 2004's Δs of each point (au), with parallax. */
  parallax: { north: Float64Array; east: Float64Array; t0ParDays: number } | null;
}

function parameterCountOf(frame: Frame): number {
  return 3 + (frame.finite ? 1 : 0) + (frame.parallax ? 2 : 0);
}

class Problem {
  readonly n: number;
  readonly datasetCount: number;
  /** Times relative to the frame's reference (days). */
  readonly t: Float64Array;
  readonly weight: Float64Array;
  readonly a: Float64Array;
  /** ∂A/∂q_k for each nonlinear parameter k, point-major. */
  readonly da: Float64Array;
  readonly sourceFlux: Float64Array;
  readonly blendFlux: Float64Array;
  /** Each dataset's weighted mean magnification ā and Σw²(A − ā)², as `solveFluxes` last found them. */
  readonly meanA: Float64Array;
  readonly spreadA: Float64Array;
  readonly p: number;

  constructor(
    readonly data: CheckedPhotometry,
    readonly frame: Frame,
    readonly magnify: Magnify,
    errorScale: number[],
  ) {
    this.n = data.tDays.length;
    this.datasetCount = data.datasets.length;
    this.p = parameterCountOf(frame);
    this.t = data.tDays.map((t) => t - frame.tRefDays);
    this.weight = new Float64Array(this.n);
    for (let i = 0; i < this.n; i++) this.weight[i] = 1 / (data.fluxErr[i] * errorScale[data.datasetIndex[i]]);
    this.a = new Float64Array(this.n);
    this.da = new Float64Array(this.n * this.p);
    this.sourceFlux = new Float64Array(this.datasetCount);
    this.blendFlux = new Float64Array(this.datasetCount);
    this.meanA = new Float64Array(this.datasetCount);
    this.spreadA = new Float64Array(this.datasetCount);
  }

  /** Magnifications (and, if asked, their derivatives by the internal parameters) at `q`. */
  magnifications(q: ArrayLike<number>, withDerivatives: boolean): void {
    const { t, a, da, p } = this;
    const { tScaleDays, finite, parallax } = this.frame;
    const t0 = q[0] * tScaleDays;
    const u0 = q[1];
    const tE = Math.exp(q[2]);
    const rho = finite ? Math.exp(q[3]) : 0;
    const piN = parallax ? q[p - 2] : 0;
    const piE = parallax ? q[p - 1] : 0;
    for (let i = 0; i < this.n; i++) {
      const tau0 = (t[i] - t0) / tE;
      const sN = parallax ? parallax.north[i] : 0;
      const sE = parallax ? parallax.east[i] : 0;
      // Gould 2004 eq. 5: τ = τ0 + π_E·Δs, β = u0 + π_E × Δs.
      const tau = tau0 + piN * sN + piE * sE;
      const beta = u0 + piN * sE - piE * sN;
      const u = Math.sqrt(tau * tau + beta * beta);
      let dadu: number;
      if (finite) {
        a[i] = this.magnify(u, rho);
        if (!withDerivatives) continue;
        const hu = FINITE_SOURCE_STEP * Math.max(u, rho);
        dadu = u > hu ? (this.magnify(u + hu, rho) - this.magnify(u - hu, rho)) / (2 * hu) : (this.magnify(u + hu, rho) - a[i]) / hu;
        const hr = FINITE_SOURCE_STEP * rho;
        da[i * p + 3] = (rho * (this.magnify(u, rho + hr) - this.magnify(u, rho - hr))) / (2 * hr);
      } else {
        a[i] = pointLensMagnification(u);
        if (!withDerivatives) continue;
        const s2 = u * u + 4;
        dadu = -8 / (u * u * s2 * Math.sqrt(s2));
      }
      const dTau = u > 0 ? (dadu * tau) / u : 0;
      const dBeta = u > 0 ? (dadu * beta) / u : 0;
      da[i * p] = (-dTau * tScaleDays) / tE;
      da[i * p + 1] = dBeta;
      da[i * p + 2] = -dTau * tau0;
      if (parallax) {
        da[i * p + p - 2] = dTau * sN + dBeta * sE;
        da[i * p + p - 1] = dTau * sE - dBeta * sN;
      }
    }
  }

  /**
   * Each dataset's F_s, F_b by weighted linear least squares on the current magnifications, from sums
   * about the weighted means (F_s = Σw²(A − ā)(f − f̄) / Σw²(A − ā)², F_b = f̄ − F_s ā): the raw normal
   * equations' determinant ΣA²Σ1 − (ΣA)² cancels to zero where every A is 1 + 10⁻¹⁰ (a search that
   * wandered to a tiny t_E), and the fluxes came out NaN. A dataset whose magnifications do not vary at
   * all has no source flux to find: F_s = 0 and F_b = f̄ (the constant that fits it best).
   */
  solveFluxes(): void {
    const count = this.datasetCount;
    const sums = new Float64Array(count * 3);
    for (let i = 0; i < this.n; i++) {
      const d = this.data.datasetIndex[i] * 3;
      const w2 = this.weight[i] * this.weight[i];
      sums[d] += w2;
      sums[d + 1] += w2 * this.a[i];
      sums[d + 2] += w2 * this.data.flux[i];
    }
    const meanF = new Float64Array(count);
    for (let d = 0; d < count; d++) {
      this.meanA[d] = sums[d * 3 + 1] / sums[d * 3];
      meanF[d] = sums[d * 3 + 2] / sums[d * 3];
    }
    const spreadA = this.spreadA.fill(0);
    const cross = new Float64Array(count);
    for (let i = 0; i < this.n; i++) {
      const d = this.data.datasetIndex[i];
      const w2 = this.weight[i] * this.weight[i];
      const da = this.a[i] - this.meanA[d];
      spreadA[d] += w2 * da * da;
      cross[d] += w2 * da * (this.data.flux[i] - meanF[d]);
    }
    for (let d = 0; d < count; d++) {
      this.sourceFlux[d] = spreadA[d] > 0 ? cross[d] / spreadA[d] : 0;
      this.blendFlux[d] = meanF[d] - this.sourceFlux[d] * this.meanA[d];
    }
  }

  /** Model flux of point i with the current magnifications and fluxes. */
  model(i: number): number {
    const d = this.data.datasetIndex[i];
    return this.sourceFlux[d] * this.a[i] + this.blendFlux[d];
  }

  /** Profiled χ² at `q` (fluxes solved); leaves magnifications and fluxes in place. */
  chi2At(q: ArrayLike<number>): number {
    this.magnifications(q, false);
    this.solveFluxes();
    return this.chi2();
  }

  chi2(): number {
    let sum = 0;
    for (let i = 0; i < this.n; i++) {
      const r = (this.data.flux[i] - this.model(i)) * this.weight[i];
      sum += r * r;
    }
    return sum;
  }

  /**
   * Kaufman's Jacobian of the whitened model at `q` with the fluxes projected out, point-major n×p:
   * each column w F_s ∂A/∂q_k minus its projection on the dataset's span of (wA, w).
   */
  projectedJacobian(q: ArrayLike<number>): Float64Array {
    const { n, p } = this;
    this.magnifications(q, true);
    this.solveFluxes();
    // The dataset's span of (wA, w) has the orthogonal basis (w(A − ā), w) under its weights, so each
    // column's projection is two independent ratios, with no determinant to cancel (see solveFluxes).
    const jac = new Float64Array(n * p);
    const weightSums = new Float64Array(this.datasetCount);
    const projections = new Float64Array(this.datasetCount * p * 2);
    for (let i = 0; i < n; i++) {
      const d = this.data.datasetIndex[i];
      const w = this.weight[i];
      const b1 = w * (this.a[i] - this.meanA[d]);
      weightSums[d] += w * w;
      for (let k = 0; k < p; k++) {
        const g = w * this.sourceFlux[d] * this.da[i * p + k];
        jac[i * p + k] = g;
        projections[(d * p + k) * 2] += b1 * g;
        projections[(d * p + k) * 2 + 1] += w * g;
      }
    }
    for (let d = 0; d < this.datasetCount; d++) {
      for (let k = 0; k < p; k++) {
        const at = (d * p + k) * 2;
        projections[at] = this.spreadA[d] > 0 ? projections[at] / this.spreadA[d] : 0;
        projections[at + 1] /= weightSums[d];
      }
    }
    for (let i = 0; i < n; i++) {
      const d = this.data.datasetIndex[i];
      const w = this.weight[i];
      for (let k = 0; k < p; k++) {
        jac[i * p + k] -= projections[(d * p + k) * 2] * w * (this.a[i] - this.meanA[d]) + projections[(d * p + k) * 2 + 1] * w;
      }
    }
    return jac;
  }

  /** gᵀ(JᵀJ)⁻¹g at `q` with g = Jᵀr: the χ² decrease a Gauss–Newton step predicts; NaN if JᵀJ is singular. */
  predictedDecrease(q: ArrayLike<number>): number {
    const { n, p } = this;
    const jac = this.projectedJacobian(q);
    const normal = Matrix.zeros(p, p);
    const gradient = Matrix.zeros(p, 1);
    for (let i = 0; i < n; i++) {
      const r = (this.data.flux[i] - this.model(i)) * this.weight[i];
      for (let k = 0; k < p; k++) {
        gradient.set(k, 0, gradient.get(k, 0) + jac[i * p + k] * r);
        for (let l = 0; l <= k; l++) normal.set(k, l, normal.get(k, l) + jac[i * p + k] * jac[i * p + l]);
      }
    }
    for (let k = 0; k < p; k++) for (let l = 0; l < k; l++) normal.set(l, k, normal.get(k, l));
    const cholesky = new CholeskyDecomposition(normal);
    if (!cholesky.isPositiveDefinite()) return Number.NaN;
    return gradient.transpose().mmul(cholesky.solve(gradient)).get(0, 0);
  }
}

interface Search {
  q: number[];
  chi2: number;
  converged: boolean;
  reason: string | null;
  iterations: number;
}

function bounds(problem: Problem): { min: number[]; max: number[] } {
  const { t } = problem;
  let lo = Infinity;
  let hi = -Infinity;
  for (const value of t) {
    lo = Math.min(lo, value);
    hi = Math.max(hi, value);
  }
  const margin = hi - lo + 100;
  const scale = problem.frame.tScaleDays;
  const min = [(lo - margin) / scale, problem.frame.parallax ? -U0_MAX : U0_MIN, Math.log(TE_MIN_DAYS)];
  const max = [(hi + margin) / scale, U0_MAX, Math.log(TE_MAX_DAYS)];
  if (problem.frame.finite) {
    min.push(Math.log(RHO_MIN));
    max.push(Math.log(RHO_MAX));
  }
  if (problem.frame.parallax) {
    min.push(-PI_E_MAX, -PI_E_MAX);
    max.push(PI_E_MAX, PI_E_MAX);
  }
  return { min, max };
}

/** Thrown inside the fit when `signal` is aborted; fitPointLens turns it into a cancelled result. */
class FitCancelled extends Error {}

/** Progress over the searches a fit plans (`planned`), reported after each round; the cancellation check. */
class FitProgress {
  private done = 0;
  constructor(
    private planned: number,
    private readonly options: Pick<PointLensFitOptions, "onProgress" | "signal">,
  ) {}

  /** Before round `round` of the current search: stops the fit when cancelled, else reports. */
  round(round: number, stage: string): void {
    if (this.options.signal?.aborted) throw new FitCancelled();
    if (round === 0 || !this.options.onProgress) return;
    const fraction = Math.min(1, (this.done + round / MAX_ROUNDS) / this.planned);
    this.options.onProgress(fraction, `${stage}: search ${this.done + 1} of ${this.planned}, ${round * ROUND_ITERATIONS} iterations`);
  }

  searchDone(stage: string): void {
    this.done += 1;
    this.planned = Math.max(this.planned, this.done);
    this.options.onProgress?.(this.done / this.planned, `${stage}: ${this.done} of ${this.planned} searches done`);
  }
}

/** Levenberg–Marquardt by the package from `start`, in rounds until the predicted χ² decrease is negligible. */
function search(problem: Problem, start: number[], progress: FitProgress, stage: string): Search {
  const { n, p } = problem;
  const { min, max } = bounds(problem);
  const x = Float64Array.from({ length: n }, (_, i) => i);
  const y = Float64Array.from({ length: n }, (_, i) => problem.weight[i] * problem.data.flux[i]);
  const whitenedModel = new Float64Array(n);
  // The package damps with λI; each round hands it the parameters scaled by their Jacobian column's
  // norm there (q_k d_k), so that its λI is Marquardt's λ diag(JᵀJ) and means the same in any unit.
  const scale = new Float64Array(p);
  const unscaled = (scaled: number[]) => scaled.map((value, k) => value / scale[k]);
  const parameterizedFunction = (scaled: number[]) => {
    problem.magnifications(unscaled(scaled), false);
    problem.solveFluxes();
    for (let i = 0; i < n; i++) whitenedModel[i] = problem.weight[i] * problem.model(i);
    return (i: number) => whitenedModel[i];
  };
  const jacobianFunction = (scaled: number[]) => {
    const jac = problem.projectedJacobian(unscaled(scaled));
    for (let k = 0; k < jac.length; k++) jac[k] /= scale[k % p];
    return (i: number) => jac.subarray(i * p, i * p + p) as unknown as number[];
  };
  let q = start.slice();
  let iterations = 0;
  let previousChi2 = problem.chi2At(q);
  let lastFall = Number.NaN;
  for (let round = 0; round < MAX_ROUNDS; round++) {
    progress.round(round, stage);
    const jac = problem.projectedJacobian(q);
    scale.fill(0);
    for (let k = 0; k < jac.length; k++) scale[k % p] += jac[k] * jac[k];
    for (let k = 0; k < p; k++) scale[k] = scale[k] > 0 && Number.isFinite(scale[k]) ? Math.sqrt(scale[k]) : 1;
    const result = levenbergMarquardt({ x, y }, parameterizedFunction, {
      initialValues: q.map((value, k) => value * scale[k]),
      minValues: min.map((value, k) => value * scale[k]),
      maxValues: max.map((value, k) => value * scale[k]),
      maxIterations: ROUND_ITERATIONS,
      errorTolerance: 0,
      jacobianFunction,
    });
    q = unscaled(result.parameterValues);
    iterations += result.iterations;
    const chi2 = problem.chi2At(q);
    const decrease = problem.predictedDecrease(q);
    const dof = n - p - 2 * problem.datasetCount;
    if (!Number.isFinite(chi2)) return { q, chi2, converged: false, reason: "the model could not be evaluated at the parameters reached", iterations };
    if (Number.isNaN(decrease)) return { q, chi2, converged: false, reason: "the data do not constrain every parameter (the fit's matrix is singular)", iterations };
    const isStationary = previousChi2 - chi2 <= STATIONARY_CHI2_CHANGE * chi2;
    const noise = Math.max(1, chi2 / dof);
    if (decrease <= CONVERGED_CHI2_DECREASE * noise || (isStationary && decrease <= STATIONARY_CHI2_DECREASE * noise)) return { q, chi2, converged: true, reason: null, iterations };
    if (isStationary) return { q, chi2, converged: false, reason: `the search stalled: χ² no longer falls, yet a step is predicted to lower it by ${formatSignificant(decrease, 2)}`, iterations };
    lastFall = previousChi2 - chi2;
    previousChi2 = chi2;
  }
  const chi2 = problem.chi2At(q);
  return { q, chi2, converged: false, reason: `χ² was still falling (by ${formatSignificant(lastFall, 2)} in the last ${ROUND_ITERATIONS} iterations) after ${iterations} iterations`, iterations };
}

/** t0 candidates (days, relative to the frame): each dataset's most significant bright point and its brightest 5-point run. */
function startTimes(problem: Problem): number[] {
  const { data, t } = problem;
  const candidates: number[] = [];
  for (let d = 0; d < problem.datasetCount; d++) {
    const rows: number[] = [];
    for (let i = 0; i < problem.n; i++) if (data.datasetIndex[i] === d) rows.push(i);
    const sorted = rows.map((i) => data.flux[i]).sort((a, b) => a - b);
    const median = sorted[Math.floor(sorted.length / 2)];
    let best = rows[0];
    let bestRun = rows[0];
    let bestRunFlux = -Infinity;
    for (let r = 0; r < rows.length; r++) {
      const i = rows[r];
      if ((data.flux[i] - median) / data.fluxErr[i] > (data.flux[best] - median) / data.fluxErr[best]) best = i;
      const run = rows.slice(Math.max(0, r - 2), r + 3);
      const mean = run.reduce((sum, j) => sum + data.flux[j], 0) / run.length;
      if (mean > bestRunFlux) {
        bestRunFlux = mean;
        bestRun = i;
      }
    }
    candidates.push(t[best], t[bestRun]);
  }
  return candidates.filter((value, index) => candidates.findIndex((other) => Math.abs(other - value) < 0.5) === index);
}

function pointSourceStarts(problem: Problem): number[][] {
  const scored: { q: number[]; chi2: number }[] = [];
  for (const t0 of startTimes(problem)) {
    for (const u0 of START_U0) {
      for (const tE of START_TE_DAYS) {
        const q = [t0 / problem.frame.tScaleDays, u0, Math.log(tE)];
        const chi2 = problem.chi2At(q);
        if (Number.isFinite(chi2)) scored.push({ q, chi2 });
      }
    }
  }
  scored.sort((a, b) => a.chi2 - b.chi2);
  return scored.slice(0, STARTS_KEPT).map((start) => start.q);
}

function bestOf(searches: Search[]): Search {
  return searches.reduce((best, next) => {
    if (next.converged !== best.converged) return next.converged ? next : best;
    return next.chi2 < best.chi2 ? next : best;
  });
}

interface ModelSpec {
  finite: boolean;
  limbDarkeningU: number;
  parallax: { raDeg: number; decDeg: number; t0ParDays?: number } | null;
}

interface Fitted {
  problem: Problem;
  best: Search;
  iterations: number;
}

function searchAll(problem: Problem, starts: number[][], iterationsBefore: number, progress: FitProgress, stage: string): Fitted {
  const searches = starts.map((start) => {
    const result = search(problem, start, progress, stage);
    progress.searchDone(stage);
    return result;
  });
  return { problem, best: bestOf(searches), iterations: iterationsBefore + searches.reduce((sum, s) => sum + s.iterations, 0) };
}

/**
 * The fit of `spec`: point source from the grid, then (if asked) the finite source from it, then
 * the parallax from that with both signs of u0. With `previous` (same spec), one search from its
 * best point in its frame (the refit with rescaled errors).
 */
function fitModel(data: CheckedPhotometry, spec: ModelSpec, errorScale: number[], previous: Fitted | null, progress: FitProgress): Fitted {
  const magnify: Magnify = (u, rho) => finiteSourceMagnification(u, rho, spec.limbDarkeningU);
  if (previous) return searchAll(new Problem(data, previous.problem.frame, magnify, errorScale), [previous.best.q], 0, progress, "Refit with the rescaled errors");
  let lo = Infinity;
  let hi = -Infinity;
  for (const value of data.tDays) {
    lo = Math.min(lo, value);
    hi = Math.max(hi, value);
  }
  const frame: Frame = { tRefDays: (lo + hi) / 2, tScaleDays: 10, finite: false, parallax: null };
  const pointSource = new Problem(data, frame, magnify, errorScale);
  const gridStarts = pointSourceStarts(pointSource);
  let fitted = searchAll(pointSource, gridStarts, 0, progress, "Point source");
  if (spec.finite) {
    // From the point-source fit and from the best grid point, each with ρ a multiple of u0: where the
    // source's disk shapes the peak, the point-source fit itself can be far off.
    const lnRho = (u0: number, ratio: number) => Math.log(Math.min(RHO_MAX, Math.max(RHO_MIN, ratio * u0)));
    const starts = [fitted.best.q, gridStarts[0]].flatMap((q) => START_RHO_PER_U0.map((ratio) => [...q.slice(0, 3), lnRho(q[1], ratio)]));
    fitted = searchAll(new Problem(data, { ...frame, finite: true }, magnify, errorScale), starts, fitted.iterations, progress, "Finite source");
  }
  if (spec.parallax) {
    const t0ParDays = spec.parallax.t0ParDays ?? frame.tRefDays + fitted.best.q[0] * frame.tScaleDays;
    const offsets = parallaxOffsetsAu(data.tDays, spec.parallax.raDeg, spec.parallax.decDeg, t0ParDays);
    const parallaxFrame: Frame = { ...fitted.problem.frame, parallax: { ...offsets, t0ParDays } };
    const q = fitted.best.q;
    const starts = [1, -1].flatMap((sign) => START_PI_E.map((piE) => [q[0], sign * Math.abs(q[1]), ...q.slice(2), ...piE]));
    fitted = searchAll(new Problem(data, parallaxFrame, magnify, errorScale), starts, fitted.iterations, progress, "Parallax");
  }
  return fitted;
}

/** The bound a search ended on, in words, or null. */
function boundReached(problem: Problem, q: number[]): string | null {
  const { min, max } = bounds(problem);
  const names = [
    "the peak time",
    "the impact parameter",
    "the Einstein time",
    ...(problem.frame.finite ? ["the source radius"] : []),
    ...(problem.frame.parallax ? ["the parallax's north component", "the parallax's east component"] : []),
  ];
  for (let k = 0; k < q.length; k++) {
    const span = max[k] - min[k];
    if (k === 1 && !problem.frame.parallax && q[k] <= min[k]) continue; // u0 → 0 is a legitimate high-magnification fit
    if (q[k] <= min[k] + 1e-4 * span || q[k] >= max[k] - 1e-4 * span) return `${names[k]} ran to the limit of the search`;
  }
  return null;
}

/** Full Jacobian (fluxes as parameters) and (JᵀJ)⁻¹ in the reported parametrisation. */
function covarianceAt(problem: Problem, q: number[]): number[][] {
  const { n, p, datasetCount } = problem;
  problem.magnifications(q, true);
  problem.solveFluxes();
  const size = p + 2 * datasetCount;
  const tE = Math.exp(q[2]);
  // d(internal)/d(reported): t0 → q0 = t0/tScale, tE → ln tE, ρ → ln ρ; u0 and π_E as they are.
  const chain = [1 / problem.frame.tScaleDays, 1, 1 / tE];
  if (problem.frame.finite) chain.push(1 / Math.exp(q[3]));
  if (problem.frame.parallax) chain.push(1, 1);
  const normal = Matrix.zeros(size, size);
  const row = new Float64Array(size);
  for (let i = 0; i < n; i++) {
    const d = problem.data.datasetIndex[i];
    const w = problem.weight[i];
    row.fill(0);
    for (let k = 0; k < p; k++) row[k] = w * problem.sourceFlux[d] * problem.da[i * p + k] * chain[k];
    row[p + 2 * d] = w * problem.a[i];
    row[p + 2 * d + 1] = w;
    for (let k = 0; k < size; k++) {
      if (row[k] === 0) continue;
      for (let l = 0; l <= k; l++) normal.set(k, l, normal.get(k, l) + row[k] * row[l]);
    }
  }
  for (let k = 0; k < size; k++) for (let l = 0; l < k; l++) normal.set(l, k, normal.get(k, l));
  const cholesky = new CholeskyDecomposition(normal);
  if (!cholesky.isPositiveDefinite()) return [];
  return cholesky.solve(Matrix.eye(size)).to2DArray();
}

/** Per-dataset χ² with the problem's current weights, magnifications and fluxes. */
function datasetChi2(problem: Problem): number[] {
  const chi2 = new Array<number>(problem.datasetCount).fill(0);
  for (let i = 0; i < problem.n; i++) {
    const r = (problem.data.flux[i] - problem.model(i)) * problem.weight[i];
    chi2[problem.data.datasetIndex[i]] += r * r;
  }
  return chi2;
}

/** Julian dates the ephemeris serves (our rule: 1900 to 2100). */
const PARALLAX_MIN_JD = 2_415_020.5;
const PARALLAX_MAX_JD = 2_488_069.5;

function checkParallaxOptions(parallax: { raDeg: number; decDeg: number; t0ParDays?: number }): void {
  if (!(Number.isFinite(parallax.raDeg) && parallax.raDeg >= 0 && parallax.raDeg < 360)) throw new FitInputError(`The event's right ascension must be 0 to 360 degrees (got ${parallax.raDeg}).`);
  if (!(Number.isFinite(parallax.decDeg) && Math.abs(parallax.decDeg) <= 90)) throw new FitInputError(`The event's declination must be −90 to +90 degrees (got ${parallax.decDeg}).`);
  const t0Par = parallax.t0ParDays;
  if (t0Par !== undefined && !(t0Par >= PARALLAX_MIN_JD && t0Par <= PARALLAX_MAX_JD)) throw new FitInputError(`The parallax reference time must be a Julian date between 1900 and 2100 (got ${t0Par}).`);
}

function checkJulianDates(tDays: Float64Array): void {
  const row = tDays.findIndex((t) => !(t >= PARALLAX_MIN_JD && t <= PARALLAX_MAX_JD));
  if (row >= 0) throw new FitInputError(`Row ${row + 1}: a parallax fit needs times as Julian dates between 1900 and 2100 (got ${tDays[row]}).`, row + 1, "time");
}

/** What a cancelled fit returns: no parameter (NaN), no covariance, and the reason in words. */
function cancelledFit(data: CheckedPhotometry, dof: number): PointLensFit {
  return {
    converged: false,
    cancelled: true,
    reason: "The fit was cancelled before it finished; nothing was fitted.",
    t0Days: Number.NaN,
    u0: Number.NaN,
    tEDays: Number.NaN,
    datasets: data.datasets.map((dataset, d) => ({ dataset, points: data.counts[d], sourceFlux: Number.NaN, blendFlux: Number.NaN, chi2: Number.NaN, errorScale: Number.NaN })),
    chi2: Number.NaN,
    dof,
    parameterOrder: [],
    covariance: [],
    iterations: 0,
  };
}

/**
 * Fits a point-lens light curve to `points` (time in days on one scale, e.g. a Julian date; flux
 * and 1σ error in one linear unit per dataset). Without options: point source, blending per dataset,
 * the stated errors (no rescaling). Returns the best fit, χ², degrees of freedom and the covariance
 * (`parameterOrder` names its rows); a fit that does not converge is returned with
 * `converged: false` and the reason. `onProgress` hears how far it is; `signal` stops it (then
 * `cancelled: true`, no parameters). Throws `FitInputError` for unusable photometry (fit-input.ts).
 * Method, sources and accuracy: the file's comment.
 */
export function fitPointLens(points: readonly PhotometryPoint[], options: PointLensFitOptions = {}): PointLensFit {
  const finite = options.finiteSource !== undefined && options.finiteSource !== false;
  const limbDarkeningU = typeof options.finiteSource === "object" ? (options.finiteSource.limbDarkeningU ?? 0) : 0;
  if (!(limbDarkeningU >= 0 && limbDarkeningU <= 1)) throw new FitInputError(`The limb-darkening coefficient must lie between 0 and 1 (got ${limbDarkeningU}).`);
  const parallax = options.parallax ?? null;
  if (parallax) checkParallaxOptions(parallax);
  const nonlinear = 3 + (finite ? 1 : 0) + (parallax ? 2 : 0);
  const data = checkPhotometry(points, (datasetCount) => nonlinear + 2 * datasetCount);
  if (parallax) checkJulianDates(data.tDays);
  const spec: ModelSpec = { finite, limbDarkeningU, parallax };
  const n = data.tDays.length;
  const dof = n - nonlinear - 2 * data.datasets.length;
  let errorScale = data.datasets.map(() => 1);
  const plannedSearches = STARTS_KEPT + (finite ? 2 * START_RHO_PER_U0.length : 0) + (parallax ? 2 * START_PI_E.length : 0) + (options.rescaleErrors ? 1 : 0);
  const progress = new FitProgress(plannedSearches, options);
  let fitted: Fitted;
  let iterations: number;
  try {
    fitted = fitModel(data, spec, errorScale, null, progress);
    iterations = fitted.iterations;
    if (options.rescaleErrors && fitted.best.converged) {
      fitted.problem.chi2At(fitted.best.q);
      const chi2 = datasetChi2(fitted.problem);
      errorScale = chi2.map((value, d) => Math.sqrt(value / (data.counts[d] - 2 - (nonlinear * data.counts[d]) / n)));
      fitted = fitModel(data, spec, errorScale, fitted, progress);
      iterations += fitted.iterations;
    }
  } catch (error) {
    if (error instanceof FitCancelled) return cancelledFit(data, dof);
    throw error;
  }
  const { problem, best } = fitted;
  const q = best.q;
  const bound = best.converged ? boundReached(problem, q) : null;
  const covariance = covarianceAt(problem, q);
  const chi2PerDataset = datasetChi2(problem);
  const converged = best.converged && bound === null && covariance.length > 0;
  const reason = best.reason ?? bound ?? (covariance.length === 0 ? "the data do not constrain every parameter (the fit's matrix is singular)" : null);
  const result: PointLensFit = {
    converged,
    reason: converged ? null : `The fit did not converge: ${reason}.`,
    t0Days: problem.frame.tRefDays + q[0] * problem.frame.tScaleDays,
    u0: q[1],
    tEDays: Math.exp(q[2]),
    datasets: data.datasets.map((dataset, d) => ({
      dataset,
      points: data.counts[d],
      sourceFlux: problem.sourceFlux[d],
      blendFlux: problem.blendFlux[d],
      chi2: chi2PerDataset[d],
      errorScale: errorScale[d],
    })),
    chi2: chi2PerDataset.reduce((sum, value) => sum + value, 0),
    dof,
    parameterOrder: [
      "t0Days",
      "u0",
      "tEDays",
      ...(finite ? ["rho"] : []),
      ...(parallax ? ["piEN", "piEE"] : []),
      ...data.datasets.flatMap((dataset) => [`sourceFlux:${dataset}`, `blendFlux:${dataset}`]),
    ],
    covariance,
    iterations,
  };
  if (finite) result.rho = Math.exp(q[3]);
  if (problem.frame.parallax) {
    result.piEN = q[nonlinear - 2];
    result.piEE = q[nonlinear - 1];
    result.t0ParDays = problem.frame.parallax.t0ParDays;
  }
  options.onProgress?.(1, converged ? "The fit converged." : "The fit stopped without converging.");
  return result;
}
