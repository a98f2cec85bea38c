/**
 * Quantity fields of the workspace forms and API (targets, proposal settings): each takes a number
 * in its stored unit (API clients) or the text a user typed, with or without a unit, read by the one
 * quantity parser (`lib/physics/units.ts`) and converted to the stored unit. A bare number is taken
 * in the field's stated unit. The same reader gives the form its echo as the user types and the
 * server its field error, so the two cannot disagree.
 */
import { z } from "zod";
import { ARCSECOND_RAD, AU_M, DAY_S, JULIAN_YEAR_S, MILLIARCSECOND_RAD, SOLAR_RADIUS_M } from "@/lib/physics/constants";
import { boundText, type AcceptedRange } from "@/lib/physics/accepted-ranges";
import {
  MAX_QUANTITY_CHARS,
  QuantityError,
  parseAngle,
  parseDistance,
  parseLength,
  parseMass,
  parseNumber,
  parseProperMotion,
  parseTime,
  parseVelocity,
  parseWavelength,
  type QuantityKind,
} from "@/lib/physics/units";
import { formatSignificant, roundToSignificant } from "@/lib/numbers/significant";

/** How one field reads its text: the parser's kind, the stored unit and what to suggest typing. */
export interface QuantitySpec {
  /** The field as a sentence names it: "Lens mass". */
  label: string;
  kind: QuantityKind;
  /** The stored unit in the parser's spelling ("Msun", "mm"); a bare number is read in it. Absent for plain numbers. */
  unit?: string;
  /** The stored unit as a reader writes it ("M☉", "mm"). */
  unitWords?: string;
  /** A value the field accepts, shown in refusals: "0.3 Msun". */
  example: string;
  range: AcceptedRange;
  /** The range refusal, in words with its reason. */
  rangeMessage: string;
  /** Whole numbers only (priority). */
  isInteger?: boolean;
}

export type FieldReading = { ok: true; value: number } | { ok: false; message: string };

// Conversions from the parser's result unit to each stored unit that differs from it (masses,
// distances, velocities and lengths in metres come out of the parser in the stored unit already).
const toStored: Record<string, (parsed: number) => number> = {
  "mas/yr": (radPerS) => (radPerS * JULIAN_YEAR_S) / MILLIARCSECOND_RAD,
  mas: (rad) => rad / MILLIARCSECOND_RAD,
  arcsec: (rad) => rad / ARCSECOND_RAD,
  deg: (rad) => (rad * 180) / Math.PI,
  min: (s) => s / 60,
  h: (s) => s / 3600,
  d: (s) => s / DAY_S,
  mm: (m) => m * 1000,
  km: (m) => m / 1000,
  Rsun: (m) => m / SOLAR_RADIUS_M,
  au: (m) => m / AU_M,
};

// A value typed with a unit is rounded to 15 significant digits: a unit conversion (a product of
// doubles) leaves noise in the 16th-17th digit, and "2.2 um" should be stored as 0.0022 mm, not
// 0.0021999999999999997. No conversion factor of the parser is known to more digits than that.
const tidy = (value: number) => roundToSignificant(value, 15);

/** A length that may be zero or negative (a site below sea level): the parser reads magnitudes only. */
function signedLengthM(text: string, unit: string): number {
  const trimmed = text.trim();
  const sign = /^[-\u2212]/.test(trimmed) ? -1 : 1;
  const magnitude = trimmed.replace(/^[-+\u2212]/, "");
  try {
    return sign * parseLength(magnitude, { defaultUnit: unit });
  } catch (error) {
    // "0 m" is refused as not positive; read the unit alone and keep the zero.
    if (!(error instanceof QuantityError) || !/^[0.,]+\D/.test(magnitude)) throw error;
    parseLength(magnitude.replace(/^[0.,]+/, "1"), { defaultUnit: unit });
    return 0;
  }
}

/** The text read by the parser for the spec's kind, in the parser's result unit. */
function parsed(spec: QuantitySpec, text: string): number {
  const options = { defaultUnit: spec.unit };
  switch (spec.kind) {
    case "mass":
      // A geometrized mass (GM/c² as a length, GM/c³ as a time) reads as on the bench; the echo shows the M☉ used.
      return parseMass(text, options).massSolar;
    case "distance":
      return parseDistance(text, options);
    case "length":
      return signedLengthM(text, spec.unit ?? "m");
    case "wavelength":
      return parseWavelength(text, options);
    case "angle":
      return parseAngle(text, options);
    case "velocity":
      return parseVelocity(text, options);
    case "proper motion":
      return parseProperMotion(text, options);
    case "time":
      return parseTime(text, options);
    case "number":
      return parseNumber(text);
  }
}

