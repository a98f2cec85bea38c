import { describe, expect, it } from "vitest";
import { delayedImagesTimeline, lightCurveTimeline } from "@/lib/figures/timeline-event";
import { finiteSourceMagnification } from "@/lib/lensing";
import { emptyScheduleMessage, observingSchedule, type ObservingSchedule, type ScheduleGap, type TimeSpanJd } from "@/lib/schedule";
import { nightPlan, nightRuns, nightSpans, NO_CYCLE_SCHEDULE_SENTENCE, scheduleSummary, visitMarks } from "@/lib/schedule/timeline-plot";
import { bulge, bulgeSeason, jd, southSite } from "./sites";

const START = 2_460_000.2;

/**
 * A hand-made 30-night cycle: nights 0–9 usable 0.35–0.6 of the night, nights 10–27 lost to the
 * Sun (below the limit for part of the dark hours, more of them on two nights), night 28 usable
 * again, night 29 lost to the Moon. Daylight outside 0.3–0.7 of every night.
 */
function handMadeSchedule(): Pick<ObservingSchedule, "cycle" | "nightCount" | "windows" | "gaps" | "firstNightIso"> {
  const windows: TimeSpanJd[] = [];
  const gaps: ScheduleGap[] = [];
  const at = (night: number, day: number) => START + night + day;
  let previousEnd = START;
  const push = (reason: ScheduleGap["reason"] | "usable", start: number, end: number) => {
    const last = reason === "usable" ? windows.at(-1) : gaps.at(-1);
    if (reason !== "usable" && last !== undefined && "reason" in last && last.reason === reason && last.endJdUtc === start) last.endJdUtc = end;
    else if (reason === "usable") windows.push({ startJdUtc: start, endJdUtc: end });
    else gaps.push({ startJdUtc: start, endJdUtc: end, reason });
    previousEnd = end;
  };
  for (let night = 0; night < 30; night++) {
    push("daylight", previousEnd, at(night, 0.3));
    if (night < 10 || night === 28) {
      push("below-limit", at(night, 0.3), at(night, 0.35));
      push("usable", at(night, 0.35), at(night, 0.6));
      push("below-limit", at(night, 0.6), at(night, 0.7));
    } else if (night < 28) {
      const sunEnd = night === 12 || night === 13 ? 0.32 : 0.5;
      push("sun", at(night, 0.3), at(night, sunEnd));
      push("below-limit", at(night, sunEnd), at(night, 0.7));
    } else {
      push("moon", at(night, 0.3), at(night, 0.7));
    }
  }
  push("daylight", previousEnd, START + 30);
  return { cycle: { startJdUtc: START, endJdUtc: START + 30 }, nightCount: 30, windows, gaps, firstNightIso: "2023-02-24" };
}

describe("the schedule timeline's nights (our rules, timeline-plot.ts)", () => {
  const schedule = handMadeSchedule();

  it("cuts windows and gaps into each night's spans, daylight left as the ground", () => {
    const spans = nightSpans(schedule);
    expect(spans.some((span) => span.kind === "daylight")).toBe(false);
    const night3 = spans.filter((span) => span.night === 3);
    expect(night3.map((span) => span.kind)).toEqual(["below-limit", "usable", "below-limit"]);
    expect(night3[1].fromDay).toBeCloseTo(0.35, 9);
    expect(night3[1].toDay).toBeCloseTo(0.6, 9);
  });

  it("merges the nights without usable time into runs named by the rule that takes the dark hours the target is up", () => {
    const runs = nightRuns(schedule);
    expect(runs.map((run) => [run.firstNight, run.nightCount, run.isUsable, run.reason])).toEqual([
      [0, 10, true, null],
      // Nights 12 and 13 are mostly below the limit, but the Sun still takes the time the target is up.
      [10, 18, false, "sun"],
      [28, 1, true, null],
      [29, 1, false, "moon"],
    ]);
    // 18 nights > the 14-night bridge: a season gap; a single Moon night is too short to name.
    expect(runs[1].label).toBe("season gap: too close to the Sun");
    expect(runs[3].label).toBeNull();
  });

  it("names a short run by its length and a night below the limit in darkness as such", () => {
    const short = { ...schedule, nightCount: 14, cycle: { startJdUtc: START, endJdUtc: START + 14 } };
    const runs = nightRuns(short);
    expect(runs[1]).toMatchObject({ firstNight: 10, nightCount: 4, reason: "sun", label: "4 nights: too close to the Sun" });
  });
});

