/**
 * The columns a target table export can hold: each with its header label, unit (as shown, in
 * LaTeX and in IVOA VOUnit form), UCD (IVOA UCD1+ 1.5), VOTable datatype and default significant
 * digits. Numbers are exported in the units the column key names.
 */
import { z } from "zod";
import type { TargetView } from "@/lib/workspace/target-view";
import { answersLine } from "@/lib/workspace/case-verdict-words";
import { formatSignificant, machineSignificantText, roundToSignificant } from "@/lib/numbers/significant";
import { headerOf } from "./data-table";

export { headerOf };

export type ColumnKind = "double" | "int" | "text";

export interface ExportColumn {
  key: keyof TargetView;
  label: string;
  /** Unit as a reader sees it in CSV/JSON headers; "" for a dimensionless or text column. */
  unit: string;
  /** The unit in LaTeX math-free text (compiles with no package). */
  latexUnit: string;
  /** IVOA VOUnits 1.0 string; "" when dimensionless. */
  voUnit: string;
  ucd: string;
  kind: ColumnKind;
  /** Significant digits when the request names none (doubles only). */
  defaultDigits: number;
  /** Whether the column is an input of the hypothesis or a stored computed quantity. */
  origin: "input" | "computed";
  /** A text of several sentences, which a typeset table wraps in a paragraph column. */
  isParagraph?: boolean;
}

const input = (c: Omit<ExportColumn, "origin">): ExportColumn => ({ ...c, origin: "input" });
const computed = (c: Omit<ExportColumn, "origin">): ExportColumn => ({ ...c, origin: "computed" });
const text = { unit: "", latexUnit: "", voUnit: "", kind: "text", defaultDigits: 0 } as const;

