/**
 * Annual microlens parallax: the Sun's position seen from the Earth, projected on the sky at the
 * event, and its offsets from uniform motion (A. Gould 2004, ApJ 606, 319, §2: the geocentric frame
 * at t0,par). Times are Julian dates (days; the time scale's seconds do not matter here: the Earth
 * moves ~2e-6 au in a minute); positions in au.
 */

import { Body, HelioVector } from "astronomy-engine";
import { astroTimeFromJdUtc } from "@/lib/astro/time";

/** Half-step (days) of the central difference giving the Sun's projected velocity at t0,par: truncation ~ (h/58 d)²/6 ≈ 5e-9 relative. */
const VELOCITY_HALF_STEP_DAYS = 0.01;

/** North and east unit vectors of the sky at (α, δ), J2000 equatorial axes. */
function skyAxes(raDeg: number, decDeg: number): { north: number[]; east: number[] } {
  const ra = (raDeg * Math.PI) / 180;
  const dec = (decDeg * Math.PI) / 180;
  return {
    north: [-Math.sin(dec) * Math.cos(ra), -Math.sin(dec) * Math.sin(ra), Math.cos(dec)],
    east: [-Math.sin(ra), Math.cos(ra), 0],
  };
}

/**
 * The Sun's geometric position relative to the Earth's centre (the Earth's heliocentric vector from
 * astronomy-engine, negated; no light time, no aberration), projected on the sky at right ascension
 * `raDeg` and declination `decDeg` (J2000, degrees): its north and east components in au, at the
 * Julian date `jd`. Accuracy: astronomy-engine's (VSOP87 truncated, ~1e-6 au for the Earth).
 */
export function projectedSunAu(jd: number, raDeg: number, decDeg: number): { northAu: number; eastAu: number } {
  const earth = HelioVector(Body.Earth, astroTimeFromJdUtc(jd));
  const { north, east } = skyAxes(raDeg, decDeg);
  return {
    northAu: -(earth.x * north[0] + earth.y * north[1] + earth.z * north[2]),
    eastAu: -(earth.x * east[0] + earth.y * east[1] + earth.z * east[2]),
  };
}

/**
 * Gould 2004's Δs(t) = s(t) − s(t0,par) − (t − t0,par) ṡ(t0,par) for each time `tDays` (Julian
 * dates), s the projected Sun (projectedSunAu), north and east components in au. With them the
 * light curve's trajectory is τ = (t − t0)/t_E + π_E·Δs, β = u0 + π_E × Δs (Gould 2004 eq. 5; the
 * cross product a × b = a_N b_E − a_E b_N).
 */
export function parallaxOffsetsAu(tDays: ArrayLike<number>, raDeg: number, decDeg: number, t0ParDays: number): { north: Float64Array; east: Float64Array } {
  const at = projectedSunAu(t0ParDays, raDeg, decDeg);
  const before = projectedSunAu(t0ParDays - VELOCITY_HALF_STEP_DAYS, raDeg, decDeg);
  const after = projectedSunAu(t0ParDays + VELOCITY_HALF_STEP_DAYS, raDeg, decDeg);
  const velocityNorth = (after.northAu - before.northAu) / (2 * VELOCITY_HALF_STEP_DAYS);
  const velocityEast = (after.eastAu - before.eastAu) / (2 * VELOCITY_HALF_STEP_DAYS);
  const north = new Float64Array(tDays.length);
  const east = new Float64Array(tDays.length);
  for (let i = 0; i < tDays.length; i++) {
    const s = projectedSunAu(tDays[i], raDeg, decDeg);
    const dt = tDays[i] - t0ParDays;
    north[i] = s.northAu - at.northAu - dt * velocityNorth;
    east[i] = s.eastAu - at.eastAu - dt * velocityEast;
  }
  return { north, east };
}
