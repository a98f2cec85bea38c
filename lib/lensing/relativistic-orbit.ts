/**
 * The orbit of a star (or pulsar) about a compact mass, for the relativistic-orbit science case: its
 * Keplerian elements, the relativistic effects an observer measures at periapsis, and its track on the
 * sky over one period, Newtonian and precessing.
 *
 * Units: masses in solar masses, lengths in au (and in M = GM/c² where named), angles on the sky in
 * mas or µas at the compact mass's distance, speeds in km/s, times in days or seconds as named, dates
 * as Julian dates UTC. The star is a test particle (its own mass neglected against the compact mass).
 *
 * Sky projection: the usual visual-binary convention. With the orbit-plane coordinates x (toward
 * periapsis) and y (toward the motion at periapsis), the offsets from the compact mass are
 *   north = A x + F y,   east = B x + G y,
 * with the Thiele–Innes constants (per unit length)
 *   A = cos ω cos Ω − sin ω sin Ω cos i,   B = cos ω sin Ω + sin ω cos Ω cos i,
 *   F = −sin ω cos Ω − cos ω sin Ω cos i,  G = −sin ω sin Ω + cos ω cos Ω cos i,
 * and the line-of-sight coordinate C x + H y, C = sin ω sin i, H = cos ω sin i (W. D. Heintz,
 * Double Stars, Reidel 1978, §4; R. M. Green, Spherical Astronomy, CUP 1985, §17 — from memory). Ω is
 * the position angle of the ascending node, from north through east; ω the argument of periapsis,
 * from the node in the direction of motion; i the inclination (i < 90°: the star moves counter-clockwise
 * on the sky, i.e. with increasing position angle). Angles at the distance D by the small-angle rule:
 * 1 au at 1 pc is 1″ (the parsec's definition, IAU 2015 Resolution B2).
 */

import { LRUCache } from "lru-cache";
import { AU_M, DAY_S, GM_SUN_M3_PER_S2, SOLAR_MASS_LENGTH_M, SPEED_OF_LIGHT_KM_PER_S, SPEED_OF_LIGHT_M_PER_S } from "@/lib/physics/constants";
import { traceBoundOrbit } from "@/lib/physics/orbit-tracer";
import { exactPeriastronAdvance, periastronAdvance } from "@/lib/physics/relativistic-effects";
import { PERIAPSIS_WINDOW_FRACTION } from "./feasibility-rules";
import type { OrbitInputs } from "./science-case-inputs";
import { numberWords } from "./science-case-words";

/** An offset on the sky from the compact mass, mas: east and north (position angle from north through east). */
export interface SkyPoint {
  eastMas: number;
  northMas: number;
}

