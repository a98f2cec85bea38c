/**
 * Turns traced rays (planar paths from lib/physics) into what the GPU draws: 3D vertices rotated into
 * each ray's half-plane, the distance along each ray (for dash patterns), and the point each ray has
 * reached at each wavefront time. Runs inside the ray workers so the main thread only concatenates.
 */

/** Rotates the planar path (x, y) about the x axis by φ: (x, y cos φ, y sin φ). Float32 for the GPU. */
export function rayVertices(xy: Float64Array, rayCount: number, samples: number, azimuthsRad: Float64Array): Float32Array {
  const vertices = new Float32Array(rayCount * samples * 3);
  for (let ray = 0; ray < rayCount; ray++) {
    const cos = Math.cos(azimuthsRad[ray]);
    const sin = Math.sin(azimuthsRad[ray]);
    for (let s = 0; s < samples; s++) {
      const point = ray * samples + s;
      const y = xy[2 * point + 1];
      vertices[3 * point] = xy[2 * point];
      vertices[3 * point + 1] = y * cos;
      vertices[3 * point + 2] = y * sin;
    }
  }
  return vertices;
}

/** Cumulative path length along each ray from its first sample (units of M), for dashed lines. */
export function rayLineDistances(xy: Float64Array, rayCount: number, samples: number): Float32Array {
  const distances = new Float32Array(rayCount * samples);
  for (let ray = 0; ray < rayCount; ray++) {
    let length = 0;
    for (let s = 1; s < samples; s++) {
      const point = ray * samples + s;
      length += Math.hypot(xy[2 * point] - xy[2 * point - 2], xy[2 * point + 1] - xy[2 * point - 1]);
      distances[point] = length;
    }
  }
  return distances;
}

/**
 * Where each ray is at each of `timesM` (coordinate time since the ray left the start plane), by
 * linear interpolation between samples; NaN where the ray's path ended earlier (captured, or out of
 * the traced region). Layout: [ray][front][x, y, z], rotated like `rayVertices`. `timesM` ascending.
 */
export function wavefrontPoints(
  xy: Float64Array,
  t: Float64Array,
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
