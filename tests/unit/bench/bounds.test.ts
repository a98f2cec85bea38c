import { describe, expect, it } from "vitest";
import { computeResults, type BenchResults } from "@/lib/bench/compute-results";
import { parseSketch, SIGMA_WARNING_KM_PER_S } from "@/lib/bench/parse-sketch";
import { lightCurve } from "@/lib/bench/plot-data";
import { demoSketch, type Sketch } from "@/lib/bench/sketch-state";
import { acceptedRanges, MAX_LENS_COMPACTNESS } from "@/lib/physics/accepted-ranges";
import { finiteSourceMagnification, peakMagnification } from "@/lib/lensing";
import { ARCSECOND_RAD, DAY_S, PARSEC_M, pointLensMagnification, SOLAR_MASS_LENGTH_M, SOLAR_RADIUS_M, SPEED_OF_LIGHT_KM_PER_S } from "@/lib/physics";

const sketch = (changes: Partial<Sketch>): Sketch => ({ ...demoSketch, ...changes });

function resultsOf(changes: Partial<Sketch>): BenchResults {
  const parsed = parseSketch(sketch(changes));
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.fieldErrors));
  const computed = computeResults(parsed.inputs);
  if (!computed.ok) throw new Error(computed.message);
  return computed.results;
}

const rowOf = (results: BenchResults, id: string) => {
  const found = results.rows.find((row) => row.id === id);
  if (found === undefined) throw new Error(`no row ${id}`);
  return found;
};

describe("velocity dispersion", () => {
  it("refuses σ = 3e5 km/s (the issue's probe, θ_E = 1.6e6″) and says the limit is far below c", () => {
    const parsed = parseSketch(sketch({ lens: "sis", sigma: "3e5 km/s" }));
    expect(parsed.ok || parsed.fieldErrors.sigma).toBe("The velocity dispersion must lie between 1 and 3000 km/s (far below the speed of light, 299\u202f792 km/s)");
    expect(acceptedRanges.velocityDispersionKmPerS.max).toBeLessThan(SPEED_OF_LIGHT_KM_PER_S / 99);
  });

  it("warns above 1,500 km/s (richer than any known cluster) without refusing", () => {
    const fast = parseSketch(sketch({ lens: "sis", sigma: "2000 km/s" }));
    if (!fast.ok) throw new Error(JSON.stringify(fast.fieldErrors));
    expect(fast.warnings.sigma).toMatch(/^Above 1500 km\/s/);
    const usual = parseSketch(sketch({ lens: "sis", sigma: "220 km/s" }));
    expect(usual.ok && usual.warnings).toEqual({});
    expect(SIGMA_WARNING_KM_PER_S).toBe(1500);
  });

  it("keeps an isothermal lens's θ_E below 5′ even at the largest σ and D_LS/D_S → 1", () => {
    // θ_E = 4π (σ/c)² D_LS/D_S (SIS); at σ = 3,000 km/s and D_LS/D_S = 1 − 1e-10 that is 4.32′.
    const results = resultsOf({ lens: "sis", sigma: "3000 km/s", dl: "1e-6 pc", ds: "10 kpc", beta: "0.5" });
    const thetaERad = rowOf(results, "theta-e").value;
    expect(thetaERad).toBeCloseTo(4 * Math.PI * (3000 / SPEED_OF_LIGHT_KM_PER_S) ** 2, 12);
    expect(thetaERad / ARCSECOND_RAD / 60).toBeLessThan(5);
  });
});

describe("Einstein radius of a point lens", () => {
  it("stays below 1.15° at the compactness limit GM/(c² D_L) = 1e-4 (θ_E ≤ √(4 × 1e-4) rad)", () => {
    // D_L such that GM/(c² D_L) = 0.99e-4 for 1e12 M☉; the source far behind (D_LS/D_S ≈ 1).
    const dLensPc = (1e12 * SOLAR_MASS_LENGTH_M) / (0.99 * MAX_LENS_COMPACTNESS) / PARSEC_M;
    const thetaERad = rowOf(resultsOf({ mass: "1e12 Msun", dl: `${dLensPc} pc`, ds: "10 Gpc" }), "theta-e").value;
    expect(thetaERad).toBeLessThan(Math.sqrt(4 * MAX_LENS_COMPACTNESS));
    expect((thetaERad * 180) / Math.PI).toBeGreaterThan(1.1);
  });

  it("refuses a lens so close for its mass that θ_E would pass a few degrees, on the mass and distance fields", () => {
    const parsed = parseSketch(sketch({ mass: "1e12 Msun", dl: "1 pc", ds: "10 Gpc" }));
    if (parsed.ok) throw new Error("expected a refusal");
    expect(parsed.fieldErrors.mass).toMatch(/too close for its mass/);
    expect(parsed.fieldErrors.dl).toBe(parsed.fieldErrors.mass);
  });
});

