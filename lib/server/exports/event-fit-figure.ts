import "server-only";
import { and, eq } from "drizzle-orm";
import { z } from "zod";
import { dbClient } from "@/db/client";
import { targets, type Proposal } from "@/db/schema";
import { AppError } from "@/lib/errors";
import type { PlotExport } from "@/lib/exports/figures/figure-response";
import type { ProvenanceValue } from "@/lib/exports/provenance";
import { eventFitFigureOf, requirePointLensFit, type EventFitQuery } from "@/lib/exports/assembly/event-fit-figure";
import type { Actor } from "@/lib/server/actor";
import { feasibilitySettingsOf } from "@/lib/server/derived-columns";
import { getTargetPhotometry } from "@/lib/server/event-photometry";
import { parseOrThrow } from "@/lib/server/http";

const MAX_DATASET_NAME_CHARS = 200;
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

/** The event-fit export's query, checked before the session is asked. */
export function parseEventFitQuery(query: Record<string, string>): EventFitQuery {
  const parsed = parseOrThrow(eventFitQuerySchema, { targetId: query.targetId, rescale: query.rescale, finite: query.finite, parallax: query.parallax, reference: query.reference }, "figure");
  return {
    targetId: parsed.targetId,
    choices: { rescaleErrors: parsed.rescale === "1", finiteSource: parsed.finite === "1", parallax: parsed.parallax === "1" },
    referenceDataset: parsed.reference ?? null,
  };
}

/**
 * The light-curve fit figure of a point-lens target of `proposal`, which `actor` has been allowed to
 * read: the target (404 when not in this proposal, refused when not a point lens before anything else
 * is loaded) and its photometry (getTargetPhotometry, which checks the role again), then the figure
 * (eventFitFigureOf).
 */
export async function eventFitFigure(proposal: Proposal, query: EventFitQuery, actor: Actor, context: { appOrigin: string; inputs: Record<string, ProvenanceValue> }): Promise<PlotExport> {
  const { db } = dbClient();
  const [target] = await db
    .select()
    .from(targets)
    .where(and(eq(targets.id, query.targetId), eq(targets.proposalId, proposal.id)))
    .limit(1);
  if (!target) throw new AppError("not_found:target", "No such target in this proposal.");
  requirePointLensFit(target);
  const photometry = await getTargetPhotometry({ proposalId: proposal.id, targetId: target.id }, actor);
  return eventFitFigureOf({ proposal, target, photometry, settings: feasibilitySettingsOf(proposal), query, context });
}
