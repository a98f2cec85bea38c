/**
 * Sunset, sunrise and the three twilights of one night, from the Sun's sampled altitude.
 */
import { SUNRISE_GEOMETRIC_ALTITUDE_DEG, TWILIGHT_ALTITUDE_DEG } from "./constants";
import type { NightGrid } from "./night-grid";

/** When the Sun's centre passes one altitude during the night. */
export interface SunCrossing {
  /** Geometric altitude of the Sun's centre that defines the boundary, degrees. */
  sunAltitudeDeg: number;
  /** Evening passage downward and morning passage upward, Julian date UTC; null if none this night. */
  eveningJdUtc: number | null;
  morningJdUtc: number | null;
  /** The Sun stays above (no such darkness tonight) or below (it lasts the whole window) throughout. */
  isSunAlwaysAbove: boolean;
  isSunAlwaysBelow: boolean;
}

export interface NightTwilight {
  sunset: SunCrossing;
  civil: SunCrossing;
  nautical: SunCrossing;
  astronomical: SunCrossing;
}

/**
 * The Sun's passages through `sunAltitudeDeg` (degrees, geometric) in the grid's window: the first
 * downward and the last upward crossing, each interpolated linearly inside its sample step (with a
 * 5-minute step the error is a few seconds; tests check 1 minute against astropy).
 */
export function sunCrossing(grid: NightGrid, sunAltitudeDeg: number): SunCrossing {
  const altitudes = grid.sunAltitudeDeg;
  let eveningJdUtc: number | null = null;
  let morningJdUtc: number | null = null;
  let isSunAlwaysAbove = true;
  let isSunAlwaysBelow = true;
  for (let k = 0; k < grid.sampleCount; k++) {
    if (altitudes[k] > sunAltitudeDeg) isSunAlwaysBelow = false;
    else isSunAlwaysAbove = false;
    if (k === 0) continue;
    const a = altitudes[k - 1] - sunAltitudeDeg;
    const b = altitudes[k] - sunAltitudeDeg;
    if ((a > 0) === (b > 0)) continue;
    const jd = grid.jdUtc[k - 1] + (a / (a - b)) * grid.stepDays;
    if (a > 0 && eveningJdUtc === null) eveningJdUtc = jd;
    if (a <= 0) morningJdUtc = jd;
  }
  if (eveningJdUtc !== null && morningJdUtc !== null && morningJdUtc < eveningJdUtc) morningJdUtc = null;
  return { sunAltitudeDeg, eveningJdUtc, morningJdUtc, isSunAlwaysAbove, isSunAlwaysBelow };
}

/**
 * Sunset/sunrise (Sun's centre at −50′: 34′ refraction and 16′ semi-diameter) and civil, nautical,
 * astronomical twilight (−6°, −12°, −18°), all common practice, for the grid's night.
 */
export function nightTwilight(grid: NightGrid): NightTwilight {
  return {
    sunset: sunCrossing(grid, SUNRISE_GEOMETRIC_ALTITUDE_DEG),
    civil: sunCrossing(grid, TWILIGHT_ALTITUDE_DEG.civil),
    nautical: sunCrossing(grid, TWILIGHT_ALTITUDE_DEG.nautical),
    astronomical: sunCrossing(grid, TWILIGHT_ALTITUDE_DEG.astronomical),
  };
}
