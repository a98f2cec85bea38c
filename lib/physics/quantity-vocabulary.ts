/**
 * The units astronomers type, read into mathjs units: the text after a quantity's number
 * (`Msun`, `km s-1`, `mas.yr**-1`, `″`, `µm`) becomes a product of known units with integer powers.
 *
 * Case: a unit is read as typed first. Spellings with no SI prefix whose case matters are also read
 * in any case (`msun`, `MSUN`, `Kpc`, `KM`, `Arcsec`, `GHZ`, `Pc`). Where a letter is an SI prefix
 * its case is kept, as SI requires: `m` is metre and `M` is not a unit, `mas` is a milliarcsecond and
 * `Mas` is refused, `Mpc` is a megaparsec and `mpc` a milliparsec, `MHz` megahertz and `mHz`
 * millihertz; `MPC` or `MAS` are refused, naming the spellings meant. `Ms` (a megasecond to SI, a
 * solar mass to some) is refused in every field. Other units mathjs knows (`kg`, `g`, `Mm`, `kyr`,
 * `week`) are read in their exact SI spelling.
 *
 * Masses of Jupiter and the Earth are their IAU 2015 B3 nominal GM over the Sun's, so they are exact
 * ratios in solar masses whatever G is; radii are the IAU 2015 B3 nominal (equatorial) radii; yr and
 * `a` are the Julian year; ly is c times a Julian year.
 *
 * Written as a scanner over the characters (no regular expression runs on the unit text), so its
 * time is linear in the length of the text.
 */

import { create, createUnitDependencies, unitDependencies, type Unit } from "mathjs";
import {
  AU_M,
  DAY_S,
  EARTH_EQUATORIAL_RADIUS_M,
  GM_EARTH_M3_PER_S2,
  GM_JUPITER_M3_PER_S2,
  GM_SUN_M3_PER_S2,
  JULIAN_YEAR_S,
  JUPITER_EQUATORIAL_RADIUS_M,
  LIGHT_YEAR_M,
  MICROARCSECOND_RAD,
  MILLIARCSECOND_RAD,
  PARSEC_M,
  SOLAR_MASS_KG,
  SOLAR_RADIUS_M,
} from "./constants";

export const math = create({ unitDependencies, createUnitDependencies });

math.createUnit({
  Msun: { definition: `${SOLAR_MASS_KG} kg` },
  Mjup: { definition: `${GM_JUPITER_M3_PER_S2 / GM_SUN_M3_PER_S2} Msun` },
  Mearth: { definition: `${GM_EARTH_M3_PER_S2 / GM_SUN_M3_PER_S2} Msun` },
  Rsun: { definition: `${SOLAR_RADIUS_M} m` },
  Rjup: { definition: `${JUPITER_EQUATORIAL_RADIUS_M} m` },
  Rearth: { definition: `${EARTH_EQUATORIAL_RADIUS_M} m` },
  pc: { definition: `${PARSEC_M} m`, prefixes: "short" },
  au: { definition: `${AU_M} m` },
  ly: { definition: `${LIGHT_YEAR_M} m`, prefixes: "short" },
  mas: { definition: `${MILLIARCSECOND_RAD} rad` },
  uas: { definition: `${MICROARCSECOND_RAD} rad` },
  d: { definition: `${DAY_S} s` },
  yr: { definition: `${JULIAN_YEAR_S} s`, prefixes: "short" },
});

/** A unit the vocabulary names: the mathjs unit it reads as, and how it is written for people. */
interface Word {
  unit: string;
  label: string;
  /** Spellings read exactly as written. */
  exact?: string[];
  /** Spellings read in any case. */
  anyCase?: string[];
}

