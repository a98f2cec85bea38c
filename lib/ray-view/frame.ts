/**
 * Framing the 3D ray view: the box the bundle actually fills, and where the camera stands so that box
 * fits the picture whatever the impact parameters (from below b_c = 3√3 M to 100 M) or the shape (fan
 * or cylinder). Pure (no three.js), so the framing is tested without a browser. Lengths in units of M.
 */

export type Vec3 = [number, number, number];

/** An axis-aligned box, units of M. */
export interface Extent {
  min: Vec3;
  max: Vec3;
}

/** The camera's place for an extent: the point it turns about, its distance, and clip planes (units of M). */
export interface ViewFrame {
  target: Vec3;
  position: Vec3;
  distanceM: number;
  nearM: number;
  farM: number;
}

/**
 * Share of the picture's half-width and half-height left empty round the extent, so the outermost
 * rays sit clearly inside the frame (our rule).
 */
export const FRAME_MARGIN = 0.06;

/** The near clip plane's distance as a share of the framed distance (depth precision only matters for the lens's spheres). */
const NEAR_SHARE = 1e-3;

/** The up direction of the view (three.js default, kept by the orbit controls). */
export const VIEW_UP: Vec3 = [0, 1, 0];

/**
 * Where the camera looks from, as a unit vector from the target toward the camera: a fan face-on (its
 * plane is z = 0); a cylinder from above and in front, so its half-planes stand apart in depth
 * instead of lying over one another as a slab (our choice of angle).
 */
export function defaultViewDirection(planes: number): Vec3 {
  return planes <= 2 ? [0, 0, 1] : normalize([0.3, 0.5, 0.81]);
}

/**
 * The direction to frame a new bundle from: the user's own (unit vector from target to camera) when
 * they have turned the view since the last reset, else the default for the bundle's shape.
 */
export function reframeDirection(userDirection: Vec3 | undefined, planes: number): Vec3 {
  if (userDirection === undefined) return defaultViewDirection(planes);
  const length = Math.hypot(...userDirection);
  return length > 0 && Number.isFinite(length) ? normalize(userDirection) : defaultViewDirection(planes);
}

/** Smallest box holding every finite point of `vertices` ([x, y, z] triples) and the given boxes. */
export function extentOf(vertices: Float32Array, ...also: Extent[]): Extent {
  const min: Vec3 = [Infinity, Infinity, Infinity];
  const max: Vec3 = [-Infinity, -Infinity, -Infinity];
  for (let i = 0; i + 2 < vertices.length; i += 3) {
    for (let axis = 0; axis < 3; axis++) {
      const value = vertices[i + axis];
      if (value < min[axis]) min[axis] = value;
      if (value > max[axis]) max[axis] = value;
    }
  }
  for (const box of also) {
    for (let axis = 0; axis < 3; axis++) {
      min[axis] = Math.min(min[axis], box.min[axis]);
      max[axis] = Math.max(max[axis], box.max[axis]);
    }
  }
  return { min, max };
}

/** A cube of half-side `radiusM` about the origin (the lens and its photon sphere, or a start region). */
export const cubeAboutOrigin = (radiusM: number): Extent => ({ min: [-radiusM, -radiusM, -radiusM], max: [radiusM, radiusM, radiusM] });

/**
 * The camera position that fits `extent` in a perspective picture of vertical field `fovDeg` and
 * `aspect` (width / height), looking at the box's centre along −`direction` with `VIEW_UP` up, leaving
 * FRAME_MARGIN on the tighter side. Each corner q (relative to the centre) sits at depth D − q·dir in
 * front of a camera at distance D, and fits when its sideways offsets are within depth × tan(half
 * field) × (1 − margin): the smallest D meeting that for all eight corners. The far clip plane lies
 * beyond the box; the near one close to the camera (D/1000), so zooming in to the lens clips nothing.
 */
export function frameExtent(extent: Extent, direction: Vec3, fovDeg: number, aspect: number): ViewFrame {
  const dir = normalize(direction);
  // Camera axes as three.js builds them from lookAt: right = up × back, up' = back × right.
  let right = cross(VIEW_UP, dir);
  if (Math.hypot(...right) < 1e-9) right = cross([0, 0, -1], dir); // looking straight down or up
  right = normalize(right);
  const up = cross(dir, right);
  const target: Vec3 = [0, 1, 2].map((axis) => (extent.min[axis] + extent.max[axis]) / 2) as Vec3;
  const tanV = Math.tan((fovDeg * Math.PI) / 360) * (1 - FRAME_MARGIN);
  const tanH = Math.tan((fovDeg * Math.PI) / 360) * aspect * (1 - FRAME_MARGIN);
  let distanceM = 0;
  let radiusM = 0;
  for (let corner = 0; corner < 8; corner++) {
    const q: Vec3 = [0, 1, 2].map((axis) => ((corner >> axis) & 1 ? extent.max[axis] : extent.min[axis]) - target[axis]) as Vec3;
    const along = dot(q, dir);
    distanceM = Math.max(distanceM, Math.abs(dot(q, right)) / tanH + along, Math.abs(dot(q, up)) / tanV + along);
    radiusM = Math.max(radiusM, Math.hypot(...q));
  }
  // A flat or empty box still needs the camera off it.
  distanceM = Math.max(distanceM, radiusM * 1e-3, 1e-3);
  const position: Vec3 = [0, 1, 2].map((axis) => target[axis] + distanceM * dir[axis]) as Vec3;
  return { target, position, distanceM, nearM: distanceM * NEAR_SHARE, farM: 2 * (distanceM + radiusM) };
}

function dot(a: Vec3, b: Vec3): number {
  return a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
}

function cross(a: Vec3, b: Vec3): Vec3 {
  return [a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]];
}

function normalize(v: Vec3): Vec3 {
  const length = Math.hypot(...v);
  return [v[0] / length, v[1] / length, v[2] / length];
}
