"use client";

import { useCallback, useEffect, useRef, useState } from "react";
import type { AssembledBundle } from "@/lib/ray-view/assemble-bundle";
import { bundleLayout } from "@/lib/ray-view/bundle-layout";
import type { BundleInputs } from "@/lib/bench/parse-sketch";
import { RayTracePool } from "@/workers/ray-trace-pool";

/** Work shorter than this finishes before a progress bar would be worth showing. */
const PROGRESS_DELAY_MS = 200;

/** Performance marks the browser benchmark reads: the trace request, and the bundle assembled from the workers. */
export const TRACE_START_MARK = "bench:trace-start";
export const TRACE_DONE_MARK = "bench:trace-done";

export interface RayTraceState {
  /** The last bundle that finished tracing (kept on screen while a newer one is traced). */
  bundle?: AssembledBundle;
  isTracing: boolean;
  /** Fraction done, shown only once the work has lasted PROGRESS_DELAY_MS. */
  progress?: number;
  error?: string;
}

/** Traces bundles in the worker pool; a new trace or `cancel` makes the one in flight stale. */
export function useRayTrace() {
  const poolRef = useRef<RayTracePool | undefined>(undefined);
  const [state, setState] = useState<RayTraceState>({ isTracing: false });

  useEffect(() => {
    const pool = new RayTracePool();
    poolRef.current = pool;
    return () => {
      pool.dispose();
      poolRef.current = undefined;
    };
  }, []);

  const trace = useCallback(async (bundle: BundleInputs) => {
    const pool = poolRef.current;
    if (pool === undefined) return;
    performance.mark(TRACE_START_MARK);
    setState((previous) => ({ bundle: previous.bundle, isTracing: true }));
    const startedAt = performance.now();
    try {
      const outcome = await pool.trace(bundleLayout(bundle), (raysDone, rayCount) => {
        if (performance.now() - startedAt < PROGRESS_DELAY_MS) return;
        setState((previous) => (previous.isTracing ? { ...previous, progress: raysDone / rayCount } : previous));
      });
      if (outcome.status === "done") {
        performance.mark(TRACE_DONE_MARK);
        setState({ bundle: outcome.bundle, isTracing: false });
      }
    } catch (error) {
      setState((previous) => ({ bundle: previous.bundle, isTracing: false, error: error instanceof Error ? error.message : String(error) }));
    }
  }, []);

  const cancel = useCallback(() => {
    poolRef.current?.cancel();
    setState((previous) => ({ bundle: previous.bundle, isTracing: false }));
  }, []);

  return { ...state, trace, cancel };
}