export const exportColumns = [
  input({ key: "name", label: "Name", ucd: "meta.id;meta.main", ...text }),
  input({ key: "raDeg", label: "RA (ICRS)", unit: "deg", latexUnit: "deg", voUnit: "deg", ucd: "pos.eq.ra;meta.main", kind: "double", defaultDigits: 9 }),
  input({ key: "decDeg", label: "Dec (ICRS)", unit: "deg", latexUnit: "deg", voUnit: "deg", ucd: "pos.eq.dec;meta.main", kind: "double", defaultDigits: 9 }),
  input({ key: "lensModel", label: "Lens model", ucd: "meta.code.class", ...text }),
  input({ key: "lensMassSolar", label: "Lens mass", unit: "Msun", latexUnit: "$M_\\odot$", voUnit: "solMass", ucd: "phys.mass", kind: "double", defaultDigits: 4 }),
  input({ key: "velocityDispersionKmPerS", label: "Velocity dispersion", unit: "km/s", latexUnit: "km/s", voUnit: "km/s", ucd: "phys.veloc.dispersion", kind: "double", defaultDigits: 4 }),
  input({ key: "lensDistancePc", label: "Lens distance", unit: "pc", latexUnit: "pc", voUnit: "pc", ucd: "pos.distance", kind: "double", defaultDigits: 4 }),
  input({ key: "sourceDistancePc", label: "Source distance", unit: "pc", latexUnit: "pc", voUnit: "pc", ucd: "pos.distance", kind: "double", defaultDigits: 4 }),
  input({ key: "lensRedshift", label: "Lens redshift", unit: "", latexUnit: "", voUnit: "", ucd: "src.redshift", kind: "double", defaultDigits: 4 }),
  input({ key: "sourceRedshift", label: "Source redshift", unit: "", latexUnit: "", voUnit: "", ucd: "src.redshift", kind: "double", defaultDigits: 4 }),
  input({ key: "sourceOffsetThetaE", label: "Source offset", unit: "thetaE", latexUnit: "$\\theta_E$", voUnit: "", ucd: "pos.angDistance;arith.ratio", kind: "double", defaultDigits: 4 }),
  input({ key: "properMotionMasPerYr", label: "Relative proper motion", unit: "mas/yr", latexUnit: "mas/yr", voUnit: "mas/yr", ucd: "pos.pm", kind: "double", defaultDigits: 4 }),
  // The case the team chose (empty while the inferred one applies); `answeredCase` below is the one answered.
  input({ key: "scienceCase", label: "Chosen science case", ucd: "meta.code.class", ...text }),
  // t0 as a Julian date (UTC): ten digits show it to about two minutes.
  input({ key: "eventPeakJdUtc", label: "Event peak t0 (JD, UTC)", unit: "d", latexUnit: "d", voUnit: "d", ucd: "time.epoch", kind: "double", defaultDigits: 10 }),
  input({ key: "sourceRadiusSolar", label: "Source radius", unit: "Rsun", latexUnit: "$R_\\odot$", voUnit: "solRad", ucd: "phys.size.radius", kind: "double", defaultDigits: 4 }),
  input({ key: "sourceRadiusThetaE", label: "Source radius rho", unit: "thetaE", latexUnit: "$\\theta_E$", voUnit: "", ucd: "phys.angSize;arith.ratio", kind: "double", defaultDigits: 4 }),
  input({ key: "limbDarkeningU", label: "Limb-darkening coefficient", unit: "", latexUnit: "", voUnit: "", ucd: "phot.limbDark", kind: "double", defaultDigits: 4 }),
  // The source's own magnitude in its band's own system (Vega or AB, as the band defines it); an empty band is the proposal's.
  input({ key: "sourceMagnitude", label: "Source magnitude", unit: "mag", latexUnit: "mag", voUnit: "mag", ucd: "phot.mag", kind: "double", defaultDigits: 4 }),
  input({ key: "sourceBand", label: "Source band", ucd: "meta.id;instr.filter", ...text }),
  // f_s: the source's flux over the baseline's (UCD1+: a ratio of fluxes).
  input({ key: "blendFraction", label: "Blend fraction f_s", unit: "", latexUnit: "", voUnit: "", ucd: "phot.flux;arith.ratio", kind: "double", defaultDigits: 3 }),
  // What a light-curve fit measured: t_E (empty while it is θ_E/μ_rel, the crossing time below) and the parallax vector π_E (north, east).
  input({ key: "einsteinTimeDays", label: "Einstein time t_E (fitted)", unit: "d", latexUnit: "d", voUnit: "d", ucd: "time.duration", kind: "double", defaultDigits: 4 }),
  input({ key: "parallaxNorth", label: "Microlens parallax pi_E north", unit: "", latexUnit: "", voUnit: "", ucd: "pos.parallax;arith.ratio", kind: "double", defaultDigits: 3 }),
  input({ key: "parallaxEast", label: "Microlens parallax pi_E east", unit: "", latexUnit: "", voUnit: "", ucd: "pos.parallax;arith.ratio", kind: "double", defaultDigits: 3 }),
  // The orbiting star of the relativistic-orbit case: a in au or as an angle at the lens distance (one of the two), e, P, T_p (JD, UTC), i, Ω, ω (UCD1+ src.orbital words).
  input({ key: "orbitSemiMajorAxisAu", label: "Orbit semi-major axis a", unit: "au", latexUnit: "au", voUnit: "AU", ucd: "phys.size.smajAxis", kind: "double", defaultDigits: 6 }),
  input({ key: "orbitSemiMajorAxisMas", label: "Orbit semi-major axis a (angle)", unit: "mas", latexUnit: "mas", voUnit: "mas", ucd: "phys.angSize.smajAxis", kind: "double", defaultDigits: 6 }),
  input({ key: "orbitEccentricity", label: "Orbit eccentricity e", unit: "", latexUnit: "", voUnit: "", ucd: "src.orbital.eccentricity", kind: "double", defaultDigits: 6 }),
  input({ key: "orbitPeriodDays", label: "Orbital period P", unit: "d", latexUnit: "d", voUnit: "d", ucd: "time.period", kind: "double", defaultDigits: 8 }),
  input({ key: "orbitPeriapsisJdUtc", label: "Time of periapsis T_p (JD, UTC)", unit: "d", latexUnit: "d", voUnit: "d", ucd: "time.epoch;src.orbital.periastron", kind: "double", defaultDigits: 10 }),
  input({ key: "orbitInclinationDeg", label: "Orbit inclination i", unit: "deg", latexUnit: "deg", voUnit: "deg", ucd: "src.orbital.inclination", kind: "double", defaultDigits: 6 }),
  input({ key: "orbitNodeDeg", label: "Orbit ascending node Omega", unit: "deg", latexUnit: "deg", voUnit: "deg", ucd: "src.orbital.node", kind: "double", defaultDigits: 6 }),
  input({ key: "orbitPeriapsisArgumentDeg", label: "Orbit argument of periapsis omega", unit: "deg", latexUnit: "deg", voUnit: "deg", ucd: "src.orbital.periastron", kind: "double", defaultDigits: 6 }),
  input({ key: "priority", label: "Priority", unit: "", latexUnit: "", voUnit: "", ucd: "meta.code.qual", kind: "int", defaultDigits: 0 }),
  input({ key: "status", label: "Status", ucd: "meta.code.status", ...text }),
  input({ key: "tags", label: "Tags", ucd: "meta.note", ...text }),
  computed({ key: "einsteinRadiusMas", label: "Einstein radius", unit: "mas", latexUnit: "mas", voUnit: "mas", ucd: "phys.angSize", kind: "double", defaultDigits: 4 }),
  computed({ key: "imageSeparationMas", label: "Image separation", unit: "mas", latexUnit: "mas", voUnit: "mas", ucd: "pos.angDistance", kind: "double", defaultDigits: 4 }),
  computed({ key: "magnificationTotal", label: "Total magnification", unit: "", latexUnit: "", voUnit: "", ucd: "arith.factor", kind: "double", defaultDigits: 4 }),
  computed({ key: "timeDelayDays", label: "Time delay", unit: "d", latexUnit: "d", voUnit: "d", ucd: "time.interval", kind: "double", defaultDigits: 4 }),
  computed({ key: "crossingTimeDays", label: "Einstein crossing time", unit: "d", latexUnit: "d", voUnit: "d", ucd: "time.duration", kind: "double", defaultDigits: 4 }),
  computed({ key: "shadowDiameterMicroarcsec", label: "Shadow diameter", unit: "uas", latexUnit: "$\\mu$as", voUnit: "uarcsec", ucd: "phys.angSize", kind: "double", defaultDigits: 4 }),
  // The photon budget: hours over the visits the case needs (exposures and overheads, so time.duration;obs
  // rather than obs.exposure), and the signal-to-noise at the brightest of them.
  computed({ key: "timeRequestHours", label: "Time request", unit: "h", latexUnit: "h", voUnit: "h", ucd: "time.duration;obs", kind: "double", defaultDigits: 3 }),
  computed({ key: "peakSignalToNoise", label: "S/N at brightest visit", unit: "", latexUnit: "", voUnit: "", ucd: "stat.snr", kind: "double", defaultDigits: 3 }),
  // The case's id (chosen, else inferred), its worst verdict, and every answer in one text cell.
  computed({ key: "answeredCase", label: "Science case", ucd: "meta.code", ...text }),
  computed({ key: "caseVerdict", label: "Case verdict", ucd: "meta.code", ...text }),
  computed({ key: "caseAnswers", label: "Case answers", ucd: "meta.note", ...text, isParagraph: true }),
] as const satisfies readonly ExportColumn[];

