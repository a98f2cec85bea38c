/// <reference lib="webworker" />
// The light-curve fit off the main thread: a thin comlink wrapper around lib/lensing's fitPointLens
// and predictFromFit. Progress reaches the page through a proxied callback; to cancel, the page ends
// the worker (components/lensing/fit-client.ts): the fit is one synchronous loop and never reads a message
// while it runs.
import { expose, transfer } from "comlink";
import { fitPointLens, FitInputError, type PhotometryPoint, type PointLensFit, type PointLensFitOptions } from "@/lib/lensing/fit";
import { predictFromFit, type FitPredictionOptions, type FitPredictionOutcome } from "@/lib/lensing/fit-prediction";

/** A fit, or the photometry's refusal in words (a FitInputError does not survive structured cloning as itself). */
export type FitWorkerOutcome =
  | { status: "done"; fit: PointLensFit }
  | { status: "refused"; message: string; row: number | null; column: FitInputError["column"] | null };

const api = {
  /**
   * fitPointLens with its options (no `signal`: see above). `onProgress` is its own argument, a
   * comlink proxy: comlink passes a proxy only as a top-level argument, never inside an object.
   */
  fit(points: PhotometryPoint[], options: Omit<PointLensFitOptions, "signal" | "onProgress">, onProgress?: (fraction: number, words: string) => void): FitWorkerOutcome {
    try {
      return { status: "done", fit: fitPointLens(points, { ...options, onProgress }) };
    } catch (error) {
      if (error instanceof FitInputError) return { status: "refused", message: error.message, row: error.row ?? null, column: error.column ?? null };
      throw error;
    }
  },
  /** predictFromFit; the band's arrays come back as transferred buffers. */
  predict(fit: PointLensFit, options: FitPredictionOptions): FitPredictionOutcome {
    const outcome = predictFromFit(fit, options);
    if (!outcome.ok) return outcome;
    const { prediction } = outcome;
    const bands = [prediction.bandMagnification, ...prediction.datasets.map((d) => d.bandFlux)];
    return transfer(outcome, [prediction.bandTDays.buffer, ...bands.flatMap((b) => [b.median.buffer, b.low.buffer, b.high.buffer])] as ArrayBuffer[]);
  },
};

export type FitWorkerApi = typeof api;

expose(api);
