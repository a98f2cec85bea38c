import { describe, expect, it } from "vitest";
import { DAY_S } from "@/lib/physics";
import { defaultPhotometrySettings } from "@/lib/workspace/photometry-schema";
import { deriveTargetColumns, lensSolutionOf, targetCaseReport, targetSchedules, type FeasibilitySettings } from "@/lib/workspace/derived";
import { microlensingFigures } from "@/lib/workspace/microlensing-figures";
import { instrumentSchema } from "@/lib/workspace/proposal-schema";
import { parseEventPeakJdUtc } from "@/lib/workspace/event-peak";
import { createTargetSchema, lensHypothesisErrors } from "@/lib/workspace/target-schema";

/**
 * A target's fitted Einstein time replaces θ_E/μ_rel wherever the product reads t_E: the stored
 * crossing time, the science case's event and peak windows, and the photon budget's visits.
 */

/** An invented southern site, one visit a night (24 h cadence), a cycle over the bulge season, a 1 m telescope. */
const southern: FeasibilitySettings = {
  site: { name: "Test ridge", latitudeDeg: -30.2, longitudeDeg: -70.7, elevationM: 2200, horizonLimitDeg: 20 },
  instrument: instrumentSchema.parse({ resolutionMas: 50, cadenceHours: 24, campaignLengthDays: 90 }),
  photometry: { ...defaultPhotometrySettings, apertureM: 1 },
  cycleStartDate: "2031-02-01",
  cycleEndDate: "2031-08-02",
};
const t0 = parseEventPeakJdUtc("2031-06-20 04:00");
/** The bulge event of tests/unit/workspace/derived.test.ts: θ_E/μ_rel = 40.4 d at u0 = 0.1. */
const event = { lensModel: "point" as const, lensMassSolar: 0.3, lensDistancePc: 4000, sourceDistancePc: 8000, sourceOffsetThetaE: 0.1, properMotionMasPerYr: 5, eventPeakJdUtc: t0, sourceMagnitude: 19 };
const [schedule] = targetSchedules(southern, [{ raDeg: 269.3, decDeg: -29.2 }]);
const visits = schedule!.visitsJdUtc;
/** Visits starting in [from, to], counted here from the schedule's own list. */
const visitsIn = (from: number, to: number) => visits.filter((jd) => jd >= from && jd <= to).length;
const answer = (columns: ReturnType<typeof deriveTargetColumns>, id: string) => columns.caseAnswers.find((a) => a.id === id)!;

