/**
 * The light-curve fit figure of a point-lens target, assembled from the target and the photometry the
 * data-access layer loaded (lib/server/exports/event-fit-figure.ts): the fit the page's panel makes
 * with the same choices, its prediction and the target's simulated schedule.
 */
import type { Proposal, Target } from "@/db/schema";
import { AppError } from "@/lib/errors";
import type { TargetPhotometryView } from "@/lib/event-photometry/views";
import { eventFitPlotExport } from "@/lib/exports/figures/event-fit-figure";
import type { PlotExport } from "@/lib/exports/figures/figure-response";
import type { ProvenanceValue } from "@/lib/exports/provenance";
import { fitPointLens, FitInputError } from "@/lib/lensing/fit";
import { defaultReferenceDataset, fitOptionsOf, hasPointLensFit, predictionOptionsOf, type EventFitChoices } from "@/lib/lensing/fit-choices";
import { predictFromFit } from "@/lib/lensing/fit-prediction";
import { targetSchedules, type FeasibilitySettings } from "@/lib/workspace/derived";
import { photometryBandOf, storedPhotometrySettings } from "@/lib/workspace/photometry-schema";

/**
 * Longest a fit may run for an export (our rule): a point-source fit of 10⁴ points takes well under a
 * second, but a finite source's magnification is slow enough to keep a server busy for minutes.
 */
const EXPORT_FIT_LIMIT_MS = 20_000;

/** The fit panel's choices as the export's query names them. */
export interface EventFitQuery {
  targetId: string;
  choices: EventFitChoices;
  referenceDataset: string | null;
}

function refuse(message: string, field = "_"): never {
  throw new AppError("bad_request:figure", message, { [field]: [message] });
}

/** Refuses, in words, a target whose lens is no point lens (checked before its photometry is loaded). */
export function requirePointLensFit(target: Pick<Target, "name" | "lensModel">): void {
  if (!hasPointLensFit[target.lensModel]) refuse(`${target.name} is not a point-lens target: the light-curve fit is for point-lens events.`);
}

/**
 * The fit figure of `target` from its `photometry`, fitted as the page's panel fits it with the same
 * choices (`fitOptionsOf`), its prediction from the last point, and the target's simulated schedule
 * under `settings` (the proposal's). Refused in words: no photometry, photometry the fit refuses, a
 * fit that does not converge or outlasts EXPORT_FIT_LIMIT_MS, a reference dataset the photometry does
 * not have.
 */
export function eventFitFigureOf({
  proposal,
  target,
  photometry,
  settings,
  query,
  context,
}: {
  proposal: Proposal;
  target: Target;
  photometry: TargetPhotometryView;
  settings: FeasibilitySettings;
  query: EventFitQuery;
  context: { appOrigin: string; inputs: Record<string, ProvenanceValue> };
}): PlotExport {
  requirePointLensFit(target);
  if (photometry.points.length === 0) refuse(`${target.name} has no photometry to fit yet: add a photometry file on its page.`);
  const datasets = photometry.files.flatMap((file) => file.datasets);
  const photometrySettings = storedPhotometrySettings(proposal.photometry);
  const band = photometryBandOf(photometrySettings, target.sourceBand ?? photometrySettings.bandId) ?? null;
  if (query.referenceDataset !== null && !datasets.some((d) => d.name === query.referenceDataset)) {
    refuse(`The reference dataset “${query.referenceDataset}” is not among ${target.name}'s datasets.`, "reference");
  }
  const referenceDataset = query.referenceDataset ?? defaultReferenceDataset(datasets, band)!;
  const fitTarget = { raDeg: target.raDeg, decDeg: target.decDeg, limbDarkeningU: target.limbDarkeningU };
  const deadline = Date.now() + EXPORT_FIT_LIMIT_MS;
  const signal = {
    get aborted() {
      return Date.now() > deadline;
    },
  };
  let fit;
  try {
    fit = fitPointLens(photometry.points, { ...fitOptionsOf(query.choices, fitTarget), signal });
  } catch (error) {
    if (error instanceof FitInputError) refuse(`The photometry cannot be fitted: ${error.message}`);
    throw error;
  }
  if (fit.cancelled) refuse(`The fit took longer than an export may (${EXPORT_FIT_LIMIT_MS / 1000} s); a finite source is the slow part: export the fit without it, or save the page's figure.`);
  if (!fit.converged) refuse(`The fit did not converge, so there is no figure of it. ${fit.reason ?? ""}`.trim());
  const outcome = predictFromFit(fit, predictionOptionsOf(photometry.points, fit, fitTarget));
  const [schedule] = targetSchedules(settings, [target]);
  return eventFitPlotExport({
    target: { ...fitTarget, id: target.id, name: target.name },
    points: photometry.points,
    choices: query.choices,
    referenceDataset,
    fit,
    prediction: outcome.ok ? outcome.prediction : null,
    schedule,
    appOrigin: context.appOrigin,
    reproducePath: `/proposals/${proposal.id}/targets/${target.id}`,
    inputs: { ...context.inputs, targetId: target.id },
  });
}
