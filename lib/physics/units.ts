/**
 * Parsing and formatting of the quantities astronomers type, on mathjs units. Every input field of the
 * product reads through these functions, so they accept the common spellings (`4e6 Msun`, `8.1 kpc`,
 * `45 uas`, `45 µas`, `1.2″`, `5 mas/yr`, `1 d`, `4×10^6 M☉`, `M_sun`, a decimal comma `8,1 kpc`,
 * thousands commas `4,100,000 Msun`) and reject nonsense with a QuantityError that names the
 * quantity. Numbers are read by the rules of ./quantity-text (a lone comma before three digits,
 * `8,125`, is refused as ambiguous). Conversion factors come from ./constants only.
 *
 * Results: masses in solar masses, distances in parsecs, angles in radians, velocities in km/s,
 * proper motions in rad/s, times in seconds.
 */

import { create, createUnitDependencies, unitDependencies, type Unit } from "mathjs";
import {
  AU_M,
  DAY_S,
  JULIAN_YEAR_S,
  LIGHT_YEAR_M,
  MICROARCSECOND_RAD,
  MILLIARCSECOND_RAD,
  PARSEC_M,
  SOLAR_MASS_KG,
  SOLAR_MASS_LENGTH_M,
  SOLAR_MASS_TIME_S,
  SOLAR_RADIUS_M,
  SPEED_OF_LIGHT_M_PER_S,
} from "./constants";
import { readLeadingNumber } from "./quantity-text";

const math = create({ unitDependencies, createUnitDependencies });

math.createUnit({
  Msun: { definition: `${SOLAR_MASS_KG} kg`, aliases: ["Msol", "solMass", "Mo"] },
  pc: { definition: `${PARSEC_M} m`, prefixes: "short", aliases: ["parsec", "parsecs"] },
  Rsun: { definition: `${SOLAR_RADIUS_M} m`, aliases: ["solRad"] },
  au: { definition: `${AU_M} m`, aliases: ["AU", "ua"] },
  ly: { definition: `${LIGHT_YEAR_M} m`, aliases: ["lyr", "lightyear", "lightyears"] },
  mas: { definition: `${MILLIARCSECOND_RAD} rad` },
  uas: { definition: `${MICROARCSECOND_RAD} rad` },
  d: { definition: `${DAY_S} s` },
  yr: { definition: `${JULIAN_YEAR_S} s`, prefixes: "short", aliases: ["yrs"] },
});

/** The quantities the parsers read; each error names one of them. */
export type QuantityKind = "mass" | "distance" | "length" | "wavelength" | "angle" | "velocity" | "proper motion" | "time" | "number";

/** Thrown for input that is not a valid quantity of the requested kind. */
export class QuantityError extends Error {
  readonly quantity: QuantityKind;
  readonly input: string;
  /** What is wrong, in the user's words, without the quantity's name: "has an unknown unit 'foo'". */
  readonly problem: string;

  constructor(quantity: QuantityKind, input: string, problem: string) {
    super(`${quantity}: '${input}' ${problem}`);
    this.name = "QuantityError";
    this.quantity = quantity;
    this.input = input;
    this.problem = problem;
  }
}

/** Reference unit of each dimension the parsers know, with the word used in messages. */
const DIMENSIONS: { unit: string; word: string; article: string }[] = [
  { unit: "kg", word: "mass", article: "a" },
  { unit: "m", word: "distance", article: "a" },
  { unit: "s", word: "time", article: "a" },
  { unit: "rad", word: "angle", article: "an" },
  { unit: "m/s", word: "velocity", article: "a" },
  { unit: "rad/s", word: "proper motion", article: "a" },
];

/** The longest quantity text read: "4.2×10^6 M☉" is a dozen characters; anything this long is not a quantity. */
export const MAX_QUANTITY_CHARS = 100;

/**
 * Trims the text and folds runs of white space into one space, first, so that no pattern below meets
 * more than one space in a row: an unanchored `\s*` before a symbol rescans a run of spaces from
 * each of its positions (quadratic time).
 */
function foldSpaces(text: string): string {
  return text.trim().replace(/\s+/g, " ");
}

