/**
 * The sample grid of one night at one site, shared by every target: times, local apparent sidereal
 * time, the Sun's altitude, the stretches of astronomical darkness and one apparent-place context.
 * Per target, the altitude at sample k is then sin(alt) = A + B cos(LST_k) + C sin(LST_k), three
 * multiply-adds with no trigonometry.
 */
import { Body, Equator, Observer, SiderealTime } from "astronomy-engine";
import { TWILIGHT_ALTITUDE_DEG } from "./constants";
import { apparentPlaceContext, type ApparentPlaceContext } from "./apparent-place";
import type { SkySite } from "./inputs";
import { astroTimeFromJdUtc, nightStartJdUtc } from "./time";

const DEG = Math.PI / 180;

/** The grid of one night; every array has `sampleCount` entries, sample k at `jdUtc[k]`. */
export interface NightGrid {
  nightDateIso: string;
  sinLatitude: number;
  cosLatitude: number;
  /** Local mean noon before the night and step between samples, Julian date UTC / days. */
  startJdUtc: number;
  stepDays: number;
  sampleCount: number;
  jdUtc: Float64Array;
  /** Local apparent sidereal time (GAST + east longitude) of each sample, degrees in [0, 360). */
  lstDeg: Float64Array;
  cosLst: Float64Array;
  sinLst: Float64Array;
  /** Geometric (unrefracted) altitude of the Sun's centre, topocentric, degrees. */
  sunAltitudeDeg: Float64Array;
  /** The Sun's apparent unit vector (equator of date, topocentric) at the middle of the window. */
  sunDirectionMid: Float64Array;
  /**
   * Astronomical darkness (Sun ≤ −18°) inside each step, as fractions [darkFrom, darkTo] of the step
   * from sample k to k+1 (linear interpolation of the Sun's altitude); steps without darkness are
   * absent. `darkFirstSample`/`darkLastSample` bound every sample a dark step touches (−1 if none).
   */
  darkStepIndex: Int32Array;
  darkFrom: Float64Array;
  darkTo: Float64Array;
  darkStepCount: number;
  darkFirstSample: number;
  darkLastSample: number;
  /**
   * Middle of astronomical darkness (Julian date UTC): halfway between its interpolated start and
   * end in the window; the window's middle when the night has no darkness.
   */
  midDarkJdUtc: number;
  /** Apparent-place context at the middle of the window, shared by every target of the night. */
  place: ApparentPlaceContext;
}

/** Upper bound on samples per night (a 1-minute step), so a bad step cannot allocate without limit. */
const MAX_SAMPLES = 24 * 60 + 1;

function sunDirectionOfDate(jdUtc: number, observer: Observer): Float64Array {
  const { vec } = Equator(Body.Sun, astroTimeFromJdUtc(jdUtc), observer, true, true);
  const length = Math.hypot(vec.x, vec.y, vec.z);
  return new Float64Array([vec.x / length, vec.y / length, vec.z / length]);
}

/** Part [from, to] of the unit step where a quantity linear from `a` to `b` is ≤ 0 (from > to: none). */
function fractionAtOrBelowZero(a: number, b: number): [number, number] {
  if (a <= 0 && b <= 0) return [0, 1];
  if (a > 0 && b > 0) return [1, 0];
  const crossing = a / (a - b);
  return a <= 0 ? [0, crossing] : [crossing, 1];
}

/**
 * Builds the grid for the night of `nightDateIso` (local date of the evening) at `site`, sampling
 * every `stepMinutes` from local mean noon to the next (see `nightStartJdUtc`). Sidereal time:
 * astronomy-engine `SiderealTime` (GAST, IAU 2006 ERA-based with the equation of the equinoxes) at every
 * sample. Sun: astronomy-engine `Equator(Sun, topocentric, of date, with aberration)` at the start
 * and end of the window, interpolated linearly along the window (the Sun moves about 1° a day, so
 * the chord departs from the arc by under 10″). Sun altitudes are geometric, accurate to about
 * 0.005° (astronomy-engine's Sun is good to about 1″).
 */
