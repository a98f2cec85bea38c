/**
 * What the event-fit figure draws, computed once for the screen (the target page's fit panel) and the
 * exports (its figure and data table): each dataset's points with their errors, the best-fit model,
 * the residuals, the prediction's band and the site's usable windows and visits over the prediction.
 *
 * Every dataset is shown on the reference dataset's magnitude scale (common practice in microlensing
 * plots): a point's flux F of dataset d is carried to the reference through the fit as
 * (F − F_b,d)/F_s,d · F_s,ref + F_b,ref (the magnification it measures), its error scaled by
 * F_s,ref/F_s,d and by the dataset's error factor; so one model curve runs through every dataset and
 * the residuals of all are in the reference's magnitudes. Magnitudes are on the fluxes' 22 mag scale
 * (lib/event-photometry/reference-magnitude.ts); a point whose carried flux is not positive has no
 * magnitude (NaN: not drawn, an empty cell in the table).
 *
 * Times are Julian dates UTC (the photometry reader's geocentric JD UTC), drawn against calendar dates
 * UTC: the schedule, its windows and the prediction's sentence are in dates, which is what a team
 * plans nights by (an HJD − 2450000 axis would need the reader to convert back).
 */

import { magnitudeOfFlux, REFERENCE_MAGNITUDE } from "@/lib/event-photometry/reference-magnitude";
import type { PhotometryPoint, PointLensFit } from "@/lib/lensing/fit";
import { fitMagnifications, alignedFlux, type FitModelOptions } from "@/lib/lensing/fit-model";
import type { FitPrediction } from "@/lib/lensing/fit-prediction";
import type { ObservingSchedule, TimeSpanJd } from "@/lib/schedule/types";
import type { LegendEntry } from "./plot-axes";
import type { PlotPalette } from "./plot-palette";

/** 2.5/ln 10: a flux's relative error as a magnitude error (first order). */
const MAGNITUDE_PER_RELATIVE_FLUX = 2.5 / Math.LN10;
/** Points of the model curve over the whole time axis (our rule: 0.1 d steps over ~200 d). */
const MODEL_CURVE_POINTS = 2000;
/** Share of the time span left free at each end, and of the magnitude span above and below. */
const TIME_PADDING = 0.02;
const MAGNITUDE_PADDING = 0.06;
/** Smallest half-range of the residual panel, mag (our rule: keeps a very good fit's residuals from filling the panel with noise). */
const MIN_RESIDUAL_LIMIT_MAG = 0.02;

type SeriesColour = keyof Pick<PlotPalette, "skyBlue" | "orange" | "bluishGreen" | "vermillion" | "reddishPurple" | "yellow">;
/** Each dataset's colour and marker, in turn: the marker tells the datasets apart without colour. */
const datasetStyles: readonly { colour: SeriesColour; marker: NonNullable<LegendEntry["marker"]> }[] = [
  { colour: "skyBlue", marker: "circle" },
  { colour: "orange", marker: "square" },
  { colour: "bluishGreen", marker: "diamond" },
  { colour: "reddishPurple", marker: "triangle" },
  { colour: "vermillion", marker: "cross" },
];

export interface EventFitDatasetView {
  name: string;
  colour: SeriesColour;
  marker: NonNullable<LegendEntry["marker"]>;
  /** Factor the dataset's errors were multiplied by in the fit. */
  errorScale: number;
  /** Per point, index-aligned: time (JD UTC), the measured flux and error as fitted (22 mag scale, unscaled error). */
  tJdUtc: Float64Array;
  flux: Float64Array;
  fluxErr: Float64Array;
  /** On the reference's scale: magnitude, its error (scaled), the model's magnitude, and data − model (mag). */
  magnitude: Float64Array;
  magnitudeError: Float64Array;
  modelMagnitude: Float64Array;
  residualMag: Float64Array;
}

export interface EventFitPredictionView {
  /** The prediction's period (JD UTC): from the last point for PREDICTION_BAND_DAYS. */
  fromJdUtc: number;
  toJdUtc: number;
  tJdUtc: Float64Array;
  /** The reference dataset's magnitude: median and the 68 % band's bright (84th percentile of flux) and faint (16th) ends. */
  median: Float64Array;
  bright: Float64Array;
  faint: Float64Array;
}

