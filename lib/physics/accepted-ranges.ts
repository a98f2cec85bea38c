/**
 * The ranges of lens inputs the lensing layer accepts, and the one check across inputs. Each bound
 * keeps every derived quantity (θ_E, t_E, delays, magnifications, cosmological distances) a finite,
 * normal double and inside the domain of the formula that computes it; inside the bounds the physics
 * functions never throw. The bounds are ours (named "our rule" below) and generous: each lies well
 * beyond the objects astronomers observe, with the physical reason beside it.
 */

import { PARSEC_M, SOLAR_MASS_LENGTH_M } from "./constants";
import { formatExactForPeople } from "@/lib/numbers/significant";

/** A closed range of accepted values, in the unit the key names. */
export interface AcceptedRange {
  min: number;
  max: number;
}

export const acceptedRanges = {
  /**
   * Lens mass, M☉. Our rule: from 1e-15 M☉ (2e15 kg, a kilometre-sized body; the lightest lenses
   * searched for are asteroid-mass primordial black holes near 1e-12 M☉) to 1e16 M☉ (ten times the
   * most massive galaxy clusters).
   */
  lensMassSolar: { min: 1e-15, max: 1e16 },
  /**
   * Lens or source distance, pc. Our rule: from 1e-6 pc (0.2 au: the Sun as a lens is seen from 1 au)
   * to 2e10 pc (20 Gpc, beyond the comoving radius of the observable universe, about 14 Gpc; farther
   * lenses are given by redshift).
   */
  distancePc: { min: 1e-6, max: 2e10 },
  /**
   * Velocity dispersion of an isothermal lens, km/s. Our rule: from 1 km/s (below the faintest dwarf
   * galaxies, a few km/s) to 3,000 km/s (twice the richest galaxy clusters, about 1,500 km/s).
   */
  velocityDispersionKmPerS: { min: 1, max: 3000 },
  /**
   * Relative lens-source proper motion, mas/yr. Our rule: from 1e-6 mas/yr (a nanoarcsecond a year)
   * to 1e10 mas/yr (the Sun crosses the sky at about 1.3e9 mas/yr as seen from the Earth).
   */
  properMotionMasPerYr: { min: 1e-6, max: 1e10 },
  /**
   * Cosmological redshift of a lens or a source. Our rule: from 0.001 (about 4 Mpc; nearer, peculiar
   * velocities rival the Hubble flow and a distance in parsecs is the better input) to 20 (beyond the
   * most distant sources lensed).
   */
  redshift: { min: 0.001, max: 20 },
  /**
   * Source offset from the lens, in Einstein radii. Our rule: from 1e-6 (a point-source magnification
   * of about a million, far above the highest observed in microlensing events, a few thousand; a
   * real source's finite size caps it) to 1,000 (where the lensing magnification is 1 + 2e-12).
   */
  sourceOffsetThetaE: { min: 1e-6, max: 1000 },
  /**
   * Einstein time t_E measured by a light-curve fit, days. Our rule: from 0.001 d (86 s; the shortest
   * events reported, of free-floating planet candidates, last hours, from memory) to 100,000 d (about
   * 270 years; the longest events followed last a few years). Inside it every event window, schedule
   * count and photon budget stays finite, as for the t_E that the proper-motion range gives.
   */
  einsteinTimeDays: { min: 1e-3, max: 1e5 },
  /**
   * Each component (north, east) of the microlens parallax vector π_E, measured by a fit. Our rule:
   * |π_E,N|, |π_E,E| ≤ 100 (π_E = π_rel/θ_E reaches a few for a nearby stellar lens and tens for a
   * planetary-mass lens within a kiloparsec, from memory).
   */
  microlensParallaxComponent: { min: -100, max: 100 },
  /**
   * Semi-major axis of a star (or pulsar) orbiting the compact lens, au. Our rule: from 1e-4 au
   * (15,000 km; the tightest neutron-star binaries have a ≈ 0.005 au, from memory) to 1e5 au (0.5 pc;
   * wider orbits around a compact mass take longer than ~10⁴ years even around 4 × 10⁶ M☉).
   */
  orbitSemiMajorAxisAu: { min: 1e-4, max: 1e5 },
  /**
   * The same semi-major axis as an angle at the lens distance, mas. Our rule: from 0.001 mas (1 µas,
   * below the finest astrometry of an epoch, tens of µas) to 1,000,000 mas (1000″, about 17′).
   */
  orbitSemiMajorAxisMas: { min: 1e-3, max: 1e6 },
  /**
   * Orbital eccentricity. Our rule: from 0 (a circle) to 0.9999: a bound orbit has e < 1 (1 is a
   * parabola), and 1 − e ≥ 10⁻⁴ keeps the periapsis a finite, representable fraction of the axis.
   */
  orbitEccentricity: { min: 0, max: 0.9999 },
  /**
   * Orbital period, days. Our rule: from 0.001 d (86 s; the shortest known binary periods are a few
   * minutes, from memory) to 10,000,000 d (about 27,000 years; no longer period is followed).
   */
  orbitPeriodDays: { min: 1e-3, max: 1e7 },
  /**
   * Inclination of the orbit to the sky, degrees: 0 to 180 (the visual-binary convention; above 90°
   * the motion on the sky is clockwise). Common practice.
   */
  orbitInclinationDeg: { min: 0, max: 180 },
  /** Longitude of the ascending node and argument of periapsis, degrees: one turn, 0 to 360 (common practice). */
  orbitAngleDeg: { min: 0, max: 360 },
} as const satisfies Record<string, AcceptedRange>;

/**
 * A bound as a user reads it and may type it back: "1000", "20 000 000 000", "0.001", "1 × 10⁻⁶",
 * "1 × 10¹⁶" (powers of ten as every number for people is written: `formatExactForPeople`).
 * Digits are grouped in threes by a narrow no-break space from five digits on (SI Brochure, 9th ed.,
 * §5.4.4), never by a comma: the quantity parser refuses "3,000" as ambiguous (3000 or 3.000).
 */
export function boundText(value: number): string {
  if (!(value >= 1e-3 && value < 1e12)) return formatExactForPeople(value);
  const [whole, fraction] = String(Number(value.toFixed(6))).split(".");
  let grouped = whole;
  if (whole.length > 4) for (let end = whole.length - 3; end > 0; end -= 3) grouped = `${grouped.slice(0, end)}\u202f${grouped.slice(end)}`;
  return fraction === undefined ? grouped : `${grouped}.${fraction}`;
}

/** "1 × 10⁻⁶ and 1000": a range as the bench's messages say it. */
export function rangeText(range: AcceptedRange): string {
  return `${boundText(range.min)} and ${boundText(range.max)}`;
}

/** True when `value` is a finite number inside `range` (NaN is outside). */
export function isInRange(value: number, range: AcceptedRange): boolean {
  return value >= range.min && value <= range.max;
}

/**
 * Largest lens compactness GM/(c² D_L) accepted. Our rule: the thin-lens, weak-field formulas (and
 * the exact lens equation's far-field set-up, which needs D_L ≫ b_c = 5.2 GM/c²) hold only for a lens
 * far from the observer compared with its gravitational radius; 1e-4 keeps θ_E below 0.02 rad (1.1°).
 * The Sun seen from the Earth is 1e-8.
 */
export const MAX_LENS_COMPACTNESS = 1e-4;

/** GM/(c² D_L), dimensionless, for a mass in M☉ and a lens distance in pc. */
export function lensCompactness(massSolar: number, dLensPc: number): number {
  return (massSolar * SOLAR_MASS_LENGTH_M) / (dLensPc * PARSEC_M);
}
