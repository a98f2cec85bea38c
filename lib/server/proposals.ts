import "server-only";
import { asc, count, desc, eq, sum } from "drizzle-orm";
import { dbClient } from "@/db/client";
import { proposalMembers, proposals, targets, uploadedFiles, type Proposal } from "@/db/schema";
import { SEASON_MAX_TARGETS } from "@/lib/astro/season";
import { AppError, type FieldErrors } from "@/lib/errors";
import { proposalParamsSchema } from "@/lib/workspace/ids";
import {
  createProposalSchema,
  proposalSettingsErrors,
  updateProposalSchema,
  type ProposalInput,
} from "@/lib/workspace/proposal-schema";
import { permissionsFor, type Permissions, type ProposalRole } from "@/lib/workspace/roles";
import { authorize, loadAccess, parseIds } from "@/lib/server/access";
import { recordActivity } from "@/lib/server/activity";
import { requireActor, type Actor } from "@/lib/server/actor";
import { changesDerivation, feasibilitySettingsOf, instrumentSettingsOf, rederiveTargets } from "@/lib/server/derived-columns";
import { storedPhotometrySettings } from "@/lib/workspace/photometry-schema";
import type { ProposalTimeRequest } from "@/lib/workspace/time-request";
import { parseOrThrow } from "@/lib/server/http";
import { summaryOf } from "@/lib/workspace/issue-words";
import { deleteStoredFiles } from "@/lib/server/uploads";
import type { ProposalSummary } from "@/lib/workspace/proposal-view";

export interface ProposalDetail extends ProposalInput {
  id: string;
  role: ProposalRole;
  /** A site admin reading a proposal they are not on (with a viewer's rights). */
  isAudit: boolean;
  permissions: Permissions;
  createdAt: string;
  updatedAt: string;
}

function detailOf(p: Proposal, { role, isAudit }: { role: ProposalRole; isAudit: boolean }): ProposalDetail {
  return {
    id: p.id,
    title: p.title,
    cycle: p.cycle,
    abstract: p.abstract,
    cycleStartDate: p.cycleStartDate,
    cycleEndDate: p.cycleEndDate,
    site: {
      name: p.siteName,
      latitudeDeg: p.siteLatitudeDeg,
      longitudeDeg: p.siteLongitudeDeg,
      elevationM: p.siteElevationM,
      horizonLimitDeg: p.siteHorizonLimitDeg,
    },
    instrument: instrumentSettingsOf(p),
    photometry: storedPhotometrySettings(p.photometry),
    role,
    isAudit,
    permissions: permissionsFor(role),
    createdAt: p.createdAt.toISOString(),
    updatedAt: p.updatedAt.toISOString(),
  };
}

function columnsOf(input: Partial<ProposalInput>) {
  return {
    ...(input.title !== undefined ? { title: input.title } : {}),
    ...(input.cycle !== undefined ? { cycle: input.cycle } : {}),
    ...(input.abstract !== undefined ? { abstract: input.abstract } : {}),
    ...(input.cycleStartDate !== undefined ? { cycleStartDate: input.cycleStartDate } : {}),
    ...(input.cycleEndDate !== undefined ? { cycleEndDate: input.cycleEndDate } : {}),
    ...(input.site
      ? {
          siteName: input.site.name,
          siteLatitudeDeg: input.site.latitudeDeg,
          siteLongitudeDeg: input.site.longitudeDeg,
          siteElevationM: input.site.elevationM,
          siteHorizonLimitDeg: input.site.horizonLimitDeg,
        }
      : {}),
    ...(input.instrument ? input.instrument : {}),
    ...(input.photometry ? { photometry: input.photometry } : {}),
  };
}

/** The proposals the actor is a member of, most recently changed first. */
export async function listProposals(actor: Actor | null): Promise<ProposalSummary[]> {
  const { userId } = requireActor(actor);
  const { db } = dbClient();
  const rows = await db
    .select({ proposal: proposals, role: proposalMembers.role, targetCount: count(targets.id) })
    .from(proposalMembers)
    .innerJoin(proposals, eq(proposals.id, proposalMembers.proposalId))
    .leftJoin(targets, eq(targets.proposalId, proposals.id))
    .where(eq(proposalMembers.userId, userId))
    .groupBy(proposals.id, proposalMembers.role)
    .orderBy(desc(proposals.updatedAt))
    .limit(500);
  return rows.map(({ proposal, role, targetCount }) => ({
    id: proposal.id,
    title: proposal.title,
    cycle: proposal.cycle,
    role,
    targetCount,
    updatedAt: proposal.updatedAt.toISOString(),
  }));
}

/** Any signed-in person may start a proposal; they become its PI. */
export async function createProposal(input: unknown, actor: Actor | null): Promise<ProposalDetail> {
  const { userId } = requireActor(actor);
  const data = parseOrThrow(createProposalSchema, input, "proposal");
  requireConsistentSettings(proposalSettingsErrors(data));
  return dbClient().db.transaction(async (tx) => {
    const [proposal] = await tx
      .insert(proposals)
      .values({ ...(columnsOf(data) as Required<ReturnType<typeof columnsOf>>), createdBy: userId })
      .returning();
    await tx.insert(proposalMembers).values({ proposalId: proposal.id, userId, role: "pi" });
    await recordActivity(tx, { proposalId: proposal.id, actorId: userId, action: "proposal.created", subject: proposal.title });
    return detailOf(proposal, { role: "pi", isAudit: false });
  });
}