/** A star's orbit about the compact mass, with its relativistic effects (see the module comment for units and conventions). */
export interface RelativisticOrbit {
  /** The compact mass, M☉, and where it came from: the target's lens mass, or Kepler's third law from the period. */
  massSolar: number;
  massFrom: "lens mass" | "period";
  /** Semi-major axis, au (given, or the angle given times the distance). */
  semiMajorAxisAu: number;
  /** Eccentricity, 0 < e < 1. */
  eccentricity: number;
  /**
   * Period, days: the period given, else Kepler's 2π √(a³/GM). (The coordinate-time radial period of
   * the Schwarzschild orbit differs from Kepler's by a relative O(GM/(c² a)), 5e-4 for S2.)
   */
  periodDays: number;
  /** Periapsis distance a(1 − e), au and in units of M = GM/c². */
  periapsisAu: number;
  periapsisM: number;
  /** Apoapsis distance a(1 + e), au. */
  apoapsisAu: number;
  /**
   * Periapsis advance per orbit, radians: the exact Schwarzschild value of the physics core
   * (exactPeriastronAdvance; C. Darwin 1961, Proc. R. Soc. A 263, 39), taking a and e as the
   * Schwarzschild-coordinate orbit with periapsis a(1 − e) and apoapsis a(1 + e).
   */
  precessionExactRad: number;
  /** The first-order advance 6πGM/(c² a (1 − e²)), radians (Einstein 1915). */
  precessionFirstOrderRad: number;
  /** Newtonian speed at periapsis, √(GM (1 + e)/(a (1 − e))) (vis-viva), km/s. */
  periapsisSpeedKmPerS: number;
  /**
   * The speed at periapsis a static observer there measures, exact for the Schwarzschild orbit (its
   * E and L: C. Cutler, D. Kennefick & E. Poisson 1994, Phys. Rev. D 50, 3816), km/s.
   */
  periapsisSpeedExactKmPerS: number;
  /**
   * Redshift at periapsis as c·z, km/s, first order in (v/c)² and GM/(c² r): the gravitational
   * GM/(c² r_p), the transverse Doppler v_p²/(2c²), and their sum (the post-Newtonian redshift of a star
   * on its orbit, as measured for S2 by the GRAVITY Collaboration 2018, A&A 615, L15). The first-order
   * line-of-sight Doppler shift, part of the Newtonian orbit, is not included. `exactKmPerS` is the
   * exact Schwarzschild value of the combined one, c (u^t − 1) at periapsis: the redshift of light that
   * leaves periapsis with no angular momentum (radially, across the star's motion), which a distant
   * observer receives without line-of-sight Doppler shift.
   */
  redshift: { gravitationalKmPerS: number; transverseDopplerKmPerS: number; combinedKmPerS: number; exactKmPerS: number };
  /**
   * Rømer delay: the range of the light-travel time across the orbit, s. With the inclination and the
   * argument of periapsis (`orientationGiven`), the range of the line-of-sight coordinate over the
   * orbit, 2a sin i √(1 − e² cos² ω) / c; without them its upper bound 2a/c (the major axis seen edge-on).
   */
  roemerDelayS: number;
  /**
   * Whether the inclination and argument of periapsis were given: then `roemerDelayS` and
   * `apoapsisShiftMicroarcsec` are the projected values, else their upper bounds (the orbit seen
   * edge-on along the major axis, and face-on).
   */
  orientationGiven: boolean;
  /**
   * Shift of the apoapsis' sky position over one orbit from the exact precession, µas: the chord
   * 2 a (1 + e) sin(Δφ/2) in the orbit plane, projected on the sky (its face-on length, an upper bound,
   * without the orientation); null without the distance.
   */
  apoapsisShiftMicroarcsec: number | null;
  /**
   * One period of the Newtonian ellipse on the sky, mas at the distance: `SKY_SAMPLES` points at true
   * anomalies 0°, 1°, …, 360° (periapsis first and last); null without the distance, the inclination,
   * the node and the argument of periapsis.
   */
  skyNewtonian: SkyPoint[] | null;
  /**
   * The same period with the periapsis advancing, from the physics core's exact Schwarzschild tracer
   * (traceBoundOrbit over one radial period): `SKY_SAMPLES` points uniform in the polar angle φ from
   * 0 to 2π + Δφ, periapsis first, apoapsis at the middle point, the next periapsis last. The tracer's
   * plane coordinates, in units of M with the first periapsis on +x and the motion toward +y, are
   * Schwarzschild r cos φ, r sin φ; times GM/c² in au they are the x, y of the projection above.
   * Null when `skyNewtonian` is.
   */
  skyPrecessing: SkyPoint[] | null;
}

/** The orbit, or a sentence naming the missing or unusable input in the user's words. */
export type RelativisticOrbitOutcome = { orbit: RelativisticOrbit } | { missing: string };

/** Points of each sky track over one period (odd, so that the middle one is the apoapsis). */
export const SKY_SAMPLES = 361;

const DEGREE_RAD = Math.PI / 180;

/** Degrees of the orientation angles, each null when not set. */
interface Orientation {
  inclinationRad: number;
  periapsisArgumentRad: number;
  nodeRad: number | null;
}

/** Kepler's third law for a test particle, GM = 4π² a³/P²: the mass in M☉ for a in au and P in days. */
function keplerMassSolar(semiMajorAxisAu: number, periodDays: number): number {
  const aM = semiMajorAxisAu * AU_M;
  const periodS = periodDays * DAY_S;
  return (4 * Math.PI * Math.PI * aM * aM * aM) / (periodS * periodS * GM_SUN_M3_PER_S2);
}

