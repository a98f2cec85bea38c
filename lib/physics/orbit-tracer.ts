/**
 * Bound timelike orbits of a test mass around a Schwarzschild mass, traced for drawing and for the
 * periastron advance. Geometrized units: p (semi-latus rectum) and M in one unit of length; the
 * output in units of M.
 *
 * The orbit has Schwarzschild-coordinate periastron p/(1+e) and apastron p/(1-e). It is written in
 * the relativistic anomaly chi, r = p/(1 + e cos chi), where polar angle and coordinate time are
 * quadratures of smooth periodic functions (C. Darwin 1961, Proc. R. Soc. A 263, 39; C. Cutler,
 * D. Kennefick & E. Poisson 1994, Phys. Rev. D 50, 3816, eqs. 2.6-2.8), with M = 1:
 *   dphi/dchi = sqrt(p / (p - 6 - 2e cos chi)),
 *   dt/dchi = p^2 sqrt(((p - 2)^2 - 4e^2)/(p - 6 - 2e cos chi)) / ((p - 2 - 2e cos chi)(1 + e cos chi)^2).
 * (Integrating the orbit equation d^2u/dphi^2 in phi instead amplifies the local error near the
 * separatrix p = 6 + 2e, where the orbit whirls about the unstable circular orbit: at rtol 1e-10 it
 * was off by 7e-5 rad per orbit at p = 7.01, e = 0.5, and 0.08 rad at p = 6.0021, e = 0.001.)
 * Both are integrated over [0, pi] by adaptive Gauss-Legendre panels (the rest of an orbit follows by
 * symmetry), with p - 6 - 2e cos chi = (p - 6 - 2e) + 4e sin^2(chi/2) so that nothing cancels near
 * periastron, and phi - chi is integrated rather than phi, so that the advance does not cancel
 * against 2 pi. Samples are uniform in phi: chi at each by Newton within its panel.
 */

import { domainError, requirePositive } from "./domain";
import { advanceFromMassOverP } from "./relativistic-effects";

/** A traced bound orbit. */
export interface TracedOrbit {
  /** Interleaved x, y in units of M, periastron first on the +x axis. */
  xy: Float64Array;
  /** Coordinate time at each sample, units of M, 0 at the first periastron. */
  t: Float64Array;
  count: number;
  /** Periastron advance per radial period from the quadrature, radians. */
  periastronAdvance: number;
  /** The exact advance per radial period (closed form, exactPeriastronAdvance), radians. */
  periastronAdvanceExact: number;
  /** The first-order advance 6 pi M/p, radians. */
  periastronAdvanceFirstOrder: number;
  /** Coordinate time of one radial period (periastron to periastron), units of M. */
  radialPeriod: number;
}

/** Options of traceBoundOrbit. */
export interface OrbitTraceOptions {
  /** Radial periods to trace (integer 1..100, default 3). */
  orbits?: number;
  /** Samples along the whole path (>= 2, default 2048). */
  samples?: number;
  /** Relative tolerance of each quadrature panel (default 1e-10). */
  rtol?: number;
}

/** Gauss-Legendre order of a panel. */
const GAUSS_ORDER = 12;
/** Panels of [0, pi] at most; near the separatrix the periastron peak needs ~2 per halving of its width. */
const MAX_PANELS = 4096;
/** Newton steps for chi at a sample (quadratic convergence from the panel's linear estimate). */
const MAX_NEWTON_STEPS = 12;

/** Gauss-Legendre nodes and weights on [-1, 1] (Newton on the Legendre recurrence; Abramowitz & Stegun 25.4.29). */
const [GAUSS_NODES, GAUSS_WEIGHTS] = (() => {
  const nodes = new Float64Array(GAUSS_ORDER);
  const weights = new Float64Array(GAUSS_ORDER);
  for (let i = 0; i < GAUSS_ORDER; i++) {
    let x = Math.cos((Math.PI * (i + 0.75)) / (GAUSS_ORDER + 0.5));
    let derivative = 1;
    for (let iteration = 0; iteration < 100; iteration++) {
      let p0 = 1;
      let p1 = x;
      for (let k = 2; k <= GAUSS_ORDER; k++) [p0, p1] = [p1, ((2 * k - 1) * x * p1 - (k - 1) * p0) / k];
      derivative = (GAUSS_ORDER * (x * p1 - p0)) / (x * x - 1);
      const step = p1 / derivative;
      x -= step;
      if (Math.abs(step) < 1e-17) break;
    }
    nodes[i] = x;
    weights[i] = 2 / ((1 - x * x) * derivative * derivative);
  }
  return [nodes, weights];
})();

