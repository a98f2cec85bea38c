/**
 * The photon budget of one visit: the signal-to-noise of a point source in a photometric aperture
 * under that visit's air mass, seeing and sky (dark sky plus moonlight), the exposure that reaches a
 * goal, and the full-well check; for one visit (`visitPhotometry`) or many at once without an object
 * per visit (`visitPhotometrySeries`). Both go through `evaluateVisit`, so their arithmetic is one.
 *
 * Method per visit:
 * 1. Seeing FWHM at the air mass, FWHM(1) X^0.6 (Roddier 1981; ./psf). The aperture radius is the
 *    instrument's multiple of that FWHM; its encircled energy (Gaussian or Moffat, ./psf) and its
 *    area in pixels, π r² / p².
 * 2. Source electrons per second: the magnitude dimmed by k X (Bouguer, `magnitudeThroughAtmosphere`)
 *    turned into electrons (./source-flux), times the encircled energy.
 * 3. Sky: the dark sky at the target's zenith distance Z by the form of Krisciunas & Schaefer 1991 eq.
 *    2, B(Z) = B_zen 10^(−0.4 k (X(Z) − 1)) X(Z), applied in the band with the band's extinction k
 *    (an approximation: K&S fit it in V; airglow brightens towards the horizon in every optical band,
 *    but not by exactly this law); plus moonlight from K&S eq. 15 in V with the V extinction, carried
 *    to the band by the colour of sunlight (./moon-colour). The two are summed in flux.
 * 4. The CCD equation (Howell 2006 eq. 4.4; ./ccd) for the S/N in the exposure and the closed-form
 *    exposure for the goal; the brightest pixel's electrons against the full well, with the source
 *    centred on a pixel (`peakPixelFluxFraction`).
 * Magnitudes are in the band's own system (the one its zero point is for), as is the dark sky.
 */
import { collectingAreaM2, magnitudeThroughAtmosphere, sourceElectronsPerS, type TelescopeOptics } from "./source-flux";
import type { PhotometricBand } from "./bands";
import { aperturePixelCount, encircledEnergyFraction, gaussianSigmaFromFwhm, peakPixelFluxFraction, requirePsfShape, seeingFwhmAtAirmassArcsec, type PsfShape } from "./psf";
import { exposureFromRates, peakPixelElectronsPerS, signalToNoiseFromRates } from "./ccd";
import { darkSkyZenithDistanceFactor, requireExtinctionV, requireMoonGeometry, scatteredMoonlightNanolamberts, vMagPerArcsec2FromNanolamberts } from "./moon-sky";
import { sunColourVMinusBandMag } from "./moon-colour";
import { domainError, requireFinite, requireNonNegative, requirePositive } from "@/lib/physics/domain";

export interface PhotometryInstrument {
  optics: TelescopeOptics;
  /** Read noise, electrons rms per pixel (≥ 0). */
  readNoiseElectrons: number;
  /** Dark current, electrons per second per pixel (≥ 0). */
  darkElectronsPerSPerPixel: number;
  /** Gain, electrons per ADU (> 0). Not in eq. 4.4 (its digitisation noise is left out, ./ccd); kept with the detector. */
  gainElectronsPerAdu: number;
  /** Full well, electrons (> 0). */
  fullWellElectrons: number;
  /** Pixel scale, arcsec per pixel (> 0). */
  pixelScaleArcsec: number;
  /** Seeing FWHM at the zenith, arcsec (> 0). */
  seeingFwhmZenithArcsec: number;
  /** Photometric aperture radius as a multiple of the FWHM at the visit's air mass (> 0). */
  apertureRadiusFwhm: number;
  psf: PsfShape;
  /** Overhead per visit, s (≥ 0): slew, acquisition, read-out. */
  overheadS: number;
}

/** A band and the site's sky in it. */
export interface BandSky {
  band: PhotometricBand;
  /** Moonless zenith sky, mag/arcsec² in the band's own system. */
  darkSkyZenithMagPerArcsec2: number;
  /** Extinction in the band, mag per air mass (≥ 0). */
  extinctionMagPerAirmass: number;
  /** V extinction for the K&S moonlight, mag per air mass (≥ 0). */
  extinctionV: number;
}

