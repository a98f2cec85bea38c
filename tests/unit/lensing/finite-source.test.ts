import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import { finiteSourceMagnification, microlensParallax, peakMagnification } from "@/lib/lensing";
import { finiteSourceMagnificationExact } from "@/lib/lensing/finite-source";
import { AU_M, GM_SUN_M3_PER_S2, MILLIARCSECOND_RAD, SPEED_OF_LIGHT_M_PER_S, einsteinRadius, pointLensMagnification } from "@/lib/physics";

interface FiniteSourceCase {
  u: string;
  rho: string;
  limbDarkeningU: string;
  magnification: string;
}

// mpmath quadrature of the point-lens magnification over the source disk at 30 digits
// (tests/fixtures/generate_lensing.py).
const fixture: { versions: Record<string, string>; cases: FiniteSourceCase[] } = JSON.parse(
  readFileSync(fileURLToPath(new URL("../../fixtures/lensing/finite-source.json", import.meta.url)), "utf8"),
);

function relativeError(actual: number, expected: number): number {
  return Math.abs(actual - expected) / Math.abs(expected);
}

describe("finiteSourceMagnification", () => {
  it("is within 1e-9 of the mpmath disk quadrature over the whole grid, for each limb darkening, with and without the series", () => {
    const worst = new Map<string, number>();
    let worstExact = 0;
    for (const entry of fixture.cases) {
      const [u, rho, a] = [Number(entry.u), Number(entry.rho), Number(entry.limbDarkeningU)];
      const error = relativeError(finiteSourceMagnification(u, rho, a), Number(entry.magnification));
      worst.set(entry.limbDarkeningU, Math.max(worst.get(entry.limbDarkeningU) ?? 0, error));
      worstExact = Math.max(worstExact, relativeError(finiteSourceMagnificationExact(u, rho, a), Number(entry.magnification)));
    }
    expect([...worst.keys()].sort()).toEqual(["0", "0.3", "0.6", "1"]);
    for (const error of worst.values()) expect(error).toBeLessThanOrEqual(1e-9);
    expect(worstExact).toBeLessThanOrEqual(1e-9);
    console.log("finite-source worst relative error per limb-darkening coefficient:", Object.fromEntries(worst), "quadrature alone:", worstExact);
  });

  it("covers the caustic crossing: u = ρ exactly and ρ(1 ± 1e-3) for every ρ of the grid", () => {
    const rhos = new Set(fixture.cases.map((entry) => entry.rho));
    expect(rhos.size).toBe(8);
    for (const rho of rhos) {
      const offsets = fixture.cases.filter((entry) => entry.rho === rho).map((entry) => Number(entry.u) / Number(rho));
      expect(offsets).toContain(1);
      expect(offsets.some((ratio) => Math.abs(ratio - 0.999) < 1e-12)).toBe(true);
      expect(offsets.some((ratio) => Math.abs(ratio - 1.001) < 1e-12)).toBe(true);
    }
  });

  it("is continuous through u = ρ, just inside and just outside the caustic", () => {
    for (const rho of [1e-4, 0.1, 1, 10]) {
      const at = finiteSourceMagnification(rho, rho);
      for (const ratio of [1 - 1e-12, 1 + 1e-12]) expect(relativeError(finiteSourceMagnification(rho * ratio, rho), at)).toBeLessThan(1e-6);
    }
  });

  it("gives the centred disk's annulus value √(1 + 4/ρ²) at u = 0 (Witt & Mao 1994, ApJ 430, 505)", () => {
    for (const rho of [1e-4, 0.01, 1, 10]) expect(finiteSourceMagnification(0, rho)).toBeCloseTo(Math.sqrt(1 + 4 / rho ** 2), 9);
  });

  it("tends to the point-source magnification far from the lens", () => {
    expect(relativeError(finiteSourceMagnification(1, 1e-4, 0.6), pointLensMagnification(1))).toBeLessThan(1e-7);
    expect(relativeError(finiteSourceMagnification(100, 10), pointLensMagnification(100))).toBeLessThan(1e-7);
  });

  it("refuses a negative offset, a source without size and a limb darkening outside [0, 1] in words", () => {
    expect(() => finiteSourceMagnification(-1, 0.1)).toThrow(new RangeError("The source's offset from the lens (in Einstein radii) must be a finite number of at least 0, got -1"));
    expect(() => finiteSourceMagnification(Number.NaN, 0.1)).toThrow(/offset from the lens.*NaN/);
    expect(() => finiteSourceMagnification(0.1, 0)).toThrow(/source's radius/);
    expect(() => finiteSourceMagnification(0.1, Infinity)).toThrow(/source's radius/);
    expect(() => finiteSourceMagnification(0.1, 0.1, 1.5)).toThrow(/limb-darkening coefficient must lie between 0 and 1, got 1.5/);
  });
});

describe("peakMagnification", () => {
  it("is Paczyński's (u0² + 2)/(u0 √(u0² + 4)) for a point source (1986, ApJ 304, 1; hand values)", () => {
    expect(peakMagnification(1)).toBeCloseTo(3 / Math.sqrt(5), 14); // 1.3416…, the classic A at u = 1
    expect(peakMagnification(0.1)).toBeCloseTo(2.01 / (0.1 * Math.sqrt(4.01)), 12); // 10.0375…
  });

  it("is the finite-source magnification at u0 when the source has a size", () => {
    expect(peakMagnification(0.001, 0.01)).toBe(finiteSourceMagnification(0.001, 0.01));
    expect(peakMagnification(0.001, 0.01, 0.6)).toBe(finiteSourceMagnification(0.001, 0.01, 0.6));
    expect(peakMagnification(0, 0.01)).toBeCloseTo(Math.sqrt(1 + 4 / 1e-4), 8);
  });

  it("refuses a point source exactly behind the lens, which has no finite peak", () => {
    expect(() => peakMagnification(0)).toThrow(/point source exactly behind the lens/);
    expect(() => peakMagnification(-0.1)).toThrow(/impact parameter/);
    expect(() => peakMagnification(0.1, -1)).toThrow(/source's radius/);
  });
});

describe("microlensParallax", () => {
  // A 0.3 M☉ lens at 4 kpc, source at 8 kpc. θ_E = √(κ M π_rel) with κ = 4 GM☉/(c² au) and π_rel =
  // au (1/D_L − 1/D_S) = 0.125 mas (Gould 2000, ApJ 542, 785, eq. 2–4); hence π_E = √(π_rel / (κ M)).
  const thetaERad = einsteinRadius(0.3, 4000, 8000);
  const kappaRadPerSolarMass = (4 * GM_SUN_M3_PER_S2) / (SPEED_OF_LIGHT_M_PER_S ** 2 * AU_M);

  it("gives π_E = √(π_rel/(κ M)) for the bulge event, with θ_E ≈ 0.553 mas", () => {
    expect(kappaRadPerSolarMass / MILLIARCSECOND_RAD).toBeCloseTo(8.144, 3); // κ = 8.144 mas/M☉ (Gould 2000)
    expect(thetaERad / MILLIARCSECOND_RAD).toBeCloseTo(Math.sqrt(8.144 * 0.3 * 0.125), 3); // 0.5527 mas
    const relativeParallaxRad = 0.125 * MILLIARCSECOND_RAD;
    expect(relativeError(microlensParallax(4000, 8000, thetaERad), Math.sqrt(relativeParallaxRad / (kappaRadPerSolarMass * 0.3)))).toBeLessThan(1e-13);
    expect(microlensParallax(4000, 8000, thetaERad)).toBeCloseTo(0.2262, 4);
  });

  it("refuses a lens behind its source and a non-positive Einstein radius in words", () => {
    expect(() => microlensParallax(8000, 4000, thetaERad)).toThrow(/source's distance must be .* beyond the lens's/);
    expect(() => microlensParallax(0, 8000, thetaERad)).toThrow(/lens's distance/);
    expect(() => microlensParallax(4000, 8000, 0)).toThrow(/Einstein radius/);
  });
});
