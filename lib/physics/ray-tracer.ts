/**
 * Light rays in the equatorial plane of a Schwarzschild mass, integrated for drawing. Geometrized
 * units: M and b in one unit of length; the output coordinates and times are in units of M, in double
 * precision from traceRay and single precision from traceRayBundle (the buffers a view draws).
 *
 * Geometry: the lens at the origin; a ray with impact parameter b starts at (x, y) = (-R, b),
 * R = startRadius, travelling towards +x, and is integrated until it leaves through r = sqrt(R^2 + b^2)
 * on the far side (escaped), crosses r = 2M (1 + CAPTURE_MARGIN) (captured), or winds (below).
 * Negative b gives the mirror image (y -> -y); the deflection is reported as a positive angle toward
 * the lens for either sign.
 *
 * Method: the orbit equation in the swept polar angle sigma (Darwin 1959), written for w = b u,
 * u = 1/r: w'' = 3 (M/b) w^2 - w, with coordinate time tau = t/b from dtau/dsigma = 1/(w^2 (1 - 2Mw/b))
 * (dt/dphi = r^2/(b (1 - 2M/r)) from the conserved energy and angular momentum; carried as
 * chi = tau + w'/w), by Dormand-Prince 5(4) with dense output (./orbit-integrator). Samples are
 * uniform in sigma along the traced path.
 *
 * Deflection of an escaped ray: where alpha >= TRACED_DEFLECTION_MIN_RAD (b below ~40 M), the traced
 * swept angle extended to infinity at both ends by the exact tail integrals (sweptAngleFromInfinity),
 * minus pi. That difference carries the integrator's absolute error in the swept angle of ~pi:
 * about 0.7 rtol rad for b >~ 40 M whatever alpha is, up to ~9 rtol near the photon sphere
 * (measured). So below the threshold, where that floor would exceed 7 rtol relative and for
 * b/M >~ 1e9 the answer itself (down to a wrong sign), the deflection is the closed form
 * exactDeflection(b, M) instead. The traced path and times are
 * the same in both cases; the path's swept angle agrees with the reported deflection to that floor.
 *
 * Winding: halfTurns = floor(swept angle / pi) of the traced path (0 or 1 for a ray that merely
 * passes the lens). A ray is "winding" when it sweeps at least 2 pi, i.e. circles the lens at least
 * once near the photon sphere (|b/b_c - 1| below ~0.03 at R = 60 M, where alpha exceeds pi + 0.17),
 * or when the maxHalfTurns or step cap stops it first; its fate is then "winding" whether it would
 * finally escape or fall in.
 */

import { exactDeflection, sweptAngleFromInfinity } from "./deflection";
import { domainError, requirePositive } from "./domain";
import { DENSE_RECORD_LENGTH, DENSE_TIME, DENSE_V, DENSE_W, OrbitIntegrator, denseValue } from "./orbit-integrator";


/** Fate of a traced ray; the numeric codes are those of traceRayBundle's `fates`. */
export type RayFate = "escaped" | "captured" | "winding";
const FATE_CODES: Record<RayFate, number> = { escaped: 0, captured: 1, winding: 2 };

/** A traced ray: positions and coordinate times in units of M, t = 0 at the start point. */
export interface TracedRay {
  /** Interleaved x, y in units of M, length 2 * count. */
  xy: Float64Array;
  /** Coordinate time at each sample, units of M. */
  t: Float64Array;
  count: number;
  fate: RayFate;
  /** Asymptotic deflection, radians (positive toward the lens); NaN unless escaped. */
  deflection: number;
  halfTurns: number;
}

/** Options of traceRay and traceRayBundle; lengths in the unit of M. */
export interface TraceOptions {
  /** Samples per ray (>= 2, default 512). */
  samples?: number;
  /** Relative tolerance of the integrator (default 1e-10). */
  rtol?: number;
  /** R, in the unit of M: the ray starts at x = -R (default 2 max(|b|, 30 M); 4 M < R <= 2e300 M, 2e30 M in a bundle). */
  startRadius?: number;
  /** Stop a winding ray after this many half-turns (default 40). */
  maxHalfTurns?: number;
}

/** Options of traceRayBundle: those of traceRay, and buffers to write the samples into. */
export interface BundleTraceOptions extends TraceOptions {
  /**
   * Buffers to overwrite instead of allocating the samples' (e.g. an earlier bundle's xy and t, read
   * and no longer needed): two that do not overlap, xy of at least 2 samples n values and t of at least
   * samples n, for n rays. The bundle's xy and t are then views of their first values. A fresh buffer
   * costs a page fault at the first write of every 4 KiB: 12-23 us of CPU each on the virtual machine
   * of the physics bench, 0.2-0.3 s for the 61 MB of 10,000 rays x 512 samples, more than tracing them.
   */
  into?: { xy: Float32Array; t: Float32Array };
}

