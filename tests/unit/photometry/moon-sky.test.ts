import { describe, expect, it } from "vitest";
import {
  darkSkyNanolamberts,
  krisciunasSchaeferAirmass,
  moonIlluminance,
  moonScattering,
  moonSkyBrightnessNanolamberts,
  nanolambertsFromVMagPerArcsec2,
  skyWithMoonVMagPerArcsec2,
  vMagPerArcsec2FromNanolamberts,
  type MoonSkyInput,
} from "@/lib/photometry";
import { relativeError } from "../physics/fixtures";
import { loadBudgetFixture } from "./budget-fixture";

interface MoonSkyFixture {
  moonSky: (MoonSkyInput & { nanolamberts: number })[];
  conversions: { vMagPerArcsec2: number; nanolamberts: number }[];
  darkSky: { zenithNanolamberts: number; targetZenithDeg: number; extinctionV: number; nanolamberts: number }[];
  inverseCheck: { nanolamberts: number; vMagPerArcsec2: number }[];
}

// Written by tests/fixtures/generate_photometry.py (mpmath, 40 digits) from the formulas of
// Krisciunas & Schaefer 1991, PASP 103, 1033, quoted there.
const fixture = loadBudgetFixture<MoonSkyFixture>("moon-sky.json");

const quarterMoonHigh: MoonSkyInput = {
  moonPhaseAngleDeg: 90,
  moonZenithDeg: 40,
  targetZenithDeg: 30,
  moonTargetSeparationDeg: 60,
  extinctionV: 0.172,
};

describe("moonSkyBrightnessNanolamberts (Krisciunas & Schaefer 1991)", () => {
  it("agrees with the independent mpmath implementation of eqs. 3, 8, 15, 21 to 1e-13", () => {
    let largest = 0;
    for (const { nanolamberts, ...input } of fixture.moonSky) {
      const error = relativeError(moonSkyBrightnessNanolamberts(input), nanolamberts);
      largest = Math.max(largest, error);
    }
    expect(fixture.moonSky.length).toBe(240);
    expect(largest).toBeLessThan(1e-13);
  });

  it("has the published terms at hand-checked points", () => {
    // Hand arithmetic from K&S eqs. 3, 8 and 21 as quoted in the module: X(0) = 1, X(90°) = 1/√0.04 = 5;
    // I*(α = 90°) = 10^(−0.4 (3.84 + 2.34 + 0.26244)); I*(0) = 1.35 × 10^(−1.536) (opposition surge);
    // f(90°) = 10^5.36 × 1.06 + 10^3.9.
    expect(krisciunasSchaeferAirmass(0)).toBe(1);
    expect(krisciunasSchaeferAirmass(90)).toBeCloseTo(5, 12);
    expect(relativeError(moonIlluminance(90), 10 ** (-0.4 * 6.44244))).toBeLessThan(1e-14);
    expect(relativeError(moonIlluminance(0), 1.35 * 10 ** -1.536)).toBeLessThan(1e-14);
    expect(relativeError(moonScattering(90), 229086.765276777 * 1.06 + 7943.28234724282)).toBeLessThan(1e-13);
  });

  it("is continuous where the opposition surge ends (|α| = 7°) and symmetric in the sign of α", () => {
    // Our reading of K&S's "up to 35% brighter within 7° of full" tapers to ×1 at 7° (module comment).
    expect(relativeError(moonIlluminance(7 - 1e-9), moonIlluminance(7))).toBeLessThan(1e-9);
    expect(moonIlluminance(-40)).toBe(moonIlluminance(40));
  });

  it("grows towards full Moon (K&S: brightness rises steeply as α → 0)", () => {
    let previous = Number.POSITIVE_INFINITY;
    for (let alpha = 0; alpha <= 180; alpha += 5) {
      const b = moonSkyBrightnessNanolamberts({ ...quarterMoonHigh, moonPhaseAngleDeg: alpha });
      expect(b).toBeLessThan(previous);
      previous = b;
    }
    // Full Moon sky is much more than ten times a quarter Moon's (K&S Fig. of B vs α, qualitatively).
    const full = moonSkyBrightnessNanolamberts({ ...quarterMoonHigh, moonPhaseAngleDeg: 0 });
    expect(full / moonSkyBrightnessNanolamberts(quarterMoonHigh)).toBeGreaterThan(10);
  });

  it("is darkest a little beyond 90° from the Moon (Rayleigh minimum at 90°, Mie still falling)", () => {
    // K&S eq. 21: the Rayleigh term is least at ρ = 90°, the Mie term falls monotonically, so the sum
    // has its minimum just past 90°.
    let bestRho = 0;
    let best = Number.POSITIVE_INFINITY;
    for (let rho = 0; rho <= 180; rho += 0.5) {
      const b = moonSkyBrightnessNanolamberts({ ...quarterMoonHigh, moonTargetSeparationDeg: rho });
      if (b < best) [best, bestRho] = [b, rho];
    }
    expect(bestRho).toBeGreaterThanOrEqual(90);
    expect(bestRho).toBeLessThanOrEqual(110);
    // Near the Moon the sky is brighter than at the minimum by the forward-scattering (Mie) peak.
    expect(moonSkyBrightnessNanolamberts({ ...quarterMoonHigh, moonTargetSeparationDeg: 10 }) / best).toBeGreaterThan(3);
  });

  it("is 0 with the Moon below the horizon and grows as the Moon rises from it", () => {
    expect(moonSkyBrightnessNanolamberts({ ...quarterMoonHigh, moonZenithDeg: 90.01 })).toBe(0);
    expect(moonSkyBrightnessNanolamberts({ ...quarterMoonHigh, moonZenithDeg: 180 })).toBe(0);
    const low = moonSkyBrightnessNanolamberts({ ...quarterMoonHigh, moonZenithDeg: 85 });
    const high = moonSkyBrightnessNanolamberts({ ...quarterMoonHigh, moonZenithDeg: 20 });
    expect(low).toBeGreaterThan(0);
    expect(high).toBeGreaterThan(low);
    // No atmosphere, no scattered moonlight (k = 0 in eq. 15).
    expect(moonSkyBrightnessNanolamberts({ ...quarterMoonHigh, extinctionV: 0 })).toBe(0);
  });

  it("refuses inputs outside their domain in words naming the field", () => {
    expect(() => moonSkyBrightnessNanolamberts({ ...quarterMoonHigh, moonPhaseAngleDeg: 200 })).toThrow(
      "Moon phase angle must be between -180° and 180°, got 200",
    );
    expect(() => moonSkyBrightnessNanolamberts({ ...quarterMoonHigh, targetZenithDeg: 95 })).toThrow(
      "Target zenith distance must be between 0° and 90°, got 95",
    );
    expect(() => moonSkyBrightnessNanolamberts({ ...quarterMoonHigh, moonTargetSeparationDeg: Number.NaN })).toThrow(
      "Moon–target separation must be a finite number, got NaN",
    );
    expect(() => moonSkyBrightnessNanolamberts({ ...quarterMoonHigh, moonZenithDeg: -1 })).toThrow(
      "Moon zenith distance must be between 0° and 180°, got -1",
    );
    expect(() => moonSkyBrightnessNanolamberts({ ...quarterMoonHigh, extinctionV: -0.1 })).toThrow(
      "V-band extinction must be at least 0 magnitudes per air mass, got -0.1",
    );
  });
});

