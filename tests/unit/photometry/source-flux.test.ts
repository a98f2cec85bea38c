import { describe, expect, it } from "vitest";
import { standardBand, validateCustomBand } from "@/lib/photometry/bands";
import {
  baselineMagnitude,
  blendedFluxInBaselineUnits,
  collectingAreaM2,
  magnifiedBlendMagnitude,
  magnitudeInBandSystem,
  magnitudeThroughAtmosphere,
  skyElectronsPerSPerPixel,
  sourceElectronsPerS,
} from "@/lib/photometry/source-flux";
import { relativeError } from "./fixtures";

const vBand = standardBand("jc-v")!;
const gBand = standardBand("sdss-g")!;
/** A 1 m telescope with a 0.3 m central obstruction and 50% total throughput. */
const optics = { apertureM: 1, centralObstructionM: 0.3, throughput: 0.5 };

describe("collecting area", () => {
  it("is π/4 (D² − d²): 1 m with 0.3 m obstruction = 0.785398 × 0.91 = 0.714712 m² (by hand)", () => {
    expect(collectingAreaM2(optics)).toBeCloseTo(0.714712, 6);
  });

  it("refuses a zero aperture and an obstruction as large as the aperture, naming the field", () => {
    expect(() => collectingAreaM2({ apertureM: 0, centralObstructionM: 0 })).toThrow(/^Telescope aperture \(m\) must be/);
    expect(() => collectingAreaM2({ apertureM: 1, centralObstructionM: 1 })).toThrow(/^Central obstruction \(m\) must be smaller than the telescope aperture/);
  });
});

describe("a V = 20 star on a 1 m telescope (worked by hand)", () => {
  // Photon zero point of V (Bessell 2005, Table 1): f_λ = 363.1e-11 erg s⁻¹ cm⁻² Å⁻¹ = 3.631e-11 W m⁻² nm⁻¹;
  //   one photon at 545 nm carries hc/λ = 1.98645e-25 J m / 545e-9 m = 3.64485e-19 J,
  //   so N₀ = 3.631e-11 / 3.64485e-19 = 9.9620e7 photons s⁻¹ m⁻² nm⁻¹.
  // Through the 84 nm width: 8.3681e9 photons s⁻¹ m⁻² at V = 0; at V = 20, × 1e-8 = 83.681.
  // × 0.714712 m² × 0.5 throughput = 29.904 e⁻/s.
  it("gives 29.90 e⁻/s", () => {
    const rate = sourceElectronsPerS({ band: vBand, magnitude: 20, optics });
    expect(relativeError(rate, 29.904)).toBeLessThan(1e-4);
  });

  it("scales as 10^(−0.4 Δm): five magnitudes fainter is 100 times fewer", () => {
    const bright = sourceElectronsPerS({ band: vBand, magnitude: 15, optics });
    const faint = sourceElectronsPerS({ band: vBand, magnitude: 20, optics });
    expect(bright / faint).toBeCloseTo(100, 10);
  });

  it("V = 20 AB is V = 19.98 Vega (AB − Vega = 0.02, Blanton & Roweis 2007): 10^(0.008) = 1.01859 times more", () => {
    const ab = sourceElectronsPerS({ band: vBand, magnitude: 20, magnitudeSystem: "ab", optics });
    const vega = sourceElectronsPerS({ band: vBand, magnitude: 20, magnitudeSystem: "vega", optics });
    expect(ab / vega).toBeCloseTo(1.018591, 6);
  });

  it("sky of 21.9 mag/arcsec² (V, typical dark site) on 0.5″ pixels: 1.2992 e⁻/s per pixel", () => {
    // 10^(−0.4 × 21.9) = 1.73780e-9; × 8.3681e9 = 14.542 photons s⁻¹ m⁻² arcsec⁻²;
    // × 0.714712 × 0.5 = 5.1968 e⁻/s per arcsec²; × 0.25 arcsec² = 1.2992 e⁻/s per pixel.
    const sky = skyElectronsPerSPerPixel({ band: vBand, skyMagPerArcsec2: 21.9, pixelScaleArcsec: 0.5, optics });
    expect(relativeError(sky, 1.2992)).toBeLessThan(1e-4);
  });

  it("refuses a throughput above 1 and a zero pixel scale, naming the field", () => {
    expect(() => sourceElectronsPerS({ band: vBand, magnitude: 20, optics: { ...optics, throughput: 1.5 } })).toThrow(/^Total throughput must be/);
    expect(() => skyElectronsPerSPerPixel({ band: vBand, skyMagPerArcsec2: 21, pixelScaleArcsec: 0, optics })).toThrow(/^Pixel scale/);
    expect(() => sourceElectronsPerS({ band: vBand, magnitude: Number.NaN, optics })).toThrow(/^Magnitude must be/);
  });
});

