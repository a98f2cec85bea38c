/**
 * Parsing and formatting of the quantities astronomers type, on mathjs units. Every input field of the
 * product reads through these functions, so they accept the common spellings (`4e6 Msun`, `8.1 kpc`,
 * `45 µas`, `1.2″`, `5 mas yr-1`, `250 km.s**-1`, `2.2 micron`, `230 GHz`, `1 d`, `4×10^6 M☉`, a
 * decimal comma `8,1 kpc`, thousands commas `4,100,000 Msun`) and reject anything else with a
 * QuantityError whose problem says, in the user's words, what is wrong and what to type instead.
 * Numbers follow the rules of ./quantity-text (a lone comma before three digits, `8,125`, is refused
 * as ambiguous), units the vocabulary and case rules of ./quantity-vocabulary. Conversion factors
 * come from ./constants only.
 *
 * Results: masses in solar masses, distances in parsecs, lengths and wavelengths in metres, angles in
 * radians, velocities in km/s, proper motions in rad/s, times in seconds. echoQuantity is the one
 * place that writes a typed value back for people ("= 4.1 × 10⁶ M☉").
 */

import type { Unit } from "mathjs";
import { SOLAR_MASS_LENGTH_M, SOLAR_MASS_TIME_S, SPEED_OF_LIGHT_M_PER_S } from "./constants";
import { readLeadingNumber } from "./quantity-text";
import { math, readUnit, unitLabel, type UnitFactor } from "./quantity-vocabulary";
import { readCompoundAngle } from "./sexagesimal-angle";
import { formatSignificant } from "@/lib/numbers/significant";

/** The quantities the parsers read; each error names one of them. */
export type QuantityKind = "mass" | "distance" | "length" | "wavelength" | "angle" | "velocity" | "proper motion" | "time" | "number";

/** Thrown for input that is not a valid quantity of the requested kind. */
export class QuantityError extends Error {
  readonly quantity: QuantityKind;
  readonly input: string;
  /**
   * What is wrong and what to type instead, in the user's words, without the quantity's name:
   * "has an unknown unit 'Mpx'; type e.g. 8 kpc or 2.5e4 ly".
   */
  readonly problem: string;
  /** What is wrong alone: "has an unknown unit 'Mpx'". */
  readonly fault: string;
  /**
   * What to type when the mistake itself says it ("8125 or 8.125", "mas"); undefined when `problem`
   * ends with the kind's general examples, which a field may replace with its own.
   */
  readonly advice: string | undefined;

  constructor(quantity: QuantityKind, input: string, problem: string, detail?: { fault: string; advice?: string }) {
    super(`${quantity}: '${input}' ${problem}`);
    this.name = "QuantityError";
    this.quantity = quantity;
    this.input = input;
    this.problem = problem;
    this.fault = detail?.fault ?? problem;
    this.advice = detail?.advice;
  }
}

/** Reference unit of each dimension the parsers know, with the word used in messages. */
const DIMENSIONS: { unit: string; word: string }[] = [
  { unit: "kg", word: "a mass" },
  { unit: "m", word: "a distance" },
  { unit: "s", word: "a time" },
  { unit: "rad", word: "an angle" },
  { unit: "m/s", word: "a velocity" },
  { unit: "rad/s", word: "a proper motion" },
  { unit: "Hz", word: "a frequency" },
];

/** What to type in a field of each kind, for the end of a refusal. */
const EXAMPLES: Record<QuantityKind, string> = {
  mass: "4e6 Msun, 1 Mjup or 3 Mearth",
  distance: "8 kpc or 2.5e4 ly",
  length: "3 Rsun or 1.5 km",
  wavelength: "2.2 µm, 1.3 mm or 230 GHz",
  angle: "1.2 arcsec, 350 mas or 45 µas",
  velocity: "250 km/s",
  "proper motion": "5 mas/yr",
  time: "3 d, 2.5 yr or 30 min",
  number: "0.3 or 2e3",
};

