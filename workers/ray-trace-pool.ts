/**
 * A pool of ray-tracing workers, sized from navigator.hardwareConcurrency. A bundle is cut into
 * chunks that idle workers take in turn, which gives progress and bounds the work wasted on a bundle
 * that is cancelled: a newer request makes every older one stale, stale chunks are not started, and a
 * stale result is dropped, so it can never replace a newer bundle. The traced chunks are then joined
 * into one bundle in a worker too.
 */

import { transfer, wrap, type Remote } from "comlink";
import { chunkBuffers, type AssembledBundle, type TracedChunk } from "@/lib/ray-view/assemble-bundle";
import type { BundleLayout } from "@/lib/ray-view/bundle-layout";
import type { AssembleRequest, ChunkRequest, RayTraceWorkerApi } from "./ray-trace.worker";

/** Rays per chunk: small enough for smooth progress and quick cancellation, large enough to amortize messaging. */
const CHUNK_RAYS = 200;

/** More workers than this do not pay for their start-up on the bundle sizes the bench allows. */
const MAX_WORKERS = 8;

export type TraceOutcome = { status: "done"; bundle: AssembledBundle } | { status: "cancelled" };

export class RayTracePool {
  private readonly workers: Worker[] = [];
  private readonly remotes: Remote<RayTraceWorkerApi>[] = [];
  private latestRequest = 0;

  constructor(size: number = defaultPoolSize()) {
    for (let i = 0; i < size; i++) {
      const worker = new Worker(new URL("./ray-trace.worker.ts", import.meta.url), { type: "module", name: `ray-trace-${i}` });
      this.workers.push(worker);
      this.remotes.push(wrap<RayTraceWorkerApi>(worker));
    }
  }

  get size(): number {
    return this.workers.length;
  }

  /** Makes any request in flight stale (its promise resolves to "cancelled"). */
  cancel(): void {
    this.latestRequest += 1;
  }

  /** Traces the bundle; `onProgress(raysDone, rayCount)` after each chunk. Errors from workers reject. */
  async trace(layout: BundleLayout, onProgress: (raysDone: number, rayCount: number) => void): Promise<TraceOutcome> {
    const request = ++this.latestRequest;
    const isStale = () => request !== this.latestRequest;
    const rayCount = layout.impactParametersM.length;
    const pending: ChunkRequest[] = [];
    for (let firstRay = 0; firstRay < rayCount; firstRay += CHUNK_RAYS) {
      const end = Math.min(rayCount, firstRay + CHUNK_RAYS);
      pending.push({
        firstRay,
        impactParametersM: layout.impactParametersM.slice(firstRay, end),
        azimuthsRad: layout.azimuthsRad.slice(firstRay, end),
        samples: layout.samples,
        startRadiusM: layout.startRadiusM,
        wavefrontTimesM: layout.wavefrontTimesM,
      });
    }
    const chunks: TracedChunk[] = [];
    let raysDone = 0;
    const drain = async (remote: Remote<RayTraceWorkerApi>) => {
      for (let next = pending.shift(); next !== undefined && !isStale(); next = pending.shift()) {
        const chunk = await remote.traceChunk(next);
        if (isStale()) return;
        chunks.push(chunk);
        raysDone += chunk.rayCount;
        onProgress(raysDone, rayCount);
      }
    };
    try {
      await Promise.all(this.remotes.map(drain));
    } catch (error) {
      pending.length = 0; // the other workers stop after their current chunk
      throw error;
    }
    if (isStale()) return { status: "cancelled" };
    const assembleRequest: AssembleRequest = { chunks, rayCount, planes: layout.planes, wavefrontTimesM: layout.wavefrontTimesM, startRadiusM: layout.startRadiusM };
    const bundle = await this.remotes[0].assemble(transfer(assembleRequest, chunks.flatMap(chunkBuffers)));
    if (isStale()) return { status: "cancelled" };
    return { status: "done", bundle };
  }

  dispose(): void {
    this.cancel();
    for (const worker of this.workers) worker.terminate();
  }
}

function defaultPoolSize(): number {
  const cores = typeof navigator === "undefined" ? 1 : (navigator.hardwareConcurrency ?? 1);
  return Math.max(1, Math.min(MAX_WORKERS, cores));
}
