import { execFileSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { dbClient } from "@/db/client";
import { proposals, targets } from "@/db/schema";
import { dateFromJdUtc } from "@/lib/astro/time";
import { calendarRoutes } from "@/lib/server/api/export-routes";
import type { Actor } from "@/lib/server/actor";
import { getProposal } from "@/lib/server/proposals";
import { getTarget } from "@/lib/server/targets";
import { targetCaseReport, targetSchedules } from "@/lib/workspace/derived";
import { createWorld, proposalInput } from "./support/world";

const folder = mkdtempSync(join(tmpdir(), "arcwright-calendar-"));

afterAll(async () => {
  rmSync(folder, { recursive: true, force: true });
  await dbClient().sql.end();
});

function calendar(actor: Actor | null, proposalId: string, query: string) {
  const url = `http://arcwright.test/api/proposals/${proposalId}/exports/calendar${query}`;
  return calendarRoutes(async () => actor).GET(new Request(url), { params: Promise.resolve({ proposalId }) });
}

interface CheckedEvent {
  uid: string;
  dtstamp: number;
  start: number;
  end: number;
  summary: string;
  location: string;
  geo: [number, number] | null;
  description: string;
}

/** The file as Debian's python3-icalendar reads it (tests/validators/check_calendar.py); throws on any refusal. */
function readWithIcalendar(ics: string, name: string): { version: string; description: string | null; events: CheckedEvent[] } {
  const path = join(folder, name);
  writeFileSync(path, ics);
  return JSON.parse(execFileSync("/usr/bin/python3", ["tests/validators/check_calendar.py", path], { encoding: "utf8" }));
}

/** Unix seconds of a Julian date (UTC), unrounded: the schedule's own instant. */
const unixSeconds = (jdUtc: number) => dateFromJdUtc(jdUtc).getTime() / 1000;

describe("iCalendar of a target's windows and visits (RFC 5545), read by python3-icalendar", () => {
  it("holds the schedule the target page shows, to the second, with stable UIDs, the site and the Sun caution; a non-member gets 404", async () => {
    const world = await createWorld();
    // Two weeks of the 2031 bulge season: the seeded target (RA 17h57m, Dec −29°) is up at night.
    await dbClient().db.update(proposals).set({ cycleStartDate: "2031-06-01", cycleEndDate: "2031-06-14" }).where(eq(proposals.id, world.proposalId));
    const query = `?targetId=${world.targetId}`;

    expect((await calendar(null, world.proposalId, query)).status).toBe(401);
    expect((await calendar(world.actors.outsider, world.proposalId, query)).status).toBe(404);
    expect((await calendar(world.actors.viewer, world.proposalId, "?targetId=3f1e0c1e-0000-4000-8000-000000000000")).status).toBe(404);
    const bad = await calendar(world.actors.viewer, world.proposalId, "?targetId=not-an-id");
    expect(bad.status).toBe(400);
    expect(Object.keys((await bad.json()).error.fields)).toEqual(["targetId"]);

    const response = await calendar(world.actors.viewer, world.proposalId, query);
    expect(response.status).toBe(200);
    expect(response.headers.get("content-type")).toBe("text/calendar; charset=utf-8");
    expect(response.headers.get("content-disposition")).toBe('attachment; filename="arcs-over-the-tessellate-bulge-field-tb-ml-0001.ics"');
    const checked = readWithIcalendar(await response.text(), "target.ics");
    expect(checked.version).toBe("2.0");

    // The schedule as the target page computes it (app/proposals/[proposalId]/targets/[targetId]/page.tsx).
    const ids = { proposalId: world.proposalId, targetId: world.targetId };
    const [proposal, target] = await Promise.all([getProposal(ids, world.actors.viewer), getTarget(ids, world.actors.viewer)]);
    const schedule = targetSchedules(proposal, [target])[0]!;
    expect(schedule.windows.length).toBeGreaterThan(5);
    expect(schedule.visitsJdUtc.length).toBeGreaterThan(5);

    const windows = checked.events.filter((e) => e.summary === "TB-ML-0001: observable window");
    const visits = checked.events.filter((e) => e.summary === "TB-ML-0001: planned visit");
    expect(windows.length + visits.length).toBe(checked.events.length);
    expect(windows).toHaveLength(schedule.windows.length);
    expect(visits).toHaveLength(schedule.visitsJdUtc.length);
    // "To the second": each time is the schedule's instant rounded to the nearest second.
    let largestSeconds = 0;
    const within = (written: number, exact: number) => {
      largestSeconds = Math.max(largestSeconds, Math.abs(written - exact));
      return Math.abs(written - exact) <= 0.5;
    };
    schedule.windows.forEach((w, i) => {
      expect(within(windows[i].start, unixSeconds(w.startJdUtc)), `window ${i} start`).toBe(true);
      expect(within(windows[i].end, unixSeconds(w.endJdUtc)), `window ${i} end`).toBe(true);
    });
    schedule.visitsJdUtc.forEach((jd, i) => {
      expect(within(visits[i].start, unixSeconds(jd)), `visit ${i} start`).toBe(true);
      expect(within(visits[i].end, unixSeconds(jd + schedule.visitLengthDays)), `visit ${i} end`).toBe(true);
    });
    expect(largestSeconds).toBeLessThanOrEqual(0.5);

    const uids = checked.events.map((e) => e.uid);
    expect(new Set(uids).size).toBe(uids.length);
    // window|visit-<target id>-<evening date>-<ordinal within the night>@<the app's host>
    expect(uids[0]).toMatch(new RegExp(`^window-${world.targetId}-2031-06-\\d\\d-1@[a-z0-9.-]+$`));
    for (const event of checked.events) {
      expect(event.location).toBe(proposalInput.site.name);
      expect(event.geo).toEqual([proposalInput.site.latitudeDeg, proposalInput.site.longitudeDeg]);
      expect(event.description).toContain("without a proper solar filter");
    }
    expect(windows[0].description).toMatch(/Air mass \d\.\d\d at the start, \d\.\d\d mid-window, \d\.\d\d at the end/);
    expect(visits[0].description).toMatch(/Air mass \d\.\d\d at mid-visit/);
    // No telescope aperture in a new proposal: no budget, so the visit states the time it leaves.
    expect(visits[0].description).toMatch(/The visit leaves \d+ s for exposing after its overhead\./);
    expect(checked.description).toContain("without a proper solar filter");
    expect(checked.description).toContain("Reference pickering2002: Pickering 2002, DIO 12, 3");

    // A second download updates rather than duplicates: the same UIDs.
    const again = readWithIcalendar(await (await calendar(world.actors.coi, world.proposalId, query)).text(), "again.ics");
    expect(again.events.map((e) => e.uid)).toEqual(uids);

    // The proposal-wide calendar holds the same events for its one target.
    const all = await calendar(world.actors.pi, world.proposalId, "");
    expect(all.headers.get("content-disposition")).toBe('attachment; filename="arcs-over-the-tessellate-bulge-field-all-targets.ics"');
    expect(readWithIcalendar(await all.text(), "all.ics").events.map((e) => e.uid)).toEqual(uids);
  });

  it("gives each visit the exposure of the target page's photon budget once the telescope and the source's magnitude are set", async () => {
    const world = await createWorld();
    await dbClient().db.update(proposals).set({ cycleStartDate: "2031-06-01", cycleEndDate: "2031-06-07", photometry: { apertureM: 1 } }).where(eq(proposals.id, world.proposalId));
    await dbClient().db.update(targets).set({ sourceMagnitude: 19 }).where(eq(targets.id, world.targetId));
    const checked = readWithIcalendar(await (await calendar(world.actors.viewer, world.proposalId, `?targetId=${world.targetId}`)).text(), "budget.ics");

    const ids = { proposalId: world.proposalId, targetId: world.targetId };
    const [proposal, target] = await Promise.all([getProposal(ids, world.actors.viewer), getTarget(ids, world.actors.viewer)]);
    const schedule = targetSchedules(proposal, [target])[0]!;
    const report = targetCaseReport(target, proposal, schedule)!;
    if (!("budget" in report.photonBudget)) throw new Error(`expected a budget: ${JSON.stringify(report.photonBudget)}`);
    const { budget } = report.photonBudget;
    const visits = checked.events.filter((e) => e.summary === "TB-ML-0001: planned visit");
    expect(budget.visitsJdUtc.length).toBeGreaterThan(0);
    // Without t0 every planned visit is graded at the peak (lib/lensing/photon-budget.ts): the budget's visits are the schedule's.
    expect(Array.from(budget.visitsJdUtc)).toEqual(Array.from(schedule.visitsJdUtc));
    budget.visitsJdUtc.forEach((_, i) => {
      const needed = budget.series.exposureForGoalS[i];
      const words =
        needed <= budget.visitExposureS
          ? `Exposure ${needed.toFixed(0)} s reaches the S/N goal of ${budget.signalToNoiseGoal} in ${budget.bandLabel}`
          : `reaches S/N ${budget.series.signalToNoise[i].toFixed(1)} in ${budget.bandLabel}, short of the goal`;
      expect(visits[i].description, `visit ${i}`).toContain(words);
    });
  });

  it("says in words that a proposal without cycle dates has no schedule to put in a calendar", async () => {
    const world = await createWorld();
    const response = await calendar(world.actors.viewer, world.proposalId, `?targetId=${world.targetId}`);
    expect(response.status).toBe(400);
    expect((await response.json()).error.message).toBe("Set the proposal's cycle dates first: the calendar holds the windows and visits of the cycle's schedule.");
  });
});
