import { describe, expect, it } from "vitest";
import {
  ASTROMETRIC_DETECTION_RULE,
  caseVerdictOf,
  ASTROMETRIC_EPOCH_RULE,
  ASTROMETRIC_NEAR_PEAK_FRACTION,
  CONTRAST_RULE,
  coverageVerdict,
  DELAY_CADENCE_RULE,
  DELAY_SEASON_RULE,
  DELAY_SEASONS_RULE,
  DELAY_VISITS_RULE,
  EVENT_VISITS_RULE,
  gradeAtLeast,
  interferometerBeamRad,
  PEAK_MAGNIFICATION_RULE,
  PEAK_VISITS_RULE,
  peakHalfWidthDays,
  peakReachVerdict,
  RESOLUTION_RULE,
  SHADOW_RULE,
  verdicts,
  worseVerdict,
} from "@/lib/lensing/feasibility-rules";
import { MICROARCSECOND_RAD, paczynskiMagnification, pointLensImages, pointLensMagnification } from "@/lib/physics";

describe("grading", () => {
  it("grades at the thresholds inclusively; NaN, no comparison, is infeasible", () => {
    const rule = { feasibleAt: 1, marginalAt: 0.5 };
    expect([1, 0.999, 0.5, 0.499, Infinity, 0].map((value) => gradeAtLeast(value, rule))).toEqual(["feasible", "marginal", "marginal", "infeasible", "feasible", "infeasible"]);
    expect(gradeAtLeast(Number.NaN, rule)).toBe("infeasible");
  });

  it("takes the worse of two verdicts", () => {
    expect(worseVerdict("feasible", "marginal")).toBe("marginal");
    expect(worseVerdict("marginal", "infeasible")).toBe("infeasible");
    expect(worseVerdict("feasible", "feasible")).toBe("feasible");
    expect(verdicts).toEqual(["feasible", "marginal", "infeasible", "unknown"]);
  });
});

describe("resolution and contrast rules", () => {
  it("resolution: one element feasible, half marginal (common practice, Rayleigh-like)", () => {
    expect(RESOLUTION_RULE).toEqual({ feasibleAt: 1, marginalAt: 0.5 });
  });

  it("λ/B of the Event Horizon Telescope, 1.3 mm over 10 700 km, is about 25 µas (Thompson, Moran & Swenson 2017 §2.1)", () => {
    // 1.3e-3 m / 1.07e7 m = 1.215e-10 rad = 25.06 µas.
    expect(interferometerBeamRad(1.3, 10_700) / MICROARCSECOND_RAD).toBeCloseTo(25.06, 2);
  });

  it("shadow: one λ/B feasible, half marginal (common practice; M87* 42 µas at λ/B ≈ 25 µas imaged, EHT 2019, from memory)", () => {
    expect(SHADOW_RULE).toEqual({ feasibleAt: 1, marginalAt: 0.5 });
    expect(gradeAtLeast(42 / 25.06, SHADOW_RULE)).toBe("feasible");
  });

  it("contrast: reachable over the images' flux ratio, 1 feasible, 0.5 (0.75 mag beyond) marginal (our rule)", () => {
    expect(CONTRAST_RULE).toEqual({ feasibleAt: 1, marginalAt: 0.5 });
    expect(2.5 * Math.log10(1 / CONTRAST_RULE.marginalAt)).toBeCloseTo(0.75, 2);
  });
});

