/// <reference lib="webworker" />
/**
 * Ray-tracing worker: integrates one slice of the bundle with lib/physics and returns GPU-ready
 * buffers, transferred (not copied) back to the page.
 */

import { expose, transfer } from "comlink";
import type { TracedChunk } from "@/lib/bench/assemble-bundle";
import { rayLineDistances, rayVertices, wavefrontPoints } from "@/lib/bench/bundle-vertices";
import { traceRayBundle } from "@/lib/physics";

/** Relative tolerance for drawn rays: far below a pixel at any zoom the view allows, and quick. */
const DRAWING_RTOL = 1e-7;

export interface ChunkRequest {
  firstRay: number;
  impactParametersM: Float64Array;
  azimuthsRad: Float64Array;
  samples: number;
  startRadiusM: number;
  wavefrontTimesM: Float64Array;
}

const rayTraceWorker = {
  traceChunk(request: ChunkRequest): TracedChunk {
    const { impactParametersM, azimuthsRad, samples, startRadiusM, wavefrontTimesM } = request;
    const rayCount = impactParametersM.length;
    const traced = traceRayBundle(impactParametersM, 1, { samples, startRadius: startRadiusM, rtol: DRAWING_RTOL });
    const chunk: TracedChunk = {
      firstRay: request.firstRay,
      rayCount,
      vertices: rayVertices(traced.xy, rayCount, samples, azimuthsRad),
      lineDistances: rayLineDistances(traced.xy, rayCount, samples),
      fates: traced.fates,
      wavefronts: wavefrontPoints(traced.xy, traced.t, rayCount, samples, azimuthsRad, wavefrontTimesM),
    };
    return transfer(chunk, [chunk.vertices.buffer, chunk.lineDistances.buffer, chunk.fates.buffer, chunk.wavefronts.buffer]);
  },
};

export type RayTraceWorkerApi = typeof rayTraceWorker;

expose(rayTraceWorker);