export interface EventFitView {
  referenceDataset: string;
  datasets: EventFitDatasetView[];
  /** The best fit on the reference's scale over the whole time axis. */
  model: { tJdUtc: Float64Array; magnitude: Float64Array };
  prediction: EventFitPredictionView | null;
  /** The schedule's usable windows and visit starts within the prediction's period (none without a schedule). */
  windows: TimeSpanJd[];
  visitsJdUtc: Float64Array;
  /** The time axis (JD UTC) and the midnight UTC its day ticks count from. */
  timeDomainJdUtc: [number, number];
  originJdUtc: number;
  /** Magnitude axis, faint end first (drawn at the bottom). */
  magnitudeDomain: [number, number];
  /** The residual panel's half-range (mag). */
  residualLimitMag: number;
}

export interface EventFitViewInput {
  /** A converged fit of `points` (fitPointLens). */
  fit: PointLensFit;
  points: readonly PhotometryPoint[];
  /** The dataset whose magnitudes the figure is drawn in (one of the fit's). */
  referenceDataset: string;
  /** predictFromFit of the fit from the last point, or null when it gave none. */
  prediction: Pick<FitPrediction, "bandTDays" | "datasets"> | null;
  schedule: Pick<ObservingSchedule, "windows" | "visitsJdUtc"> | null;
  /** The limb darkening and event position the fit was made with. */
  model?: FitModelOptions;
}

/** The time of the last point (JD UTC): where the prediction starts (the figure's and the page's rule). */
export function lastPointJdUtc(points: readonly PhotometryPoint[]): number {
  let last = -Infinity;
  for (const point of points) last = Math.max(last, point.tDays);
  return last;
}

function finiteExtent(values: Iterable<number>, into: [number, number]): void {
  for (const value of values) {
    if (!Number.isFinite(value)) continue;
    if (value < into[0]) into[0] = value;
    if (value > into[1]) into[1] = value;
  }
}