/** The unit each parser returns, in the vocabulary of ./quantity-vocabulary. */
const RESULT_UNITS: Record<Exclude<QuantityKind, "number">, string> = {
  mass: "Msun",
  distance: "pc",
  length: "m",
  wavelength: "m",
  angle: "rad",
  velocity: "km/s",
  "proper motion": "rad/s",
  time: "s",
};

/** The longest quantity text read: "4.2×10^6 M☉" is a dozen characters; anything this long is not a quantity. */
export const MAX_QUANTITY_CHARS = 100;

/**
 * Trims the text and folds runs of white space into one space, first, so that no scanner meets more
 * than one space in a row (and no pattern rescans a run of spaces: quadratic time).
 */
function foldSpaces(text: string): string {
  return text.trim().replace(/\s+/g, " ");
}

/** A problem with what to type instead: the given advice, or the field kind's examples. */
function refusal(kind: QuantityKind, problem: string, instead?: string): string {
  return `${problem}; type ${instead ?? `e.g. ${EXAMPLES[kind]}`}`;
}

function quantityError(kind: QuantityKind, text: string, problem: string, instead?: string): QuantityError {
  return new QuantityError(kind, text, refusal(kind, problem, instead), { fault: problem, advice: instead });
}

/** The error for a number that breaks the rules of ./quantity-text, whose problems each end with their own advice. */
function numberError(kind: QuantityKind, text: string, problem: string): QuantityError {
  const cut = problem.indexOf("; type ");
  return new QuantityError(kind, text, problem, cut < 0 ? undefined : { fault: problem.slice(0, cut), advice: problem.slice(cut + "; type ".length) });
}

export interface ParseOptions {
  /** Unit assumed when the text is a bare number (e.g. "pc"); without it a bare number is an error. */
  defaultUnit?: string;
}

/** A typed quantity split into its number and its unit, which is of one of the `accepted` dimensions. */
interface ParsedQuantity {
  /** The number as typed. */
  value: number;
  /** The unit as typed, or the default unit for a bare number. */
  unit: { one: Unit; factors: UnitFactor[] };
  /** Index into the `accepted` reference units of the matching dimension. */
  index: number;
  /** True when the text was a bare number, read in the default unit. */
  isAssumed: boolean;
}

/** The words for a unit's dimension ("a mass"), or undefined for one the parsers do not know. */
function describeDimension(unit: Unit): string | undefined {
  return DIMENSIONS.find((candidate) => unit.equalBase(math.unit(candidate.unit)))?.word;
}

/**
 * Splits `text` into a number and a unit of one of the `accepted` dimensions. The number is kept
 * apart from the unit so that a value typed in the target unit converts exactly (factor 1).
 */
function parseQuantity(kind: QuantityKind, text: string, accepted: string[], options: ParseOptions | undefined): ParsedQuantity {
  if (typeof text !== "string" || text.trim() === "") throw quantityError(kind, String(text), "is empty");
  if (text.length > MAX_QUANTITY_CHARS) throw quantityError(kind, `${text.slice(0, 20)}…`, `is longer than ${MAX_QUANTITY_CHARS} characters`);
  const folded = foldSpaces(text);
  const number = readLeadingNumber(folded);
  if (!number.ok) throw number.hasDigits ? numberError(kind, text, number.problem) : quantityError(kind, text, "is not a number followed by a unit");
  const typedUnit = folded.slice(number.length).trim();
  const isAssumed = typedUnit === "";
  const defaultUnit = options?.defaultUnit ?? "";
  // A default unit can come from a file's column; it gets the same bound as typed text.
  if (isAssumed && defaultUnit.length > MAX_QUANTITY_CHARS) throw quantityError(kind, text, `has a unit longer than ${MAX_QUANTITY_CHARS} characters`);
  const unitText = isAssumed ? foldSpaces(defaultUnit) : typedUnit;
  if (unitText === "") throw quantityError(kind, text, `has no ${kind} unit`);
  const unit = readUnit(unitText);
  if (!unit.ok) throw quantityError(kind, text, unit.problem, unit.instead);
  const index = accepted.findIndex((reference) => unit.unit.equalBase(math.unit(reference)));
  if (index < 0) {
    const what = describeDimension(unit.unit);
    throw quantityError(kind, text, what === undefined ? `has the unit '${unitText}', which is not ${articleFor(kind)} ${kind} unit` : `is ${what}, not ${articleFor(kind)} ${kind}`);
  }
  return { value: number.value, unit, index, isAssumed };
}

