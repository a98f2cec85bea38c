/**
 * The sky's surface brightness at a target through one night, in the target's band: the dark sky
 * at the target's zenith distance and the Moon's light added to it, over the hours of astronomical
 * darkness while the target is up. Each sample is the photometry layer's own `skyBrightnessAtVisit`
 * (dark sky after K&S 1991 eq. 2 in the band, moonlight after K&S eq. 15 carried to the band by the
 * Sun's colour; ./visit-budget) under the conditions the schedule's visits read (`skyAtTimes`,
 * lib/schedule/visit-sky.ts: the night grid and Moon of lib/astro), so the figure and the photon
 * budget never disagree about the sky.
 */
import { nightDateSchema, parseSkyInput, skySiteSchema, skyTargetSchema, type SkySite, type SkySiteInput, type SkyTarget } from "@/lib/astro/inputs";
import { DEFAULT_STEP_MINUTES } from "@/lib/astro/constants";
import { buildNightGrid, type NightGrid } from "@/lib/astro/night-grid";
import { nightMoon } from "@/lib/astro/night-moon";
import { apparentAltitudeDeg, refractionScale } from "@/lib/astro/refraction";
import { skyAtTimes } from "@/lib/schedule/visit-sky";
import { skyBrightnessAtVisit, type BandSky } from "./visit-budget";

/** The Moon's centre crossing the geometric horizon, where the model's moonlight starts or stops. */
export interface MoonHorizonCrossing {
  kind: "rise" | "set";
  /** JD UTC, interpolated linearly in zenith distance between the two samples either side. */
  jdUtc: number;
}

export interface NightSkyBrightness {
  nightDateIso: string;
  site: SkySite;
  target: SkyTarget;
  bandLabel: string;
  /** Astronomical darkness (Sun ≤ −18°): its first and last instant, JD UTC; null without darkness. */
  darkness: { startJdUtc: number; endJdUtc: number } | null;
  /**
   * Samples in darkness with the target above the site's horizon limit (apparent altitude), ascending;
   * index-aligned arrays. Brightness in mag/arcsec² in the band's own system.
   */
  jdUtc: Float64Array;
  totalMagPerArcsec2: Float64Array;
  darkMagPerArcsec2: Float64Array;
  /** The Moon's share alone, mag/arcsec²; +Infinity while the Moon is down. */
  moonMagPerArcsec2: Float64Array;
  /** The grid's step between samples, days: samples further apart than this lie either side of a stretch with the target down. */
  stepDays: number;
  /** How much brighter the Moon makes the sky at most over the samples, mag (total less dark); 0 with the Moon down throughout. */
  largestMoonBrighteningMag: number;
  /** The Moon rising or setting during darkness, in time order. */
  moonCrossings: MoonHorizonCrossing[];
  /** Illuminated fraction of the Moon at the middle of darkness, [0, 1] (the night's one value, as the schedule's). */
  moonIlluminatedFraction: number | null;
}

/**
 * The times a night's darkness is sampled at: every grid sample in darkness, and darkness's own
 * start and end where they fall between samples (from the grid's interpolated dark steps).
 */
function darkTimes(grid: NightGrid): Float64Array {
  const times: number[] = [];
  for (let i = 0; i < grid.darkStepCount; i++) {
    const k = grid.darkStepIndex[i];
    times.push(grid.jdUtc[k] + grid.darkFrom[i] * grid.stepDays);
    const continues = i + 1 < grid.darkStepCount && grid.darkStepIndex[i + 1] === k + 1 && grid.darkFrom[i + 1] === 0 && grid.darkTo[i] === 1;
    if (!continues) times.push(grid.jdUtc[k] + grid.darkTo[i] * grid.stepDays);
  }
  return Float64Array.from(times);
}