describe("nanolamberts and V mag/arcsec² (K&S eq. 1)", () => {
  it("agree with the mpmath evaluation of eq. 1 both ways", () => {
    for (const { vMagPerArcsec2, nanolamberts } of fixture.conversions) {
      expect(relativeError(nanolambertsFromVMagPerArcsec2(vMagPerArcsec2), nanolamberts)).toBeLessThan(1e-13);
    }
    for (const { nanolamberts, vMagPerArcsec2 } of fixture.inverseCheck) {
      expect(relativeError(vMagPerArcsec2FromNanolamberts(nanolamberts), vMagPerArcsec2)).toBeLessThan(1e-14);
    }
  });

  it("map the paper's Mauna Kea dark zenith sky, 79.0 nL, to V = 21.587 mag/arcsec²", () => {
    // From memory of K&S 1991 (their dark-sky zenith value in both units); eq. 1 reproduces it to 1e-4 mag.
    expect(Math.abs(vMagPerArcsec2FromNanolamberts(79.0) - 21.587)).toBeLessThan(1e-4);
    expect(vMagPerArcsec2FromNanolamberts(0)).toBe(Number.POSITIVE_INFINITY);
  });

  it("add moonlight to a dark sky in flux, not in magnitudes", () => {
    // Equal dark and moon light: twice the flux, 2.5 log10 2 = 0.7526 mag brighter (to eq. 1's rounding of 0.4 ln 10).
    const dark = 21.5;
    const sky = skyWithMoonVMagPerArcsec2({ darkSkyVMagPerArcsec2: dark, moonNanolamberts: nanolambertsFromVMagPerArcsec2(dark) });
    expect(dark - sky).toBeCloseTo(2.5 * Math.log10(2), 4);
    expect(skyWithMoonVMagPerArcsec2({ darkSkyVMagPerArcsec2: dark, moonNanolamberts: 0 })).toBeCloseTo(dark, 12);
    expect(() => skyWithMoonVMagPerArcsec2({ darkSkyVMagPerArcsec2: dark, moonNanolamberts: -5 })).toThrow(
      "Moonlight (nanolamberts) must be at least 0, got -5",
    );
  });

  it("brighten the dark sky away from the zenith as K&S eq. 2 gives", () => {
    for (const { nanolamberts, ...input } of fixture.darkSky) {
      expect(relativeError(darkSkyNanolamberts(input), nanolamberts)).toBeLessThan(1e-13);
    }
    expect(darkSkyNanolamberts({ zenithNanolamberts: 79, targetZenithDeg: 0, extinctionV: 0.172 })).toBe(79);
  });
});
