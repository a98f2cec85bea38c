/**
 * Nightly visibility of one target from one site: the figures and curves of the night chart.
 */
import { Body, Equator, Horizon, Illumination, Observer } from "astronomy-engine";
import { airmassPickering } from "./airmass";
import { apparentDirectionOfDate } from "./apparent-place";
import {
  nightDateSchema,
  parseSkyInput,
  skyLimitsSchema,
  skySiteSchema,
  skyTargetSchema,
  type SkyLimitsInput,
  type SkySite,
  type SkySiteInput,
  type SkyTarget,
} from "./inputs";
import { altitudeLimit, type AltitudeLimit } from "./limits";
import { buildNightGrid, hoursOfDarkness } from "./night-grid";
import { apparentAltitudeDeg } from "./refraction";
import { fillSineAltitudes, hoursAboveInDarkness, targetPassages, type TargetPassages } from "./target-night";
import { astroTimeFromJdUtc } from "./time";
import { nightTwilight, type NightTwilight } from "./twilight";

const DEG = Math.PI / 180;

/** Per-sample curves of the night, local noon to local noon; all arrays share `jdUtc`. */
export interface NightSamples {
  jdUtc: Float64Array;
  /** Target's apparent (refracted) altitude, degrees. */
  altitudeDeg: Float64Array;
  /** Pickering 2002 air mass; NaN while the target is below the apparent horizon. */
  airmass: Float64Array;
  /** Moon's apparent topocentric altitude, degrees. */
  moonAltitudeDeg: Float64Array;
  /** Sun's geometric altitude, degrees. */
  sunAltitudeDeg: Float64Array;
}

export interface NightVisibility {
  nightDateIso: string;
  site: SkySite;
  target: SkyTarget;
  samples: NightSamples;
  twilight: NightTwilight;
  passages: TargetPassages;
  limit: AltitudeLimit;
  /** Hours in astronomical darkness with the target above the binding limit (h); 0 if unusable. */
  hoursDarkAboveLimit: number;
  /** Length of astronomical darkness this night (h). */
  hoursDark: number;
  moon: {
    /** Illuminated fraction of the Moon's disc, [0, 1]. */
    illuminatedFraction: number;
    /** Topocentric angle between the Moon and the target, degrees. */
    separationDeg: number;
    /** When these two were evaluated: middle of darkness, else middle of the window (JD UTC). */
    atJdUtc: number;
  };
  sun: {
    /** Angle between the Sun and the target at the middle of the window, degrees. */
    elongationDeg: number;
    safeElongationDeg: number;
    /** Pointing at the target tonight would come closer to the Sun than the safe elongation. */
    isTooCloseToSun: boolean;
  };
  /** Observable tonight: some dark time above the limit and not too close to the Sun. */
  isUsable: boolean;
}

function angleBetweenDeg(a: ArrayLike<number>, b: ArrayLike<number>): number {
  const dot = (a[0] * b[0] + a[1] * b[1] + a[2] * b[2]) / (Math.hypot(a[0], a[1], a[2]) * Math.hypot(b[0], b[1], b[2]));
  return Math.acos(Math.max(-1, Math.min(1, dot))) / DEG;
}

/**
 * The night of `nightDateIso` (local date of the evening, `YYYY-MM-DD`) for a star at ICRS
 * `target.raDeg`/`decDeg` (degrees) seen from `site` (latitude, longitude east, degrees; elevation
 * m; horizon limit, degrees of apparent altitude) under `limits` (airmass limit, safe Sun elongation
 * in degrees, step in minutes).
 * Methods: the shared night grid (`night-grid.ts`: astronomy-engine sidereal time and Sun), the
 * target's apparent place of date, Moon from astronomy-engine `Equator` (topocentric, of date) at
 * every sample, Moon phase from astronomy-engine `Illumination`. Air mass: Pickering 2002.
 * Accuracy: altitudes ~1″ (tests: 1′ against astropy), times to ~1 minute, hours to a few minutes.
 * Throws `AppError("bad_request:sky")` naming the invalid field.
 */
export function nightlyVisibility(
  siteInput: SkySiteInput,
  targetInput: SkyTarget,
  nightDateIsoInput: string,
  limitsInput: SkyLimitsInput = {},
): NightVisibility {
  const site = parseSkyInput(skySiteSchema, siteInput, "site");
  const target = parseSkyInput(skyTargetSchema, targetInput, "target");
  const nightDateIso = parseSkyInput(nightDateSchema, nightDateIsoInput, "date");
  const limits = parseSkyInput(skyLimitsSchema, limitsInput, "limits");

  const grid = buildNightGrid(site, nightDateIso, limits.stepMinutes);
  const limit = altitudeLimit(site, limits);
  const direction = apparentDirectionOfDate(grid.place, target.raDeg, target.decDeg, new Float64Array(3));
  const sineAltitudes = new Float64Array(grid.sampleCount);
  fillSineAltitudes(grid, direction, sineAltitudes, 0, grid.sampleCount - 1);

  const observer = new Observer(site.latitudeDeg, site.longitudeEastDeg, site.elevationM);
  const altitudeDeg = new Float64Array(grid.sampleCount);
  const airmass = new Float64Array(grid.sampleCount);
  const moonAltitudeDeg = new Float64Array(grid.sampleCount);
  for (let k = 0; k < grid.sampleCount; k++) {
    const geometric = Math.asin(Math.max(-1, Math.min(1, sineAltitudes[k]))) / DEG;
    altitudeDeg[k] = apparentAltitudeDeg(geometric, limit.refractionScale);
    airmass[k] = airmassPickering(altitudeDeg[k]);
    const time = astroTimeFromJdUtc(grid.jdUtc[k]);
    const moon = Equator(Body.Moon, time, observer, true, true);
    moonAltitudeDeg[k] = apparentAltitudeDeg(Horizon(time, observer, moon.ra, moon.dec).altitude, limit.refractionScale);
  }

  const hoursDark = hoursOfDarkness(grid);
  const atJdUtc = grid.midDarkJdUtc;
  const moonTime = astroTimeFromJdUtc(atJdUtc);
  const moonVector = Equator(Body.Moon, moonTime, observer, true, true).vec;
  const elongationDeg = angleBetweenDeg(direction, grid.sunDirectionMid);
  const isTooCloseToSun = elongationDeg < limits.safeSunElongationDeg;
  const hoursAbove = hoursAboveInDarkness(grid, sineAltitudes, limit.sinGeometric);

  return {
    nightDateIso,
    site,
    target,
    samples: { jdUtc: grid.jdUtc, altitudeDeg, airmass, moonAltitudeDeg, sunAltitudeDeg: grid.sunAltitudeDeg },
    twilight: nightTwilight(grid),
    passages: targetPassages(grid, direction),
    limit,
    hoursDarkAboveLimit: isTooCloseToSun ? 0 : hoursAbove,
    hoursDark,
    moon: {
      illuminatedFraction: Illumination(Body.Moon, moonTime).phase_fraction,
      separationDeg: angleBetweenDeg(direction, [moonVector.x, moonVector.y, moonVector.z]),
      atJdUtc,
    },
    sun: { elongationDeg, safeElongationDeg: limits.safeSunElongationDeg, isTooCloseToSun },
    isUsable: !isTooCloseToSun && hoursAbove > 0,
  };
}
