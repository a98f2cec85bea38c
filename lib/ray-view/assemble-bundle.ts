/**
 * Joins the traced chunks of a bundle into one set of GPU buffers: every ray's (thinned) vertices in
 * one array, a segment index ordered by fate (so one BufferGeometry draws the whole bundle with one
 * group per fate), and the wavefront segments between neighbouring rays of each half-plane, thinned
 * like the rays. Within a fate the rays are indexed in interleaved passes, so drawing any leading
 * part of a group (as the progressive draw does) shows rays spread over the whole bundle.
 */

import { keptSamples } from "./polyline-decimation";
import { cubeAboutOrigin, extentOf, type Extent } from "./frame";

/**
 * Fates as lib/physics codes them in `traceRayBundle`: 0 escaped, 1 captured, 2 winding; and 3, given
 * here (bundle-surface), for a ray that ends on the surface of a lens with a radius.
 */
export const RAY_FATES = ["escaped", "captured", "winding", "surface"] as const;
export type RayFate = (typeof RAY_FATES)[number];

/** One traced slice of the bundle, rays [firstRay, firstRay + rayCount), as a worker returns it. */
export interface TracedChunk {
  firstRay: number;
  rayCount: number;
  vertices: Float32Array;
  lineDistances: Float32Array;
  /** Coordinate time (units of M) since the ray's start, at each drawn point. */
  times: Float32Array;
  /** Drawn points per ray (rays are thinned, so their lengths differ). */
  pointCounts: Uint32Array;
  fates: Uint8Array;
  /** Each ray's asymptotic deflection, radians; NaN unless it escaped. */
  deflectionsRad: Float32Array;
  /** Each ray's arrival time (units of M, bundle-vertices' arrivalTimes); NaN unless it escaped. */
  arrivalTimesM: Float32Array;
  /** Every ray's point at every front, [ray][front][x, y, z]; NaN where the ray never got there. */
  wavefronts: Float32Array;
}

/** The buffers of a chunk, to transfer between threads rather than copy. */
export function chunkBuffers(chunk: TracedChunk): ArrayBuffer[] {
  return [chunk.vertices, chunk.lineDistances, chunk.times, chunk.pointCounts, chunk.fates, chunk.deflectionsRad, chunk.arrivalTimesM, chunk.wavefronts].map((array) => array.buffer) as ArrayBuffer[];
}

export interface AssembledBundle {
  rayCount: number;
  /** Half-planes the rays lie in (2 for a planar fan). */
  planes: number;
  vertices: Float32Array;
  /**
   * Distance along each ray (units of M) for its dash pattern, shifted by a different fraction of
   * DASH_PHASE_SPAN_M per ray so the dashes of neighbouring rays do not line up into stripes.
   */
  lineDistances: Float32Array;
  /** Coordinate time (units of M) since the ray's start, at each vertex. */
  vertexTimesM: Float32Array;
  /** Latest vertex time (units of M): the time slider's end. */
  latestTimeM: number;
  /** Pairs of vertex indices, escaped rays first, then captured, then winding, then surface. */
  segmentIndex: Uint32Array;
  /** Ray r's points are vertices [rayFirstPoint[r], rayFirstPoint[r + 1]). */
  rayFirstPoint: Uint32Array;
  /** Each ray's fate code (index into RAY_FATES). */
  rayFates: Uint8Array;
  /** Each ray's asymptotic deflection, radians; NaN unless it escaped. */
  rayDeflectionsRad: Float32Array;
  /** Each ray's arrival time, units of M; NaN unless it escaped. */
  rayArrivalTimesM: Float32Array;
  /** Ranges of `segmentIndex` per fate (in index entries), in RAY_FATES order. */
  fateGroups: { start: number; count: number; fate: RayFate }[];
  fateCounts: Record<RayFate, number>;
  /** Wavefront segment end points, [x, y, z] pairs. */
  wavefrontVertices: Float32Array;
  /** The coordinate time (units of M) of the front each wavefront vertex lies on. */
  wavefrontVertexTimesM: Float32Array;
  startRadiusM: number;
  /** The box the rays and the lens's photon sphere fill, units of M (what the camera frames). */
  extentM: Extent;
}

