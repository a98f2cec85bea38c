/**
 * Joins the traced chunks of a bundle into one set of GPU buffers: every ray's vertices in one array,
 * a segment index ordered by fate (so one BufferGeometry draws the whole bundle with one group per
 * fate), and the wavefront segments between neighbouring rays of each half-plane.
 */

/** Fates as lib/physics codes them in `traceRayBundle`: 0 escaped, 1 captured, 2 winding. */
export const RAY_FATES = ["escaped", "captured", "winding"] as const;
export type RayFate = (typeof RAY_FATES)[number];

/** One traced slice of the bundle, rays [firstRay, firstRay + rayCount), as a worker returns it. */
export interface TracedChunk {
  firstRay: number;
  rayCount: number;
  vertices: Float32Array;
  lineDistances: Float32Array;
  fates: Uint8Array;
  wavefronts: Float32Array;
}

export interface AssembledBundle {
  rayCount: number;
  samples: number;
  vertices: Float32Array;
  lineDistances: Float32Array;
  /** Pairs of vertex indices, escaped rays first, then captured, then winding. */
  segmentIndex: Uint32Array;
  /** Ranges of `segmentIndex` per fate (in index entries), in RAY_FATES order. */
  fateGroups: { start: number; count: number; fate: RayFate }[];
  fateCounts: Record<RayFate, number>;
  /** Wavefront segment end points, [x, y, z] pairs. */
  wavefrontVertices: Float32Array;
  startRadiusM: number;
}

/**
 * A wavefront segment is not drawn across a gap wider than this fraction of the start radius: such a
 * gap separates rays on either side of the photon sphere's capture cross-section, not one front.
 */
const MAX_FRONT_GAP_OF_START_RADIUS = 0.1;

export function assembleBundle(
  chunks: TracedChunk[],
  rayCount: number,
  samples: number,
  planes: number,
  wavefrontCount: number,
  startRadiusM: number,
): AssembledBundle {
  const vertices = new Float32Array(rayCount * samples * 3);
  const lineDistances = new Float32Array(rayCount * samples);
  const fates = new Uint8Array(rayCount);
  const wavefronts = new Float32Array(rayCount * wavefrontCount * 3);
  for (const chunk of chunks) {
    vertices.set(chunk.vertices, chunk.firstRay * samples * 3);
    lineDistances.set(chunk.lineDistances, chunk.firstRay * samples);
    fates.set(chunk.fates, chunk.firstRay);
    wavefronts.set(chunk.wavefronts, chunk.firstRay * wavefrontCount * 3);
  }

  const fateCounts: Record<RayFate, number> = { escaped: 0, captured: 0, winding: 0 };
  for (let ray = 0; ray < rayCount; ray++) fateCounts[RAY_FATES[fates[ray]]] += 1;

  const segmentsPerRay = samples - 1;
  const segmentIndex = new Uint32Array(rayCount * segmentsPerRay * 2);
  const fateGroups: AssembledBundle["fateGroups"] = [];
  let cursor = 0;
  for (let code = 0; code < RAY_FATES.length; code++) {
    const start = cursor;
    for (let ray = 0; ray < rayCount; ray++) {
      if (fates[ray] !== code) continue;
      const base = ray * samples;
      for (let s = 0; s < segmentsPerRay; s++) {
        segmentIndex[cursor++] = base + s;
        segmentIndex[cursor++] = base + s + 1;
      }
    }
    fateGroups.push({ start, count: cursor - start, fate: RAY_FATES[code] });
  }

  return {
    rayCount,
    samples,
    vertices,
    lineDistances,
    segmentIndex,
    fateGroups,
    fateCounts,
    wavefrontVertices: wavefrontSegments(wavefronts, rayCount, planes, wavefrontCount, startRadiusM * MAX_FRONT_GAP_OF_START_RADIUS),
    startRadiusM,
  };
}

/** Segments joining ray i and ray i + planes (neighbours in one half-plane) at each front. */
function wavefrontSegments(wavefronts: Float32Array, rayCount: number, planes: number, fronts: number, maxGapM: number): Float32Array {
  const out = new Float32Array(Math.max(0, rayCount - planes) * fronts * 6);
  let cursor = 0;
  for (let ray = 0; ray + planes < rayCount; ray++) {
    for (let front = 0; front < fronts; front++) {
      const a = 3 * (ray * fronts + front);
      const b = 3 * ((ray + planes) * fronts + front);
      const gap = Math.hypot(wavefronts[a] - wavefronts[b], wavefronts[a + 1] - wavefronts[b + 1], wavefronts[a + 2] - wavefronts[b + 2]);
      // NaN (a ray that never got there) fails this test too, so the line breaks there.
      if (!(gap <= maxGapM)) continue;
      out.set(wavefronts.subarray(a, a + 3), cursor);
      out.set(wavefronts.subarray(b, b + 3), cursor + 3);
      cursor += 6;
    }
  }
  return out.slice(0, cursor);
}
