import "server-only";
import { and, asc, eq } from "drizzle-orm";
import { z } from "zod";
import { dbClient } from "@/db/client";
import { targets } from "@/db/schema";
import { serverEnv } from "@/lib/env";
import { AppError } from "@/lib/errors";
import { MAX_CALENDAR_TARGETS, proposalCalendar } from "@/lib/exports/calendar/proposal-calendar";
import { proposalParamsSchema } from "@/lib/workspace/ids";
import { authorize, parseIds } from "@/lib/server/access";
import { requireActor, type Actor } from "@/lib/server/actor";
import { feasibilitySettingsOf } from "@/lib/server/derived-columns";
import { parseOrThrow } from "@/lib/server/http";
import { targetViewOf } from "@/lib/server/targets";

const calendarQuerySchema = z.object({
  targetId: z.uuid({ error: "Name the target by its id." }).optional(),
});

/**
 * The calendar of one target (`targetId`) or of the proposal's targets (the first
 * `MAX_CALENDAR_TARGETS`, by priority then name): proposalCalendar. Any member may download it,
 * viewers included. Order: validate → session → load and role → compute.
 */
export async function loadCalendar(params: unknown, query: unknown, actor: Actor | null): Promise<{ ics: string; fileName: string }> {
  const { proposalId } = parseIds(proposalParamsSchema, params, "proposal");
  const { targetId } = parseOrThrow(calendarQuerySchema, query, "calendar");
  const who = requireActor(actor);
  const { db } = dbClient();
  const { proposal } = await authorize(db, proposalId, who, "read", "calendar");
  const rows = await db
    .select()
    .from(targets)
    .where(targetId === undefined ? eq(targets.proposalId, proposalId) : and(eq(targets.proposalId, proposalId), eq(targets.id, targetId)))
    .orderBy(asc(targets.priority), asc(targets.name), asc(targets.id))
    .limit(MAX_CALENDAR_TARGETS);
  if (targetId !== undefined && rows.length === 0) throw new AppError("not_found:target", "No such target in this proposal.");
  return proposalCalendar({
    proposal,
    settings: feasibilitySettingsOf(proposal),
    views: rows.map(targetViewOf),
    isSingle: targetId !== undefined,
    origin: serverEnv().NEXTAUTH_URL,
  });
}
