import { describe, expect, it } from "vitest";
import { targetPhotonBudget } from "@/lib/lensing/photon-budget";
import { depthAnswer } from "@/lib/lensing/science-case-depth";
import { DAY_S } from "@/lib/physics/constants";
import type { ObservingSchedule } from "@/lib/schedule";
import { eventTimingOf, lensSolutionOf, orbitInputsOf, photonBudgetInputsOf, type FeasibilitySettings } from "@/lib/workspace/derived";
import { defaultPhotometrySettings, photometrySettingsSchema } from "@/lib/workspace/photometry-schema";
import { instrumentSchema } from "@/lib/workspace/proposal-schema";
import { sourcePhotometryErrors, type LensHypothesis } from "@/lib/workspace/target-schema";

/** A 1 m telescope in I (typical dark site), 20 min visits with 60 s overhead: 1140 s to expose. */
const settings: FeasibilitySettings = {
  site: { name: "Test ridge", latitudeDeg: -30.2, longitudeDeg: -70.7, elevationM: 2200, horizonLimitDeg: 20 },
  instrument: instrumentSchema.parse({ resolutionMas: 50, cadenceHours: 24, campaignLengthDays: 90, visitMinutes: 20 }),
  photometry: photometrySettingsSchema.parse({ apertureM: 1, centralObstructionM: 0.3, overheadS: 60, bandId: "jc-i" }),
  cycleStartDate: "2031-03-01",
  cycleEndDate: "2031-05-31",
};

const PEAK_JD = 2_463_000.5;
const event: LensHypothesis = {
  lensModel: "point",
  lensMassSolar: 0.3,
  lensDistancePc: 4000,
  sourceDistancePc: 8000,
  sourceOffsetThetaE: 0.1,
  properMotionMasPerYr: 5,
  eventPeakJdUtc: PEAK_JD,
  sourceMagnitude: 19,
  blendFraction: 0.5,
};

/** Visits at air mass 1.2 with the Moon down, but the middle one (the peak) 6° from a bright Moon. */
function schedule(visitsJdUtc: number[]): ObservingSchedule {
  const n = visitsJdUtc.length;
  const moonZenithDeg = new Float32Array(n).fill(120);
  const moonSeparationDeg = new Float32Array(n).fill(120);
  moonZenithDeg[20] = 40;
  moonSeparationDeg[20] = 6;
  return {
    visitsJdUtc: Float64Array.from(visitsJdUtc),
    visitSky: {
      airmass: new Float32Array(n).fill(1.2),
      targetZenithDeg: new Float32Array(n).fill(33.6),
      moonZenithDeg,
      moonSeparationDeg,
      moonPhaseAngleDeg: new Float32Array(n).fill(20),
    },
    cycle: { startJdUtc: visitsJdUtc[0], endJdUtc: visitsJdUtc[n - 1] },
  } as unknown as ObservingSchedule;
}

function budgetOf(h: LensHypothesis, visits: number[], caseId: "photometric-microlensing" | "resolved-images" | "horizon-scale" | "relativistic-orbit" = "photometric-microlensing", s = settings) {
  const solved = lensSolutionOf(h)!;
  return targetPhotonBudget({ caseId, solution: solved.solution, event: eventTimingOf(h, solved.solution, solved.geometry), schedule: schedule(visits), inputs: photonBudgetInputsOf(h, s), orbit: orbitInputsOf(h, solved.geometry) });
}

const tEDays = lensSolutionOf(event)!.solution.einsteinTimeS! / DAY_S;
const visits = Array.from({ length: 41 }, (_, i) => PEAK_JD + (i - 20) * (tEDays / 10));