/** One visit's sky, as lib/schedule's VisitSky gives per index. Angles in degrees. */
export interface VisitSkyConditions {
  /** Air mass of the target (≥ 1), for extinction and seeing. */
  airmass: number;
  /** Zenith distance of the target, [0, 90]. */
  targetZenithDeg: number;
  /** Zenith distance of the Moon, [0, 180]; beyond 90 the Moon is down. */
  moonZenithDeg: number;
  /** Moon–target separation, [0, 180]. */
  moonSeparationDeg: number;
  /** Moon's phase angle, [−180, 180]; 0 full. */
  moonPhaseAngleDeg: number;
}

/** Sky surface brightness at a visit, mag/arcsec² in the band's own system. */
export interface SkyBrightness {
  totalMagPerArcsec2: number;
  darkMagPerArcsec2: number;
  /** +Infinity when the Moon is down */
  moonMagPerArcsec2: number;
}

export interface VisitPhotometry {
  signalToNoise: number;
  /** mmag, 1.0857/(S/N) × 1000 */
  precisionMmag: number;
  /** Exposure that reaches the S/N goal, s. */
  exposureForGoalS: number;
  /**
   * The brightest pixel reaches the full well in the exposure the visit uses: the one that reaches the
   * goal, at most the time available (`exposureS`); a brighter source exposes for less.
   */
  isSaturated: boolean;
  /** Electrons in the brightest pixel over the full well, after the exposure the visit uses. */
  peakPixelFullWellFraction: number;
  skyMagPerArcsec2: number;
  moonMagPerArcsec2: number;
  /** Seeing FWHM at the visit's air mass, arcsec. */
  seeingFwhmArcsec: number;
}

/** `visitPhotometry` for many visits, index-aligned with the visits. */
export interface VisitPhotometrySeries {
  signalToNoise: Float32Array;
  precisionMmag: Float32Array;
  exposureForGoalS: Float32Array;
  /** 1 where the brightest pixel reaches the full well. */
  saturated: Uint8Array;
  skyMagPerArcsec2: Float32Array;
  moonMagPerArcsec2: Float32Array;
}

/** 2.5 / ln 10 = 1.0857 mag per unit relative flux error: σ_m = 1.0857 / (S/N) (the derivative of Pogson's law). */
const MAG_PER_RELATIVE_FLUX = 2.5 / Math.LN10;

function requireSky(sky: BandSky): void {
  requireFinite("Dark sky at the zenith (mag/arcsec²)", sky.darkSkyZenithMagPerArcsec2);
  requireNonNegative("Extinction (mag per air mass)", sky.extinctionMagPerAirmass);
  requireExtinctionV(sky.extinctionV);
}

function requireInstrument(instrument: PhotometryInstrument): void {
  collectingAreaM2(instrument.optics);
  requireNonNegative("Read noise (electrons)", instrument.readNoiseElectrons);
  requireNonNegative("Dark current (electrons per second per pixel)", instrument.darkElectronsPerSPerPixel);
  requirePositive("Gain (electrons per ADU)", instrument.gainElectronsPerAdu);
  requirePositive("Full well (electrons)", instrument.fullWellElectrons);
  requirePositive("Pixel scale (arcsec per pixel)", instrument.pixelScaleArcsec);
  requirePositive("Seeing FWHM at zenith (arcsec)", instrument.seeingFwhmZenithArcsec);
  requirePositive("Photometric aperture radius (multiples of the FWHM)", instrument.apertureRadiusFwhm);
  requirePsfShape(instrument.psf);
  requireNonNegative("Overhead per visit (seconds)", instrument.overheadS);
}

/** What every visit of a call shares, checked once. */
interface PreparedBudget {
  instrument: PhotometryInstrument;
  sky: BandSky;
  /** Electrons per second from a 0-mag source above the atmosphere (all of its light, before the aperture). */
  electronsPerSAtZeroMag: number;
  /** M_☉,V − M_☉,band (./moon-colour). */
  sunColourMag: number;
  exposureS: number;
  signalToNoiseGoal: number;
}

function prepare(instrument: PhotometryInstrument, sky: BandSky, exposureS: number, signalToNoiseGoal: number): PreparedBudget {
  requireInstrument(instrument);
  requireSky(sky);
  requirePositive("Exposure time (seconds)", exposureS);
  requirePositive("Signal-to-noise goal", signalToNoiseGoal);
  return {
    instrument,
    sky,
    electronsPerSAtZeroMag: sourceElectronsPerS({ band: sky.band, magnitude: 0, optics: instrument.optics }),
    sunColourMag: sunColourVMinusBandMag(sky.band),
    exposureS,
    signalToNoiseGoal,
  };
}

