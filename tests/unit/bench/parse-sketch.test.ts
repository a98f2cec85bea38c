import { describe, expect, it } from "vitest";
import { parseBundle, parseSketch } from "@/lib/bench/parse-sketch";
import { demoSketch, sketchFromSearchParams, sketchToQueryString, type Sketch } from "@/lib/bench/sketch-state";
import { MILLIARCSECOND_RAD, PARSEC_M } from "@/lib/physics";

const sketch = (changes: Partial<Sketch>): Sketch => ({ ...demoSketch, ...changes });

describe("parseSketch", () => {
  it("reads the demo sketch's typed quantities in the physics units", () => {
    const parsed = parseSketch(sketch({}));
    if (!parsed.ok) throw new Error(JSON.stringify(parsed.fieldErrors));
    expect(parsed.inputs.lens).toEqual({ model: "point", massSolar: 0.5, radiusM: 0 });
    expect(parsed.inputs.geometry.dLensPc).toBe(4000);
    expect(parsed.inputs.geometry.dLensSourcePc).toBe(4000);
    // λ/B = 2.2 µm / 130 m, back from parsecs to metres.
    expect(parsed.inputs.instrument.resolutionRad).toBeCloseTo(2.2e-6 / 130, 18);
    expect(parsed.inputs.instrument.resolutionName).toBe("λ/B");
    expect(parsed.inputs.lightCurve.peakTimeS).toBe(45 * 86_400);
    expect(parsed.inputs.bundle).toEqual({ rayCount: 2000, bMinM: 0.5, bMaxM: 15, layout: "fan" });
  });

  it("accepts the spellings an astronomer types: 4e6 Msun, 8.1 kpc, 45 uas", () => {
    const parsed = parseSketch(sketch({ mass: "4e6 Msun", dl: "8.1 kpc", ds: "16 kpc", beta: "45 uas", betaUnit: "angle" }));
    if (!parsed.ok) throw new Error(JSON.stringify(parsed.fieldErrors));
    expect(parsed.inputs.lens).toEqual({ model: "point", massSolar: 4e6, radiusM: 0 });
    expect(parsed.inputs.geometry.dLensPc).toBeCloseTo(8100, 9);
    expect(parsed.inputs.sourceOffset).toEqual({ unit: "angle", betaRad: expect.closeTo(0.045 * MILLIARCSECOND_RAD, 24) });
  });

  it("puts a unit error beside the field that has it, and only there", () => {
    const parsed = parseSketch(sketch({ dl: "8 kg" }));
    expect(parsed.ok).toBe(false);
    if (parsed.ok) return;
    expect(Object.keys(parsed.fieldErrors)).toEqual(["dl"]);
    expect(parsed.fieldErrors.dl).toMatch(/^Lens distance D_L: '8 kg' .*mass/);
  });

  it("rejects a source in front of the lens on the source-distance field", () => {
    const parsed = parseSketch(sketch({ dl: "8 kpc", ds: "4 kpc" }));
    expect(parsed.ok || parsed.fieldErrors).toEqual({ ds: "The source must lie behind the lens (D_S > D_L)" });
  });

  it("rejects zero, negative and unitless values where they make no sense", () => {
    const parsed = parseSketch(sketch({ mass: "-1 Msun", u0: "0", cadence: "1 kg", rays: "5001", bmax: "0.1" }));
    if (parsed.ok) throw new Error("expected errors");
    expect(parsed.fieldErrors.mass).toMatch(/^Lens mass: '-1 Msun' .*greater than zero/);
    expect(parsed.fieldErrors.u0).toBe("u0 must lie between 1e-6 and 1000 (closer, a real source's size caps the peak magnification)");
    expect(parsed.fieldErrors.cadence).toMatch(/^Cadence: '1 kg' /);
    expect(parsed.fieldErrors.rays).toBe("The ray count must be a whole number from 1 to 5000");
    expect(parsed.fieldErrors.bmax).toBe("The largest impact parameter must exceed the smallest");
  });

  it("does not parse fields the chosen model hides (a stale σ is not an error for a point lens)", () => {
    expect(parseSketch(sketch({ sigma: "nonsense" })).ok).toBe(true);
    const sis = parseSketch(sketch({ lens: "sis", sigma: "nonsense" }));
    expect(sis.ok || Object.keys(sis.fieldErrors)).toEqual(["sigma"]);
  });

  it("turns redshifts into angular-diameter distances with the given H0 and Ωm", () => {
    const parsed = parseSketch(sketch({ geometry: "redshift", zl: "0.5", zs: "2", h0: "70", om0: "0.3" }));
    if (!parsed.ok) throw new Error(JSON.stringify(parsed.fieldErrors));
    // Flat ΛCDM, H0 = 70, Ωm = 0.3: D_A(0.5) ≈ 1259 Mpc, D_A(2) ≈ 1726 Mpc (Hogg 1999 formulas; astropy gives the same to 4 digits).
    expect(parsed.inputs.geometry.dLensPc / 1e6).toBeCloseTo(1259, -1);
    expect(parsed.inputs.geometry.dSourcePc / 1e6).toBeCloseTo(1726, -1);
    expect(parsed.inputs.geometry.zLens).toBe(0.5);
    // D_LS = (D_M(z_S) − D_M(z_L))/(1 + z_S) ≈ (5178 − 1889)/3 Mpc, not D_S − D_L (Hogg 1999 eq. 19).
    expect(parsed.inputs.geometry.dLensSourcePc / 1e6).toBeCloseTo(1097, -1);
  });

  it("reads the bundle fields alone, so a bad lens mass does not block tracing", () => {
    expect(parseBundle(sketch({ mass: "heavy" }))).toEqual({ ok: true, bundle: { rayCount: 2000, bMinM: 0.5, bMaxM: 15, layout: "fan" } });
    expect(parseBundle(sketch({ rays: "2.5" })).ok).toBe(false);
  });

  it("reads a bare number in the field's stated unit (mass in M☉, distances in kpc, cadence in days)", () => {
    const parsed = parseSketch(sketch({ mass: "0.5", dl: "4", ds: "8", cadence: "1" }));
    if (!parsed.ok) throw new Error(JSON.stringify(parsed.fieldErrors));
    expect(parsed.inputs.lens).toEqual({ model: "point", massSolar: 0.5, radiusM: 0 });
    expect(parsed.inputs.geometry.dLensPc).toBeCloseTo(4000, 9);
    expect(parsed.inputs.instrument.cadenceS).toBe(86_400);
  });

  it("converts wavelength and baseline without losing digits", () => {
    const parsed = parseSketch(sketch({ lambda: "1.3 mm", baseline: "10000 km" }));
    if (!parsed.ok) throw new Error(JSON.stringify(parsed.fieldErrors));
    expect(parsed.inputs.instrument.resolutionRad / (1.3e-3 / 1e7) - 1).toBeLessThan(1e-14);
    expect(PARSEC_M).toBeGreaterThan(3e16);
  });
});

describe("sketch URL state", () => {
  it("reproduces a sketch exactly from its query string", () => {
    const typed = sketch({ mass: "4e6 Msun", dl: "8.1 kpc", beta: "45 uas", betaUnit: "angle", layout: "cylinder" });
    const query = sketchToQueryString(typed);
    expect(sketchFromSearchParams(Object.fromEntries(new URLSearchParams(query)))).toEqual(typed);
  });

  it("falls back to the demo value for missing or malformed keys instead of failing", () => {
    const fromLink = sketchFromSearchParams({ mass: "1 Msun", lens: "wormhole", ds: ["9 kpc", "10 kpc"], dl: "x".repeat(200) });
    expect(fromLink.mass).toBe("1 Msun");
    expect(fromLink.lens).toBe("point");
    expect(fromLink.ds).toBe("9 kpc");
    expect(fromLink.dl).toBe(demoSketch.dl);
    expect(fromLink.cadence).toBe(demoSketch.cadence);
  });
});
