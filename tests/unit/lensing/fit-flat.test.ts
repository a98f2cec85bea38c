import { describe, expect, it } from "vitest";
import { fitPointLens, type PhotometryPoint } from "@/lib/lensing/fit";

// A light curve with no event in it drives the search to magnifications of 1 + 10⁻¹⁰ (a tiny t_E or
// a large u0), where the blended fluxes' normal equations lose every digit: the fit must still end
// with finite fluxes and a χ², never a NaN or an exception from the linear algebra.
describe("a flat light curve", () => {
  it("ends with finite fluxes and χ² (the constant baseline), whatever the search reaches", () => {
    const points: PhotometryPoint[] = [];
    for (let i = 0; i < 120; i++) {
      const wobble = ((i * 7919) % 13) / 13 - 0.5; // deterministic scatter of ±0.5 %
      points.push({ tDays: 2_463_000 + i * 0.5, flux: 10 * (1 + 0.01 * wobble), fluxErr: 0.05, dataset: i % 3 === 0 ? "B" : "A" });
    }
    const fit = fitPointLens(points);
    expect(Number.isFinite(fit.chi2)).toBe(true);
    for (const d of fit.datasets) {
      expect(Number.isFinite(d.sourceFlux)).toBe(true);
      expect(Number.isFinite(d.blendFlux)).toBe(true);
      // Source plus blend is the baseline, 10 to within the scatter.
      expect(d.sourceFlux + d.blendFlux).toBeCloseTo(10, 1);
    }
  });
});
