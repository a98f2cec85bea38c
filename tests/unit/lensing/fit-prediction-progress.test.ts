import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { fitPointLens, type PhotometryPoint } from "@/lib/lensing/fit";
import { predictFromFit } from "@/lib/lensing/fit-prediction";

// The first synthetic two-dataset event of tests/fixtures/generate_point_lens_fits.py (the fit's own fixture).
const event = (
  JSON.parse(readFileSync(new URL("../../fixtures/lensing/point-lens-fits.json", import.meta.url), "utf8")) as {
    events: { points: { tDays: number[]; flux: number[]; fluxErr: number[]; dataset: string[] } }[];
  }
).events[0];
const points: PhotometryPoint[] = event.points.tDays.map((t, i) => ({ tDays: t, flux: event.points.flux[i], fluxErr: event.points.fluxErr[i], dataset: event.points.dataset[i] }));

describe("fitPointLens reports progress and can be cancelled (what workers/fit.worker.ts passes on)", () => {
  it("reports a rising share in [0, 1] with words, ends at 1, and fits exactly as without the callback", () => {
    const heard: { fraction: number; words: string }[] = [];
    const fit = fitPointLens(points, { rescaleErrors: true, onProgress: (fraction, words) => heard.push({ fraction, words }) });
    expect(fit.converged).toBe(true);
    expect(heard.length).toBeGreaterThan(4);
    heard.forEach(({ fraction }, i) => {
      expect(fraction).toBeGreaterThanOrEqual(i === 0 ? 0 : heard[i - 1].fraction);
      expect(fraction).toBeLessThanOrEqual(1);
    });
    expect(heard[0].words).toMatch(/^Point source: search 1 of 4, 10 iterations$|^Point source: 1 of 4 searches done$/);
    expect(heard.some(({ words }) => words.startsWith("Refit with the rescaled errors"))).toBe(true);
    expect(heard.at(-1)).toEqual({ fraction: 1, words: "The fit converged." });
    const quiet = fitPointLens(points, { rescaleErrors: true });
    expect(fit.t0Days).toBe(quiet.t0Days);
    expect(fit.covariance).toEqual(quiet.covariance);
  });

  it("a real fit's covariance, symmetric only to rounding, is sampled (ml-matrix's Cholesky refuses an asymmetric matrix)", () => {
    const fit = fitPointLens(points);
    const outcome = predictFromFit(fit, { fromDays: fit.t0Days - 5, bandDays: 1, draws: 200 });
    expect(outcome.ok).toBe(true);
    if (outcome.ok) expect(Math.abs(outcome.prediction.t0Days.median - fit.t0Days)).toBeLessThan(0.5 * Math.sqrt(fit.covariance[0][0]));
  });

  it("stops when the signal is aborted between rounds, and says so: no parameters, not converged", () => {
    const signal = { aborted: false };
    let calls = 0;
    const fit = fitPointLens(points, {
      signal,
      onProgress: () => {
        calls += 1;
        if (calls === 2) signal.aborted = true;
      },
    });
    expect(calls).toBe(2);
    expect(fit).toMatchObject({ converged: false, cancelled: true, reason: "The fit was cancelled before it finished; nothing was fitted.", parameterOrder: [], covariance: [] });
    expect(fit.t0Days).toBeNaN();
    expect(fit.datasets.map((d) => d.sourceFlux)).toEqual([Number.NaN, Number.NaN]);
    // Nothing downstream takes it for a fit.
    expect(predictFromFit(fit, { fromDays: 0 })).toEqual({ ok: false, reason: "The fit was cancelled, so there is nothing to predict from." });
  });

  it("does not start when the signal is already aborted (an AbortSignal serves)", () => {
    const controller = new AbortController();
    controller.abort();
    let calls = 0;
    const fit = fitPointLens(points, { signal: controller.signal, onProgress: () => (calls += 1) });
    expect(fit.cancelled).toBe(true);
    expect(calls).toBe(0);
  });
});
