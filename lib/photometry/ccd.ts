/**
 * Signal-to-noise of a point source measured in a photometric aperture of a CCD, the exposure that
 * reaches a chosen S/N, and the full-well check. Method: the "CCD equation" of W. J. Merline &
 * S. B. Howell 1995, Exp. Astron. 6, 163, as written by S. B. Howell, Handbook of CCD Astronomy,
 * 2nd ed. 2006, eq. 4.4 (rates times the exposure t):
 *   S/N = S t / sqrt(S t + n (B t + D t + R²))
 * S source electrons per second inside the aperture, B sky and D dark electrons per second per
 * pixel, R read noise (electrons rms per pixel), n pixels in the aperture. Left out, as in eq. 4.4:
 * the digitisation noise G²σ_f² (a gain's rounding, ~0.3 ADU; Howell's fuller form) and the error of
 * the sky estimate (the factor 1 + n/n_B), both small for a well-sampled sky annulus.
 *
 * Without a noise term that grows in proportion to t (flat-field error, scintillation; none is in
 * eq. 4.4) the S/N grows without bound, as √t once sky-limited:
 *   S/N → S √t / sqrt(S + n (B + D)),
 * so every S/N goal is reached by some exposure, however faint the source against the sky. The only
 * goal that no exposure reaches is one asked of a source that gives no electrons (S = 0); that is
 * refused in words.
 */
import { domainError, requireFinite } from "@/lib/physics/domain";

export interface CcdRates {
  /** Electrons per second from the source inside the aperture (≥ 0). */
  sourceElectronsPerS: number;
  /** Sky electrons per second per pixel (≥ 0). */
  skyElectronsPerSPerPixel: number;
  /** Dark-current electrons per second per pixel (≥ 0). */
  darkElectronsPerSPerPixel: number;
  /** Read noise, electrons rms per pixel (≥ 0). */
  readNoiseElectrons: number;
  /** Pixels in the photometric aperture (> 0; may be fractional, e.g. πr² in pixels). */
  pixelCount: number;
}

function requireAtLeastZero(label: string, value: number): void {
  requireFinite(label, value);
  if (value < 0) throw domainError(label, value, "at least 0");
}

function requireAboveZero(label: string, value: number): void {
  requireFinite(label, value);
  if (!(value > 0)) throw domainError(label, value, "greater than 0");
}

function checkRates(rates: CcdRates): void {
  requireAtLeastZero("Source count rate (electrons per second)", rates.sourceElectronsPerS);
  requireAtLeastZero("Sky count rate (electrons per second per pixel)", rates.skyElectronsPerSPerPixel);
  requireAtLeastZero("Dark current (electrons per second per pixel)", rates.darkElectronsPerSPerPixel);
  requireAtLeastZero("Read noise (electrons)", rates.readNoiseElectrons);
  requireAboveZero("Pixels in the aperture", rates.pixelCount);
}

/**
 * Signal-to-noise ratio (dimensionless, ≥ 0) of an exposure of `exposureS` seconds (> 0), Howell
 * 2006 eq. 4.4 (see the module comment). 0 for a source giving no electrons. Throws a RangeError
 * naming the field in words for an input outside its domain (`CcdRates`).
 */
export function ccdSignalToNoise(input: CcdRates & { exposureS: number }): number {
  checkRates(input);
  requireAboveZero("Exposure time (seconds)", input.exposureS);
  const { sourceElectronsPerS: s, skyElectronsPerSPerPixel: b, darkElectronsPerSPerPixel: d } = input;
  return signalToNoiseFromRates(s, b, d, input.readNoiseElectrons, input.pixelCount, input.exposureS);
}

/**
 * Eq. 4.4 as `ccdSignalToNoise`, with positional arguments in the same units (source, sky and dark
 * e⁻/s, read noise e⁻, pixels, seconds) and no checks: for loops whose inputs were checked once.
 */
export function signalToNoiseFromRates(s: number, b: number, d: number, r: number, n: number, t: number): number {
  if (s === 0) return 0;
  const signal = s * t;
  return signal / Math.sqrt(signal + n * ((b + d) * t + r * r));
}

