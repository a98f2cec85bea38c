/**
 * The observing calendar of a proposal's targets, assembled from what the data-access layer loaded
 * (lib/server/exports/calendar.ts): each target's usable windows and planned visits over the cycle,
 * from the schedule and photon budget the target page shows (`targetSchedules`, `targetCaseReport`).
 */
import type { Proposal } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { fileSlug } from "@/lib/exports/download";
import { buildProvenance } from "@/lib/exports/provenance";
import { targetCaseReport, targetSchedules, type FeasibilitySettings } from "@/lib/workspace/derived";
import { skySiteOf } from "@/lib/workspace/proposal-schema";
import type { TargetView } from "@/lib/workspace/target-view";
import { targetCalendarEvents, type CalendarEvent } from "./events";
import { calendarIcs } from "./ical";

/**
 * Most targets one proposal-wide calendar holds, by priority then name (our rule: each target's
 * schedule and photon budget are computed for the file; a calendar of more is unreadable anyway).
 */
export const MAX_CALENDAR_TARGETS = 200;

/**
 * The calendar file of `views` (one target when `isSingle`, else the proposal's, in priority then name
 * order) under `settings`, the proposal's schedule settings; `origin` is the app's public origin (the
 * events' links and UIDs). Refused in words when the proposal has no cycle dates.
 */
export function proposalCalendar({
  proposal,
  settings,
  views,
  isSingle,
  origin,
}: {
  proposal: Proposal;
  settings: FeasibilitySettings;
  views: TargetView[];
  isSingle: boolean;
  origin: string;
}): { ics: string; fileName: string } {
  if (settings.cycleStartDate === null || settings.cycleEndDate === null) {
    const message = "Set the proposal's cycle dates first: the calendar holds the windows and visits of the cycle's schedule.";
    throw new AppError("bad_request:calendar", message, { _: [message] });
  }
  const site = { ...skySiteOf(settings.site), name: settings.site.name };
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
  const single = isSingle ? views[0] : null;
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
