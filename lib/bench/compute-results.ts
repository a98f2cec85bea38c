/**
 * Everything the results panel shows, computed from parsed inputs by lib/physics. This module only
 * assembles: it scales physics results (given in units of θ_E or M) to angles and lengths and puts
 * them in rows, so the panel, the copy-as-text and the tests read one structure.
 */

import {
  einsteinCrossingTime,
  einsteinRadius,
  exactDeflection,
  photonSphereRadius,
  pointLensImages,
  pointMassTimeDelay,
  PARSEC_M,
  shadowAngularDiameter,
  sisEinsteinRadius,
  sisImages,
  sisTimeDelay,
  SOLAR_MASS_LENGTH_M,
  virbhadraEllisImages,
  weakFieldDeflection,
} from "@/lib/physics";
import type { DisplayKind } from "./display-units";
import type { SketchInputs } from "./parse-sketch";
import { resolutionVerdict, samplingVerdict, singleImageVerdict, timeDelayVerdict, type Verdict } from "./verdicts";

export interface ResultRow {
  id: string;
  label: string;
  symbol: string;
  kind: DisplayKind;
  /** Radians, seconds, metres, or a plain number, by `kind`. */
  value: number;
  defaultUnit: string;
}

/** The weak-field formula is flagged where it is off from the exact deflection by more than this. */
export const WEAK_FIELD_TOLERANCE = 0.01;

export interface DeflectionRow {
  id: string;
  label: string;
  /** Impact parameter of the ray, units of M (the lens mass as a length). */
  bOverM: number;
  exactRad: number;
  weakFieldRad: number;
  /** (weak − exact) / exact. */
  fractionalDifference: number;
  isWeakFieldOff: boolean;
}

/** Positions in units of θ_E, for the lens-plane diagram. */
export interface LensPlaneLayout {
  thetaERad: number;
  betaThetaE: number;
  images: { thetaThetaE: number; magnification: number }[];
}

export interface BenchResults {
  rows: ResultRow[];
  deflections: DeflectionRow[];
  verdicts: Verdict[];
  lensPlane: LensPlaneLayout;
  /** The microlensing event for the light-curve and astrometric plots; point lens only. */
  event?: MicrolensingEvent;
}

export interface MicrolensingEvent {
  thetaERad: number;
  einsteinTimeS: number;
  peakTimeS: number;
  u0ThetaE: number;
  cadenceS: number;
  campaignS: number;
}

function deflectionRow(id: string, label: string, bOverM: number): DeflectionRow {
  const exactRad = exactDeflection(bOverM, 1);
  const weakFieldRad = weakFieldDeflection(bOverM, 1, 1);
  const fractionalDifference = (weakFieldRad - exactRad) / exactRad;
  return { id, label, bOverM, exactRad, weakFieldRad, fractionalDifference, isWeakFieldOff: Math.abs(fractionalDifference) > WEAK_FIELD_TOLERANCE };
}

function betaInThetaE(inputs: SketchInputs, thetaERad: number): number {
  return inputs.sourceOffset.unit === "thetaE" ? inputs.sourceOffset.betaThetaE : inputs.sourceOffset.betaRad / thetaERad;
}