/** The text as a bare number (no unit), or undefined when it has a unit or is not a number. */
function bareNumber(text: string): number | undefined {
  try {
    return parseNumber(text);
  } catch {
    return undefined;
  }
}

/**
 * "Lens mass: '5 kpc' is a distance, not a mass; type e.g. 0.3 Msun." Advice the mistake itself gives
 * (both readings of "8,125") stays; otherwise the field's example, in the field's own unit, replaces
 * the parser's general examples for the kind.
 */
function refusal(spec: QuantitySpec, text: string, error: QuantityError): string {
  const shown = text.length > 24 ? `${text.slice(0, 20)}…` : text;
  const typing = error.advice !== undefined ? `type ${error.advice}` : spec.kind === "number" ? `type a number, e.g. ${spec.example}` : `type e.g. ${spec.example}`;
  return `${spec.label}: '${shown}' ${error.fault}; ${typing}.`;
}

/** Reads one value as a field receives it: a number in the stored unit, or typed text. */
export function readQuantityField(spec: QuantitySpec, input: unknown): FieldReading {
  let value: number;
  if (typeof input === "number") {
    value = input;
  } else if (typeof input === "string") {
    if (input.trim() === "") return { ok: false, message: `${spec.label} is empty; type e.g. ${spec.example}.` };
    if (input.length > MAX_QUANTITY_CHARS) return { ok: false, message: `${spec.label} is at most ${MAX_QUANTITY_CHARS} characters; type e.g. ${spec.example}.` };
    try {
      // A bare number is already in the stored unit: taken as written, with no round trip.
      const bare = bareNumber(input);
      const convert = (spec.unit === undefined ? undefined : toStored[spec.unit]) ?? ((result: number) => result);
      value = bare ?? tidy(convert(parsed(spec, input)));
    } catch (error) {
      if (!(error instanceof QuantityError)) throw error;
      return { ok: false, message: refusal(spec, input, error) };
    }
  } else {
    return { ok: false, message: `${spec.label} is ${input === undefined || input === null ? "missing" : "not a number"}; type e.g. ${spec.example}.` };
  }
  if (!Number.isFinite(value)) return { ok: false, message: `${spec.label} must be a finite number; type e.g. ${spec.example}.` };
  if (spec.isInteger && !Number.isInteger(value)) return { ok: false, message: `${spec.label} is a whole number; ${spec.rangeMessage}` };
  if (value < spec.range.min || value > spec.range.max) return { ok: false, message: spec.rangeMessage };
  return { ok: true, value };
}

/**
 * The zod field for a spec: output a number in the stored unit; every refusal is one message in
 * words naming the field and saying what to type instead.
 */
export function quantityField(spec: QuantitySpec) {
  return z.unknown().transform((input, ctx) => {
    const reading = readQuantityField(spec, input);
    if (reading.ok) return reading.value;
    ctx.addIssue({ code: "custom", message: reading.message });
    return z.NEVER;
  });
}

/** An optional quantity: null or absent is "not set". */
export function optionalQuantityField(spec: QuantitySpec) {
  return quantityField(spec).nullable().optional();
}

/** A range message: "The lens mass is from 1e-15 to 1e16 M☉ (why)." */
export function rangeMessage(what: string, range: AcceptedRange, unitWords: string, why: string): string {
  return `${what} is from ${boundText(range.min)} to ${boundText(range.max)}${unitWords ? ` ${unitWords}` : ""}${why ? ` (${why})` : ""}.`;
}

/**
 * What a quantity field shows beside its input as the user types: the value the server will store
 * ("= 4.1 × 10⁶ M☉", saying when a bare number was taken in the field's unit), or its refusal.
 */
export function quantityEcho(spec: QuantitySpec, text: string): { ok: true; text: string } | { ok: false; message: string } | null {
  if (text.trim() === "") return null;
  const reading = readQuantityField(spec, text);
  if (!reading.ok) return { ok: false, message: reading.message };
  // The echo formats the stored value itself (in the stored unit), so it shows exactly what is saved.
  const shown = `= ${formatSignificant(reading.value)}`;
  // A plain number typed as it will be stored needs no echo; "0,5" read as 0.5 does.
  if (spec.unitWords === undefined) return String(reading.value) === text.trim() ? null : { ok: true, text: shown };
  // No space before a degree sign (SI Brochure, 9th ed., §5.4.3); other units follow a space.
  const withUnit = `${shown}${spec.unitWords === "°" ? "" : " "}${spec.unitWords}`;
  return { ok: true, text: bareNumber(text) === undefined ? withUnit : `${withUnit} (a bare number is read in ${spec.unitWords})` };
}
