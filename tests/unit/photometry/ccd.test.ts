import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { ccdSignalToNoise, exposureForSignalToNoise, saturationCheck, type CcdRates } from "@/lib/photometry";
import { relativeError } from "../physics/fixtures";
import { loadBudgetFixture } from "./budget-fixture";

type CcdCase = CcdRates & { kind: "snr" | "exposure"; exposureS: number; signalToNoise: number };

// Written by tests/fixtures/generate_photometry.py (mpmath, 40 digits): Howell 2006 eq. 4.4 evaluated
// directly, and the exposure for each goal found by a bracketing root search on the S/N itself.
const fixture = loadBudgetFixture<{ cases: CcdCase[] }>("ccd.json");

const faintSkyLimited: CcdRates = {
  sourceElectronsPerS: 20,
  skyElectronsPerSPerPixel: 80,
  darkElectronsPerSPerPixel: 0.002,
  readNoiseElectrons: 4,
  pixelCount: 50,
};

describe("ccdSignalToNoise (Howell 2006 eq. 4.4)", () => {
  it("agrees with the mpmath evaluation of eq. 4.4 to 1e-14", () => {
    const cases = fixture.cases.filter((c) => c.kind === "snr");
    expect(cases.length).toBe(25);
    let largest = 0;
    for (const { kind: _kind, signalToNoise, ...input } of cases) {
      largest = Math.max(largest, relativeError(ccdSignalToNoise(input), signalToNoise));
    }
    expect(largest).toBeLessThan(1e-14);
  });

  it("matches a worked example by hand", () => {
    // Our hand calculation with eq. 4.4 (not Howell's printed example): N* = 30 e/s × 30 s = 900 e,
    // 16 pixels of sky 0.625 e/s (18.75 e) and read noise 5 e: noise² = 900 + 16 (18.75 + 25) = 1600,
    // S/N = 900 / 40 = 22.5.
    const snr = ccdSignalToNoise({
      sourceElectronsPerS: 30,
      skyElectronsPerSPerPixel: 0.625,
      darkElectronsPerSPerPixel: 0,
      readNoiseElectrons: 5,
      pixelCount: 16,
      exposureS: 30,
    });
    expect(snr).toBeCloseTo(22.5, 12);
  });

  it("has Howell's limits: √N* for a bright source, N*/√(n N_S) deep in the sky", () => {
    // Howell 2006 §4.4: a bright source gives S/N ≈ √N* (Poisson); a faint one in a bright sky
    // S/N ≈ N* / √(n_pix N_S).
    const bright = ccdSignalToNoise({ ...faintSkyLimited, sourceElectronsPerS: 1e11, exposureS: 10 });
    expect(relativeError(bright, Math.sqrt(1e12))).toBeLessThan(1e-6);
    const faint = ccdSignalToNoise({ ...faintSkyLimited, sourceElectronsPerS: 1e-3, readNoiseElectrons: 0, darkElectronsPerSPerPixel: 0, exposureS: 1e4 });
    expect(relativeError(faint, 10 / Math.sqrt(50 * 80 * 1e4))).toBeLessThan(1e-6);
    expect(ccdSignalToNoise({ ...faintSkyLimited, sourceElectronsPerS: 0, exposureS: 60 })).toBe(0);
  });

  it("refuses inputs outside their domain in words naming the field", () => {
    expect(() => ccdSignalToNoise({ ...faintSkyLimited, exposureS: 0 })).toThrow("Exposure time (seconds) must be greater than 0, got 0");
    expect(() => ccdSignalToNoise({ ...faintSkyLimited, pixelCount: 0, exposureS: 10 })).toThrow(
      "Pixels in the aperture must be greater than 0, got 0",
    );
    expect(() => ccdSignalToNoise({ ...faintSkyLimited, readNoiseElectrons: -1, exposureS: 10 })).toThrow(
      "Read noise (electrons) must be at least 0, got -1",
    );
    expect(() => ccdSignalToNoise({ ...faintSkyLimited, skyElectronsPerSPerPixel: Number.POSITIVE_INFINITY, exposureS: 10 })).toThrow(
      "Sky count rate (electrons per second per pixel) must be a finite number, got Infinity",
    );
  });
});

