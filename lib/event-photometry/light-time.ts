/**
 * Heliocentric and barycentric Julian dates (HJD, BJD) back to the geocentre: the Rømer delay, the
 * light-travel time between the Earth's centre and the Sun or the Solar System barycentre along the
 * target's direction, Δ = r·n̂ / c (r the Earth's position relative to the Sun or barycentre, n̂ the
 * unit vector to the target), so that HJD = JD + Δ_sun and BJD = JD + Δ_bary in the same time
 * scale (J. Eastman, R. Siverd & B. S. Gaudi 2010, PASP 122, 935, eq. 2 without the Shapiro and
 * Einstein terms, which astropy's `Time.light_travel_time` also leaves out). The Earth's position is
 * astronomy-engine's (VSOP87, J2000 equator ≈ ICRS axes); the delays agree with astropy's (ERFA
 * epv00 ephemeris) to 3 ms (HJD) and 6 ms (BJD), tests/unit/event-photometry/conversions.test.ts. Times are Julian dates (days).
 */
import { AstroTime, BaryState, Body, C_AUDAY, HelioVector } from "astronomy-engine";
import { J2000_JD } from "@/lib/astro/constants";

/** The origin an HJD or BJD is counted at. */
export type LightTimeOrigin = "sun" | "barycentre";

/** Unit vector to right ascension `raDeg`, declination `decDeg` (ICRS, degrees). */
function direction(raDeg: number, decDeg: number): [number, number, number] {
  const ra = (raDeg * Math.PI) / 180;
  const dec = (decDeg * Math.PI) / 180;
  return [Math.cos(dec) * Math.cos(ra), Math.cos(dec) * Math.sin(ra), Math.sin(dec)];
}

/**
 * Rømer delay (days) of the geocentre relative to `origin` towards (`raDeg`, `decDeg`) at the TT
 * Julian date `jdTt`: positive when the Earth is nearer the target than the origin is.
 */
export function roemerDelayDays(jdTt: number, origin: LightTimeOrigin, raDeg: number, decDeg: number): number {
  const time = AstroTime.FromTerrestrialTime(jdTt - J2000_JD);
  const earth = origin === "sun" ? HelioVector(Body.Earth, time) : BaryState(Body.Earth, time);
  const [x, y, z] = direction(raDeg, decDeg);
  return (earth.x * x + earth.y * y + earth.z * z) / C_AUDAY;
}

/**
 * The geocentric Julian date of the heliocentric or barycentric Julian date `jd` (same time scale),
 * towards (`raDeg`, `decDeg`): JD = HJD − Δ(JD), solved by two fixed-point steps from Δ(HJD). Δ
 * changes at most 1e-4 of the step (v/c), so the second step leaves ~5e-6 s. `toJdTt` turns a date of
 * the file's scale into TT for the ephemeris.
 */
export function geocentricJd(jd: number, origin: LightTimeOrigin, raDeg: number, decDeg: number, toJdTt: (jd: number) => number): number {
  const first = jd - roemerDelayDays(toJdTt(jd), origin, raDeg, decDeg);
  return jd - roemerDelayDays(toJdTt(first), origin, raDeg, decDeg);
}