function articleFor(kind: QuantityKind): string {
  return kind === "angle" ? "an" : "a";
}

/** The parsed value in `target` units; QuantityError unless finite. */
function valueIn(kind: QuantityKind, text: string, parsed: ParsedQuantity, target: string): number {
  const value = parsed.value * parsed.unit.one.toNumber(target);
  if (!Number.isFinite(value)) throw quantityError(kind, text, "is not finite");
  return value;
}

/** How a parsed mass was written: as a mass, or geometrized as GM/c^2 (a length) or GM/c^3 (a time). */
export type MassInterpretation = "mass" | "geometrized length" | "geometrized time";

/** True when every factor is the metre or the second with an SI prefix (km, us), as geometrized masses are written. */
function isGeometrizedSpelling(factors: UnitFactor[]): boolean {
  return factors.every((factor) => ["m", "s"].includes(math.unit(factor.unit).units[0].unit.name));
}

/**
 * Parses a mass: `1.2e6 Msun`, `1 Mjup`, `3 Mearth`, `3e30 kg`, or geometrized `1.48 km` (GM/c^2) and
 * `4.9 us` (GM/c^3) in SI lengths and times only (`3 Rsun` or `8 kpc` in a mass field is a slip, not
 * a mass). Result in solar masses (IAU 2015 B3 nominal GM_sun, GM_J, GM_E; kilograms go through G,
 * CODATA 2018, so they carry its 2e-5 uncertainty). Domain: finite and > 0 (QuantityError otherwise).
 */
export function parseMass(text: string, options?: ParseOptions): { massSolar: number; interpretedAs: MassInterpretation } {
  return readMass(text, options).result;
}

function readMass(text: string, options?: ParseOptions): { result: { massSolar: number; interpretedAs: MassInterpretation }; parsed: ParsedQuantity } {
  const parsed = parseQuantity("mass", text, ["kg", "m", "s"], options);
  if (parsed.index > 0 && !isGeometrizedSpelling(parsed.unit.factors)) {
    throw quantityError("mass", text, `is ${parsed.index === 1 ? "a distance" : "a time"}, not a mass (a mass written as a length or time is GM/c² in m or km, or GM/c³ in s or µs)`);
  }
  const interpretations: MassInterpretation[] = ["mass", "geometrized length", "geometrized time"];
  const massSolar =
    parsed.index === 0
      ? valueIn("mass", text, parsed, "Msun")
      : valueIn("mass", text, parsed, parsed.index === 1 ? "m" : "s") / (parsed.index === 1 ? SOLAR_MASS_LENGTH_M : SOLAR_MASS_TIME_S);
  if (!(massSolar > 0)) throw quantityError("mass", text, "must be greater than zero");
  return { result: { massSolar, interpretedAs: interpretations[parsed.index] }, parsed };
}

/** A parser's result with the parsed text it came from (for the echo). */
interface Reading {
  value: number;
  parsed: ParsedQuantity;
}

function readPositive(kind: "distance" | "length", text: string, options: ParseOptions | undefined): Reading {
  const parsed = parseQuantity(kind, text, ["m"], options);
  const value = valueIn(kind, text, parsed, RESULT_UNITS[kind]);
  if (!(value > 0)) throw quantityError(kind, text, "must be greater than zero");
  return { value, parsed };
}

