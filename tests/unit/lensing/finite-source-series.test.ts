import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import { finiteSourceMagnification, finiteSourceMagnificationExact } from "@/lib/lensing/finite-source";
import { finiteSourceSeries, pointLensLaplacianPower } from "@/lib/lensing/finite-source-series";

// tests/fixtures/generate_finite_source_series.py: Δ^k A by mpmath numerical differentiation in
// Cartesian coordinates at 40 digits; disk averages by mpmath quadrature at 30 digits.
const fixture: {
  laplacians: { rows: { u: string; k: number; value: string }[] };
  diskAverages: { cases: { u: string; rho: string; uOverRho: string; limbDarkeningU: string; magnification: string }[] };
} = JSON.parse(readFileSync(fileURLToPath(new URL("../../fixtures/lensing/finite-source-series.json", import.meta.url)), "utf8"));

function relativeError(actual: number, expected: number): number {
  return Math.abs(actual - expected) / Math.abs(expected);
}

describe("pointLensLaplacianPower", () => {
  it("is mpmath's numerical Δ^k A of the point-lens magnification for k = 1…12 from u = 0.01 to 200, to 1e-12", () => {
    let worst = 0;
    for (const row of fixture.laplacians.rows) worst = Math.max(worst, relativeError(pointLensLaplacianPower(Number(row.u), row.k), Number(row.value)));
    expect(fixture.laplacians.rows.length).toBe(96);
    expect(worst).toBeLessThan(1e-12);
    console.log(`Δ^k A worst relative error against mpmath: ${worst.toExponential(1)}`);
  });

  it("gives the known ∇²A = 32(u² + 1)/(u³ (u² + 4)^{5/2}) (from dA/du = −8/(u² (u² + 4)^{3/2}))", () => {
    for (const u of [0.003, 0.4, 7]) expect(relativeError(pointLensLaplacianPower(u, 1), (32 * (u * u + 1)) / (u ** 3 * (u * u + 4) ** 2.5))).toBeLessThan(1e-14);
  });
});

describe("finiteSourceMagnification across the switch between the series and the quadrature", () => {
  const cases = fixture.diskAverages.cases;

  it("is within 1e-9 of the mpmath disk averages on both sides of the switch (u/ρ from 1.1 to 1000, ρ from 1e-4 to 0.5, a = 0, 0.5, 1)", () => {
    const worst = { series: 0, quadrature: 0 };
    const count = { series: 0, quadrature: 0 };
    for (const entry of cases) {
      const [u, rho, a] = [Number(entry.u), Number(entry.rho), Number(entry.limbDarkeningU)];
      const side = finiteSourceSeries(u, rho, a) === null ? "quadrature" : "series";
      count[side] += 1;
      worst[side] = Math.max(worst[side], relativeError(finiteSourceMagnification(u, rho, a), Number(entry.magnification)));
    }
    expect(cases.length).toBe(225);
    // The grid crosses the switch: both sides are measured, for every ρ.
    expect(count).toEqual({ series: 180, quadrature: 45 });
    expect(worst.series).toBeLessThanOrEqual(1e-9);
    expect(worst.quadrature).toBeLessThanOrEqual(1e-9);
    console.log("finite-source across the switch, points and worst relative error per side:", count, worst);
  });

  it("takes the series from u = 2ρ outwards and the quadrature at u ≤ 1.5ρ", () => {
    for (const entry of cases) {
      const [u, rho, a] = [Number(entry.u), Number(entry.rho), Number(entry.limbDarkeningU)];
      const ratio = Number(entry.uOverRho);
      if (ratio >= 2) expect(finiteSourceSeries(u, rho, a)).not.toBeNull();
      if (ratio <= 1.5) expect(finiteSourceSeries(u, rho, a)).toBeNull();
    }
  });

  it("keeps the quadrature alone (finiteSourceMagnificationExact) within 1e-9 of mpmath out to u = 1000ρ", () => {
    let worst = 0;
    for (const entry of cases) worst = Math.max(worst, relativeError(finiteSourceMagnificationExact(Number(entry.u), Number(entry.rho), Number(entry.limbDarkeningU)), Number(entry.magnification)));
    expect(worst).toBeLessThanOrEqual(1e-9);
  });

  it("gives no series value with the source over the lens (u ≤ ρ)", () => {
    expect(finiteSourceSeries(0.01, 0.01, 0)).toBeNull();
    expect(finiteSourceSeries(0.005, 0.01, 0.5)).toBeNull();
  });
});