/** Results for a compact (point-mass) lens. */
function pointLensResults(inputs: SketchInputs, massSolar: number): BenchResults {
  const { dLensPc, dSourcePc, dLensSourcePc, zLens } = inputs.geometry;
  const thetaERad = einsteinRadius(massSolar, dLensPc, dSourcePc, dLensSourcePc);
  const u = betaInThetaE(inputs, thetaERad);
  const images = pointLensImages(u);
  const separationRad = (images.thetaPlus - images.thetaMinus) * thetaERad;
  const timeDelayS = pointMassTimeDelay(massSolar, zLens, u);
  const einsteinTimeS = einsteinCrossingTime(thetaERad, inputs.lightCurve.muRelRadPerS);
  const massLengthM = massSolar * SOLAR_MASS_LENGTH_M;
  const lensDistanceM = dLensPc * PARSEC_M;
  // b = D_L sin θ for the ray that reaches the observer at angle θ from the lens.
  const impactOverM = (thetaRad: number) => (Math.abs(Math.sin(thetaRad)) * lensDistanceM) / massLengthM;
  const exact = virbhadraEllisImages(u * thetaERad, massSolar, dLensPc, dSourcePc, dLensSourcePc);

  const rows: ResultRow[] = [
    { id: "theta-e", label: "Einstein radius", symbol: "θ_E", kind: "angle", value: thetaERad, defaultUnit: "mas" },
    { id: "beta", label: "Source offset", symbol: "β", kind: "angle", value: u * thetaERad, defaultUnit: "mas" },
    { id: "theta-plus", label: "Image position, outer", symbol: "θ₊", kind: "angle", value: images.thetaPlus * thetaERad, defaultUnit: "mas" },
    { id: "theta-minus", label: "Image position, inner", symbol: "θ₋", kind: "angle", value: images.thetaMinus * thetaERad, defaultUnit: "mas" },
    { id: "separation", label: "Image separation", symbol: "Δθ", kind: "angle", value: separationRad, defaultUnit: "mas" },
    { id: "mu-plus", label: "Magnification, outer image", symbol: "μ₊", kind: "ratio", value: images.magnificationPlus, defaultUnit: "" },
    { id: "mu-minus", label: "Magnification, inner image", symbol: "μ₋", kind: "ratio", value: images.magnificationMinus, defaultUnit: "" },
    { id: "mu-total", label: "Total magnification", symbol: "μ", kind: "ratio", value: images.magnificationTotal, defaultUnit: "" },
    { id: "flux-ratio", label: "Flux ratio, outer/inner", symbol: "|μ₊/μ₋|", kind: "ratio", value: Math.abs(images.magnificationPlus / images.magnificationMinus), defaultUnit: "" },
    { id: "time-delay", label: "Time delay between images", symbol: "Δt", kind: "time", value: timeDelayS, defaultUnit: "s" },
    { id: "t-e", label: "Einstein crossing time", symbol: "t_E", kind: "time", value: einsteinTimeS, defaultUnit: "d" },
    { id: "centroid-shift", label: "Astrometric centroid shift", symbol: "δθ", kind: "angle", value: images.centroidShift * thetaERad, defaultUnit: "uas" },
    { id: "r-s", label: "Schwarzschild radius", symbol: "R_S", kind: "length", value: 2 * massLengthM, defaultUnit: "km" },
    { id: "r-ph", label: "Photon-sphere radius", symbol: "r_ph", kind: "length", value: photonSphereRadius(massLengthM), defaultUnit: "km" },
    { id: "shadow", label: "Shadow angular diameter", symbol: "θ_sh", kind: "angle", value: shadowAngularDiameter(massSolar, dLensPc), defaultUnit: "uas" },
    { id: "photon-ring", label: "Photon ring radius (exact lens equation)", symbol: "θ_∞", kind: "angle", value: exact.thetaInfinityRad, defaultUnit: "uas" },
    { id: "rel-plus", label: "Relativistic image, source side", symbol: "θ₁₊", kind: "angle", value: exact.relativisticPrimary.thetaRad, defaultUnit: "uas" },
    { id: "rel-plus-mu", label: "Relativistic image magnification, source side", symbol: "μ₁₊", kind: "ratio", value: exact.relativisticPrimary.magnification, defaultUnit: "" },
    { id: "rel-minus", label: "Relativistic image, far side", symbol: "θ₁₋", kind: "angle", value: exact.relativisticSecondary.thetaRad, defaultUnit: "uas" },
    { id: "rel-minus-mu", label: "Relativistic image magnification, far side", symbol: "μ₁₋", kind: "ratio", value: exact.relativisticSecondary.magnification, defaultUnit: "" },
  ];

  const deflections = [
    deflectionRow("deflection-plus", "Ray to the outer image", impactOverM(images.thetaPlus * thetaERad)),
    deflectionRow("deflection-minus", "Ray to the inner image", impactOverM(images.thetaMinus * thetaERad)),
    deflectionRow("deflection-ring", "Ray at the Einstein radius", impactOverM(thetaERad)),
    deflectionRow("deflection-rel-plus", "Ray to the relativistic image", impactOverM(exact.relativisticPrimary.thetaRad)),
  ];

  const { instrument, lightCurve } = inputs;
  return {
    rows,
    deflections,
    verdicts: [
      resolutionVerdict(separationRad, instrument.resolutionRad, instrument.resolutionName),
      samplingVerdict(einsteinTimeS, instrument.cadenceS, instrument.campaignS, lightCurve.peakTimeS),
      timeDelayVerdict(timeDelayS, instrument.cadenceS, instrument.campaignS),
    ],
    lensPlane: {
      thetaERad,
      betaThetaE: u,
      images: [
        { thetaThetaE: images.thetaPlus, magnification: images.magnificationPlus },
        { thetaThetaE: images.thetaMinus, magnification: images.magnificationMinus },
      ],
    },
    event: { thetaERad, einsteinTimeS, peakTimeS: lightCurve.peakTimeS, u0ThetaE: lightCurve.u0ThetaE, cadenceS: instrument.cadenceS, campaignS: instrument.campaignS },
  };
}

