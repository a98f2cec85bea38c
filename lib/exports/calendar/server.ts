import "server-only";
import { and, asc, eq } from "drizzle-orm";
import { z } from "zod";
import { dbClient } from "@/db/client";
import { targets } from "@/db/schema";
import { serverEnv } from "@/lib/env";
import { AppError } from "@/lib/errors";
import { attachmentHeaders, fileSlug } from "@/lib/exports/download";
import { buildProvenance } from "@/lib/exports/provenance";
import { targetCaseReport, targetSchedules } from "@/lib/workspace/derived";
import { proposalParamsSchema } from "@/lib/workspace/ids";
import { skySiteOf } from "@/lib/workspace/proposal-schema";
import { authorize, parseIds } from "@/lib/server/access";
import { requireActor, type Actor, type GetActor } from "@/lib/server/actor";
import { endpoint, queryOf } from "@/lib/server/api/endpoint";
import { feasibilitySettingsOf } from "@/lib/server/derived-columns";
import { parseOrThrow } from "@/lib/server/http";
import { targetViewOf } from "@/lib/server/targets";
import { targetCalendarEvents, type CalendarEvent } from "./events";
import { CALENDAR_CONTENT_TYPE, calendarIcs } from "./ical";

/**
 * Most targets one proposal-wide calendar holds, by priority then name (our rule: each target's
 * schedule and photon budget are computed for the file; a calendar of more is unreadable anyway).
 */
export const MAX_CALENDAR_TARGETS = 200;

const calendarQuerySchema = z.object({
  targetId: z.uuid({ error: "Name the target by its id." }).optional(),
});

/**
 * The calendar of one target (`targetId`) or of the proposal's targets (the first
 * `MAX_CALENDAR_TARGETS`): each one's usable windows and planned visits over the cycle, from the
 * schedule and photon budget the target page shows (`targetSchedules`, `targetCaseReport`). Any
 * member may download it, viewers included. Order: validate → session → load and role → compute.
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
  const settings = feasibilitySettingsOf(proposal);
  if (settings.cycleStartDate === null || settings.cycleEndDate === null) {
    const message = "Set the proposal's cycle dates first: the calendar holds the windows and visits of the cycle's schedule.";
    throw new AppError("bad_request:calendar", message, { _: [message] });
  }
  const origin = serverEnv().NEXTAUTH_URL;
  const site = { ...skySiteOf(settings.site), name: settings.site.name };
  const views = rows.map(targetViewOf);
  const schedules = targetSchedules(settings, views);
  const events: CalendarEvent[] = views.flatMap((target, i) => {
    const schedule = schedules[i];
    if (schedule === null) return [];
    const report = targetCaseReport(target, settings, schedule);
    return targetCalendarEvents({
      target,
      site,
      airmassLimit: settings.instrument.airmassLimit,
      schedule,
      budget: report !== null && "budget" in report.photonBudget ? report.photonBudget.budget : null,
      visitExposureS: settings.instrument.visitMinutes * 60 - (settings.photometry?.overheadS ?? 0),
      uidDomain: new URL(origin).hostname,
      targetUrl: new URL(`/proposals/${proposal.id}/targets/${target.id}`, origin).toString(),
    });
  });
  const single = targetId === undefined ? null : views[0];
  const provenance = buildProvenance({
    subject: single === null ? `Observing calendar of the proposal "${proposal.title}" (${proposal.cycle}), ${views.length} targets` : `Observing calendar of ${single.name}, proposal "${proposal.title}" (${proposal.cycle})`,
    reproduceUrl: new URL(single === null ? `/proposals/${proposal.id}` : `/proposals/${proposal.id}/targets/${single.id}`, origin).toString(),
    inputs: {
      proposalId: proposal.id,
      proposalUpdatedAt: proposal.updatedAt.toISOString(),
      targetId: single?.id ?? null,
      site: `${site.name} (lat ${site.latitudeDeg} deg, lon ${site.longitudeEastDeg} deg, ${site.elevationM} m)`,
      cycle: `${settings.cycleStartDate} to ${settings.cycleEndDate}`,
      airmassLimit: settings.instrument.airmassLimit,
      cadenceHours: settings.instrument.cadenceHours,
      visitMinutes: settings.instrument.visitMinutes,
      clearNightFraction: settings.instrument.clearNightFraction,
      targetCount: views.length,
    },
    references: ["astronomyengine", "pickering2002", "krisciunas1991", "merline1995"],
  });
  const ics = calendarIcs({
    name: single === null ? `${proposal.title}: observing calendar` : `${single.name}: observing calendar (${proposal.title})`,
    site,
    events,
    provenance,
  });
  const fileName = `${fileSlug(proposal.title)}-${single === null ? "all-targets" : fileSlug(single.name)}.ics`;
  return { ics, fileName };
}

/** /api/proposals/[proposalId]/exports/calendar?targetId=…: the iCalendar download. */
export function calendarRoutes(getActor: GetActor) {
  return {
    GET: endpoint<{ proposalId: string }>(getActor, async ({ request, params, actor }) => {
      const { ics, fileName } = await loadCalendar(params, queryOf(request), actor);
      return new Response(ics, { headers: attachmentHeaders(fileName, CALENDAR_CONTENT_TYPE) });
    }),
  };
}