export type ExportColumnKey = (typeof exportColumns)[number]["key"];

export const exportColumnKeys = exportColumns.map((c) => c.key) as [ExportColumnKey, ...ExportColumnKey[]];

const columnByKey = new Map<string, ExportColumn>(exportColumns.map((c) => [c.key, c]));

/** The column spec for a key known to be valid. */
export function exportColumnOf(key: ExportColumnKey): ExportColumn {
  return columnByKey.get(key)!;
}

/** The columns a request names none of: what a technical justification usually shows. */
export const defaultExportColumns: ExportColumnKey[] = [
  "name",
  "raDeg",
  "decDeg",
  "lensModel",
  "einsteinRadiusMas",
  "imageSeparationMas",
  "magnificationTotal",
  "crossingTimeDays",
  "timeRequestHours",
  "answeredCase",
  "caseVerdict",
];

/**
 * A column in words for VOTable and ECSV descriptions: its label and whether it is an input or
 * computed; a scale that is no unit (θ_E) is said here, since no unit attribute can carry it.
 */
export function descriptionOf(column: ExportColumn): string {
  const scale = column.voUnit === "" && column.unit !== "" ? `, in units of ${column.unit}` : "";
  return `${column.label}${scale} (${column.origin})`;
}

export const MIN_DIGITS = 1;
export const MAX_DIGITS = 17;

/** A column with the significant digits it is exported with. */
export interface ChosenColumn {
  column: ExportColumn;
  /** Significant digits shown to a reader (LaTeX, the summary): the request's, else the column's default. */
  digits: number;
  /** Whether the request named this column's digits (a bare `n` names every double column's). */
  hasRequestedDigits: boolean;
}

/** One exported cell before formatting: a number, a text, or nothing (the model gives no value). */
export type CellValue = number | string | null;

/** The cell of `row` under `column`; tags are joined with "; ", the case's answers written as one text ("Question: Verdict (figure); …"). */
export function cellOf(row: TargetView, column: ExportColumn): CellValue {
  if (column.key === "caseAnswers") return row.caseAnswers.length === 0 ? null : answersLine(row.caseAnswers);
  const value = row[column.key];
  if (Array.isArray(value)) return value.join("; ");
  if (value === null || value === undefined) return null;
  return value as number | string;
}

