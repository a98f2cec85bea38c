/**
 * Thins a traced ray's polyline (or a wavefront's) for drawing. The tracer samples every ray uniformly
 * in swept angle, so a nearly straight escaped ray carries as many points as one that winds round the
 * photon sphere; drawing all of them made the GPU (software-rendered in headless Chromium) the
 * bottleneck. A point is dropped when the path turns by less than a small angle between the kept
 * points around it, so the drawn chord never points further than that angle from any piece of path it
 * replaces. Points on the photon sphere are always kept: that is where rays wind, and where a reader
 * zooms in.
 */

/**
 * Most the drawn direction may differ from the traced path's, radians. A chord spanning a 2° turn
 * strays from the path by at most a quarter of the turn times its length: about a pixel for the longest
 * chords at the default view (12 px per M), and far less where the path bends sharply.
 */
export const DRAWN_MAX_TURN_RAD = (2 * Math.PI) / 180;

/** The photon sphere's radius (units of M): circular photon orbits. */
const PHOTON_SPHERE_M = 3;

/** Every sample within this distance (units of M) of the photon sphere is kept. */
export const PHOTON_SPHERE_SHELL_M = 0.25;

/** A path's points inside a larger buffer: point k at coords[offset + k * stride + (0 … dims - 1)]. */
export interface StridedPath {
  coords: Float64Array | Float32Array;
  offset: number;
  stride: number;
  dims: 2 | 3;
  count: number;
}

/**
 * Indices of the points of `path` to keep, written into `kept`; returns how many. The first and last
 * points are always kept. Between two kept points the path's total absolute turning is at most
 * `maxTurnRad`, which bounds the angle between the chord and every segment it replaces by the same
 * amount. Zero-length segments (no direction) turn by nothing.
 */
export function keptSamples(
  path: StridedPath,
  kept: Uint32Array,
  maxTurnRad: number = DRAWN_MAX_TURN_RAD,
  shellM: number = PHOTON_SPHERE_SHELL_M,
): number {
  const { coords, offset, stride, dims, count: points } = path;
  const at = (k: number, c: number) => (c < dims ? coords[offset + k * stride + c] : 0);
  let count = 0;
  kept[count++] = 0;
  let turnedRad = 0;
  for (let k = 1; k < points - 1; k++) {
    const inX = at(k, 0) - at(k - 1, 0);
    const inY = at(k, 1) - at(k - 1, 1);
    const inZ = at(k, 2) - at(k - 1, 2);
    const outX = at(k + 1, 0) - at(k, 0);
    const outY = at(k + 1, 1) - at(k, 1);
    const outZ = at(k + 1, 2) - at(k, 2);
    const cross = Math.hypot(inY * outZ - inZ * outY, inZ * outX - inX * outZ, inX * outY - inY * outX);
    turnedRad += Math.atan2(cross, inX * outX + inY * outY + inZ * outZ);
    if (turnedRad > maxTurnRad || Math.abs(Math.hypot(at(k, 0), at(k, 1), at(k, 2)) - PHOTON_SPHERE_M) < shellM) {
      kept[count++] = k;
      turnedRad = 0;
    }
  }
  if (points > 1) kept[count++] = points - 1;
  return count;
}
