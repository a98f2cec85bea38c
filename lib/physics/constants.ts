/**
 * Physical and astronomical constants, SI units, each with its source. Every other module takes its
 * constants from here; none is re-typed elsewhere.
 */

/** Speed of light in vacuum, m/s. Exact by definition of the metre (SI, 17th CGPM 1983). */
export const SPEED_OF_LIGHT_M_PER_S = 299_792_458;

/**
 * Nominal solar mass parameter GM_sun, m^3/s^2. IAU 2015 Resolution B3. Used instead of G times a mass
 * in kilograms: G is known to only about five digits, GM_sun to about ten.
 */
export const GM_SUN_M3_PER_S2 = 1.3271244e20;

/**
 * Newtonian constant of gravitation, m^3 kg^-1 s^-2. CODATA 2018 recommended value (relative standard
 * uncertainty 2.2e-5). Needed only to read masses typed in kilograms.
 */
export const GRAVITATIONAL_CONSTANT_SI = 6.6743e-11;

/** Solar mass in kilograms implied by GM_sun (IAU 2015 B3) and G (CODATA 2018); uncertain at 2e-5. */
export const SOLAR_MASS_KG = GM_SUN_M3_PER_S2 / GRAVITATIONAL_CONSTANT_SI;

/** Nominal solar radius, m. IAU 2015 Resolution B3. */
export const SOLAR_RADIUS_M = 6.957e8;

/** Astronomical unit, m. Exact by IAU 2012 Resolution B2. */
export const AU_M = 149_597_870_700;

/** Parsec, m: (648000/pi) au, by IAU 2015 Resolution B2. */
export const PARSEC_M = (648_000 / Math.PI) * AU_M;

/** Day of 86400 SI seconds (IAU). */
export const DAY_S = 86_400;

/** Julian year of 365.25 days, s (IAU). */
export const JULIAN_YEAR_S = 365.25 * DAY_S;

/** Light year, m: c times one Julian year (IAU Style Manual). */
export const LIGHT_YEAR_M = SPEED_OF_LIGHT_M_PER_S * JULIAN_YEAR_S;

/** GM_sun/c^2, m: the solar mass expressed as a length in geometrized units (about 1476.6 m). */
export const SOLAR_MASS_LENGTH_M = GM_SUN_M3_PER_S2 / (SPEED_OF_LIGHT_M_PER_S * SPEED_OF_LIGHT_M_PER_S);

/** GM_sun/c^3, s: the solar mass expressed as a time in geometrized units (about 4.925 microseconds). */
export const SOLAR_MASS_TIME_S = SOLAR_MASS_LENGTH_M / SPEED_OF_LIGHT_M_PER_S;

/** Milliarcsecond in radians: pi / (180 * 3600 * 1000). */
export const MILLIARCSECOND_RAD = Math.PI / 648_000_000;

/** Microarcsecond in radians: pi / (180 * 3600 * 1e6). */
export const MICROARCSECOND_RAD = Math.PI / 648_000_000_000;

/** Arcsecond in radians: pi / (180 * 3600). */
export const ARCSECOND_RAD = Math.PI / 648_000;

/** Speed of light in km/s, for H0 in km/s/Mpc. Exact (see SPEED_OF_LIGHT_M_PER_S). */
export const SPEED_OF_LIGHT_KM_PER_S = SPEED_OF_LIGHT_M_PER_S / 1000;

/** Nominal Jovian mass parameter GM_J, m^3/s^2. IAU 2015 Resolution B3. */
export const GM_JUPITER_M3_PER_S2 = 1.2668653e17;

/** Nominal terrestrial mass parameter GM_E, m^3/s^2. IAU 2015 Resolution B3. */
export const GM_EARTH_M3_PER_S2 = 3.986004e14;

/** Nominal equatorial radius of Jupiter, m. IAU 2015 Resolution B3. */
export const JUPITER_EQUATORIAL_RADIUS_M = 7.1492e7;

/** Nominal equatorial radius of the Earth, m. IAU 2015 Resolution B3. */
export const EARTH_EQUATORIAL_RADIUS_M = 6.3781e6;

/** Planck constant, J s. Exact by definition of the kilogram (SI, 26th CGPM 2018). */
export const PLANCK_CONSTANT_J_S = 6.626_070_15e-34;
