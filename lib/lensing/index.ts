/**
 * The lensing layer: lensing quantities the product shows, built on lib/physics. Offsets and radii in
 * units of θ_E, distances in parsecs, angles in radians (see each module).
 */

export { finiteSourceMagnification } from "./finite-source";
export { fitPointLens, FitInputError, MAX_FIT_ROWS } from "./fit";
export type { DatasetFit, PhotometryPoint, PointLensFit, PointLensFitOptions } from "./fit";
export { microlensParallax, peakMagnification } from "./microlensing";
export {
  lensModelIds,
  lensModelLabels,
  lensModelOf,
  lensModelOfAlias,
  lensModelOfParameters,
  lensModels,
  lensParameters,
  parametersOf,
  solveLens,
  usesParameter,
} from "./registry";
export type { LensModelId } from "./registry";
export type { LensGeometry, LensModel, LensParameter, LensParameterKey, LensProblem, LensTimescale } from "./lens-model";
export type { LensImage, LensSolution } from "./solution";
