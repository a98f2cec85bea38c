import { describe, expect, it } from "vitest";
import { deriveTargetColumns, targetFeasibility } from "@/lib/workspace/derived";
import {
  darkHoursVerdict,
  feasibilityReport,
  gradeRatio,
  interferometerBeamMicroarcsec,
  shadowVerdict,
  type FeasibilityColumns,
} from "@/lib/workspace/verdicts";

const defaults = { resolutionMas: 50, cadenceHours: 4, campaignLengthDays: 90, interferometerWavelengthMm: 1.3, interferometerBaselineKm: 10_700 };

describe("interferometer λ/B", () => {
  it("is 25.1 µas for 1.3 mm on a 10,700 km baseline", () => {
    // λ/B = 1.3e-3 m / 1.07e7 m = 1.2150e-10 rad; 1 µas = π/(648e9) rad = 4.8481e-12 rad → 25.06 µas.
    // The ~25 µas figure of an Earth-sized array at 1.3 mm: Event Horizon Telescope Collaboration 2019, ApJL 875, L1, §1.
    expect(interferometerBeamMicroarcsec(1.3, 10_700)).toBeCloseTo(25.06, 2);
    expect(interferometerBeamMicroarcsec(null, 10_700)).toBeNull();
    expect(interferometerBeamMicroarcsec(1.3, null)).toBeNull();
  });
});

describe("grading", () => {
  it("grades a ratio at the thresholds, unknown without a finite ratio", () => {
    expect(gradeRatio(1, 1, 0.5)).toBe("feasible");
    expect(gradeRatio(0.5, 1, 0.5)).toBe("marginal");
    expect(gradeRatio(0.49, 1, 0.5)).toBe("infeasible");
    expect(gradeRatio(null, 1, 0.5)).toBe("unknown");
    expect(gradeRatio(Number.NaN, 1, 0.5)).toBe("unknown");
  });

  it("grades the shadow against λ/B (one beam resolves, half a beam is marginal)", () => {
    expect(shadowVerdict(51.8, 25.06)).toEqual({ verdict: "feasible", ratio: 51.8 / 25.06 });
    expect(shadowVerdict(20, 25.06).verdict).toBe("marginal");
    expect(shadowVerdict(10, 25.06).verdict).toBe("infeasible");
    expect(shadowVerdict(null, 25.06).verdict).toBe("unknown");
    expect(shadowVerdict(51.8, null).verdict).toBe("unknown");
  });

  it("grades dark hours in the cycle: 0 h is infeasible, any hour marginal, 30 h feasible (our rule)", () => {
    expect(darkHoursVerdict(null)).toBe("unknown");
    expect(darkHoursVerdict({ totalHoursDark: 0, nightCount: 183, sunNightCount: 0 })).toBe("infeasible");
    expect(darkHoursVerdict({ totalHoursDark: 0.1, nightCount: 183, sunNightCount: 0 })).toBe("marginal");
    expect(darkHoursVerdict({ totalHoursDark: 29.9, nightCount: 183, sunNightCount: 0 })).toBe("marginal");
    expect(darkHoursVerdict({ totalHoursDark: 30, nightCount: 183, sunNightCount: 0 })).toBe("feasible");
  });
});