/**
 * Exposure time (seconds, > 0) at which `ccdSignalToNoise` equals `signalToNoise` (> 0). Method:
 * squaring eq. 4.4 gives S² t² − g² (S + n(B + D)) t − g² n R² = 0 (g the goal); its positive root is
 *   t = [a + sqrt(a² + 4 S² g² n R²)] / (2 S²),  a = g² (S + n (B + D)),
 * taken with the + sign (no cancellation) and the square root as a hypot (no overflow). Exact to a
 * few ulp; tests check the forward S/N at the root to 1e-12. Throws, naming the field in words, for a
 * source that gives no electrons (no exposure reaches any goal) or an input outside its domain.
 */
export function exposureForSignalToNoise(input: CcdRates & { signalToNoise: number }): number {
  checkRates(input);
  requireAboveZero("Signal-to-noise goal", input.signalToNoise);
  const { sourceElectronsPerS: s, skyElectronsPerSPerPixel: b, darkElectronsPerSPerPixel: d } = input;
  const { readNoiseElectrons: r, pixelCount: n, signalToNoise: g } = input;
  if (s === 0) {
    throw new RangeError(
      `Source count rate is 0 electrons per second: no exposure reaches a signal-to-noise of ${g}.`,
    );
  }
  return exposureFromRates(s, b, d, r, n, g);
}

/**
 * The closed-form root of `exposureForSignalToNoise` with positional arguments in the same units and
 * no checks; +Infinity for a source giving no electrons (no exposure reaches the goal).
 */
export function exposureFromRates(s: number, b: number, d: number, r: number, n: number, g: number): number {
  if (s === 0) return Number.POSITIVE_INFINITY;
  const a = g * g * (s + n * (b + d));
  return (a + Math.hypot(a, 2 * s * g * Math.sqrt(n) * r)) / (2 * s * s);
}

export interface SaturationCheck {
  /** Electrons collected by the brightest pixel in the exposure (source share + sky + dark). */
  peakPixelElectrons: number;
  /** `peakPixelElectrons` over the full well (≥ 1 is saturated). */
  fullWellFraction: number;
  isSaturated: boolean;
  /** Longest exposure (seconds) that keeps the brightest pixel below the full well. */
  longestUnsaturatedExposureS: number;
}

/**
 * Full-well check of the brightest pixel after `exposureS` seconds (> 0): it collects the share
 * `peakPixelFraction` ((0, 1], from the PSF model) of the source's electrons plus one pixel's sky and
 * dark; the exposure saturates when that reaches `fullWellElectrons` (> 0). Bias level and
 * non-linearity below the full well are left out (common practice for a planning warning).
 */
export function saturationCheck(input: {
  sourceElectronsPerS: number;
  peakPixelFraction: number;
  skyElectronsPerSPerPixel: number;
  darkElectronsPerSPerPixel: number;
  fullWellElectrons: number;
  exposureS: number;
}): SaturationCheck {
  requireAtLeastZero("Source count rate (electrons per second)", input.sourceElectronsPerS);
  requireAboveZero("Share of the source's light in the brightest pixel", input.peakPixelFraction);
  if (input.peakPixelFraction > 1) {
    throw domainError("Share of the source's light in the brightest pixel", input.peakPixelFraction, "at most 1");
  }
  requireAtLeastZero("Sky count rate (electrons per second per pixel)", input.skyElectronsPerSPerPixel);
  requireAtLeastZero("Dark current (electrons per second per pixel)", input.darkElectronsPerSPerPixel);
  requireAboveZero("Full well (electrons)", input.fullWellElectrons);
  requireAboveZero("Exposure time (seconds)", input.exposureS);
  const peakRate = peakPixelElectronsPerS(input.sourceElectronsPerS, input.peakPixelFraction, input.skyElectronsPerSPerPixel, input.darkElectronsPerSPerPixel);
  const peakPixelElectrons = peakRate * input.exposureS;
  const fullWellFraction = peakPixelElectrons / input.fullWellElectrons;
  return {
    peakPixelElectrons,
    fullWellFraction,
    isSaturated: fullWellFraction >= 1,
    longestUnsaturatedExposureS: peakRate === 0 ? Number.POSITIVE_INFINITY : input.fullWellElectrons / peakRate,
  };
}

/**
 * Electrons per second in the brightest pixel: the share `peakPixelFraction` of the source's rate plus
 * one pixel's sky and dark (all e⁻/s); no checks (see `saturationCheck`).
 */
export function peakPixelElectronsPerS(sourceElectronsPerS: number, peakPixelFraction: number, skyElectronsPerSPerPixel: number, darkElectronsPerSPerPixel: number): number {
  return sourceElectronsPerS * peakPixelFraction + skyElectronsPerSPerPixel + darkElectronsPerSPerPixel;
}
