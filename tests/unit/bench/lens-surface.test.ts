import { describe, expect, it } from "vitest";
import { assembleBundle, type TracedChunk } from "@/lib/ray-view/assemble-bundle";
import { withLensSurface } from "@/lib/ray-view/bundle-surface";
import { computeResults, type BenchResults } from "@/lib/bench/compute-results";
import { hasPhotonSphere, lensRadiusInMassUnits, surfaceImpactParameterM } from "@/lib/bench/lens-surface";
import { parseSketch } from "@/lib/bench/parse-sketch";
import { demoSketch, type Sketch } from "@/lib/bench/sketch-state";
import { isSolarSketch } from "@/lib/bench/solar-caution";
import { ARCSECOND_RAD, AU_M, SOLAR_MASS_LENGTH_M, SOLAR_RADIUS_M } from "@/lib/physics";

function resultsOf(changes: Partial<Sketch>): BenchResults {
  const parsed = parseSketch({ ...demoSketch, ...changes });
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.fieldErrors));
  const computed = computeResults(parsed.inputs);
  if (!computed.ok) throw new Error(computed.message);
  return computed.results;
}

const rowIds = (results: BenchResults) => results.rows.map((row) => row.id);
const rowOf = (results: BenchResults, id: string) => {
  const found = results.rows.find((row) => row.id === id);
  if (found === undefined) throw new Error(`no row ${id}`);
  return found;
};

/** The Sun seen from the Earth, a star 1° from it far behind (the 1919 eclipse geometry). */
const sun: Partial<Sketch> = { mass: "1 Msun", dl: "1 au", ds: "8 kpc", betaUnit: "angle", beta: "1 deg", radius: "1 Rsun" };