/**
 * Significant digits a data format (CSV, ECSV, VOTable, JSON) writes a double column with. An input
 * the request named no digits for is written as stored (17 digits identify every double, and its
 * shortest form is written), so a file re-imported unchanged matches its targets exactly; computed
 * quantities keep their chosen digits, the accuracy their model has.
 */
export function dataDigitsOf(chosen: ChosenColumn): number {
  return isWrittenAsStored(chosen) ? MAX_DIGITS : chosen.digits;
}

/** Whether a data format writes the column's values exactly as stored (see `dataDigitsOf`). */
export function isWrittenAsStored(chosen: ChosenColumn): boolean {
  return chosen.column.origin === "input" && !chosen.hasRequestedDigits;
}

/** A cell as a data format writes it: a double rounded to `dataDigitsOf`, anything else as it is. */
export function dataCellOf(row: TargetView, chosen: ChosenColumn): CellValue {
  const value = cellOf(row, chosen.column);
  return typeof value === "number" && chosen.column.kind === "double" ? roundToSignificant(value, dataDigitsOf(chosen)) : value;
}

/**
 * A cell as LaTeX's and the summary's text: doubles at their significant digits in the machine form
 * (`machineSignificantText`, which the LaTeX writer sets as a power of ten), "" for null.
 */
export function cellText(value: CellValue, chosen: ChosenColumn): string {
  if (value === null) return "";
  if (typeof value === "number") return chosen.column.kind === "double" ? machineSignificantText(value, chosen.digits) : String(value);
  return value;
}

/** A cell as a person reads it in a printed table (the technical summary): doubles by `formatSignificant`. */
export function cellTextForPeople(value: CellValue, chosen: ChosenColumn): string {
  if (typeof value === "number" && chosen.column.kind === "double") return formatSignificant(value, chosen.digits);
  return cellText(value, chosen);
}

const digitsSchema = z.coerce.number().int().min(MIN_DIGITS).max(MAX_DIGITS);

/**
 * The export query's `columns` (comma-separated keys) and `digits` (`key:n` pairs, or one bare `n`
 * for every double column). Unknown columns are refused by name; digits for a column that is not
 * chosen are refused too, so a typo never passes silently.
 */
export const tableColumnsQuerySchema = z
  .object({
    columns: z.string().max(2000).optional(),
    digits: z.string().max(2000).optional(),
  })
  .transform((query, ctx): ChosenColumn[] => {
    const keys = query.columns === undefined || query.columns.trim() === "" ? defaultExportColumns : query.columns.split(",").map((k) => k.trim());
    const unknown = keys.filter((k) => !columnByKey.has(k));
    if (unknown.length > 0) {
      ctx.addIssue({ code: "custom", path: ["columns"], message: `Unknown column${unknown.length > 1 ? "s" : ""}: ${unknown.join(", ")}. Known: ${exportColumnKeys.join(", ")}.` });
      return z.NEVER;
    }
    const duplicates = keys.filter((k, i) => keys.indexOf(k) !== i);
    if (duplicates.length > 0) {
      ctx.addIssue({ code: "custom", path: ["columns"], message: `Column named twice: ${[...new Set(duplicates)].join(", ")}.` });
      return z.NEVER;
    }
    const digitsByKey = new Map<string, number>();
    let allDigits: number | undefined;
    for (const part of (query.digits ?? "").split(",").map((p) => p.trim()).filter((p) => p !== "")) {
      const [key, n] = part.includes(":") ? part.split(":", 2) : [undefined, part];
      const parsed = digitsSchema.safeParse(n);
      if (!parsed.success) {
        ctx.addIssue({ code: "custom", path: ["digits"], message: `Significant digits must be a whole number from ${MIN_DIGITS} to ${MAX_DIGITS} (got "${part}").` });
        return z.NEVER;
      }
      if (key === undefined) allDigits = parsed.data;
      else if (!keys.includes(key) || columnByKey.get(key)!.kind !== "double") {
        ctx.addIssue({ code: "custom", path: ["digits"], message: `Digits given for "${key}", which is not a chosen numeric column.` });
        return z.NEVER;
      } else digitsByKey.set(key, parsed.data);
    }
    return keys.map((key) => {
      const column = columnByKey.get(key)!;
      const requested = digitsByKey.get(key) ?? (column.kind === "double" ? allDigits : undefined);
      return { column, digits: requested ?? column.defaultDigits, hasRequestedDigits: requested !== undefined };
    });
  });
