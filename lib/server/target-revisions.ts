import "server-only";
import { and, desc, eq, isNull } from "drizzle-orm";
import { dbClient, type Database } from "@/db/client";
import { targetRevisions, targets, users, type Target, type TargetRevision } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { lensModelOf } from "@/lib/lensing/registry";
import { targetParamsSchema } from "@/lib/workspace/ids";
import {
  applyFitRequestSchema,
  fitRevisionFields,
  revisionParamsSchema,
  type FitRevisionField,
  type FitRevisionValues,
  type FitSummary,
  type TargetRevisionView,
} from "@/lib/workspace/fit-revision";
import { fitAppliedWords, fitUndoneWords } from "@/lib/workspace/fit-revision-words";
import type { FeasibilitySettings } from "@/lib/workspace/derived";
import type { TargetView } from "@/lib/workspace/target-view";
import { authorize, parseIds } from "@/lib/server/access";
import { recordActivity } from "@/lib/server/activity";
import { requireActor, type Actor } from "@/lib/server/actor";
import { deriveOne, feasibilitySettingsOf } from "@/lib/server/derived-columns";
import { parseOrThrow } from "@/lib/server/http";
import { loadTarget, lockTarget, targetViewOf } from "@/lib/server/targets";

type Transaction = Parameters<Parameters<Database["transaction"]>[0]>[0];

/** Our rule: the list shows a target's newest revisions, this many at most. */
const MAX_LISTED_REVISIONS = 100;

/** The values of the fields a fit sets, as a revision keeps them. */
function fitValuesOf(t: Target): FitRevisionValues {
  return Object.fromEntries(fitRevisionFields.map((field) => [field, t[field]])) as FitRevisionValues;
}

/** Whether the target still holds exactly these values (doubles compare exactly: jsonb keeps every digit). */
function holds(t: Target, values: FitRevisionValues): boolean {
  return fitRevisionFields.every((field) => t[field] === values[field]);
}

/** Writes `values` into the target with its derived columns recomputed, as a target edit does. */
async function writeFitValues(tx: Transaction, target: Target, values: FitRevisionValues, settings: FeasibilitySettings): Promise<Target> {
  const typed = values as Pick<Target, FitRevisionField>;
  const derived = deriveOne({ ...target, ...typed }, settings);
  const [updated] = await tx
    .update(targets)
    .set({ ...typed, ...derived, updatedAt: new Date() })
    .where(eq(targets.id, target.id))
    .returning();
  return updated;
}

/** The latest applied fit of a target that is not undone, or undefined. */
async function latestStandingFit(tx: Pick<Database, "select">, targetId: string): Promise<TargetRevision | undefined> {
  const [latest] = await tx
    .select()
    .from(targetRevisions)
    .where(and(eq(targetRevisions.targetId, targetId), eq(targetRevisions.kind, "light_curve_fit"), isNull(targetRevisions.undoneAt)))
    .orderBy(desc(targetRevisions.createdAt))
    .limit(1);
  return latest;
}

function revisionViewOf(r: TargetRevision, actorName: string | null, canUndo: boolean): TargetRevisionView {
  return {
    id: r.id,
    kind: r.kind,
    before: r.before as FitRevisionValues,
    after: r.after as FitRevisionValues,
    summary: r.summary as FitSummary | null,
    actorName,
    createdAt: r.createdAt.toISOString(),
    undoneAt: r.undoneAt === null ? null : r.undoneAt.toISOString(),
    canUndo,
  };
}

/**
 * Co-I or PI. Applies a light-curve fit to a point-lens target as one revision: t0, |u0|, the fitted
 * t_E (which then stands for θ_E/μ_rel: lib/workspace/derived.ts), the parallax (null when the fit had
 * none), the source's magnitude, band and f_s, and ρ. A fit without a finite source (ρ null) leaves
 * the stored ρ as it is: the fit measured nothing about the source's size. The values before are
 * kept for undo, the derived columns recomputed, and the feed says what the fit was.
 */