export async function getProposal(params: unknown, actor: Actor | null): Promise<ProposalDetail> {
  const { proposalId } = parseIds(proposalParamsSchema, params, "proposal");
  const access = await loadAccess(dbClient().db, proposalId, requireActor(actor));
  return detailOf(access.proposal, access);
}

function requireConsistentSettings(fields: FieldErrors): void {
  if (Object.keys(fields).length > 0) throw new AppError("bad_request:proposal", summaryOf(fields), fields);
}

/**
 * PI only. The cross-field checks run on the proposal as it will be stored; changing the instrument,
 * the site or the cycle re-grades every target in the same transaction (their schedules and science
 * cases' answers depend on all three).
 */
export async function updateProposal(params: unknown, input: unknown, actor: Actor | null): Promise<ProposalDetail> {
  const { proposalId } = parseIds(proposalParamsSchema, params, "proposal");
  const who = requireActor(actor);
  const data = parseOrThrow(updateProposalSchema, input, "proposal");
  return dbClient().db.transaction(async (tx) => {
    const access = await authorize(tx, proposalId, who, "manage", "proposal");
    const current = detailOf(access.proposal, access);
    requireConsistentSettings(
      proposalSettingsErrors({
        cycleStartDate: data.cycleStartDate === undefined ? current.cycleStartDate : data.cycleStartDate,
        cycleEndDate: data.cycleEndDate === undefined ? current.cycleEndDate : data.cycleEndDate,
        instrument: data.instrument ?? current.instrument,
        photometry: data.photometry ?? current.photometry,
      }),
    );
    const [proposal] = await tx
      .update(proposals)
      .set({ ...columnsOf(data), updatedAt: new Date() })
      .where(eq(proposals.id, proposalId))
      .returning();
    if (changesDerivation(feasibilitySettingsOf(access.proposal), feasibilitySettingsOf(proposal))) await rederiveTargets(tx, proposal);
    await recordActivity(tx, { proposalId, actorId: who.userId, action: "proposal.updated", subject: proposal.title });
    return detailOf(proposal, access);
  });
}

/** A target's place on the sky, what the season view needs of it. */
export interface SkyTargetRow {
  id: string;
  name: string;
  raDeg: number;
  decDeg: number;
}

/**
 * Any member: the proposal and the sky positions of its targets (by priority, then name), at most
 * `SEASON_MAX_TARGETS`; `total` tells when more exist.
 */
export async function getProposalSky(params: unknown, actor: Actor | null): Promise<{ proposal: ProposalDetail; targets: SkyTargetRow[]; total: number }> {
  const { proposalId } = parseIds(proposalParamsSchema, params, "proposal");
  const { db } = dbClient();
  const access = await authorize(db, proposalId, requireActor(actor), "read", "proposal");
  const [rows, [{ total }]] = await Promise.all([
    db
      .select({ id: targets.id, name: targets.name, raDeg: targets.raDeg, decDeg: targets.decDeg })
      .from(targets)
      .where(eq(targets.proposalId, proposalId))
      .orderBy(asc(targets.priority), asc(targets.name), asc(targets.id))
      .limit(SEASON_MAX_TARGETS),
    db.select({ total: count() }).from(targets).where(eq(targets.proposalId, proposalId)),
  ]);
  return { proposal: detailOf(access.proposal, access), targets: rows, total };
}

/** Any member: the proposal's time request, summed in SQL from the targets' stored budgets. */
export async function getProposalTimeRequest(params: unknown, actor: Actor | null): Promise<ProposalTimeRequest> {
  const { proposalId } = parseIds(proposalParamsSchema, params, "proposal");
  const { db } = dbClient();
  await authorize(db, proposalId, requireActor(actor), "read", "proposal");
  const [row] = await db
    .select({ totalHours: sum(targets.timeRequestHours).mapWith(Number), budgetedTargets: count(targets.timeRequestHours), targetCount: count() })
    .from(targets)
    .where(eq(targets.proposalId, proposalId));
  return { totalHours: row.totalHours ?? 0, budgetedTargets: row.budgetedTargets, targetCount: row.targetCount };
}

/** PI only; targets, notes, members and the feed go with it. */
export async function deleteProposal(params: unknown, actor: Actor | null): Promise<void> {
  const { proposalId } = parseIds(proposalParamsSchema, params, "proposal");
  const who = requireActor(actor);
  const storedKeys = await dbClient().db.transaction(async (tx) => {
    await authorize(tx, proposalId, who, "delete", "proposal");
    // Every file record (note attachments, imported target lists) goes with the proposal (cascade).
    const files = await tx.select({ key: uploadedFiles.key }).from(uploadedFiles).where(eq(uploadedFiles.proposalId, proposalId));
    await tx.delete(proposals).where(eq(proposals.id, proposalId));
    return files.map((file) => file.key);
  });
  // The stored bytes go only once the proposal is gone for certain.
  await deleteStoredFiles(storedKeys);
}