/** Surface brightness (mag/arcsec²) of a flux in units of a 0-mag/arcsec² sky; +Infinity for 0. */
function magFromFlux(flux: number): number {
  return -2.5 * Math.log10(flux);
}

/** Dark sky at zenith distance Z (degrees), mag/arcsec²: K&S eq. 2's factor applied in the band (module comment, step 3). */
function darkSkyMagAt(sky: BandSky, targetZenithDeg: number): number {
  return sky.darkSkyZenithMagPerArcsec2 + magFromFlux(darkSkyZenithDistanceFactor(targetZenithDeg, sky.extinctionMagPerAirmass));
}

/** Moonlight in the band, mag/arcsec² (+Infinity with the Moon down): K&S eq. 15 in V, then the Sun's colour. */
function moonMagAt(sky: BandSky, sunColourMag: number, targetZenithDeg: number, moonZenithDeg: number, separationDeg: number, phaseAngleDeg: number): number {
  const nanolamberts = scatteredMoonlightNanolamberts(phaseAngleDeg, moonZenithDeg, targetZenithDeg, separationDeg, sky.extinctionV);
  return vMagPerArcsec2FromNanolamberts(nanolamberts) - sunColourMag;
}

/** Sum of two surface brightnesses in flux, mag/arcsec². */
function addInFlux(darkMag: number, moonMag: number): number {
  return magFromFlux(10 ** (-0.4 * darkMag) + 10 ** (-0.4 * moonMag));
}

function requireVisit(airmass: number, targetZenithDeg: number, moonZenithDeg: number, separationDeg: number, phaseAngleDeg: number): void {
  if (!(Number.isFinite(airmass) && airmass >= 1)) throw domainError("Air mass", airmass, "a number of at least 1");
  requireMoonGeometry(phaseAngleDeg, moonZenithDeg, targetZenithDeg, separationDeg);
}

/**
 * Sky brightness at a visit in the band: dark sky at the target's zenith distance, moonlight, and
 * their sum in flux, mag/arcsec² in the band's own system (method: module comment, step 3). Throws a
 * RangeError naming the field in words for an input outside its domain.
 */
export function skyBrightnessAtVisit(sky: BandSky, visit: VisitSkyConditions): SkyBrightness {
  requireSky(sky);
  requireVisit(visit.airmass, visit.targetZenithDeg, visit.moonZenithDeg, visit.moonSeparationDeg, visit.moonPhaseAngleDeg);
  const darkMagPerArcsec2 = darkSkyMagAt(sky, visit.targetZenithDeg);
  const moonMagPerArcsec2 = moonMagAt(sky, sunColourVMinusBandMag(sky.band), visit.targetZenithDeg, visit.moonZenithDeg, visit.moonSeparationDeg, visit.moonPhaseAngleDeg);
  return { totalMagPerArcsec2: addInFlux(darkMagPerArcsec2, moonMagPerArcsec2), darkMagPerArcsec2, moonMagPerArcsec2 };
}

/**
 * One visit's numbers, written by `evaluateVisit` into a record the caller reuses (the precision
 * follows from the S/N); `peakPixelFullWellFraction` is NaN when neither asked for nor needed.
 */
type VisitScratch = Omit<VisitPhotometry, "precisionMmag">;

function newScratch(): VisitScratch {
  return { signalToNoise: 0, exposureForGoalS: 0, isSaturated: false, peakPixelFullWellFraction: 0, skyMagPerArcsec2: 0, moonMagPerArcsec2: 0, seeingFwhmArcsec: 0 };
}

/**
 * Electrons in the brightest pixel over the full well after the exposure, when it holds the share
 * `peakFraction` of the source's `sourceElectronsPerS` (all its light) plus one pixel's sky and dark.
 */
function fullWellShare(budget: PreparedBudget, exposureS: number, sourceElectronsPerS: number, peakFraction: number, skyElectronsPerSPerPixel: number): number {
  const { darkElectronsPerSPerPixel, fullWellElectrons } = budget.instrument;
  return (peakPixelElectronsPerS(sourceElectronsPerS, peakFraction, skyElectronsPerSPerPixel, darkElectronsPerSPerPixel) * exposureS) / fullWellElectrons;
}

/**
 * The method of the module comment for one visit, into `out`; the visit's numbers checked here. The
 * brightest pixel's exact share (a quadrature, most of a visit's cost) is computed when
 * `needsPeakShare` or when its bounds leave the saturation verdict open.
 */
