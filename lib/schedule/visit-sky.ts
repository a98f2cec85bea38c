/**
 * The sky at the middle of every planned visit (air mass, zenith distances, the Moon), read from what
 * the schedule's nights already hold: no ephemeris call per visit. While the nights are built, each
 * keeps a small record (its sidereal time at the first dark sample, its apparent-place context, the
 * Moon's direction over the dark span and its phase); the grids themselves are dropped.
 */
import { airmassPickering } from "@/lib/astro/airmass";
import { apparentDirectionOfDate, type ApparentPlaceContext } from "@/lib/astro/apparent-place";
import { SIDEREAL_RATE_DEG_PER_DAY } from "@/lib/astro/constants";
import type { SkySite, SkyTarget } from "@/lib/astro/inputs";
import type { NightGrid } from "@/lib/astro/night-grid";
import type { NightMoon } from "@/lib/astro/night-moon";
import { apparentAltitudeDeg } from "@/lib/astro/refraction";
import type { ScheduleNight } from "./night";
import type { VisitSky } from "./types";

const DEG = Math.PI / 180;

/** What one night with darkness keeps for the visits placed in it. */
interface VisitSkyNight {
  /** Time of the first dark sample (JD UTC), the grid's step (days) and the samples kept. */
  fromJdUtc: number;
  stepDays: number;
  sampleCount: number;
  /** Local apparent sidereal time at `fromJdUtc`, degrees. */
  fromLstDeg: number;
  /** The night's apparent-place context (shared with the grid, not copied). */
  place: ApparentPlaceContext;
  /** The Moon's topocentric unit vector (true equator of date) at each dark sample. */
  moonX: Float32Array;
  moonY: Float32Array;
  moonZ: Float32Array;
  /** acos(2k − 1) of the night's illuminated fraction k, degrees. */
  moonPhaseAngleDeg: number;
}

/**
 * The nights of one cycle, as far as the visits' sky needs them. `add` every night while the
 * schedule is built, then `skyOf` once per target. Memory: about 2 KB per dark night (three
 * single-precision Moon components per dark sample at a 5-minute step).
 */
export class VisitSkyNights {
  private readonly nights: (VisitSkyNight | null)[];
  private readonly sinLatitude: number;
  private readonly cosLatitude: number;

  /**
   * For `nightCount` nights at `site`, the first starting at `cycleStartJdUtc` (JD UTC, local mean
   * noon); `refractionScale` of the site's elevation (`lib/astro/refraction.ts`).
   */
  constructor(site: SkySite, private readonly cycleStartJdUtc: number, nightCount: number, private readonly refractionScale: number) {
    this.nights = new Array<VisitSkyNight | null>(nightCount).fill(null);
    this.sinLatitude = Math.sin(site.latitudeDeg * DEG);
    this.cosLatitude = Math.cos(site.latitudeDeg * DEG);
  }

  /** Keeps what the visits of `night` need; a night without darkness keeps nothing (it holds no visit). */
  add(night: Pick<ScheduleNight, "index" | "grid" | "moon">): void {
    const { grid, moon } = night;
    if (moon === null) return;
    const from = moon.fromSample;
    const to = moon.toSample + 1;
    this.nights[night.index] = {
      fromJdUtc: grid.jdUtc[from],
      stepDays: grid.stepDays,
      sampleCount: to - from,
      fromLstDeg: grid.lstDeg[from],
      place: grid.place,
      moonX: Float32Array.from(moon.x.subarray(from, to)),
      moonY: Float32Array.from(moon.y.subarray(from, to)),
      moonZ: Float32Array.from(moon.z.subarray(from, to)),
      moonPhaseAngleDeg: Math.acos(Math.max(-1, Math.min(1, 2 * moon.illuminatedFraction - 1))) / DEG,
    };
  }

