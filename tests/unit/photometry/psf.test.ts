import { describe, expect, it } from "vitest";
import {
  aperturePixelCount,
  encircledEnergyFraction,
  gaussianSigmaFromFwhm,
  KOLMOGOROV_MOFFAT_BETA,
  moffatAlphaFromFwhm,
  peakPixelFluxFraction,
  seeingFwhmAtAirmassArcsec,
  type PsfShape,
} from "@/lib/photometry/psf";
import { loadPhotometryFixture, relativeError } from "./fixtures";

interface PsfFixture {
  psf: {
    shape: PsfShape;
    encircled: { radiusOverFwhm: number; fraction: number }[];
    peakPixel: { pixelOverFwhm: number; fraction: number; erfSquared?: number }[];
  }[];
}

const fixture = loadPhotometryFixture<PsfFixture>();
const gaussian: PsfShape = { kind: "gaussian" };
const kolmogorovMoffat: PsfShape = { kind: "moffat", beta: KOLMOGOROV_MOFFAT_BETA };

describe("seeing at an air mass", () => {
  it("grows as X^0.6 (Roddier 1981, Progress in Optics 19, 281)", () => {
    // 1.0″ at zenith, X = 2: 2^0.6 = 1.515717 (by hand: exp(0.6 ln 2) = exp(0.415888))
    expect(seeingFwhmAtAirmassArcsec(1, 2)).toBeCloseTo(1.515717, 6);
    expect(seeingFwhmAtAirmassArcsec(0.8, 1)).toBe(0.8);
  });

  it("refuses an air mass below 1 and a zero FWHM, naming the field", () => {
    expect(() => seeingFwhmAtAirmassArcsec(1, 0.9)).toThrow(/Air mass/);
    expect(() => seeingFwhmAtAirmassArcsec(0, 1.2)).toThrow(/Seeing FWHM at zenith/);
  });
});

describe("PSF widths from the FWHM", () => {
  it("Gaussian σ = FWHM / 2.35482 (2√(2 ln 2) = 2.354820, by hand)", () => {
    expect(gaussianSigmaFromFwhm(2.354820045)).toBeCloseTo(1, 9);
  });

  it("Moffat α puts half the peak at FWHM/2", () => {
    const alpha = moffatAlphaFromFwhm(1, KOLMOGOROV_MOFFAT_BETA);
    expect((1 + 0.25 / (alpha * alpha)) ** -KOLMOGOROV_MOFFAT_BETA).toBeCloseTo(0.5, 14);
  });
});

describe("encircled energy against numerical integration (tests/fixtures/generate_psf.py, mpmath quad)", () => {
  it("matches the closed forms for the Gaussian and Moffat β = 4.765 and 2.5 to 1e-13 (largest seen 4.4e-16)", () => {
    let largest = 0;
    for (const { shape, encircled } of fixture.psf) {
      for (const row of encircled) {
        largest = Math.max(largest, relativeError(encircledEnergyFraction(shape, row.radiusOverFwhm, 1), row.fraction));
      }
    }
    expect(largest).toBeLessThan(1e-13);
  });

  it("is scale-free: r = 0.5 FWHM holds half a Gaussian's flux for any FWHM (1 − exp(−ln 2))", () => {
    expect(encircledEnergyFraction(gaussian, 1.5, 3)).toBeCloseTo(0.5, 15);
  });

  it("holds less inside one FWHM for the Moffat than the Gaussian (its wings)", () => {
    expect(encircledEnergyFraction(kolmogorovMoffat, 1, 1)).toBeLessThan(encircledEnergyFraction(gaussian, 1, 1));
  });

  it("is 0 at radius 0 and refuses a negative radius or β ≤ 1 in words", () => {
    expect(encircledEnergyFraction(gaussian, 0, 1)).toBe(0);
    expect(() => encircledEnergyFraction(gaussian, -1, 1)).toThrow(/Aperture radius/);
    expect(() => encircledEnergyFraction({ kind: "moffat", beta: 1 }, 1, 1)).toThrow(/Moffat β/);
    expect(() => encircledEnergyFraction(gaussian, 1, Number.NaN)).toThrow(/Seeing FWHM/);
  });
});

describe("peak pixel share", () => {
  it("matches scipy's dblquad over the pixel and the Gaussian's erf² to 1e-9 (largest seen 2.4e-10)", () => {
    let largest = 0;
    for (const { shape, peakPixel } of fixture.psf) {
      for (const row of peakPixel) {
        const actual = peakPixelFluxFraction(shape, 1, row.pixelOverFwhm);
        largest = Math.max(largest, relativeError(actual, row.fraction));
        if (row.erfSquared !== undefined) expect(relativeError(actual, row.erfSquared)).toBeLessThan(1e-9);
      }
    }
    expect(largest).toBeLessThan(1e-9);
  });

  it("lies between the inscribed and the circumscribed circle's encircled energy", () => {
    const share = peakPixelFluxFraction(kolmogorovMoffat, 1.2, 0.4);
    expect(share).toBeGreaterThan(encircledEnergyFraction(kolmogorovMoffat, 0.2, 1.2));
    expect(share).toBeLessThan(encircledEnergyFraction(kolmogorovMoffat, 0.2 * Math.SQRT2, 1.2));
  });
});

describe("aperture pixel count", () => {
  it("is π r² / p²: r = 1.5″ on 0.3″ pixels is 25π = 78.54 pixels (by hand)", () => {
    expect(aperturePixelCount(1.5, 0.3)).toBeCloseTo(25 * Math.PI, 10);
  });

  it("refuses a zero pixel scale, naming the field", () => {
    expect(() => aperturePixelCount(1.5, 0)).toThrow(/Pixel scale/);
  });
});