function evaluateVisit(
  budget: PreparedBudget,
  airmass: number,
  targetZenithDeg: number,
  moonZenithDeg: number,
  separationDeg: number,
  phaseAngleDeg: number,
  magnitude: number,
  needsPeakShare: boolean,
  out: VisitScratch,
): void {
  requireVisit(airmass, targetZenithDeg, moonZenithDeg, separationDeg, phaseAngleDeg);
  const { instrument, sky, electronsPerSAtZeroMag } = budget;
  const seeing = seeingFwhmAtAirmassArcsec(instrument.seeingFwhmZenithArcsec, airmass);
  const radius = instrument.apertureRadiusFwhm * seeing;
  const pixelCount = aperturePixelCount(radius, instrument.pixelScaleArcsec);
  const sourceTotal = electronsPerSAtZeroMag * 10 ** (-0.4 * magnitudeThroughAtmosphere(magnitude, sky.extinctionMagPerAirmass, airmass));
  const sourceInAperture = sourceTotal * encircledEnergyFraction(instrument.psf, radius, seeing);

  const moonMag = moonMagAt(sky, budget.sunColourMag, targetZenithDeg, moonZenithDeg, separationDeg, phaseAngleDeg);
  const skyMag = addInFlux(darkSkyMagAt(sky, targetZenithDeg), moonMag);
  const pixelArcsec2 = instrument.pixelScaleArcsec * instrument.pixelScaleArcsec;
  const skyPerPixel = electronsPerSAtZeroMag * 10 ** (-0.4 * skyMag) * pixelArcsec2;

  const { readNoiseElectrons: read, darkElectronsPerSPerPixel: dark } = instrument;
  out.signalToNoise = signalToNoiseFromRates(sourceInAperture, skyPerPixel, dark, read, pixelCount, budget.exposureS);
  out.exposureForGoalS = exposureFromRates(sourceInAperture, skyPerPixel, dark, read, pixelCount, budget.signalToNoiseGoal);
  // The pixel lies between its inscribed and circumscribed circles, so their encircled energies bound
  // its share; when both bounds fall on one side of the full well the quadrature cannot change the
  // verdict and a series (which keeps only the verdict) skips it.
  const halfSide = instrument.pixelScaleArcsec / 2;
  const usedExposureS = Math.min(out.exposureForGoalS, budget.exposureS);
  const upper = fullWellShare(budget, usedExposureS, sourceTotal, encircledEnergyFraction(instrument.psf, halfSide * Math.SQRT2, seeing), skyPerPixel);
  const lower = fullWellShare(budget, usedExposureS, sourceTotal, encircledEnergyFraction(instrument.psf, halfSide, seeing), skyPerPixel);
  if (needsPeakShare || (lower < 1 && upper >= 1)) {
    out.peakPixelFullWellFraction = fullWellShare(budget, usedExposureS, sourceTotal, peakPixelFluxFraction(instrument.psf, seeing, instrument.pixelScaleArcsec), skyPerPixel);
    out.isSaturated = out.peakPixelFullWellFraction >= 1;
  } else {
    out.peakPixelFullWellFraction = Number.NaN;
    out.isSaturated = lower >= 1;
  }
  out.skyMagPerArcsec2 = skyMag;
  out.moonMagPerArcsec2 = moonMag;
  out.seeingFwhmArcsec = seeing;
}

/** Photometric precision, mmag, from the S/N: 1.0857 / (S/N) × 1000 (+Infinity at S/N 0). */
function precisionMmagFromSignalToNoise(signalToNoise: number): number {
  return (MAG_PER_RELATIVE_FLUX / signalToNoise) * 1000;
}

/**
 * S/N of a point source of `magnitude` (band's own system, above the atmosphere) in `exposureS` at
 * this visit, and the exposure that reaches `signalToNoiseGoal`. Method: module comment. Throws a
 * RangeError naming the field in words for an input outside its domain (a zero aperture, a negative
 * read noise, an air mass below 1, …).
 */