/**
 * A wavefront segment is not drawn across a gap wider than this fraction of the start radius: such a
 * gap separates rays on either side of the photon sphere's capture cross-section, not one front.
 */
const MAX_FRONT_GAP_OF_START_RADIUS = 0.1;

/** Passes the rays of one fate are indexed in: pass p holds every SPREAD_PASSES-th ray from the p-th. */
export const SPREAD_PASSES = 8;

/** Span (units of M) of the per-ray dash offsets: longer than any fate's dash period. */
export const DASH_PHASE_SPAN_M = 8;

/** The golden ratio's fractional part: successive multiples spread evenly over [0, 1) (Weyl sequence). */
const GOLDEN_FRACTION = (Math.sqrt(5) - 1) / 2;

/** Photon sphere radius, units of M: always inside the framed extent, so the lens shows whole. */
const PHOTON_SPHERE_M = 3;

/** `wavefrontTimesM`: the coordinate times (units of M, ascending) the chunks' fronts were taken at. */
export function assembleBundle(chunks: TracedChunk[], rayCount: number, planes: number, wavefrontTimesM: Float64Array, startRadiusM: number): AssembledBundle {
  const wavefrontCount = wavefrontTimesM.length;
  const ordered = [...chunks].sort((a, b) => a.firstRay - b.firstRay);
  let pointTotal = 0;
  for (const chunk of ordered) pointTotal += chunk.lineDistances.length;
  const vertices = new Float32Array(pointTotal * 3);
  const lineDistances = new Float32Array(pointTotal);
  const vertexTimesM = new Float32Array(pointTotal);
  const rayFirstPoint = new Uint32Array(rayCount + 1);
  const fates = new Uint8Array(rayCount);
  const deflections = new Float32Array(rayCount);
  const arrivals = new Float32Array(rayCount);
  const wavefronts = new Float32Array(rayCount * wavefrontCount * 3);
  let point = 0;
  let latestTimeM = 0;
  for (const chunk of ordered) {
    const chunkStart = point;
    vertices.set(chunk.vertices, point * 3);
    vertexTimesM.set(chunk.times, point);
    for (let k = 0; k < chunk.rayCount; k++) {
      const ray = chunk.firstRay + k;
      rayFirstPoint[ray] = point;
      const phaseM = ((ray * GOLDEN_FRACTION) % 1) * DASH_PHASE_SPAN_M;
      for (let p = point; p < point + chunk.pointCounts[k]; p++) {
        lineDistances[p] = chunk.lineDistances[p - chunkStart] + phaseM;
        if (vertexTimesM[p] > latestTimeM) latestTimeM = vertexTimesM[p];
      }
      point += chunk.pointCounts[k];
    }
    fates.set(chunk.fates, chunk.firstRay);
    deflections.set(chunk.deflectionsRad, chunk.firstRay);
    arrivals.set(chunk.arrivalTimesM, chunk.firstRay);
    wavefronts.set(chunk.wavefronts, chunk.firstRay * wavefrontCount * 3);
  }
  rayFirstPoint[rayCount] = point;

  const grouped = groupSegmentsByFate(rayFirstPoint, fates, rayCount);
  const fronts = wavefrontSegments(wavefronts, rayCount, planes, wavefrontTimesM, startRadiusM * MAX_FRONT_GAP_OF_START_RADIUS);
  return {
    rayCount,
    planes,
    vertices,
    lineDistances,
    vertexTimesM,
    latestTimeM,
    ...grouped,
    rayFirstPoint,
    rayFates: fates,
    rayDeflectionsRad: deflections,
    rayArrivalTimesM: arrivals,
    wavefrontVertices: fronts.vertices,
    wavefrontVertexTimesM: fronts.timesM,
    startRadiusM,
    extentM: extentOf(vertices, cubeAboutOrigin(PHOTON_SPHERE_M)),
  };
}

/** The assembled bundle's buffers, to transfer between threads rather than copy. */
export function bundleBuffers(bundle: AssembledBundle): ArrayBuffer[] {
  const arrays = [bundle.vertices, bundle.lineDistances, bundle.vertexTimesM, bundle.segmentIndex, bundle.rayFirstPoint, bundle.rayFates, bundle.rayDeflectionsRad, bundle.rayArrivalTimesM];
  return [...arrays, bundle.wavefrontVertices, bundle.wavefrontVertexTimesM].map((array) => array.buffer) as ArrayBuffer[];
}