export function buildNightGrid(site: SkySite, nightDateIso: string, stepMinutes: number): NightGrid {
  const sampleCount = Math.min(MAX_SAMPLES, Math.round((24 * 60) / stepMinutes) + 1);
  const stepDays = 1 / (sampleCount - 1);
  const startJdUtc = nightStartJdUtc(nightDateIso, site.longitudeEastDeg);
  const observer = new Observer(site.latitudeDeg, site.longitudeEastDeg, site.elevationM);
  const sinLatitude = Math.sin(site.latitudeDeg * DEG);
  const cosLatitude = Math.cos(site.latitudeDeg * DEG);

  const sunStart = sunDirectionOfDate(startJdUtc, observer);
  const sunEnd = sunDirectionOfDate(startJdUtc + 1, observer);
  const jdUtc = new Float64Array(sampleCount);
  const lstDeg = new Float64Array(sampleCount);
  const cosLst = new Float64Array(sampleCount);
  const sinLst = new Float64Array(sampleCount);
  const sunAltitudeDeg = new Float64Array(sampleCount);
  for (let k = 0; k < sampleCount; k++) {
    const jd = startJdUtc + k * stepDays;
    const lst = (((SiderealTime(astroTimeFromJdUtc(jd)) * 15 + site.longitudeEastDeg) % 360) + 360) % 360;
    const c = Math.cos(lst * DEG);
    const s = Math.sin(lst * DEG);
    const w = k / (sampleCount - 1);
    const sx = sunStart[0] + w * (sunEnd[0] - sunStart[0]);
    const sy = sunStart[1] + w * (sunEnd[1] - sunStart[1]);
    const sz = sunStart[2] + w * (sunEnd[2] - sunStart[2]);
    const sinAlt = (sinLatitude * sz + cosLatitude * (sx * c + sy * s)) / Math.hypot(sx, sy, sz);
    jdUtc[k] = jd;
    lstDeg[k] = lst;
    cosLst[k] = c;
    sinLst[k] = s;
    sunAltitudeDeg[k] = Math.asin(Math.max(-1, Math.min(1, sinAlt))) / DEG;
  }

  const darkStepIndex = new Int32Array(sampleCount - 1);
  const darkFrom = new Float64Array(sampleCount - 1);
  const darkTo = new Float64Array(sampleCount - 1);
  let darkStepCount = 0;
  let darkFirstSample = -1;
  let darkLastSample = -1;
  const limit = TWILIGHT_ALTITUDE_DEG.astronomical;
  for (let k = 0; k < sampleCount - 1; k++) {
    const [from, to] = fractionAtOrBelowZero(sunAltitudeDeg[k] - limit, sunAltitudeDeg[k + 1] - limit);
    if (to <= from) continue;
    darkStepIndex[darkStepCount] = k;
    darkFrom[darkStepCount] = from;
    darkTo[darkStepCount] = to;
    darkStepCount++;
    if (darkFirstSample < 0) darkFirstSample = k;
    darkLastSample = k + 1;
  }

  const midDarkJdUtc = darkStepCount > 0
    ? (jdUtc[darkStepIndex[0]] + darkFrom[0] * stepDays + jdUtc[darkStepIndex[darkStepCount - 1]] + darkTo[darkStepCount - 1] * stepDays) / 2
    : startJdUtc + 0.5;

  const mid = new Float64Array([
    sunStart[0] + sunEnd[0],
    sunStart[1] + sunEnd[1],
    sunStart[2] + sunEnd[2],
  ]);
  const midLength = Math.hypot(mid[0], mid[1], mid[2]);
  for (let i = 0; i < 3; i++) mid[i] /= midLength;

  return {
    nightDateIso,
    sinLatitude,
    cosLatitude,
    startJdUtc,
    stepDays,
    sampleCount,
    jdUtc,
    lstDeg,
    cosLst,
    sinLst,
    sunAltitudeDeg,
    sunDirectionMid: mid,
    darkStepIndex,
    darkFrom,
    darkTo,
    darkStepCount,
    darkFirstSample,
    darkLastSample,
    midDarkJdUtc,
    place: apparentPlaceContext(startJdUtc + 0.5),
  };
}

/** Hours (h) of astronomical darkness (Sun's centre ≤ −18°) in the grid's window. */
export function hoursOfDarkness(grid: NightGrid): number {
  let stepFraction = 0;
  for (let i = 0; i < grid.darkStepCount; i++) stepFraction += grid.darkTo[i] - grid.darkFrom[i];
  return stepFraction * grid.stepDays * 24;
}
