/**
 * The point-spread function of a seeing-limited telescope: its width at an air mass, the share of a
 * point source's flux inside a circular aperture, the aperture's size in pixels, and the share that
 * falls in the brightest pixel (for a saturation check).
 *
 * Angles (FWHM, radii, pixel scale) may be in any one unit, the same for every argument of a call;
 * the names say arcsec, the unit the product uses.
 */
import { domainError, requirePositive } from "@/lib/physics/domain";

/**
 * Exponent of the air mass in the growth of the seeing FWHM, FWHM(X) = FWHM(1) X^0.6: Kolmogorov
 * turbulence gives FWHM ∝ r₀^(−1) with r₀ ∝ (sec z)^(−3/5) (Roddier 1981, Progress in Optics 19, 281).
 */
export const SEEING_AIRMASS_EXPONENT = 0.6;

/**
 * Moffat β of a PSF shaped by Kolmogorov turbulence (Trujillo et al. 2001, MNRAS 328, 977: β = 4.765
 * is their best fit to the Kolmogorov profile).
 */
export const KOLMOGOROV_MOFFAT_BETA = 4.765;

/** A circular PSF: Gaussian, or Moffat (1969, A&A 3, 455) with power β > 1. */
export type PsfShape = { kind: "gaussian" } | { kind: "moffat"; beta: number };

export const psfShapeLabels: Record<PsfShape["kind"], string> = { gaussian: "Gaussian", moffat: "Moffat" };

/** Seeing FWHM (arcsec) at air mass X ≥ 1 from the zenith FWHM (arcsec): FWHM × X^0.6 (Roddier 1981). */
export function seeingFwhmAtAirmassArcsec(zenithFwhmArcsec: number, airmass: number): number {
  requirePositive("Seeing FWHM at zenith (arcsec)", zenithFwhmArcsec);
  if (!(Number.isFinite(airmass) && airmass >= 1)) throw domainError("Air mass", airmass, "a number of at least 1");
  return zenithFwhmArcsec * airmass ** SEEING_AIRMASS_EXPONENT;
}

/** Gaussian σ from the FWHM (same unit): σ = FWHM / (2 √(2 ln 2)). */
export function gaussianSigmaFromFwhm(fwhm: number): number {
  return fwhm / (2 * Math.sqrt(2 * Math.LN2));
}

/** Moffat α from the FWHM (same unit): α = FWHM / (2 √(2^(1/β) − 1)), from I(FWHM/2) = I(0)/2. */
export function moffatAlphaFromFwhm(fwhm: number, beta: number): number {
  return fwhm / (2 * Math.sqrt(Math.expm1(Math.LN2 / beta)));
}

/** Checks a PSF shape (a Moffat needs β > 1), throwing a RangeError naming the field in words. */
export function requirePsfShape(shape: PsfShape): void {
  if (shape.kind === "moffat" && !(Number.isFinite(shape.beta) && shape.beta > 1)) {
    throw domainError("Moffat β", shape.beta, "a number above 1 (at or below 1 the profile holds infinite flux)");
  }
}

/** The profile's width parameter squared: 2σ² (Gaussian) or α² (Moffat), in the FWHM's unit squared. */
function widthSquared(shape: PsfShape, fwhm: number): number {
  if (shape.kind === "gaussian") {
    const sigma = gaussianSigmaFromFwhm(fwhm);
    return 2 * sigma * sigma;
  }
  const alpha = moffatAlphaFromFwhm(fwhm, shape.beta);
  return alpha * alpha;
}

/** Encircled energy at radius² over `widthSquared`, without argument checks (the quadrature below calls it many times). */
function encircledEnergyUnchecked(shape: PsfShape, radiusSquaredOverWidthSquared: number): number {
  if (shape.kind === "gaussian") return -Math.expm1(-radiusSquaredOverWidthSquared);
  return -Math.expm1((1 - shape.beta) * Math.log1p(radiusSquaredOverWidthSquared));
}

/**
 * Share of a point source's flux within a circle of `radiusArcsec` about its centre, for a PSF of
 * `fwhmArcsec` (radius 0 gives 0; the share tends to 1 as the radius grows). Closed forms:
 * Gaussian 1 − exp(−r²/2σ²); Moffat 1 − (1 + r²/α²)^(1−β) (the integral of
 * I(r) = (β − 1)/(π α²) (1 + r²/α²)^(−β); Moffat 1969, A&A 3, 455). Evaluated with expm1/log1p, so
 * small radii keep full relative precision.
 */
export function encircledEnergyFraction(shape: PsfShape, radiusArcsec: number, fwhmArcsec: number): number {
  requirePsfShape(shape);
  requirePositive("Seeing FWHM (arcsec)", fwhmArcsec);
  if (!(Number.isFinite(radiusArcsec) && radiusArcsec >= 0)) {
    throw domainError("Aperture radius (arcsec)", radiusArcsec, "a finite number of at least 0");
  }
  return encircledEnergyUnchecked(shape, (radiusArcsec * radiusArcsec) / widthSquared(shape, fwhmArcsec));
}

/** Number of pixels (fractional) in a circular aperture: π r² / p² for radius r and pixel scale p (arcsec). */
export function aperturePixelCount(radiusArcsec: number, pixelScaleArcsec: number): number {
  requirePositive("Aperture radius (arcsec)", radiusArcsec);
  requirePositive("Pixel scale (arcsec per pixel)", pixelScaleArcsec);
  return (Math.PI * radiusArcsec * radiusArcsec) / (pixelScaleArcsec * pixelScaleArcsec);
}

/** Composite Simpson intervals over t = tan θ in [0, 1] for the peak pixel (even). */
const PEAK_PIXEL_INTERVALS = 64;

/**
 * Share of a point source's flux in the brightest pixel when the source sits at a pixel's centre (the
 * worst case for saturation), for square pixels of `pixelScaleArcsec` and a PSF of `fwhmArcsec`.
 *
 * Method: for a circular PSF with encircled energy EE(r), the flux in the square of half-side h about
 * the centre is (4/π) ∫₀^{π/4} EE(h / cos θ) dθ (polar coordinates, the square's eight symmetric
 * triangles) = (4/π) ∫₀¹ EE(h √(1 + t²)) / (1 + t²) dt with t = tan θ, whose integrand is nearly
 * constant for pixels small against the FWHM; summed by composite Simpson's rule on 64 intervals
 * (our rule). It matches the Gaussian's exact erf(h/(√2 σ))² and a numerical two-dimensional integral
 * of the Moffat (tests/fixtures/generate_psf.py) to the relative error the tests state.
 */
export function peakPixelFluxFraction(shape: PsfShape, fwhmArcsec: number, pixelScaleArcsec: number): number {
  requirePsfShape(shape);
  requirePositive("Seeing FWHM (arcsec)", fwhmArcsec);
  requirePositive("Pixel scale (arcsec per pixel)", pixelScaleArcsec);
  const halfSide = pixelScaleArcsec / 2;
  const halfSideSquaredOverWidthSquared = (halfSide * halfSide) / widthSquared(shape, fwhmArcsec);
  const step = 1 / PEAK_PIXEL_INTERVALS;
  let sum = 0;
  for (let i = 0; i <= PEAK_PIXEL_INTERVALS; i++) {
    const weight = i === 0 || i === PEAK_PIXEL_INTERVALS ? 1 : i % 2 === 1 ? 4 : 2;
    const secantSquared = 1 + (i * step) ** 2;
    sum += (weight * encircledEnergyUnchecked(shape, halfSideSquaredOverWidthSquared * secantSquared)) / secantSquared;
  }
  return (4 / Math.PI) * (step / 3) * sum;
}
