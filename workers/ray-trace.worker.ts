/// <reference lib="webworker" />
/**
 * Ray-tracing worker: integrates one slice of the bundle with lib/physics and returns GPU-ready
 * buffers, transferred (not copied) back to the page. Wavefronts are read from the full-resolution
 * samples before the rays are thinned for drawing. One worker then joins the chunks into the bundle,
 * so the page receives it ready to draw (joining 5,000 rays took the main thread over 50 ms).
 */

import { expose, transfer } from "comlink";
import { assembleBundle, bundleBuffers, chunkBuffers, type AssembledBundle, type TracedChunk } from "@/lib/ray-view/assemble-bundle";
import { arrivalTimes, drawnRays, wavefrontPoints } from "@/lib/ray-view/bundle-vertices";
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

/**
 * The traced samples of the last chunk, overwritten by the next: they are read only inside
 * `traceChunk` (the drawn vertices and wavefronts are copies), and fresh buffers of this size cost
 * more in page faults than the tracing itself (npm run bench -- physics).
 */
let sampleScratch: { xy: Float32Array; t: Float32Array } | undefined;

const rayTraceWorker = {
  traceChunk(request: ChunkRequest): TracedChunk {
    const { impactParametersM, azimuthsRad, samples, startRadiusM, wavefrontTimesM } = request;
    const rayCount = impactParametersM.length;
    const need = rayCount * samples;
    if (sampleScratch === undefined || sampleScratch.t.length < need) sampleScratch = { xy: new Float32Array(2 * need), t: new Float32Array(need) };
    const traced = traceRayBundle(impactParametersM, 1, { samples, startRadius: startRadiusM, rtol: DRAWING_RTOL, into: sampleScratch });
    const wavefronts = wavefrontPoints(traced.xy, traced.t, rayCount, samples, azimuthsRad, wavefrontTimesM);
    const chunk: TracedChunk = {
      firstRay: request.firstRay,
      rayCount,
      ...drawnRays(traced.xy, traced.t, rayCount, samples, azimuthsRad),
      fates: traced.fates,
      deflectionsRad: Float32Array.from(traced.deflections),
      arrivalTimesM: arrivalTimes(traced.t, traced.fates, samples),
      wavefronts,
    };
    return transfer(chunk, chunkBuffers(chunk));
  },

  assemble({ chunks, rayCount, planes, wavefrontTimesM, startRadiusM }: AssembleRequest): AssembledBundle {
    const bundle = assembleBundle(chunks, rayCount, planes, wavefrontTimesM, startRadiusM);
    return transfer(bundle, bundleBuffers(bundle));
  },
};

export interface AssembleRequest {
  chunks: TracedChunk[];
  rayCount: number;
  planes: number;
  wavefrontTimesM: Float64Array;
  startRadiusM: number;
}

export type RayTraceWorkerApi = typeof rayTraceWorker;

expose(rayTraceWorker);
