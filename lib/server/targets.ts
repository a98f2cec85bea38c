import "server-only";
import { and, arrayContains, asc, count, desc, eq, ilike, sql, type SQL } from "drizzle-orm";
import { dbClient } from "@/db/client";
import { proposals, targets, type Target } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { formatDeclination, formatRightAscension } from "@/lib/workspace/coordinates";
import type { TargetPage, TargetView } from "@/lib/workspace/target-view";
import type { CaseAnswer } from "@/lib/lensing/science-case-questions";
import { proposalParamsSchema, targetParamsSchema } from "@/lib/workspace/ids";
import { canChangeStatus } from "@/lib/workspace/status";
import { targetListQuerySchema, type TargetSortColumn } from "@/lib/workspace/target-query";
import {
  createTargetSchema,
  lensHypothesisErrors,
  sourcePhotometryErrors,
  updateTargetSchema,
  type LensHypothesis,
} from "@/lib/workspace/target-schema";
import { authorize, parseIds } from "@/lib/server/access";
import { recordActivity } from "@/lib/server/activity";
import { forgetTargetFiles } from "@/lib/server/attachments";
import { forgetTargetPhotometryFiles } from "@/lib/server/event-photometry";
import { requireActor, type Actor } from "@/lib/server/actor";
import { deriveOne, feasibilitySettingsOf } from "@/lib/server/derived-columns";
import { parseOrThrow } from "@/lib/server/http";
import { summaryOf } from "@/lib/workspace/issue-words";
import { deleteStoredFiles } from "@/lib/server/uploads";

export function targetViewOf(t: Target): TargetView {
  return {
    id: t.id,
    proposalId: t.proposalId,
    name: t.name,
    raDeg: t.raDeg,
    decDeg: t.decDeg,
    raText: formatRightAscension(t.raDeg),
    decText: formatDeclination(t.decDeg),
    lensModel: t.lensModel,
    lensMassSolar: t.lensMassSolar,
    velocityDispersionKmPerS: t.velocityDispersionKmPerS,
    lensDistancePc: t.lensDistancePc,
    sourceDistancePc: t.sourceDistancePc,
    lensRedshift: t.lensRedshift,
    sourceRedshift: t.sourceRedshift,
    sourceOffsetThetaE: t.sourceOffsetThetaE,
    properMotionMasPerYr: t.properMotionMasPerYr,
    scienceCase: t.scienceCase,
    eventPeakJdUtc: t.eventPeakJdUtc,
    sourceRadiusSolar: t.sourceRadiusSolar,
    sourceRadiusThetaE: t.sourceRadiusThetaE,
    limbDarkeningU: t.limbDarkeningU,
    sourceMagnitude: t.sourceMagnitude,
    sourceBand: t.sourceBand,
    blendFraction: t.blendFraction,
    einsteinTimeDays: t.einsteinTimeDays,
    parallaxNorth: t.parallaxNorth,
    parallaxEast: t.parallaxEast,
    orbitSemiMajorAxisAu: t.orbitSemiMajorAxisAu,
    orbitSemiMajorAxisMas: t.orbitSemiMajorAxisMas,
    orbitEccentricity: t.orbitEccentricity,
    orbitPeriodDays: t.orbitPeriodDays,
    orbitPeriapsisJdUtc: t.orbitPeriapsisJdUtc,
    orbitInclinationDeg: t.orbitInclinationDeg,
    orbitNodeDeg: t.orbitNodeDeg,
    orbitPeriapsisArgumentDeg: t.orbitPeriapsisArgumentDeg,
    priority: t.priority,
    status: t.status,
    tags: t.tags,
    einsteinRadiusMas: t.einsteinRadiusMas,
    imageSeparationMas: t.imageSeparationMas,
    magnificationTotal: t.magnificationTotal,
    timeDelayDays: t.timeDelayDays,
    crossingTimeDays: t.crossingTimeDays,
    shadowDiameterMicroarcsec: t.shadowDiameterMicroarcsec,
    timeRequestHours: t.timeRequestHours,
    peakSignalToNoise: t.peakSignalToNoise,
    answeredCase: t.answeredCase,
    caseVerdict: t.caseVerdict,
    caseAnswers: t.caseAnswers as CaseAnswer[],
    updatedAt: t.updatedAt.toISOString(),
  };
}