/** Results for a singular isothermal sphere: no Schwarzschild rows, one image when β ≥ θ_E. */
function sisResults(inputs: SketchInputs, sigmaKmPerS: number): BenchResults {
  const { dLensPc, dSourcePc, dLensSourcePc, zLens } = inputs.geometry;
  const thetaERad = sisEinsteinRadius(sigmaKmPerS, dLensSourcePc, dSourcePc);
  const betaRad = betaInThetaE(inputs, thetaERad) * thetaERad;
  const images = sisImages(betaRad, thetaERad);
  const einsteinTimeS = einsteinCrossingTime(thetaERad, inputs.lightCurve.muRelRadPerS);
  const isPair = images.imageCount === 2;
  const rows: ResultRow[] = [
    { id: "theta-e", label: "Einstein radius", symbol: "θ_E", kind: "angle", value: thetaERad, defaultUnit: "arcsec" },
    { id: "beta", label: "Source offset", symbol: "β", kind: "angle", value: betaRad, defaultUnit: "arcsec" },
    { id: "theta-plus", label: "Image position, outer", symbol: "θ₊", kind: "angle", value: images.thetaPlus, defaultUnit: "arcsec" },
    { id: "mu-plus", label: "Magnification, outer image", symbol: "μ₊", kind: "ratio", value: images.magnificationPlus, defaultUnit: "" },
    { id: "mu-total", label: "Total magnification", symbol: "μ", kind: "ratio", value: images.magnificationTotal, defaultUnit: "" },
    { id: "t-e", label: "Einstein crossing time", symbol: "t_E", kind: "time", value: einsteinTimeS, defaultUnit: "yr" },
  ];
  const { instrument, lightCurve } = inputs;
  const verdicts: Verdict[] = [];
  if (isPair) {
    const separationRad = images.thetaPlus - images.thetaMinus;
    const timeDelayS = sisTimeDelay(betaRad, thetaERad, zLens, dLensPc, dSourcePc, dLensSourcePc);
    rows.splice(
      3,
      0,
      { id: "theta-minus", label: "Image position, inner", symbol: "θ₋", kind: "angle", value: images.thetaMinus, defaultUnit: "arcsec" },
      { id: "separation", label: "Image separation", symbol: "Δθ", kind: "angle", value: separationRad, defaultUnit: "arcsec" },
    );
    rows.splice(
      6,
      0,
      { id: "mu-minus", label: "Magnification, inner image", symbol: "μ₋", kind: "ratio", value: images.magnificationMinus, defaultUnit: "" },
      { id: "flux-ratio", label: "Flux ratio, outer/inner", symbol: "|μ₊/μ₋|", kind: "ratio", value: Math.abs(images.magnificationPlus / images.magnificationMinus), defaultUnit: "" },
    );
    rows.push({ id: "time-delay", label: "Time delay between images", symbol: "Δt", kind: "time", value: timeDelayS, defaultUnit: "d" });
    verdicts.push(resolutionVerdict(separationRad, instrument.resolutionRad, instrument.resolutionName));
    verdicts.push(timeDelayVerdict(timeDelayS, instrument.cadenceS, instrument.campaignS));
  } else {
    verdicts.push(singleImageVerdict());
  }
  verdicts.push(samplingVerdict(einsteinTimeS, instrument.cadenceS, instrument.campaignS, lightCurve.peakTimeS));
  const lensPlaneImages = [{ thetaThetaE: images.thetaPlus / thetaERad, magnification: images.magnificationPlus }];
  if (isPair) lensPlaneImages.push({ thetaThetaE: images.thetaMinus / thetaERad, magnification: images.magnificationMinus });
  return {
    rows,
    deflections: [],
    verdicts,
    lensPlane: { thetaERad, betaThetaE: betaRad / thetaERad, images: lensPlaneImages },
  };
}

export type ComputedSketch = { ok: true; results: BenchResults } | { ok: false; message: string };

/**
 * The results of a parsed sketch. Inputs that parse but that the physics rejects (a ray inside the
 * photon sphere, a distance outside a formula's domain) come back as a message, never as a throw.
 */
export function computeResults(inputs: SketchInputs): ComputedSketch {
  try {
    const results = inputs.lens.model === "point" ? pointLensResults(inputs, inputs.lens.massSolar) : sisResults(inputs, inputs.lens.sigmaKmPerS);
    return { ok: true, results };
  } catch (error) {
    return { ok: false, message: error instanceof Error ? error.message : String(error) };
  }
}
