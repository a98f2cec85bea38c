/**
 * Everything the results panel shows, computed from parsed inputs by lib/physics. This module only
 * assembles: it scales physics results (given in units of θ_E or M) to angles and lengths and puts
 * them in rows, so the panel, the copy-as-text and the tests read one structure.
 */

import { DAY_S, exactDeflection, photonSphereRadius, PARSEC_M, SOLAR_MASS_LENGTH_M, virbhadraEllisImages, weakFieldDeflection } from "@/lib/physics";
import type { LensSolution } from "@/lib/lensing/solution";
import { lensModelOf } from "@/lib/lensing/registry";
import { nightStartJdUtc } from "@/lib/astro/time";
import { hypothesisFromSketch } from "@/lib/workspace/bench-link";
import { eventTimingOf } from "@/lib/workspace/derived";
import { FINITE_SOURCE_METHOD } from "@/lib/lensing/finite-source";
import type { DisplayKind } from "./display-units";
import { eventMagnification, type EventSourceDisk } from "./event-magnification";
import { hasPhotonSphere, surfaceImpactParameterM } from "./lens-surface";
import { lensParametersOf, sourceOffsetThetaEOf, type SketchInputs } from "./parse-sketch";
import { formatSignificant } from "@/lib/numbers/significant";

export interface ResultRow {
  id: string;
  label: string;
  symbol: string;
  kind: DisplayKind;
  /** Radians, seconds, metres, or a plain number, by `kind`; NaN (shown as "—") when `note` says why there is none. */
  value: number;
  /** What qualifies the value: "hidden behind the lens", "limited by the source's size". */
  note?: string;
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
  /** The ray comes closer than the lens's radius: it ends on the surface, so no image forms from it. */
  hitsSurface: boolean;
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
  lensPlane: LensPlaneLayout;
  /** The microlensing event for the light-curve and astrometric plots; point lens with a proper motion only. */
  event?: MicrolensingEvent;
  /** Statements about the whole sketch (a lens with no photon sphere), shown under the rows. */
  notes: { id: string; text: string }[];
}

/** The bench's microlensing event: its scales and timing, and its source (`EventSourceDisk`). */
export interface MicrolensingEvent extends EventSourceDisk {
  thetaERad: number;
  einsteinTimeS: number;
  /** The peak, seconds from the campaign's start (`peakFromCampaignStartS`). */
  peakTimeS: number;
  /** The campaign's start, Julian date UTC: the cycle's start; null without cycle dates or a peak date. */
  campaignStartJdUtc: number | null;
  /** β, the impact parameter at the peak, units of θ_E. */
  u0ThetaE: number;
  cadenceS: number;
  campaignS: number;
}

function deflectionRow(id: string, label: string, bOverM: number, surfaceBOverM = 0): DeflectionRow {
  const exactRad = exactDeflection(bOverM, 1);
  const weakFieldRad = weakFieldDeflection(bOverM, 1, 1);
  const fractionalDifference = (weakFieldRad - exactRad) / exactRad;
  return {
    id,
    label,
    bOverM,
    exactRad,
    weakFieldRad,
    fractionalDifference,
    isWeakFieldOff: Math.abs(fractionalDifference) > WEAK_FIELD_TOLERANCE,
    hitsSurface: bOverM < surfaceBOverM,
  };
}

const HIDDEN_NOTE = "behind the lens: its ray passes closer than the lens's radius";

/** The lens model's solution of the sketch (β typed as an angle is turned into θ_E units first). */
function solveSketch(inputs: SketchInputs): LensSolution {
  const model = lensModelOf(inputs.lens.model);
  return model.solve({ parameters: lensParametersOf(inputs.lens), geometry: inputs.geometry, sourceOffsetThetaE: sourceOffsetThetaEOf(inputs), properMotionRadPerS: inputs.lightCurve.muRelRadPerS });
}

/**
 * Where the light curve's time axis starts: the first night of the cycle (local mean noon before it,
 * as the schedule counts), so the peak sits at its date; without a cycle or a peak date the peak is
 * drawn in the middle of the campaign.
 */
function campaignTiming(inputs: SketchInputs, peakJdUtc: number | null, campaignS: number): Pick<MicrolensingEvent, "peakTimeS" | "campaignStartJdUtc"> {
  const { cycleStartDate, site } = inputs.settings;
  if (peakJdUtc === null || cycleStartDate === null) return { peakTimeS: campaignS / 2, campaignStartJdUtc: null };
  const campaignStartJdUtc = nightStartJdUtc(cycleStartDate, site.longitudeDeg);
  return { peakTimeS: (peakJdUtc - campaignStartJdUtc) * DAY_S, campaignStartJdUtc };
}

const nanIfNull = (value: number | null) => value ?? Number.NaN;

