/**
 * A light-curve fit (fit.ts) in the words and numbers the target page shows and applies: each
 * parameter with its 1σ error from the covariance, each dataset's source and blend as magnitudes, and
 * the request that applies the fit to the target (lib/workspace/fit-revision.ts).
 */

import { magnitudeOfFlux } from "@/lib/event-photometry/reference-magnitude";
import { formatUtcDateTime } from "@/lib/astro/sky-format";
import type { ApplyFitRequest } from "@/lib/workspace/fit-revision";
import type { PointLensFit } from "./fit";
import { formatSignificant } from "@/lib/numbers/significant";

/** The nonlinear parameters in the fit's covariance order, with their label and unit on the page. */
const parameterLabels: Record<string, { label: string; unit: string }> = {
  t0Days: { label: "Peak t0 (UTC)", unit: "d" },
  u0: { label: "Impact parameter u0", unit: "θE" },
  tEDays: { label: "Einstein time t_E", unit: "d" },
  rho: { label: "Source radius ρ", unit: "θE" },
  piEN: { label: "Parallax π_E,N", unit: "" },
  piEE: { label: "Parallax π_E,E", unit: "" },
};

/** The 1σ error of parameter `name` (√ of its covariance diagonal); NaN when absent or the covariance is empty. */
export function sigmaOf(fit: Pick<PointLensFit, "parameterOrder" | "covariance">, name: string): number {
  const index = fit.parameterOrder.indexOf(name);
  const variance = index < 0 ? Number.NaN : fit.covariance[index]?.[index];
  return variance === undefined || !(variance >= 0) ? Number.NaN : Math.sqrt(variance);
}

/**
 * `value ± sigma` with the value rounded where σ's second significant digit falls (common practice);
 * six significant digits when σ is not known.
 */
export function valueWithSigma(value: number, sigma: number): string {
  if (!Number.isFinite(sigma) || sigma <= 0) return `${formatSignificant(value, 6)} (no error: the covariance is singular)`;
  const decimals = Math.min(12, Math.max(0, 1 - Math.floor(Math.log10(sigma))));
  return `${value.toFixed(decimals)} ± ${sigma.toFixed(decimals)}`;
}

export interface FitParameterRow {
  name: string;
  label: string;
  value: number;
  sigma: number;
  /** "2026-07-14 03:10 UTC ± 0.021 d", "0.1203 ± 0.0021", "24.02 ± 0.31 d". */
  text: string;
}

/** The fitted parameters in the covariance's order (t0, u0, t_E, then ρ and π_E when fitted). */
export function fitParameterRows(fit: PointLensFit): FitParameterRow[] {
  const values: Record<string, number | undefined> = { t0Days: fit.t0Days, u0: fit.u0, tEDays: fit.tEDays, rho: fit.rho, piEN: fit.piEN, piEE: fit.piEE };
  return fit.parameterOrder.flatMap((name) => {
    const value = values[name];
    const labels = parameterLabels[name];
    if (value === undefined || labels === undefined) return [];
    const sigma = sigmaOf(fit, name);
    const unit = labels.unit === "" ? "" : ` ${labels.unit}`;
    const text = name === "t0Days" ? `${formatUtcDateTime(value)} ± ${Number.isFinite(sigma) ? formatSignificant(sigma, 2) : "?"} d (JD ${value.toFixed(4)})` : `${valueWithSigma(value, sigma)}${unit}`;
    return [{ name, label: labels.label, value, sigma, text }];
  });
}

export interface DatasetReportRow {
  dataset: string;
  points: number;
  /** Magnitudes of the source and the blend on the fluxes' 22 mag scale (NaN: a flux ≤ 0, no magnitude). */
  sourceMagnitude: number;
  blendMagnitude: number;
  blendFlux: number;
  /** The source's share of the baseline flux, F_s/(F_s + F_b). */
  sourceFraction: number;
  errorScale: number;
  chi2: number;
}

export function datasetReportRows(fit: PointLensFit): DatasetReportRow[] {
  return fit.datasets.map((d) => ({
    dataset: d.dataset,
    points: d.points,
    sourceMagnitude: magnitudeOfFlux(d.sourceFlux),
    blendMagnitude: magnitudeOfFlux(d.blendFlux),
    blendFlux: d.blendFlux,
    sourceFraction: d.sourceFlux / (d.sourceFlux + d.blendFlux),
    errorScale: d.errorScale,
    chi2: d.chi2,
  }));
}

/**
 * The request applying a converged `fit` to its target, the source's magnitude and share of the
 * baseline read from `referenceDataset`: m_s = 22 − 2.5 log10 F_s, f_s = F_s/(F_s + F_b); |u0| (the
 * target stores the impact parameter's size). `sourceBand` is the proposal's band id the dataset is
 * taken to be in (null: the proposal's own). Returns the refusal in words when the reference's
 * source flux is not positive (no magnitude).
 */
export function applyFitRequestOf(fit: PointLensFit, referenceDataset: string, sourceBand: string | null): ApplyFitRequest | { refusal: string } {
  const reference = fit.datasets.find((d) => d.dataset === referenceDataset);
  if (!reference) return { refusal: `The fit has no dataset “${referenceDataset}”.` };
  if (!(reference.sourceFlux > 0)) return { refusal: `The fitted source flux of ${referenceDataset} is not positive, so it gives no source magnitude: choose another reference dataset.` };
  // A singular covariance has no errors to keep (NaN would not survive JSON).
  const sigmas = Object.fromEntries(fitParameterRows(fit).flatMap((row) => (Number.isFinite(row.sigma) ? [[row.name, row.sigma]] : [])));
  return {
    t0JdUtc: fit.t0Days,
    u0: Math.abs(fit.u0),
    einsteinTimeDays: fit.tEDays,
    rho: fit.rho ?? null,
    parallaxNorth: fit.piEN ?? null,
    parallaxEast: fit.piEE ?? null,
    sourceMagnitude: magnitudeOfFlux(reference.sourceFlux),
    blendFraction: reference.sourceFlux / (reference.sourceFlux + reference.blendFlux),
    sourceBand,
    summary: {
      chi2: fit.chi2,
      dof: fit.dof,
      pointCount: fit.datasets.reduce((sum, d) => sum + d.points, 0),
      referenceDataset,
      datasets: fit.datasets.map((d) => d.dataset),
      sigmas,
      errorScales: Object.fromEntries(fit.datasets.map((d) => [d.dataset, d.errorScale])),
    },
  };
}
