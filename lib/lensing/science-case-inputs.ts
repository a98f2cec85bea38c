/**
 * The science cases' ids and what the proposal and the target give the cases' questions: the event's
 * timing, the instrument, the campaign and an orbiting star. Shapes only (no logic), imported by the
 * questions, the photon budget and the schema alike.
 */

/** The case ids, once: a tuple for zod and database enums. */
export const scienceCaseIds = ["photometric-microlensing", "astrometric-microlensing", "resolved-images", "time-delay", "horizon-scale", "relativistic-orbit"] as const;

export type ScienceCaseId = (typeof scienceCaseIds)[number];

/** The event's timing and source, for the microlensing cases. */
export interface EventTiming {
  /** Time of the closest approach (the peak), Julian date UTC; null when not set. */
  peakJdUtc: number | null;
  /** Impact parameter u0, units of θ_E, ≥ 0; null when not set. */
  impactParameterThetaE: number | null;
  /** The source's angular radius in units of θ_E, ρ = θ_s / θ_E, ≥ 0; null for a point source (radius not set). */
  sourceRadiusThetaE: number | null;
  /** Linear limb-darkening coefficient a of I(r) ∝ 1 − a(1 − √(1 − r²)), 0 ≤ a ≤ 1 (0: uniform disk). */
  limbDarkeningU: number;
}

/** The instrument's side of the comparisons; each setting null when the proposal does not give it. */
export interface InstrumentSettings {
  /** Resolution of a single telescope: the PSF's FWHM, mas. */
  psfFwhmMas: number | null;
  /** An interferometer: observing wavelength (mm) and longest baseline (km), both or none. */
  interferometer: { wavelengthMm: number; longestBaselineKm: number } | null;
  /** Astrometric precision of one epoch (one visit), mas. */
  astrometricPrecisionMas: number | null;
  /**
   * Reachable contrast: the largest flux ratio, brighter over fainter (≥ 1), at which the fainter of two
   * images is still detected beside the brighter. A contrast given as Δm magnitudes is 10^(0.4 Δm).
   */
  reachableContrast: number | null;
  /** Radial-velocity precision of one spectroscopic epoch, km/s. */
  spectroscopicPrecisionKmPerS: number | null;
}

/** The campaign's span and pace. */
export interface CampaignSettings {
  /** Length of the monitoring campaign, days; null to use the cycle's length from the schedule. */
  lengthDays: number | null;
  /** Time between visits the proposal asks for, hours; null when not set. */
  cadenceHours: number | null;
}

/**
 * A star (or pulsar) orbiting the compact lens, as the target gives it, for the relativistic-orbit
 * case; each value null when not set.
 */
export interface OrbitInputs {
  /** The compact mass, M☉ (the target's lens mass); null to take it from the period (Kepler's third law). */
  centralMassSolar: number | null;
  /** Distance to the compact mass, pc (the target's lens distance), for angles on the sky. */
  distancePc: number | null;
  /** Semi-major axis, au; null to read it from `semiMajorAxisMas`. */
  semiMajorAxisAu: number | null;
  /** Semi-major axis as an angle at `distancePc`, mas (used when `semiMajorAxisAu` is null). */
  semiMajorAxisMas: number | null;
  /** Eccentricity, 0 ≤ e < 1. */
  eccentricity: number | null;
  /** Orbital period, days (used for the mass when `centralMassSolar` is null). */
  periodDays: number | null;
  /** A time of periapsis passage, Julian date UTC. */
  periapsisJdUtc: number | null;
  /** Inclination, longitude of the ascending node and argument of periapsis, degrees (the usual visual-binary convention). */
  inclinationDeg: number | null;
  nodeDeg: number | null;
  periapsisArgumentDeg: number | null;
}