describe("a target with a fitted Einstein time", () => {
  const derivedTE = lensSolutionOf(event)!.solution.einsteinTimeS! / DAY_S;
  const fittedTE = derivedTE / 2;
  const asTyped = deriveTargetColumns(event, southern, schedule);
  const fitted = deriveTargetColumns({ ...event, einsteinTimeDays: fittedTE }, southern, schedule);

  it("stores the fitted t_E as its crossing time, keeping θ_E and the typed proper motion", () => {
    // t_E = θ_E/μ_rel (Paczyński 1986, ApJ 304, 1): 0.5535 mas / 5 mas/yr = 40.4 d for the hypothesis.
    expect(asTyped.crossingTimeDays).toBeCloseTo(40.37, 2);
    expect(fitted.crossingTimeDays! / fittedTE).toBeCloseTo(1, 14);
    expect(fitted.einsteinRadiusMas).toBe(asTyped.einsteinRadiusMas);
    expect(lensSolutionOf({ ...event, einsteinTimeDays: fittedTE })!.solution.einsteinTimeS! / DAY_S).toBeCloseTo(fittedTE, 12);
  });

  it("samples the peak over t0 ± u0·t_E of the fitted t_E: halving it halves the window and turns the peak's answer from feasible to marginal", () => {
    // t_eff = u0·t_E (common practice, as the peak-visits rule cites); five or more visits trace the peak, two to four its height (our rule).
    const before = answer(asTyped, "peak-visits");
    const after = answer(fitted, "peak-visits");
    expect(before.figure).toBe(`${visitsIn(t0 - 0.1 * derivedTE, t0 + 0.1 * derivedTE)} visits within ±4.04 d of t0`);
    expect(after.figure).toBe(`${visitsIn(t0 - 0.1 * fittedTE, t0 + 0.1 * fittedTE)} visits within ±2.02 d of t0`);
    expect(before.verdict).toBe("feasible");
    expect(after.verdict).toBe("marginal");
    expect(fitted.caseVerdict).toBe("marginal");
  });

  it("counts the event's visits and the photon budget's over t0 ± t_E of the fitted t_E", () => {
    // The event is t0 ± t_E (common practice, as the event-visits rule cites).
    const inEvent = visitsIn(t0 - fittedTE, t0 + fittedTE);
    expect(answer(fitted, "event-visits").figure).toBe(`${inEvent} visits in t0 ± t_E (±20.2 d)`);
    const report = targetCaseReport({ ...event, einsteinTimeDays: fittedTE }, southern, schedule)!;
    if (!("budget" in report.photonBudget)) throw new Error("no photon budget");
    expect(report.photonBudget.budget.visitsJdUtc.length).toBe(inEvent);
    expect(fitted.timeRequestHours).toBeLessThan(asTyped.timeRequestHours!);
  });

  it("derives finite columns and answers at both ends of the accepted range (0.001 d and 100 000 d), with a schedule", () => {
    for (const einsteinTimeDays of [1e-3, 1e5]) {
      const columns = deriveTargetColumns({ ...event, einsteinTimeDays }, southern, schedule);
      expect(columns.crossingTimeDays! / einsteinTimeDays).toBeCloseTo(1, 14);
      for (const value of [columns.timeRequestHours, columns.peakSignalToNoise]) if (value !== null) expect(Number.isFinite(value)).toBe(true);
      for (const { figure, sentence } of columns.caseAnswers) expect(`${figure} ${sentence}`).not.toMatch(/NaN|Infinity|undefined|null/);
    }
  });

  it("gives a hypothesis without a proper motion the fitted t_E, where it had none", () => {
    const { properMotionMasPerYr: _, ...withoutMotion } = event;
    expect(deriveTargetColumns(withoutMotion, southern, schedule).crossingTimeDays).toBeNull();
    const measured = deriveTargetColumns({ ...withoutMotion, einsteinTimeDays: 27.6 }, southern, schedule);
    expect(measured.crossingTimeDays).toBeCloseTo(27.6, 12);
    expect(answer(measured, "event-duration").figure).toBe("2 t_E = 55.2 d against 90 d");
  });
});

describe("a target with a fitted microlens parallax", () => {
  it("shows |π_E| = √(π_E,N² + π_E,E²) in place of π_rel/θ_E (the vector's length; Gould 2004, ApJ 606, 319)", () => {
    expect(microlensingFigures({ ...event, parallaxNorth: 0.3, parallaxEast: -0.4 })!.microlensParallax).toBeCloseTo(0.5, 15);
  });

  it("refuses one component without the other, and a t_E outside its range, naming the field", () => {
    expect(lensHypothesisErrors({ ...event, parallaxNorth: 0.3 })).toEqual({ parallaxEast: ["Give both components of the microlens parallax, π_E,N and π_E,E, or neither."] });
    const parsed = createTargetSchema.safeParse({ name: "T", ra: 10, dec: 10, priority: 1, ...event, einsteinTimeDays: "0 d" });
    expect(parsed.success).toBe(false);
    expect(parsed.error!.issues.map((issue) => [issue.path.join("."), issue.message])).toEqual([["einsteinTimeDays", "The fitted Einstein time t_E is from 0.001 to 100\u202f000 days (86 seconds to about 270 years)."]]);
  });

  it("reads a typed t_E with its unit into days (1 week = 7 d; 1 h = 1/24 d)", () => {
    const parsed = createTargetSchema.parse({ name: "T", ra: 10, dec: 10, priority: 1, ...event, einsteinTimeDays: "3 weeks" });
    expect(parsed.einsteinTimeDays).toBe(21);
    expect(createTargetSchema.parse({ name: "T", ra: 10, dec: 10, priority: 1, ...event, einsteinTimeDays: "6 h" }).einsteinTimeDays).toBe(0.25);
  });
});
