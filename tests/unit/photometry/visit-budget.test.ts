import { describe, expect, it } from "vitest";
import {
  baselineMagnitude,
  centroidPrecisionMas,
  magnifiedBlendMagnitude,
  skyBrightnessAtVisit,
  standardBand,
  visitPhotometry,
  visitPhotometrySeries,
  type BandSky,
  type PhotometryInstrument,
  type PsfShape,
  type VisitSkyConditions,
} from "@/lib/photometry";
import { loadBudgetFixture } from "./budget-fixture";
import { relativeError } from "./fixtures";

interface VisitCase {
  input: {
    name: string;
    bandId: string;
    sourceMagnitude: number;
    blendFraction: number;
    magnification: number;
    airmass: number;
    targetZenithDeg: number;
    moonZenithDeg: number;
    moonSeparationDeg: number;
    moonPhaseAngleDeg: number;
    apertureM: number;
    centralObstructionM: number;
    throughput: number;
    readNoise: number;
    dark: number;
    gain: number;
    fullWell: number;
    pixelScaleArcsec: number;
    seeingZenithArcsec: number;
    apertureRadiusFwhm: number;
    psf: PsfShape;
    exposureS: number;
    goal: number;
    darkSkyZenith: number;
    extinction: number;
    extinctionV: number;
  };
  expected: {
    visitMagnitude: number;
    seeingFwhmArcsec: number;
    darkSkyMagPerArcsec2: number;
    moonMagPerArcsec2: number | null;
    skyMagPerArcsec2: number;
    signalToNoise: number;
    precisionMmag: number;
    exposureForGoalS: number;
    peakPixelFullWellFraction: number;
    centroidPrecisionMas: number;
  };
}

// Written by tests/fixtures/generate_photometry.py: each visit worked end to end in mpmath and scipy
// from the papers' formulas (quoted in its docstring), without the TypeScript. The first case is the
// invented target of issue 17: I = 19.0, f_s = 0.6, A = 12, X = 1.3, Moon 60° away at Z = 50°,
// phase angle 40°, 1.0 m telescope (0.35 m obstruction), throughput 0.45, 120 s.
const fixture = loadBudgetFixture<{ cases: VisitCase[] }>("visit-budget.json");

function setupOf(input: VisitCase["input"]) {
  const band = standardBand(input.bandId);
  if (!band) throw new Error(`no band ${input.bandId}`);
  const instrument: PhotometryInstrument = {
    optics: { apertureM: input.apertureM, centralObstructionM: input.centralObstructionM, throughput: input.throughput },
    readNoiseElectrons: input.readNoise,
    darkElectronsPerSPerPixel: input.dark,
    gainElectronsPerAdu: input.gain,
    fullWellElectrons: input.fullWell,
    pixelScaleArcsec: input.pixelScaleArcsec,
    seeingFwhmZenithArcsec: input.seeingZenithArcsec,
    apertureRadiusFwhm: input.apertureRadiusFwhm,
    psf: input.psf,
    overheadS: 60,
  };
  const sky: BandSky = { band, darkSkyZenithMagPerArcsec2: input.darkSkyZenith, extinctionMagPerAirmass: input.extinction, extinctionV: input.extinctionV };
  const visit: VisitSkyConditions = {
    airmass: input.airmass,
    targetZenithDeg: input.targetZenithDeg,
    moonZenithDeg: input.moonZenithDeg,
    moonSeparationDeg: input.moonSeparationDeg,
    moonPhaseAngleDeg: input.moonPhaseAngleDeg,
  };
  const magnitude = magnifiedBlendMagnitude(baselineMagnitude(input.sourceMagnitude, input.blendFraction), input.magnification, input.blendFraction);
  return { instrument, sky, visit, magnitude, exposureS: input.exposureS, signalToNoiseGoal: input.goal };
}

const endToEnd = setupOf(fixture.cases[0].input);

