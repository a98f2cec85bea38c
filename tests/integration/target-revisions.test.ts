import { afterAll, describe, expect, it, vi } from "vitest";

vi.mock("server-only", () => ({}));

import { eq } from "drizzle-orm";
import { dbClient } from "@/db/client";
import { activity, proposals, targetRevisions, targets, type Target } from "@/db/schema";
import { fitRevisionFields, type ApplyFitRequest } from "@/lib/workspace/fit-revision";
import { deriveTargetColumns, targetSchedules } from "@/lib/workspace/derived";
import { parseEventPeakJdUtc } from "@/lib/workspace/event-peak";
import { listActivity } from "@/lib/server/activity";
import { feasibilitySettingsOf } from "@/lib/server/derived-columns";
import { updateProposal } from "@/lib/server/proposals";
import { applyFit, listRevisions, undoRevision } from "@/lib/server/target-revisions";
import { updateTarget } from "@/lib/server/targets";
import { createWorld, type World } from "./support/world";

afterAll(async () => {
  await dbClient().sql.end();
});

/** 2031-06-13 10:04 UTC: JD 2451544.5 (2000-01-01 0 h) + 11 486.419 d = JD 2463030.919 (date arithmetic by hand). */
const t0JdUtc = parseEventPeakJdUtc("2031-06-13 10:04");

const fit: ApplyFitRequest = {
  t0JdUtc,
  u0: -0.081,
  einsteinTimeDays: 27.6,
  rho: null,
  parallaxNorth: null,
  parallaxEast: null,
  sourceMagnitude: 19.42,
  blendFraction: 0.8,
  sourceBand: "jc-i",
  summary: { chi2: 410.04, dof: 402, pointCount: 412, referenceDataset: "Survey I", datasets: ["Survey I", "Site A V"], sigmas: { t0Days: 0.01, u0: 0.002, tEDays: 0.4 }, errorScales: { "Survey I": 1.1, "Site A V": 0.9 } },
};

/**
 * The world of the authorization matrix with two months around the event as its cycle, so its visits
 * are counted, and a 1 m telescope, so its photon budget is computed once the source has a magnitude.
 */
async function seasonWorld(): Promise<World & { params: { proposalId: string; targetId: string } }> {
  const world = await createWorld();
  await updateProposal({ proposalId: world.proposalId }, { cycleStartDate: "2031-05-15", cycleEndDate: "2031-07-15", photometry: { apertureM: 1 } }, world.actors.pi);
  return { ...world, params: { proposalId: world.proposalId, targetId: world.targetId } };
}

async function storedTarget(targetId: string): Promise<Target> {
  const [row] = await dbClient().db.select().from(targets).where(eq(targets.id, targetId));
  return row;
}

const fitValues = (t: Target) => Object.fromEntries(fitRevisionFields.map((field) => [field, t[field]]));
const derivedOf = ({ crossingTimeDays, timeRequestHours, peakSignalToNoise, answeredCase, caseVerdict, caseAnswers, derivationVersion }: Target) => ({
  crossingTimeDays,
  timeRequestHours,
  peakSignalToNoise,
  answeredCase,
  caseVerdict,
  caseAnswers,
  derivationVersion,
});

async function latestActivity(world: World) {
  const { entries } = await listActivity({ proposalId: world.proposalId }, {}, world.actors.viewer);
  return entries[0];
}

