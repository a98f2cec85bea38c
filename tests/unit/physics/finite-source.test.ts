import { describe, expect, it } from "vitest";
import { CAPPED_MAGNIFICATION_MAX_ERROR, cappedMagnification, sourceRadiusInThetaE, uniformDiskPeakMagnification } from "@/lib/physics/finite-source";
import { PARSEC_M, SOLAR_RADIUS_M } from "@/lib/physics";
import { loadFixture, relativeError } from "./fixtures";

interface FiniteSourceFixture {
  centred: { rho: number; magnification: string }[];
  offset: { u: number; rho: number; magnification: string }[];
}

// Reference: tests/fixtures/generate_finite_source.py (mpmath quadrature of the point-lens
// magnification over a uniform disk; versions recorded in the fixture).
const fixture = loadFixture<FiniteSourceFixture>("finite-source.json");

describe("uniform-disk peak magnification", () => {
  it("matches the disk centred on the lens, √(1 + 4/ρ²) (Witt & Mao 1994), to 1e-14", () => {
    let worst = 0;
    for (const row of fixture.centred) worst = Math.max(worst, relativeError(uniformDiskPeakMagnification(row.rho), Number(row.magnification)));
    expect(worst).toBeLessThan(1e-14);
  });

  it("refuses a source of no size (that is the unbounded point-source peak)", () => {
    expect(() => uniformDiskPeakMagnification(0)).toThrow(RangeError);
  });
});

describe("capped magnification", () => {
  it("stays within its stated error of the uniform disk at every offset, and is exact far from the lens", () => {
    let worst = 0;
    for (const row of fixture.offset) {
      const error = relativeError(cappedMagnification(row.u, row.rho).magnification, Number(row.magnification));
      worst = Math.max(worst, error);
      if (row.u > 20 * row.rho && row.rho <= 0.01) expect(error).toBeLessThan(1e-3);
    }
    expect(worst).toBeLessThan(CAPPED_MAGNIFICATION_MAX_ERROR);
    // The bound is not loose: the worst case (u ≈ 0.9 ρ) is within 0.01 of it.
    expect(worst).toBeGreaterThan(CAPPED_MAGNIFICATION_MAX_ERROR - 0.01);
  });

  it("says when the source's size sets the value", () => {
    expect(cappedMagnification(1e-6, 1e-3)).toEqual({ magnification: uniformDiskPeakMagnification(1e-3), isCapped: true });
    expect(cappedMagnification(0.3, 1e-3).isCapped).toBe(false);
  });
});

describe("source radius in Einstein radii", () => {
  it("is R/D_S over θ_E: a Sun-sized source at 8 kpc behind a 0.71 mas Einstein radius has ρ ≈ 8e-4", () => {
    // R☉ = 6.957e8 m (IAU 2015 B3 nominal); 8 kpc = 2.4686e20 m: θ_* = 2.818e-12 rad = 0.5813 µas.
    const thetaERad = 0.7134e-3 / 206_264.806;
    expect(sourceRadiusInThetaE(SOLAR_RADIUS_M, 8000, thetaERad)).toBeCloseTo(SOLAR_RADIUS_M / (8000 * PARSEC_M) / thetaERad, 15);
    expect(sourceRadiusInThetaE(SOLAR_RADIUS_M, 8000, thetaERad)).toBeCloseTo(8.15e-4, 5);
  });
});