/** Results for a point-mass lens: compact (a black hole) or a body of radius R that may hide an image. */
function pointLensResults(inputs: SketchInputs, massSolar: number, radiusM: number): BenchResults {
  const { dLensPc, dSourcePc, dLensSourcePc } = inputs.geometry;
  const solution = solveSketch(inputs);
  const { einsteinRadiusRad: thetaERad, sourceOffsetThetaE: u } = solution;
  const [outer, inner] = solution.images;
  const images = { thetaPlus: outer.positionThetaE, thetaMinus: inner.positionThetaE, magnificationPlus: outer.magnification, magnificationMinus: inner.magnification };
  const massLengthM = massSolar * SOLAR_MASS_LENGTH_M;
  const lensDistanceM = dLensPc * PARSEC_M;
  // b = D_L sin θ for the ray that reaches the observer at angle θ from the lens.
  const impactM = (thetaRad: number) => Math.abs(Math.sin(thetaRad)) * lensDistanceM;
  const surfaceImpactM = surfaceImpactParameterM(radiusM, massLengthM);
  const isCompact = hasPhotonSphere(radiusM, massLengthM);
  const isPlusHidden = impactM(images.thetaPlus * thetaERad) < surfaceImpactM;
  const isMinusHidden = impactM(images.thetaMinus * thetaERad) < surfaceImpactM;
  const isPair = !isPlusHidden && !isMinusHidden;
  const hiddenNote = (isHidden: boolean) => (isHidden ? { note: HIDDEN_NOTE } : {});

  const separationRad = nanIfNull(solution.imageSeparationRad);
  const timeDelayS = nanIfNull(solution.timeDelayS);
  const einsteinTimeS = nanIfNull(solution.einsteinTimeS);
  // The source's size and limb darkening as the stored target reads them (ρ typed, else R*/D_S over θ_E).
  const timing = eventTimingOf(hypothesisFromSketch(inputs), solution, inputs.geometry);
  const sourceRadiusThetaE = timing.sourceRadiusThetaE;
  const { instrument } = inputs.settings;
  const campaignS = instrument.campaignLengthDays * DAY_S;
  const source = { sourceRadiusThetaE, limbDarkeningU: timing.limbDarkeningU, occultingRadiusThetaE: surfaceImpactM / (lensDistanceM * thetaERad) };
  const event: MicrolensingEvent | undefined =
    solution.einsteinTimeS === null
      ? undefined
      : {
          thetaERad,
          einsteinTimeS,
          ...campaignTiming(inputs, timing.peakJdUtc, campaignS),
          u0ThetaE: u,
          cadenceS: instrument.cadenceHours * 3600,
          campaignS,
          ...source,
        };
  const peak = eventMagnification(u, source);

  // What an observer sees: only the images not behind the body count in the total and the centroid.
  const visibleMagnification = (isPlusHidden ? 0 : images.magnificationPlus) + (isMinusHidden ? 0 : Math.abs(images.magnificationMinus));
  const visibleCentroidShift = isPair ? nanIfNull(solution.centroidShiftRad) / thetaERad : isPlusHidden === isMinusHidden ? Number.NaN : Math.abs((isPlusHidden ? images.thetaMinus : images.thetaPlus) - u);
  const noPair = { note: isPlusHidden && isMinusHidden ? "both images are behind the lens" : "one image is behind the lens, so there is no pair" };

  const rows: ResultRow[] = [
    { id: "theta-e", label: "Einstein radius", symbol: "θ_E", kind: "angle", value: thetaERad },
    { id: "beta", label: "Source offset", symbol: "β", kind: "angle", value: u * thetaERad },
    { id: "theta-plus", label: "Image position, outer", symbol: "θ₊", kind: "angle", value: images.thetaPlus * thetaERad, ...hiddenNote(isPlusHidden) },
    { id: "theta-minus", label: "Image position, inner", symbol: "θ₋", kind: "angle", value: images.thetaMinus * thetaERad, ...hiddenNote(isMinusHidden) },
    { id: "separation", label: "Image separation", symbol: "Δθ", kind: "angle", value: isPair ? separationRad : Number.NaN, ...(isPair ? {} : noPair) },
    { id: "mu-plus", label: "Magnification, outer image", symbol: "μ₊", kind: "ratio", value: images.magnificationPlus, ...hiddenNote(isPlusHidden) },
    { id: "mu-minus", label: "Magnification, inner image", symbol: "μ₋", kind: "ratio", value: images.magnificationMinus, ...hiddenNote(isMinusHidden) },
    {
      id: "mu-total",
      label: isPair ? "Total magnification" : "Total magnification of the images seen",
      symbol: "μ",
      kind: "ratio",
      value: visibleMagnification,
      ...(isPair ? {} : { note: "images behind the lens are not counted" }),
    },
    { id: "flux-ratio", label: "Flux ratio, outer/inner", symbol: "|μ₊/μ₋|", kind: "ratio", value: isPair ? nanIfNull(solution.fluxRatio) : Number.NaN, ...(isPair ? {} : noPair) },
    { id: "time-delay", label: "Time delay between images", symbol: "Δt", kind: "time", value: isPair ? timeDelayS : Number.NaN, ...(isPair ? {} : noPair) },
    { id: "t-e", label: "Einstein crossing time", symbol: "t_E", kind: "time", value: einsteinTimeS },
    {
      id: "peak",
      label: "Peak magnification of the event",
      symbol: "A(u0)",
      kind: "ratio",
      value: peak.magnification,
      ...(peak.isLimitedBySourceSize
        ? { note: `limited by the source's size: for a disk of ρ = ${formatSignificant(sourceRadiusThetaE ?? 0, 3)} θ_E it differs by more than 1% from a point source's ${formatSignificant(peak.pointSourceMagnification, 4)}; ${FINITE_SOURCE_METHOD}` }
        : {}),
      ...(peak.magnification === 0 ? { note: "the source is behind the lens at closest approach: no image is seen" } : {}),
    },
    {
      id: "rho",
      label: "Source radius in Einstein radii",
      symbol: "ρ",
      kind: "ratio",
      value: nanIfNull(sourceRadiusThetaE),
      ...(sourceRadiusThetaE === null ? { note: "no source radius set: a point source" } : {}),
    },
    { id: "centroid-shift", label: isPair ? "Astrometric centroid shift" : "Shift of the image seen from the source", symbol: "δθ", kind: "angle", value: visibleCentroidShift * thetaERad },
    { id: "max-centroid-shift", label: "Largest centroid shift over the event (at u = √2)", symbol: "θ_E/√8", kind: "angle", value: nanIfNull(solution.maxAstrometricShiftRad) },
    {
      id: "pi-e",
      label: "Microlens parallax",
      symbol: "π_E",
      kind: "ratio",
      value: nanIfNull(solution.microlensParallax),
      ...(solution.microlensParallax === null ? { note: "needs the distances (a redshift sketch gives none)" } : {}),
    },
    { id: "r-s", label: "Schwarzschild radius", symbol: "R_S", kind: "length", value: 2 * massLengthM },
  ];
  if (radiusM > 0) rows.push({ id: "lens-angular-radius", label: "Angular radius of the lens's body", symbol: "θ_R", kind: "angle", value: radiusM / lensDistanceM });

  const deflections = [
    deflectionRow("deflection-plus", "Ray to the outer image", impactM(images.thetaPlus * thetaERad) / massLengthM, surfaceImpactM / massLengthM),
    deflectionRow("deflection-minus", "Ray to the inner image", impactM(images.thetaMinus * thetaERad) / massLengthM, surfaceImpactM / massLengthM),
    deflectionRow("deflection-ring", "Ray at the Einstein radius", impactM(thetaERad) / massLengthM, surfaceImpactM / massLengthM),
  ];
  const notes: BenchResults["notes"] = [];
  if (isCompact) {
    const exact = virbhadraEllisImages(u * thetaERad, massSolar, dLensPc, dSourcePc, dLensSourcePc);
    rows.push(
      { id: "r-ph", label: "Photon-sphere radius", symbol: "r_ph", kind: "length", value: photonSphereRadius(massLengthM) },
      { id: "shadow", label: "Shadow angular diameter", symbol: "θ_sh", kind: "angle", value: nanIfNull(solution.shadowDiameterRad) },
      { id: "photon-ring", label: "Photon ring radius, limit of the relativistic rings (exact lens equation)", symbol: "θ_∞", kind: "angle", value: exact.thetaInfinityRad },
      { id: "photon-ring-n1", label: "First relativistic Einstein ring (n = 1), diameter", symbol: "2θ₁", kind: "angle", value: nanIfNull(solution.photonRingDiameterRad) },
      { id: "rel-plus", label: "Relativistic image, source side", symbol: "θ₁₊", kind: "angle", value: exact.relativisticPrimary.thetaRad },
      { id: "rel-plus-mu", label: "Relativistic image magnification, source side", symbol: "μ₁₊", kind: "ratio", value: exact.relativisticPrimary.magnification },
      { id: "rel-minus", label: "Relativistic image, far side", symbol: "θ₁₋", kind: "angle", value: exact.relativisticSecondary.thetaRad },
      { id: "rel-minus-mu", label: "Relativistic image magnification, far side", symbol: "μ₁₋", kind: "ratio", value: exact.relativisticSecondary.magnification },
    );
    deflections.push(deflectionRow("deflection-rel-plus", "Ray to the relativistic image", impactM(exact.relativisticPrimary.thetaRad) / massLengthM));
  } else {
    notes.push({
      id: "no-photon-sphere",
      text: "The lens's body is larger than its photon sphere (R ≥ 3GM/c²): it has no photon sphere, no shadow and no relativistic images.",
    });
    deflections.push(deflectionRow("deflection-limb", "Ray grazing the lens's surface", surfaceImpactM / massLengthM));
  }

  if (!isPair) {
    // The science case's answers come from the target's hypothesis, which has no lens body: say what it leaves out.
    notes.push({
      id: "occulted-image",
      text:
        isPlusHidden && isMinusHidden
          ? "Both images lie behind the lens's body (their rays pass closer than its radius): the source is hidden. A target has no lens radius, so the science case below grades the images of a compact lens."
          : "The inner image lies behind the lens's body (its ray passes closer than its radius): one image is seen, no pair to resolve and no time delay. A target has no lens radius, so the science case below grades the images of a compact lens.",
    });
  }

  const lensPlaneImages = [];
  if (!isPlusHidden) lensPlaneImages.push({ thetaThetaE: images.thetaPlus, magnification: images.magnificationPlus });
  if (!isMinusHidden) lensPlaneImages.push({ thetaThetaE: images.thetaMinus, magnification: images.magnificationMinus });
  return { rows, deflections, lensPlane: { thetaERad, betaThetaE: u, images: lensPlaneImages }, ...(event === undefined ? {} : { event }), notes };
}

