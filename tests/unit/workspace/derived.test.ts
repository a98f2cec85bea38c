import { defaultPhotometrySettings } from "@/lib/workspace/photometry-schema";
import { describe, expect, it } from "vitest";
import { DERIVATION_VERSION, deriveTargetColumns, targetCaseReport, targetSchedule, targetSchedules, type FeasibilitySettings } from "@/lib/workspace/derived";
import { instrumentSchema } from "@/lib/workspace/proposal-schema";
import { parseEventPeakJdUtc } from "@/lib/workspace/event-peak";

/** An invented southern site and a cycle from February to early August (the bulge season). */
const southern: FeasibilitySettings = {
  site: { name: "Test ridge", latitudeDeg: -30.2, longitudeDeg: -70.7, elevationM: 2200, horizonLimitDeg: 20 },
  instrument: instrumentSchema.parse({ resolutionMas: 50, cadenceHours: 4, campaignLengthDays: 90 }),
  photometry: defaultPhotometrySettings,
  cycleStartDate: "2031-02-01",
  cycleEndDate: "2031-08-02",
};
const noCycle: FeasibilitySettings = { ...southern, cycleStartDate: null, cycleEndDate: null };

const bulgeTarget = { raDeg: 269.3, decDeg: -29.2 };
const bulgeEvent = (peak: string) => ({
  lensModel: "point" as const,
  lensMassSolar: 0.3,
  lensDistancePc: 4000,
  sourceDistancePc: 8000,
  sourceOffsetThetaE: 0.1,
  properMotionMasPerYr: 5,
  eventPeakJdUtc: parseEventPeakJdUtc(peak),
});

// Reference numbers worked by hand from the closed forms (Paczyński 1986; SIS per Schneider, Ehlers
// & Falco 1992), with GM☉/c² = 1476.625 m and 1 pc = 3.0856776e16 m.
describe("derived columns of a point lens in the Galaxy", () => {
  const h = { lensModel: "point" as const, lensMassSolar: 0.5, lensDistancePc: 4000, sourceDistancePc: 8000, sourceOffsetThetaE: 0.3, properMotionMasPerYr: 5 };
  const d = deriveTargetColumns(h, noCycle, null);

  it("gives θE, the image separation √(u²+4) θE and the total magnification", () => {
    expect(d.einsteinRadiusMas).toBeCloseTo(0.71344, 4);
    expect(d.imageSeparationMas! / d.einsteinRadiusMas!).toBeCloseTo(Math.sqrt(0.09 + 4), 12);
    // A(u) = (u² + 2)/(u √(u² + 4)) = 2.09/(0.3 · 2.02237) = 3.44477.
    expect(d.magnificationTotal).toBeCloseTo(3.44477, 4);
  });

  it("gives the crossing time θE/μ in days", () => {
    // 0.71344 mas / 5 mas/yr = 0.142688 yr = 52.117 d.
    expect(d.crossingTimeDays).toBeCloseTo(52.117, 2);
  });

  it("has a shadow far below any resolution for a stellar lens", () => {
    expect(d.shadowDiameterMicroarcsec).toBeGreaterThan(0);
    expect(d.shadowDiameterMicroarcsec).toBeLessThan(1e-4);
  });

  it("is stamped with the rules' version", () => {
    expect(d.derivationVersion).toBe(DERIVATION_VERSION);
  });
});