/** A bundle of rays in one set of buffers, `samples` points per ray, ready to transfer or draw. */
export interface TracedRayBundle {
  /**
   * Interleaved x, y of all rays, ray i at [2 i samples, 2 (i+1) samples), units of M, in single
   * precision (each value traceRay's, rounded once to the nearest float: relative error <= 2^-24).
   */
  xy: Float32Array;
  /** Coordinate times, ray i at [i samples, (i+1) samples), units of M, single precision as xy. */
  t: Float32Array;
  /** 0 escaped, 1 captured, 2 winding. */
  fates: Uint8Array;
  /** Asymptotic deflections, radians; NaN unless escaped. */
  deflections: Float64Array;
  samples: number;
}

/** Captured rays stop at r = 2M (1 + CAPTURE_MARGIN), where t still is finite. */
export const CAPTURE_MARGIN = 0.01;
const DEFAULT_SAMPLES = 512;
const DEFAULT_RTOL = 1e-10;
const DEFAULT_MAX_HALF_TURNS = 40;
/**
 * Smallest deflection reported from the integration; below it the closed form is returned (module
 * comment): the traced value's error there, ~0.7 rtol rad, is then at most ~7 rtol relative.
 */
const TRACED_DEFLECTION_MIN_RAD = 0.1;
/**
 * Below this |b|/M the ray is traced as the radial one (b = 0), which it matches to far below a
 * double's resolution; integrating it in w = b/r underflowed (below ~1e-150 M every sample was 0).
 */
const RADIAL_IMPACT_OVER_M = 1e-100;
/**
 * Largest |b|/M and start radius R/M per output precision: they keep the default start radius 2|b|
 * and every sample (|x|, |y| <= sqrt(R^2 + b^2), t ~ 2R) finite: in double precision for traceRay and,
 * far below the single-precision maximum 3.4e38, in single precision for traceRayBundle.
 */
interface SampleRange {
  maxImpactOverM: number;
  maxImpactText: string;
  maxStartRadiusText: string;
}
const DOUBLE_RANGE: SampleRange = { maxImpactOverM: 1e300, maxImpactText: "1e300", maxStartRadiusText: "2e300" };
const SINGLE_RANGE: SampleRange = { maxImpactOverM: 1e30, maxImpactText: "1e30", maxStartRadiusText: "2e30" };
const MIN_DEFAULT_START_RADIUS = 30;
/** Newton steps on the dense output to locate the exit or capture radius (converges in ~4). */
const MAX_EVENT_ITERATIONS = 30;
/** Samples between exact re-evaluations of cos/sin in the rotation recurrence. */
const ROTATION_RESYNC = 64;
/** Dense-record capacity per ray: ~25 steps per radian, so 40 half-turns need ~3200. */
const MAX_STEPS = 20_000;

/** Where the tracer writes samples: Float64 for one ray, Float32 for a bundle that is drawn. */
type SampleArray = Float32Array | Float64Array;

interface RayOutcome {
  fate: RayFate;
  deflection: number;
  halfTurns: number;
}

/** Reusable integrator and scratch for many rays (one per thread). */
class RayTracer {
  private readonly integrator: OrbitIntegrator;

  constructor(rtol: number) {
    this.integrator = new OrbitIntegrator(rtol, MAX_STEPS);
  }

  get rtol(): number {
    return this.integrator.rtol;
  }

