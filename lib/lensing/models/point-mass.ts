/**
 * Point mass (a star, a planet, a black hole): thin-lens images, magnifications and delay of
 * Paczyński 1986 (ApJ 304, 1) and Refsdal 1964 (MNRAS 128, 307), with the strong-field quantities a
 * compact mass adds (shadow, photon ring from the exact lens equation of Virbhadra & Ellis 2000).
 */

import { acceptedRanges } from "@/lib/physics/accepted-ranges";
import { einsteinCrossingTime, einsteinRadius, pointLensImages, pointMassTimeDelay, shadowAngularDiameter, virbhadraEllisImages } from "@/lib/physics";
import type { LensModel } from "../lens-model";
import { microlensParallax } from "../microlensing";

/**
 * Offset of the largest astrometric centroid shift, θ_E units: the shift u/(u² + 2) θ_E peaks at
 * u = √2, where it is θ_E/√8 (C. M. Walker 1995, ApJ 453, 37; from memory).
 */
const LARGEST_SHIFT_OFFSET_THETA_E = Math.SQRT2;

export const pointMassModel: LensModel<"point", "lensMassSolar"> = {
  id: "point",
  label: "Point mass",
  shortLabel: "Point",
  parameters: [
    {
      key: "lensMassSolar",
      label: "Lens mass",
      kind: "mass",
      unit: "Msun",
      unitWords: "M☉",
      example: "0.3 Msun",
      range: acceptedRanges.lensMassSolar,
      rangeWords: { what: "The lens mass", unitWords: "solar masses", why: "an asteroid to ten times the largest galaxy cluster" },
      missingMessage: "A point-mass lens needs its mass in solar masses.",
    },
  ],
  importAliases: ["point", "pointmass", "pointlens", "pm"],
  timescale: "einsteinTime",
  einsteinRadiusRad: ({ lensMassSolar }, g) => einsteinRadius(lensMassSolar, g.dLensPc, g.dSourcePc, g.dLensSourcePc),

  /**
   * Both images exist for every offset. The photon ring is the n = 1 relativistic Einstein ring of a
   * source on the axis (β = 0) from the exact deflection; the parallax is given for Galactic
   * distances only (z_L = 0), where the relative parallax is au (1/D_L − 1/D_S).
   */
  solve({ parameters: { lensMassSolar: massSolar }, geometry: g, sourceOffsetThetaE: u, properMotionRadPerS }) {
    const thetaERad = pointMassModel.einsteinRadiusRad({ lensMassSolar: massSolar }, g);
    const images = pointLensImages(u);
    const ring = virbhadraEllisImages(0, massSolar, g.dLensPc, g.dSourcePc, g.dLensSourcePc).relativisticPrimary;
    return {
      modelId: pointMassModel.id,
      einsteinRadiusRad: thetaERad,
      sourceOffsetThetaE: u,
      images: [
        { positionThetaE: images.thetaPlus, magnification: images.magnificationPlus },
        { positionThetaE: images.thetaMinus, magnification: images.magnificationMinus },
      ],
      imageSeparationRad: (images.thetaPlus - images.thetaMinus) * thetaERad,
      magnificationTotal: images.magnificationTotal,
      fluxRatio: images.magnificationPlus / Math.abs(images.magnificationMinus),
      timeDelayS: pointMassTimeDelay(massSolar, g.zLens, u),
      einsteinTimeS: properMotionRadPerS === null ? null : einsteinCrossingTime(thetaERad, properMotionRadPerS),
      centroidShiftRad: images.centroidShift * thetaERad,
      maxAstrometricShiftRad: pointLensImages(LARGEST_SHIFT_OFFSET_THETA_E).centroidShift * thetaERad,
      shadowDiameterRad: shadowAngularDiameter(massSolar, g.dLensPc),
      photonRingDiameterRad: 2 * ring.thetaRad,
      microlensParallax: g.zLens === 0 ? microlensParallax(g.dLensPc, g.dSourcePc, thetaERad) : null,
    };
  },
};