describe("feasibility report wording", () => {
  const point: FeasibilityColumns = {
    lensModel: "point",
    imageSeparationMas: 100,
    timeDelayDays: 1e-6,
    crossingTimeDays: 20,
    shadowDiameterMicroarcsec: 0.01,
    resolutionVerdict: "feasible",
    cadenceVerdict: "feasible",
    campaignVerdict: "feasible",
  };

  it("gives the number behind each verdict", () => {
    const report = Object.fromEntries(feasibilityReport(point, defaults, { totalHoursDark: 412.34, nightCount: 183, sunNightCount: 12 }).map((i) => [i.id, i]));
    expect(report.images.figure).toBe("separation 100 mas = 2 × resolution (50 mas)");
    // 20 d × 24 h / 4 h = 120 samples across t_E.
    expect(report.sampling.figure).toBe("120 samples per t_E (20 d at 4 h cadence)");
    // t0 ± t_E spans 40 d; 90 d / 40 d = 2.25.
    expect(report.campaign.figure).toBe("2 t_E = 40 d against a 90 d campaign (2.25 ×)");
    expect(report.shadow).toMatchObject({ verdict: "infeasible", figure: "shadow 0.01 µas = 0.000399 × λ/B (25.1 µas)" });
    expect(report["dark-hours"]).toMatchObject({ verdict: "feasible", figure: "412.3 h over 183 nights (12 nights unusable: too close to the Sun)" });
  });

  it("says what is missing instead of a number", () => {
    const sis: FeasibilityColumns = { ...point, lensModel: "sis", imageSeparationMas: null, timeDelayDays: null, shadowDiameterMicroarcsec: null, resolutionVerdict: "unknown" };
    const report = Object.fromEntries(feasibilityReport(sis, { ...defaults, interferometerWavelengthMm: null, interferometerBaselineKm: null }, null).map((i) => [i.id, i]));
    expect(report.images.figure).toBe("no image pair for this hypothesis");
    expect(report.sampling.figure).toBe("no Δt for this hypothesis");
    expect(report.shadow).toMatchObject({ verdict: "unknown", figure: "no shadow for this lens model" });
    expect(report["dark-hours"]).toMatchObject({ verdict: "unknown", figure: "set the cycle dates" });
  });

  it("grades a Galactic-Centre compact object's shadow as resolvable on an Earth-sized 1.3 mm array", () => {
    // Shadow 2√27 GM/(c² D) for 4.0e6 M☉ at 8.0 kpc = 51.3 µas (EHT Collaboration 2022, ApJL 930, L12:
    // ring 51.8 ± 2.3 µas); against λ/B = 25.06 µas that is 2.05 beams.
    const h = { lensModel: "point" as const, lensMassSolar: 4e6, lensDistancePc: 8000, sourceDistancePc: 8500, sourceOffsetThetaE: 2, properMotionMasPerYr: 5 };
    const columns = deriveTargetColumns(h, defaults);
    expect(columns.shadowDiameterMicroarcsec).toBeCloseTo(51.3, 0);
    const settings = {
      site: { name: "Southern test site", latitudeDeg: -24.6, longitudeDeg: -70.4, elevationM: 2635, horizonLimitDeg: 20 },
      instrument: { ...defaults, airmassLimit: 2 },
      cycleStartDate: "2031-03-01",
      cycleEndDate: "2031-08-30",
    };
    const report = Object.fromEntries(targetFeasibility({ ...columns, lensModel: "point", raDeg: 266.4168, decDeg: -29.0078 }, settings).map((i) => [i.id, i]));
    expect(report.shadow.verdict).toBe("feasible");
    expect(report.shadow.figure).toBe("shadow 51.3 µas = 2.05 × λ/B (25.1 µas)");
    // Culminating at 85° from 24.6° S, the Galactic Centre has hours of dark time on most nights of March–August.
    expect(report["dark-hours"].verdict).toBe("feasible");
  });

  it("grades a target that never clears the limit as infeasible, 0 h", () => {
    // Dec +60° culminates at 90° − |−24.6° − 60°| = 5.4°, below the 30° of air mass 2.
    const settings = {
      site: { name: "Southern test site", latitudeDeg: -24.6, longitudeDeg: -70.4, elevationM: 2635, horizonLimitDeg: 20 },
      instrument: { ...defaults, airmassLimit: 2 },
      cycleStartDate: "2031-03-01",
      cycleEndDate: "2031-03-07",
    };
    const report = Object.fromEntries(targetFeasibility({ ...point, raDeg: 150, decDeg: 60 }, settings).map((i) => [i.id, i]));
    expect(report["dark-hours"]).toMatchObject({ verdict: "infeasible", figure: "0.0 h over 7 nights" });
  });
});
