/**
 * Distances in a flat Lambda-CDM universe without radiation (D. W. Hogg 1999, astro-ph/9905116,
 * eqs. 14-16 and 19): D_C(z) = (c/H0) Integral_0^z dz'/E(z'), E(z) = sqrt(Om0 (1+z)^3 + 1 - Om0),
 * D_A(z) = D_C(z)/(1+z), D_A(z1, z2) = (D_C(z2) - D_C(z1))/(1+z2). Distances in parsecs.
 *
 * Method: with a = 1/(1+z) = s^2 the integral becomes Integral 2 ds / sqrt(Om0 + (1-Om0) s^6), smooth
 * on [0, 1], integrated by adaptive 16-point Gauss-Legendre; D_C(z2) - D_C(z1) is integrated directly
 * between the two limits, whose s-width is formed without cancellation, so small and close redshifts
 * keep their digits. Accuracy: 1e-13 relative (tested against 40-digit mpmath quadrature; astropy
 * FlatLambdaCDM with Tcmb0 = 0 agrees to its own ~2e-9).
 */

import { SPEED_OF_LIGHT_KM_PER_S } from "./constants";
import { domainError } from "./domain";

/** Flat Lambda-CDM parameters: H0 in km/s/Mpc, Om0 the matter density today (Lambda = 1 - Om0). */
export interface Cosmology {
  H0: number;
  Om0: number;
}

/** H0 = 70 km/s/Mpc, Om0 = 0.3: a common-practice default, not a measurement. */
export const DEFAULT_COSMOLOGY: Cosmology = { H0: 70, Om0: 0.3 };

const GAUSS_POINTS = 16;
/** Panel acceptance: the 16-point rule converges geometrically, so halves agreeing to this suffice. */
const PANEL_TOLERANCE = 1e-14;
const MAX_PANELS = 4096;

/** Gauss-Legendre nodes and weights on [-1, 1] by Newton on P_n (cap 100 steps, converges in ~5). */
const [NODES, WEIGHTS] = ((): [Float64Array, Float64Array] => {
  const nodes = new Float64Array(GAUSS_POINTS);
  const weights = new Float64Array(GAUSS_POINTS);
  for (let i = 0; i < GAUSS_POINTS; i++) {
    let x = Math.cos((Math.PI * (i + 0.75)) / (GAUSS_POINTS + 0.5));
    let derivative = 0;
    for (let iteration = 0; iteration < 100; iteration++) {
      let p0 = 1;
      let p1 = x;
      for (let k = 2; k <= GAUSS_POINTS; k++) [p0, p1] = [p1, ((2 * k - 1) * x * p1 - (k - 1) * p0) / k];
      derivative = (GAUSS_POINTS * (x * p1 - p0)) / (x * x - 1);
      const step = p1 / derivative;
      x -= step;
      if (Math.abs(step) < 1e-16) break;
    }
    nodes[i] = x;
    weights[i] = 2 / ((1 - x * x) * derivative * derivative);
  }
  return [nodes, weights];
})();

function checkCosmology(cosmology: Cosmology): void {
  if (!(cosmology.H0 > 0 && Number.isFinite(cosmology.H0))) throw domainError("cosmology.H0", cosmology.H0, "finite and > 0 (km/s/Mpc)");
  if (!(cosmology.Om0 >= 0 && cosmology.Om0 <= 1)) throw domainError("cosmology.Om0", cosmology.Om0, "in [0, 1] (flat universe)");
}

function checkRedshift(name: string, z: number): void {
  if (!(z >= 0 && Number.isFinite(z))) throw domainError(name, z, "finite and >= 0");
}

/** Gauss panel over [low, low + width]; the width is passed separately so that it keeps its digits. */
function gaussPanel(low: number, width: number, om0: number): number {
  const half = 0.5 * width;
  const middle = low + half;
  const lambda = 1 - om0;
  let sum = 0;
  for (let i = 0; i < GAUSS_POINTS; i++) {
    const s = middle + half * NODES[i];
    const s3 = s * s * s;
    sum += WEIGHTS[i] / Math.sqrt(om0 + lambda * s3 * s3);
  }
  return 2 * half * sum;
}