describe("visitPhotometry against the independent end-to-end calculation (generate_photometry.py)", () => {
  it.each(fixture.cases.map((c) => [c.input.name, c] as const))("%s: every figure to 1e-6 relative", (_name, { input, expected }) => {
    const setup = setupOf(input);
    const result = visitPhotometry(setup);
    const sky = skyBrightnessAtVisit(setup.sky, setup.visit);
    const pairs: [number, number][] = [
      [setup.magnitude, expected.visitMagnitude],
      [result.seeingFwhmArcsec, expected.seeingFwhmArcsec],
      [sky.darkMagPerArcsec2, expected.darkSkyMagPerArcsec2],
      [result.skyMagPerArcsec2, expected.skyMagPerArcsec2],
      [sky.totalMagPerArcsec2, expected.skyMagPerArcsec2],
      [result.signalToNoise, expected.signalToNoise],
      [result.precisionMmag, expected.precisionMmag],
      [result.exposureForGoalS, expected.exposureForGoalS],
      [result.peakPixelFullWellFraction, expected.peakPixelFullWellFraction],
      [centroidPrecisionMas(result.seeingFwhmArcsec, result.signalToNoise), expected.centroidPrecisionMas],
    ];
    if (expected.moonMagPerArcsec2 !== null) pairs.push([result.moonMagPerArcsec2, expected.moonMagPerArcsec2]);
    else expect(result.moonMagPerArcsec2).toBe(Number.POSITIVE_INFINITY);
    const largest = Math.max(...pairs.map(([ours, theirs]) => relativeError(ours, theirs)));
    // Largest seen 5.2e-11 (the peak pixel: 64-interval Simpson against scipy's dblquad); the rest ≤ 1e-14.
    expect(largest).toBeLessThan(1e-6);
    expect(result.isSaturated).toBe(expected.peakPixelFullWellFraction >= 1);
  });

  it("the invented event reaches S/N 192 in 120 s (5.7 mmag) and S/N 50 in 8.8 s, unsaturated", () => {
    const result = visitPhotometry(endToEnd);
    expect(result.signalToNoise).toBeCloseTo(192.0026, 3);
    expect(result.exposureForGoalS).toBeCloseTo(8.7686, 3);
    expect(result.isSaturated).toBe(false);
  });
});

describe("visitPhotometry: its own consistency", () => {
  it("the exposure for the goal gives back the goal through the forward S/N", () => {
    for (const { input } of fixture.cases) {
      const setup = setupOf(input);
      const { exposureForGoalS } = visitPhotometry(setup);
      expect(relativeError(visitPhotometry({ ...setup, exposureS: exposureForGoalS }).signalToNoise, setup.signalToNoiseGoal)).toBeLessThan(1e-12);
    }
  });

  it("with the Moon down the sky is the dark sky and the Moon's magnitude is +Infinity", () => {
    const sky = skyBrightnessAtVisit(endToEnd.sky, { ...endToEnd.visit, moonZenithDeg: 120 });
    expect(sky.moonMagPerArcsec2).toBe(Number.POSITIVE_INFINITY);
    expect(sky.totalMagPerArcsec2).toBe(sky.darkMagPerArcsec2);
    // K&S eq. 2 at the zenith is the zenith value itself
    expect(skyBrightnessAtVisit(endToEnd.sky, { ...endToEnd.visit, targetZenithDeg: 0, airmass: 1 }).darkMagPerArcsec2).toBe(20);
  });

  it("moonlight adds in flux: equal dark and moon light make the sky 0.7526 mag brighter than either", () => {
    const { darkMagPerArcsec2, moonMagPerArcsec2, totalMagPerArcsec2 } = skyBrightnessAtVisit(endToEnd.sky, endToEnd.visit);
    const expected = -2.5 * Math.log10(10 ** (-0.4 * darkMagPerArcsec2) + 10 ** (-0.4 * moonMagPerArcsec2));
    expect(totalMagPerArcsec2).toBeCloseTo(expected, 12);
    expect(totalMagPerArcsec2).toBeLessThan(Math.min(darkMagPerArcsec2, moonMagPerArcsec2));
  });

  it("the precision is 1.0857 / (S/N) in mag", () => {
    const result = visitPhotometry(endToEnd);
    expect(result.precisionMmag).toBeCloseTo((1085.7362 / result.signalToNoise), 4);
  });
});