  /**
   * Traces one ray (b in units of M, may be negative) from x = -startRadius into xy/t at the given
   * sample offset, writing exactly `samples` points.
   */
  trace(b: number, startRadius: number, samples: number, maxHalfTurns: number, xy: SampleArray, t: SampleArray, offset: number): RayOutcome {
    const sign = b < 0 ? -1 : 1;
    const bAbs = Math.abs(b);
    const captureRadius = 2 * (1 + CAPTURE_MARGIN);
    if (bAbs < RADIAL_IMPACT_OVER_M) return this.traceRadial(startRadius, captureRadius, samples, xy, t, offset);
    const startR = Math.hypot(startRadius, bAbs);
    const wStart = bAbs / startR;
    const wCapture = bAbs / captureRadius;
    const integrator = this.integrator;
    const rtol = integrator.rtol;
    const vStart = Math.sqrt(Math.max(0, 1 - wStart * wStart + (2 / bAbs) * wStart * wStart * wStart));
    integrator.start(1 / bAbs, wStart, vStart, rtol * Math.min(1, wStart), rtol, (rtol * startR) / bAbs, 0.05 * wStart);
    const maxSweep = maxHalfTurns * Math.PI;
    let fate: RayFate = "winding";
    let endSigma = 0;
    while (integrator.step()) {
      if (integrator.v < 0 && integrator.w <= wStart) {
        fate = "escaped";
        endSigma = this.locate(wStart);
        break;
      }
      if (integrator.w >= wCapture) {
        fate = "captured";
        endSigma = this.locate(wCapture);
        break;
      }
      if (integrator.sigma >= maxSweep) break;
    }
    if (fate === "winding") endSigma = integrator.sigma;
    const halfTurns = Math.floor(endSigma / Math.PI);
    if (halfTurns >= 2) fate = "winding";
    let deflection = NaN;
    if (fate === "escaped") {
      deflection = exactDeflection(bAbs, 1);
      if (deflection >= TRACED_DEFLECTION_MIN_RAD) {
        // asymptotic swept angle: tail before the start + traced + tail after the last step
        const tails = sweptAngleFromInfinity(startR, bAbs, 1) + sweptAngleFromInfinity(bAbs / integrator.w, bAbs, 1);
        deflection = tails + integrator.sigma - Math.PI;
      }
    }
    this.sample(bAbs, sign, Math.atan2(bAbs, -startRadius), endSigma, samples, xy, t, offset);
    return { fate, deflection, halfTurns };
  }

  /** sigma within the last accepted step where w = target, by Newton on the dense output. */
  private locate(target: number): number {
    const { dense } = this.integrator;
    const step = this.integrator.stepCount - 1;
    const x0 = dense[step * DENSE_RECORD_LENGTH];
    const x1 = this.integrator.sigma;
    let sigma = x1;
    for (let i = 0; i < MAX_EVENT_ITERATIONS; i++) {
      const residual = denseValue(dense, step, DENSE_W, sigma) - target;
      const slope = denseValue(dense, step, DENSE_V, sigma);
      const next = Math.min(x1, Math.max(x0, sigma - residual / slope));
      if (Math.abs(next - sigma) <= 1e-15 * Math.max(1, sigma)) return next;
      sigma = next;
    }
    return sigma;
  }

  /**
   * Writes `samples` points uniform in sigma on [0, endSigma] from the dense record: an outer loop over
   * steps holds each step's 15 coefficients in locals, an inner loop writes the samples in that step;
   * the last sample, at endSigma, is written after them so that the inner loop does not test for it
   * (12% of the bundle's time). Values are computed in double precision and rounded once, on the
   * store, to the output's type.
   */
  private sample(bAbs: number, sign: number, phiStart: number, endSigma: number, samples: number, xy: SampleArray, t: SampleArray, offset: number): void {
    const { dense, stepCount } = this.integrator;
    // the record layout in locals: imported bindings read inside the loop cost a load each (a getter
    // call each where the module is bundled as CommonJS, as tsx runs the bench)
    const recordLength = DENSE_RECORD_LENGTH, wAt = DENSE_W, vAt = DENSE_V, timeAt = DENSE_TIME;
    const last = samples - 1;
    const delta = endSigma / last;
    const cosDelta = Math.cos(delta);
    const sinDelta = Math.sin(delta);
    const signedB = sign * bAbs;
    // the rotation to phiStart - sigma; set exactly at j = 0, a resync sample
    let cosPhi = 0;
    let sinPhi = 0;
    let j = 0;
    let at = 2 * offset;
    for (let step = 0; step < stepCount && j < last; step++) {
      const base = step * recordLength;
      const sigma0 = dense[base];
      const inverseH = dense[base + 1];
      const stepEnd = step === stepCount - 1 ? Infinity : sigma0 + 1 / inverseH;
      if (j * delta > stepEnd) continue; // no sample in this step
      const w0 = dense[base + wAt], w1 = dense[base + wAt + 1], w2 = dense[base + wAt + 2], w3 = dense[base + wAt + 3], w4 = dense[base + wAt + 4];
      const v0 = dense[base + vAt], v1 = dense[base + vAt + 1], v2 = dense[base + vAt + 2], v3 = dense[base + vAt + 3], v4 = dense[base + vAt + 4];
      const c0 = dense[base + timeAt], c1 = dense[base + timeAt + 1], c2 = dense[base + timeAt + 2], c3 = dense[base + timeAt + 3], c4 = dense[base + timeAt + 4];
      for (; j < last; j++, at += 2) {
        const sigma = j * delta;
        if (sigma > stepEnd) break;
        if ((j & (ROTATION_RESYNC - 1)) === 0) {
          cosPhi = Math.cos(phiStart - sigma);
          sinPhi = Math.sin(phiStart - sigma);
        } else {
          const c = cosPhi * cosDelta + sinPhi * sinDelta;
          sinPhi = sinPhi * cosDelta - cosPhi * sinDelta;
          cosPhi = c;
        }
        // the 4th-order continuous extension (denseValue) of w, v and chi at one theta
        const theta = (sigma - sigma0) * inverseH;
        const theta1 = 1 - theta;
        const w = w0 + theta * (w1 + theta1 * (w2 + theta * (w3 + theta1 * w4)));
        const v = v0 + theta * (v1 + theta1 * (v2 + theta * (v3 + theta1 * v4)));
        const chi = c0 + theta * (c1 + theta1 * (c2 + theta * (c3 + theta1 * c4)));
        const inverseW = 1 / w;
        xy[at] = bAbs * inverseW * cosPhi;
        xy[at + 1] = signedB * inverseW * sinPhi;
        t[offset + j] = bAbs * (chi - v * inverseW);
      }
    }
    // the last sample, at endSigma in the last step (the event located there, or its end)
    const lastStep = stepCount - 1;
    const inverseW = 1 / denseValue(dense, lastStep, wAt, endSigma);
    xy[at] = bAbs * inverseW * Math.cos(phiStart - endSigma);
    xy[at + 1] = signedB * inverseW * Math.sin(phiStart - endSigma);
    t[offset + last] = bAbs * (denseValue(dense, lastStep, timeAt, endSigma) - denseValue(dense, lastStep, vAt, endSigma) * inverseW);
    t[offset] = 0; // by definition; the dense output gives chi - v/w = 0 only to rounding
  }

