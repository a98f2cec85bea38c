import { describe, expect, it } from "vitest";
import { benchLink } from "@/lib/workspace/bench-link";
import { deriveTargetColumns } from "@/lib/workspace/derived";

const instrument = { resolutionMas: 50, cadenceHours: 4, campaignLengthDays: 90 };

// Reference numbers worked by hand from the closed forms (Paczyński 1986; SIS per Schneider, Ehlers
// & Falco 1992), with GM☉/c² = 1476.625 m and 1 pc = 3.0856776e16 m.
describe("derived columns of a point lens in the Galaxy", () => {
  const h = { lensModel: "point" as const, lensMassSolar: 0.5, lensDistancePc: 4000, sourceDistancePc: 8000, sourceOffsetThetaE: 0.3, properMotionMasPerYr: 5 };
  const d = deriveTargetColumns(h, instrument);

  it("gives θE, the image separation √(u²+4) θE and the total magnification", () => {
    expect(d.einsteinRadiusMas).toBeCloseTo(0.71344, 4);
    expect(d.imageSeparationMas! / d.einsteinRadiusMas!).toBeCloseTo(Math.sqrt(0.09 + 4), 12);
    // A(u) = (u² + 2)/(u √(u² + 4)) = 2.09/(0.3 · 2.02237) = 3.44477.
    expect(d.magnificationTotal).toBeCloseTo(3.44477, 4);
  });

  it("gives the crossing time θE/μ in days and grades it against the instrument", () => {
    // 0.71344 mas / 5 mas/yr = 0.142688 yr = 52.117 d.
    expect(d.crossingTimeDays).toBeCloseTo(52.117, 2);
    expect(d.resolutionVerdict).toBe("infeasible");
    expect(d.cadenceVerdict).toBe("feasible");
    expect(d.campaignVerdict).toBe("marginal");
  });

  it("has a shadow far below any resolution for a stellar lens", () => {
    expect(d.shadowDiameterMicroarcsec).toBeGreaterThan(0);
    expect(d.shadowDiameterMicroarcsec).toBeLessThan(1e-4);
  });

  it("leaves the crossing time and the cadence verdict unknown without a proper motion", () => {
    const without = deriveTargetColumns({ ...h, properMotionMasPerYr: null }, instrument);
    expect(without.crossingTimeDays).toBeNull();
    expect(without.cadenceVerdict).toBe("unknown");
  });
});

describe("derived columns of an isothermal galaxy", () => {
  const h = { lensModel: "sis" as const, velocityDispersionKmPerS: 250, lensRedshift: 0.4, sourceRedshift: 1.8, sourceOffsetThetaE: 0.3 };

  it("forms two images 2θE apart with magnification 2/u inside the Einstein radius", () => {
    const d = deriveTargetColumns(h, instrument);
    expect(d.imageSeparationMas! / d.einsteinRadiusMas!).toBeCloseTo(2, 12);
    expect(d.magnificationTotal).toBeCloseTo(2 / 0.3, 10);
    expect(d.timeDelayDays).toBeGreaterThan(1);
    expect(d.resolutionVerdict).toBe("feasible");
  });

  it("forms one image (no separation, no delay) outside it", () => {
    const d = deriveTargetColumns({ ...h, sourceOffsetThetaE: 1.5 }, instrument);
    expect(d.imageSeparationMas).toBeNull();
    expect(d.timeDelayDays).toBeNull();
    expect(d.magnificationTotal).toBeCloseTo(1 + 1 / 1.5, 12);
    expect(d.resolutionVerdict).toBe("unknown");
  });
});

describe("lens bench link", () => {
  it("carries the hypothesis and the instrument with units", () => {
    const url = new URL(benchLink({ lensModel: "point", lensMassSolar: 0.5, lensDistancePc: 4000, sourceDistancePc: 8000, sourceOffsetThetaE: 0.3, properMotionMasPerYr: 5 }, instrument), "http://x");
    expect(url.pathname).toBe("/bench");
    expect(Object.fromEntries(url.searchParams)).toMatchObject({ lens: "point", mass: "0.5 Msun", geometry: "distance", dl: "4000 pc", ds: "8000 pc", beta: "0.3", mu: "5 mas/yr", fwhm: "50 mas", cadence: "4 h", campaign: "90 d" });
  });
});