/** Kepler's period 2π √(a³/GM), days, for a in au and M in M☉. */
function keplerPeriodDays(massSolar: number, semiMajorAxisAu: number): number {
  const aM = semiMajorAxisAu * AU_M;
  return (2 * Math.PI * Math.sqrt((aM * aM * aM) / (massSolar * GM_SUN_M3_PER_S2))) / DAY_S;
}

/** "a, b and c". */
function listWords(items: string[]): string {
  return items.length <= 1 ? items.join("") : `${items.slice(0, -1).join(", ")} and ${items[items.length - 1]}`;
}

const isPositive = (value: number) => Number.isFinite(value) && value > 0;

/** The semi-major axis in au, or what is missing or wrong, in words. */
function semiMajorAxisOf(inputs: OrbitInputs): { au: number } | { missing: string } | { wrong: string } {
  const { semiMajorAxisAu, semiMajorAxisMas, distancePc } = inputs;
  if (semiMajorAxisAu !== null) return isPositive(semiMajorAxisAu) ? { au: semiMajorAxisAu } : { wrong: "The orbit's semi-major axis must be a length above 0." };
  if (semiMajorAxisMas === null) return { missing: "the orbit's semi-major axis (in au, or as an angle with the lens distance)" };
  if (!isPositive(semiMajorAxisMas)) return { wrong: "The orbit's semi-major axis must be an angle above 0." };
  if (distancePc === null) return { missing: "the lens distance (the semi-major axis is given as an angle)" };
  if (!isPositive(distancePc)) return { wrong: "The lens distance must be above 0." };
  // 1 au at 1 pc subtends 1″.
  return { au: (semiMajorAxisMas / 1000) * distancePc };
}

/** The inclination and argument of periapsis (and the node when set), or null when either is missing. */
function orientationOf(inputs: OrbitInputs): Orientation | null {
  const { inclinationDeg, periapsisArgumentDeg, nodeDeg } = inputs;
  if (inclinationDeg === null || periapsisArgumentDeg === null) return null;
  return { inclinationRad: inclinationDeg * DEGREE_RAD, periapsisArgumentRad: periapsisArgumentDeg * DEGREE_RAD, nodeRad: nodeDeg === null ? null : nodeDeg * DEGREE_RAD };
}

/** The orientation's fields, as the user names them. */
const orientationAngleWords: readonly [keyof OrbitInputs, string][] = [
  ["inclinationDeg", "orbit's inclination"],
  ["nodeDeg", "longitude of the ascending node"],
  ["periapsisArgumentDeg", "argument of periapsis"],
];

/** Thiele–Innes constants per unit length (see the module comment). */
interface ThieleInnes {
  a: number;
  b: number;
  f: number;
  g: number;
}

function thieleInnes(inclinationRad: number, nodeRad: number, periapsisArgumentRad: number): ThieleInnes {
  const cosW = Math.cos(periapsisArgumentRad);
  const sinW = Math.sin(periapsisArgumentRad);
  const cosN = Math.cos(nodeRad);
  const sinN = Math.sin(nodeRad);
  const cosI = Math.cos(inclinationRad);
  return {
    a: cosW * cosN - sinW * sinN * cosI,
    b: cosW * sinN + sinW * cosN * cosI,
    f: -sinW * cosN - cosW * sinN * cosI,
    g: -sinW * sinN + cosW * cosN * cosI,
  };
}

/** A point of the orbit plane (au) on the sky, mas at `masPerAu`. */
function skyPoint(constants: ThieleInnes, xAu: number, yAu: number, masPerAu: number): SkyPoint {
  return { eastMas: (constants.b * xAu + constants.g * yAu) * masPerAu, northMas: (constants.a * xAu + constants.f * yAu) * masPerAu };
}

/** The Newtonian ellipse at true anomalies 0°, 1°, …, 360°. */
function newtonianTrack(constants: ThieleInnes, semiLatusRectumAu: number, eccentricity: number, masPerAu: number): SkyPoint[] {
  const points: SkyPoint[] = [];
  for (let j = 0; j < SKY_SAMPLES; j++) {
    const anomaly = (2 * Math.PI * j) / (SKY_SAMPLES - 1);
    const r = semiLatusRectumAu / (1 + eccentricity * Math.cos(anomaly));
    points.push(skyPoint(constants, r * Math.cos(anomaly), r * Math.sin(anomaly), masPerAu));
  }
  return points;
}

