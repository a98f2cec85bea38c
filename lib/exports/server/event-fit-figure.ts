import "server-only";
import { and, eq } from "drizzle-orm";
import { z } from "zod";
import { dbClient } from "@/db/client";
import { targets, type Proposal } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { eventFitPlotExport } from "@/lib/exports/figures/event-fit-figure";
import type { PlotExport } from "@/lib/exports/figures/figure-response";
import type { ProvenanceValue } from "@/lib/exports/provenance";
import { fitPointLens, FitInputError } from "@/lib/lensing/fit";
import { defaultReferenceDataset, fitOptionsOf, hasPointLensFit, predictionOptionsOf, type EventFitChoices } from "@/lib/lensing/fit-choices";
import { predictFromFit } from "@/lib/lensing/fit-prediction";
import { targetSchedules } from "@/lib/workspace/derived";
import { photometryBandOf, storedPhotometrySettings } from "@/lib/workspace/photometry-schema";
import type { Actor } from "@/lib/server/actor";
import { feasibilitySettingsOf } from "@/lib/server/derived-columns";
import { getTargetPhotometry } from "@/lib/server/event-photometry";
import { parseOrThrow } from "@/lib/server/http";

const MAX_DATASET_NAME_CHARS = 200;
/**
 * Longest a fit may run for an export (our rule): a point-source fit of 10⁴ points takes well under a
 * second, but a finite source's magnification is slow enough to keep a server busy for minutes.
 */
const EXPORT_FIT_LIMIT_MS = 20_000;
const switchOf = (what: string) => z.enum(["0", "1"], { error: `${what} is 1 (on) or 0 (off).` });

/** The fit panel's choices as the export's query (`eventFitQuery` of the panel writes them). */
const eventFitQuerySchema = z.object({
  targetId: z.uuid({ error: "Name the target by its id." }),
  rescale: switchOf("Error rescaling").default("1"),
  finite: switchOf("Finite source").default("0"),
  parallax: switchOf("Annual parallax").default("0"),
  reference: z
    .string({ error: "The reference dataset is named by text." })
    .min(1, "The reference dataset's name is empty.")
    .max(MAX_DATASET_NAME_CHARS, `The reference dataset's name is at most ${MAX_DATASET_NAME_CHARS} characters.`)
    .optional(),
});

export interface EventFitQuery {
  targetId: string;
  choices: EventFitChoices;
  referenceDataset: string | null;
}

/** The event-fit export's query, checked before the session is asked. */
export function parseEventFitQuery(query: Record<string, string>): EventFitQuery {
  const parsed = parseOrThrow(eventFitQuerySchema, { targetId: query.targetId, rescale: query.rescale, finite: query.finite, parallax: query.parallax, reference: query.reference }, "figure");
  return {
    targetId: parsed.targetId,
    choices: { rescaleErrors: parsed.rescale === "1", finiteSource: parsed.finite === "1", parallax: parsed.parallax === "1" },
    referenceDataset: parsed.reference ?? null,
  };
}

function refuse(message: string, field = "_"): never {
  throw new AppError("bad_request:figure", message, { [field]: [message] });
}

/**
 * The light-curve fit figure of a point-lens target for a member who may read the proposal: the
 * target's photometry (getTargetPhotometry) fitted as the page's panel fits it with the same choices
 * (`fitOptionsOf`), its prediction from the last point, and the target's simulated schedule. Refused
 * in words: a target that is not a point lens, no photometry, photometry the fit refuses, a fit that
 * does not converge, a reference dataset the photometry does not have.
 */
export async function eventFitFigure(proposal: Proposal, query: EventFitQuery, actor: Actor, context: { appOrigin: string; inputs: Record<string, ProvenanceValue> }): Promise<PlotExport> {
  const { db } = dbClient();
  const [target] = await db
    .select()
    .from(targets)
    .where(and(eq(targets.id, query.targetId), eq(targets.proposalId, proposal.id)))
    .limit(1);
  if (!target) throw new AppError("not_found:target", "No such target in this proposal.");
  if (!hasPointLensFit[target.lensModel]) refuse(`${target.name} is not a point-lens target: the light-curve fit is for point-lens events.`);
  const photometry = await getTargetPhotometry({ proposalId: proposal.id, targetId: target.id }, actor);
  if (photometry.points.length === 0) refuse(`${target.name} has no photometry to fit yet: add a photometry file on its page.`);
  const datasets = photometry.files.flatMap((file) => file.datasets);
  const settings = storedPhotometrySettings(proposal.photometry);
  const band = photometryBandOf(settings, target.sourceBand ?? settings.bandId) ?? null;
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
  const [schedule] = targetSchedules(feasibilitySettingsOf(proposal), [target]);
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