describe("visits drawn on the timeline", () => {
  it("merges visits closer than the drawing's resolution and keeps every visit counted", () => {
    const visits = Float64Array.from([0, 0.01, 0.02, 0.5, 0.51, 2]);
    const marks = visitMarks(visits, 0.005, 0.01);
    expect(marks.map((mark) => mark.visitCount)).toEqual([3, 2, 1]);
    expect(marks[0]).toMatchObject({ startJdUtc: 0, endJdUtc: 0.025 });
    expect(marks.reduce((sum, mark) => sum + mark.visitCount, 0)).toBe(visits.length);
  });

  it("places every visit mark of a real schedule inside a usable span of its night", () => {
    const schedule = observingSchedule({ ...bulgeSeason, site: southSite, target: bulge, cycleStartNightIso: "2022-06-01", cycleEndNightIso: "2022-06-20" });
    const usable = nightSpans(schedule).filter((span) => span.kind === "usable");
    const marks = visitMarks(schedule.visitsJdUtc, schedule.visitLengthDays, 0);
    expect(marks.length).toBe(schedule.visitsJdUtc.length);
    expect(marks.length).toBeGreaterThan(20);
    for (const mark of marks) {
      const day = mark.startJdUtc - schedule.cycle.startJdUtc;
      const night = Math.floor(day);
      const within = usable.some((span) => span.night === night && day - night >= span.fromDay - 1e-12 && mark.endJdUtc - schedule.cycle.startJdUtc - night <= span.toDay + 1e-12);
      expect(within).toBe(true);
    }
  });
});

describe("one night's planned visits (night view)", () => {
  const schedule = observingSchedule({ ...bulgeSeason, site: southSite, target: bulge, cycleStartNightIso: "2022-06-10", cycleEndNightIso: "2022-06-16" });

  it("lists the night's visits in UTC, each inside the night", () => {
    const plan = nightPlan(schedule, "2022-06-12");
    const nightStart = schedule.cycle.startJdUtc + 2;
    expect(plan.visitsJdUtc.length).toBeGreaterThanOrEqual(2);
    for (const visit of plan.visitsJdUtc) expect(visit >= nightStart && visit < nightStart + 1).toBe(true);
    expect(plan.sentence).toMatch(new RegExp(`^${plan.visitsJdUtc.length} visits planned this night: \\d\\d:\\d\\d(, \\d\\d:\\d\\d)+ \\(UTC\\)\\.$`));
  });

  it("says why there is none: outside the cycle, no cycle, an empty schedule", () => {
    expect(nightPlan(schedule, "2022-07-01").sentence).toBe("No visit planned: this night is outside the proposal's cycle (2022-06-10 to 2022-06-16).");
    expect(nightPlan(null, "2022-06-12").sentence).toBe("Set the proposal's cycle dates to plan visits.");
    // The bulge from 30° S in late December is up in darkness only near the Sun (schedule tests).
    const behindSun = observingSchedule({ ...bulgeSeason, site: southSite, target: bulge, cycleStartNightIso: "2022-12-10", cycleEndNightIso: "2022-12-20" });
    expect(behindSun.emptyReason).not.toBeNull();
    expect(nightPlan(behindSun, "2022-12-12").sentence).toBe(emptyScheduleMessage(behindSun.emptyReason!));
  });

  it("sums up the schedule for the chart's accessible name", () => {
    expect(scheduleSummary(schedule)).toMatch(/^\d+ visits planned over 7 nights \(2022-06-10 to 2022-06-16\); observing season: 2022-06-10 to 2022-06-16\.$/);
    expect(NO_CYCLE_SCHEDULE_SENTENCE).toBe("Set the proposal's cycle dates to see the schedule.");
  });
});

