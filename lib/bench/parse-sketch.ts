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
  parseMass,
  parseProperMotion,
  parseTime,
  parseVelocity,
} from "@/lib/physics";
import type { Sketch, SketchField } from "./sketch-state";

/** Most rays the bench traces at once (issue 4: "count up to 5,000"). */
export const MAX_RAY_COUNT = 5000;

/** Largest impact parameter of the bundle, units of M; the traced region grows with it. */
export const MAX_BUNDLE_IMPACT_M = 100;

export type FieldErrors = Partial<Record<SketchField, string>>;

/** The lens, as the results need it. */
export type LensInputs =
  | { model: "point"; massSolar: number }
  | { model: "sis"; sigmaKmPerS: number };

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

export type ParsedSketch = { ok: true; inputs: SketchInputs } | { ok: false; fieldErrors: FieldErrors };

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
      this.errors[field] = error instanceof Error ? error.message : String(error);
      return Number.NaN;
    }
  }
}

/** A bare number: "0.3", "2e3". Units are not allowed here (the label states what the number means). */
export function parsePlainNumber(text: string): number {
  const trimmed = text.trim();
  if (!/^[+-]?(\d+(?:\.\d*)?|\.\d+)(e[+-]?\d+)?$/i.test(trimmed)) throw new Error(`'${text}' is not a plain number`);
  return Number(trimmed);
}

/** A check that passes values above zero and otherwise returns `message`. */
const positive = (message: string) => (value: number) => (value > 0 ? undefined : message);

function readLens(reader: FieldReader, sketch: Sketch): LensInputs {
  if (sketch.lens === "sis") {
    return { model: "sis", sigmaKmPerS: reader.read("sigma", parseVelocity, positive("The velocity dispersion must be greater than zero")) };
  }
  return { model: "point", massSolar: reader.read("mass", (text) => parseMass(text).massSolar) };
}

function readGeometry(reader: FieldReader, sketch: Sketch): GeometryInputs {
  if (sketch.geometry === "distance") {
    const dLensPc = reader.read("dl", parseDistance);
    const dSourcePc = reader.read("ds", parseDistance, (value) =>
      value > dLensPc || Number.isNaN(dLensPc) ? undefined : "The source must lie behind the lens (D_S > D_L)",
    );
    return { dLensPc, dSourcePc, dLensSourcePc: dSourcePc - dLensPc, zLens: 0 };
  }
  const h0 = reader.read("h0", parsePlainNumber, (value) => (value > 0 && value < 1000 ? undefined : "H0 must lie between 0 and 1000 km/s/Mpc"));
  const om0 = reader.read("om0", parsePlainNumber, (value) => (value >= 0 && value <= 1 ? undefined : "Ωm must lie between 0 and 1"));
  const zLens = reader.read("zl", parsePlainNumber, positive("The lens redshift must be greater than zero"));
  const zSource = reader.read("zs", parsePlainNumber, (value) =>
    value > zLens || Number.isNaN(zLens) ? undefined : "The source must lie behind the lens (z_S > z_L)",
  );
  if ([h0, om0, zLens, zSource].some(Number.isNaN)) return { dLensPc: NaN, dSourcePc: NaN, dLensSourcePc: NaN, zLens };
  const cosmology = { H0: h0, Om0: om0 };
  return {
    dLensPc: angularDiameterDistance(zLens, cosmology),
    dSourcePc: angularDiameterDistance(zSource, cosmology),
    dLensSourcePc: angularDiameterDistanceBetween(zLens, zSource, cosmology),
    zLens,
  };
}

function readSourceOffset(reader: FieldReader, sketch: Sketch): SourceOffsetInputs {
  const aboveZero = positive("β must be greater than zero (at β = 0 the image is a ring of unbounded magnification)");
  if (sketch.betaUnit === "angle") return { unit: "angle", betaRad: reader.read("beta", parseAngle, aboveZero) };
  return { unit: "thetaE", betaThetaE: reader.read("beta", parsePlainNumber, aboveZero) };
}

function readInstrument(reader: FieldReader, sketch: Sketch): InstrumentInputs {
  const cadenceS = reader.read("cadence", parseTime, positive("The cadence must be greater than zero"));
  const campaignS = reader.read("campaign", parseTime, (value) =>
    value >= cadenceS || Number.isNaN(cadenceS) ? undefined : "The campaign must last at least one cadence interval",
  );
  if (sketch.resolution === "fwhm") {
    return { resolutionRad: reader.read("fwhm", parseAngle, positive("The FWHM must be greater than zero")), resolutionName: "FWHM", cadenceS, campaignS };
  }
  const toMetres = (text: string) => parseDistance(text) * PARSEC_M;
  const wavelengthM = reader.read("lambda", toMetres);
  const baselineM = reader.read("baseline", toMetres);
  // λ/B is the interferometric resolution element (fringe spacing) for the longest baseline.
  return { resolutionRad: wavelengthM / baselineM, resolutionName: "λ/B", cadenceS, campaignS };
}

function readLightCurve(reader: FieldReader): LightCurveInputs {
  return {
    muRelRadPerS: reader.read("mu", parseProperMotion, positive("The relative proper motion must be greater than zero")),
    peakTimeS: reader.read("t0", parseTime),
    u0ThetaE: reader.read("u0", parsePlainNumber, positive("u0 must be greater than zero (at u0 = 0 the peak magnification is unbounded)")),
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

/** Parses every field the sketch uses; on any error returns all the field errors at once. */
export function parseSketch(sketch: Sketch): ParsedSketch {
  const reader = new FieldReader(sketch);
  const inputs: SketchInputs = {
    lens: readLens(reader, sketch),
    geometry: readGeometry(reader, sketch),
    sourceOffset: readSourceOffset(reader, sketch),
    lightCurve: readLightCurve(reader),
    instrument: readInstrument(reader, sketch),
    bundle: readBundle(reader, sketch),
  };
  if (Object.keys(reader.errors).length > 0) return { ok: false, fieldErrors: reader.errors };
  return { ok: true, inputs };
}

export type ParsedBundle = { ok: true; bundle: BundleInputs } | { ok: false; fieldErrors: FieldErrors };

/** Only the ray-bundle fields: the bundle is in units of M, so it never waits on the lens or geometry. */
export function parseBundle(sketch: Sketch): ParsedBundle {
  const reader = new FieldReader(sketch);
  const bundle = readBundle(reader, sketch);
  if (Object.keys(reader.errors).length > 0) return { ok: false, fieldErrors: reader.errors };
  return { ok: true, bundle };
}
