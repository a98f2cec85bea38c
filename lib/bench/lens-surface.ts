/**
 * What a lens's physical size changes: a ray that comes closer to the centre than the body's radius
 * R ends on its surface, so an image whose ray passes that close is not seen (occulted); and a body
 * larger than its photon sphere (R ≥ 3GM/c²) has no photon sphere, shadow or relativistic images,
 * which all need light to circle the mass at r = 3GM/c² in vacuum.
 */

import { impactParameterFromClosestApproach, parseLength, parseMass, photonSphereRadius, SOLAR_MASS_LENGTH_M } from "@/lib/physics";
import { defaultUnits, isCompactRadiusText } from "./parse-sketch";
import { lensSketches, type Sketch } from "./sketch-state";

/** True when the body (radius R, metres; 0 = compact) lies inside its photon sphere, R < 3M. */
export function hasPhotonSphere(radiusM: number, massLengthM: number): boolean {
  return radiusM < photonSphereRadius(massLengthM);
}

/**
 * The impact parameter of the ray that grazes the surface, metres: b_R = R/√(1 − 2M/R) (closest
 * approach R; Darwin 1959), so rays with b < b_R hit the body. It is b = R to a part in 10⁶ for the
 * Sun. For R < 3M it is 0: every ray that would come that close has b < b_c and falls in already.
 */
export function surfaceImpactParameterM(radiusM: number, massLengthM: number): number {
  if (hasPhotonSphere(radiusM, massLengthM)) return 0;
  return impactParameterFromClosestApproach(radiusM, massLengthM);
}

/**
 * The lens's radius in units of its mass M = GM/c² (the ray bundle's unit), from the sketch's mass and
 * radius fields; 0 for a compact lens, an isothermal sphere, or while either field does not parse
 * (the form shows that field's error).
 */
export function lensRadiusInMassUnits(sketch: Pick<Sketch, "lens" | "mass" | "radius">): number {
  if (!lensSketches[sketch.lens].fields.includes("radius") || isCompactRadiusText(sketch.radius)) return 0;
  try {
    const massLengthM = parseMass(sketch.mass, { defaultUnit: defaultUnits.mass }).massSolar * SOLAR_MASS_LENGTH_M;
    const radiusOverM = parseLength(sketch.radius, { defaultUnit: defaultUnits.radius }) / massLengthM;
    return radiusOverM > 2 ? radiusOverM : 0;
  } catch {
    return 0;
  }
}
