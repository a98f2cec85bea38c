/**
 * Turns the typed sketch into numbers through the physics units module, collecting one message per
 * field so the form can show each error beside its input. Only the fields the chosen lens model,
 * geometry and instrument actually use are parsed: a stale value in a hidden field is not an error.
 */

import {
  angularDiameterDistance,
  angularDiameterDistanceBetween,
  PARSEC_M,
  parseAngle,
  parseDistance,
  parseLength,
  parseMass,
  parseNumber,
  parseProperMotion,
  parseTime,
  parseVelocity,
  parseWavelength,
  QuantityError,
  SOLAR_MASS_LENGTH_M,
} from "@/lib/physics";
import { acceptedRanges, isInRange, lensCompactness, MAX_LENS_COMPACTNESS, boundText, rangeText, type AcceptedRange } from "@/lib/physics/accepted-ranges";
import { JULIAN_YEAR_S, MILLIARCSECOND_RAD } from "@/lib/physics/constants";
import type { LensParameterKey } from "@/lib/lensing/lens-model";
import { lensModelOf } from "@/lib/lensing/registry";
import { fieldLabels, lensSketches, type Sketch, type SketchField } from "./sketch-state";

/** Most rays the bench traces at once (issue 4: "count up to 5,000"). */
export const MAX_RAY_COUNT = 5000;

/** Largest impact parameter of the bundle, units of M; the traced region grows with it. */
export const MAX_BUNDLE_IMPACT_M = 100;

export type FieldErrors = Partial<Record<SketchField, string>>;

/** The lens, as the results need it: one member per lens model of the registry. */
export type LensInputs =
  | {
      model: "point";
      massSolar: number;
      /** The body's radius, metres; 0 for a compact object (inside its photon sphere, r < 3M). */
      radiusM: number;
    }
  | { model: "sis"; sigmaKmPerS: number };

/** The lens model's parameters (`lib/lensing/registry.ts`) of the bench's lens. */
export function lensParametersOf(lens: LensInputs): Record<LensParameterKey, number> {
  switch (lens.model) {
    case "point":
      return { lensMassSolar: lens.massSolar } as Record<LensParameterKey, number>;
    case "sis":
      return { velocityDispersionKmPerS: lens.sigmaKmPerS } as Record<LensParameterKey, number>;
    default:
      return lens satisfies never;
  }
}

/** Distances in parsecs; `zLens` is 0 for a Galactic (distance-only) sketch. */
export interface GeometryInputs {
  dLensPc: number;
  dSourcePc: number;
  dLensSourcePc: number;
  zLens: number;
}

/** β is either an angle or a multiple of θ_E, which is only known once the lens is solved. */
export type SourceOffsetInputs = { unit: "angle"; betaRad: number } | { unit: "thetaE"; betaThetaE: number };

export interface InstrumentInputs {
  /** Smallest separation the instrument resolves: the PSF FWHM, or λ/B for an interferometer. */
  resolutionRad: number;
  /** How the resolution is named in verdicts ("FWHM" or "λ/B"). */
  resolutionName: "FWHM" | "λ/B";
  cadenceS: number;
  campaignS: number;
}

export interface LightCurveInputs {
  muRelRadPerS: number;
  /** Peak time, seconds from the start of the campaign. */
  peakTimeS: number;
  /** Impact parameter at peak, units of θ_E. */
  u0ThetaE: number;
  /** The source's radius, metres (its finite-source magnification along the light curve). */
  sourceRadiusM: number;
}

export interface BundleInputs {
  rayCount: number;
  bMinM: number;
  bMaxM: number;
  layout: Sketch["layout"];
}

export interface SketchInputs {
  lens: LensInputs;
  geometry: GeometryInputs;
  sourceOffset: SourceOffsetInputs;
  lightCurve: LightCurveInputs;
  instrument: InstrumentInputs;
  bundle: BundleInputs;
}

/** Values that parse and compute but deserve a second look, shown beside their field. */
export type FieldWarnings = Partial<Record<SketchField, string>>;

export type ParsedSketch = { ok: true; inputs: SketchInputs; warnings: FieldWarnings } | { ok: false; fieldErrors: FieldErrors };

