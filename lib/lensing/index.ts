/**
 * The lensing layer: lensing quantities the product shows, built on lib/physics. Offsets and radii in
 * units of θ_E, distances in parsecs, angles in radians (see each module).
 */

export { finiteSourceMagnification } from "./finite-source";
export { fitPointLens, FitInputError, MAX_FIT_ROWS } from "./fit";
export type { DatasetFit, PhotometryPoint, PointLensFit, PointLensFitOptions } from "./fit";
export { predictFromFit, PREDICTION_BAND_DAYS, PREDICTION_BAND_STEP_DAYS, PREDICTION_DRAWS } from "./fit-prediction";
export type { DatasetPrediction, FitPrediction, FitPredictionOptions, FitPredictionOutcome, PercentileBand } from "./fit-prediction";
export { sitePeakOutlook } from "./fit-prediction-site";
export type { SitePeakOutlook } from "./fit-prediction-site";
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