describe("peak magnification", () => {
  it("refuses u0 = β = 1e-9 (the issue's unbounded peak) and accepts the range's floor, 1e-6", () => {
    const tiny = parseSketch(sketch({ beta: "1e-9" }));
    expect(tiny.ok || tiny.fieldErrors.beta).toMatch(/^β must lie between 1 × 10⁻⁶ and 1000/);
    expect(parseSketch(sketch({ beta: "1e-6" })).ok).toBe(true);
  });

  it("gives the peak of a Sun-sized source as its finite-source magnification, near √(1 + 4/ρ²), and says the source's size limits it", () => {
    const results = resultsOf({ beta: "1e-6", rstar: "1 Rsun" });
    const thetaERad = rowOf(results, "theta-e").value;
    // ρ = (R☉ / D_S) / θ_E with R☉ = 6.957e8 m (IAU 2015 B3 nominal), D_S = 8 kpc.
    const rho = SOLAR_RADIUS_M / (8000 * PARSEC_M) / thetaERad;
    expect(rowOf(results, "rho").value).toBeCloseTo(rho, 15);
    const peak = rowOf(results, "peak");
    // Witt & Mao 1994: a uniform disk centred on the lens is magnified √(1 + 4/ρ²) ≈ 2/ρ ≈ 2,455 here;
    // u0 = 1e-6 ≪ ρ ≈ 8e-4 changes that by ~(u0/ρ)², far below the digit checked.
    expect(peak.value).toBe(peakMagnification(1e-6, rowOf(results, "rho").value));
    expect(peak.value).toBeCloseTo(2454.6, 0);
    expect(peak.note).toMatch(/^limited by the source's size: for a disk of ρ = .* it differs by more than 1% from a point source's 1(\.0*)? × 10⁶/);
  });

  it("gives the demo's peak (u0 = β = 0.3) within 1% of the point-source value (u²+2)/(u√(u²+4)) = 3.445 (Paczyński 1986), without the source-size note", () => {
    const results = resultsOf({});
    const peak = rowOf(results, "peak");
    expect(peak.value).toBe(peakMagnification(0.3, rowOf(results, "rho").value));
    expect(Math.abs(peak.value / (2.09 / (0.3 * Math.sqrt(4.09))) - 1)).toBeLessThan(1e-5);
    expect(peak.note).toBeUndefined();
  });

  it("refuses a source radius without a length unit and reads a bare number in R☉, as a target's field does", () => {
    const parsed = parseSketch(sketch({ rstar: "2 kg" }));
    expect(parsed.ok || parsed.fieldErrors.rstar).toMatch(/^Source radius: '2 kg'/);
    const bare = parseSketch(sketch({ rstar: "2" }));
    expect(bare.ok && bare.inputs.event.sourceRadiusSolar).toBe(2);
  });

  it("takes the source's radius or ρ, not both, and a point source when neither is set", () => {
    const both = parseSketch(sketch({ rstar: "1 Rsun", rho: "0.01" }));
    expect(both.ok || both.fieldErrors.rho).toBe("Give the source's radius R_* or ρ, not both.");
    const pointSource = resultsOf({ rstar: "" });
    expect(rowOf(pointSource, "rho").note).toBe("no source radius set: a point source");
    expect(rowOf(pointSource, "peak").value).toBe(pointLensMagnification(0.3));
  });
});

describe("light curve", () => {
  it("marks the curve limited by the source's size when a finite source moves it more than 1%, and draws no peak above the disk's", () => {
    const limited = resultsOf({ beta: "1e-6" });
    const curve = lightCurve(limited.event!);
    expect(curve.isLimitedBySourceSize).toBe(true);
    expect(Math.max(...curve.curve.map((point) => point.y))).toBeLessThanOrEqual(rowOf(limited, "peak").value);
    expect(lightCurve(resultsOf({}).event!).isLimitedBySourceSize).toBe(false);
  });

  it("draws the exact finite-source magnification along the curve, not a point source's capped at the peak", () => {
    const event = resultsOf({ beta: "1e-6" }).event!;
    const rho = event.sourceRadiusThetaE!;
    // Inside the disk the cap would have drawn the point-source value (below its √(1 + 4/ρ²) cap at u ≈ ρ/2); the disk gives less.
    const u = 0.5 * rho;
    expect(finiteSourceMagnification(u, rho)).toBeLessThan(0.99 * pointLensMagnification(u));
    for (const point of lightCurve(event).curve) {
      const uAt = Math.hypot(event.u0ThetaE, (point.x * DAY_S - event.peakTimeS) / event.einsteinTimeS);
      expect(Math.abs(point.y / finiteSourceMagnification(uAt, rho) - 1)).toBeLessThan(1e-9);
    }
  });
});