/** The figure's description (see the file's comment). Throws a RangeError in words for a reference dataset the fit does not have. */
export function eventFitView(input: EventFitViewInput): EventFitView {
  const { fit, points, referenceDataset } = input;
  const reference = fit.datasets.find((d) => d.dataset === referenceDataset);
  if (!reference) throw new RangeError(`The fit has no dataset “${referenceDataset}”.`);
  const refMagnitude = (magnification: number) => magnitudeOfFlux(reference.sourceFlux * magnification + reference.blendFlux);

  const allTimes = Float64Array.from(points, (p) => p.tDays);
  const allModel = fitMagnifications(fit, allTimes, input.model);
  const datasets = fit.datasets.map((d, index): EventFitDatasetView => {
    const rows: number[] = [];
    points.forEach((p, i) => {
      if (p.dataset === d.dataset) rows.push(i);
    });
    const magnitude = new Float64Array(rows.length);
    const magnitudeError = new Float64Array(rows.length);
    const modelMagnitude = new Float64Array(rows.length);
    const residualMag = new Float64Array(rows.length);
    const errorToReference = Math.abs(reference.sourceFlux / d.sourceFlux) * d.errorScale;
    rows.forEach((i, k) => {
      const carried = alignedFlux(points[i].flux, d, reference);
      magnitude[k] = magnitudeOfFlux(carried);
      magnitudeError[k] = carried > 0 ? (MAGNITUDE_PER_RELATIVE_FLUX * points[i].fluxErr * errorToReference) / carried : Number.NaN;
      modelMagnitude[k] = refMagnitude(allModel[i]);
      residualMag[k] = magnitude[k] - modelMagnitude[k];
    });
    const style = datasetStyles[index % datasetStyles.length];
    return {
      name: d.dataset,
      colour: style.colour,
      marker: style.marker,
      errorScale: d.errorScale,
      tJdUtc: Float64Array.from(rows, (i) => points[i].tDays),
      flux: Float64Array.from(rows, (i) => points[i].flux),
      fluxErr: Float64Array.from(rows, (i) => points[i].fluxErr),
      magnitude,
      magnitudeError,
      modelMagnitude,
      residualMag,
    };
  });

  const refPrediction = input.prediction?.datasets.find((d) => d.dataset === referenceDataset);
  const prediction: EventFitPredictionView | null =
    input.prediction && refPrediction && input.prediction.bandTDays.length > 0
      ? {
          fromJdUtc: input.prediction.bandTDays[0],
          toJdUtc: input.prediction.bandTDays[input.prediction.bandTDays.length - 1],
          tJdUtc: input.prediction.bandTDays,
          median: refPrediction.bandFlux.median.map(magnitudeOfFlux),
          bright: refPrediction.bandFlux.high.map(magnitudeOfFlux),
          faint: refPrediction.bandFlux.low.map(magnitudeOfFlux),
        }
      : null;

  const time: [number, number] = [Infinity, -Infinity];
  finiteExtent(allTimes, time);
  if (prediction) finiteExtent([prediction.fromJdUtc, prediction.toJdUtc], time);
  const span = Math.max(time[1] - time[0], 1);
  const timeDomainJdUtc: [number, number] = [time[0] - TIME_PADDING * span, time[1] + TIME_PADDING * span];

  const modelTimes = Float64Array.from({ length: MODEL_CURVE_POINTS }, (_, k) => timeDomainJdUtc[0] + ((timeDomainJdUtc[1] - timeDomainJdUtc[0]) * k) / (MODEL_CURVE_POINTS - 1));
  // The peak itself, so a peak narrower than the grid's step is still drawn at its height.
  const peakAt = modelTimes.findIndex((t) => t > fit.t0Days);
  const curveTimes = peakAt > 0 ? Float64Array.from([...modelTimes.subarray(0, peakAt), fit.t0Days, ...modelTimes.subarray(peakAt)]) : modelTimes;
  const model = { tJdUtc: curveTimes, magnitude: fitMagnifications(fit, curveTimes, input.model).map(refMagnitude) };

  const magnitudes: [number, number] = [Infinity, -Infinity];
  for (const d of datasets) {
    finiteExtent(d.magnitude.map((m, k) => m - (Number.isFinite(d.magnitudeError[k]) ? d.magnitudeError[k] : 0)), magnitudes);
    finiteExtent(d.magnitude.map((m, k) => m + (Number.isFinite(d.magnitudeError[k]) ? d.magnitudeError[k] : 0)), magnitudes);
  }
  finiteExtent(model.magnitude, magnitudes);
  if (prediction) finiteExtent([...prediction.bright, ...prediction.faint], magnitudes);
  // No magnitude at all (every carried flux ≤ 0): the reference magnitude's neighbourhood, so the axes still draw.
  const [bright, faint] = Number.isFinite(magnitudes[0]) ? magnitudes : [REFERENCE_MAGNITUDE - 1, REFERENCE_MAGNITUDE];
  const magnitudeSpan = Math.max(faint - bright, 0.1);
  const magnitudeDomain: [number, number] = [faint + MAGNITUDE_PADDING * magnitudeSpan, bright - MAGNITUDE_PADDING * magnitudeSpan];

  let residualLimitMag = MIN_RESIDUAL_LIMIT_MAG;
  for (const d of datasets) for (const r of d.residualMag) if (Number.isFinite(r)) residualLimitMag = Math.max(residualLimitMag, Math.abs(r) * (1 + MAGNITUDE_PADDING));

  const period = prediction ? { from: prediction.fromJdUtc, to: prediction.toJdUtc } : null;
  const windows = period && input.schedule ? input.schedule.windows.filter((w) => w.endJdUtc > period.from && w.startJdUtc < period.to).map((w) => ({ startJdUtc: Math.max(w.startJdUtc, period.from), endJdUtc: Math.min(w.endJdUtc, period.to) })) : [];
  const visitsJdUtc = period && input.schedule ? input.schedule.visitsJdUtc.filter((t) => t >= period.from && t <= period.to) : new Float64Array(0);

  return {
    referenceDataset,
    datasets,
    model,
    prediction,
    windows,
    visitsJdUtc: Float64Array.from(visitsJdUtc),
    timeDomainJdUtc,
    originJdUtc: Math.floor(timeDomainJdUtc[0] - 0.5) + 0.5,
    magnitudeDomain,
    residualLimitMag,
  };
}