/** Results for a singular isothermal sphere: no Schwarzschild rows, one image when β ≥ θ_E. */
function sisResults(inputs: SketchInputs): BenchResults {
  const solution = solveSketch(inputs);
  const { einsteinRadiusRad: thetaERad, sourceOffsetThetaE: u } = solution;
  const [outer, inner] = solution.images;
  const rows: ResultRow[] = [
    { id: "theta-e", label: "Einstein radius", symbol: "θ_E", kind: "angle", value: thetaERad },
    { id: "beta", label: "Source offset", symbol: "β", kind: "angle", value: u * thetaERad },
    { id: "theta-plus", label: "Image position, outer", symbol: "θ₊", kind: "angle", value: outer.positionThetaE * thetaERad },
    { id: "mu-plus", label: "Magnification, outer image", symbol: "μ₊", kind: "ratio", value: outer.magnification },
    { id: "mu-total", label: "Total magnification", symbol: "μ", kind: "ratio", value: solution.magnificationTotal },
    { id: "t-e", label: "Einstein crossing time", symbol: "t_E", kind: "time", value: nanIfNull(solution.einsteinTimeS) },
  ];
  if (inner !== undefined && solution.imageSeparationRad !== null && solution.timeDelayS !== null) {
    rows.splice(
      3,
      0,
      { id: "theta-minus", label: "Image position, inner", symbol: "θ₋", kind: "angle", value: inner.positionThetaE * thetaERad },
      { id: "separation", label: "Image separation", symbol: "Δθ", kind: "angle", value: solution.imageSeparationRad },
    );
    rows.splice(
      6,
      0,
      { id: "mu-minus", label: "Magnification, inner image", symbol: "μ₋", kind: "ratio", value: inner.magnification },
      { id: "flux-ratio", label: "Flux ratio, outer/inner", symbol: "|μ₊/μ₋|", kind: "ratio", value: nanIfNull(solution.fluxRatio) },
    );
    rows.push({ id: "time-delay", label: "Time delay between images", symbol: "Δt", kind: "time", value: solution.timeDelayS });
  }
  return {
    rows,
    deflections: [],
    lensPlane: { thetaERad, betaThetaE: u, images: solution.images.map(({ positionThetaE, magnification }) => ({ thetaThetaE: positionThetaE, magnification })) },
    notes: [],
  };
}

/** The bench's results of each lens model: the solution's rows plus what the bench adds for that model. */
function resultsOf(inputs: SketchInputs): BenchResults {
  const { lens } = inputs;
  switch (lens.model) {
    case "point":
      return pointLensResults(inputs, lens.massSolar, lens.radiusM);
    case "sis":
      return sisResults(inputs);
    default:
      return lens satisfies never;
  }
}

export type ComputedSketch = { ok: true; results: BenchResults } | { ok: false; message: string };

/**
 * The results of a parsed sketch. Inputs that parse but that the physics rejects (a ray inside the
 * photon sphere, a distance outside a formula's domain) come back as a message, never as a throw.
 */
export function computeResults(inputs: SketchInputs): ComputedSketch {
  try {
    return { ok: true, results: resultsOf(inputs) };
  } catch {
    // The accepted ranges are meant to keep every sketch computable; the physics' own message names
    // its arguments, which mean nothing to the user, so it is not shown.
    return { ok: false, message: "These values lie outside what the bench can compute; bring the lens, distances or source offset nearer the examples." };
  }
}