/** Collects field errors while reading values; `read` returns NaN for a failed field so parsing goes on. */
class FieldReader {
  readonly errors: FieldErrors = {};

  constructor(private readonly sketch: Sketch) {}

  read(field: SketchField, parse: (text: string) => number, check?: (value: number) => string | undefined): number {
    try {
      const value = parse(this.sketch[field]);
      const problem = check?.(value);
      if (problem !== undefined) {
        this.errors[field] = problem;
        return Number.NaN;
      }
      return value;
    } catch (error) {
      // The parser's problem is in the user's words; the field's label says which field it is.
      this.errors[field] = error instanceof QuantityError ? `${fieldLabels[field]}: '${error.input}' ${error.problem}` : `${fieldLabels[field]} cannot be read`;
      return Number.NaN;
    }
  }
}

/** A bare number ("0.3", "2e3", "4,100,000"), with the comma rules of every field; units are not allowed. */
export function parsePlainNumber(text: string): number {
  return parseNumber(text);
}

/**
 * The unit a bare number is read in, per field (the hint says so and the echo repeats it). Fields
 * that are plain numbers (redshifts, u0, β in θ_E, ray inputs) have none.
 */
export const defaultUnits = {
  mass: "Msun",
  sigma: "km/s",
  dl: "kpc",
  ds: "kpc",
  mu: "mas/yr",
  t0: "d",
  cadence: "d",
  campaign: "d",
  fwhm: "mas",
  lambda: "um",
  baseline: "m",
  radius: "Rsun",
  rstar: "Rsun",
  beta: "mas",
} as const satisfies Partial<Record<SketchField, string>>;

/** What the lens-radius field takes for "no surface outside the photon sphere" (the default). */
const COMPACT_WORDS = new Set(["", "compact", "compact object", "none", "black hole"]);

/** True when the lens-radius text means a compact object rather than a typed radius. */
export function isCompactRadiusText(text: string): boolean {
  return COMPACT_WORDS.has(text.trim().toLowerCase());
}

/** A check that passes values above zero and otherwise returns `message`. */
const positive = (message: string) => (value: number) => (value > 0 ? undefined : message);

/**
 * A check that passes values inside `range` (in the unit the parser returns, scaled by `toRangeUnit`)
 * and otherwise returns `message`: the lensing layer's accepted ranges, so that nothing derived
 * overflows or leaves a formula's domain.
 */
const within = (range: AcceptedRange, message: string, toRangeUnit = 1) => (value: number) => (isInRange(value * toRangeUnit, range) ? undefined : message);

/** Bench-only bounds (our rule): H0 from 10 to 200 km/s/Mpc (measured values are 67–74); times within ±100 years. */
const HUBBLE_RANGE: AcceptedRange = { min: 10, max: 200 };
const MAX_TIME_S = 100 * JULIAN_YEAR_S;
/** Resolution from 1e-12 rad (0.2 nanoarcseconds) to 1 rad; wavelengths and baselines from 1 nm to 1e10 m (our rule). */
const RESOLUTION_RANGE_RAD: AcceptedRange = { min: 1e-12, max: 1 };
const INTERFEROMETER_LENGTH_RANGE_M: AcceptedRange = { min: 1e-9, max: 1e10 };

function readLens(reader: FieldReader, sketch: Sketch): LensInputs {
  switch (sketch.lens) {
    case "sis":
      return {
        model: "sis",
        sigmaKmPerS: reader.read(
          "sigma",
          (text) => parseVelocity(text, { defaultUnit: defaultUnits.sigma }),
          within(acceptedRanges.velocityDispersionKmPerS, `The velocity dispersion must lie between ${rangeText(acceptedRanges.velocityDispersionKmPerS)} km/s (far below the speed of light, 299\u202f792 km/s)`),
        ),
      };
    case "point": {
      const radiusM = isCompactRadiusText(sketch.radius)
        ? 0
        : reader.read("radius", (text) => parseLength(text, { defaultUnit: defaultUnits.radius }), within(LENS_RADIUS_RANGE_M, "The lens radius lies between 1 mm and 1 pc; type compact for a black hole"));
      return {
        model: "point",
        massSolar: reader.read("mass", (text) => parseMass(text, { defaultUnit: defaultUnits.mass }).massSolar, within(acceptedRanges.lensMassSolar, `The mass must lie between ${rangeText(acceptedRanges.lensMassSolar)} solar masses`)),
        radiusM,
      };
    }
    default:
      return sketch.lens satisfies never;
  }
}

