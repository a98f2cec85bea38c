"use client";

import { proxy, wrap, type Remote } from "comlink";
import type { PhotometryPoint, PointLensFit, PointLensFitOptions } from "@/lib/lensing/fit";
import type { FitPredictionOptions, FitPredictionOutcome } from "@/lib/lensing/fit-prediction";
import type { FitWorkerApi, FitWorkerOutcome } from "@/workers/fit.worker";

/** What a fit in the worker ends as: the worker's outcome, or cancelled (said in words). */
export type FitClientOutcome = FitWorkerOutcome | { status: "cancelled"; message: string };

const CANCELLED_MESSAGE = "The fit was cancelled before it finished; nothing was fitted.";
const CANCELLED_PREDICTION_MESSAGE = "The prediction was cancelled before it finished.";

/**
 * One light-curve fit at a time in `workers/fit.worker.ts`. `cancel()` ends the worker (the fit is one
 * synchronous loop there and would not read a cancel message before it finished): the request in
 * flight resolves as cancelled, never with a partial fit, and the next `fit` starts a fresh worker.
 */
export class FitWorkerClient {
  private worker: Worker | null = null;
  private api: Remote<FitWorkerApi> | null = null;
  private settleCancelled: (() => void) | null = null;

  /** Fits `points` in the worker; `onProgress(fraction 0..1, words)` as the fit reports. A newer call cancels an older one. */
  fit(points: PhotometryPoint[], options: Omit<PointLensFitOptions, "signal" | "onProgress">, onProgress: (fraction: number, words: string) => void): Promise<FitClientOutcome> {
    return this.run<FitClientOutcome>((api) => api.fit(points, options, proxy(onProgress)), { status: "cancelled", message: CANCELLED_MESSAGE });
  }

  /** predictFromFit of a fit in the worker (1,000 Monte-Carlo draws of the model: seconds with a finite source); cancelled like a fit. */
  predict(fit: PointLensFit, options: FitPredictionOptions): Promise<FitPredictionOutcome> {
    return this.run<FitPredictionOutcome>((api) => api.predict(fit, options), { ok: false, reason: CANCELLED_PREDICTION_MESSAGE });
  }

  /** One request in the worker (started if needed), raced against cancel(). */
  private run<T>(request: (api: Remote<FitWorkerApi>) => Promise<T>, whenCancelled: T): Promise<T> {
    this.cancel();
    if (this.worker === null) {
      this.worker = new Worker(new URL("../../workers/fit.worker.ts", import.meta.url), { type: "module", name: "light-curve-fit" });
      this.api = wrap<FitWorkerApi>(this.worker);
    }
    const cancelled = new Promise<T>((resolve) => {
      this.settleCancelled = () => resolve(whenCancelled);
    });
    const done = request(this.api!).finally(() => {
      this.settleCancelled = null;
    });
    return Promise.race([done, cancelled]);
  }

  /** Cancels the fit in flight, if any, by ending its worker. */
  cancel(): void {
    if (this.settleCancelled === null) return;
    this.settleCancelled();
    this.settleCancelled = null;
    this.dispose();
  }

  dispose(): void {
    this.worker?.terminate();
    this.worker = null;
    this.api = null;
  }
}