describe("magnitude systems", () => {
  it("turns a Vega g into AB with g's offset (AB − Vega = −0.08): g_Vega 20 = g_AB 19.92", () => {
    expect(magnitudeInBandSystem(gBand, 20, "vega")).toBeCloseTo(19.92, 12);
    expect(magnitudeInBandSystem(gBand, 20, "ab")).toBe(20);
  });

  it("asks for the band's own system when a custom band has no offset", () => {
    const result = validateCustomBand({
      label: "Narrow",
      effectiveWavelengthNm: 500,
      widthNm: 10,
      zeroPointWPerM2PerNm: 4e-11,
      zeroPointSystem: "vega",
      abMinusVegaMag: null,
    });
    if (!("band" in result)) throw new Error("expected a band");
    expect(() => magnitudeInBandSystem(result.band, 18, "ab")).toThrow("Magnitude system: the band Narrow has no AB − Vega offset, so give the magnitude in Vega.");
  });
});

describe("extinction", () => {
  it("adds k X: V = 20, k = 0.15 mag/air mass, X = 1.5 → 20.225", () => {
    expect(magnitudeThroughAtmosphere(20, 0.15, 1.5)).toBeCloseTo(20.225, 12);
  });

  it("refuses an air mass below 1", () => {
    expect(() => magnitudeThroughAtmosphere(20, 0.15, 0.5)).toThrow(/^Air mass must be a number of at least 1/);
  });
});

describe("blended lensed source", () => {
  it("A f_s + (1 − f_s): A = 10, f_s = 0.3 → 3.7 baseline fluxes", () => {
    expect(blendedFluxInBaselineUnits(10, 0.3)).toBeCloseTo(3.7, 14);
  });

  it("unblended (f_s = 1) gives A; unmagnified (A = 1) gives the baseline for any f_s", () => {
    expect(blendedFluxInBaselineUnits(7.5, 1)).toBe(7.5);
    expect(blendedFluxInBaselineUnits(1, 0.2)).toBeCloseTo(1, 15);
  });

  it("magnitudes: a source of 19.3 with f_s = 0.3 has a baseline of 17.9928 and 16.5723 at A = 10 (by hand)", () => {
    // baseline: 19.3 + 2.5 log₁₀ 0.3 = 19.3 − 2.5 × 0.5228787 = 19.3 − 1.3071968 = 17.9928032
    // at A = 10: 17.9928032 − 2.5 log₁₀ 3.7 = 17.9928032 − 2.5 × 0.5682017 = 17.9928032 − 1.4205043 = 16.5722989
    const base = baselineMagnitude(19.3, 0.3);
    expect(base).toBeCloseTo(17.9928032, 6);
    expect(magnifiedBlendMagnitude(base, 10, 0.3)).toBeCloseTo(16.5722989, 6);
  });

  it("the magnified blend's magnitude equals the sum of the magnified source and the blend's own light", () => {
    // source 19.3 magnified 10× is 19.3 − 2.5 = 16.8; the blend is 7/3 of the source's flux
    const sourceFlux = 10 ** (-0.4 * 16.8);
    const blendFlux = (0.7 / 0.3) * 10 ** (-0.4 * 19.3);
    const total = -2.5 * Math.log10(sourceFlux + blendFlux);
    expect(magnifiedBlendMagnitude(baselineMagnitude(19.3, 0.3), 10, 0.3)).toBeCloseTo(total, 12);
  });

  it("refuses a blend fraction of 0 or above 1, and a magnification of 0, in words", () => {
    expect(() => blendedFluxInBaselineUnits(2, 0)).toThrow(/^Blend fraction f_s \(share of the baseline flux from the lensed source\) must be a share above 0 and at most 1/);
    expect(() => blendedFluxInBaselineUnits(2, 1.2)).toThrow(/Blend fraction/);
    expect(() => blendedFluxInBaselineUnits(0, 0.5)).toThrow(/^Magnification must be/);
  });
});