/** One radial period of the exact Schwarzschild orbit from the tracer, its plane coordinates (units of M) scaled to au. */
function precessingTrack(constants: ThieleInnes, semiLatusRectumM: number, eccentricity: number, massAu: number, masPerAu: number): SkyPoint[] {
  const traced = traceBoundOrbit(semiLatusRectumM, eccentricity, 1, { orbits: 1, samples: SKY_SAMPLES });
  const points: SkyPoint[] = [];
  for (let j = 0; j < traced.count; j++) points.push(skyPoint(constants, traced.xy[2 * j] * massAu, traced.xy[2 * j + 1] * massAu, masPerAu));
  return points;
}

/**
 * The star at periapsis on the exact Schwarzschild orbit of semi-latus rectum p (units of M) and
 * eccentricity e, with the energy and angular momentum per unit mass of Cutler, Kennefick & Poisson
 * 1994 (M = 1): E² − 1 = −(1 − e²)(p − 4)/(p (p − 3 − e²)), L/r_p = (1 + e)/√(p − 3 − e²), r_p = p/(1 + e).
 * Returns u^t − 1 = (E − 1 + 2/r_p)/(1 − 2/r_p) (E − 1 from E² − 1, so that nothing cancels in the weak
 * field) and the speed a static observer at periapsis measures, (L/r_p) √(1 − 2/r_p)/E, in units of c.
 */
function periapsisExact(semiLatusRectumM: number, eccentricity: number): { utMinusOne: number; speedC: number } {
  const p = semiLatusRectumM;
  const e = eccentricity;
  const bound = p - 3 - e * e;
  const energySquaredMinusOne = (-(1 - e) * (1 + e) * (p - 4)) / (p * bound);
  const energy = Math.sqrt(1 + energySquaredMinusOne);
  const twoOverR = (2 * (1 + e)) / p;
  return {
    utMinusOne: (energySquaredMinusOne / (energy + 1) + twoOverR) / (1 - twoOverR),
    speedC: ((1 + e) * Math.sqrt(1 - twoOverR)) / (energy * Math.sqrt(bound)),
  };
}

/**
 * The apoapsis' displacement over one orbit, au: the apoapsis (−r_a, 0) turned by the advance Δφ
 * moves by (r_a (1 − cos Δφ), −r_a sin Δφ); projected on the sky its length is that of the vector
 * less its line-of-sight part C x + H y (the node only turns it on the sky).
 */
function apoapsisShiftAu(apoapsisAu: number, advanceRad: number, orientation: Orientation | null): number {
  const half = Math.sin(0.5 * advanceRad);
  const dx = 2 * apoapsisAu * half * half;
  const dy = -apoapsisAu * Math.sin(advanceRad);
  const inPlane = Math.hypot(dx, dy);
  if (orientation === null) return inPlane;
  const sinI = Math.sin(orientation.inclinationRad);
  const lineOfSight = sinI * (Math.sin(orientation.periapsisArgumentRad) * dx + Math.cos(orientation.periapsisArgumentRad) * dy);
  return Math.sqrt(Math.max(0, inPlane * inPlane - lineOfSight * lineOfSight));
}

/**
 * Rømer delay across the orbit, s: the line-of-sight coordinate a sin i [(cos E − e) sin ω +
 * √(1 − e²) sin E cos ω] ranges over 2a |sin i| √(1 − e² cos² ω) as the eccentric anomaly E runs;
 * without the orientation the bound 2a.
 */
function roemerDelayS(semiMajorAxisAu: number, eccentricity: number, orientation: Orientation | null): number {
  const rangeAu =
    orientation === null
      ? 2 * semiMajorAxisAu
      : 2 * semiMajorAxisAu * Math.abs(Math.sin(orientation.inclinationRad)) * Math.sqrt(1 - (eccentricity * Math.cos(orientation.periapsisArgumentRad)) ** 2);
  return (rangeAu * AU_M) / SPEED_OF_LIGHT_M_PER_S;
}

