import { describe, expect, it } from "vitest";
import { parseBundle, parseSketch } from "@/lib/bench/parse-sketch";
import { demoSketch, sketchFromSearchParams, sketchToQueryString, type Sketch } from "@/lib/bench/sketch-state";
import { MILLIARCSECOND_RAD } from "@/lib/physics";

const sketch = (changes: Partial<Sketch>): Sketch => ({ ...demoSketch, ...changes });

describe("parseSketch", () => {
  it("reads the demo sketch's typed quantities in the physics units", () => {
    const parsed = parseSketch(sketch({}));
    if (!parsed.ok) throw new Error(JSON.stringify(parsed.fieldErrors));
    expect(parsed.inputs.lens).toEqual({ model: "point", massSolar: 0.5, radiusM: 0 });
    expect(parsed.inputs.geometry.dLensPc).toBe(4000);
    expect(parsed.inputs.geometry.dLensSourcePc).toBe(4000);
    // The proposal's side in a proposal's stored units: 2.2 µm = 0.0022 mm, 130 m = 0.13 km, 1 d = 24 h.
    expect(parsed.inputs.settings).toEqual({
      site: { name: "Sketch site", latitudeDeg: -30.2, longitudeDeg: -70.7, elevationM: 2200, horizonLimitDeg: 20 },
      cycleStartDate: "2027-04-01",
      cycleEndDate: "2027-09-30",
      instrument: {
        resolutionMas: 50,
        cadenceHours: 24,
        campaignLengthDays: 90,
        airmassLimit: 2,
        interferometerWavelengthMm: 0.0022,
        interferometerBaselineKm: 0.13,
        moonMinSeparationDeg: 30,
        moonMaxIllumination: null,
        visitMinutes: 20,
        clearNightFraction: 1,
        astrometricPrecisionMas: null,
        reachableContrast: null,
        spectroscopicPrecisionKmPerS: null,
      },
      photometry: null,
    });
    // 2027-07-10 00:00 UTC is JD 2461596.5 (JD 2451545.0 is 2000-01-01 12:00 UTC, plus 10050.5 days).
    expect(parsed.inputs.event).toEqual({ raDeg: expect.closeTo(269.30166666666667, 12), decDeg: expect.closeTo(-29.201388888888889, 12), scienceCase: null, eventPeakJdUtc: 2461596.5, sourceRadiusSolar: 1, sourceRadiusThetaE: null, limbDarkeningU: null });
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
    const parsed = parseSketch(sketch({ mass: "-1 Msun", beta: "0", cadence: "1 kg", rays: "5001", bmax: "0.1", clear: "0" }));
    if (parsed.ok) throw new Error("expected errors");
    expect(parsed.fieldErrors.mass).toMatch(/^Lens mass: '-1 Msun' .*greater than zero/);
    expect(parsed.fieldErrors.beta).toBe("β must lie between 1 × 10⁻⁶ and 1000 θ_E (closer, a real source's size caps the magnification)");
    expect(parsed.fieldErrors.clear).toBe("The clear-night fraction is from 0.01 to 1 (every night clear).");
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
    expect(parsed.inputs.settings.instrument.cadenceHours).toBe(24);
  });

  it("converts wavelength and baseline to the proposal's mm and km without losing digits", () => {
    const parsed = parseSketch(sketch({ lambda: "230 GHz", baseline: "10700 km" }));
    if (!parsed.ok) throw new Error(JSON.stringify(parsed.fieldErrors));
    // λ = c/ν = 299792458 m/s / 230 GHz = 1.303445469565 mm.
    expect(parsed.inputs.settings.instrument.interferometerWavelengthMm).toBe(1.30344546957);
    expect(parsed.inputs.settings.instrument.interferometerBaselineKm).toBe(10700);
  });

  it("reads the target's and the proposal's own fields as their forms do, and an empty one as not set", () => {
    const parsed = parseSketch(sketch({ lambda: "", baseline: "", t0: "", rstar: "", mu: "", case: "time-delay", cycleStart: "", cycleEnd: "", moonSep: "", astrometry: "100 uas", contrast: "1e3", elev: "-5" }));
    if (!parsed.ok) throw new Error(JSON.stringify(parsed.fieldErrors));
    const { instrument } = parsed.inputs.settings;
    expect([instrument.interferometerWavelengthMm, instrument.interferometerBaselineKm, instrument.moonMinSeparationDeg]).toEqual([null, null, null]);
    expect([instrument.astrometricPrecisionMas, instrument.reachableContrast, parsed.inputs.settings.site.elevationM]).toEqual([0.1, 1000, -5]);
    expect([parsed.inputs.settings.cycleStartDate, parsed.inputs.settings.cycleEndDate]).toEqual([null, null]);
    expect(parsed.inputs.event).toMatchObject({ scienceCase: "time-delay", eventPeakJdUtc: null, sourceRadiusSolar: null });
    expect(parsed.inputs.lightCurve.muRelRadPerS).toBeNull();
  });

  it("refuses a half-given interferometer, a cycle in the wrong order and a peak that is not a date, beside their fields", () => {
    const parsed = parseSketch(sketch({ lambda: "1.3 mm", baseline: "", cycleStart: "2027-09-30", cycleEnd: "2027-04-01", t0: "45 d", ra: "25 00 00" }));
    if (parsed.ok) throw new Error("expected errors");
    expect(parsed.fieldErrors.baseline).toBe("Give both the interferometer's wavelength and its baseline, or neither.");
    expect(parsed.fieldErrors.cycleEnd).toBe("The last night comes on or after the first.");
    expect(parsed.fieldErrors.t0).toMatch(/^The event peak "45 d" is not a date/);
    expect(parsed.fieldErrors.ra).toBe("Right ascension: hours must be below 24 (got 25).");
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