/** The integrands of one orbit, M = 1. */
class OrbitIntegrands {
  private readonly rootP: number;
  private readonly timeFactor: number;

  constructor(
    private readonly p: number,
    private readonly e: number,
    /** p - 6 - 2e: both subtractions are exact near the separatrix (Sterbenz), where it matters */
    private readonly gap: number,
  ) {
    this.rootP = Math.sqrt(p);
    this.timeFactor = p * p * Math.sqrt((p - 2 - 2 * e) * (p - 2 + 2 * e));
  }

  /** dphi/dchi - 1 = (6 + 2e cos chi) / (s (sqrt(p) + s)), s = sqrt(p - 6 - 2e cos chi). */
  angleExcessRate(chi: number): number {
    const half = Math.sin(0.5 * chi);
    const s = Math.sqrt(this.gap + 4 * this.e * half * half);
    return (6 + 2 * this.e * Math.cos(chi)) / (s * (this.rootP + s));
  }

  timeRate(chi: number): number {
    const half = Math.sin(0.5 * chi);
    const peri = 4 * this.e * half * half;
    const onePlus = 1 + this.e * Math.cos(chi);
    return this.timeFactor / (Math.sqrt(this.gap + peri) * (this.p - 2 - 2 * this.e + peri) * onePlus * onePlus);
  }
}

/** Gauss-Legendre integrals of phi - chi and t over [a, b]. */
function panelIntegrals(integrands: OrbitIntegrands, a: number, b: number): [number, number] {
  const middle = 0.5 * (a + b);
  const halfWidth = 0.5 * (b - a);
  let angle = 0;
  let time = 0;
  for (let i = 0; i < GAUSS_ORDER; i++) {
    const chi = middle + halfWidth * GAUSS_NODES[i];
    angle += GAUSS_WEIGHTS[i] * integrands.angleExcessRate(chi);
    time += GAUSS_WEIGHTS[i] * integrands.timeRate(chi);
  }
  return [angle * halfWidth, time * halfWidth];
}

/** Panels of [0, pi] with cumulative phi - chi and t at their left ends (the last entry closes [0, pi]). */
interface Panels {
  chi: number[];
  angle: number[];
  time: number[];
}

/** Adaptive panels: a panel is kept when its two halves agree with it to rtol (relative; both integrands are positive). */
function buildPanels(integrands: OrbitIntegrands, rtol: number, p: number): Panels {
  const panels: Panels = { chi: [0], angle: [0], time: [0] };
  const stack: [number, number][] = [[0, Math.PI]];
  while (stack.length > 0) {
    const [a, b] = stack.pop()!;
    const middle = 0.5 * (a + b);
    const [angle, time] = panelIntegrals(integrands, a, b);
    const [angleLeft, timeLeft] = panelIntegrals(integrands, a, middle);
    const [angleRight, timeRight] = panelIntegrals(integrands, middle, b);
    const converged =
      Math.abs(angleLeft + angleRight - angle) <= rtol * angle && Math.abs(timeLeft + timeRight - time) <= rtol * time;
    if (converged || middle === a || middle === b) {
      const last = panels.chi.length - 1;
      panels.chi.push(b);
      panels.angle.push(panels.angle[last] + angleLeft + angleRight);
      panels.time.push(panels.time[last] + timeLeft + timeRight);
      if (panels.chi.length > MAX_PANELS) throw domainError("p", p, "farther from the separatrix (6 + 2e) M (the orbit's periastron peak cannot be resolved)");
    } else {
      stack.push([middle, b], [a, middle]);
    }
  }
  return panels;
}