/**
 * The orbit of the star the target gives (OrbitInputs), with its relativistic effects, or a sentence
 * naming what is missing or unusable. Mass: the lens mass when given, else Kepler's third law from
 * the period and the semi-major axis. Semi-major axis: in au when given, else the angle times the
 * distance. Refused: a circular orbit (no periapsis to advance), e ≥ 1, and an orbit whose
 * semi-latus rectum a (1 − e²) is not above (6 + 2e) GM/c² (no stable bound orbit: C. Cutler,
 * D. Kennefick & E. Poisson 1994, Phys. Rev. D 50, 3816). Accuracy: the exact precession and the
 * precessing track to the physics core's 1e-15 relative, the exact periapsis redshift and speed to
 * a few ulp; the first-order quantities are exact formulas of their order (the redshift's neglected
 * terms are relative O(GM/(c² r_p))).
 */
export function relativisticOrbitOf(inputs: OrbitInputs): RelativisticOrbitOutcome {
  const key = JSON.stringify(inputs);
  const kept = orbitOutcomes.get(key);
  if (kept !== undefined) return kept;
  const outcome = orbitOutcomeOf(inputs);
  orbitOutcomes.set(key, outcome);
  return outcome;
}

/**
 * Outcomes already computed, by their inputs (all an outcome depends on, so a kept one is never stale):
 * a target page asks for its star's orbit four times (the inferred case, the photon budget's periapsis
 * window, the case's answers, the section), 0.5–20 ms each. Shared between callers: read, never change.
 */
const orbitOutcomes = new LRUCache<string, RelativisticOrbitOutcome>({ max: 128 });

function orbitOutcomeOf(inputs: OrbitInputs): RelativisticOrbitOutcome {
  const missing: string[] = [];
  const axis = semiMajorAxisOf(inputs);
  if ("wrong" in axis) return { missing: axis.wrong };
  if ("missing" in axis) missing.push(axis.missing);
  const { eccentricity, centralMassSolar, periodDays, distancePc } = inputs;
  if (eccentricity === null) missing.push("the orbit's eccentricity");
  else if (!(eccentricity >= 0 && eccentricity < 1)) return { missing: "The orbit's eccentricity must be at least 0 and below 1 (a bound orbit)." };
  else if (eccentricity === 0) return { missing: "A circular orbit (eccentricity 0) has no periapsis whose advance could be seen: set the orbit's eccentricity above 0." };
  if (centralMassSolar === null && periodDays === null) missing.push("the lens mass or the orbital period");
  if (!("au" in axis) || eccentricity === null || missing.length > 0) return { missing: `Set ${listWords(missing)} to compute the star's orbit.` };
  if (centralMassSolar !== null && !isPositive(centralMassSolar)) return { missing: "The lens mass must be above 0." };
  if (periodDays !== null && !isPositive(periodDays)) return { missing: "The orbital period must be above 0." };
  if (distancePc !== null && !isPositive(distancePc)) return { missing: "The lens distance must be above 0." };
  const unreadAngle = orientationAngleWords.find(([field]) => inputs[field] !== null && !Number.isFinite(inputs[field]));
  if (unreadAngle !== undefined) return { missing: `The ${unreadAngle[1]} must be an angle in degrees.` };

  const aAu = axis.au;
  const e = eccentricity;
  const massSolar = centralMassSolar ?? keplerMassSolar(aAu, periodDays!);
  const massAu = (massSolar * SOLAR_MASS_LENGTH_M) / AU_M;
  const periapsisAu = aAu * (1 - e);
  const semiLatusRectumAu = aAu * (1 - e) * (1 + e);
  const semiLatusRectumM = semiLatusRectumAu / massAu;
  if (!(massSolar > 0 && Number.isFinite(semiLatusRectumM))) {
    return { missing: "The lens mass (or the mass the period gives) is too small against the orbit for its relativistic effects to be computed: check the lens mass or the orbital period." };
  }
  if (!(semiLatusRectumM > 6 + 2 * e)) {
    return {
      missing: `The star would pass within ${numberWords(periapsisAu / massAu)} GM/c² of the compact mass, inside the last stable orbits (a (1 − e²) must exceed (6 + 2e) GM/c²): check the semi-major axis, the eccentricity and the lens mass or period.`,
    };
  }
  const periapsisM = periapsisAu / massAu;
  const precessionExactRad = exactPeriastronAdvance(massSolar, aAu, e);
  // v_p²/c² = (M/r_p)(1 + e); z_grav = M/r_p; z_TD = v_p²/(2c²)
  const gravitational = 1 / periapsisM;
  const transverseDoppler = (0.5 * (1 + e)) / periapsisM;
  const exact = periapsisExact(semiLatusRectumM, e);
  const orientation = orientationOf(inputs);
  const apoapsisAu = aAu * (1 + e);
  const masPerAu = distancePc === null ? null : 1000 / distancePc;
  const constants = orientation === null || orientation.nodeRad === null ? null : thieleInnes(orientation.inclinationRad, orientation.nodeRad, orientation.periapsisArgumentRad);
  const canDraw = constants !== null && masPerAu !== null;
  return {
    orbit: {
      massSolar,
      massFrom: centralMassSolar === null ? "period" : "lens mass",
      semiMajorAxisAu: aAu,
      eccentricity: e,
      periodDays: periodDays ?? keplerPeriodDays(massSolar, aAu),
      periapsisAu,
      periapsisM,
      apoapsisAu,
      precessionExactRad,
      precessionFirstOrderRad: periastronAdvance(massSolar, aAu, e),
      periapsisSpeedKmPerS: SPEED_OF_LIGHT_KM_PER_S * Math.sqrt((1 + e) / periapsisM),
      periapsisSpeedExactKmPerS: SPEED_OF_LIGHT_KM_PER_S * exact.speedC,
      redshift: {
        gravitationalKmPerS: SPEED_OF_LIGHT_KM_PER_S * gravitational,
        transverseDopplerKmPerS: SPEED_OF_LIGHT_KM_PER_S * transverseDoppler,
        combinedKmPerS: SPEED_OF_LIGHT_KM_PER_S * (gravitational + transverseDoppler),
        exactKmPerS: SPEED_OF_LIGHT_KM_PER_S * exact.utMinusOne,
      },
      roemerDelayS: roemerDelayS(aAu, e, orientation),
      orientationGiven: orientation !== null,
      apoapsisShiftMicroarcsec: masPerAu === null ? null : apoapsisShiftAu(apoapsisAu, precessionExactRad, orientation) * masPerAu * 1000,
      skyNewtonian: canDraw ? newtonianTrack(constants, semiLatusRectumAu, e, masPerAu) : null,
      skyPrecessing: canDraw ? precessingTrack(constants, semiLatusRectumM, e, massAu, masPerAu) : null,
    },
  };
}

