/**
 * Atmospheric refraction between geometric and apparent altitude. Model: astronomy-engine's
 * "normal" option, Saemundsson's formula (Sky & Telescope 1986; Meeus, Astronomical Algorithms,
 * eq. 16.4) for 1010 hPa and 10 °C, scaled by the U.S. Standard Atmosphere 1976 density at the
 * site's elevation (astronomy-engine `Atmosphere`), as astronomy-engine's documentation recommends.
 * Good to about 0.1′ above 15° altitude and a few arcminutes at the horizon, where the real
 * atmosphere varies by more than that.
 */
import { Atmosphere, Refraction } from "astronomy-engine";

/** Refraction relative to sea level at `elevationM` (metres, domain [−500, 9000]): density ratio. */
export function refractionScale(elevationM: number): number {
  return Atmosphere(elevationM).density;
}

/** Apparent altitude (degrees) of a geometric altitude `geometricDeg` (degrees, [−90, 90]). */
export function apparentAltitudeDeg(geometricDeg: number, scale: number): number {
  return geometricDeg + scale * Refraction("normal", geometricDeg);
}

const INVERSE_MAX_ITERATIONS = 30;
const INVERSE_TOLERANCE_DEG = 1e-10;

/**
 * Geometric altitude (degrees) whose apparent altitude is `apparentDeg` (degrees, [−1, 90]), the
 * inverse of `apparentAltitudeDeg`. Method: fixed-point iteration h ← h_app − R(h), which contracts
 * because |dR/dh| < 0.2 above −1°; tolerance 1e-10°, at most 30 iterations.
 */
export function geometricAltitudeDeg(apparentDeg: number, scale: number): number {
  let geometric = apparentDeg;
  for (let iteration = 0; iteration < INVERSE_MAX_ITERATIONS; iteration++) {
    const next = apparentDeg - scale * Refraction("normal", geometric);
    if (Math.abs(next - geometric) < INVERSE_TOLERANCE_DEG) return next;
    geometric = next;
  }
  return geometric;
}
