/**
 * The lensing layer: lensing quantities the product shows, built on lib/physics. Offsets and radii in
 * units of θ_E, distances in parsecs, angles in radians (see each module).
 */

export { finiteSourceMagnification } from "./finite-source";
export { microlensParallax, peakMagnification } from "./microlensing";
