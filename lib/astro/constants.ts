/**
 * Conventions of the sky-windows core, each with its source. Every other module of `lib/astro`
 * takes these from here.
 */

/**
 * Rate of the Earth's rotation relative to the equinox, degrees of hour angle per day of UT:
 * 1.00273790935 sidereal days per solar day times 360 (the derivative of the IAU 1982 GMST
 * expression; Meeus, Astronomical Algorithms, 2nd ed., eq. 12.4).
 */
export const SIDEREAL_RATE_DEG_PER_DAY = 360.98564736629;

/** Julian date of the J2000.0 epoch (2000-01-01T12:00 UT), the origin of astronomy-engine's day count. */
export const J2000_JD = 2_451_545.0;

/** Milliseconds in a day of 86400 s. */
export const DAY_MS = 86_400_000;

/**
 * Geometric altitude of a star's centre when it touches the apparent horizon: the standard
 * horizontal refraction of 34 arcminutes (common practice in almanac rise and set times).
 */
export const RISE_SET_GEOMETRIC_ALTITUDE_DEG = -34 / 60;

/**
 * Geometric altitude of the Sun's centre at sunrise and sunset: 34′ refraction plus 16′
 * semi-diameter (common practice, as in almanac sunrise tables).
 */
export const SUNRISE_GEOMETRIC_ALTITUDE_DEG = -50 / 60;

/** Sun's geometric altitudes bounding civil, nautical and astronomical twilight (common practice). */
export const TWILIGHT_ALTITUDE_DEG = { civil: -6, nautical: -12, astronomical: -18 } as const;

/**
 * Default smallest safe angle between a pointing and the Sun, degrees. A chosen default in the range
 * telescope operators commonly use (common practice); each site should set its own.
 */
export const DEFAULT_SAFE_SUN_ELONGATION_DEG = 45;

/** Default airmass limit: the airmass-2 rule of thumb (common practice). */
export const DEFAULT_AIRMASS_LIMIT = 2;

/** Default time step of the nightly sample grid, minutes; crossings are interpolated inside a step. */
export const DEFAULT_STEP_MINUTES = 5;