export async function applyFit(params: unknown, input: unknown, actor: Actor | null): Promise<{ target: TargetView; revision: TargetRevisionView }> {
  const { proposalId, targetId } = parseIds(targetParamsSchema, params, "target");
  const who = requireActor(actor);
  const fit = parseOrThrow(applyFitRequestSchema, input, "revision");
  return dbClient().db.transaction(async (tx) => {
    const access = await authorize(tx, proposalId, who, "edit", "target");
    const current = await lockTarget(tx, proposalId, targetId);
    const model = lensModelOf(current.lensModel);
    if (model.timescale !== "einsteinTime") {
      throw new AppError("conflict:revision", `${current.name} is a ${model.label.toLowerCase()}, whose light varies by its images' delay, not as a microlensing event: a light-curve fit does not apply to it.`);
    }
    if (fit.rho !== null && current.sourceRadiusSolar !== null) {
      throw new AppError("conflict:revision", `${current.name} gives its source's radius in R☉, and a fit with a finite source sets ρ instead: clear the source radius first, or apply a fit without a finite source.`);
    }
    const before = fitValuesOf(current);
    const after: FitRevisionValues = {
      eventPeakJdUtc: fit.t0JdUtc,
      sourceOffsetThetaE: fit.u0,
      einsteinTimeDays: fit.einsteinTimeDays,
      sourceRadiusThetaE: fit.rho ?? current.sourceRadiusThetaE,
      parallaxNorth: fit.parallaxNorth,
      parallaxEast: fit.parallaxEast,
      sourceMagnitude: fit.sourceMagnitude,
      sourceBand: fit.sourceBand,
      blendFraction: fit.blendFraction,
    };
    const target = await writeFitValues(tx, current, after, feasibilitySettingsOf(access.proposal));
    const [revision] = await tx
      .insert(targetRevisions)
      .values({ targetId, kind: "light_curve_fit", before, after, summary: fit.summary, actorId: who.userId })
      .returning();
    await recordActivity(tx, { proposalId, actorId: who.userId, action: "target.fit_applied", subject: fitAppliedWords(target.name, after, fit.summary) });
    return { target: targetViewOf(target), revision: revisionViewOf(revision, who.name, true) };
  });
}

/**
 * Co-I or PI. Undoes the target's latest applied fit that is not undone yet, while the target still
 * holds the fit's values: the values before it come back, the derived columns are recomputed, the
 * fit is marked undone and the undo is kept as a revision of its own. After a hand edit the values
 * are the team's, so the undo is refused (409) rather than overwriting them.
 */
export async function undoRevision(params: unknown, actor: Actor | null): Promise<{ target: TargetView; revision: TargetRevisionView }> {
  const { proposalId, targetId, revisionId } = parseIds(revisionParamsSchema, params, "revision");
  const who = requireActor(actor);
  return dbClient().db.transaction(async (tx) => {
    const access = await authorize(tx, proposalId, who, "edit", "target");
    const current = await lockTarget(tx, proposalId, targetId);
    const [fit] = await tx
      .select()
      .from(targetRevisions)
      .where(and(eq(targetRevisions.id, revisionId), eq(targetRevisions.targetId, targetId)))
      .limit(1);
    if (!fit) throw new AppError("not_found:revision", "No such revision of this target.");
    if (fit.kind !== "light_curve_fit") throw new AppError("conflict:revision", "An undo cannot be undone; apply the fit again instead.");
    if (fit.undoneAt !== null) throw new AppError("conflict:revision", `This fit of ${current.name} was undone already.`);
    const latest = await latestStandingFit(tx, targetId);
    if (latest?.id !== fit.id) throw new AppError("conflict:revision", `A later fit was applied to ${current.name}; undo that one first.`);
    const applied = fit.after as FitRevisionValues;
    if (!holds(current, applied)) {
      throw new AppError("conflict:revision", `${current.name} was edited after this fit was applied; change the values by hand instead.`);
    }
    const restored = fit.before as FitRevisionValues;
    const target = await writeFitValues(tx, current, restored, feasibilitySettingsOf(access.proposal));
    await tx.update(targetRevisions).set({ undoneAt: new Date() }).where(eq(targetRevisions.id, fit.id));
    const [undo] = await tx
      .insert(targetRevisions)
      .values({ targetId, kind: "undo", before: applied, after: restored, summary: null, undoes: fit.id, actorId: who.userId })
      .returning();
    await recordActivity(tx, { proposalId, actorId: who.userId, action: "target.fit_undone", subject: fitUndoneWords(target.name, restored) });
    return { target: targetViewOf(target), revision: revisionViewOf(undo, who.name, false) };
  });
}

/** Any member (and an auditing admin): the target's revisions, newest first, the undoable fit marked. */
export async function listRevisions(params: unknown, actor: Actor | null): Promise<TargetRevisionView[]> {
  const { proposalId, targetId } = parseIds(targetParamsSchema, params, "target");
  const { db } = dbClient();
  await authorize(db, proposalId, requireActor(actor), "read", "target");
  const target = await loadTarget(db, proposalId, targetId);
  const rows = await db
    .select({ revision: targetRevisions, actorName: users.name })
    .from(targetRevisions)
    .leftJoin(users, eq(users.id, targetRevisions.actorId))
    .where(eq(targetRevisions.targetId, targetId))
    .orderBy(desc(targetRevisions.createdAt))
    .limit(MAX_LISTED_REVISIONS);
  const standing = rows.find(({ revision }) => revision.kind === "light_curve_fit" && revision.undoneAt === null)?.revision;
  const undoable = standing !== undefined && holds(target, standing.after as FitRevisionValues) ? standing.id : null;
  return rows.map(({ revision, actorName }) => revisionViewOf(revision, actorName, revision.id === undoable));
}