  /** b = 0: radial infall along the x axis; t = (R - r) + 2 ln((R - 2)/(r - 2)) (M = 1). */
  private traceRadial(startRadius: number, captureRadius: number, samples: number, xy: SampleArray, t: SampleArray, offset: number): RayOutcome {
    for (let j = 0; j < samples; j++) {
      const r = startRadius + ((captureRadius - startRadius) * j) / (samples - 1);
      xy[2 * (offset + j)] = -r;
      xy[2 * (offset + j) + 1] = 0;
      t[offset + j] = startRadius - r + 2 * Math.log((startRadius - 2) / (r - 2));
    }
    return { fate: "captured", deflection: NaN, halfTurns: 0 };
  }
}

let sharedTracer: RayTracer | undefined;

function tracerFor(rtol: number): RayTracer {
  if (sharedTracer === undefined || sharedTracer.rtol !== rtol) sharedTracer = new RayTracer(rtol);
  return sharedTracer;
}

interface ResolvedOptions {
  samples: number;
  rtol: number;
  startRadiusM: number;
  maxHalfTurns: number;
}

/** Throws unless |b|/M is within the range; `name` is the argument as the caller knows it. */
function requireImpactInRange(name: string, b: number, M: number, range: SampleRange): void {
  if (!(Math.abs(b) / M <= range.maxImpactOverM)) {
    throw domainError(name, b, `finite, with |b| <= ${range.maxImpactText} M = ${range.maxImpactOverM * M}`);
  }
}

/** Options in units of M; the default start radius is computed in them, so it is finite whenever |b|/M is. */
function resolveOptions(largestAbsBOverM: number, M: number, options: TraceOptions | undefined, range: SampleRange): ResolvedOptions {
  const samples = options?.samples ?? DEFAULT_SAMPLES;
  const rtol = options?.rtol ?? DEFAULT_RTOL;
  const startRadiusM = options?.startRadius === undefined ? 2 * Math.max(largestAbsBOverM, MIN_DEFAULT_START_RADIUS) : options.startRadius / M;
  const maxHalfTurns = options?.maxHalfTurns ?? DEFAULT_MAX_HALF_TURNS;
  if (!(Number.isInteger(samples) && samples >= 2)) throw domainError("options.samples", samples, "an integer >= 2");
  if (!(rtol >= 1e-14 && rtol <= 1e-3)) throw domainError("options.rtol", rtol, "in [1e-14, 1e-3]");
  if (!(startRadiusM > 4 && startRadiusM <= 2 * range.maxImpactOverM)) {
    throw domainError("options.startRadius", options?.startRadius ?? NaN, `finite, > 4M = ${4 * M} and <= ${range.maxStartRadiusText} M`);
  }
  if (!(Number.isInteger(maxHalfTurns) && maxHalfTurns >= 2 && maxHalfTurns <= 1000)) throw domainError("options.maxHalfTurns", maxHalfTurns, "an integer in [2, 1000]");
  return { samples, rtol, startRadiusM, maxHalfTurns };
}

