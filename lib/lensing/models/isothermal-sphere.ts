/**
 * Singular isothermal sphere (a galaxy or a cluster): θ_E = 4π (σ/c)² D_LS/D_S, images at β ± θ_E,
 * two only while the source lies inside the Einstein radius (P. Schneider, J. Ehlers & E. E. Falco
 * 1992, Gravitational Lenses, sect. 8.1.4). An extended lens has no shadow, no photon ring and no
 * microlensing centroid shift.
 */

import { acceptedRanges } from "@/lib/physics/accepted-ranges";
import { einsteinCrossingTime, sisEinsteinRadius, sisImages, sisTimeDelay } from "@/lib/physics";
import type { LensModel } from "../lens-model";

export const isothermalSphereModel: LensModel<"sis", "velocityDispersionKmPerS"> = {
  id: "sis",
  label: "Singular isothermal sphere",
  shortLabel: "SIS",
  parameters: [
    {
      key: "velocityDispersionKmPerS",
      label: "Velocity dispersion",
      kind: "velocity",
      unit: "km/s",
      unitWords: "km/s",
      example: "250 km/s",
      range: acceptedRanges.velocityDispersionKmPerS,
      rangeWords: { what: "The velocity dispersion", unitWords: "km/s", why: "dwarf galaxies to the richest clusters" },
      missingMessage: "An isothermal lens needs its velocity dispersion in km/s.",
    },
  ],
  importAliases: ["sis", "isothermal", "singularisothermalsphere"],
  timescale: "timeDelay",
  einsteinRadiusRad: ({ velocityDispersionKmPerS }, g) => sisEinsteinRadius(velocityDispersionKmPerS, g.dLensSourcePc, g.dSourcePc),

  /** For u ≥ 1 one image: no separation, flux ratio or delay. */
  solve({ parameters, geometry: g, sourceOffsetThetaE: u, properMotionRadPerS }) {
    const thetaERad = isothermalSphereModel.einsteinRadiusRad(parameters, g);
    const betaRad = u * thetaERad;
    const images = sisImages(betaRad, thetaERad);
    const isDouble = images.imageCount === 2;
    return {
      modelId: isothermalSphereModel.id,
      einsteinRadiusRad: thetaERad,
      sourceOffsetThetaE: u,
      images: [
        { positionThetaE: images.thetaPlus / thetaERad, magnification: images.magnificationPlus },
        ...(isDouble ? [{ positionThetaE: images.thetaMinus / thetaERad, magnification: images.magnificationMinus }] : []),
      ],
      imageSeparationRad: isDouble ? images.thetaPlus - images.thetaMinus : null,
      magnificationTotal: images.magnificationTotal,
      fluxRatio: isDouble ? images.magnificationPlus / Math.abs(images.magnificationMinus) : null,
      timeDelayS: isDouble ? sisTimeDelay(betaRad, thetaERad, g.zLens, g.dLensPc, g.dSourcePc, g.dLensSourcePc) : null,
      einsteinTimeS: properMotionRadPerS === null ? null : einsteinCrossingTime(thetaERad, properMotionRadPerS),
      centroidShiftRad: null,
      maxAstrometricShiftRad: null,
      shadowDiameterRad: null,
      photonRingDiameterRad: null,
      microlensParallax: null,
    };
  },
};
