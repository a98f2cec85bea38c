/**
 * The altitude a target must reach to count: the higher of the airmass limit and the site's horizon
 * limit, as an apparent altitude (what the telescope points at) and the geometric altitude the fast
 * per-sample tests compare with.
 */
import { apparentAltitudeForAirmassDeg } from "./airmass";
import type { SkyLimits, SkySite } from "./inputs";
import { geometricAltitudeDeg, refractionScale } from "./refraction";

const DEG = Math.PI / 180;

export interface AltitudeLimit {
  /** Apparent altitude of the airmass limit (Pickering 2002 air mass), degrees. */
  airmassAltitudeDeg: number;
  /** The site's own lowest pointing, apparent altitude, degrees. */
  horizonLimitDeg: number;
  /** The binding (higher) one, apparent and geometric, degrees; and its sine. */
  apparentDeg: number;
  geometricDeg: number;
  sinGeometric: number;
  binding: "airmass" | "horizon";
  /** Refraction scale of the site's elevation (see `refractionScale`). */
  refractionScale: number;
}

/**
 * Altitude limit for `site` under `limits` (validated inputs). Air mass to altitude by inverting
 * Pickering 2002 (to 1e-9°); apparent to geometric with astronomy-engine's refraction scaled to the
 * site's elevation (see `refraction.ts`).
 */
export function altitudeLimit(site: SkySite, limits: SkyLimits): AltitudeLimit {
  const airmassAltitudeDeg = apparentAltitudeForAirmassDeg(limits.airmassLimit);
  const binding = site.horizonLimitDeg > airmassAltitudeDeg ? "horizon" : "airmass";
  const apparentDeg = Math.max(airmassAltitudeDeg, site.horizonLimitDeg);
  const scale = refractionScale(site.elevationM);
  const geometricDeg = geometricAltitudeDeg(apparentDeg, scale);
  return {
    airmassAltitudeDeg,
    horizonLimitDeg: site.horizonLimitDeg,
    apparentDeg,
    geometricDeg,
    sinGeometric: Math.sin(geometricDeg * DEG),
    binding,
    refractionScale: scale,
  };
}
