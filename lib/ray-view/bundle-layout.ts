/**
 * Where the rays of the 3D bundle start, in units of M with the lens at the origin. Rays come in along
 * +x; ray i has impact parameter b_i (evenly spread over [bMin, bMax], all distinct) and lies in the
 * half-plane at azimuth φ = 2π (i mod P)/P about the x axis. A planar fan uses P = 2 (above and below
 * the axis); a cylinder uses P = CYLINDER_PLANES. Rays i and i + P are neighbours in one half-plane,
 * which is how wavefront lines are joined.
 */

import type { BundleInputs } from "../bench/parse-sketch";

/** Points per ray: enough to draw a ray winding once round the photon sphere smoothly. */
export const RAY_SAMPLES = 160;

/** Half-planes of a full cylinder of rays. */
export const CYLINDER_PLANES = 12;

/** Wavefront lines drawn across the bundle. */
export const WAVEFRONT_COUNT = 14;

/** Rays start this far out (units of M), and at least twice the widest impact parameter. */
const MIN_START_RADIUS_M = 30;

export interface BundleLayout {
  impactParametersM: Float64Array;
  azimuthsRad: Float64Array;
  planes: number;
  startRadiusM: number;
  samples: number;
  /** Coordinate times (units of M, from the start plane) at which wavefronts are drawn. */
  wavefrontTimesM: Float64Array;
}

export function bundleLayout(bundle: BundleInputs): BundleLayout {
  const { rayCount, bMinM, bMaxM } = bundle;
  const planes = bundle.layout === "fan" ? 2 : CYLINDER_PLANES;
  const impactParametersM = new Float64Array(rayCount);
  const azimuthsRad = new Float64Array(rayCount);
  for (let i = 0; i < rayCount; i++) {
    impactParametersM[i] = bMinM + ((bMaxM - bMinM) * (i + 0.5)) / rayCount;
    azimuthsRad[i] = (2 * Math.PI * (i % planes)) / planes;
  }
  const startRadiusM = Math.max(MIN_START_RADIUS_M, 2 * bMaxM);
  // A straight ray crosses the traced region in 2R: fronts are spread evenly over that crossing.
  const wavefrontTimesM = new Float64Array(WAVEFRONT_COUNT);
  for (let k = 0; k < WAVEFRONT_COUNT; k++) wavefrontTimesM[k] = (2 * startRadiusM * (k + 1)) / (WAVEFRONT_COUNT + 1);
  return { impactParametersM, azimuthsRad, planes, startRadiusM, samples: RAY_SAMPLES, wavefrontTimesM };
}
