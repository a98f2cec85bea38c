/**
 * Photon budget core (issue 17): moonlit sky brightness (Krisciunas & Schaefer 1991) and the CCD
 * equation (Howell 2006 eq. 4.4). Pure functions, no React, DOM or database.
 */
export {
  darkSkyNanolamberts,
  krisciunasSchaeferAirmass,
  moonIlluminance,
  moonScattering,
  moonSkyBrightnessNanolamberts,
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
