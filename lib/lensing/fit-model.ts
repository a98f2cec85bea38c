/**
 * The light curve of a fit (fit.ts) at chosen times, for drawing and tabulating it: the best fit's
 * magnification A(u(t)) with u² = τ² + β², τ = (t − t0)/t_E + π_E·Δs, β = u0 + π_E × Δs
 * (B. Paczyński 1986, ApJ 304, 1; with parallax A. Gould 2004, ApJ 606, 319, eq. 5, as the fit's model),
 * of a point source, or of a disk of radius ρ (finite-source.ts) when the fit has one.
 */

import { pointLensMagnification } from "@/lib/physics/point-lens";
import { finiteSourceMagnification } from "./finite-source";
import type { DatasetFit, PointLensFit } from "./fit";
import { parallaxOffsetsAu } from "./fit-parallax";

export interface FitModelOptions {
  /** The linear limb-darkening coefficient the fit was made with (0..1, default 0). */
  limbDarkeningU?: number;
  /** The event's position (J2000 degrees); needed when the fit has parallax. */
  event?: { raDeg: number; decDeg: number };
}

/**
 * The best fit's magnification at each time of `tDays` (days, the fit's time scale: Julian dates with
 * parallax). Throws a RangeError in words for a parallax fit without the event's position.
 */
export function fitMagnifications(fit: Pick<PointLensFit, "t0Days" | "u0" | "tEDays" | "rho" | "piEN" | "piEE" | "t0ParDays">, tDays: ArrayLike<number>, options: FitModelOptions = {}): Float64Array {
  const hasParallax = fit.piEN !== undefined && fit.piEE !== undefined && fit.t0ParDays !== undefined;
  if (hasParallax && !options.event) throw new RangeError("The fit has parallax: give the event's position to draw its light curve.");
  const offsets = hasParallax ? parallaxOffsetsAu(tDays, options.event!.raDeg, options.event!.decDeg, fit.t0ParDays!) : null;
  const piN = fit.piEN ?? 0;
  const piE = fit.piEE ?? 0;
  const rho = fit.rho;
  const limbDarkeningU = options.limbDarkeningU ?? 0;
  const result = new Float64Array(tDays.length);
  for (let k = 0; k < tDays.length; k++) {
    const sN = offsets ? offsets.north[k] : 0;
    const sE = offsets ? offsets.east[k] : 0;
    const tau = (tDays[k] - fit.t0Days) / fit.tEDays + piN * sN + piE * sE;
    const beta = fit.u0 + piN * sE - piE * sN;
    const u = Math.sqrt(tau * tau + beta * beta);
    result[k] = rho === undefined ? pointLensMagnification(u) : finiteSourceMagnification(u, rho, limbDarkeningU);
  }
  return result;
}

/**
 * A flux `flux` of dataset `from` carried to the flux scale of dataset `to` through the fit: the same
 * magnification, (F − F_b,from)/F_s,from, on `to`'s source and blend (common practice in microlensing
 * plots, which show every dataset on one reference's magnitudes). Errors scale by F_s,to/F_s,from.
 */
export function alignedFlux(flux: number, from: Pick<DatasetFit, "sourceFlux" | "blendFlux">, to: Pick<DatasetFit, "sourceFlux" | "blendFlux">): number {
  return ((flux - from.blendFlux) / from.sourceFlux) * to.sourceFlux + to.blendFlux;
}