/**
 * The first periapsis passage at or after `afterJdUtc`, Julian date UTC: periapsisJdUtc + k P for
 * the least integer k that reaches it (k may be negative: the time given may lie after `afterJdUtc`).
 * Domain: finite dates; the orbit's period > 0.
 */
export function nextPeriapsisJdUtc(orbit: RelativisticOrbit, periapsisJdUtc: number, afterJdUtc: number): number {
  if (!Number.isFinite(periapsisJdUtc) || !Number.isFinite(afterJdUtc)) throw new RangeError(`nextPeriapsisJdUtc: dates must be finite, got ${periapsisJdUtc} and ${afterJdUtc}`);
  const period = orbit.periodDays;
  const passage = periapsisJdUtc + Math.ceil((afterJdUtc - periapsisJdUtc) / period) * period;
  // (after − T0)/P rounded down across an integer puts the passage one period early
  return passage < afterJdUtc ? passage + period : passage;
}

/** A periapsis passage a campaign aims at: its date (Julian date UTC) and the half-width of its window, days. */
export interface PeriapsisPassage {
  jdUtc: number;
  windowHalfDays: number;
}

/**
 * The passage a campaign starting at `afterJdUtc` aims at: the next periapsis (nextPeriapsisJdUtc) and
 * its window, ±PERIAPSIS_WINDOW_FRACTION of the period (feasibility-rules.ts).
 */
export function periapsisPassage(orbit: RelativisticOrbit, periapsisJdUtc: number, afterJdUtc: number): PeriapsisPassage {
  return { jdUtc: nextPeriapsisJdUtc(orbit, periapsisJdUtc, afterJdUtc), windowHalfDays: PERIAPSIS_WINDOW_FRACTION * orbit.periodDays };
}
