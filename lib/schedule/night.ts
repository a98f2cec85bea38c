/**
 * What one night of the cycle holds for every target at once: the sample grid (sidereal time, Sun,
 * darkness), the Moon across the dark hours, whether the night is clear and when a too-bright Moon
 * is up. Built once per night and shared by all targets.
 */
import { RISE_SET_GEOMETRIC_ALTITUDE_DEG } from "@/lib/astro/constants";
import { buildNightGrid, type NightGrid } from "@/lib/astro/night-grid";
import { nightMoon, type NightMoon } from "@/lib/astro/night-moon";
import { addDaysIso } from "@/lib/astro/time";
import { isClearNight } from "./clear-nights";
import type { ScheduleSettings } from "./request";

const SIN_HORIZON = Math.sin((RISE_SET_GEOMETRIC_ALTITUDE_DEG * Math.PI) / 180);

export interface ScheduleNight {
  /** Index from the cycle's first night. */
  index: number;
  grid: NightGrid;
  /**
   * The Moon over the dark samples; null without darkness. Computed on every night (the visits'
   * sky reads it, `visit-sky.ts`), whether or not a Moon rule is set.
   */
  moon: NightMoon | null;
  isClear: boolean;
  /**
   * Per sample of the dark span, positive while a Moon brighter than the largest illumination is
   * above the horizon (its centre above −34′ geometric, the standard horizon refraction; common
   * practice): sin(altitude) − sin(−34′). Null when no such Moon tonight.
   */
  brightMoonMargin: Float64Array | null;
}

/**
 * Night `index` of the cycle in `settings`. The Moon's brightness is one value per night (its
 * illuminated fraction at the middle of darkness, our rule); the night is lost to a too-bright Moon
 * only while that Moon is above the horizon.
 */
export function buildScheduleNight(settings: ScheduleSettings, index: number): ScheduleNight {
  const grid = buildNightGrid(settings.site, addDaysIso(settings.firstNightIso, index), settings.limits.stepMinutes);
  const moon = nightMoon(grid, settings.site);
  let brightMoonMargin: Float64Array | null = null;
  const maxFraction = settings.moonMaxIlluminatedFraction;
  if (moon !== null && maxFraction !== null && moon.illuminatedFraction > maxFraction) {
    brightMoonMargin = new Float64Array(grid.sampleCount);
    for (let k = moon.fromSample; k <= moon.toSample; k++) brightMoonMargin[k] = moon.sinAltitude[k] - SIN_HORIZON;
  }
  return { index, grid, moon, isClear: isClearNight(index, settings.clearNightFraction), brightMoonMargin };
}