describe("photometric microlensing rules", () => {
  it("peak magnification: A(u0 = 1) = 1.34 feasible (common practice), A(u0 = 2) = 1.06 marginal (our rule); Paczyński 1986 eq. 6", () => {
    expect(PEAK_MAGNIFICATION_RULE.feasibleAt).toBeCloseTo(pointLensMagnification(1), 14);
    expect(PEAK_MAGNIFICATION_RULE.marginalAt).toBeCloseTo(pointLensMagnification(2), 14);
    expect(PEAK_MAGNIFICATION_RULE.feasibleAt).toBeCloseTo(1.3416, 4);
  });

  it("visits over t0 ± t_E: 20 feasible, 6 marginal (common practice: ten per t_E, three for a shape)", () => {
    expect(EVENT_VISITS_RULE).toEqual({ feasibleAt: 20, marginalAt: 6 });
  });

  it("visits over the peak: 5 feasible, 2 marginal (our rule)", () => {
    expect(PEAK_VISITS_RULE).toEqual({ feasibleAt: 5, marginalAt: 2 });
  });

  it("t_eff is u0·t_E (common practice), ρ·t_E for a larger source, at least t_E/10 (our rule)", () => {
    expect(peakHalfWidthDays(20, 0.3, null)).toEqual({ days: 6, term: "impact" });
    expect(peakHalfWidthDays(20, 0.3, 0.5)).toEqual({ days: 10, term: "source" });
    expect(peakHalfWidthDays(20, 0.01, 0.002)).toEqual({ days: 2, term: "floor" });
  });

  it("the peak is observed within t_eff/4 of t0, where A is within 3 % of its peak (our rule; Paczyński 1986 light curve)", () => {
    const u0 = 0.05;
    const tE = 20;
    const peak = paczynskiMagnification(0, 0, tE, u0);
    const atQuarter = paczynskiMagnification((u0 * tE) / 4, 0, tE, u0);
    expect(1 - atQuarter / peak).toBeLessThan(0.03);
    expect(1 - atQuarter / peak).toBeGreaterThan(0.02);
    expect(peakReachVerdict(0.25, 1)).toBe("feasible");
    expect(peakReachVerdict(0.26, 1)).toBe("marginal");
    expect(peakReachVerdict(1, 1)).toBe("marginal");
    expect(peakReachVerdict(1.01, 1)).toBe("infeasible");
  });

  it("coverage: 2 t_E feasible (common practice), under that marginal, under t_E/10 infeasible (our rule)", () => {
    expect(coverageVerdict(40, 20)).toBe("feasible");
    expect(coverageVerdict(39.9, 20)).toBe("marginal");
    expect(coverageVerdict(2, 20)).toBe("marginal");
    expect(coverageVerdict(1.99, 20)).toBe("infeasible");
  });
});

describe("astrometric microlensing rules", () => {
  it("per epoch: 3 precisions feasible, 1 marginal (our rule)", () => {
    expect(ASTROMETRIC_EPOCH_RULE).toEqual({ feasibleAt: 3, marginalAt: 1 });
  });

  it("over the visits: 5σ detection, 3σ evidence (common practice)", () => {
    expect(ASTROMETRIC_DETECTION_RULE).toEqual({ feasibleAt: 5, marginalAt: 3 });
  });

  it("visits count while the shift is at least half its largest value θ_E/√8 (our rule; Walker 1995, Miyamoto & Yoshii 1995)", () => {
    expect(ASTROMETRIC_NEAR_PEAK_FRACTION).toBe(0.5);
    // The shift u/(u² + 2) is largest, 1/√8, at u = √2.
    expect(pointLensImages(Math.SQRT2).centroidShift).toBeCloseTo(1 / Math.sqrt(8), 15);
    expect(pointLensImages(1.3).centroidShift).toBeLessThan(1 / Math.sqrt(8));
    expect(pointLensImages(1.5).centroidShift).toBeLessThan(1 / Math.sqrt(8));
  });
});

describe("time-delay rules", () => {
  it("season: 1.5 Δt feasible, Δt marginal (common practice: the delay within one season)", () => {
    expect(DELAY_SEASON_RULE).toEqual({ feasibleAt: 1.5, marginalAt: 1 });
    expect(gradeAtLeast(120 / 200, DELAY_SEASON_RULE)).toBe("infeasible");
  });

  it("visits per Δt: 10 feasible, 3 marginal (common practice)", () => {
    expect(DELAY_VISITS_RULE).toEqual({ feasibleAt: 10, marginalAt: 3 });
  });

  it("cadence: Δt over three intervals feasible, one marginal, shorter not measured (common practice)", () => {
    expect(DELAY_CADENCE_RULE).toEqual({ feasibleAt: 3, marginalAt: 1 });
    expect(gradeAtLeast(0.9, DELAY_CADENCE_RULE)).toBe("infeasible");
  });

  it("seasons: one is enough, none is infeasible (our rule)", () => {
    expect([0, 1, 2].map((count) => gradeAtLeast(count, DELAY_SEASONS_RULE))).toEqual(["infeasible", "feasible", "feasible"]);
  });
});

describe("a case's overall verdict (our rule)", () => {
  it("is the worst known answer, unknown only while nothing is wrong but an input is missing", () => {
    expect(caseVerdictOf(["feasible", "marginal", "unknown"])).toBe("marginal");
    expect(caseVerdictOf(["feasible", "infeasible", "marginal"])).toBe("infeasible");
    expect(caseVerdictOf(["feasible", "unknown"])).toBe("unknown");
    expect(caseVerdictOf(["feasible", "feasible"])).toBe("feasible");
    expect(caseVerdictOf([])).toBe("unknown");
  });

  it("counts a stretch covered whole as covered, whatever the rounding of its Julian dates", () => {
    const t0 = 2_463_000.3;
    const tE = 25.35;
    expect(coverageVerdict(t0 + tE - (t0 - tE), tE)).toBe("feasible");
  });
});
