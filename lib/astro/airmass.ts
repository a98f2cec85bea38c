/**
 * Relative air mass from apparent altitude, valid down to the horizon, where the plane-parallel
 * sec(z) diverges. Formula of K. A. Pickering 2002, "The Southern Limits of the Ancient Star Catalog",
 * DIO 12, 3 (as reproduced from memory of the paper and its common citations):
 *   X = 1 / sin(h + 244 / (165 + 47 h^1.1)),  h = apparent altitude in degrees.
 * It fits the standard-atmosphere air mass tables to about 0.2% (Pickering's statement); tests
 * compare it with the independent Kasten & Young 1989 formula and with sec(z) high in the sky.
 */

const DEG = Math.PI / 180;

/**
 * Air mass (dimensionless, ≥ 1) at apparent altitude `apparentAltitudeDeg` (degrees). Domain [0, 90];
 * returns NaN below the apparent horizon (no air mass is defined there) and for NaN input. Method and
 * source: Pickering 2002 (see the module comment); X(90°) = 1 to 2e-7, X(0°) ≈ 38.8.
 */
export function airmassPickering(apparentAltitudeDeg: number): number {
  if (!(apparentAltitudeDeg >= 0)) return Number.NaN;
  const h = Math.min(apparentAltitudeDeg, 90);
  return 1 / Math.sin((h + 244 / (165 + 47 * h ** 1.1)) * DEG);
}

const INVERSE_MAX_ITERATIONS = 80;
const INVERSE_TOLERANCE_DEG = 1e-9;

/**
 * Apparent altitude (degrees, [0, 90]) at which the Pickering 2002 air mass equals `airmass`
 * (domain [1, X(0°)]; a limit beyond the horizon air mass returns 0, the horizon). Method: bisection
 * on the strictly decreasing X(h), tolerance 1e-9°, at most 80 iterations.
 */
export function apparentAltitudeForAirmassDeg(airmass: number): number {
  if (!(airmass >= 1)) throw new RangeError(`Air mass must be at least 1 (got ${airmass}).`);
  if (airmass >= airmassPickering(0)) return 0;
  let low = 0;
  let high = 90;
  for (let iteration = 0; iteration < INVERSE_MAX_ITERATIONS && high - low > INVERSE_TOLERANCE_DEG; iteration++) {
    const middle = (low + high) / 2;
    if (airmassPickering(middle) > airmass) low = middle;
    else high = middle;
  }
  return (low + high) / 2;
}