/**
 * Integral 2 ds / sqrt(Om0 + (1-Om0) s^6) over [sHigh - width, sHigh] by adaptive bisection of Gauss
 * panels (at most MAX_PANELS).
 */
function comovingIntegral(sHigh: number, width: number, om0: number): number {
  const stackLow: number[] = [sHigh - width];
  const stackWidth: number[] = [width];
  let total = 0;
  for (let panels = 0; stackLow.length > 0; panels++) {
    const low = stackLow.pop() as number;
    const panelWidth = stackWidth.pop() as number;
    const half = 0.5 * panelWidth;
    const whole = gaussPanel(low, panelWidth, om0);
    const halves = gaussPanel(low, half, om0) + gaussPanel(low + half, half, om0);
    if (Math.abs(whole - halves) <= PANEL_TOLERANCE * Math.abs(halves) || panels >= MAX_PANELS) {
      total += halves;
    } else {
      stackLow.push(low, low + half);
      stackWidth.push(half, half);
    }
  }
  return total;
}

/** 1/sqrt(1+z1) - 1/sqrt(1+z2) for z1 <= z2, without cancellation: the s-width of [z1, z2]. */
function sWidth(z1: number, z2: number): number {
  const r1 = Math.sqrt(1 + z1);
  const r2 = Math.sqrt(1 + z2);
  return (z2 - z1) / ((r1 + r2) * r1 * r2);
}

function hubbleDistancePc(cosmology: Cosmology): number {
  return (SPEED_OF_LIGHT_KM_PER_S / cosmology.H0) * 1e6;
}

/**
 * Line-of-sight comoving distance D_C(z) in a flat Lambda-CDM universe, parsecs (Hogg 1999 eq. 15).
 * Domain: z finite >= 0; cosmology.H0 > 0 (km/s/Mpc), cosmology.Om0 in [0, 1]. Accuracy: 1e-12.
 */
export function comovingDistance(z: number, cosmology: Cosmology = DEFAULT_COSMOLOGY): number {
  checkRedshift("z", z);
  checkCosmology(cosmology);
  return hubbleDistancePc(cosmology) * comovingIntegral(1, sWidth(0, z), cosmology.Om0);
}

/**
 * Angular-diameter distance D_A(z) = D_C(z)/(1+z) in a flat Lambda-CDM universe, parsecs (Hogg 1999
 * eq. 18). Domain as comovingDistance; z = 0 gives 0. Accuracy: 1e-12 relative (astropy to 1e-10).
 */
export function angularDiameterDistance(z: number, cosmology: Cosmology = DEFAULT_COSMOLOGY): number {
  return comovingDistance(z, cosmology) / (1 + z);
}

/**
 * Angular-diameter distance between redshifts z1 <= z2, (D_C(z2) - D_C(z1))/(1+z2), parsecs (Hogg
 * 1999 eq. 19, flat case): the D_LS of a cosmological lens. Domain: 0 <= z1 <= z2 finite (z1 > z2
 * throws; z1 = z2 gives 0). Accuracy: 1e-12 relative, also for z2 - z1 tiny (no cancellation).
 */
export function angularDiameterDistanceBetween(z1: number, z2: number, cosmology: Cosmology = DEFAULT_COSMOLOGY): number {
  checkRedshift("z1", z1);
  checkRedshift("z2", z2);
  if (z2 < z1) throw domainError("z2", z2, `>= z1 = ${z1}`);
  checkCosmology(cosmology);
  if (z1 === z2) return 0;
  return (hubbleDistancePc(cosmology) * comovingIntegral(1 / Math.sqrt(1 + z1), sWidth(z1, z2), cosmology.Om0)) / (1 + z2);
}