/** chi in [0, pi] where phi(chi) = target (phi - chi cumulative in panels), and t there. */
function chiAndTimeAt(target: number, panels: Panels, integrands: OrbitIntegrands): [number, number] {
  const { chi, angle, time } = panels;
  let low = 0;
  let high = chi.length - 1;
  while (high - low > 1) {
    const middle = (low + high) >> 1;
    if (chi[middle] + angle[middle] <= target) low = middle;
    else high = middle;
  }
  const a = chi[low];
  const phiA = a + angle[low];
  const phiB = chi[high] + angle[high];
  let x = phiB > phiA ? a + ((chi[high] - a) * (target - phiA)) / (phiB - phiA) : a;
  for (let i = 0; i < MAX_NEWTON_STEPS; i++) {
    const residual = phiA + (x - a) + panelIntegrals(integrands, a, x)[0] - target;
    const next = Math.min(chi[high], Math.max(a, x - residual / (1 + integrands.angleExcessRate(x))));
    if (Math.abs(next - x) <= 4e-16 * Math.max(x, 1e-300)) {
      x = next;
      break;
    }
    x = next;
  }
  return [x, time[low] + panelIntegrals(integrands, a, x)[1]];
}

/**
 * Traces a bound orbit for `orbits` radial periods (see the module comment for the method).
 * Units: p and M in one unit of length; output positions and times in units of M. Domain: M > 0,
 * 0 < eccentricity < 1 (a circular orbit has no periastron to time), p > (6 + 2e) M (stable bound
 * orbits; Cutler, Kennefick & Poisson 1994), options as OrbitTraceOptions. Accuracy at the default
 * rtol 1e-10 against mpmath quadrature (tests/fixtures/physics/periastron.json, separatrix-orbits.json:
 * p from (6 + 2e + 1e-4) M to 1e8 M, e from 0.001 to 0.99): the advance and the radial period
 * to 8e-16 relative (tested to 2e-15), whatever rtol; the samples' positions and times as accurate.
 */
export function traceBoundOrbit(p: number, eccentricity: number, M: number, options?: OrbitTraceOptions): TracedOrbit {
  requirePositive("M", M);
  if (!(eccentricity > 0 && eccentricity < 1)) throw domainError("eccentricity", eccentricity, "in (0, 1)");
  const pOverM = p / M;
  const e = eccentricity;
  const gap = pOverM - 6 - 2 * e;
  if (!(gap > 0 && Number.isFinite(pOverM))) {
    throw domainError("p", p, `finite and > (6 + 2e) M = ${(6 + 2 * eccentricity) * M} (a stable bound orbit)`);
  }
  const orbits = options?.orbits ?? 3;
  const samples = options?.samples ?? 2048;
  const rtol = options?.rtol ?? 1e-10;
  if (!(Number.isInteger(orbits) && orbits >= 1 && orbits <= 100)) throw domainError("options.orbits", orbits, "an integer in 1..100");
  if (!(Number.isInteger(samples) && samples >= 2)) throw domainError("options.samples", samples, "an integer >= 2");
  if (!(rtol >= 1e-14 && rtol <= 1e-3)) throw domainError("options.rtol", rtol, "in [1e-14, 1e-3]");

  const integrands = new OrbitIntegrands(pOverM, e, gap);
  const panels = buildPanels(integrands, rtol, p);
  const last = panels.chi.length - 1;
  const halfAdvance = panels.angle[last];
  const halfPeriod = panels.time[last];
  const sweepPerOrbit = 2 * Math.PI + 2 * halfAdvance;
  const radialPeriod = 2 * halfPeriod;

  const xy = new Float64Array(2 * samples);
  const t = new Float64Array(samples);
  const totalSweep = orbits * sweepPerOrbit;
  for (let j = 0; j < samples; j++) {
    const phi = j === samples - 1 ? totalSweep : (totalSweep * j) / (samples - 1);
    // phi(2 pi k + chi) = k sweep + phi(chi), phi(2 pi - chi) = sweep - phi(chi); likewise t
    const k = Math.min(orbits - 1, Math.floor(phi / sweepPerOrbit));
    const withinOrbit = phi - k * sweepPerOrbit;
    const mirrored = withinOrbit > 0.5 * sweepPerOrbit;
    const [chi, time] = chiAndTimeAt(mirrored ? sweepPerOrbit - withinOrbit : withinOrbit, panels, integrands);
    const r = pOverM / (1 + e * Math.cos(chi));
    xy[2 * j] = r * Math.cos(phi);
    xy[2 * j + 1] = r * Math.sin(phi);
    t[j] = k * radialPeriod + (mirrored ? radialPeriod - time : time);
  }
  return {
    xy,
    t,
    count: samples,
    periastronAdvance: 2 * halfAdvance,
    periastronAdvanceExact: advanceFromMassOverP(1 / pOverM, e),
    periastronAdvanceFirstOrder: (6 * Math.PI) / pOverM,
    radialPeriod,
  };
}
