/**
 * The units each results row can be shown in, the readable unit picked when the user has chosen none,
 * and the text of a value in a unit. Values travel in base units (radians, seconds, metres) and are
 * converted by the physics formatters, so the bench never carries conversion factors of its own.
 * The user's choices live in the sketch's `units` key ("t-e:yr,theta-e:arcsec"), so a link keeps them.
 */

import {
  ARCSECOND_RAD,
  AU_M,
  DAY_S,
  formatAngle,
  formatDistance,
  formatTime,
  MICROARCSECOND_RAD,
  MILLIARCSECOND_RAD,
  PARSEC_M,
} from "@/lib/physics";
import { DEFAULT_SIGNIFICANT_DIGITS, formatSignificant } from "@/lib/numbers/significant";

export type DisplayKind = "angle" | "time" | "length" | "ratio";

/** Units offered per kind, smallest first. */
export const unitChoices = {
  angle: ["uas", "mas", "arcsec", "deg", "rad"],
  time: ["us", "ms", "s", "min", "h", "d", "yr"],
  length: ["m", "km", "au", "pc"],
  ratio: [""],
} as const satisfies Record<DisplayKind, readonly string[]>;

/** The select's value for "no choice made: pick a readable unit for the value". */
export const AUTO_UNIT = "auto";

/** How a unit is written for people (µas rather than the typed "uas"). */
export function unitLabel(unit: string): string {
  if (unit === "uas") return "µas";
  if (unit === "us") return "µs";
  return unit;
}

/** Significant digits shown in the results panel; copying a row keeps the same text. */
export const RESULT_DIGITS = DEFAULT_SIGNIFICANT_DIGITS;

/** Formats `value` (radians, seconds, metres, or a plain ratio) in `unit`, with the unit written for people. */
export function formatInUnit(kind: DisplayKind, value: number, unit: string, digits = RESULT_DIGITS): string {
  if (!Number.isFinite(value)) return formatSignificant(value);
  switch (kind) {
    case "angle":
      return formatAngle(value, unit, digits).replace(/ uas$/, " µas");
    case "time":
      return formatTime(value, unit, digits).replace(/ us$/, " µs");
    case "length":
      return formatDistance(value / PARSEC_M, unit, digits);
    case "ratio":
      return formatSignificant(value, digits);
  }
}

/** Longest span still read in days (our rule, from the issue: "days → years above ~1,000 d"). */
const MAX_DAYS = 1000;

/** The readable unit for a time span: µs to years, each used while the number stays short. */
export function naturalTimeUnit(timeS: number): "us" | "ms" | "s" | "min" | "h" | "d" | "yr" {
  const magnitude = Math.abs(timeS);
  if (magnitude < 1e-3) return "us";
  if (magnitude < 1) return "ms";
  if (magnitude < 120) return "s";
  if (magnitude < 2 * 3600) return "min";
  if (magnitude < DAY_S) return "h";
  if (magnitude < MAX_DAYS * DAY_S) return "d";
  return "yr";
}

/** The readable unit for an angle: µas below 1 mas, mas below 1″, arcsec below 1°, then degrees. */
export function naturalAngleUnit(angleRad: number): "uas" | "mas" | "arcsec" | "deg" {
  const magnitudeMas = Math.abs(angleRad) / MILLIARCSECOND_RAD;
  if (magnitudeMas < 1) return "uas";
  if (magnitudeMas < 1000) return "mas";
  if (magnitudeMas < 3_600_000) return "arcsec";
  return "deg";
}

/** The readable unit for a length: metres, km up to a million km, au up to 10⁵ au, then parsecs. */
export function naturalLengthUnit(lengthM: number): "m" | "km" | "au" | "pc" {
  const magnitude = Math.abs(lengthM);
  if (magnitude < 1e3) return "m";
  if (magnitude < 1e9) return "km";
  if (magnitude < 1e5 * AU_M) return "au";
  return "pc";
}

/** The unit a row shows: the user's choice when it is one of the kind's units, else the readable one. */
export function displayUnit(kind: DisplayKind, value: number, chosen: string | undefined): string {
  if (kind === "ratio") return "";
  if (chosen !== undefined && (unitChoices[kind] as readonly string[]).includes(chosen)) return chosen;
  // A row with no value ("—") still offers a unit; any middling one will do.
  if (!Number.isFinite(value)) return { angle: "mas", time: "d", length: "km" }[kind];
  if (kind === "angle") return naturalAngleUnit(value);
  if (kind === "time") return naturalTimeUnit(value);
  return naturalLengthUnit(value);
}

/** Row ids are lowercase words joined by hyphens; anything else in a URL is ignored. */
const ROW_ID = /^[a-z]+(?:-[a-z]+)*$/;
const KNOWN_UNITS = new Set<string>(Object.values(unitChoices).flat());

/** The unit choices kept in the sketch's `units` text: "t-e:yr,theta-e:arcsec" → { "t-e": "yr", ... }. */
export function readUnitChoices(text: string): Record<string, string> {
  const choices: Record<string, string> = {};
  for (const entry of text.split(",")) {
    const [id, unit] = entry.split(":");
    if (id !== undefined && unit !== undefined && ROW_ID.test(id) && KNOWN_UNITS.has(unit)) choices[id] = unit;
  }
  return choices;
}

/** The `units` text with row `id` set to `unit`, or cleared when `unit` is AUTO_UNIT; ids in a stable order. */
export function withUnitChoice(text: string, id: string, unit: string): string {
  const choices = readUnitChoices(text);
  if (unit === AUTO_UNIT) delete choices[id];
  else choices[id] = unit;
  return Object.keys(choices)
    .sort()
    .map((key) => `${key}:${choices[key]}`)
    .join(",");
}

const radiansPerAngleUnit = { uas: MICROARCSECOND_RAD, mas: MILLIARCSECOND_RAD, arcsec: ARCSECOND_RAD, deg: Math.PI / 180 } as const;

/** An angle in radians as a number in one of the plot units (for axes that read in µas, mas, ...). */
export function angleInUnit(angleRad: number, unit: keyof typeof radiansPerAngleUnit): number {
  return angleRad / radiansPerAngleUnit[unit];
}