/**
 * Traces one light ray past a Schwarzschild mass for drawing (see the module comment for geometry,
 * method and the meaning of "winding"). Units: b, M and options.startRadius in one unit of length;
 * output positions and times in units of M, in double precision. Domain: b finite with
 * |b| <= 1e300 M (any sign; 0, and any |b| < 1e-100 M, is the radial ray), M > 0, options as
 * TraceOptions (startRadius <= 2e300 M). Accuracy at the default rtol 1e-10 (tested against
 * mpmath quadrature): travel times 6e-10 relative from b = 6 M to 1e12 M (7e-11 for b >= 1e3 M, which
 * is more than the Shapiro excess of a ray with b >~ 1e11 M); the escaped deflection is traced where
 * alpha >= 0.1 rad, within 1e-9 rad (6e-10 relative) of exactDeflection, and below is the closed
 * form exactDeflection itself (module comment: the integrator's ~0.7 rtol rad floor would exceed a
 * weakly deflected ray's alpha), to which the path's swept angle agrees within 7e-11 rad.
 */
export function traceRay(b: number, M: number, options?: TraceOptions): TracedRay {
  requirePositive("M", M);
  requireImpactInRange("b", b, M, DOUBLE_RANGE);
  const resolved = resolveOptions(Math.abs(b) / M, M, options, DOUBLE_RANGE);
  const xy = new Float64Array(2 * resolved.samples);
  const t = new Float64Array(resolved.samples);
  const outcome = tracerFor(resolved.rtol).trace(b / M, resolved.startRadiusM, resolved.samples, resolved.maxHalfTurns, xy, t, 0);
  return { xy, t, count: resolved.samples, ...outcome };
}

/** The first `length` values of `buffer`, or a fresh array when none is given; `name` for the error. */
function outputArray(buffer: Float32Array | undefined, length: number, name: string): Float32Array {
  if (buffer === undefined) return new Float32Array(length);
  if (!(buffer instanceof Float32Array) || buffer.length < length) {
    throw domainError(name, buffer?.length ?? NaN, `a Float32Array of at least ${length} values (2 or 1 per sample of every ray)`);
  }
  return buffer.subarray(0, length);
}

/**
 * Traces many rays into one set of contiguous buffers (transferable to and from a web worker, drawable
 * as one BufferGeometry). Every ray gets exactly `samples` points (uniform in swept angle, so no ray is
 * short and none needs padding). All rays share one start radius, 2 max(max |b|, 30 M) by default.
 * Units and method as traceRay. Domain: as traceRay but |b| <= 1e30 M and startRadius <= 2e30 M, so
 * that every sample is finite in single precision. Accuracy: the deflections (double precision) as
 * traceRay; the positions and times are traceRay's, computed in double precision and rounded once
 * to single precision, within 2^-24 = 6e-8 of the value (4e-6 M at 60 M from the lens, 1e-5 M of a
 * travel time of ~130 M), far below a drawn pixel. The samples are written straight into the output,
 * with no double-precision copy; options.into lets a caller that is done with an earlier bundle's
 * samples have them overwritten instead of faulting in new buffers. The integrator and its dense
 * record are allocated once and reused; the inner loops allocate nothing.
 */
export function traceRayBundle(impactParameters: Float64Array, M: number, options?: BundleTraceOptions): TracedRayBundle {
  requirePositive("M", M);
  let largest = 0;
  for (let i = 0; i < impactParameters.length; i++) {
    requireImpactInRange(`impactParameters[${i}]`, impactParameters[i], M, SINGLE_RANGE);
    largest = Math.max(largest, Math.abs(impactParameters[i]));
  }
  const resolved = resolveOptions(largest / M, M, options, SINGLE_RANGE);
  const { samples } = resolved;
  const count = impactParameters.length;
  const xy = outputArray(options?.into?.xy, 2 * samples * count, "options.into.xy");
  const t = outputArray(options?.into?.t, samples * count, "options.into.t");
  const fates = new Uint8Array(count);
  const deflections = new Float64Array(count);
  const tracer = tracerFor(resolved.rtol);
  for (let i = 0; i < count; i++) {
    const outcome = tracer.trace(impactParameters[i] / M, resolved.startRadiusM, samples, resolved.maxHalfTurns, xy, t, i * samples);
    fates[i] = FATE_CODES[outcome.fate];
    deflections[i] = outcome.deflection;
  }
  return { xy, t, fates, deflections, samples };
}
