import type { CitationKey } from "@/lib/citations/references";
import { buildProvenance, type ProvenanceValue } from "@/lib/exports/provenance";
import { eventFitData } from "@/lib/exports/figure-data/event-fit-data";
import { EVENT_FIT_HEIGHT_PX, EVENT_FIT_WIDTH_PX, eventFitPlot, eventFitTitle } from "@/lib/figures/event-fit-plot";
import { eventFitView } from "@/lib/figures/event-fit-view";
import { printPalette } from "@/lib/figures/plot-palette";
import type { PhotometryPoint, PointLensFit } from "@/lib/lensing/fit";
import type { EventFitChoices, EventFitTarget } from "@/lib/lensing/fit-choices";
import type { FitPrediction } from "@/lib/lensing/fit-prediction";
import type { ObservingSchedule } from "@/lib/schedule/types";
import { utcIsoOfJd } from "@/lib/exports/figure-data/columns";
import { figureMarkup } from "./figure-markup";
import type { PlotExport } from "./figure-response";

export interface EventFitExportInput {
  target: EventFitTarget & { id: string; name: string };
  points: readonly PhotometryPoint[];
  choices: EventFitChoices;
  referenceDataset: string;
  /** A converged fit of `points` with the choices' options, and its prediction (null when it gave none). */
  fit: PointLensFit;
  prediction: FitPrediction | null;
  schedule: ObservingSchedule | null;
  appOrigin: string;
  /** The target page, the link back. */
  reproducePath: string;
  inputs: Record<string, ProvenanceValue>;
  exportedAt?: Date;
}

/**
 * The event-fit figure and its data as exports: the page's own figure tree in the print
 * style, with the fit's result, the choices that reproduce it and the methods' references in the
 * provenance (Paczyński 1986 light curve; Levenberg 1944 and Marquardt 1963 with Golub & Pereyra 1973's
 * variable projection for the fit; Gould 2004 for the parallax frame; the finite source's Lee et al.
 * 2009 when fitted; the schedule's Sun, Moon and air mass).
 */
export function eventFitPlotExport(input: EventFitExportInput): PlotExport {
  const { target, fit, choices } = input;
  const model = { limbDarkeningU: target.limbDarkeningU ?? 0, event: { raDeg: target.raDeg, decDeg: target.decDeg } };
  const view = eventFitView({ fit, points: input.points, referenceDataset: input.referenceDataset, prediction: input.prediction, schedule: input.schedule, model });
  const title = eventFitTitle(target.name, fit);
  const markup = figureMarkup(eventFitPlot({ view, title, width: EVENT_FIT_WIDTH_PX, height: EVENT_FIT_HEIGHT_PX, palette: printPalette }));
  const reproduceUrl = new URL(input.reproducePath, input.appOrigin).toString();
  const references: CitationKey[] = ["paczynski1986", "levenberg1944", "marquardt1963", "golub1973", "gould2004", "okabe2008"];
  if (choices.finiteSource) references.push("lee2009", "gould2008", "pejcha2009");
  if (input.schedule !== null) references.push("astronomyengine", "pickering2002");
  const provenance = buildProvenance({
    subject: `Light-curve fit: ${title}`,
    reproduceUrl,
    inputs: {
      figure: "event-fit",
      ...input.inputs,
      target: target.name,
      raDeg: target.raDeg,
      decDeg: target.decDeg,
      rescaleErrors: choices.rescaleErrors,
      finiteSource: choices.finiteSource,
      limbDarkeningU: choices.finiteSource ? (target.limbDarkeningU ?? 0) : null,
      parallax: choices.parallax,
      referenceDataset: input.referenceDataset,
      datasets: fit.datasets.map((d) => `${d.dataset} (${d.points} points, errors × ${d.errorScale})`).join("; "),
      chi2: fit.chi2,
      dof: fit.dof,
      t0JdUtc: fit.t0Days,
      u0: fit.u0,
      tEDays: fit.tEDays,
      rho: fit.rho ?? null,
      piEN: fit.piEN ?? null,
      piEE: fit.piEE ?? null,
      predictionFromUtc: view.prediction ? utcIsoOfJd(view.prediction.fromJdUtc) : null,
      predictionToUtc: view.prediction ? utcIsoOfJd(view.prediction.toJdUtc) : null,
      method:
        "Point-source point-lens with blending per dataset (Paczynski 1986), least squares by Levenberg-Marquardt (ml-levenberg-marquardt) with the fluxes solved linearly (variable projection); 1-sigma errors from (J^T J)^-1; parallax in Gould 2004's geocentric frame; prediction band: 16th-84th percentiles of 1,000 draws of the covariance; all datasets on the reference dataset's magnitudes",
    },
    references,
    exportedAt: input.exportedAt,
  });
  return { markup, title, fileStem: `light-curve-fit-${target.name}`, provenance, data: eventFitData({ view, title, provenance }) };
}
