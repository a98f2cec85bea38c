/**
 * One target on one night's grid: altitudes, hours above a limit in darkness, culmination, rising
 * and setting. Everything here is cheap arithmetic on the shared grid; nothing calls the ephemeris.
 */
import { RISE_SET_GEOMETRIC_ALTITUDE_DEG, SIDEREAL_RATE_DEG_PER_DAY } from "./constants";
import type { NightGrid } from "./night-grid";

const DEG = Math.PI / 180;

/**
 * Writes sin(geometric altitude) of the target with apparent unit vector `direction` (true equator
 * of date) into `out[k]` for samples `from` ≤ k ≤ `to`: sin(alt) = sinφ z + cosφ (x cos LST + y sin LST),
 * the spherical-astronomy relation sin(alt) = sinφ sinδ + cosφ cosδ cos(LST − α).
 */
export function fillSineAltitudes(grid: NightGrid, direction: ArrayLike<number>, out: Float64Array, from: number, to: number): void {
  const a = grid.sinLatitude * direction[2];
  const b = grid.cosLatitude * direction[0];
  const c = grid.cosLatitude * direction[1];
  const { cosLst, sinLst } = grid;
  for (let k = from; k <= to; k++) out[k] = a + b * cosLst[k] + c * sinLst[k];
}

/**
 * Hours (h) of astronomical darkness in which the target's geometric altitude is at or above the
 * limit whose sine is `sinLimit`, given `sineAltitudes` filled at least over the grid's dark samples.
 * Method: per sample step, the overlap of the dark fraction with the fraction above the limit, both
 * linear inside the step; error ≲ 1 minute per crossing with a 5-minute step.
 */
export function hoursAboveInDarkness(grid: NightGrid, sineAltitudes: Float64Array, sinLimit: number): number {
  let stepFraction = 0;
  const { darkStepIndex, darkFrom, darkTo } = grid;
  // Inlined form of `fractionAtOrBelowZero` (this loop runs for every target on every night).
  for (let i = 0; i < grid.darkStepCount; i++) {
    const k = darkStepIndex[i];
    const a = sineAltitudes[k] - sinLimit;
    const b = sineAltitudes[k + 1] - sinLimit;
    let upFrom = 0;
    let upTo = 1;
    if (a < 0 && b < 0) continue;
    if (a < 0) upFrom = a / (a - b);
    else if (b < 0) upTo = a / (a - b);
    const overlap = Math.min(upTo, darkTo[i]) - Math.max(upFrom, darkFrom[i]);
    if (overlap > 0) stepFraction += overlap;
  }
  return stepFraction * grid.stepDays * 24;
}

/**
 * The nightly Sun rule: whether the target with apparent unit vector `direction` is closer to the
 * Sun than the safe elongation (given as its cosine, `cosSafeElongation`) at the middle of the
 * grid's window. One value per night: the Sun moves about 1° a day.
 */
export function isTooCloseToSun(grid: NightGrid, direction: ArrayLike<number>, cosSafeElongation: number): boolean {
  const sun = grid.sunDirectionMid;
  return direction[0] * sun[0] + direction[1] * sun[1] + direction[2] * sun[2] > cosSafeElongation;
}

/**
 * Geometric altitude (degrees) of a star at declination `decDeg` at upper culmination from geodetic
 * latitude `latitudeDeg`: 90° − |φ − δ| (spherical astronomy; aberration and precession move it
 * by well under 1′).
 */
export function upperCulminationAltitudeDeg(latitudeDeg: number, decDeg: number): number {
  return 90 - Math.abs(latitudeDeg - decDeg);
}

/** Culmination and horizon passages of a target around one night. */
export interface TargetPassages {
  /** Upper culmination (hour angle 0) inside the window, Julian date UTC. */
  transitJdUtc: number;
  /** Geometric altitude at upper culmination, degrees. */
  transitAltitudeDeg: number;
  /** Rising before and setting after that culmination, Julian date UTC; null if it never crosses. */
  riseJdUtc: number | null;
  setJdUtc: number | null;
  /** Always above the horizon (−34′ geometric) or always below it at this latitude. */
  isCircumpolar: boolean;
  isNeverRising: boolean;
}