/** Parses a distance (`8.2 kpc`, `8,1 Kpc`, `1.3 Gpc`, `1 au`, `2.1 ly`, `3e19 m`) into parsecs; finite, > 0. */
export function parseDistance(text: string, options?: ParseOptions): number {
  return readPositive("distance", text, options).value;
}

/** Parses a length (`3 km`, `1 Rsun`, `11 Rjup`, `2 Rearth`, `6.957e8 m`) into metres; finite, > 0. */
export function parseLength(text: string, options?: ParseOptions): number {
  return readPositive("length", text, options).value;
}

function readWavelength(text: string, options: ParseOptions | undefined): Reading {
  const parsed = parseQuantity("wavelength", text, ["m", "Hz"], options);
  const value = parsed.index === 0 ? valueIn("wavelength", text, parsed, "m") : SPEED_OF_LIGHT_M_PER_S / valueIn("wavelength", text, parsed, "Hz");
  if (!(value > 0) || !Number.isFinite(value)) throw quantityError("wavelength", text, "must be greater than zero");
  return { value, parsed };
}

/**
 * Parses a wavelength (`1.3 mm`, `2.2 um`, `2.2 micron`, `5000 Å`) into metres, or a frequency
 * (`230 GHz`, `1.4 GHz`, `150 MHz`) as λ = c/ν (c exact, SI); finite, > 0.
 */
export function parseWavelength(text: string, options?: ParseOptions): number {
  return readWavelength(text, options).value;
}

/** Parses a bare number (`0.3`, `2e3`, `0,3`, `4,100,000`, `4×10^6`) by the same rules as quantities; a unit is an error. */
export function parseNumber(text: string): number {
  if (typeof text !== "string" || text.trim() === "") throw quantityError("number", String(text), "is empty");
  if (text.length > MAX_QUANTITY_CHARS) throw quantityError("number", `${text.slice(0, 20)}…`, `is longer than ${MAX_QUANTITY_CHARS} characters`);
  const folded = foldSpaces(text);
  const number = readLeadingNumber(folded);
  if (!number.ok) throw number.hasDigits ? numberError("number", text, number.problem) : quantityError("number", text, "is not a number");
  if (number.length !== folded.length) throw quantityError("number", text, "is not a plain number (no unit here)");
  if (!Number.isFinite(number.value)) throw quantityError("number", text, "is not finite");
  return number.value;
}

/** An angle typed as degrees, arcminutes and arcseconds together (./sexagesimal-angle), or undefined for any other text. */
function readCompound(text: string): Reading | undefined {
  if (typeof text !== "string" || text.length > MAX_QUANTITY_CHARS) return undefined;
  const compound = readCompoundAngle(foldSpaces(text));
  if (compound === undefined) return undefined;
  if (!compound.ok) throw quantityError("angle", text, compound.fault, compound.advice);
  const degree = readUnit("deg");
  if (!degree.ok) throw new Error("the degree is missing from the unit vocabulary");
  return { value: degree.one.toNumber("rad") * compound.degrees, parsed: { value: compound.degrees, unit: degree, index: 0, isAssumed: false } };
}

function readSigned(kind: "angle" | "velocity" | "proper motion" | "time", text: string, options: ParseOptions | undefined): Reading {
  const compound = kind === "angle" ? readCompound(text) : undefined;
  if (compound !== undefined) return compound;
  const reference = { angle: "rad", velocity: "m/s", "proper motion": "rad/s", time: "s" }[kind];
  const parsed = parseQuantity(kind, text, [reference], options);
  return { value: valueIn(kind, text, parsed, RESULT_UNITS[kind]), parsed };
}

/** Parses an angle (`1.2 arcsec`, `1.2″`, `1.2''`, `350 mas`, `40 µas`, `0.3 deg`, `0.3°`, `5′`, `12°30′15″`) into radians; finite. */
export function parseAngle(text: string, options?: ParseOptions): number {
  return readSigned("angle", text, options).value;
}

