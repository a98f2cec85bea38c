/**
 * The ray bundle around a lens with a surface: the workers trace vacuum paths past the mass, and here
 * a ray whose impact parameter is below the surface's (b < b_R, lens-surface.ts) is cut where it
 * enters the body and given the fate "surface"; wavefront segments inside the body are dropped.
 * Everything is in units of M, as the bundle is.
 */

import { groupSegmentsByFate, RAY_FATES, type AssembledBundle } from "./assemble-bundle";
import { surfaceImpactParameterM } from "../bench/lens-surface";

const SURFACE_CODE = RAY_FATES.indexOf("surface");

/** Smallest t in [0, 1] where p + t (q − p) meets the sphere |x| = R entering it, or undefined. */
function entryFraction(vertices: Float32Array, p: number, q: number, radius: number): number | undefined {
  const [px, py, pz] = [vertices[3 * p], vertices[3 * p + 1], vertices[3 * p + 2]];
  const [dx, dy, dz] = [vertices[3 * q] - px, vertices[3 * q + 1] - py, vertices[3 * q + 2] - pz];
  const a = dx * dx + dy * dy + dz * dz;
  const b = 2 * (px * dx + py * dy + pz * dz);
  const c = px * px + py * py + pz * pz - radius * radius;
  if (c <= 0) return 0;
  const discriminant = b * b - 4 * a * c;
  if (a === 0 || discriminant < 0) return undefined;
  const t = (-b - Math.sqrt(discriminant)) / (2 * a);
  return t >= 0 && t <= 1 ? t : undefined;
}

/**
 * `bundle` with the body of radius `surfaceRadiusM` (units of M) in place. A lens inside its photon
 * sphere (R < 3M) changes nothing: every ray that would reach it is captured already.
 */
export function withLensSurface(bundle: AssembledBundle, surfaceRadiusM: number): AssembledBundle {
  const surfaceImpactM = surfaceImpactParameterM(surfaceRadiusM, 1);
  if (surfaceImpactM === 0) return bundle;
  const { rayCount, rayFirstPoint, vertices, lineDistances, vertexTimesM } = bundle;
  // At most one new point (the entry into the body) per ray.
  const cutVertices = new Float32Array(vertices.length + 3 * rayCount);
  const cutDistances = new Float32Array(lineDistances.length + rayCount);
  const cutTimes = new Float32Array(vertexTimesM.length + rayCount);
  const cutFirstPoint = new Uint32Array(rayCount + 1);
  const fates = Uint8Array.from(bundle.rayFates);
  const deflections = Float32Array.from(bundle.rayDeflectionsRad);
  const arrivals = Float32Array.from(bundle.rayArrivalTimesM);
  let out = 0;
  const copyPoint = (from: number) => {
    cutVertices.set(vertices.subarray(3 * from, 3 * from + 3), 3 * out);
    cutTimes[out] = vertexTimesM[from];
    cutDistances[out++] = lineDistances[from];
  };
  for (let ray = 0; ray < rayCount; ray++) {
    cutFirstPoint[ray] = out;
    const first = rayFirstPoint[ray];
    const end = rayFirstPoint[ray + 1];
    // Every ray starts on the plane x = −R₀ at distance b from the axis.
    const impactM = Math.hypot(vertices[3 * first + 1], vertices[3 * first + 2]);
    if (end === first || impactM >= surfaceImpactM) {
      for (let p = first; p < end; p++) copyPoint(p);
      continue;
    }
    fates[ray] = SURFACE_CODE;
    deflections[ray] = Number.NaN;
    arrivals[ray] = Number.NaN;
    for (let p = first; p < end; p++) {
      const t = p + 1 < end ? entryFraction(vertices, p, p + 1, surfaceRadiusM) : undefined;
      if (t === 0) break; // this point is inside already (the traced region starts inside the body)
      copyPoint(p);
      if (t !== undefined) {
        for (let axis = 0; axis < 3; axis++) cutVertices[3 * out + axis] = vertices[3 * p + axis] + t * (vertices[3 * (p + 1) + axis] - vertices[3 * p + axis]);
        cutTimes[out] = vertexTimesM[p] + t * (vertexTimesM[p + 1] - vertexTimesM[p]);
        cutDistances[out++] = lineDistances[p] + t * (lineDistances[p + 1] - lineDistances[p]);
        break;
      }
    }
  }
  cutFirstPoint[rayCount] = out;

  const fronts: number[] = [];
  const frontTimes: number[] = [];
  const outside = (v: Float32Array, i: number) => Math.hypot(v[i], v[i + 1], v[i + 2]) > surfaceRadiusM;
  for (let i = 0; i + 5 < bundle.wavefrontVertices.length; i += 6) {
    if (outside(bundle.wavefrontVertices, i) && outside(bundle.wavefrontVertices, i + 3)) {
      fronts.push(...bundle.wavefrontVertices.subarray(i, i + 6));
      frontTimes.push(...bundle.wavefrontVertexTimesM.subarray(i / 3, i / 3 + 2));
    }
  }
  const keptTimes = cutTimes.slice(0, out);

  return {
    ...bundle,
    vertices: cutVertices.slice(0, 3 * out),
    lineDistances: cutDistances.slice(0, out),
    vertexTimesM: keptTimes,
    latestTimeM: keptTimes.reduce((latest, time) => Math.max(latest, time), 0),
    rayFirstPoint: cutFirstPoint,
    rayFates: fates,
    rayDeflectionsRad: deflections,
    rayArrivalTimesM: arrivals,
    ...groupSegmentsByFate(cutFirstPoint, fates, rayCount),
    wavefrontVertices: new Float32Array(fronts),
    wavefrontVertexTimesM: new Float32Array(frontTimes),
  };
}