describe("visitPhotometrySeries", () => {
  // 240 visits over air mass 1–3, the Moon up and down at every phase, sources from 8 to 24 mag (some
  // saturate, some sit near the full well, so the bound test and the quadrature both decide).
  const count = 240;
  const visits = {
    airmass: new Float64Array(count),
    targetZenithDeg: new Float64Array(count),
    moonZenithDeg: new Float64Array(count),
    moonSeparationDeg: new Float64Array(count),
    moonPhaseAngleDeg: new Float64Array(count),
  };
  const magnitudes = new Float64Array(count);
  for (let i = 0; i < count; i++) {
    const z = (i * 7.3) % 70;
    visits.targetZenithDeg[i] = z;
    visits.airmass[i] = 1 / Math.cos((z * Math.PI) / 180);
    visits.moonZenithDeg[i] = (i * 13.7) % 180;
    visits.moonSeparationDeg[i] = (i * 29.1) % 180;
    visits.moonPhaseAngleDeg[i] = ((i * 17.9) % 360) - 180;
    magnitudes[i] = 8 + (i * 0.0671) % 16;
  }
  // A goal no 120 s exposure reaches: every visit then exposes the whole 120 s, so the full well's
  // verdict varies with the magnitude (a visit that reaches its goal exposes for less, see below).
  const common = { instrument: endToEnd.instrument, sky: endToEnd.sky, exposureS: 120, signalToNoiseGoal: 1e5 };
  const series = visitPhotometrySeries({ ...common, visits, magnitudes });

  it("equals visitPhotometry visit by visit (to float32), saturation verdicts included", () => {
    let saturated = 0;
    for (let i = 0; i < count; i++) {
      const visit = {
        airmass: visits.airmass[i],
        targetZenithDeg: visits.targetZenithDeg[i],
        moonZenithDeg: visits.moonZenithDeg[i],
        moonSeparationDeg: visits.moonSeparationDeg[i],
        moonPhaseAngleDeg: visits.moonPhaseAngleDeg[i],
      };
      const one = visitPhotometry({ ...common, visit, magnitude: magnitudes[i] });
      expect(series.signalToNoise[i]).toBe(Math.fround(one.signalToNoise));
      expect(series.precisionMmag[i]).toBe(Math.fround(one.precisionMmag));
      expect(series.exposureForGoalS[i]).toBe(Math.fround(one.exposureForGoalS));
      expect(series.skyMagPerArcsec2[i]).toBe(Math.fround(one.skyMagPerArcsec2));
      expect(series.moonMagPerArcsec2[i]).toBe(Math.fround(one.moonMagPerArcsec2));
      expect(series.saturated[i]).toBe(one.isSaturated ? 1 : 0);
      if (one.isSaturated) saturated += 1;
    }
    // both verdicts occur, so the comparison covers them
    expect(saturated).toBeGreaterThan(10);
    expect(saturated).toBeLessThan(count - 10);
  });

  it("decides saturation right next to the full well, where only the quadrature can", () => {
    // The well fills as a 10^(−0.4 m) + b (b: sky and dark); find the magnitude at which it just
    // fills, then step 1e-4 mag either side.
    const at = (magnitude: number) => visitPhotometry({ ...endToEnd, signalToNoiseGoal: 1e5, magnitude });
    const b = at(60).peakPixelFullWellFraction;
    const a = at(endToEnd.magnitude).peakPixelFullWellFraction - b;
    const threshold = endToEnd.magnitude - 2.5 * Math.log10((1 - b) / a);
    const near = Float64Array.from([threshold - 1e-4, threshold + 1e-4]);
    const two = { airmass: [1.3, 1.3], targetZenithDeg: [39.7, 39.7], moonZenithDeg: [50, 50], moonSeparationDeg: [60, 60], moonPhaseAngleDeg: [40, 40] };
    const result = visitPhotometrySeries({ ...common, instrument: endToEnd.instrument, visits: two, magnitudes: near });
    expect([...result.saturated]).toEqual([at(near[0]).isSaturated ? 1 : 0, at(near[1]).isSaturated ? 1 : 0]);
    expect([...result.saturated]).toEqual([1, 0]);
  });

  it("fills the well only over the exposure that reaches the goal: a bright source exposes for less", () => {
    const capped = visitPhotometry({ ...endToEnd, signalToNoiseGoal: 1e5 });
    const goalDriven = visitPhotometry(endToEnd);
    expect(goalDriven.exposureForGoalS).toBeLessThan(endToEnd.exposureS);
    // The well fills in proportion to the exposure used: the goal's, not the whole 120 s.
    expect(goalDriven.peakPixelFullWellFraction / capped.peakPixelFullWellFraction).toBeCloseTo(goalDriven.exposureForGoalS / endToEnd.exposureS, 12);
  });

  it("refuses arrays of different lengths and names the bad visit, counted from 1", () => {
    expect(() => visitPhotometrySeries({ ...common, visits: { ...visits, airmass: visits.airmass.subarray(1) }, magnitudes })).toThrow(
      /^Visit sky: the air masses, zenith distances, Moon separations and phase angles must give one value for each of the 240 visits \(got 239, 240, 240, 240, 240\)\.$/,
    );
    const bad = Float64Array.from(visits.airmass);
    bad[2] = 0.8;
    expect(() => visitPhotometrySeries({ ...common, visits: { ...visits, airmass: bad }, magnitudes })).toThrow(
      "Visit 3: Air mass must be a number of at least 1, got 0.8",
    );
  });

  it("checks the instrument before any visit: a zero aperture is refused even with no visits", () => {
    const none = { airmass: [], targetZenithDeg: [], moonZenithDeg: [], moonSeparationDeg: [], moonPhaseAngleDeg: [] };
    const zeroAperture = { ...endToEnd.instrument, optics: { ...endToEnd.instrument.optics, apertureM: 0 } };
    expect(() => visitPhotometrySeries({ ...common, instrument: zeroAperture, visits: none, magnitudes: [] })).toThrow(
      "Telescope aperture (m) must be a finite number > 0, got 0",
    );
    expect(visitPhotometrySeries({ ...common, visits: none, magnitudes: [] }).signalToNoise.length).toBe(0);
  });
});