const WORDS: Word[] = [
  { unit: "Msun", label: "M☉", exact: ["M☉", "M⊙", "Mo"], anyCase: ["Msun", "Msol", "M_sun", "M_sol", "solMass"] },
  { unit: "Mjup", label: "M_J", exact: ["M_J"], anyCase: ["Mjup", "M_jup", "Mjupiter", "jupiterMass"] },
  { unit: "Mearth", label: "M⊕", exact: ["M⊕", "M_E"], anyCase: ["Mearth", "M_earth", "earthMass"] },
  { unit: "kg", label: "kg", anyCase: ["kg"] },
  { unit: "m", label: "m", exact: ["m"] },
  { unit: "km", label: "km", anyCase: ["km"] },
  { unit: "cm", label: "cm", exact: ["cm"] },
  { unit: "mm", label: "mm", exact: ["mm"] },
  { unit: "um", label: "µm", exact: ["um"], anyCase: ["micron", "microns", "micrometre", "micrometer"] },
  { unit: "nm", label: "nm", exact: ["nm"] },
  { unit: "angstrom", label: "Å", exact: ["Å", "Å", "AA"], anyCase: ["angstrom", "angstroms"] },
  { unit: "Rsun", label: "R☉", exact: ["R☉", "R⊙"], anyCase: ["Rsun", "R_sun", "solRad"] },
  { unit: "Rjup", label: "R_J", exact: ["R_J"], anyCase: ["Rjup", "R_jup", "Rjupiter", "jupiterRad"] },
  { unit: "Rearth", label: "R⊕", exact: ["R⊕", "R_E"], anyCase: ["Rearth", "R_earth", "earthRad"] },
  { unit: "au", label: "au", anyCase: ["au", "ua"] },
  { unit: "ly", label: "ly", anyCase: ["ly", "lyr", "lightyear", "lightyears"] },
  { unit: "kly", label: "kly", anyCase: ["kly"] },
  { unit: "Mly", label: "Mly", exact: ["Mly"] },
  { unit: "Gly", label: "Gly", anyCase: ["Gly"] },
  { unit: "pc", label: "pc", anyCase: ["pc", "parsec", "parsecs"] },
  { unit: "kpc", label: "kpc", anyCase: ["kpc", "kiloparsec", "kiloparsecs"] },
  { unit: "Mpc", label: "Mpc", exact: ["Mpc"], anyCase: ["megaparsec", "megaparsecs"] },
  { unit: "Gpc", label: "Gpc", anyCase: ["Gpc", "gigaparsec", "gigaparsecs"] },
  { unit: "Hz", label: "Hz", anyCase: ["Hz"] },
  { unit: "kHz", label: "kHz", anyCase: ["kHz"] },
  { unit: "MHz", label: "MHz", exact: ["MHz", "Mhz", "MHZ"] },
  { unit: "GHz", label: "GHz", anyCase: ["GHz"] },
  { unit: "THz", label: "THz", anyCase: ["THz"] },
  { unit: "rad", label: "rad", anyCase: ["rad", "radian", "radians"] },
  { unit: "deg", label: "°", exact: ["°"], anyCase: ["deg", "degree", "degrees"] },
  { unit: "arcmin", label: "′", exact: ["′", "'", "’"], anyCase: ["arcmin", "arcminute", "arcminutes"] },
  { unit: "arcsec", label: "″", exact: ["″", '"', "”", "''", "′′", "’’"], anyCase: ["arcsec", "arcsecond", "arcseconds"] },
  { unit: "mas", label: "mas", exact: ["mas"] },
  { unit: "uas", label: "µas", anyCase: ["uas", "muas", "uarcsec"] },
  { unit: "s", label: "s", exact: ["s"], anyCase: ["sec", "secs", "second", "seconds"] },
  { unit: "min", label: "min", anyCase: ["min", "mins", "minute", "minutes"] },
  { unit: "h", label: "h", exact: ["h"], anyCase: ["hr", "hrs", "hour", "hours"] },
  { unit: "d", label: "d", exact: ["d"], anyCase: ["day", "days"] },
  { unit: "yr", label: "yr", exact: ["a"], anyCase: ["yr", "yrs", "year", "years"] },
];

/** Spellings refused in every field, with what to type instead. */
const REFUSED: Record<string, { problem: string; instead: string }> = {
  Ms: { problem: "has the unit 'Ms', a megasecond in SI but a solar mass to some", instead: "Msun for solar masses or 1e6 s for a megasecond" },
};

const exactWords = new Map<string, Word>();
const anyCaseWords = new Map<string, Word>();
for (const word of WORDS) {
  for (const spelling of word.exact ?? []) exactWords.set(spelling, word);
  for (const spelling of word.anyCase ?? []) {
    exactWords.set(spelling, word);
    anyCaseWords.set(spelling.toLowerCase(), word);
  }
}

/**
 * Units whose case matters, by the lower case of their spellings, for naming what was meant ("mas"
 * for "MAS"). Single letters are left out: "M" is not a metre.
 */
const caseKept = new Map<string, string[]>();
for (const [spelling, word] of exactWords) {
  const lower = spelling.toLowerCase();
  if (anyCaseWords.has(lower) || spelling.length === 1) continue;
  const meant = caseKept.get(lower) ?? [];
  if (!meant.includes(word.unit)) caseKept.set(lower, [...meant, word.unit]);
}
caseKept.set("mpc", ["Mpc", "mpc"]);

