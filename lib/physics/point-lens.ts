/**
 * Point-mass (Schwarzschild) gravitational lens in the thin-lens, weak-field approximation.
 * Masses in solar masses, distances in parsecs, angles in radians, times in seconds; u is the source
 * offset in units of the Einstein radius. Sources: B. Paczynski 1986, ApJ 304, 1 (images,
 * magnifications, light curve); S. Refsdal 1964, MNRAS 128, 307 (time delay); the astrometric shift
 * u/(u^2 + 2) theta_E as in M. Miyamoto & Y. Yoshii 1995, AJ 110, 1427.
 */

import { PARSEC_M, SOLAR_MASS_LENGTH_M, SOLAR_MASS_TIME_S } from "./constants";
import { domainError, requireFinite, requireNonNegative, requirePositive } from "./domain";

/**
 * Einstein radius theta_E = sqrt(4 G M/c^2 * D_LS / (D_L D_S)), radians (Paczynski 1986 eq. 1).
 * Units: massSolar in solar masses, distances in parsecs. Domain: massSolar >= 0, 0 < dLensPc,
 * dSourcePc > 0, dLensSourcePc > 0 (default D_S - D_L, right within the Galaxy; pass the
 * angular-diameter distance between the planes for cosmological lenses). Accuracy: ~2 ulp.
 */
export function einsteinRadius(massSolar: number, dLensPc: number, dSourcePc: number, dLensSourcePc: number = dSourcePc - dLensPc): number {
  requireNonNegative("massSolar", massSolar);
  requirePositive("dLensPc", dLensPc);
  requirePositive("dSourcePc", dSourcePc);
  if (!(dLensSourcePc > 0 && Number.isFinite(dLensSourcePc))) {
    throw domainError("dLensSourcePc", dLensSourcePc, "> 0 (the source must lie behind the lens)");
  }
  return Math.sqrt(((4 * massSolar * SOLAR_MASS_LENGTH_M) / PARSEC_M) * (dLensSourcePc / (dLensPc * dSourcePc)));
}

/** Images of a point lens, in units of theta_E; magnifications signed by parity. */
export interface PointLensImages {
  /** Position of the outer, unmagnified-parity image along the source direction, in theta_E. */
  thetaPlus: number;
  /** Position of the inner, inverted image (negative: on the far side of the lens), in theta_E. */
  thetaMinus: number;
  /** Magnification of the outer image, >= 1. */
  magnificationPlus: number;
  /** Signed magnification of the inverted image, <= 0. */
  magnificationMinus: number;
  /** magnificationPlus + |magnificationMinus|. */
  magnificationTotal: number;
  /** Offset of the light centroid from the true source position, u/(u^2+2), in theta_E. */
  centroidShift: number;
}

/**
 * Images of a point lens for a source at offset u (in units of theta_E): theta = (u +- sqrt(u^2+4))/2,
 * mu = (u^2+2)/(2u sqrt(u^2+4)) +- 1/2 (Paczynski 1986). Written as |mu-| = 2/(u s (u^2+2+u s)), s =
 * sqrt(u^2+4), so that the faint image keeps full relative accuracy for u >> 1 (no cancellation).
 * Domain: u >= 0 finite or +Infinity (u = 0 gives the Einstein ring: infinite magnifications, zero
 * centroid shift; u = Infinity gives the unlensed source). Accuracy: a few ulp.
 */
export function pointLensImages(u: number): PointLensImages {
  if (!(u >= 0)) throw domainError("u", u, ">= 0 (source offset in Einstein radii)");
  if (u === Infinity) {
    return { thetaPlus: Infinity, thetaMinus: -0, magnificationPlus: 1, magnificationMinus: -0, magnificationTotal: 1, centroidShift: 0 };
  }
  const s = Math.sqrt(u * u + 4);
  const faint = u === 0 ? Infinity : 2 / (u * s * (u * u + 2 + u * s));
  return {
    thetaPlus: (u + s) / 2,
    thetaMinus: -2 / (u + s),
    magnificationPlus: 1 + faint,
    magnificationMinus: -faint,
    magnificationTotal: 1 + 2 * faint,
    centroidShift: u / (u * u + 2),
  };
}

/**
 * Total point-lens magnification A(u) = (u^2+2)/(u sqrt(u^2+4)) (Paczynski 1986 eq. 6), dimensionless.
 * Domain: u >= 0 (u = 0 gives Infinity). Accuracy: a few ulp, also for u >> 1 (A - 1 ~ 2/u^4 kept).
 */
export function pointLensMagnification(u: number): number {
  return pointLensImages(u).magnificationTotal;
}

/**
 * Paczynski light curve A(t) for a point source: u(t)^2 = u0^2 + ((t - t0)/t_E)^2 (Paczynski 1986).
 * Units: timeS, peakTimeS, einsteinTimeS in seconds (any common zero point); impactU0 in theta_E.
 * Domain: times finite, einsteinTimeS > 0, impactU0 >= 0. Accuracy: a few ulp.
 */
export function paczynskiMagnification(timeS: number, peakTimeS: number, einsteinTimeS: number, impactU0: number): number {
  requireFinite("timeS", timeS);
  requireFinite("peakTimeS", peakTimeS);
  requirePositive("einsteinTimeS", einsteinTimeS);
  requireNonNegative("impactU0", impactU0);
  return pointLensMagnification(Math.hypot(impactU0, (timeS - peakTimeS) / einsteinTimeS));
}

/**
 * Einstein crossing time t_E = theta_E / mu_rel, seconds (Paczynski 1986). Units: thetaERad in radians,
 * relativeProperMotionRadPerS in rad/s (parseProperMotion returns this unit). Domain: thetaERad >= 0,
 * relativeProperMotionRadPerS > 0. Exact to rounding.
 */
export function einsteinCrossingTime(thetaERad: number, relativeProperMotionRadPerS: number): number {
  requireNonNegative("thetaERad", thetaERad);
  requirePositive("relativeProperMotionRadPerS", relativeProperMotionRadPerS);
  return thetaERad / relativeProperMotionRadPerS;
}

/**
 * Time delay between the two images of a point lens, seconds:
 * dt = 4 G M (1 + z_L)/c^3 [u sqrt(u^2+4)/2 + ln((sqrt(u^2+4)+u)/(sqrt(u^2+4)-u))], with the logarithm
 * written 2 asinh(u/2) to stay exact for small u (Refsdal 1964 for the method; standard closed form).
 * Units: massSolar in solar masses, zLens the lens redshift, u in theta_E. Domain: massSolar >= 0,
 * zLens >= 0 (or > -1), u >= 0, all finite. Accuracy: a few ulp.
 */
export function pointMassTimeDelay(massSolar: number, zLens: number, u: number): number {
  requireNonNegative("massSolar", massSolar);
  if (!(zLens > -1 && Number.isFinite(zLens))) throw domainError("zLens", zLens, "finite and > -1");
  requireNonNegative("u", u);
  const s = Math.sqrt(u * u + 4);
  return 4 * massSolar * SOLAR_MASS_TIME_S * (1 + zLens) * ((u * s) / 2 + 2 * Math.asinh(u / 2));
}