/**
 * The sky brightness at `target` (ICRS degrees) from `site` through the night of `nightDateIso`
 * (local date of the evening) in the band of `bandSky`, sampled every `stepMinutes` (the schedule's
 * step by default) over astronomical darkness while the target's apparent altitude is at least the
 * site's horizon limit. Method: module comment. Accuracy: the model's (K&S's 8–23% for moonlight;
 * the dark sky is the site's zenith value carried by eq. 2). Throws `AppError("bad_request:sky")` for
 * a bad site or target, and a RangeError in words for band values outside their domain.
 */
export function nightSkyBrightness(input: { site: SkySiteInput; target: SkyTarget; nightDateIso: string; bandSky: BandSky; stepMinutes?: number }): NightSkyBrightness {
  const site = parseSkyInput(skySiteSchema, input.site, "site");
  const target = parseSkyInput(skyTargetSchema, input.target, "target");
  const nightDateIso = parseSkyInput(nightDateSchema, input.nightDateIso, "date");
  const grid = buildNightGrid(site, nightDateIso, input.stepMinutes ?? DEFAULT_STEP_MINUTES);
  const moon = nightMoon(grid, site);
  const scale = refractionScale(site.elevationM);
  const times = darkTimes(grid);
  const sky = skyAtTimes(site, grid, moon, scale, target, times);
  const empty = new Float64Array(0);
  const base = { nightDateIso, site, target, bandLabel: input.bandSky.band.label, stepDays: grid.stepDays };
  if (sky === null || times.length === 0) {
    return { ...base, darkness: null, jdUtc: empty, totalMagPerArcsec2: empty, darkMagPerArcsec2: empty, moonMagPerArcsec2: empty, largestMoonBrighteningMag: 0, moonCrossings: [], moonIlluminatedFraction: null };
  }

  const moonCrossings: MoonHorizonCrossing[] = [];
  for (let i = 1; i < times.length; i++) {
    const [a, b] = [sky.moonZenithDeg[i - 1] - 90, sky.moonZenithDeg[i] - 90];
    if (a > 0 === b > 0) continue;
    moonCrossings.push({ kind: b > 0 ? "set" : "rise", jdUtc: times[i - 1] + ((times[i] - times[i - 1]) * a) / (a - b) });
  }

  const kept: number[] = [];
  for (let i = 0; i < times.length; i++) {
    const zenithDeg = sky.targetZenithDeg[i];
    if (zenithDeg <= 90 && apparentAltitudeDeg(90 - zenithDeg, scale) >= site.horizonLimitDeg) kept.push(i);
  }
  const jdUtc = new Float64Array(kept.length);
  const totalMagPerArcsec2 = new Float64Array(kept.length);
  const darkMagPerArcsec2 = new Float64Array(kept.length);
  const moonMagPerArcsec2 = new Float64Array(kept.length);
  let largestMoonBrighteningMag = 0;
  kept.forEach((i, n) => {
    const brightness = skyBrightnessAtVisit(input.bandSky, {
      airmass: sky.airmass[i],
      targetZenithDeg: sky.targetZenithDeg[i],
      moonZenithDeg: sky.moonZenithDeg[i],
      moonSeparationDeg: sky.moonSeparationDeg[i],
      moonPhaseAngleDeg: sky.moonPhaseAngleDeg[i],
    });
    jdUtc[n] = times[i];
    totalMagPerArcsec2[n] = brightness.totalMagPerArcsec2;
    darkMagPerArcsec2[n] = brightness.darkMagPerArcsec2;
    moonMagPerArcsec2[n] = brightness.moonMagPerArcsec2;
    largestMoonBrighteningMag = Math.max(largestMoonBrighteningMag, brightness.darkMagPerArcsec2 - brightness.totalMagPerArcsec2);
  });
  return {
    ...base,
    darkness: { startJdUtc: times[0], endJdUtc: times[times.length - 1] },
    jdUtc,
    totalMagPerArcsec2,
    darkMagPerArcsec2,
    moonMagPerArcsec2,
    largestMoonBrighteningMag,
    moonCrossings,
    moonIlluminatedFraction: moon!.illuminatedFraction,
  };
}