/** One factor of a unit: a unit mathjs knows, its power, and its label for people. */
export interface UnitFactor {
  unit: string;
  power: number;
  label: string;
}

/**
 * A typed unit read: the mathjs unit of value 1 (to convert from), the unit without a value (to
 * convert to) and its factors; or what is wrong in the user's words, and what to type instead when
 * the mistake suggests it.
 */
export type UnitReading = { ok: true; one: Unit; unit: Unit; factors: UnitFactor[] } | { ok: false; problem: string; instead?: string };

const SUPERSCRIPT_DIGITS = "⁰¹²³⁴⁵⁶⁷⁸⁹";
const SYMBOL_CHARACTERS = "°′″'\"’”";
const MAX_POWER = 4;

function isLetter(character: string): boolean {
  return (character >= "a" && character <= "z") || (character >= "A" && character <= "Z") || "_µμ☉⊙⊕ÅÅ".includes(character);
}

/** A power after a unit word (`-1`, `^-1`, `**-1`, `⁻¹`, `2`) at `start`, or 1 when none is written. */
function readPower(text: string, start: number): { power: number; end: number } | { problem: string; instead?: string } {
  let index = start;
  let isMarked = false;
  if (text[index] === "^") {
    index += 1;
    isMarked = true;
  } else if (text[index] === "*" && text[index + 1] === "*") {
    index += 2;
    isMarked = true;
  }
  let sign = 1;
  const signCharacter = text[index];
  if (signCharacter === "-" || signCharacter === "−" || signCharacter === "⁻") sign = -1;
  const hasSign = signCharacter !== undefined && "+-−⁺⁻".includes(signCharacter);
  if (hasSign) index += 1;
  let digits = "";
  while (index < text.length) {
    const character = text[index];
    const superscript = SUPERSCRIPT_DIGITS.indexOf(character);
    if (character >= "0" && character <= "9") digits += character;
    else if (superscript >= 0) digits += String(superscript);
    else break;
    index += 1;
  }
  if (digits === "") {
    if (isMarked || hasSign) return { problem: "has a power without its digits" };
    return { power: 1, end: start };
  }
  const power = sign * Number(digits);
  if (power === 0 || Math.abs(power) > MAX_POWER) return { problem: `has the power ${power} in its unit, which no quantity here takes` };
  return { power, end: index };
}

/** The vocabulary entry, or a mathjs unit in its exact spelling, for one typed word. */
function lookUp(spelling: string): { unit: string; label: string } | { problem: string; instead?: string } {
  const refused = REFUSED[spelling];
  if (refused !== undefined) return refused;
  const word = exactWords.get(spelling) ?? anyCaseWords.get(spelling.toLowerCase());
  if (word !== undefined) return word;
  const meant = caseKept.get(spelling.toLowerCase());
  if (meant !== undefined && !meant.includes(spelling)) {
    return { problem: `has the unit '${spelling}', whose case matters`, instead: meant.join(" or ") };
  }
  try {
    math.unit(spelling);
    return { unit: spelling, label: spelling };
  } catch {
    return { problem: `has an unknown unit '${spelling}'` };
  }
}

/** Unicode micro signs and the spaced sun symbol ("M ☉") in the forms the vocabulary lists. */
function foldSpellings(text: string): string {
  let folded = "";
  for (let index = 0; index < text.length; index += 1) {
    const character = text[index];
    if (character === "µ" || character === "μ") folded += "u";
    else if (character === " " && "MR".includes(text[index - 1] ?? "?") && "☉⊙⊕".includes(text[index + 1] ?? "?")) continue;
    else folded += character;
  }
  return folded;
}

/**
 * Reads a unit text (`km s-1`, `mas/yr`, `Msun`, `″`): factors separated by spaces, `.`, `·`, `*`,
 * or `/` (which inverts the factor after it), each a word with an optional power. White space must
 * already be folded to single spaces.
 */