/** Lens and source radii, metres (our rule): from 1 mm to 1 pc, beyond any body that lenses as one mass. */
const LENS_RADIUS_RANGE_M: AcceptedRange = { min: 1e-3, max: PARSEC_M };
const SOURCE_RADIUS_RANGE_M: AcceptedRange = { min: 1e-3, max: PARSEC_M };

/**
 * Velocity dispersions above this are accepted with a warning (our rule): the richest galaxy clusters
 * have about 1,500 km/s; the accepted range stops at 3,000 km/s, 1% of the speed of light.
 */
export const SIGMA_WARNING_KM_PER_S = 1500;

function readGeometry(reader: FieldReader, sketch: Sketch): GeometryInputs {
  if (sketch.geometry === "distance") {
    const distanceMessage = "Distances lie between 1e-6 pc (0.2 au) and 20 Gpc";
    const dLensPc = reader.read("dl", (text) => parseDistance(text, { defaultUnit: defaultUnits.dl }), within(acceptedRanges.distancePc, distanceMessage));
    const dSourcePc = reader.read("ds", (text) => parseDistance(text, { defaultUnit: defaultUnits.ds }), (value) => {
      if (!isInRange(value, acceptedRanges.distancePc)) return distanceMessage;
      return value > dLensPc || Number.isNaN(dLensPc) ? undefined : "The source must lie behind the lens (D_S > D_L)";
    });
    return { dLensPc, dSourcePc, dLensSourcePc: dSourcePc - dLensPc, zLens: 0 };
  }
  const h0 = reader.read("h0", parsePlainNumber, within(HUBBLE_RANGE, "H0 must lie between 10 and 200 km/s/Mpc"));
  const om0 = reader.read("om0", parsePlainNumber, (value) => (value >= 0 && value <= 1 ? undefined : "Ωm must lie between 0 and 1"));
  const redshiftMessage = `Redshifts lie between ${rangeText(acceptedRanges.redshift)} (nearer, give distances instead)`;
  const zLens = reader.read("zl", parsePlainNumber, within(acceptedRanges.redshift, redshiftMessage));
  const zSource = reader.read("zs", parsePlainNumber, (value) => {
    if (!isInRange(value, acceptedRanges.redshift)) return redshiftMessage;
    return value > zLens || Number.isNaN(zLens) ? undefined : "The source must lie behind the lens (z_S > z_L)";
  });
  if ([h0, om0, zLens, zSource].some(Number.isNaN)) return { dLensPc: NaN, dSourcePc: NaN, dLensSourcePc: NaN, zLens };
  const cosmology = { H0: h0, Om0: om0 };
  return {
    dLensPc: angularDiameterDistance(zLens, cosmology),
    dSourcePc: angularDiameterDistance(zSource, cosmology),
    dLensSourcePc: angularDiameterDistanceBetween(zLens, zSource, cosmology),
    zLens,
  };
}

const sourceOffsetMessage = `β must lie between ${rangeText(acceptedRanges.sourceOffsetThetaE)} θ_E (closer, a real source's size caps the magnification)`;

function readSourceOffset(reader: FieldReader, sketch: Sketch): SourceOffsetInputs {
  const aboveZero = positive("β must be greater than zero (at β = 0 the image is a ring of unbounded magnification)");
  // An angle is checked against θ_E once the lens is known (checkLensScales).
  if (sketch.betaUnit === "angle") return { unit: "angle", betaRad: reader.read("beta", (text) => parseAngle(text, { defaultUnit: defaultUnits.beta }), aboveZero) };
  return { unit: "thetaE", betaThetaE: reader.read("beta", parsePlainNumber, within(acceptedRanges.sourceOffsetThetaE, sourceOffsetMessage)) };
}

