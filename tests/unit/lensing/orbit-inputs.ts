/** Orbiting stars for the relativistic-orbit tests, as a target's fields (OrbitInputs). */
import type { OrbitInputs } from "@/lib/lensing/science-case-inputs";

/** A target without an orbiting star. */
export const noOrbit: OrbitInputs = {
  centralMassSolar: null,
  distancePc: null,
  semiMajorAxisAu: null,
  semiMajorAxisMas: null,
  eccentricity: null,
  periodDays: null,
  periapsisJdUtc: null,
  inclinationDeg: null,
  nodeDeg: null,
  periapsisArgumentDeg: null,
};

/**
 * S2 about Sgr A*, its elements as recalled from GRAVITY Collaboration 2020, A&A 636, L5 (from memory,
 * not re-checked): a = 125.058 mas, e = 0.884649, i = 134.567°, Ω = 228.171°, ω = 66.263°,
 * P = 16.0455 yr, M = 4.261 × 10⁶ M☉, R0 = 8246.7 pc (the periapsis time is left to each test).
 */
export const S2: OrbitInputs = {
  ...noOrbit,
  centralMassSolar: 4.261e6,
  distancePc: 8246.7,
  semiMajorAxisMas: 125.058,
  eccentricity: 0.884649,
  periodDays: 16.0455 * 365.25,
  inclinationDeg: 134.567,
  nodeDeg: 228.171,
  periapsisArgumentDeg: 66.263,
};
