/**
 * The choices the target page's fit panel offers, turned into the fit's and the prediction's options
 * the same way in the browser and in the figure export, so an exported figure reproduces the panel's
 * fit: error rescaling, a finite source (with the target's limb darkening), annual parallax (at the
 * target's position), and the dataset the figure and the target's source magnitude are read in.
 */

import { REFERENCE_MAGNITUDE } from "@/lib/event-photometry/reference-magnitude";
import type { PhotometryPoint, PointLensFit, PointLensFitOptions } from "./fit";
import type { FitPredictionOptions } from "./fit-prediction";
import type { LensModelId } from "./registry";

/** The lens models whose events the light-curve fit describes: it fits a point lens. */
export const hasPointLensFit: Record<LensModelId, boolean> = { point: true, sis: false };

export interface EventFitChoices {
  rescaleErrors: boolean;
  finiteSource: boolean;
  parallax: boolean;
}

/** The page's defaults: errors rescaled (issue 19: the page turns rescaling on), point source, no parallax. */
export const defaultEventFitChoices: EventFitChoices = { rescaleErrors: true, finiteSource: false, parallax: false };

/** What the fit needs of the target: its position (ICRS degrees) and linear limb-darkening coefficient (null: a uniform disk). */
export interface EventFitTarget {
  raDeg: number;
  decDeg: number;
  limbDarkeningU: number | null;
}

export type EventFitOptions = Omit<PointLensFitOptions, "signal" | "onProgress">;

export function fitOptionsOf(choices: EventFitChoices, target: EventFitTarget): EventFitOptions {
  return {
    rescaleErrors: choices.rescaleErrors,
    ...(choices.finiteSource ? { finiteSource: { limbDarkeningU: target.limbDarkeningU ?? 0 } } : {}),
    ...(choices.parallax ? { parallax: { raDeg: target.raDeg, decDeg: target.decDeg } } : {}),
  };
}

/**
 * The prediction's options for a fit of `points`: the band from the last point (our rule: the data's
 * end is "now" for a live event, and an export made later draws the same band), every dataset's zero
 * point the fluxes' 22 mag, the fit's limb darkening and the event's position. A finite-source fit
 * takes the default draws and band step like any other (our rule, since the magnification's series
 * made it ~0.05 µs a call away from the lens: 1,000 draws on the 0.1 d grid of the demo event's
 * limb-darkened fit, with the source over the lens at the peak, take ~1–2.5 s; scripts/bench/finite-source.ts).
 */
export function predictionOptionsOf(points: readonly PhotometryPoint[], fit: Pick<PointLensFit, "datasets">, target: EventFitTarget): FitPredictionOptions {
  let lastDays = -Infinity;
  for (const point of points) lastDays = Math.max(lastDays, point.tDays);
  return {
    fromDays: lastDays,
    limbDarkeningU: target.limbDarkeningU ?? 0,
    zeroPointsMag: Object.fromEntries(fit.datasets.map((d) => [d.dataset, REFERENCE_MAGNITUDE])),
    event: { raDeg: target.raDeg, decDeg: target.decDeg },
  };
}

/** A band as the proposal names it: its id ("jc-i") and label ("I (Johnson–Cousins)"). */
export interface BandName {
  id: string;
  label: string;
}

/** Whether a dataset's band text ("I", "i", "I (Johnson–Cousins)", "jc-i") names `band`. */
export function isBand(text: string | undefined, band: BandName): boolean {
  if (text === undefined) return false;
  const said = text.trim().toLowerCase();
  const label = band.label.trim().toLowerCase();
  const letter = label.split(" (")[0];
  return said !== "" && (said === label || said === band.id.toLowerCase() || said === letter);
}

/**
 * The dataset the source magnitude is read from by default: the first whose band names the target's
 * band (`band`, null when the proposal's band is not described), else the first dataset (our rule).
 */
export function defaultReferenceDataset(datasets: readonly { name: string; band?: string }[], band: BandName | null): string | null {
  if (datasets.length === 0) return null;
  return (band === null ? undefined : datasets.find((d) => isBand(d.band, band)))?.name ?? datasets[0].name;
}

/** The figure export's query for a fit with these choices (read by lib/server/exports/event-fit-figure.ts). */
export function eventFitQuery(targetId: string, choices: EventFitChoices, referenceDataset: string): Record<string, string> {
  const flag = (on: boolean) => (on ? "1" : "0");
  return { targetId, rescale: flag(choices.rescaleErrors), finite: flag(choices.finiteSource), parallax: flag(choices.parallax), reference: referenceDataset };
}