function readInstrument(reader: FieldReader, sketch: Sketch): InstrumentInputs {
  const cadenceS = reader.read("cadence", (text) => parseTime(text, { defaultUnit: defaultUnits.cadence }), (value) => (value >= 1 && value <= MAX_TIME_S ? undefined : "The cadence must lie between 1 second and 100 years"));
  const campaignS = reader.read("campaign", (text) => parseTime(text, { defaultUnit: defaultUnits.campaign }), (value) => {
    if (!(value <= MAX_TIME_S)) return "The campaign lasts at most 100 years";
    return value >= cadenceS || Number.isNaN(cadenceS) ? undefined : "The campaign must last at least one cadence interval";
  });
  if (sketch.resolution === "fwhm") {
    const fwhmRad = reader.read("fwhm", (text) => parseAngle(text, { defaultUnit: defaultUnits.fwhm }), within(RESOLUTION_RANGE_RAD, "The FWHM must lie between 0.2 nanoarcseconds and 1 radian"));
    return { resolutionRad: fwhmRad, resolutionName: "FWHM", cadenceS, campaignS };
  }
  const lengthCheck = within(INTERFEROMETER_LENGTH_RANGE_M, "Lengths here lie between 1 nm and 10 million km");
  const wavelengthM = reader.read("lambda", (text) => parseWavelength(text, { defaultUnit: defaultUnits.lambda }), lengthCheck);
  const baselineM = reader.read("baseline", (text) => parseLength(text, { defaultUnit: defaultUnits.baseline }), lengthCheck);
  // λ/B is the interferometric resolution element (fringe spacing) for the longest baseline.
  return { resolutionRad: wavelengthM / baselineM, resolutionName: "λ/B", cadenceS, campaignS };
}

function readLightCurve(reader: FieldReader, sketch: Sketch): LightCurveInputs {
  return {
    muRelRadPerS: reader.read(
      "mu",
      (text) => parseProperMotion(text, { defaultUnit: defaultUnits.mu }),
      within(acceptedRanges.properMotionMasPerYr, `The relative proper motion must lie between ${rangeText(acceptedRanges.properMotionMasPerYr)} mas/yr`, JULIAN_YEAR_S / MILLIARCSECOND_RAD),
    ),
    peakTimeS: reader.read("t0", (text) => parseTime(text, { defaultUnit: defaultUnits.t0 }), (value) => (Math.abs(value) <= MAX_TIME_S ? undefined : "The peak time lies within 100 years of the campaign start")),
    u0ThetaE: reader.read("u0", parsePlainNumber, within(acceptedRanges.sourceOffsetThetaE, `u0 must lie between ${rangeText(acceptedRanges.sourceOffsetThetaE)} (closer, a real source's size caps the peak magnification)`)),
    // The source's size matters only to the point lens's light curve.
    sourceRadiusM:
      lensSketches[sketch.lens].hasLightCurve
        ? reader.read("rstar", (text) => parseLength(text, { defaultUnit: defaultUnits.rstar }), within(SOURCE_RADIUS_RANGE_M, "The source radius lies between 1 mm and 1 pc"))
        : Number.NaN,
  };
}

function readBundle(reader: FieldReader, sketch: Sketch): BundleInputs {
  const rayCount = reader.read("rays", parsePlainNumber, (value) =>
    Number.isInteger(value) && value >= 1 && value <= MAX_RAY_COUNT ? undefined : `The ray count must be a whole number from 1 to ${MAX_RAY_COUNT}`,
  );
  const bMinM = reader.read("bmin", parsePlainNumber, positive("The smallest impact parameter must be greater than zero"));
  const bMaxM = reader.read("bmax", parsePlainNumber, (value) => {
    if (!(value > bMinM) && !Number.isNaN(bMinM)) return "The largest impact parameter must exceed the smallest";
    return value <= MAX_BUNDLE_IMPACT_M ? undefined : `The largest impact parameter is at most ${MAX_BUNDLE_IMPACT_M} M`;
  });
  return { rayCount, bMinM, bMaxM, layout: sketch.layout };
}

