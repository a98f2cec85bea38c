import { describe, expect, it } from "vitest";
import { benchSchedule, benchScheduleRequest } from "@/lib/bench/case-report";
import { computeResults } from "@/lib/bench/compute-results";
import { parseSketch } from "@/lib/bench/parse-sketch";
import { astrometricTrack, lightCurve } from "@/lib/bench/plot-data";
import { demoSketch } from "@/lib/bench/sketch-state";

describe("the event plots' epochs", () => {
  // A short cycle keeps the schedule cheap; the demo's event peaks inside it.
  const parsed = parseSketch({ ...demoSketch, cycleStart: "2027-06-20", cycleEnd: "2027-07-31", campaign: "30 d" });
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.fieldErrors));
  const computed = computeResults(parsed.inputs);
  if (!computed.ok) throw new Error(computed.message);
  const event = computed.results.event!;
  const schedule = benchSchedule(benchScheduleRequest(parsed.inputs)!);

  it("are the schedule's visits inside the campaign once the schedule is known", () => {
    const start = event.campaignStartJdUtc!;
    const inCampaign = Array.from(schedule.visitsJdUtc).filter((jd) => jd >= start && jd <= start + 30);
    expect(inCampaign.length).toBeGreaterThan(10);
    // One visit a night at a 1 d cadence, at most: fewer than the 31 cadence epochs.
    expect(inCampaign.length).toBeLessThanOrEqual(31);
    const curve = lightCurve(event, schedule);
    expect(curve.epochs.map((epoch) => epoch.x)).toEqual(inCampaign.map((jd) => ((jd - start) * 86_400) / 86_400));
    expect(astrometricTrack(event, schedule).epochs).toHaveLength(inCampaign.length);
  });

  it("are one per cadence interval from the campaign's start without a schedule", () => {
    expect(lightCurve(event).epochs.map((epoch) => epoch.x)).toEqual(Array.from({ length: 31 }, (_, k) => k));
  });
});