/**
 * Transit, rise and set of the target with apparent unit vector `direction` (true equator of date).
 * Transit: LST = α, solved on the grid's sidereal time (linear at the sidereal rate between samples,
 * exact to well under a second); if two culminations fall in the window, the one nearer the middle of
 * the dark hours (else of the window) is taken. Rise and set: hour angle H₀ from
 * cos H₀ = (sin h₀ − sinφ sinδ)/(cosφ cosδ) with h₀ = −34′ geometric (standard horizon refraction,
 * common practice), the target's place held fixed over the day (it moves < 0.2″).
 */
export function targetPassages(grid: NightGrid, direction: ArrayLike<number>): TargetPassages {
  const raDeg = (Math.atan2(direction[1], direction[0]) / DEG + 360) % 360;
  const sinDec = Math.max(-1, Math.min(1, direction[2]));
  const decDeg = Math.asin(sinDec) / DEG;
  const cosDec = Math.sqrt(1 - sinDec * sinDec);

  const reference = grid.midDarkJdUtc;
  const hourAngleAtStart = (((grid.lstDeg[0] - raDeg) % 360) + 360) % 360;
  const firstTransit = grid.startJdUtc + (360 - hourAngleAtStart) / SIDEREAL_RATE_DEG_PER_DAY;
  const candidates = [firstTransit, firstTransit + 360 / SIDEREAL_RATE_DEG_PER_DAY, firstTransit - 360 / SIDEREAL_RATE_DEG_PER_DAY]
    .filter((jd) => jd >= grid.startJdUtc && jd <= grid.startJdUtc + 1);
  let transitJdUtc = candidates[0] ?? firstTransit;
  for (const candidate of candidates) {
    if (Math.abs(candidate - reference) < Math.abs(transitJdUtc - reference)) transitJdUtc = candidate;
  }
  // The grid's sidereal time includes nutation in right ascension; correct the constant-rate guess
  // with the residual hour angle at the nearest sample.
  const k = Math.min(grid.sampleCount - 1, Math.max(0, Math.round((transitJdUtc - grid.startJdUtc) / grid.stepDays)));
  const lstAtTransit = grid.lstDeg[k] + (transitJdUtc - grid.jdUtc[k]) * SIDEREAL_RATE_DEG_PER_DAY;
  const residualDeg = ((((lstAtTransit - raDeg) % 360) + 540) % 360) - 180;
  transitJdUtc -= residualDeg / SIDEREAL_RATE_DEG_PER_DAY;

  const phi = Math.asin(grid.sinLatitude) / DEG;
  const transitAltitudeDeg = 90 - Math.abs(phi - decDeg);
  const denominator = grid.cosLatitude * cosDec;
  const cosH0 = denominator > 1e-12
    ? (Math.sin(RISE_SET_GEOMETRIC_ALTITUDE_DEG * DEG) - grid.sinLatitude * sinDec) / denominator
    // At a pole or for a target at a pole the altitude never changes: decide by its constant value.
    : (transitAltitudeDeg >= RISE_SET_GEOMETRIC_ALTITUDE_DEG ? -2 : 2);
  if (cosH0 <= -1 || cosH0 >= 1) {
    return { transitJdUtc, transitAltitudeDeg, riseJdUtc: null, setJdUtc: null, isCircumpolar: cosH0 <= -1, isNeverRising: cosH0 >= 1 };
  }
  const halfArcDays = Math.acos(cosH0) / DEG / SIDEREAL_RATE_DEG_PER_DAY;
  return {
    transitJdUtc,
    transitAltitudeDeg,
    riseJdUtc: transitJdUtc - halfArcDays,
    setJdUtc: transitJdUtc + halfArcDays,
    isCircumpolar: false,
    isNeverRising: false,
  };
}