/**
 * The segment index of a bundle ordered by fate, each fate's rays in SPREAD_PASSES interleaved passes,
 * with each fate's range and ray count. A ray of one point (or none) has no segment.
 */
export function groupSegmentsByFate(rayFirstPoint: Uint32Array, fates: Uint8Array, rayCount: number): Pick<AssembledBundle, "segmentIndex" | "fateGroups" | "fateCounts"> {
  const fateCounts = Object.fromEntries(RAY_FATES.map((fate) => [fate, 0])) as Record<RayFate, number>;
  let segmentTotal = 0;
  for (let ray = 0; ray < rayCount; ray++) {
    fateCounts[RAY_FATES[fates[ray]]] += 1;
    segmentTotal += Math.max(0, rayFirstPoint[ray + 1] - rayFirstPoint[ray] - 1);
  }
  const segmentIndex = new Uint32Array(2 * segmentTotal);
  const fateGroups: AssembledBundle["fateGroups"] = [];
  let cursor = 0;
  for (let code = 0; code < RAY_FATES.length; code++) {
    const start = cursor;
    const raysOfFate: number[] = [];
    for (let ray = 0; ray < rayCount; ray++) if (fates[ray] === code) raysOfFate.push(ray);
    for (let pass = 0; pass < SPREAD_PASSES; pass++) {
      for (let rank = pass; rank < raysOfFate.length; rank += SPREAD_PASSES) {
        const ray = raysOfFate[rank];
        for (let p = rayFirstPoint[ray]; p + 1 < rayFirstPoint[ray + 1]; p++) {
          segmentIndex[cursor++] = p;
          segmentIndex[cursor++] = p + 1;
        }
      }
    }
    fateGroups.push({ start, count: cursor - start, fate: RAY_FATES[code] });
  }
  return { segmentIndex, fateGroups, fateCounts };
}

/**
 * Segments along each front in each half-plane (rays i, i + planes, i + 2 planes, … are neighbours),
 * broken where neighbours are too far apart, each unbroken run thinned like a ray.
 */
function wavefrontSegments(wavefronts: Float32Array, rayCount: number, planes: number, frontTimesM: Float64Array, maxGapM: number): { vertices: Float32Array; timesM: Float32Array } {
  const fronts = frontTimesM.length;
  const out: number[] = [];
  const outTimes: number[] = [];
  const kept = new Uint32Array(Math.ceil(rayCount / planes) + 1);
  const pointOffset = (ray: number, front: number) => 3 * (ray * fronts + front);
  const emitRun = (firstRay: number, points: number, front: number) => {
    if (points < 2) return;
    const path = { coords: wavefronts, offset: pointOffset(firstRay, front), stride: 3 * planes * fronts, dims: 3 as const, count: points };
    const count = keptSamples(path, kept);
    for (let k = 0; k + 1 < count; k++) {
      const a = path.offset + kept[k] * path.stride;
      const b = path.offset + kept[k + 1] * path.stride;
      out.push(wavefronts[a], wavefronts[a + 1], wavefronts[a + 2], wavefronts[b], wavefronts[b + 1], wavefronts[b + 2]);
      outTimes.push(frontTimesM[front], frontTimesM[front]);
    }
  };
  for (let plane = 0; plane < planes; plane++) {
    for (let front = 0; front < fronts; front++) {
      let runStart = plane;
      let runPoints = 1;
      for (let ray = plane; ray + planes < rayCount; ray += planes) {
        const a = pointOffset(ray, front);
        const b = pointOffset(ray + planes, front);
        const gap = Math.hypot(wavefronts[a] - wavefronts[b], wavefronts[a + 1] - wavefronts[b + 1], wavefronts[a + 2] - wavefronts[b + 2]);
        // NaN (a ray that never got there) fails this test too, so the line breaks there.
        if (gap <= maxGapM) {
          runPoints += 1;
          continue;
        }
        emitRun(runStart, runPoints, front);
        runStart = ray + planes;
        runPoints = 1;
      }
      emitRun(runStart, runPoints, front);
    }
  }
  return { vertices: new Float32Array(out), timesM: new Float32Array(outTimes) };
}
