/**
 * The Moon across one night's dark samples, shared by every target of the night: its topocentric
 * direction and altitude at each sample and its illuminated fraction. Three ephemeris calls per
 * night instead of one per sample, so a schedule of many nights stays cheap.
 */
import { Body, GeoMoon, Illumination, ObserverVector, Observer } from "astronomy-engine";
import type { SkySite } from "./inputs";
import type { NightGrid } from "./night-grid";
import { astroTimeFromJdUtc } from "./time";

export interface NightMoon {
  /** Samples covered, `fromSample` ≤ k ≤ `toSample` (the grid's dark span); entries outside are 0. */
  fromSample: number;
  toSample: number;
  /** Topocentric unit vector toward the Moon's centre, true equator and equinox of date, per sample. */
  x: Float64Array;
  y: Float64Array;
  z: Float64Array;
  /** Sine of the Moon's geometric (unrefracted) topocentric altitude, per sample. */
  sinAltitude: Float64Array;
  /** Illuminated fraction of the disc at the middle of darkness, [0, 1] (one value per night). */
  illuminatedFraction: number;
}

/** Geocentric Moon (AU, J2000 axes) rotated to the true equator of date with the grid's rotation. */
function geocentricMoonOfDate(grid: NightGrid, jdUtc: number): [number, number, number] {
  const v = GeoMoon(astroTimeFromJdUtc(jdUtc));
  const m = grid.place.rotation;
  return [
    m[0] * v.x + m[1] * v.y + m[2] * v.z,
    m[3] * v.x + m[4] * v.y + m[5] * v.z,
    m[6] * v.x + m[7] * v.y + m[8] * v.z,
  ];
}

/**
 * The Moon over the dark span of `grid` (samples `darkFirstSample` to `darkLastSample`) seen from
 * `site`; null when the night has no astronomical darkness.
 * Method: astronomy-engine `GeoMoon` (geometric geocentric position, Brown's lunar theory as
 * adapted by Montenbruck & Pfleger; a few arcseconds) at the start, middle and end of the span,
 * rotated to the equator of date (IAU 2006/2000B, the grid's rotation) and interpolated by a
 * quadratic in time; minus the observer's geocentric position (astronomy-engine `ObserverVector`
 * once, then turned about the pole by the grid's sidereal time at each sample), which gives the
 * parallax (up to 1°) exactly. No annual aberration: for the Moon it cancels against the light
 * time to within about 1″ (both shift it by the Earth's orbital motion, ~20″, in opposite senses),
 * whereas a star's 20″ stays (`apparent-place.ts`). Refraction is left out.
 * Accuracy: better than 0.5′ in direction over a dark span of up to 14 h (the quadratic's error grows
 * as the cube of the span); tests check 1′ against astropy. Illuminated fraction: astronomy-engine
 * `Illumination` at `grid.midDarkJdUtc`.
 */
export function nightMoon(grid: NightGrid, site: SkySite): NightMoon | null {
  if (grid.darkStepCount === 0) return null;
  const fromSample = grid.darkFirstSample;
  const toSample = grid.darkLastSample;
  const t0 = grid.jdUtc[fromSample];
  const spanDays = grid.jdUtc[toSample] - t0;
  const p0 = geocentricMoonOfDate(grid, t0);
  const p1 = geocentricMoonOfDate(grid, t0 + spanDays / 2);
  const p2 = geocentricMoonOfDate(grid, t0 + spanDays);

  const observer = new Observer(site.latitudeDeg, site.longitudeEastDeg, site.elevationM);
  const origin = ObserverVector(astroTimeFromJdUtc(t0), observer, true);
  // The observer's position at sample k: its position at `fromSample` turned by LST_k − LST_0.
  const cos0 = grid.cosLst[fromSample];
  const sin0 = grid.sinLst[fromSample];

  const count = grid.sampleCount;
  const x = new Float64Array(count);
  const y = new Float64Array(count);
  const z = new Float64Array(count);
  const sinAltitude = new Float64Array(count);
  for (let k = fromSample; k <= toSample; k++) {
    const s = spanDays > 0 ? (grid.jdUtc[k] - t0) / spanDays : 0;
    // Lagrange basis on the nodes s = 0, 1/2, 1.
    const l0 = 2 * (s - 0.5) * (s - 1);
    const l1 = -4 * s * (s - 1);
    const l2 = 2 * s * (s - 0.5);
    const cosTurn = grid.cosLst[k] * cos0 + grid.sinLst[k] * sin0;
    const sinTurn = grid.sinLst[k] * cos0 - grid.cosLst[k] * sin0;
    const mx = l0 * p0[0] + l1 * p1[0] + l2 * p2[0] - (origin.x * cosTurn - origin.y * sinTurn);
    const my = l0 * p0[1] + l1 * p1[1] + l2 * p2[1] - (origin.x * sinTurn + origin.y * cosTurn);
    const mz = l0 * p0[2] + l1 * p1[2] + l2 * p2[2] - origin.z;
    const length = Math.hypot(mx, my, mz);
    x[k] = mx / length;
    y[k] = my / length;
    z[k] = mz / length;
    sinAltitude[k] = grid.sinLatitude * z[k] + grid.cosLatitude * (x[k] * grid.cosLst[k] + y[k] * grid.sinLst[k]);
  }
  const illuminatedFraction = Illumination(Body.Moon, astroTimeFromJdUtc(grid.midDarkJdUtc)).phase_fraction;
  return { fromSample, toSample, x, y, z, sinAltitude, illuminatedFraction };
}