/** Parses a velocity (`250 km/s`, `250 km s-1`, `250 km.s**-1`, `250 km·s⁻¹`, `3e5 m/s`) into km/s; finite, any sign. */
export function parseVelocity(text: string, options?: ParseOptions): number {
  return readSigned("velocity", text, options).value;
}

/** Parses a proper motion (`5 mas/yr`, `5 mas yr-1`, `5 mas.yr**-1`, `5 mas/a`, `1 uas/d`) into rad/s (yr = Julian year); finite. */
export function parseProperMotion(text: string, options?: ParseOptions): number {
  return readSigned("proper motion", text, options).value;
}

/** Parses a time or duration (`30 s`, `1 d`, `2 days`, `2.5 yr`, `3 h`, `3 hr`, `30 min`) into seconds (yr, a = Julian year); finite. */
export function parseTime(text: string, options?: ParseOptions): number {
  return readSigned("time", text, options).value;
}

/** What a field shows beside its input: the value used, in words and normalised units, or why none. */
export type QuantityEcho = { ok: true; text: string; assumedUnit: boolean } | { ok: false; message: string };

/** The kind's value (in RESULT_UNITS) with the parsed text, or for a bare number its value alone. */
function readKind(kind: QuantityKind, text: string, options: ParseOptions | undefined): { value: number; parsed?: ParsedQuantity } {
  switch (kind) {
    case "mass": {
      const { result, parsed } = readMass(text, options);
      return { value: result.massSolar, parsed };
    }
    case "distance":
    case "length":
      return readPositive(kind, text, options);
    case "wavelength":
      return readWavelength(text, options);
    case "angle":
    case "velocity":
    case "proper motion":
    case "time":
      return readSigned(kind, text, options);
    case "number":
      return { value: parseNumber(text) };
  }
}

/** A readable unit for an angle in radians: µas below 1 mas, mas below 1″, ″ below 1°, else °. */
function readableAngleUnit(angleRad: number): string {
  const magnitudeArcsec = Math.abs(math.unit(angleRad, "rad").toNumber("arcsec"));
  if (magnitudeArcsec < 1e-3) return "uas";
  if (magnitudeArcsec < 1) return "mas";
  if (magnitudeArcsec < 3600) return "arcsec";
  return "deg";
}

/** A readable unit for a time in seconds: s below 2 min, min below 2 h, h below 1 d, d below 2 yr, else yr. */
function readableTimeUnit(timeS: number): string {
  const magnitudeS = Math.abs(timeS);
  if (magnitudeS < 120) return "s";
  if (magnitudeS < 7200) return "min";
  if (magnitudeS < math.unit(1, "d").toNumber("s")) return "h";
  if (magnitudeS < math.unit(2, "yr").toNumber("s")) return "d";
  return "yr";
}

/** A readable unit for a wavelength in metres: nm below 1 µm, µm below 1 mm, mm below 1 m, else m. */
function readableWavelengthUnit(wavelengthM: number): string {
  if (wavelengthM < 1e-6) return "nm";
  if (wavelengthM < 1e-3) return "um";
  if (wavelengthM < 1) return "mm";
  return "m";
}

/**
 * The unit an echo shows by default: the result unit for masses (M☉), distances (pc), lengths (m) and
 * velocities (km/s); mas/yr for proper motions; a readable unit for angles, times and wavelengths
 * (an astronomer reads "2.2 µm" and "1.303 mm", not "2.2 × 10⁻⁶ m").
 */
function defaultDisplayUnit(kind: Exclude<QuantityKind, "number">, value: number): string {
  if (kind === "wavelength") return readableWavelengthUnit(value);
  if (kind === "angle") return readableAngleUnit(value);
  if (kind === "time") return readableTimeUnit(value);
  if (kind === "proper motion") return "mas/yr";
  return RESULT_UNITS[kind];
}

