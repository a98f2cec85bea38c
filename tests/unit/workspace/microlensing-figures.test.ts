import { describe, expect, it } from "vitest";
import { einsteinRadius, MILLIARCSECOND_RAD } from "@/lib/physics";
import { microlensingFigures } from "@/lib/workspace/microlensing-figures";

const bulge = { lensModel: "point" as const, lensMassSolar: 0.3, lensDistancePc: 4000, sourceDistancePc: 8000, sourceOffsetThetaE: 0.1, properMotionMasPerYr: 5 };

describe("a bulge event's microlensing figures", () => {
  const figures = microlensingFigures(bulge)!;
  const thetaE = einsteinRadius(0.3, 4000, 8000, 4000);

  it("gives A(u0) of a point source, (u² + 2)/(u √(u² + 4)) (Paczyński 1986, ApJ 304, 1)", () => {
    expect(figures.pointSourcePeak).toBeCloseTo(2.01 / (0.1 * Math.sqrt(4.01)), 12);
    expect(figures.finiteSourcePeak).toBeNull();
  });

  it("gives π_E = π_rel/θ_E with π_rel = 1 au (1/D_L − 1/D_S) (Gould 2000, ApJ 542, 785)", () => {
    // 1 au/4 kpc − 1 au/8 kpc = 0.125 mas; θ_E from the physics layer.
    expect(figures.microlensParallax).toBeCloseTo((0.125 * MILLIARCSECOND_RAD) / thetaE, 9);
  });

  it("gives the largest centroid shift θ_E/√8 (Walker 1995, ApJ 453, 37; from memory)", () => {
    expect(figures.maxAstrometricShiftRad).toBeCloseTo(thetaE / Math.sqrt(8), 20);
  });

  it("limits the peak by the source's disk: a 1 R☉ star at 8 kpc (ρ ≈ 0.0011) barely changes A at u0 = 0.1, and dominates at u0 = 0.0005", () => {
    const sized = microlensingFigures({ ...bulge, sourceRadiusSolar: 1 })!;
    expect(sized.finiteSourcePeak!.rho).toBeGreaterThan(0.001);
    expect(sized.finiteSourcePeak!.magnification / figures.pointSourcePeak!).toBeCloseTo(1, 3);
    const close = microlensingFigures({ ...bulge, sourceOffsetThetaE: 0.0005, sourceRadiusThetaE: 0.01 })!;
    // A uniform disk centred near the lens peaks at √(1 + 4/ρ²) ≈ 2/ρ = 200 (Witt & Mao 1994, ApJ 430, 505).
    expect(close.finiteSourcePeak!.magnification).toBeCloseTo(Math.sqrt(1 + 4 / 0.0001), 0);
    expect(close.finiteSourcePeak!.method).toMatch(/Lee et al\. 2009/);
  });

  it("has none for an extended lens", () => {
    expect(microlensingFigures({ lensModel: "sis", velocityDispersionKmPerS: 250, lensRedshift: 0.5, sourceRedshift: 2, sourceOffsetThetaE: 0.3 })).toBeNull();
  });
});