describe("exposureForSignalToNoise (closed-form root of eq. 4.4)", () => {
  it("agrees with the independent mpmath root search to 1e-13", () => {
    const cases = fixture.cases.filter((c) => c.kind === "exposure");
    expect(cases.length).toBe(20);
    let largest = 0;
    for (const { kind: _kind, exposureS, ...input } of cases) {
      largest = Math.max(largest, relativeError(exposureForSignalToNoise(input), exposureS));
    }
    expect(largest).toBeLessThan(1e-13);
  });

  it("gives back the goal through the forward S/N (property, fixed seed)", () => {
    const rate = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });
    fc.assert(
      fc.property(
        rate(1e-3, 1e7),
        rate(0, 1e4),
        rate(0, 10),
        rate(0, 50),
        rate(0.5, 5000),
        rate(0.1, 1e4),
        (source, sky, dark, read, pixels, goal) => {
          const rates = { sourceElectronsPerS: source, skyElectronsPerSPerPixel: sky, darkElectronsPerSPerPixel: dark, readNoiseElectrons: read, pixelCount: pixels };
          const exposureS = exposureForSignalToNoise({ ...rates, signalToNoise: goal });
          expect(exposureS).toBeGreaterThan(0);
          expect(relativeError(ccdSignalToNoise({ ...rates, exposureS }), goal)).toBeLessThan(1e-12);
        },
      ),
      { numRuns: 2000 },
    );
  });

  it("reaches any goal once sky-limited, at the time the √t law gives", () => {
    // Sky-limited, S/N = S √t / √(S + n (B + D)) (no read noise): t = g² (S + n (B + D)) / S².
    const rates = { ...faintSkyLimited, readNoiseElectrons: 0 };
    const t = exposureForSignalToNoise({ ...rates, signalToNoise: 1000 });
    expect(relativeError(t, (1000 ** 2 * (20 + 50 * 80.002)) / 400)).toBeLessThan(1e-14);
  });

  it("says in words that a source giving no electrons reaches no goal", () => {
    expect(() => exposureForSignalToNoise({ ...faintSkyLimited, sourceElectronsPerS: 0, signalToNoise: 10 })).toThrow(
      "Source count rate is 0 electrons per second: no exposure reaches a signal-to-noise of 10.",
    );
    expect(() => exposureForSignalToNoise({ ...faintSkyLimited, signalToNoise: -3 })).toThrow(
      "Signal-to-noise goal must be greater than 0, got -3",
    );
  });
});

describe("saturationCheck", () => {
  const bright = {
    sourceElectronsPerS: 2e5,
    peakPixelFraction: 0.1,
    skyElectronsPerSPerPixel: 100,
    darkElectronsPerSPerPixel: 0,
    fullWellElectrons: 1e5,
  };

  it("warns when the brightest pixel reaches the full well", () => {
    // Peak pixel rate 2e5 × 0.1 + 100 = 20,100 e/s: full at 1e5 / 20,100 = 4.975 s.
    const short = saturationCheck({ ...bright, exposureS: 4 });
    expect(short.peakPixelElectrons).toBe(80_400);
    expect(short.isSaturated).toBe(false);
    expect(short.longestUnsaturatedExposureS).toBeCloseTo(1e5 / 20_100, 12);
    const long = saturationCheck({ ...bright, exposureS: 5 });
    expect(long.isSaturated).toBe(true);
    expect(long.fullWellFraction).toBeCloseTo(1.005, 12);
  });

  it("refuses a share of the light above one in words", () => {
    expect(() => saturationCheck({ ...bright, peakPixelFraction: 1.5, exposureS: 1 })).toThrow(
      "Share of the source's light in the brightest pixel must be at most 1, got 1.5",
    );
    expect(() => saturationCheck({ ...bright, fullWellElectrons: 0, exposureS: 1 })).toThrow(
      "Full well (electrons) must be greater than 0, got 0",
    );
  });
});
