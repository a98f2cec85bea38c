/**
 * Turns the typed sketch into numbers through the physics units module, collecting one message per
 * field so the form can show each error beside its input. Only the fields the chosen lens model and
 * geometry actually use are parsed: a stale value in a hidden field is not an error. The target's own
 * inputs (position, science case, event peak, source size) and the proposal's settings (instrument,
 * site, cycle, observing constraints) are read by the very readers the target and proposal forms use
 * (`lib/workspace/quantity-field.ts`, `coordinates.ts`, `event-peak.ts`), into their stored units, so
 * a sketch means what the same text means on a target or a proposal.
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
import { DAY_S, JULIAN_YEAR_S, MILLIARCSECOND_RAD } from "@/lib/physics/constants";
import type { LensParameterKey } from "@/lib/lensing/lens-model";
import { lensModelOf } from "@/lib/lensing/registry";
import type { ScienceCaseId } from "@/lib/lensing/science-case-inputs";
import { nightDateSchema } from "@/lib/astro/inputs";
import { CoordinateError, parseDeclinationDeg, parseRightAscensionDeg } from "@/lib/workspace/coordinates";
import type { FeasibilitySettings } from "@/lib/workspace/derived";
import { EventPeakError, parseEventPeakJdUtc } from "@/lib/workspace/event-peak";
import { proposalQuantities, proposalSettingsErrors } from "@/lib/workspace/proposal-schema";
import { readQuantityField, type QuantitySpec } from "@/lib/workspace/quantity-field";
import { targetQuantities } from "@/lib/workspace/target-schema";
import { fieldLabels, type Sketch, type SketchField } from "./sketch-state";
import { roundToSignificant } from "@/lib/numbers/significant";

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

/** β in units of θ_E: as typed, or an angle divided by the lens's θ_E (a target stores it so). */
export function sourceOffsetThetaEOf({ lens, geometry, sourceOffset }: Pick<SketchInputs, "lens" | "geometry" | "sourceOffset">): number {
  if (sourceOffset.unit === "thetaE") return sourceOffset.betaThetaE;
  return sourceOffset.betaRad / lensModelOf(lens.model).einsteinRadiusRad(lensParametersOf(lens), geometry);
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

export interface LightCurveInputs {
  /** Relative proper motion, rad/s; null when not set (no t_E, no light curve). */
  muRelRadPerS: number | null;
}

/**
 * The target's own inputs beyond the lens, in a target's stored units; null where the field is empty
 * (not set). β is the impact parameter u0 at the peak, as on a target.
 */
export interface EventInputs {
  /** ICRS position, degrees. */
  raDeg: number;
  decDeg: number;
  /** The case chosen; null: inferred from the lens and the instrument. */
  scienceCase: ScienceCaseId | null;
  /** The event's peak, Julian date UTC. */
  eventPeakJdUtc: number | null;
  sourceRadiusSolar: number | null;
  sourceRadiusThetaE: number | null;
  limbDarkeningU: number | null;
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
  /** The redshifts of a redshift sketch (a target keeps them, not the distances); null for distances. */
  redshifts: { lens: number; source: number } | null;
  sourceOffset: SourceOffsetInputs;
  lightCurve: LightCurveInputs;
  event: EventInputs;
  /** The proposal's side: instrument, site and cycle, in a proposal's stored units. */
  settings: FeasibilitySettings;
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

  /** A target's or proposal's quantity, read by its form's reader into its stored unit. */
  quantity(field: SketchField, spec: QuantitySpec): number {
    const reading = readQuantityField(spec, this.sketch[field]);
    if (reading.ok) return reading.value;
    this.errors[field] = reading.message;
    return Number.NaN;
  }

  /** The same, empty text being "not set". */
  optionalQuantity(field: SketchField, spec: QuantitySpec): number | null {
    return this.sketch[field].trim() === "" ? null : this.quantity(field, spec);
  }
}

/** A bare number ("0.3", "2e3", "4,100,000"), with the comma rules of every field; units are not allowed. */
export function parsePlainNumber(text: string): number {
  return parseNumber(text);
}

/**
 * The unit a bare number is read in, per field (the hint says so and the echo repeats it). Fields
 * that are plain numbers (redshifts, β in θ_E, ray inputs) have none. The target's and proposal's
 * own fields read a bare number in their stored unit (`targetQuantities`, `proposalQuantities`).
 */
export const defaultUnits = {
  mass: "Msun",
  sigma: "km/s",
  dl: "kpc",
  ds: "kpc",
  mu: "mas/yr",
  cadence: "d",
  campaign: "d",
  fwhm: "mas",
  lambda: "um",
  baseline: "m",
  radius: "Rsun",
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

/** Bench-only bound (our rule): H0 from 10 to 200 km/s/Mpc (measured values are 67–74). */
const HUBBLE_RANGE: AcceptedRange = { min: 10, max: 200 };

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

/** Lens radii, metres (our rule): from 1 mm to 1 pc, beyond any body that lenses as one mass. */
const LENS_RADIUS_RANGE_M: AcceptedRange = { min: 1e-3, max: PARSEC_M };

/**
 * Velocity dispersions above this are accepted with a warning (our rule): the richest galaxy clusters
 * have about 1,500 km/s; the accepted range stops at 3,000 km/s, 1% of the speed of light.
 */
export const SIGMA_WARNING_KM_PER_S = 1500;

function readGeometry(reader: FieldReader, sketch: Sketch): Pick<SketchInputs, "geometry" | "redshifts"> {
  if (sketch.geometry === "distance") {
    const distanceMessage = `Distances lie between ${boundText(acceptedRanges.distancePc.min)} pc (0.2 au) and 20 Gpc`;
    const dLensPc = reader.read("dl", (text) => parseDistance(text, { defaultUnit: defaultUnits.dl }), within(acceptedRanges.distancePc, distanceMessage));
    const dSourcePc = reader.read("ds", (text) => parseDistance(text, { defaultUnit: defaultUnits.ds }), (value) => {
      if (!isInRange(value, acceptedRanges.distancePc)) return distanceMessage;
      return value > dLensPc || Number.isNaN(dLensPc) ? undefined : "The source must lie behind the lens (D_S > D_L)";
    });
    return { geometry: { dLensPc, dSourcePc, dLensSourcePc: dSourcePc - dLensPc, zLens: 0 }, redshifts: null };
  }
  const h0 = reader.read("h0", parsePlainNumber, within(HUBBLE_RANGE, "H0 must lie between 10 and 200 km/s/Mpc"));
  const om0 = reader.read("om0", parsePlainNumber, (value) => (value >= 0 && value <= 1 ? undefined : "Ωm must lie between 0 and 1"));
  const redshiftMessage = `Redshifts lie between ${rangeText(acceptedRanges.redshift)} (nearer, give distances instead)`;
  const zLens = reader.read("zl", parsePlainNumber, within(acceptedRanges.redshift, redshiftMessage));
  const zSource = reader.read("zs", parsePlainNumber, (value) => {
    if (!isInRange(value, acceptedRanges.redshift)) return redshiftMessage;
    return value > zLens || Number.isNaN(zLens) ? undefined : "The source must lie behind the lens (z_S > z_L)";
  });
  const redshifts = { lens: zLens, source: zSource };
  if ([h0, om0, zLens, zSource].some(Number.isNaN)) return { geometry: { dLensPc: NaN, dSourcePc: NaN, dLensSourcePc: NaN, zLens }, redshifts };
  const cosmology = { H0: h0, Om0: om0 };
  return {
    geometry: {
      dLensPc: angularDiameterDistance(zLens, cosmology),
      dSourcePc: angularDiameterDistance(zSource, cosmology),
      dLensSourcePc: angularDiameterDistanceBetween(zLens, zSource, cosmology),
      zLens,
    },
    redshifts,
  };
}

const sourceOffsetMessage = `β must lie between ${rangeText(acceptedRanges.sourceOffsetThetaE)} θ_E (closer, a real source's size caps the magnification)`;

function readSourceOffset(reader: FieldReader, sketch: Sketch): SourceOffsetInputs {
  const aboveZero = positive("β must be greater than zero (at β = 0 the image is a ring of unbounded magnification)");
  // An angle is checked against θ_E once the lens is known (checkLensScales).
  if (sketch.betaUnit === "angle") return { unit: "angle", betaRad: reader.read("beta", (text) => parseAngle(text, { defaultUnit: defaultUnits.beta }), aboveZero) };
  return { unit: "thetaE", betaThetaE: reader.read("beta", parsePlainNumber, within(acceptedRanges.sourceOffsetThetaE, sourceOffsetMessage)) };
}

/**
 * Twelve significant digits: a unit conversion ("4 kpc" → 3999.9999999999995 pc, "6 h" in seconds and
 * back) comes back as typed, so a stored value carried through a link is the stored value again.
 */
export const tidy = (value: number) => roundToSignificant(value, 12);

/** The proposal's instrument: the bench's typed fields in a proposal's stored units (mas, h, d, mm, km). */
function readInstrument(reader: FieldReader, sketch: Sketch): FeasibilitySettings["instrument"] {
  const cadenceS = reader.read("cadence", (text) => parseTime(text, { defaultUnit: defaultUnits.cadence }), within(proposalQuantities.cadenceHours.range, proposalQuantities.cadenceHours.rangeMessage, 1 / 3600));
  const campaignS = reader.read("campaign", (text) => parseTime(text, { defaultUnit: defaultUnits.campaign }), within(proposalQuantities.campaignLengthDays.range, proposalQuantities.campaignLengthDays.rangeMessage, 1 / DAY_S));
  const fwhmRad = reader.read("fwhm", (text) => parseAngle(text, { defaultUnit: defaultUnits.fwhm }), within(proposalQuantities.resolutionMas.range, proposalQuantities.resolutionMas.rangeMessage, 1 / MILLIARCSECOND_RAD));
  // Each is read when typed; one without the other is the proposal's both-or-neither rule (readSettings).
  const wavelengthM =
    sketch.lambda.trim() === ""
      ? null
      : reader.read("lambda", (text) => parseWavelength(text, { defaultUnit: defaultUnits.lambda }), within(proposalQuantities.interferometerWavelengthMm.range, proposalQuantities.interferometerWavelengthMm.rangeMessage, 1000));
  const baselineM =
    sketch.baseline.trim() === ""
      ? null
      : reader.read("baseline", (text) => parseLength(text, { defaultUnit: defaultUnits.baseline }), within(proposalQuantities.interferometerBaselineKm.range, proposalQuantities.interferometerBaselineKm.rangeMessage, 1 / 1000));
  return {
    resolutionMas: tidy(fwhmRad / MILLIARCSECOND_RAD),
    cadenceHours: tidy(cadenceS / 3600),
    campaignLengthDays: tidy(campaignS / DAY_S),
    airmassLimit: reader.quantity("airmass", proposalQuantities.airmassLimit),
    interferometerWavelengthMm: wavelengthM === null ? null : tidy(wavelengthM * 1000),
    interferometerBaselineKm: baselineM === null ? null : tidy(baselineM / 1000),
    moonMinSeparationDeg: reader.optionalQuantity("moonSep", proposalQuantities.moonMinSeparationDeg),
    moonMaxIllumination: reader.optionalQuantity("moonIllum", proposalQuantities.moonMaxIllumination),
    visitMinutes: reader.quantity("visit", proposalQuantities.visitMinutes),
    clearNightFraction: reader.quantity("clear", proposalQuantities.clearNightFraction),
    astrometricPrecisionMas: reader.optionalQuantity("astrometry", proposalQuantities.astrometricPrecisionMas),
    reachableContrast: reader.optionalQuantity("contrast", proposalQuantities.reachableContrast),
    // The bench sketches no orbiting star, so no redshift is graded against a spectrograph there.
    spectroscopicPrecisionKmPerS: null,
  };
}

/** A cycle date: empty is "not set". */
function readNightDate(reader: FieldReader, sketch: Sketch, field: "cycleStart" | "cycleEnd"): string | null {
  const text = sketch[field].trim();
  if (text === "") return null;
  const date = nightDateSchema.safeParse(text);
  if (date.success) return date.data;
  reader.errors[field] = `${fieldLabels[field]}: ${date.error.issues[0]?.message ?? "The date must be written YYYY-MM-DD."}`;
  return null;
}

/** The proposal's side: instrument, site and cycle, checked across fields by the proposal's own rule. */
function readSettings(reader: FieldReader, sketch: Sketch): FeasibilitySettings {
  const settings: FeasibilitySettings = {
    site: {
      name: sketch.site.trim() === "" ? "Site of the sketch" : sketch.site.trim(),
      latitudeDeg: reader.quantity("lat", proposalQuantities.latitudeDeg),
      longitudeDeg: reader.quantity("lon", proposalQuantities.longitudeDeg),
      elevationM: reader.quantity("elev", proposalQuantities.elevationM),
      horizonLimitDeg: reader.quantity("horizon", proposalQuantities.horizonLimitDeg),
    },
    instrument: readInstrument(reader, sketch),
    // The bench has no camera: the photon budget is the proposal's (its target page).
    photometry: null,
    cycleStartDate: readNightDate(reader, sketch, "cycleStart"),
    cycleEndDate: readNightDate(reader, sketch, "cycleEnd"),
  };
  const crossFieldFields: Record<string, SketchField> = {
    cycleStartDate: "cycleStart",
    cycleEndDate: "cycleEnd",
    "instrument.interferometerWavelengthMm": "lambda",
    "instrument.interferometerBaselineKm": "baseline",
  };
  for (const [key, messages] of Object.entries(proposalSettingsErrors(settings))) {
    const field = crossFieldFields[key];
    if (field !== undefined && messages?.[0] !== undefined) reader.errors[field] ??= messages[0];
  }
  return settings;
}

function readLightCurve(reader: FieldReader, sketch: Sketch): LightCurveInputs {
  if (sketch.mu.trim() === "") return { muRelRadPerS: null };
  return {
    muRelRadPerS: reader.read(
      "mu",
      (text) => parseProperMotion(text, { defaultUnit: defaultUnits.mu }),
      within(acceptedRanges.properMotionMasPerYr, `The relative proper motion must lie between ${rangeText(acceptedRanges.properMotionMasPerYr)} mas/yr`, JULIAN_YEAR_S / MILLIARCSECOND_RAD),
    ),
  };
}

/** A coordinate as the target form reads it. */
function readCoordinate(reader: FieldReader, sketch: Sketch, field: "ra" | "dec"): number {
  try {
    return (field === "ra" ? parseRightAscensionDeg : parseDeclinationDeg)(sketch[field]);
  } catch (error) {
    if (!(error instanceof CoordinateError)) throw error;
    reader.errors[field] = error.message;
    return Number.NaN;
  }
}

/** The target's inputs beyond the lens: position, case, event peak and source size, as a target reads them. */
function readEvent(reader: FieldReader, sketch: Sketch): EventInputs {
  let eventPeakJdUtc: number | null = null;
  if (sketch.t0.trim() !== "") {
    try {
      eventPeakJdUtc = parseEventPeakJdUtc(sketch.t0);
    } catch (error) {
      if (!(error instanceof EventPeakError)) throw error;
      reader.errors.t0 = error.message;
    }
  }
  const sourceRadiusSolar = reader.optionalQuantity("rstar", targetQuantities.sourceRadiusSolar);
  const sourceRadiusThetaE = reader.optionalQuantity("rho", targetQuantities.sourceRadiusThetaE);
  if (sourceRadiusSolar !== null && sourceRadiusThetaE !== null) reader.errors.rho ??= "Give the source's radius R_* or ρ, not both.";
  return {
    raDeg: readCoordinate(reader, sketch, "ra"),
    decDeg: readCoordinate(reader, sketch, "dec"),
    scienceCase: sketch.case === "inferred" ? null : sketch.case,
    eventPeakJdUtc,
    sourceRadiusSolar,
    sourceRadiusThetaE,
    limbDarkeningU: reader.optionalQuantity("limb", targetQuantities.limbDarkeningU),
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
  const { geometry, redshifts } = readGeometry(reader, sketch);
  const inputs: SketchInputs = {
    lens: readLens(reader, sketch),
    geometry,
    redshifts,
    sourceOffset: readSourceOffset(reader, sketch),
    lightCurve: readLightCurve(reader, sketch),
    event: readEvent(reader, sketch),
    settings: readSettings(reader, sketch),
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