export function readUnit(typed: string): UnitReading {
  const text = foldSpellings(typed);
  const factors: UnitFactor[] = [];
  let isDivided = false;
  let index = 0;
  while (index < text.length) {
    const character = text[index];
    if (character === " " || character === "." || character === "·" || character === "⋅" || (character === "*" && text[index + 1] !== "*")) {
      index += 1;
      continue;
    }
    if (character === "/") {
      if (isDivided || factors.length === 0) return { ok: false, problem: "has a '/' in the wrong place" };
      isDivided = true;
      index += 1;
      continue;
    }
    let end = index;
    if (SYMBOL_CHARACTERS.includes(character)) {
      end = index + 1;
      // Two primes or apostrophes are the arcsecond sign.
      if ((character === "′" || character === "'" || character === "’") && text[end] === character) end += 1;
    } else if (isLetter(character)) {
      while (end < text.length && isLetter(text[end])) end += 1;
    } else if (character >= "0" && character <= "9") {
      return { ok: false, problem: "has a second number, or a space inside its number that does not separate groups of three digits" };
    } else {
      return { ok: false, problem: `has the character '${character}' in its unit` };
    }
    const found = lookUp(text.slice(index, end));
    if ("problem" in found) return { ok: false, ...found };
    const power = readPower(text, end);
    if ("problem" in power) return { ok: false, ...power };
    factors.push({ unit: found.unit, label: found.label, power: isDivided ? -power.power : power.power });
    isDivided = false;
    index = power.end;
  }
  if (isDivided) return { ok: false, problem: "ends with '/'" };
  if (factors.length === 0) return { ok: false, problem: "has no unit" };
  return { ok: true, one: compose(factors, 1), unit: compose(factors, undefined), factors };
}

/** `unit` to an integer power (mathjs's Unit.pow takes a number; its type declaration says a Unit). */
function power(unit: Unit, exponent: number): Unit {
  return (unit as unknown as { pow(exponent: number): Unit }).pow(exponent);
}

/** The product of `factors`, of value `value` (or none: a unit to convert to). */
function compose(factors: UnitFactor[], value: number | undefined): Unit {
  const unitOf = (factor: UnitFactor) => power(value === undefined ? math.unit(factor.unit) : math.unit(value, factor.unit), factor.power);
  return factors.slice(1).reduce((product, factor) => product.multiply(unitOf(factor)), unitOf(factors[0]));
}

const SUPERSCRIPT_MINUS = "⁻";

/** A power as superscript digits ("²", "⁻¹"). */
export function superscript(power: number): string {
  const digits = [...String(Math.abs(power))].map((digit) => SUPERSCRIPT_DIGITS[Number(digit)]).join("");
  return power < 0 ? `${SUPERSCRIPT_MINUS}${digits}` : digits;
}

/**
 * A text cut at its powers written in superscript characters that the bundled faces cannot draw
 * ("10⁻¹²": they have ¹²³ but nothing else of U+2070–U+207F), each such power given on the line
 * ("−12") and marked raised, for figures and PDFs to draw in raised smaller type. A power of ¹²³
 * alone ("arcsec²") stays as written.
 */
export function raisedPowerParts(text: string): { text: string; isRaised: boolean }[] {
  const parts: { text: string; isRaised: boolean }[] = [];
  let from = 0;
  for (const match of text.matchAll(/[⁰¹²³⁴⁵⁶⁷⁸⁹⁺⁻]+/g)) {
    if (/^[¹²³]+$/.test(match[0])) continue;
    if (match.index > from) parts.push({ text: text.slice(from, match.index), isRaised: false });
    parts.push({ text: [...match[0]].map(baseOfSuperscript).join(""), isRaised: true });
    from = match.index + match[0].length;
  }
  if (from < text.length || parts.length === 0) parts.push({ text: text.slice(from), isRaised: false });
  return parts;
}

/** What a superscript character stands for on the line ("⁷" → "7", "⁻" → "−", "⁺" → "+"). */
function baseOfSuperscript(character: string): string {
  if (character === SUPERSCRIPT_MINUS) return "−";
  if (character === "⁺") return "+";
  return String(SUPERSCRIPT_DIGITS.indexOf(character));
}

/** How a unit read by readUnit is written for people: "km/s", "mas/yr", "M☉", "µas/d". */
export function unitLabel(factors: UnitFactor[]): string {
  const part = (factor: UnitFactor, power: number) => `${factor.label}${power === 1 ? "" : superscript(power)}`;
  const numerator = factors.filter((factor) => factor.power > 0).map((factor) => part(factor, factor.power));
  const denominator = factors.filter((factor) => factor.power < 0).map((factor) => part(factor, -factor.power));
  const top = numerator.length === 0 ? "1" : numerator.join("·");
  return denominator.length === 0 ? top : `${top}/${denominator.join("·")}`;
}
