/**
 * From a catalogue (ICRS) direction to the apparent direction of date: annual aberration, then
 * precession and nutation. The rotation and the Earth's velocity come from astronomy-engine once per
 * epoch and are shared by every target, so each target costs a handful of multiplications.
 */
import { Body, BaryState, C_AUDAY, Rotation_EQJ_EQD } from "astronomy-engine";
import { astroTimeFromJdUtc } from "./time";

const DEG = Math.PI / 180;

/** What one epoch contributes to every target's apparent place. */
export interface ApparentPlaceContext {
  /** The epoch, Julian date UTC. */
  jdUtc: number;
  /** Row-major 3×3 rotation from the J2000 mean equator (≈ ICRS to 0.02″) to the true equator of date. */
  rotation: Float64Array;
  /** Earth's barycentric velocity divided by c, J2000 equatorial axes (dimensionless, ~1e-4). */
  velocityOverC: Float64Array;
}

/**
 * The apparent-place context at `jdUtc` (Julian date UTC). Precession–nutation: astronomy-engine's
 * `Rotation_EQJ_EQD` (IAU 2006 precession, abridged IAU 2000B nutation). Earth's velocity:
 * `BaryState(Body.Earth)`. Good to better than 1″ over ±1 day around the epoch (precession moves a
 * star by 0.14″ per day), so one context serves a whole night.
 */
export function apparentPlaceContext(jdUtc: number): ApparentPlaceContext {
  const time = astroTimeFromJdUtc(jdUtc);
  const { rot } = Rotation_EQJ_EQD(time);
  // astronomy-engine applies rot[j][i] to component j when producing component i (RotateVector).
  const rotation = new Float64Array([
    rot[0][0], rot[1][0], rot[2][0],
    rot[0][1], rot[1][1], rot[2][1],
    rot[0][2], rot[1][2], rot[2][2],
  ]);
  const earth = BaryState(Body.Earth, time);
  const velocityOverC = new Float64Array([earth.vx / C_AUDAY, earth.vy / C_AUDAY, earth.vz / C_AUDAY]);
  return { jdUtc, rotation, velocityOverC };
}

/**
 * Writes into `out` (length ≥ 3) the unit vector, true equator and equinox of date, toward a star at
 * ICRS `raDeg`, `decDeg` (degrees) as seen from the Earth at the context's epoch. Method: first-order
 * annual aberration u' = (u + v/c)/|u + v/c| (error < 0.001″), then the precession–nutation rotation.
 * Omits light deflection by the Sun (< 0.02″ beyond 45° from it), diurnal aberration (≤ 0.3″),
 * proper motion and parallax (catalogue position taken as of date).
 */
export function apparentDirectionOfDate(context: ApparentPlaceContext, raDeg: number, decDeg: number, out: Float64Array): Float64Array {
  const cosDec = Math.cos(decDeg * DEG);
  const v = context.velocityOverC;
  let x = cosDec * Math.cos(raDeg * DEG) + v[0];
  let y = cosDec * Math.sin(raDeg * DEG) + v[1];
  let z = Math.sin(decDeg * DEG) + v[2];
  const norm = Math.hypot(x, y, z);
  x /= norm;
  y /= norm;
  z /= norm;
  const m = context.rotation;
  out[0] = m[0] * x + m[1] * y + m[2] * z;
  out[1] = m[3] * x + m[4] * y + m[5] * z;
  out[2] = m[6] * x + m[7] * y + m[8] * z;
  return out;
}

/** Right ascension (degrees, [0, 360)) and declination (degrees) of a unit vector. */
export function sphericalFromDirection(direction: ArrayLike<number>): { raDeg: number; decDeg: number } {
  const raDeg = (Math.atan2(direction[1], direction[0]) / DEG + 360) % 360;
  const decDeg = Math.asin(Math.max(-1, Math.min(1, direction[2]))) / DEG;
  return { raDeg, decDeg };
}