/** Rewrites the common typographic spellings of a unit (text after the number) into what mathjs reads. */
function normalizeUnit(unitText: string): string {
  return unitText
    .replace(/[\u00b5\u03bc]/g, "u") // micro sign and Greek mu
    .replace(/M ?[\u2609\u2299]/g, "Msun") // M☉, M⊙
    .replace(/\bM_(sun|sol)\b/g, "Msun")
    .replace(/R ?[\u2609\u2299]|\bR_sun\b/g, "Rsun")
    .replace(/ ?[\u2033"] ?/g, " arcsec ")
    .replace(/ ?[\u2032'] ?/g, " arcmin ")
    .replace(/ ?\u00b0 ?/g, " deg ")
    .trim();
}

/** "a mass", "an angle", ...; undefined for a dimension the parsers do not know (or none). */
function describeDimension(unit: Unit): string | undefined {
  const dimension = DIMENSIONS.find((candidate) => unit.equalBase(math.unit(candidate.unit)));
  return dimension === undefined ? undefined : `${dimension.article} ${dimension.word}`;
}

interface ParseOptions {
  /** Unit assumed when the text is a bare number (e.g. "pc"); without it a bare number is an error. */
  defaultUnit?: string;
}

interface ParsedQuantity {
  /** The number as typed. */
  value: number;
  /** The unit as typed (after normalization), e.g. "kpc" or "mas / yr". */
  unitText: string;
  /** Index into the `accepted` reference units of the matching dimension. */
  index: number;
}

/**
 * Splits `text` into a number and a unit of one of the `accepted` dimensions. The number is kept
 * apart from the unit so that a value typed in the target unit converts exactly (factor 1).
 */
function parseQuantity(kind: QuantityKind, text: string, accepted: string[], options: ParseOptions | undefined): ParsedQuantity {
  if (typeof text !== "string" || text.trim() === "") throw new QuantityError(kind, String(text), "is empty; type a number and a unit");
  if (text.length > MAX_QUANTITY_CHARS) throw new QuantityError(kind, `${text.slice(0, 20)}…`, `is longer than ${MAX_QUANTITY_CHARS} characters; type a number and a unit`);
  const folded = foldSpaces(text);
  const number = readLeadingNumber(folded);
  if (!number.ok) throw new QuantityError(kind, text, number.hasDigits ? number.problem : "is not a number followed by a unit");
  const value = number.value;
  const typedUnit = normalizeUnit(folded.slice(number.length));
  const unitText = typedUnit === "" ? (options?.defaultUnit ?? "") : typedUnit;
  if (unitText === "") throw new QuantityError(kind, text, `has no ${kind} unit`);
  let unit: Unit;
  try {
    unit = math.unit(`1 ${unitText}`);
  } catch {
    throw new QuantityError(kind, text, `has an unknown unit '${unitText}'`);
  }
  const index = accepted.findIndex((reference) => unit.equalBase(math.unit(reference)));
  if (index < 0) {
    const what = describeDimension(unit);
    if (what === undefined) throw new QuantityError(kind, text, `has no ${kind} unit`);
    throw new QuantityError(kind, text, `is ${what}, not ${articleFor(kind)} ${kind}`);
  }
  return { value, unitText, index };
}

function articleFor(kind: QuantityKind): string {
  return kind === "angle" ? "an" : "a";
}

/** The parsed value in `target` units; QuantityError unless finite. */
function valueIn(kind: QuantityKind, text: string, parsed: ParsedQuantity, target: string): number {
  const value = parsed.value * math.unit(`1 ${parsed.unitText}`).toNumber(target);
  if (!Number.isFinite(value)) throw new QuantityError(kind, text, "is not finite");
  return value;
}

/** How a parsed mass was written: as a mass, or geometrized as GM/c^2 (a length) or GM/c^3 (a time). */
export type MassInterpretation = "mass" | "geometrized length" | "geometrized time";

/**
 * Parses a mass: `1.2e6 Msun`, `3e30 kg`, or geometrized `1.48 km` (GM/c^2) and `4.9 us` (GM/c^3).
 * Result in solar masses (IAU 2015 B3 nominal GM_sun; kilograms go through G, CODATA 2018, so they
 * carry its 2e-5 uncertainty). Domain: finite and > 0 (QuantityError otherwise).
 */
export function parseMass(text: string, options?: ParseOptions): { massSolar: number; interpretedAs: MassInterpretation } {
  const parsed = parseQuantity("mass", text, ["kg", "m", "s"], options);
  const interpretations: MassInterpretation[] = ["mass", "geometrized length", "geometrized time"];
  const massSolar =
    parsed.index === 0
      ? valueIn("mass", text, parsed, "Msun")
      : valueIn("mass", text, parsed, parsed.index === 1 ? "m" : "s") / (parsed.index === 1 ? SOLAR_MASS_LENGTH_M : SOLAR_MASS_TIME_S);
  if (!(massSolar > 0)) throw new QuantityError("mass", text, "must be greater than zero");
  return { massSolar, interpretedAs: interpretations[parsed.index] };
}

/** Parses a distance (`8.2 kpc`, `1.3 Gpc`, `1 au`, `2.1 ly`, `3e19 m`) into parsecs; finite, > 0. */
export function parseDistance(text: string, options?: ParseOptions): number {
  const distancePc = valueIn("distance", text, parseQuantity("distance", text, ["m"], options), "pc");
  if (!(distancePc > 0)) throw new QuantityError("distance", text, "must be greater than zero");
  return distancePc;
}

/** Parses a length (`3 km`, `1 Rsun`, `6.957e8 m`) into metres; finite, > 0. */
export function parseLength(text: string, options?: ParseOptions): number {
  const lengthM = valueIn("length", text, parseQuantity("length", text, ["m"], options), "m");
  if (!(lengthM > 0)) throw new QuantityError("length", text, "must be greater than zero");
  return lengthM;
}

/** Parses a wavelength (`1.3 mm`, `2.2 um`, `230 GHz` as c/ν) into metres; finite, > 0. */
export function parseWavelength(text: string, options?: ParseOptions): number {
  const parsed = parseQuantity("wavelength", text, ["m", "Hz"], options);
  const value = parsed.index === 0 ? valueIn("wavelength", text, parsed, "m") : SPEED_OF_LIGHT_M_PER_S / valueIn("wavelength", text, parsed, "Hz");
  if (!(value > 0) || !Number.isFinite(value)) throw new QuantityError("wavelength", text, "must be greater than zero");
  return value;
}

/** Parses a bare number (`0.3`, `2e3`, `0,3`, `4,100,000`); a unit is an error. */
export function parseNumber(text: string): number {
  if (typeof text !== "string" || text.trim() === "") throw new QuantityError("number", String(text), "is empty; type a number");
  const folded = foldSpaces(text);
  const number = readLeadingNumber(folded);
  if (!number.ok) throw new QuantityError("number", text, number.hasDigits ? number.problem : "is not a number; type e.g. 0.3 or 2e3");
  if (number.length !== folded.length) throw new QuantityError("number", text, "is not a plain number");
  if (!Number.isFinite(number.value)) throw new QuantityError("number", text, "is not finite");
  return number.value;
}

/** What a field shows beside its input: the value used, in words and normalised units, or why none. */
export type QuantityEcho = { ok: true; text: string; assumedUnit: boolean } | { ok: false; message: string };

/**
 * The echo of `text` read as `kind`, shown in `displayUnit` (default: the kind's result unit):
 * "= 4.1 × 10⁶ M☉"; a bare number says it was taken in the default unit.
 */
export function echoQuantity(kind: QuantityKind, text: string, options?: ParseOptions & { displayUnit?: string }): QuantityEcho {
  try {
    const parsers: Record<QuantityKind, (t: string) => number> = {
      mass: (t) => parseMass(t, options).massSolar,
      distance: (t) => parseDistance(t, options),
      length: (t) => parseLength(t, options),
      wavelength: (t) => parseWavelength(t, options),
      angle: (t) => parseAngle(t, options),
      velocity: (t) => parseVelocity(t, options),
      "proper motion": (t) => parseProperMotion(t, options),
      time: (t) => parseTime(t, options),
      number: parseNumber,
    };
    const value = parsers[kind](text);
    const folded = foldSpaces(text);
    const number = readLeadingNumber(folded);
    const assumedUnit = kind !== "number" && number.ok && number.length === folded.length;
    return { ok: true, text: `= ${formatNumber(value, 4)}`, assumedUnit };
  } catch (error) {
    if (error instanceof QuantityError) return { ok: false, message: error.problem };
    throw error;
  }
}

/** Parses an angle (`1.2 arcsec`, `1.2″`, `350 mas`, `40 uas`, `40 µas`, `0.3 deg`) into radians; finite. */
export function parseAngle(text: string, options?: ParseOptions): number {
  return valueIn("angle", text, parseQuantity("angle", text, ["rad"], options), "rad");
}

/** Parses a velocity (`250 km/s`, `3e5 m/s`) into km/s; finite, any sign. */
export function parseVelocity(text: string, options?: ParseOptions): number {
  return valueIn("velocity", text, parseQuantity("velocity", text, ["m/s"], options), "km/s");
}

/** Parses a proper motion (`5 mas/yr`, `5 mas yr^-1`, `1 uas/d`) into rad/s (yr = Julian year); finite. */
export function parseProperMotion(text: string, options?: ParseOptions): number {
  return valueIn("proper motion", text, parseQuantity("proper motion", text, ["rad/s"], options), "rad/s");
}

/** Parses a time or duration (`30 s`, `1 d`, `2.5 yr`, `3 h`) into seconds (yr = Julian year); finite. */
export function parseTime(text: string, options?: ParseOptions): number {
  return valueIn("time", text, parseQuantity("time", text, ["s"], options), "s");
}

/** Formats a number to `significantDigits` digits, plain in [1e-3, 1e6), exponential outside. */
function formatNumber(value: number, significantDigits: number): string {
  const magnitude = Math.abs(value);
  if (value === 0 || (magnitude >= 1e-3 && magnitude < 1e6)) return String(Number(value.toPrecision(significantDigits)));
  const [mantissa, exponent] = value.toExponential(significantDigits - 1).split("e");
  return `${String(Number(mantissa))}e${Number(exponent)}`;
}

function formatIn(kind: QuantityKind, value: number, fromUnit: string, toUnit: string, significantDigits: number): string {
  if (!math.unit(fromUnit).equalBase(knownUnit(kind, toUnit))) throw new QuantityError(kind, toUnit, `is not ${articleFor(kind)} ${kind} unit`);
  return `${formatNumber(value * math.unit(`1 ${fromUnit}`).toNumber(toUnit), significantDigits)} ${toUnit}`;
}

function knownUnit(kind: QuantityKind, unit: string): Unit {
  try {
    return math.unit(`1 ${unit}`);
  } catch {
    throw new QuantityError(kind, unit, "is not a known unit");
  }
}

/**
 * Formats a mass given in solar masses in `unit`: a mass unit (`Msun`, `kg`), or a length or time
 * unit for the geometrized GM/c^2 (`km`) or GM/c^3 (`us`, `s`). Default 4 significant digits.
 */
export function formatMass(massSolar: number, unit = "Msun", significantDigits = 4): string {
  const probe = knownUnit("mass", unit);
  if (probe.equalBase(math.unit("m"))) return formatIn("mass", massSolar * SOLAR_MASS_LENGTH_M, "m", unit, significantDigits);
  if (probe.equalBase(math.unit("s"))) return formatIn("mass", massSolar * SOLAR_MASS_TIME_S, "s", unit, significantDigits);
  return formatIn("mass", massSolar, "Msun", unit, significantDigits);
}

/** Formats a distance in parsecs in `unit` (`pc`, `kpc`, `Mpc`, `au`, `ly`, `m`); default 4 digits. */
export function formatDistance(distancePc: number, unit = "pc", significantDigits = 4): string {
  return formatIn("distance", distancePc, "pc", unit, significantDigits);
}

/** Formats an angle in radians in `unit` (`uas`, `mas`, `arcsec`, `deg`, `rad`); default 4 digits. */
export function formatAngle(angleRad: number, unit = "mas", significantDigits = 4): string {
  return formatIn("angle", angleRad, "rad", unit, significantDigits);
}

/** Formats a velocity in km/s in `unit` (`km/s`, `m/s`); default 4 digits. */
export function formatVelocity(velocityKmPerS: number, unit = "km/s", significantDigits = 4): string {
  return formatIn("velocity", velocityKmPerS, "km/s", unit, significantDigits);
}

/** Formats a proper motion in rad/s in `unit` (`mas/yr`, `uas/yr`, `rad/s`); default 4 digits. */
export function formatProperMotion(properMotionRadPerS: number, unit = "mas/yr", significantDigits = 4): string {
  return formatIn("proper motion", properMotionRadPerS, "rad/s", unit, significantDigits);
}

/** Formats a time in seconds in `unit` (`s`, `h`, `d`, `yr`); default 4 digits. */
export function formatTime(timeS: number, unit = "d", significantDigits = 4): string {
  return formatIn("time", timeS, "s", unit, significantDigits);
}