describe("the Sun as a lens", () => {
  const results = resultsOf(sun);

  it("has no photon sphere, shadow or relativistic images, and says why", () => {
    for (const id of ["r-ph", "shadow", "photon-ring", "rel-plus", "rel-plus-mu", "rel-minus", "rel-minus-mu"]) expect(rowIds(results)).not.toContain(id);
    expect(results.deflections.map((row) => row.id)).not.toContain("deflection-rel-plus");
    expect(results.notes.map((note) => note.id)).toEqual(["no-photon-sphere", "occulted-image"]);
  });

  it("marks the inner image occulted, counts only the outer one and says there is no pair", () => {
    expect(rowOf(results, "theta-minus").note).toMatch(/^behind the lens/);
    expect(rowOf(results, "theta-plus").note).toBeUndefined();
    expect(Number.isNaN(rowOf(results, "separation").value)).toBe(true);
    expect(rowOf(results, "mu-total").value).toBe(rowOf(results, "mu-plus").value);
    expect(rowOf(results, "mu-total").note).toBe("images behind the lens are not counted");
    // A target has no lens radius: the page says the science case grades a compact lens's images.
    expect(results.notes.find((note) => note.id === "occulted-image")?.text).toMatch(/^The inner image lies behind the lens's body.*grades the images of a compact lens\.$/);
    expect(results.lensPlane.images).toHaveLength(1);
    expect(results.deflections.find((row) => row.id === "deflection-minus")?.hitsSurface).toBe(true);
    expect(results.deflections.find((row) => row.id === "deflection-plus")?.hitsSurface).toBe(false);
  });

  it("deflects a ray grazing the limb by 4GM☉/(c²R☉) = 1.7512″ (Einstein 1916; the 1.75″ of the 1919 eclipse)", () => {
    const limb = results.deflections.find((row) => row.id === "deflection-limb");
    // GM☉/c² = 1476.625 m (IAU 2015 B3 nominal GM☉, exact c), R☉ = 6.957e8 m (IAU 2015 B3).
    // The grazing ray's b = R/√(1 − 2M/R) exceeds R by M/R = 2.1e-6 relative.
    expect(Math.abs((limb?.weakFieldRad ?? 0) / ((4 * SOLAR_MASS_LENGTH_M) / SOLAR_RADIUS_M) - 1)).toBeLessThan(3e-6);
    expect((limb?.weakFieldRad ?? 0) / ARCSECOND_RAD).toBeCloseTo(1.7512, 4);
    // The next term, (15π/4)(M/b)², adds 6e-6 of the whole (Keeton & Petters 2005).
    expect(Math.abs((limb?.exactRad ?? 0) / (limb?.weakFieldRad ?? 1) - 1)).toBeLessThan(1e-5);
    expect(limb?.hitsSurface).toBe(false);
  });

  it("shifts the star seen 1° from the Sun by 1.7512″ × R☉/b = 0.4666″ (weak-field deflection 4GM/(c² b))", () => {
    const bM = AU_M * Math.sin(Math.PI / 180);
    const expectedRad = (4 * SOLAR_MASS_LENGTH_M) / bM;
    expect(rowOf(results, "centroid-shift").value / expectedRad - 1).toBeLessThan(1e-3);
    expect(rowOf(results, "centroid-shift").value / ARCSECOND_RAD).toBeCloseTo(0.4666, 3);
  });

  it("keeps the solar-filter caution", () => {
    const parsed = parseSketch({ ...demoSketch, ...sun });
    expect(parsed.ok && isSolarSketch(parsed.inputs)).toBe(true);
  });

  it("hides both images, and the source, when it lies behind the disk (β = 0.3 θ_E)", () => {
    const behind = resultsOf({ ...sun, betaUnit: "thetaE", beta: "0.3" });
    expect(rowOf(behind, "mu-total").value).toBe(0);
    expect(rowOf(behind, "peak")).toMatchObject({ value: 0, note: "the source is behind the lens at closest approach: no image is seen" });
    expect(behind.notes.find((note) => note.id === "occulted-image")?.text).toMatch(/^Both images lie behind the lens's body/);
    expect(behind.lensPlane.images).toEqual([]);
  });
});

describe("lens radius against the photon sphere (r = 3GM/c²)", () => {
  it("keeps the shadow, photon ring and relativistic images of a compact lens", () => {
    const blackHole = resultsOf({ mass: "4e6 Msun", dl: "8.1 kpc", ds: "16 kpc" });
    for (const id of ["r-ph", "shadow", "photon-ring", "rel-plus"]) expect(rowIds(blackHole)).toContain(id);
    expect(blackHole.notes).toEqual([]);
  });

  it("gives a 1.4 M☉ body of 12 km (> 3M = 6.2 km) no shadow, and one of 5 km (< 3M) its shadow", () => {
    expect(rowIds(resultsOf({ mass: "1.4 Msun", radius: "12 km" }))).not.toContain("shadow");
    expect(rowIds(resultsOf({ mass: "1.4 Msun", radius: "5 km" }))).toContain("shadow");
  });

  it("refuses a radius inside the horizon (R ≤ 2M = 4.13 km for 1.4 M☉)", () => {
    const parsed = parseSketch({ ...demoSketch, mass: "1.4 Msun", radius: "4 km" });
    expect(parsed.ok || parsed.fieldErrors.radius).toMatch(/inside its own horizon/);
  });

  it("takes compact, an empty field or 'black hole' as a compact object", () => {
    for (const radius of ["compact", "", "Compact object", "black hole"]) {
      const parsed = parseSketch({ ...demoSketch, radius });
      expect(parsed.ok && parsed.inputs.lens).toEqual({ model: "point", massSolar: 0.5, radiusM: 0 });
    }
  });

  it("grazes at b_R = R/√(1 − 2M/R) (Darwin 1959) and has none inside 3M", () => {
    expect(surfaceImpactParameterM(10, 1)).toBeCloseTo(10 / Math.sqrt(0.8), 14);
    expect(surfaceImpactParameterM(2.5, 1)).toBe(0);
    expect(hasPhotonSphere(2.9, 1)).toBe(true);
    expect(hasPhotonSphere(3, 1)).toBe(false);
  });
});

describe("the ray bundle around a body", () => {
  /** Two straight rays along +x at y = 1 and y = 10 (units of M), points every unit from x = −20 to 20. */
  function straightBundle() {
    const xs = Array.from({ length: 41 }, (_, i) => i - 20);
    const vertices = new Float32Array([...xs.flatMap((x) => [x, 1, 0]), ...xs.flatMap((x) => [x, 10, 0])]);
    const chunk: TracedChunk = {
      firstRay: 0,
      rayCount: 2,
      vertices,
      lineDistances: new Float32Array([...xs.map((x) => x + 20), ...xs.map((x) => x + 20)]),
      // At unit speed from x = −20.
      times: new Float32Array([...xs.map((x) => x + 20), ...xs.map((x) => x + 20)]),
      pointCounts: new Uint32Array([41, 41]),
      fates: new Uint8Array([0, 0]),
      deflectionsRad: new Float32Array([0.1, 0.01]),
      arrivalTimesM: new Float32Array([40.5, 40.1]),
      wavefronts: new Float32Array([0, 1, 0, 0, 10, 0]),
    };
    return assembleBundle([chunk], 2, 1, new Float64Array([20]), 20);
  }

  it("ends rays with b below the surface on it and counts them as hitting the body", () => {
    const bundle = withLensSurface(straightBundle(), 5);
    expect(bundle.fateCounts).toEqual({ escaped: 1, captured: 0, winding: 0, surface: 1 });
    // The first ray stops where y = 1 meets r = 5: x = −√24.
    const firstRayEnd = bundle.rayFirstPoint[1] - 1;
    expect(bundle.vertices[3 * firstRayEnd]).toBeCloseTo(-Math.sqrt(24), 5);
    // It reaches the surface at coordinate time 20 − √24 (unit speed from x = −20), and has no deflection or arrival.
    expect(bundle.vertexTimesM[firstRayEnd]).toBeCloseTo(20 - Math.sqrt(24), 5);
    expect(bundle.latestTimeM).toBe(40);
    expect([bundle.rayDeflectionsRad[0], bundle.rayArrivalTimesM[0]].every(Number.isNaN)).toBe(true);
    expect(bundle.rayDeflectionsRad[1]).toBeCloseTo(0.01, 7);
    expect(bundle.rayFirstPoint[2] - bundle.rayFirstPoint[1]).toBe(41);
    // The wavefront joining (0, 1) and (0, 10) has an end inside the body: dropped.
    expect(bundle.wavefrontVertices).toHaveLength(0);
    expect(bundle.wavefrontVertexTimesM).toHaveLength(0);
  });

  it("changes nothing for a body inside its photon sphere", () => {
    const bundle = straightBundle();
    expect(withLensSurface(bundle, 2.5)).toBe(bundle);
  });

  it("puts the Sun's surface at R☉/(GM☉/c²) = 4.711e5 M, outside any traced region", () => {
    expect(lensRadiusInMassUnits({ lens: "point", mass: "1 Msun", radius: "1 Rsun" }) / 4.711e5 - 1).toBeLessThan(1e-4);
    expect(lensRadiusInMassUnits({ lens: "point", mass: "1 Msun", radius: "compact" })).toBe(0);
    expect(lensRadiusInMassUnits({ lens: "sis", mass: "1 Msun", radius: "1 Rsun" })).toBe(0);
  });
});
