/**
 * Physics core of the product: exact Schwarzschild light paths, lens equations and distances.
 * Pure TypeScript (no React, DOM, database or Node APIs), safe inside web workers.
 * Conventions: geometrized functions take M and lengths in one unit of length; astronomical ones take
 * masses in solar masses, distances in parsecs, angles in radians and return times in seconds, unless a
 * name says otherwise.
 */

export * from "./constants";
export * from "./units";
export { carlsonRF } from "./carlson";
export {
  closestApproach,
  criticalExcess,
  criticalImpactParameter,
  impactParameterFromClosestApproach,
  isCaptured,
  photonSphereExcessFromCriticalExcess,
  photonSphereRadius,
} from "./schwarzschild";
export {
  deflectionFromCriticalExcess,
  exactDeflection,
  strongFieldDeflection,
  sweptAngleFromInfinity,
  weakFieldDeflection,
  weakFieldSeriesCoefficient,
} from "./deflection";
export { CAPTURE_MARGIN, traceRay, traceRayBundle } from "./ray-tracer";
export type { BundleTraceOptions, RayFate, TraceOptions, TracedRay, TracedRayBundle } from "./ray-tracer";
export { traceBoundOrbit } from "./orbit-tracer";
export type { OrbitTraceOptions, TracedOrbit } from "./orbit-tracer";
export {
  einsteinCrossingTime,
  einsteinRadius,
  paczynskiMagnification,
  pointLensImages,
  pointLensMagnification,
  pointMassTimeDelay,
} from "./point-lens";
export type { PointLensImages } from "./point-lens";
export { sisEinsteinRadius, sisImages, sisTimeDelay } from "./sis";
export type { SisImages } from "./sis";
export { DEFAULT_COSMOLOGY, angularDiameterDistance, angularDiameterDistanceBetween, comovingDistance } from "./cosmology";
export type { Cosmology } from "./cosmology";
export {
  advanceFromMassOverP,
  exactPeriastronAdvance,
  periastronAdvance,
  shadowAngularDiameter,
  shapiroDelay,
} from "./relativistic-effects";
export { virbhadraEllisImages } from "./strong-lens";
export type { LensImage, VirbhadraEllisImages } from "./strong-lens";