describe("bad input, in words naming the field", () => {
  const cases: [string, Partial<PhotometryInstrument>, string][] = [
    ["zero photometric aperture", { apertureRadiusFwhm: 0 }, "Photometric aperture radius (multiples of the FWHM) must be a finite number > 0, got 0"],
    ["negative read noise", { readNoiseElectrons: -1 }, "Read noise (electrons) must be a finite number >= 0, got -1"],
    ["zero gain", { gainElectronsPerAdu: 0 }, "Gain (electrons per ADU) must be a finite number > 0, got 0"],
    ["zero full well", { fullWellElectrons: 0 }, "Full well (electrons) must be a finite number > 0, got 0"],
    ["zero seeing", { seeingFwhmZenithArcsec: 0 }, "Seeing FWHM at zenith (arcsec) must be a finite number > 0, got 0"],
    ["negative overhead", { overheadS: -5 }, "Overhead per visit (seconds) must be a finite number >= 0, got -5"],
    ["Moffat β of 1", { psf: { kind: "moffat", beta: 1 } }, "Moffat β must be a number above 1"],
  ];
  it.each(cases)("%s", (_name, change, message) => {
    expect(() => visitPhotometry({ ...endToEnd, instrument: { ...endToEnd.instrument, ...change } })).toThrow(message);
  });

  it("a source magnitude that is not a number, a zero exposure and a zero goal", () => {
    expect(() => visitPhotometry({ ...endToEnd, magnitude: Number.NaN })).toThrow("Magnitude must be a finite number, got NaN");
    expect(() => visitPhotometry({ ...endToEnd, exposureS: 0 })).toThrow("Exposure time (seconds) must be a finite number > 0, got 0");
    expect(() => visitPhotometry({ ...endToEnd, signalToNoiseGoal: 0 })).toThrow("Signal-to-noise goal must be a finite number > 0, got 0");
    expect(() => skyBrightnessAtVisit({ ...endToEnd.sky, extinctionV: -1 }, endToEnd.visit)).toThrow("V-band extinction must be at least 0");
  });
});

describe("centroidPrecisionMas (σ_PSF / (S/N), Lindegren 1978 photon limit)", () => {
  it("FWHM 1″ at S/N 100: 1000 / (2.354820 × 100) = 4.24661 mas (by hand)", () => {
    expect(centroidPrecisionMas(1, 100)).toBeCloseTo(4.24661, 5);
    expect(centroidPrecisionMas(2, 100) / centroidPrecisionMas(1, 200)).toBeCloseTo(4, 12);
  });

  it("refuses an S/N of 0 in words", () => {
    expect(() => centroidPrecisionMas(1, 0)).toThrow("Signal-to-noise must be a finite number > 0, got 0");
  });
});
