/**
 * The units each results row can be shown in, and the text of a value in the chosen unit. Values
 * travel in base units (radians, seconds, metres) and are converted by the physics formatters, so the
 * bench never carries conversion factors of its own.
 */

import {
  ARCSECOND_RAD,
  DAY_S,
  formatAngle,
  formatDistance,
  formatTime,
  JULIAN_YEAR_S,
  MICROARCSECOND_RAD,
  MILLIARCSECOND_RAD,
  PARSEC_M,
} from "@/lib/physics";

export type DisplayKind = "angle" | "time" | "length" | "ratio";

/** Units offered per kind, smallest first. */
export const unitChoices = {
  angle: ["uas", "mas", "arcsec", "deg", "rad"],
  time: ["s", "h", "d", "yr"],
  length: ["m", "km", "au", "pc"],
  ratio: [""],
} as const satisfies Record<DisplayKind, readonly string[]>;

/** How a unit is written for people (µas rather than the typed "uas"). */
export function unitLabel(unit: string): string {
  return unit === "uas" ? "µas" : unit;
}

/** Significant digits shown in the results panel; copying a row keeps the same text. */
export const RESULT_DIGITS = 4;

/** Formats `value` (radians, seconds, metres, or a plain ratio) in `unit`, with the unit written for people. */
export function formatInUnit(kind: DisplayKind, value: number, unit: string, digits = RESULT_DIGITS): string {
  if (!Number.isFinite(value)) return value > 0 ? "∞" : value < 0 ? "−∞" : "—";
  switch (kind) {
    case "angle":
      return formatAngle(value, unit, digits).replace(/ uas$/, " µas");
    case "time":
      return formatTime(value, unit, digits);
    case "length":
      return formatDistance(value / PARSEC_M, unit, digits);
    case "ratio":
      return formatPlain(value, digits);
  }
}

/** A dimensionless number in the same style as the physics formatters (exponent outside 1e-3..1e6). */
export function formatPlain(value: number, digits = RESULT_DIGITS): string {
  if (!Number.isFinite(value)) return value > 0 ? "∞" : value < 0 ? "−∞" : "—";
  const magnitude = Math.abs(value);
  if (value === 0 || (magnitude >= 1e-3 && magnitude < 1e6)) return String(Number(value.toPrecision(digits)));
  const [mantissa, exponent] = value.toExponential(digits - 1).split("e");
  return `${Number(mantissa)}e${Number(exponent)}`;
}

/** The unit a human would pick for a time span: minutes to years, so verdicts read naturally. */
export function naturalTimeUnit(timeS: number): "s" | "min" | "h" | "d" | "yr" {
  const magnitude = Math.abs(timeS);
  if (magnitude < 120) return "s";
  if (magnitude < 2 * 3600) return "min";
  if (magnitude < DAY_S) return "h";
  if (magnitude < 2 * JULIAN_YEAR_S) return "d";
  return "yr";
}

/** The unit a human would pick for an angle: µas below 1 mas, mas below 1 arcsec, else arcsec or deg. */
export function naturalAngleUnit(angleRad: number): "uas" | "mas" | "arcsec" | "deg" {
  const magnitudeMas = Math.abs(angleRad) / MILLIARCSECOND_RAD;
  if (magnitudeMas < 1) return "uas";
  if (magnitudeMas < 1000) return "mas";
  if (magnitudeMas < 3_600_000) return "arcsec";
  return "deg";
}

const radiansPerAngleUnit = { uas: MICROARCSECOND_RAD, mas: MILLIARCSECOND_RAD, arcsec: ARCSECOND_RAD, deg: Math.PI / 180 } as const;

/** An angle in radians as a number in one of the plot units (for axes that read in µas, mas, ...). */
export function angleInUnit(angleRad: number, unit: keyof typeof radiansPerAngleUnit): number {
  return angleRad / radiansPerAngleUnit[unit];
}
