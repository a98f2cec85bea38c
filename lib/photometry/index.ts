/**
 * Photon budget core: standard bands and site defaults, the PSF and its encircled energy, photon
 * rates from magnitudes, moonlit sky brightness (Krisciunas & Schaefer 1991) and the CCD equation
 * (Howell 2006 eq. 4.4), moonlight carried to other bands by the Sun's colour, and the budget of
 * each visit (S/N, exposure for a goal, saturation) under its own sky. Pure functions, no React, DOM
 * or database.
 */
export {
  darkSkyNanolamberts,
  krisciunasSchaeferAirmass,
  moonIlluminance,
  moonScattering,
  moonSkyBrightnessNanolamberts,
  MOONLIGHT_MODEL_MIN_SEPARATION_DEG,
  nanolambertsFromVMagPerArcsec2,
  skyWithMoonVMagPerArcsec2,
  vMagPerArcsec2FromNanolamberts,
  type MoonSkyInput,
} from "./moon-sky";
export {
  ccdSignalToNoise,
  exposureForSignalToNoise,
  saturationCheck,
  type CcdRates,
  type SaturationCheck,
} from "./ccd";
export {
  AB_ZERO_POINT_JY,
  standardBand,
  standardBandIds,
  standardBands,
  typicalDarkSiteConditions,
  validateCustomBand,
  zeroPointPhotonsPerSPerM2PerNm,
  type MagnitudeSystem,
  type PhotometricBand,
} from "./bands";
export { aperturePixelCount, encircledEnergyFraction, KOLMOGOROV_MOFFAT_BETA, peakPixelFluxFraction, seeingFwhmAtAirmassArcsec, type PsfShape } from "./psf";
export {
  baselineMagnitude,
  blendedFluxInBaselineUnits,
  collectingAreaM2,
  magnifiedBlendMagnitude,
  magnitudeThroughAtmosphere,
  skyElectronsPerSPerPixel,
  sourceElectronsPerS,
  type TelescopeOptics,
} from "./source-flux";
export { moonMagPerArcsec2InBand, SOLAR_ABSOLUTE_MAGNITUDES, solarAbsoluteMagnitude, sunColourVMinusBandMag } from "./moon-colour";
export {
  centroidPrecisionMas,
  skyBrightnessAtVisit,
  visitPhotometry,
  visitPhotometrySeries,
  type BandSky,
  type PhotometryInstrument,
  type SkyBrightness,
  type VisitPhotometry,
  type VisitPhotometrySeries,
  type VisitSkyArrays,
  type VisitSkyConditions,
} from "./visit-budget";