export function visitPhotometry(input: {
  instrument: PhotometryInstrument;
  sky: BandSky;
  visit: VisitSkyConditions;
  magnitude: number;
  exposureS: number;
  signalToNoiseGoal: number;
}): VisitPhotometry {
  const budget = prepare(input.instrument, input.sky, input.exposureS, input.signalToNoiseGoal);
  const { visit } = input;
  const out = newScratch();
  evaluateVisit(budget, visit.airmass, visit.targetZenithDeg, visit.moonZenithDeg, visit.moonSeparationDeg, visit.moonPhaseAngleDeg, input.magnitude, true, out);
  return { ...out, precisionMmag: precisionMmagFromSignalToNoise(out.signalToNoise) };
}

/** Per-visit sky arrays, index-aligned (degrees, air mass). */
export interface VisitSkyArrays {
  airmass: ArrayLike<number>;
  targetZenithDeg: ArrayLike<number>;
  moonZenithDeg: ArrayLike<number>;
  moonSeparationDeg: ArrayLike<number>;
  moonPhaseAngleDeg: ArrayLike<number>;
}

/**
 * `visitPhotometry` for many visits at once: the same arithmetic (the same `evaluateVisit`), with the
 * instrument and sky checked once and one scratch record for all visits; results as 32-bit arrays
 * index-aligned with the visits. `magnitudes[i]` is the source's (magnified, blended) magnitude at
 * visit i. Throws a RangeError in words when the arrays differ in length or when a visit's numbers are
 * outside their domain (the message names the visit, counted from 1).
 */
export function visitPhotometrySeries(input: {
  instrument: PhotometryInstrument;
  sky: BandSky;
  visits: VisitSkyArrays;
  magnitudes: ArrayLike<number>;
  exposureS: number;
  signalToNoiseGoal: number;
}): VisitPhotometrySeries {
  const budget = prepare(input.instrument, input.sky, input.exposureS, input.signalToNoiseGoal);
  const { visits, magnitudes } = input;
  const count = magnitudes.length;
  const lengths = [visits.airmass.length, visits.targetZenithDeg.length, visits.moonZenithDeg.length, visits.moonSeparationDeg.length, visits.moonPhaseAngleDeg.length];
  if (lengths.some((length) => length !== count)) {
    throw new RangeError(
      `Visit sky: the air masses, zenith distances, Moon separations and phase angles must give one value for each of the ${count} visits (got ${lengths.join(", ")}).`,
    );
  }
  const series: VisitPhotometrySeries = {
    signalToNoise: new Float32Array(count),
    precisionMmag: new Float32Array(count),
    exposureForGoalS: new Float32Array(count),
    saturated: new Uint8Array(count),
    skyMagPerArcsec2: new Float32Array(count),
    moonMagPerArcsec2: new Float32Array(count),
  };
  const out = newScratch();
  let i = 0;
  try {
    for (; i < count; i++) {
      evaluateVisit(budget, visits.airmass[i], visits.targetZenithDeg[i], visits.moonZenithDeg[i], visits.moonSeparationDeg[i], visits.moonPhaseAngleDeg[i], magnitudes[i], false, out);
      series.signalToNoise[i] = out.signalToNoise;
      series.precisionMmag[i] = precisionMmagFromSignalToNoise(out.signalToNoise);
      series.exposureForGoalS[i] = out.exposureForGoalS;
      series.saturated[i] = out.isSaturated ? 1 : 0;
      series.skyMagPerArcsec2[i] = out.skyMagPerArcsec2;
      series.moonMagPerArcsec2[i] = out.moonMagPerArcsec2;
    }
  } catch (error) {
    if (error instanceof RangeError) throw new RangeError(`Visit ${i + 1}: ${error.message}`);
    throw error;
  }
  return series;
}

/**
 * Photon-limited centroid precision per axis, mas, of a source of S/N `signalToNoise` (> 0) with a
 * Gaussian-like PSF of `fwhmArcsec` (> 0): σ = σ_PSF / (S/N) = FWHM / (2√(2 ln 2) · S/N).
 * Source: the photon-noise bound σ_x = σ_PSF / √N for N detected photons of a Gaussian PSF
 * (Lindegren 1978, in Modern Astrometry, IAU Colloq. 48, 197; from memory), with S/N in place of √N
 * (common practice; exact when the source's own photons dominate the noise, optimistic by a factor
 * of order unity when the sky does).
 */
export function centroidPrecisionMas(fwhmArcsec: number, signalToNoise: number): number {
  requirePositive("Seeing FWHM (arcsec)", fwhmArcsec);
  requirePositive("Signal-to-noise", signalToNoise);
  return (gaussianSigmaFromFwhm(fwhmArcsec) / signalToNoise) * 1000;
}