/** A value followed by its unit label; the degree, minute and second signs follow the number unspaced. */
function withLabel(number: string, label: string): string {
  return ["°", "′", "″"].includes(label) ? `${number}${label}` : `${number} ${label}`;
}

/**
 * The echo of `text` read as `kind`, as a field shows it beside its input: "= 4.1 × 10⁶ M☉", four
 * significant digits, in `displayUnit` (any spelling the parser reads, of the kind's dimension;
 * default: see defaultDisplayUnit). A bare number read in `defaultUnit` says so ("= 8100 pc (no unit
 * typed: taken as kpc)", with `assumedUnit`); a frequency typed for a wavelength is echoed beside it
 * ("= 1.303 mm (230 GHz)"); a geometrized mass says how it was read ("(typed as GM/c²)"). A refusal
 * gives the QuantityError's problem.
 * Throws a plain Error for a `displayUnit` of the wrong dimension (a mistake in the calling code).
 */
export function echoQuantity(kind: QuantityKind, text: string, options?: ParseOptions & { displayUnit?: string }): QuantityEcho {
  let reading: { value: number; parsed?: ParsedQuantity };
  try {
    reading = readKind(kind, text, options);
  } catch (error) {
    if (error instanceof QuantityError) return { ok: false, message: error.problem };
    throw error;
  }
  const { value, parsed } = reading;
  if (kind === "number" || parsed === undefined) return { ok: true, text: `= ${formatSignificant(value)}`, assumedUnit: false };
  const display = readUnit(options?.displayUnit ?? defaultDisplayUnit(kind, value));
  const result = readUnit(RESULT_UNITS[kind]);
  if (!display.ok || !result.ok || !display.unit.equalBase(result.unit)) throw new Error(`echoQuantity: '${options?.displayUnit}' is not a ${kind} unit`);
  const shown = withLabel(formatSignificant(value * result.one.to(display.unit).toNumber()), unitLabel(display.factors));
  const notes: string[] = [];
  if (kind === "wavelength" && parsed.index === 1) notes.push(withLabel(formatSignificant(parsed.value), unitLabel(parsed.unit.factors)));
  if (kind === "mass" && parsed.index > 0) notes.push(`typed as GM/c${parsed.index === 1 ? "²" : "³"}`);
  if (parsed.isAssumed) notes.push(`no unit typed: taken as ${unitLabel(parsed.unit.factors)}`);
  return { ok: true, text: `= ${shown}${notes.map((note) => ` (${note})`).join("")}`, assumedUnit: parsed.isAssumed };
}

/** A unit given to a formatter, read by the same vocabulary as typed units. */
function knownUnit(kind: QuantityKind, unit: string): Unit {
  const reading = readUnit(foldSpaces(unit));
  if (!reading.ok) throw new QuantityError(kind, unit, "is not a known unit");
  return reading.unit;
}

/**
 * `value` in `fromUnit` written in `toUnit` ("8.1 kpc"). A value that is not finite is written as
 * the results panel writes it, with no unit: "—" for NaN (no value), "∞" or "−∞".
 */
function formatIn(kind: QuantityKind, value: number, fromUnit: string, toUnit: string, significantDigits: number): string {
  const target = knownUnit(kind, toUnit);
  const from = math.unit(1, fromUnit);
  if (!from.equalBase(target)) throw new QuantityError(kind, toUnit, `is not ${articleFor(kind)} ${kind} unit`);
  if (!Number.isFinite(value)) return formatSignificant(value);
  return `${formatSignificant(value * from.to(target).toNumber(), significantDigits)} ${toUnit}`;
}

/**
 * Formats a mass given in solar masses in `unit`: a mass unit (`Msun`, `Mjup`, `kg`), or a length or
 * time unit for the geometrized GM/c^2 (`km`) or GM/c^3 (`us`, `s`). Default 4 significant digits.
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