/** Largest source offset β the bench accepts, radians (our rule: 0.1 rad = 5.7°, inside the exact lens equation's 0.5 rad domain). */
const MAX_SOURCE_OFFSET_RAD = 0.1;

/**
 * The checks across fields, once the lens and the geometry have parsed: a point lens far enough
 * from the observer for the thin-lens set-up (`MAX_LENS_COMPACTNESS`), and β inside its range both
 * as a multiple of θ_E and as an angle. Field errors go beside the field to change.
 */
function checkLensScales(errors: FieldErrors, sketch: Sketch, { lens, geometry, sourceOffset }: Pick<SketchInputs, "lens" | "geometry" | "sourceOffset">): void {
  const distanceField = sketch.geometry === "distance" ? "dl" : "zl";
  if (lens.model === "point" && lensCompactness(lens.massSolar, geometry.dLensPc) > MAX_LENS_COMPACTNESS) {
    const message = "The lens is too close for its mass: its gravitational radius exceeds 1/10,000 of its distance, where the thin-lens formulas fail";
    errors.mass = message;
    errors[distanceField] = message;
    return;
  }
  if (lens.model === "point" && lens.radiusM > 0 && lens.radiusM <= 2 * lens.massSolar * SOLAR_MASS_LENGTH_M) {
    errors.radius = "A body this small for its mass lies inside its own horizon (R ≤ 2GM/c²): type compact for a black hole";
    return;
  }
  const thetaERad = lensModelOf(lens.model).einsteinRadiusRad(lensParametersOf(lens), geometry);
  const betaRad = sourceOffset.unit === "angle" ? sourceOffset.betaRad : sourceOffset.betaThetaE * thetaERad;
  if (sourceOffset.unit === "angle" && !isInRange(betaRad / thetaERad, acceptedRanges.sourceOffsetThetaE)) {
    errors.beta = `β must lie between ${rangeText(acceptedRanges.sourceOffsetThetaE)} Einstein radii of this lens`;
  } else if (!(betaRad <= MAX_SOURCE_OFFSET_RAD)) {
    errors.beta = "β must be at most 0.1 radian (5.7°) from the lens";
  }
}

/** Parses every field the sketch uses; on any error returns all the field errors at once. */
export function parseSketch(sketch: Sketch): ParsedSketch {
  const reader = new FieldReader(sketch);
  const inputs: SketchInputs = {
    lens: readLens(reader, sketch),
    geometry: readGeometry(reader, sketch),
    sourceOffset: readSourceOffset(reader, sketch),
    lightCurve: readLightCurve(reader, sketch),
    instrument: readInstrument(reader, sketch),
    bundle: readBundle(reader, sketch),
  };
  const lensFields = ["mass", "sigma", "dl", "ds", "h0", "om0", "zl", "zs", "beta", "radius"] as const;
  if (lensFields.every((field) => reader.errors[field] === undefined)) checkLensScales(reader.errors, sketch, inputs);
  if (Object.keys(reader.errors).length > 0) return { ok: false, fieldErrors: reader.errors };
  return { ok: true, inputs, warnings: sketchWarnings(inputs) };
}

function sketchWarnings({ lens }: SketchInputs): FieldWarnings {
  if (lens.model === "sis" && lens.sigmaKmPerS > SIGMA_WARNING_KM_PER_S) {
    return { sigma: `Above ${boundText(SIGMA_WARNING_KM_PER_S)} km/s, faster than in the richest galaxy clusters known: check the value` };
  }
  return {};
}

export type ParsedBundle = { ok: true; bundle: BundleInputs } | { ok: false; fieldErrors: FieldErrors };

/** Only the ray-bundle fields: the bundle is in units of M, so it never waits on the lens or geometry. */
export function parseBundle(sketch: Sketch): ParsedBundle {
  const reader = new FieldReader(sketch);
  const bundle = readBundle(reader, sketch);
  if (Object.keys(reader.errors).length > 0) return { ok: false, fieldErrors: reader.errors };
  return { ok: true, bundle };
}