  /**
   * The sky at the middle (start + `visitLengthDays`/2) of each visit of `target` (ICRS degrees)
   * starting at `visitsJdUtc` (JD UTC, each inside a usable window of an added night).
   * Method. Night: the one whose noon-to-noon span holds the middle. Target: its apparent direction
   * of date (`apparentDirectionOfDate`, the night's context) and sin(alt) = sinφ z + cosφ (x cos LST +
   * y sin LST), as `fillSineAltitudes`, with LST advanced from the first dark sample at the sidereal
   * rate (exact to well under 1″ over a night); apparent altitude by the site's refraction
   * (`apparentAltitudeDeg`, as the airmass limit uses it), air mass by Pickering 2002
   * (`airmassPickering`). Moon: its direction interpolated linearly between the two neighbouring
   * samples and renormalised (under 1″ at a 5-minute step: the path bends mostly by the daily turn of
   * the ≤ 1° parallax), zenith distance by the same relation; separation
   * atan2(|u × v|, u · v), accurate at small angles too. Phase angle: one value per night, from the
   * illuminated fraction at the middle of darkness (`nightMoon`).
   * Accuracy: zenith distances and separation as the night grid and `nightMoon` (tests: within 1′ of
   * astropy, 0.06′ seen); air mass within 1e-3 relative of Pickering of astropy's apparent altitude
   * (tests up to air mass 3.2, 2e-4 seen: the two refraction models). The phase angle is the one at
   * the middle of darkness (tests: 0.5°, 0.006° seen); at the visit itself the Moon's phase has moved
   * by ~0.5° per hour from then (up to ~3.5° at the ends of a 14-hour night).
   */
  skyOf(target: SkyTarget, visitsJdUtc: Float64Array, visitLengthDays: number): VisitSky {
    const count = visitsJdUtc.length;
    const sky: VisitSky = {
      airmass: new Float32Array(count),
      targetZenithDeg: new Float32Array(count),
      moonZenithDeg: new Float32Array(count),
      moonSeparationDeg: new Float32Array(count),
      moonPhaseAngleDeg: new Float32Array(count),
    };
    const direction = new Float64Array(3);
    const { sinLatitude, cosLatitude } = this;
    let directionNight: VisitSkyNight | null = null;
    for (let i = 0; i < count; i++) {
      const middleJdUtc = visitsJdUtc[i] + visitLengthDays / 2;
      const index = Math.min(this.nights.length - 1, Math.max(0, Math.floor(middleJdUtc - this.cycleStartJdUtc)));
      const night = this.nights[index]!;
      if (night !== directionNight) {
        apparentDirectionOfDate(night.place, target.raDeg, target.decDeg, direction);
        directionNight = night;
      }
      const lstRad = (night.fromLstDeg + SIDEREAL_RATE_DEG_PER_DAY * (middleJdUtc - night.fromJdUtc)) * DEG;
      const cosLst = Math.cos(lstRad);
      const sinLst = Math.sin(lstRad);

      const [tx, ty, tz] = direction;
      const sinTargetAltitude = sinLatitude * tz + cosLatitude * (tx * cosLst + ty * sinLst);
      const targetAltitudeDeg = Math.asin(Math.max(-1, Math.min(1, sinTargetAltitude))) / DEG;
      sky.targetZenithDeg[i] = 90 - targetAltitudeDeg;
      sky.airmass[i] = airmassPickering(apparentAltitudeDeg(targetAltitudeDeg, this.refractionScale));

      const position = Math.min(night.sampleCount - 1, Math.max(0, (middleJdUtc - night.fromJdUtc) / night.stepDays));
      // A dark span has at least two samples (one dark step), so k and k + 1 both exist.
      const k = Math.min(night.sampleCount - 2, Math.floor(position));
      const w = position - k;
      let mx = night.moonX[k] + w * (night.moonX[k + 1] - night.moonX[k]);
      let my = night.moonY[k] + w * (night.moonY[k + 1] - night.moonY[k]);
      let mz = night.moonZ[k] + w * (night.moonZ[k + 1] - night.moonZ[k]);
      const length = Math.hypot(mx, my, mz);
      mx /= length;
      my /= length;
      mz /= length;
      const sinMoonAltitude = sinLatitude * mz + cosLatitude * (mx * cosLst + my * sinLst);
      sky.moonZenithDeg[i] = 90 - Math.asin(Math.max(-1, Math.min(1, sinMoonAltitude))) / DEG;
      const cross = Math.hypot(ty * mz - tz * my, tz * mx - tx * mz, tx * my - ty * mx);
      sky.moonSeparationDeg[i] = Math.atan2(cross, tx * mx + ty * my + tz * mz) / DEG;
      sky.moonPhaseAngleDeg[i] = night.moonPhaseAngleDeg;
    }
    return sky;
  }
}

/**
 * The sky of `target` (ICRS degrees) at each of `timesJdUtc` (JD UTC, ascending, inside the dark
 * span of the night of `grid` and `moon`, built by `buildNightGrid` and `nightMoon` as the schedule
 * builds its nights): what `VisitSkyNights.skyOf` gives a visit of zero length at each time, so a
 * figure through the night reads the same conditions as the visits (method and accuracy: `skyOf`).
 * `refractionScale` of the site's elevation (`lib/astro/refraction.ts`). Null when the night has no
 * astronomical darkness (`moon` null). A time outside the dark span takes the Moon of the span's
 * nearer end.
 */
export function skyAtTimes(site: SkySite, grid: NightGrid, moon: NightMoon | null, refractionScale: number, target: SkyTarget, timesJdUtc: Float64Array): VisitSky | null {
  if (moon === null) return null;
  const nights = new VisitSkyNights(site, grid.startJdUtc, 1, refractionScale);
  nights.add({ index: 0, grid, moon });
  return nights.skyOf(target, timesJdUtc, 0);
}