describe("applying a light-curve fit to a target", () => {
  it("sets t0, |u0|, t_E, the source's magnitude, band and f_s, re-derives the columns and the verdict from the fitted t_E, and says so in the feed", async () => {
    const world = await seasonWorld();
    const before = await storedTarget(world.targetId);
    // No peak date yet: the event's sampling questions cannot be answered.
    expect(before.caseAnswers).toEqual(expect.arrayContaining([expect.objectContaining({ id: "event-visits", verdict: "unknown" })]));

    const { target, revision } = await applyFit(world.params, fit, world.actors.coi);

    expect(target).toMatchObject({ eventPeakJdUtc: t0JdUtc, sourceOffsetThetaE: 0.081, einsteinTimeDays: 27.6, sourceRadiusThetaE: null, parallaxNorth: null, parallaxEast: null, sourceMagnitude: 19.42, sourceBand: "jc-i", blendFraction: 0.8 });
    // The hypothesis' proper motion stays as typed; the crossing time is the fitted t_E.
    expect(target.properMotionMasPerYr).toBe(5);
    expect(target.crossingTimeDays).toBeCloseTo(27.6, 12);
    const stored = await storedTarget(world.targetId);
    const [proposal] = await dbClient().db.select().from(proposals).where(eq(proposals.id, world.proposalId));
    // The stored columns are those of the new values under the proposal's schedule, as a target edit derives them.
    const settings = feasibilitySettingsOf(proposal);
    const expected = deriveTargetColumns(stored, settings, targetSchedules(settings, [stored])[0]);
    expect(derivedOf(stored)).toEqual({ crossingTimeDays: expected.crossingTimeDays, timeRequestHours: expected.timeRequestHours, peakSignalToNoise: expected.peakSignalToNoise, answeredCase: expected.answeredCase, caseVerdict: expected.caseVerdict, caseAnswers: expected.caseAnswers, derivationVersion: expected.derivationVersion });
    const visits = target.caseAnswers.find((a) => a.id === "event-visits")!;
    expect(visits.verdict).not.toBe("unknown");
    expect(visits.figure).toMatch(/in t0 ± t_E \(±27\.6 d\)$/);
    // Without a peak date and a source magnitude the case had unknown answers; with the fit's it has a verdict.
    expect(before.caseVerdict).toBe("unknown");
    expect(stored.caseVerdict).not.toBe("unknown");
    expect(stored.timeRequestHours).toBeGreaterThan(0);

    expect(revision).toMatchObject({ kind: "light_curve_fit", before: fitValues(before), after: fitValues(stored), summary: fit.summary, actorName: "coi", undoneAt: null, canUndo: true });
    expect(await latestActivity(world)).toMatchObject({
      action: "target.fit_applied",
      actorName: "coi",
      subject: "TB-ML-0001: t0 2031-06-13 10:04 UTC (JD 2463030.92), u0 0.081, t_E 27.6 d (χ²/dof 1.02, 412 points)",
    });
    const listed = await listRevisions(world.params, world.actors.viewer);
    expect(listed).toEqual([revision]);
  });

  it("keeps the stored ρ when the fit had no finite source, sets it when it had, and refuses ρ over a source radius in R☉", async () => {
    const world = await seasonWorld();
    await updateTarget(world.params, { sourceRadiusThetaE: 0.004 }, world.actors.coi);
    expect((await applyFit(world.params, fit, world.actors.coi)).target.sourceRadiusThetaE).toBe(0.004);
    const finite = await applyFit(world.params, { ...fit, rho: 0.012, parallaxNorth: 0.3, parallaxEast: -0.4 }, world.actors.pi);
    expect(finite.target).toMatchObject({ sourceRadiusThetaE: 0.012, parallaxNorth: 0.3, parallaxEast: -0.4 });

    const other = await seasonWorld();
    await updateTarget(other.params, { sourceRadiusSolar: 1.1 }, other.actors.coi);
    await expect(applyFit(other.params, { ...fit, rho: 0.012 }, other.actors.coi)).rejects.toMatchObject({ code: "conflict:revision", message: expect.stringMatching(/^TB-ML-0001 gives its source's radius in R☉/) });
    expect(await dbClient().db.select().from(targetRevisions).where(eq(targetRevisions.targetId, other.targetId))).toEqual([]);
  });
});

describe("undoing a fit", () => {
  it("restores every value and derived column exactly, marks the fit undone, keeps the undo as a revision and says so in the feed; a second undo is refused", async () => {
    const world = await seasonWorld();
    const original = await storedTarget(world.targetId);
    const { revision } = await applyFit(world.params, fit, world.actors.coi);

    const undone = await undoRevision({ ...world.params, revisionId: revision.id }, world.actors.pi);
    const restored = await storedTarget(world.targetId);
    expect(fitValues(restored)).toEqual(fitValues(original));
    expect(derivedOf(restored)).toEqual(derivedOf(original));
    expect(undone.target.crossingTimeDays).toBe(original.crossingTimeDays);
    expect(undone.revision).toMatchObject({ kind: "undo", before: revision.after, after: revision.before, summary: null, actorName: "pi", canUndo: false });
    expect(await latestActivity(world)).toMatchObject({ action: "target.fit_undone", actorName: "pi", subject: "TB-ML-0001, back to t0 not set, u0 0.3, t_E from θ_E / μ_rel" });

    const listed = await listRevisions(world.params, world.actors.coi);
    expect(listed.map((r) => [r.kind, r.canUndo, r.undoneAt === null])).toEqual([
      ["undo", false, true],
      ["light_curve_fit", false, false],
    ]);
    await expect(undoRevision({ ...world.params, revisionId: revision.id }, world.actors.pi)).rejects.toMatchObject({ code: "conflict:revision", message: "This fit of TB-ML-0001 was undone already." });
    await expect(undoRevision({ ...world.params, revisionId: undone.revision.id }, world.actors.pi)).rejects.toMatchObject({ code: "conflict:revision" });
    expect(fitValues(await storedTarget(world.targetId))).toEqual(fitValues(original));
  });

  it("is refused once the target was edited by hand after the fit, leaving the edit in place", async () => {
    const world = await seasonWorld();
    const { revision } = await applyFit(world.params, fit, world.actors.coi);
    await updateTarget(world.params, { sourceOffsetThetaE: 0.2 }, world.actors.coi);
    const edited = await storedTarget(world.targetId);
    await expect(undoRevision({ ...world.params, revisionId: revision.id }, world.actors.coi)).rejects.toMatchObject({
      code: "conflict:revision",
      message: "TB-ML-0001 was edited after this fit was applied; change the values by hand instead.",
    });
    expect(await storedTarget(world.targetId)).toEqual(edited);
    expect((await listRevisions(world.params, world.actors.coi)).map((r) => r.canUndo)).toEqual([false]);
  });

  it("undoes fits last first: the earlier one only after the later one", async () => {
    const world = await seasonWorld();
    const original = fitValues(await storedTarget(world.targetId));
    const first = await applyFit(world.params, fit, world.actors.coi);
    const second = await applyFit(world.params, { ...fit, einsteinTimeDays: 31.2 }, world.actors.coi);
    expect((await listRevisions(world.params, world.actors.coi)).map((r) => [r.id, r.canUndo])).toEqual([
      [second.revision.id, true],
      [first.revision.id, false],
    ]);
    await expect(undoRevision({ ...world.params, revisionId: first.revision.id }, world.actors.coi)).rejects.toMatchObject({ message: "A later fit was applied to TB-ML-0001; undo that one first." });
    await undoRevision({ ...world.params, revisionId: second.revision.id }, world.actors.coi);
    expect((await storedTarget(world.targetId)).einsteinTimeDays).toBe(27.6);
    await undoRevision({ ...world.params, revisionId: first.revision.id }, world.actors.coi);
    expect(fitValues(await storedTarget(world.targetId))).toEqual(original);
  });
});

describe("who may apply and undo, and what is refused", () => {
  it("lets a viewer list the revisions but neither apply nor undo (403); a stranger's revision id is 404", async () => {
    const world = await seasonWorld();
    const before = await storedTarget(world.targetId);
    await expect(applyFit(world.params, fit, world.actors.viewer)).rejects.toMatchObject({ code: "forbidden:target" });
    const { revision } = await applyFit(world.params, fit, world.actors.pi);
    await expect(undoRevision({ ...world.params, revisionId: revision.id }, world.actors.viewer)).rejects.toMatchObject({ code: "forbidden:target" });
    expect(await listRevisions(world.params, world.actors.viewer)).toHaveLength(1);
    await expect(listRevisions(world.params, world.actors.outsider)).rejects.toMatchObject({ code: "not_found:proposal" });

    // The revision belongs to another target: it names nothing here.
    const other = await seasonWorld();
    await expect(undoRevision({ ...other.params, revisionId: revision.id }, other.actors.pi)).rejects.toMatchObject({ code: "not_found:revision" });
    expect(fitValues(await storedTarget(world.targetId))).not.toEqual(fitValues(before));
  });

  it("refuses bad bodies with a message naming the field, and writes nothing", async () => {
    const world = await seasonWorld();
    const before = await storedTarget(world.targetId);
    const activityBefore = await dbClient().db.select().from(activity).where(eq(activity.proposalId, world.proposalId));
    const bad: [Record<string, unknown>, string, RegExp][] = [
      [{ ...fit, einsteinTimeDays: 0 }, "einsteinTimeDays", /^The fit's Einstein time t_E is from 0\.001 to 100.000 days\.$/],
      [{ ...fit, einsteinTimeDays: "27.6" }, "einsteinTimeDays", /^The fit's Einstein time t_E must be a number\.$/],
      [{ ...fit, t0JdUtc: 2451544.5 - 1 }, "t0JdUtc", /^The fit's peak time t0 is a Julian date \(UTC\) from 2451544\.5/],
      [{ ...fit, t0JdUtc: 2488069.5 }, "t0JdUtc", /before 2488069\.5 \(2100\)/],
      [{ ...fit, u0: 0 }, "u0", /^The fit's impact parameter u0 is from 1 × 10⁻⁶ to 1000 Einstein radii/],
      [{ ...fit, blendFraction: 0 }, "blendFraction", /^The blend fraction f_s from the fit is from 0\.001 to 1/],
      [{ ...fit, blendFraction: 1.2 }, "blendFraction", /blend fraction f_s/],
      [{ ...fit, rho: 50 }, "rho", /^The fit's source radius ρ is from/],
      [{ ...fit, parallaxNorth: 0.2 }, "parallaxEast", /needs both components, π_E,N and π_E,E, or neither/],
      [{ ...fit, sourceBand: "Q" }, "sourceBand", /band/],
      [{ ...fit, summary: undefined }, "summary", /^The fit summary is missing\.$|fit summary/],
      [{ ...fit, summary: { ...fit.summary, dof: 0 } }, "summary.dof", /^The fit's degrees of freedom is a whole number from 1/],
      [{ ...fit, summary: { ...fit.summary, referenceDataset: "Other" } }, "summary.referenceDataset", /^The reference dataset must be one of the fitted datasets\.$/],
      [{ ...fit, summary: { ...fit.summary, errorScales: { "Survey I": -1 } } }, "summary.errorScales", /^The fit's error scale factors must be positive numbers\.$/],
    ];
    for (const [body, field, message] of bad) {
      const refusal = await applyFit(world.params, body, world.actors.coi).then(
        () => null,
        (error: { code: string; fields?: Record<string, string[]> }) => error,
      );
      expect(refusal?.code, field).toBe("bad_request:revision");
      expect(Object.keys(refusal!.fields!), field).toEqual([field]);
      expect(refusal!.fields![field].join(" "), field).toMatch(message);
    }
    expect(await storedTarget(world.targetId)).toEqual(before);
    expect(await dbClient().db.select().from(targetRevisions).where(eq(targetRevisions.targetId, world.targetId))).toEqual([]);
    expect(await dbClient().db.select().from(activity).where(eq(activity.proposalId, world.proposalId))).toHaveLength(activityBefore.length);
  });
});