// The textbook Galactic-bulge event: 0.3 M☉ at 4 kpc, source at 8 kpc, u0 = 0.1. One watches
// its light curve: no question about resolving its images or timing their delay may be asked.
describe("a bulge microlensing event graded by its science case", () => {
  const inWinter = bulgeEvent("2031-06-20 04:00");
  const [schedule] = targetSchedules(southern, [bulgeTarget]);
  const report = targetCaseReport(inWinter, southern, schedule)!;
  const columns = deriveTargetColumns(inWinter, southern, schedule);

  it("is inferred to be a photometric microlensing event, with the reason stated", () => {
    expect(report.scienceCase).toMatchObject({ caseId: "photometric-microlensing", isChosen: false });
    expect(report.scienceCase.reason).toMatch(/brighten/);
    expect(columns.answeredCase).toBe("photometric-microlensing");
  });

  it("asks no resolution or time-delay question", () => {
    const ids = columns.caseAnswers.map((answer) => answer.id);
    expect(ids).toEqual(expect.arrayContaining(["peak-magnification", "event-visits", "peak-visits", "peak-window"]));
    expect(ids).not.toContain("image-separation");
    expect(ids.some((id) => id.startsWith("delay"))).toBe(false);
  });

  it("collects visits around a June peak from a southern site", () => {
    expect(schedule!.visitsJdUtc.length).toBeGreaterThan(100);
    const visits = columns.caseAnswers.find((answer) => answer.id === "event-visits")!;
    expect(visits.verdict).toBe("feasible");
    expect(columns.caseAnswers.find((answer) => answer.id === "peak-window")!.verdict).toBe("feasible");
  });

  it("says the peak is lost when the Galactic centre is behind the Sun (mid-December)", () => {
    const decemberCycle = { ...southern, cycleStartDate: "2031-11-25", cycleEndDate: "2032-01-05" };
    const [december] = targetSchedules(decemberCycle, [bulgeTarget]);
    const answers = deriveTargetColumns(bulgeEvent("2031-12-18"), decemberCycle, december).caseAnswers;
    const visits = answers.find((answer) => answer.id === "event-visits")!;
    expect(visits.verdict).toBe("infeasible");
    // Mid-December the Sun stands within a few degrees of the Galactic centre: up only in daylight.
    expect(visits.sentence).toMatch(/daylight|Sun/);
  });

  it("says which input is missing without a cycle", () => {
    const answers = deriveTargetColumns(inWinter, noCycle, null).caseAnswers;
    const visits = answers.find((answer) => answer.id === "event-visits")!;
    expect(visits.verdict).toBe("unknown");
    expect(visits.sentence).toMatch(/first and last nights/);
  });

  it("honours a case the team chose over the inferred one", () => {
    const chosen = targetCaseReport({ ...inWinter, scienceCase: "astrometric-microlensing" }, southern, schedule)!;
    expect(chosen.scienceCase).toEqual({ caseId: "astrometric-microlensing", isChosen: true, reason: null });
    expect(chosen.answers.map((answer) => answer.id)).toContain("astrometric-shift");
  });
});

describe("an isothermal galaxy lens", () => {
  const h = { lensModel: "sis" as const, velocityDispersionKmPerS: 250, lensRedshift: 0.5, sourceRedshift: 2, sourceOffsetThetaE: 0.3 };

  it("gives a separation of 2θE for a double", () => {
    const d = deriveTargetColumns(h, noCycle, null);
    expect(d.imageSeparationMas! / d.einsteinRadiusMas!).toBeCloseTo(2, 12);
    expect(d.timeDelayDays).toBeGreaterThan(0);
  });

  it("has no separation or delay with the source outside θE", () => {
    const d = deriveTargetColumns({ ...h, sourceOffsetThetaE: 1.5 }, noCycle, null);
    expect(d.imageSeparationMas).toBeNull();
    expect(d.timeDelayDays).toBeNull();
  });
});

describe("an incomplete hypothesis", () => {
  it("yields nulls and no answers rather than an error", () => {
    const d = deriveTargetColumns({ lensModel: "point", lensMassSolar: null, lensDistancePc: 4000, sourceDistancePc: 8000, sourceOffsetThetaE: 0.3 }, noCycle, null);
    expect(d).toMatchObject({ einsteinRadiusMas: null, answeredCase: null, caseVerdict: "unknown", caseAnswers: [] });
  });
});

// The kept single-target schedule must be the very schedule the batch computes (the batch is
// checked against astropy in tests/unit/schedule), handed back again for the same inputs only.
describe("one target's kept schedule", () => {
  it("is the batch's schedule, kept for the same conditions and coordinates", () => {
    const kept = targetSchedule(southern, bulgeTarget);
    expect(kept).toEqual(targetSchedules(southern, [bulgeTarget])[0]);
    expect(targetSchedule(southern, { ...bulgeTarget })).toBe(kept);
  });

  it("is simulated afresh when a condition or the coordinates change", () => {
    const kept = targetSchedule(southern, bulgeTarget);
    const slowerCadence = { ...southern, instrument: { ...southern.instrument, cadenceHours: 24 } };
    const other = targetSchedule(slowerCadence, bulgeTarget);
    expect(other).not.toBe(kept);
    expect(other).toEqual(targetSchedules(slowerCadence, [bulgeTarget])[0]);
    expect(other!.visitsJdUtc.length).toBeLessThan(kept!.visitsJdUtc.length);
    expect(targetSchedule(southern, { ...bulgeTarget, decDeg: -29.3 })).not.toBe(kept);
  });

  it("is null without cycle dates", () => {
    expect(targetSchedule(noCycle, bulgeTarget)).toBeNull();
  });
});
