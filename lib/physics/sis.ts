/**
 * Singular isothermal sphere lens (thin lens). Angles in radians, velocity dispersion in km/s,
 * distances in parsecs unless a name says otherwise, times in seconds. Sources: the SIS model as in
 * P. Schneider, J. Ehlers & E. E. Falco 1992, Gravitational Lenses, sect. 8.1.4; time delay
 * dt = (1+z_L)/(2c) (D_L D_S/D_LS) (theta_A^2 - theta_B^2) (e.g. Schneider, Kochanek & Wambsganss
 * 2006, Saas-Fee 33, part 2, eq. for the SIS).
 */

import { PARSEC_M, SPEED_OF_LIGHT_KM_PER_S, SPEED_OF_LIGHT_M_PER_S } from "./constants";
import { domainError, requireNonNegative, requirePositive } from "./domain";

/**
 * SIS Einstein radius theta_E = 4 pi (sigma/c)^2 D_LS/D_S, radians. Units: sigmaKmPerS in km/s; the
 * two distances in one (any) unit. Domain: sigma >= 0, 0 < dLensSource <= dSource. Accuracy: ~2 ulp.
 */
export function sisEinsteinRadius(sigmaKmPerS: number, dLensSource: number, dSource: number): number {
  requireNonNegative("sigmaKmPerS", sigmaKmPerS);
  requirePositive("dSource", dSource);
  if (!(dLensSource > 0 && dLensSource <= dSource)) throw domainError("dLensSource", dLensSource, `in (0, dSource = ${dSource}]`);
  const beta = sigmaKmPerS / SPEED_OF_LIGHT_KM_PER_S;
  return 4 * Math.PI * beta * beta * (dLensSource / dSource);
}

/** Images of an SIS lens. Positions along the source direction, radians; magnifications signed. */
export interface SisImages {
  /** 2 for a source inside the Einstein radius (beta < theta_E), else 1. */
  imageCount: 1 | 2;
  /** Outer image at beta + theta_E, radians. */
  thetaPlus: number;
  /** Inner image at beta - theta_E (negative, across the lens), radians; NaN when imageCount = 1. */
  thetaMinus: number;
  /** 1 + theta_E/beta. */
  magnificationPlus: number;
  /** 1 - theta_E/beta (negative: inverted); NaN when imageCount = 1. */
  magnificationMinus: number;
  /** |mu+| + |mu-| (2 theta_E/beta inside the Einstein radius). */
  magnificationTotal: number;
}

/**
 * Images and magnifications of an SIS lens for a source at angle betaRad from the lens: theta =
 * beta +- theta_E, mu = 1 +- theta_E/beta (Schneider, Ehlers & Falco 1992, sect. 8.1.4). Units:
 * radians. Domain: betaRad >= 0 (0 gives the Einstein ring, infinite magnification), thetaERad > 0.
 */
export function sisImages(betaRad: number, thetaERad: number): SisImages {
  requireNonNegative("betaRad", betaRad);
  requirePositive("thetaERad", thetaERad);
  const ratio = thetaERad / betaRad;
  if (betaRad >= thetaERad) {
    return { imageCount: 1, thetaPlus: betaRad + thetaERad, thetaMinus: NaN, magnificationPlus: 1 + ratio, magnificationMinus: NaN, magnificationTotal: 1 + ratio };
  }
  return {
    imageCount: 2,
    thetaPlus: betaRad + thetaERad,
    thetaMinus: betaRad - thetaERad,
    magnificationPlus: 1 + ratio,
    magnificationMinus: 1 - ratio,
    magnificationTotal: 2 * ratio,
  };
}

/**
 * Time delay between the two images of an SIS lens, seconds:
 * dt = (1+z_L)/(2c) (D_L D_S/D_LS) (theta_A^2 - theta_B^2) = 2 (1+z_L) (D_L D_S/D_LS) beta theta_E / c.
 * Units: angles in radians, distances in parsecs (angular-diameter distances for cosmological lenses).
 * Domain: 0 <= betaRad < thetaERad (two images), zLens > -1, distances > 0. Accuracy: ~3 ulp.
 */
export function sisTimeDelay(betaRad: number, thetaERad: number, zLens: number, dLensPc: number, dSourcePc: number, dLensSourcePc: number): number {
  requirePositive("thetaERad", thetaERad);
  if (!(betaRad >= 0 && betaRad < thetaERad)) throw domainError("betaRad", betaRad, `in [0, thetaERad = ${thetaERad}) (two images)`);
  if (!(zLens > -1 && Number.isFinite(zLens))) throw domainError("zLens", zLens, "finite and > -1");
  requirePositive("dLensPc", dLensPc);
  requirePositive("dSourcePc", dSourcePc);
  requirePositive("dLensSourcePc", dLensSourcePc);
  const timeDistanceS = ((dLensPc * dSourcePc) / dLensSourcePc) * (PARSEC_M / SPEED_OF_LIGHT_M_PER_S);
  return 2 * (1 + zLens) * timeDistanceS * betaRad * thetaERad;
}
