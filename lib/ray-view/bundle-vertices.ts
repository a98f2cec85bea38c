/**
 * Turns traced rays (planar paths from lib/physics) into what the GPU draws: each ray's path thinned
 * to the points the eye needs (see polyline-decimation), rotated into its half-plane, with the
 * distance along the full path (for dash patterns) and the coordinate time (for the view's time
 * slider); each escaped ray's arrival time; and the point each ray has reached at each
 * wavefront time, interpolated from the full-resolution samples. Runs inside the ray workers so the
 * main thread only concatenates.
 */

import { keptSamples } from "./polyline-decimation";

export interface DrawnRays {
  /** Kept points of every ray in turn, [x, y, z] in units of M, Float32 for the GPU. */
  vertices: Float32Array;
  /** Path length (units of M) along the full traced ray from its first sample, at each kept point. */
  lineDistances: Float32Array;
  /** Coordinate time (units of M) since the ray left its start point, at each kept point. */
  times: Float32Array;
  /** Kept points per ray. */
  pointCounts: Uint32Array;
}

/**
 * Thins each ray and rotates its planar path (x, y) about the x axis by φ: (x, y cos φ, y sin φ);
 * `t` holds the traced coordinate times (units of M), kept at the kept points.
 */
export function drawnRays(xy: Float32Array | Float64Array, t: Float32Array | Float64Array, rayCount: number, samples: number, azimuthsRad: Float64Array): DrawnRays {
  const pointCounts = new Uint32Array(rayCount);
  const kept = new Uint32Array(rayCount * samples);
  const arcLengths = new Float64Array(samples);
  const vertices = new Float32Array(rayCount * samples * 3);
  const lineDistances = new Float32Array(rayCount * samples);
  const times = new Float32Array(rayCount * samples);
  let out = 0;
  for (let ray = 0; ray < rayCount; ray++) {
    const first = ray * samples;
    for (let s = 1; s < samples; s++) {
      const p = 2 * (first + s);
      arcLengths[s] = arcLengths[s - 1] + Math.hypot(xy[p] - xy[p - 2], xy[p + 1] - xy[p - 1]);
    }
    const keptOfRay = kept.subarray(out);
    const count = keptSamples({ coords: xy, offset: 2 * first, stride: 2, dims: 2, count: samples }, keptOfRay);
    pointCounts[ray] = count;
    const cos = Math.cos(azimuthsRad[ray]);
    const sin = Math.sin(azimuthsRad[ray]);
    for (let k = 0; k < count; k++) {
      const s = keptOfRay[k];
      const point = first + s;
      const y = xy[2 * point + 1];
      vertices[3 * out] = xy[2 * point];
      vertices[3 * out + 1] = y * cos;
      vertices[3 * out + 2] = y * sin;
      lineDistances[out] = arcLengths[s];
      times[out] = t[point] - t[first];
      out += 1;
    }
  }
  // Copies, so only the kept points cross to the page.
  return { vertices: vertices.slice(0, 3 * out), lineDistances: lineDistances.slice(0, out), times: times.slice(0, out), pointCounts };
}

/**
 * Where each ray is at each of `timesM` (coordinate time since the ray left the start plane), by
 * linear interpolation between samples; NaN where the ray's path ended earlier (captured, or out of
 * the traced region). Layout: [ray][front][x, y, z], rotated like `drawnRays`. `timesM` ascending.
 */
export function wavefrontPoints(
  xy: Float32Array | Float64Array,
  t: Float32Array | Float64Array,
  rayCount: number,
  samples: number,
  azimuthsRad: Float64Array,
  timesM: Float64Array,
): Float32Array {
  const fronts = timesM.length;
  const points = new Float32Array(rayCount * fronts * 3).fill(Number.NaN);
  for (let ray = 0; ray < rayCount; ray++) {
    const first = ray * samples;
    const startTime = t[first];
    const cos = Math.cos(azimuthsRad[ray]);
    const sin = Math.sin(azimuthsRad[ray]);
    let s = 1;
    for (let front = 0; front < fronts; front++) {
      const target = timesM[front] + startTime;
      while (s < samples && t[first + s] < target) s++;
      if (s >= samples) break;
      const t0 = t[first + s - 1];
      const t1 = t[first + s];
      const f = t1 > t0 ? (target - t0) / (t1 - t0) : 0;
      const a = first + s - 1;
      const x = xy[2 * a] + f * (xy[2 * a + 2] - xy[2 * a]);
      const y = xy[2 * a + 1] + f * (xy[2 * a + 3] - xy[2 * a + 1]);
      const out = 3 * (ray * fronts + front);
      points[out] = x;
      points[out + 1] = y * cos;
      points[out + 2] = y * sin;
    }
  }
  return points;
}

/**
 * Each ray's arrival time (units of M): the coordinate time from its start on the plane x = −R₀ to
 * its exit through the sphere it started on (r₀ = √(R₀² + b²), lib/physics ray-tracer), which is its
 * last sample. NaN for a ray that did not escape (fate code other than 0). A straight ray at the speed
 * of light crosses that sphere in exactly 2R₀ (its chord at distance b from the centre is 2√(r₀² − b²)).
 */
export function arrivalTimes(t: Float32Array | Float64Array, fates: Uint8Array, samples: number): Float32Array {
  const arrivals = new Float32Array(fates.length);
  for (let ray = 0; ray < fates.length; ray++) arrivals[ray] = fates[ray] === 0 ? t[(ray + 1) * samples - 1] - t[ray * samples] : Number.NaN;
  return arrivals;
}