describe("a target's photon budget", () => {
  it("grades the visits in t0 ± t_E only, each at the blend's magnitude along the event (Paczyński 1986; blending: A f_s + 1 − f_s)", () => {
    const outcome = budgetOf(event, visits);
    if (!("budget" in outcome)) throw new Error("no budget");
    const { budget } = outcome;
    expect(budget.visitsJdUtc.length).toBe(21);
    for (let i = 0; i < budget.visitsJdUtc.length; i++) {
      const tau = (budget.visitsJdUtc[i] - PEAK_JD) / tEDays;
      const u = Math.hypot(0.1, tau);
      const a = (u * u + 2) / (u * Math.sqrt(u * u + 4));
      // m = m_s + 2.5 log f_s − 2.5 log(A f_s + 1 − f_s), written out here from the definitions.
      expect(budget.magnitudes[i]).toBeCloseTo(19 + 2.5 * Math.log10(0.5) - 2.5 * Math.log10(a * 0.5 + 0.5), 12);
    }
    // The peak is the brightest visit; the worst is at an edge of the span.
    expect(budget.visitsJdUtc[budget.brightestVisit]).toBe(PEAK_JD);
    expect([0, 20]).toContain(budget.worstVisit);
  });

  it("asks Σ (the goal's exposure, at most the 1140 s a visit leaves, plus the 60 s overhead)", () => {
    const outcome = budgetOf({ ...event, sourceMagnitude: 21.5 }, visits);
    if (!("budget" in outcome)) throw new Error("no budget");
    const { budget } = outcome;
    let seconds = 0;
    for (let i = 0; i < budget.visitsJdUtc.length; i++) seconds += Math.min(budget.series.exposureForGoalS[i], 1140) + 60;
    expect(budget.timeRequestHours).toBeCloseTo(seconds / 3600, 9);
    expect(budget.visitExposureS).toBe(1140);
  });

  it("answers the depth question by the worst visit: the goal feasible, half of it marginal, less infeasible (our rule)", () => {
    const verdictAt = (sourceMagnitude: number) => depthAnswer(budgetOf({ ...event, sourceMagnitude }, visits))!.verdict;
    expect(verdictAt(17)).toBe("feasible");
    expect(verdictAt(25)).toBe("infeasible");
    // Somewhere between, the worst visit reaches between half the goal and the goal.
    const sweep = Array.from({ length: 101 }, (_, i) => 17 + i / 20);
    expect(sweep.map(verdictAt)).toContain("marginal");
    for (const sourceMagnitude of sweep) {
      const outcome = budgetOf({ ...event, sourceMagnitude }, visits);
      if (!("budget" in outcome)) throw new Error("no budget");
      const reached = outcome.budget.series.signalToNoise[outcome.budget.worstVisit];
      expect(verdictAt(sourceMagnitude)).toBe(reached >= 50 ? "feasible" : reached >= 25 ? "marginal" : "infeasible");
    }
  });

  it("warns of visits nearer the Moon than the moonlight model is fitted to (10°, Krisciunas & Schaefer 1991)", () => {
    const answer = depthAnswer(budgetOf(event, visits))!;
    expect(answer.sentence).toMatch(/1 visit lies within 10° of the Moon, where the moonlight model underestimates the sky/);
  });

  it("measures the fainter image alone for resolved images, at every planned visit", () => {
    const lens = { ...event, sourceOffsetThetaE: 0.5 };
    const outcome = budgetOf(lens, visits, "resolved-images");
    if (!("budget" in outcome)) throw new Error("no budget");
    const faint = lensSolutionOf(lens)!.solution.images[1];
    expect(outcome.budget.visitsJdUtc.length).toBe(41);
    expect(outcome.budget.magnitudes[0]).toBeCloseTo(19 - 2.5 * Math.log10(Math.abs(faint.magnification)), 12);
    const images = lensSolutionOf(lens)!.solution.images;
    expect(outcome.budget.imageMagnitudes).toEqual(images.map((image) => 19 - 2.5 * Math.log10(Math.abs(image.magnification))));
  });

  it("measures the orbiting star itself in a relativistic orbit, at the visits within ±10 % of the period around the next periapsis", () => {
    // a = 700 au about 5.2 × 10⁶ M☉: P = √(a³/M) yr = 8.12 yr = 2966 d (Kepler's third law), window ±296.6 d.
    const periapsisJdUtc = 2_463_500.5;
    const star: LensHypothesis = {
      lensModel: "point",
      lensMassSolar: 5.2e6,
      lensDistancePc: 8300,
      sourceDistancePc: 9000,
      sourceOffsetThetaE: 2,
      orbitSemiMajorAxisAu: 700,
      orbitEccentricity: 0.93,
      orbitPeriapsisJdUtc: periapsisJdUtc,
      sourceMagnitude: 14.1,
      blendFraction: 1,
    };
    const everyTenDays = Array.from({ length: 200 }, (_, i) => periapsisJdUtc - 1000 + 10 * i);
    const outcome = budgetOf(star, everyTenDays, "relativistic-orbit");
    if (!("budget" in outcome)) throw new Error("no budget");
    const halfDays = 0.1 * Math.sqrt(700 ** 3 / 5.2e6) * 365.25;
    const inWindow = everyTenDays.filter((jd) => Math.abs(jd - periapsisJdUtc) <= halfDays);
    expect(inWindow.length).toBe(59);
    expect(Array.from(outcome.budget.visitsJdUtc)).toEqual(inWindow);
    expect(outcome.budget.measured).toBe("orbiting-star");
    expect(new Set(outcome.budget.magnitudes)).toEqual(new Set([14.1]));
    // Without its periapsis time the passage cannot be placed: every planned visit is graded.
    const unplaced = budgetOf({ ...star, orbitPeriapsisJdUtc: null }, everyTenDays, "relativistic-orbit");
    expect("budget" in unplaced && unplaced.budget.visitsJdUtc.length).toBe(200);
  });

  it("names the missing input in words, and asks nothing of horizon-scale imaging or of a bench without a camera", () => {
    expect(budgetOf({ ...event, sourceMagnitude: null }, visits)).toEqual({ missing: expect.stringMatching(/^Set the source's magnitude/) });
    expect(budgetOf(event, visits, "photometric-microlensing", { ...settings, photometry: defaultPhotometrySettings })).toEqual({ missing: expect.stringMatching(/^Set the telescope's aperture/) });
    expect(budgetOf(event, visits, "horizon-scale")).toEqual({ notApplicable: true });
    expect(budgetOf(event, visits, "photometric-microlensing", { ...settings, photometry: null })).toEqual({ notApplicable: true });
    expect(depthAnswer({ notApplicable: true })).toBeNull();
  });
});

describe("a target's source photometry, checked across fields", () => {
  it("refuses a band or a blend fraction without the magnitude they qualify, naming the field in words", () => {
    expect(sourcePhotometryErrors({ sourceBand: "jc-i", sourceMagnitude: null, blendFraction: null })).toEqual({
      sourceMagnitude: ["Give the source magnitude in the band chosen for it, or clear the source's band."],
    });
    expect(sourcePhotometryErrors({ sourceBand: null, sourceMagnitude: undefined, blendFraction: 0.5 }).sourceMagnitude).toEqual([
      "Give the source magnitude the blend fraction f_s refers to, or clear f_s.",
    ]);
    expect(sourcePhotometryErrors({ sourceBand: "jc-i", sourceMagnitude: 19, blendFraction: 0.5 })).toEqual({});
    expect(sourcePhotometryErrors({ sourceBand: null, sourceMagnitude: null, blendFraction: null })).toEqual({});
  });
});
