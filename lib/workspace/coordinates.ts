/**
 * Sky coordinates as people type them: right ascension in sexagesimal hours ("17 45 40.04",
 * "17:45:40.04", "17h45m40.04s") or decimal degrees ("266.4168", "266.4168d"); declination in
 * sexagesimal degrees ("-29 00 28.1", "-29d00m28.1s") or decimal degrees. Results are ICRS degrees.
 */

export class CoordinateError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "CoordinateError";
  }
}

/**
 * Decimal degrees as a form field holds them, so the coordinate reader gives back the same double:
 * JavaScript's shortest round-trip text; the exponent forms, which the reader does not take, occur
 * only within 1e-6° of zero and are written with fifteen decimals (an error below 2e-12″).
 */
export function degreesFieldText(valueDeg: number): string {
  const text = String(valueDeg);
  return text.includes("e") ? valueDeg.toFixed(15) : text;
}

/** The longest coordinate text read: a typed or pasted position with every decimal a catalogue gives is far shorter. */
export const MAX_COORDINATE_CHARS = 64;

// Each separator is a marker with optional spaces around it or spaces alone, never both ways: a
// pattern where two space runs can take the same spaces backtracks polynomially on a long run of
// spaces (a 3 KB body held a server process for seconds).
const sexagesimalPattern =
  /^([+-])?\s*(\d{1,3})(?:\s*[:hd°]\s*|\s+)(\d{1,2})(?:\s*[:m'′]\s*|\s+)(\d{1,2}(?:\.\d+)?)\s*[s"″]?$/i;
const decimalPattern = /^([+-]?\d{1,3}(?:\.\d+)?)\s*(?:d|deg|°)?$/i;

interface Sexagesimal {
  negative: boolean;
  whole: number;
  minutes: number;
  seconds: number;
}

function matchSexagesimal(text: string, label: string): Sexagesimal | undefined {
  const match = sexagesimalPattern.exec(text);
  if (!match) return undefined;
  const minutes = Number(match[3]);
  const seconds = Number(match[4]);
  if (minutes >= 60) throw new CoordinateError(`${label}: minutes must be below 60 (got ${minutes}).`);
  if (seconds >= 60) throw new CoordinateError(`${label}: seconds must be below 60 (got ${seconds}).`);
  return { negative: match[1] === "-", whole: Number(match[2]), minutes, seconds };
}

/** The typed text, trimmed, with a true minus sign (U+2212, as papers and our own display write it) read as "-". */
function asText(input: string | number): string {
  return typeof input === "number" ? String(input) : input.trim().replace(/^\u2212/, "-");
}

/** Right ascension in degrees, [0, 360). Sexagesimal input is in hours; bare numbers are degrees. */
export function parseRightAscensionDeg(input: string | number): number {
  const text = asText(input);
  const sexagesimal = matchSexagesimal(text, "Right ascension");
  if (sexagesimal) {
    if (sexagesimal.negative) throw new CoordinateError("Right ascension cannot be negative.");
    if (sexagesimal.whole >= 24) throw new CoordinateError(`Right ascension: hours must be below 24 (got ${sexagesimal.whole}).`);
    return (sexagesimal.whole + sexagesimal.minutes / 60 + sexagesimal.seconds / 3600) * 15;
  }
  const decimal = decimalPattern.exec(text);
  if (!decimal) {
    throw new CoordinateError('Right ascension must be hours "hh mm ss.s" or degrees like "266.417".');
  }
  const degrees = Number(decimal[1]);
  if (!(degrees >= 0 && degrees < 360)) throw new CoordinateError(`Right ascension must be in [0, 360) degrees (got ${degrees}).`);
  return degrees;
}

/** Declination in degrees, [-90, 90]. */
export function parseDeclinationDeg(input: string | number): number {
  const text = asText(input);
  const sexagesimal = matchSexagesimal(text, "Declination");
  let degrees: number;
  if (sexagesimal) {
    const magnitude = sexagesimal.whole + sexagesimal.minutes / 60 + sexagesimal.seconds / 3600;
    degrees = sexagesimal.negative ? -magnitude : magnitude;
  } else {
    const decimal = decimalPattern.exec(text);
    if (!decimal) throw new CoordinateError('Declination must be "±dd mm ss.s" or degrees like "-29.008".');
    degrees = Number(decimal[1]);
  }
  if (!(degrees >= -90 && degrees <= 90)) throw new CoordinateError(`Declination must be in [-90, 90] degrees (got ${degrees}).`);
  return degrees;
}

function splitSexagesimal(value: number, secondDecimals: number): [number, number, string] {
  const scale = 10 ** secondDecimals;
  // Round on the total seconds so 59.96 s never prints as "60.0".
  const totalSeconds = Math.round(value * 3600 * scale) / scale;
  const whole = Math.floor(totalSeconds / 3600);
  const minutes = Math.floor((totalSeconds - whole * 3600) / 60);
  const seconds = totalSeconds - whole * 3600 - minutes * 60;
  return [whole, minutes, seconds.toFixed(secondDecimals).padStart(secondDecimals + 3, "0")];
}

const two = (n: number) => String(n).padStart(2, "0");

/** "17h45m40.04s" for display. */
export function formatRightAscension(raDeg: number): string {
  const [hours, minutes, seconds] = splitSexagesimal(raDeg / 15, 2);
  return `${two(hours % 24)}h${two(minutes)}m${seconds}s`;
}

/** "−29°00′28.1″" for display (with a true minus sign). */
export function formatDeclination(decDeg: number): string {
  const [degrees, minutes, seconds] = splitSexagesimal(Math.abs(decDeg), 1);
  return `${decDeg < 0 ? "−" : "+"}${two(degrees)}°${two(minutes)}′${seconds}″`;
}

/**
 * "17:45:40.036": right ascension as hours:minutes:seconds with `secondDecimals` decimals of a
 * second (3: 0.001 s, 15 mas at the equator), the form observatory proposal forms and astropy's
 * `Angle.to_string(unit=hourangle, sep=":")` write; ASCII only, so table readers parse it.
 */
export function formatRightAscensionColons(raDeg: number, secondDecimals: number): string {
  const [hours, minutes, seconds] = splitSexagesimal(raDeg / 15, secondDecimals);
  return `${two(hours % 24)}:${two(minutes)}:${seconds}`;
}

/**
 * "-29:00:28.17": declination as signed degrees:arcminutes:arcseconds with `secondDecimals`
 * decimals of an arcsecond (2: 10 mas), an ASCII hyphen-minus or plus always written, as astropy's
 * `Angle.to_string(sep=":", alwayssign=True)` writes it.
 */
export function formatDeclinationColons(decDeg: number, secondDecimals: number): string {
  const [degrees, minutes, seconds] = splitSexagesimal(Math.abs(decDeg), secondDecimals);
  const isNegative = decDeg < 0 && (degrees > 0 || minutes > 0 || Number(seconds) > 0);
  return `${isNegative ? "-" : "+"}${two(degrees)}:${two(minutes)}:${seconds}`;
}