const sortableColumns = {
  name: targets.name,
  raDeg: targets.raDeg,
  decDeg: targets.decDeg,
  priority: targets.priority,
  status: targets.status,
  einsteinRadiusMas: targets.einsteinRadiusMas,
  imageSeparationMas: targets.imageSeparationMas,
  magnificationTotal: targets.magnificationTotal,
  timeDelayDays: targets.timeDelayDays,
  crossingTimeDays: targets.crossingTimeDays,
  timeRequestHours: targets.timeRequestHours,
  peakSignalToNoise: targets.peakSignalToNoise,
  caseVerdict: targets.caseVerdict,
  updatedAt: targets.updatedAt,
} satisfies Record<TargetSortColumn, unknown>;

/** An ILIKE pattern matching `text` anywhere, with its own %, _ and backslash taken literally. */
export const likePattern = (text: string) => `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

/** One page of a proposal's targets, sorted and filtered in SQL on known columns only. */
export async function listTargets(params: unknown, query: unknown, actor: Actor | null): Promise<TargetPage> {
  const { proposalId } = parseIds(proposalParamsSchema, params, "proposal");
  const q = parseOrThrow(targetListQuerySchema, query, "query");
  const { db } = dbClient();
  await authorize(db, proposalId, requireActor(actor), "read", "target");
  const filters: (SQL | undefined)[] = [
    eq(targets.proposalId, proposalId),
    q.q ? ilike(targets.name, likePattern(q.q)) : undefined,
    q.status ? eq(targets.status, q.status) : undefined,
    q.lensModel ? eq(targets.lensModel, q.lensModel) : undefined,
    q.tag ? arrayContains(targets.tags, [q.tag]) : undefined,
    q.caseVerdict ? eq(targets.caseVerdict, q.caseVerdict) : undefined,
    q.answeredCase ? eq(targets.answeredCase, q.answeredCase) : undefined,
  ];
  const where = and(...filters);
  const column = sortableColumns[q.sort];
  // Rows without a value (a model that gives none) sort last either way; id breaks ties so paging is stable.
  const order = q.direction === "asc" ? sql`${asc(column)} nulls last` : sql`${desc(column)} nulls last`;
  const [rows, [{ total }]] = await Promise.all([
    db.select().from(targets).where(where).orderBy(order, asc(targets.id)).limit(q.pageSize).offset((q.page - 1) * q.pageSize),
    db.select({ total: count() }).from(targets).where(where),
  ]);
  return { rows: rows.map(targetViewOf), total, page: q.page, pageSize: q.pageSize };
}

/** A target of the proposal, or 404. */
export async function loadTarget(db: Parameters<typeof authorize>[0], proposalId: string, targetId: string): Promise<Target> {
  const [target] = await db.select().from(targets).where(and(eq(targets.id, targetId), eq(targets.proposalId, proposalId))).limit(1);
  if (!target) throw new AppError("not_found:target", "No such target in this proposal.");
  return target;
}

/** A target of the proposal locked until the transaction ends, or 404: two changes of one target apply one after the other, never interleaved. */
export async function lockTarget(tx: Parameters<typeof authorize>[0], proposalId: string, targetId: string): Promise<Target> {
  const [target] = await tx
    .select()
    .from(targets)
    .where(and(eq(targets.id, targetId), eq(targets.proposalId, proposalId)))
    .for("update");
  if (!target) throw new AppError("not_found:target", "No such target in this proposal.");
  return target;
}

export async function getTarget(params: unknown, actor: Actor | null): Promise<TargetView> {
  const { proposalId, targetId } = parseIds(targetParamsSchema, params, "target");
  const { db } = dbClient();
  await authorize(db, proposalId, requireActor(actor), "read", "target");
  return targetViewOf(await loadTarget(db, proposalId, targetId));
}

function requireCompleteHypothesis(h: LensHypothesis): void {
  const fields = { ...lensHypothesisErrors(h), ...sourcePhotometryErrors(h) };
  if (Object.keys(fields).length > 0) throw new AppError("bad_request:target", summaryOf(fields), fields);
}

/** Co-I or PI. The derived columns are computed from the new target and the proposal's instrument, site and cycle. */
export async function createTarget(params: unknown, input: unknown, actor: Actor | null): Promise<TargetView> {
  const { proposalId } = parseIds(proposalParamsSchema, params, "proposal");
  const who = requireActor(actor);
  const { ra, dec, ...data } = parseOrThrow(createTargetSchema, input, "target");
  requireCompleteHypothesis(data);
  return dbClient().db.transaction(async (tx) => {
    const access = await authorize(tx, proposalId, who, "edit", "target");
    const derived = deriveOne({ ...data, raDeg: ra, decDeg: dec }, feasibilitySettingsOf(access.proposal));
    const [target] = await tx
      .insert(targets)
      .values({ ...data, raDeg: ra, decDeg: dec, ...derived, proposalId, createdBy: who.userId })
      .returning();
    await tx.update(proposals).set({ updatedAt: new Date() }).where(eq(proposals.id, proposalId));
    await recordActivity(tx, { proposalId, actorId: who.userId, action: "target.added", subject: target.name });
    return targetViewOf(target);
  });
}

/** Co-I or PI. Status moves follow the allowed transitions; the hypothesis must stay complete. */
export async function updateTarget(params: unknown, input: unknown, actor: Actor | null): Promise<TargetView> {
  const { proposalId, targetId } = parseIds(targetParamsSchema, params, "target");
  const who = requireActor(actor);
  const { ra, dec, ...patch } = parseOrThrow(updateTargetSchema, input, "target");
  return dbClient().db.transaction(async (tx) => {
    const access = await authorize(tx, proposalId, who, "edit", "target");
    const current = await lockTarget(tx, proposalId, targetId);
    if (patch.status && !canChangeStatus(current.status, patch.status)) {
      throw new AppError("bad_request:target", `A ${current.status} target cannot become ${patch.status}.`, {
        status: [`Not allowed from ${current.status}.`],
      });
    }
    const merged = { ...current, ...patch };
    requireCompleteHypothesis(merged);
    const derived = deriveOne({ ...merged, raDeg: ra ?? current.raDeg, decDeg: dec ?? current.decDeg }, feasibilitySettingsOf(access.proposal));
    const [target] = await tx
      .update(targets)
      .set({
        ...patch,
        ...(ra !== undefined ? { raDeg: ra } : {}),
        ...(dec !== undefined ? { decDeg: dec } : {}),
        ...derived,
        updatedAt: new Date(),
      })
      .where(eq(targets.id, targetId))
      .returning();
    const what = patch.status && patch.status !== current.status ? `${target.name} → ${patch.status}` : target.name;
    await recordActivity(tx, { proposalId, actorId: who.userId, action: "target.updated", subject: what });
    return targetViewOf(target);
  });
}

/** Co-I or PI; its notes go with it. */
export async function deleteTarget(params: unknown, actor: Actor | null): Promise<void> {
  const { proposalId, targetId } = parseIds(targetParamsSchema, params, "target");
  const who = requireActor(actor);
  const storedKeys = await dbClient().db.transaction(async (tx) => {
    await authorize(tx, proposalId, who, "edit", "target");
    const target = await loadTarget(tx, proposalId, targetId);
    // Its notes, their attachments and its photometry go with it (cascade); the file records are the proposal's, so they are forgotten here.
    const keys = [...(await forgetTargetFiles(tx, targetId)), ...(await forgetTargetPhotometryFiles(tx, targetId))];
    await tx.delete(targets).where(eq(targets.id, targetId));
    await recordActivity(tx, { proposalId, actorId: who.userId, action: "target.removed", subject: target.name });
    return keys;
  });
  // The stored bytes go only once the target is gone for certain.
  await deleteStoredFiles(storedKeys);
}