describe("the event drawn over the schedule", () => {
  const span = { startJdUtc: jd("2022-03-01T12:00:00Z"), endJdUtc: jd("2022-09-01T12:00:00Z") };
  const t0 = jd("2022-06-15T04:00:00Z");

  it("peaks at t0 with A(u0): the point-lens value (u0² + 2)/(u0 √(u0² + 4)) of Paczyński 1986", () => {
    const u0 = 0.1;
    const curve = lightCurveTimeline({ peakJdUtc: t0, einsteinTimeDays: 30, impactParameterThetaE: u0, sourceRadiusThetaE: null, limbDarkeningU: 0 }, span, [t0 + 30]);
    const expected = (u0 * u0 + 2) / (u0 * Math.sqrt(u0 * u0 + 4));
    expect(curve.peak?.jdUtc).toBe(t0);
    expect(curve.peak?.value).toBeCloseTo(expected, 12);
    const highest = curve.points.reduce((best, point) => (point.value > best.value ? point : best));
    expect(highest.jdUtc).toBe(t0);
    // One t_E after t0, u = √(u0² + 1): A = 1.3409… (same formula).
    const u = Math.hypot(u0, 1);
    expect(curve.marks[0].value).toBeCloseTo((u * u + 2) / (u * Math.sqrt(u * u + 4)), 12);
  });

  it("draws a finite source's peak from the lensing layer, lower than a point source's when ρ > u0", () => {
    const event = { peakJdUtc: t0, einsteinTimeDays: 20, impactParameterThetaE: 0.01, sourceRadiusThetaE: 0.05, limbDarkeningU: 0.5 };
    const curve = lightCurveTimeline(event, span, []);
    expect(curve.peak?.value).toBe(finiteSourceMagnification(0.01, 0.05, 0.5));
    expect(curve.peak!.value).toBeLessThan(100);
  });

  it("leaves out the infinite peak of a point source at u0 = 0 and says t0 outside the span has no peak", () => {
    const onAxis = lightCurveTimeline({ peakJdUtc: t0, einsteinTimeDays: 30, impactParameterThetaE: 0, sourceRadiusThetaE: null, limbDarkeningU: 0 }, span, [t0]);
    expect(onAxis.peak).toBeNull();
    expect(onAxis.marks).toEqual([]);
    expect(onAxis.points.every((point) => Number.isFinite(point.value))).toBe(true);
    const later = lightCurveTimeline({ peakJdUtc: span.endJdUtc + 40, einsteinTimeDays: 30, impactParameterThetaE: 0.3, sourceRadiusThetaE: null, limbDarkeningU: 0 }, span, []);
    expect(later.peak).toBeNull();
  });

  it("shows the illustrative flare in the fainter image Δt later and 2.5 log₁₀(ratio) mag fainter", () => {
    const flare = jd("2022-04-01T00:00:00Z");
    const curves = delayedImagesTimeline(40, 4, flare, span, [flare, flare + 40]);
    expect(curves.echoJdUtc).toBe(flare + 40);
    expect(curves.trailingOffsetMag).toBeCloseTo(-2.5 * Math.log10(4), 12);
    expect(curves.leadingMarks[0].value).toBeCloseTo(0.3, 12);
    expect(curves.trailingMarks[1].value - curves.trailingOffsetMag).toBeCloseTo(0.3, 12);
    const peakOf = (points: { jdUtc: number; value: number }[]) => points.reduce((best, point) => (point.value > best.value ? point : best)).jdUtc;
    expect(peakOf(curves.trailing) - peakOf(curves.leading)).toBeCloseTo(40, 9);
  });
});

describe("the drawn light curve of a limb-darkened source", () => {
  it("stays within 1e-4 of the lensing layer's limb-darkened magnification where it draws the uniform disk's value", () => {
    const t0 = jd("2031-04-18T07:30:00Z");
    const event = { peakJdUtc: t0, einsteinTimeDays: 7, impactParameterThetaE: 0.05, sourceRadiusThetaE: 0.05, limbDarkeningU: 0.6 };
    const curve = lightCurveTimeline(event, { startJdUtc: t0 - 60, endJdUtc: t0 + 60 }, []);
    let worst = 0;
    for (const point of curve.points) {
      const u = Math.hypot(0.05, (point.jdUtc - t0) / 7);
      worst = Math.max(worst, Math.abs(point.value / finiteSourceMagnification(u, 0.05, 0.6) - 1));
    }
    // Measured: 1.0e-5 (our drawing tolerance is 1e-4, a hundredth of a pixel on the chart).
    expect(worst).toBeLessThan(1e-4);
  });
});
