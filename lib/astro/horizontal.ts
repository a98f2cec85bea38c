/**
 * Altitude and azimuth of a fixed target at one instant, for spot checks and readouts.
 */
import { Horizon, Observer } from "astronomy-engine";
import { apparentDirectionOfDate, apparentPlaceContext, sphericalFromDirection } from "./apparent-place";
import { parseSkyInput, skySiteSchema, skyTargetSchema, type SkySiteInput, type SkyTarget } from "./inputs";
import { apparentAltitudeDeg, refractionScale } from "./refraction";
import { astroTimeFromJdUtc } from "./time";

export interface HorizontalPosition {
  /** Geometric (airless) altitude, degrees, [−90, 90]. */
  altitudeDeg: number;
  /** Apparent altitude with refraction (see `refraction.ts`), degrees. */
  apparentAltitudeDeg: number;
  /** Azimuth from north through east, degrees, [0, 360). */
  azimuthDeg: number;
}

/**
 * Where a star at ICRS `target.raDeg`, `target.decDeg` (degrees) stands in the sky of `site` at
 * `jdUtc` (Julian date UTC). Method: apparent place of date (annual aberration, IAU 2006/2000B
 * precession–nutation; `apparent-place.ts`), then astronomy-engine `Horizon` (GAST, geodetic
 * latitude). Accuracy: about 1″ plus |UT1 − UTC| × 15″/s of hour angle; tests check 1′ against astropy.
 * Throws `AppError("bad_request:sky")` naming the field for invalid input.
 */
export function altitudeAzimuth(siteInput: SkySiteInput, targetInput: SkyTarget, jdUtc: number): HorizontalPosition {
  const site = parseSkyInput(skySiteSchema, siteInput, "site");
  const target = parseSkyInput(skyTargetSchema, targetInput, "target");
  if (!Number.isFinite(jdUtc)) throw new RangeError(`jdUtc must be a finite Julian date (got ${jdUtc}).`);
  const direction = apparentDirectionOfDate(apparentPlaceContext(jdUtc), target.raDeg, target.decDeg, new Float64Array(3));
  const { raDeg, decDeg } = sphericalFromDirection(direction);
  const observer = new Observer(site.latitudeDeg, site.longitudeEastDeg, site.elevationM);
  const horizontal = Horizon(astroTimeFromJdUtc(jdUtc), observer, raDeg / 15, decDeg);
  return {
    altitudeDeg: horizontal.altitude,
    apparentAltitudeDeg: apparentAltitudeDeg(horizontal.altitude, refractionScale(site.elevationM)),
    azimuthDeg: horizontal.azimuth,
  };
}
