import { AppError, type FieldErrors } from "@/lib/errors";
import {
  defaultUnits,
  epochScaleOf,
  importFieldKinds,
  importFieldLabels,
  importFields,
  isComputedColumn,
  requiredImportFields,
  type ColumnMapping,
  type FieldKind,
  type ImportField,
} from "@/lib/imports/columns";
import type { ImportTable } from "@/lib/imports/import-table";
import { sourceBandChoicesText, sourceBandOfText } from "@/lib/imports/source-band";
import { lensModelIds, lensModelOfAlias, lensModelOfParameters, lensModels } from "@/lib/lensing/registry";
import { scienceCaseLabels } from "@/lib/lensing/science-cases";
import { scienceCaseIds, type ScienceCaseId } from "@/lib/lensing/science-case-inputs";
import { JULIAN_YEAR_S, MILLIARCSECOND_RAD, SOLAR_RADIUS_M } from "@/lib/physics/constants";
import { QuantityError, parseDistance, parseLength, parseMass, parseProperMotion, parseVelocity } from "@/lib/physics/units";
import { wordedIssue } from "@/lib/workspace/issue-words";
import { createNoteSchema } from "@/lib/workspace/note-schema";
import { createTargetSchema, lensHypothesisErrors, sourcePhotometryErrors, type CreateTargetInput, type LensModel } from "@/lib/workspace/target-schema";
import { PLAIN_NUMBER } from "@/lib/numbers/plain-number";

/** Values used for every row where the file has no column (or an empty cell) for the field. */
export interface ImportFill {
  lensModel?: LensModel;
  priority?: number;
  sourceOffsetThetaE?: number;
}

/** One row of the preview: its cells as written, the target it becomes, or why it cannot. */
export interface PreviewRow {
  rowNumber: number;
  /** The mapped cells, trimmed, by field. */
  cells: Partial<Record<ImportField, string>>;
  /** Present exactly when `errors` is empty. */
  target?: CreateTargetInput;
  /** The notes column's text, trimmed, when the row has one: the first note of a new target. */
  note?: string;
  /** Each one names the row and the field: "row 17: Dec +95:00:00 — Declination must be in ...". */
  errors: string[];
}

export interface ImportPreview {
  rows: PreviewRow[];
  validRowCount: number;
  invalidRowCount: number;
}

// Spellings of "no value" in exported tables (common practice); such a cell is empty.
const MISSING = new Set(["", "nan", "null", "none", "--", "-", "n/a", "na"]);
const HOUR_UNITS = new Set(["h", "hr", "hour", "hours", "hourangle"]);
const DEGREE_UNITS = new Set(["deg", "degree", "degrees", "°"]);
// A magnitude without a named system (VOUnit "mag"): the band's own system, as the target keeps it.
const MAGNITUDE_UNITS = new Set(["mag", "mags", "magnitude", "magnitudes"]);

class CellError extends Error {}

/** How a row names its model without the column: "a lens mass for a point mass or a velocity dispersion for a singular isothermal sphere". */
const modelByParameterText = lensModels.map((m) => `${m.parameters.map((p) => `a ${p.label.toLowerCase()}`).join(" and ")} for a ${m.label.toLowerCase()}`).join(" or ");

/** The science cases as a refused cell lists them: "photometric-microlensing (Photometric microlensing event), …". */
const scienceCaseChoicesText = scienceCaseIds.map((id) => `${id} (${scienceCaseLabels[id]})`).join(", ");

/** A science case written as its id or its label, in any case ("Time-delay monitoring", "TIME-DELAY"). */
function scienceCaseOfText(text: string): ScienceCaseId | undefined {
  const written = text.trim().toLowerCase();
  return scienceCaseIds.find((id) => id === written || scienceCaseLabels[id].toLowerCase() === written);
}

/** A file's unit without the quotes some tables put around it; the units parser reads VOUnits ("km.s-1") itself. */
function readableUnit(unit: string): string {
  return unit.trim().replace(/^"(.*)"$/, "$1");
}

type QuantityParse = (text: string, options: { defaultUnit?: string }) => number;

// Remembered answers of `isFieldUnit`; units come from files, so the memory is bounded.
const sameAsDefaultUnit = new Map<string, boolean>();
const MAX_REMEMBERED_UNITS = 256;

/** Whether the column's unit reads as the field's own ("solMass" as "Msun"), by the one parser. */
function isFieldUnit(kind: FieldKind, parse: QuantityParse, unit: string): boolean {
  const fieldUnit = defaultUnits[kind];
  if (unit === fieldUnit) return true;
  const key = `${kind} ${unit}`;
  let isSame = sameAsDefaultUnit.get(key);
  if (isSame === undefined) {
    try {
      isSame = fieldUnit !== undefined && parse("1", { defaultUnit: unit }) === parse("1", { defaultUnit: fieldUnit });
    } catch (error) {
      if (!(error instanceof QuantityError)) throw error;
      isSame = false;
    }
    if (sameAsDefaultUnit.size >= MAX_REMEMBERED_UNITS) sameAsDefaultUnit.clear();
    sameAsDefaultUnit.set(key, isSame);
  }
  return isSame;
}

/**
 * A quantity cell in the field's unit. A bare number already in that unit (or one that reads as it,
 * "solRad" for "Rsun") is taken as written, so "5.5" mas/yr stays 5.5 rather than passing through
 * rad/s and back, and our own export re-imports to the same double.
 */
function quantity(kind: FieldKind, parse: QuantityParse, text: string, unit: string | undefined): number {
  const defaultUnit = unit === undefined ? undefined : readableUnit(unit);
  if (PLAIN_NUMBER.test(text) && defaultUnit !== undefined && isFieldUnit(kind, parse, defaultUnit)) return Number(text);
  try {
    return parse(text, { defaultUnit });
  } catch (error) {
    if (!(error instanceof QuantityError)) throw error;
    // The row message names the field and the cell; the parser's problem says what is wrong with it.
    throw new CellError(error.problem);
  }
}

/** A cell as the target schema's input wants it (coordinates stay text for the workspace parser). */
function readCell(kind: FieldKind, text: string, unit: string | undefined): unknown {
  switch (kind) {
    case "text":
    case "dec":
      return text;
    case "ra": {
      const unitName = unit === undefined ? undefined : readableUnit(unit).toLowerCase();
      if (unitName !== undefined && HOUR_UNITS.has(unitName) && PLAIN_NUMBER.test(text)) return Number(text) * 15;
      if (unitName !== undefined && !HOUR_UNITS.has(unitName) && !DEGREE_UNITS.has(unitName) && unitName !== "h:m:s") {
        throw new CellError(`has the unit ${unit}; RA is read in hours (h:m:s or h) or degrees`);
      }
      return text;
    }
    case "lensModel": {
      const model = lensModelOfAlias(text);
      if (model === undefined) throw new CellError(`is not a lens model: write ${lensModelIds.map((id) => `"${id}"`).join(" or ")}`);
      return model;
    }
    case "scienceCase": {
      const id = scienceCaseOfText(text);
      if (id === undefined) throw new CellError(`is not a science case: write one of ${scienceCaseChoicesText}, or leave the cell empty to use the inferred case`);
      return id;
    }
    case "epoch": {
      // Read by the target schema with the workspace's one reader of peak times (lib/workspace/event-peak.ts):
      // a calendar date as written, a bare number as the column's day count.
      const scale = unit === undefined ? "JD" : epochScaleOf(unit);
      if (scale === undefined) throw new CellError(`is in ${unit}; a time is read as a Julian date (unit JD, HJD, MJD or d) or as a UTC date such as 2027-06-15 04:30`);
      return scale === "MJD" && PLAIN_NUMBER.test(text) ? `MJD ${text}` : text;
    }
    case "magnitude": {
      if (unit !== undefined && !MAGNITUDE_UNITS.has(readableUnit(unit).toLowerCase())) {
        throw new CellError(`is in ${unit}; the source magnitude is a magnitude (unit mag) in its band's own system: Vega for Johnson–Cousins and 2MASS, AB for SDSS`);
      }
      // Read by the target schema with the parser's number rules, as for any number.
      return text;
    }
    case "band": {
      const id = sourceBandOfText(text);
      if (id === undefined) throw new CellError(`is not a band we know: ${sourceBandChoicesText}`);
      return id;
    }
    case "number":
    case "integer":
      // Read by the target schema with the parser's number rules (a decimal comma, thousands groups).
      return text;
    case "tags":
      return text.split(/[;,|\s]+/).filter(Boolean);
    case "mass":
      return quantity(kind, (t, o) => parseMass(t, o).massSolar, text, unit);
    case "distance":
      return quantity(kind, parseDistance, text, unit);
    case "radius":
      return quantity(kind, (t, o) => parseLength(t, o) / SOLAR_RADIUS_M, text, unit);
    case "velocity":
      return quantity(kind, parseVelocity, text, unit);
    case "properMotion":
      return quantity(kind, (t, o) => (parseProperMotion(t, o) * JULIAN_YEAR_S) / MILLIARCSECOND_RAD, text, unit);
  }
}

/**
 * Checks a mapping (proposed or chosen by the user) against the table: every required field mapped,
 * each column in range and used once. Refuses with an AppError whose `fields` name each problem.
 */
export function checkColumnMapping(table: ImportTable, mapping: ColumnMapping): void {
  const fields: FieldErrors = {};
  const add = (field: ImportField, message: string) => (fields[field] ??= []).push(message);
  const users = new Map<number, ImportField>();
  for (const field of importFields) {
    const assignment = mapping[field];
    if (assignment === undefined) {
      if (requiredImportFields.includes(field)) add(field, `Choose the column that holds the ${importFieldLabels[field]}.`);
      continue;
    }
    const { column } = assignment;
    if (!Number.isInteger(column) || column < 0 || column >= table.columns.length) {
      add(field, `${importFieldLabels[field]}: there is no column ${column + 1}.`);
      continue;
    }
    if (isComputedColumn(table.columns[column])) {
      add(field, `Column "${table.columns[column].name}" is computed from a target's inputs, not an input; it cannot fill ${importFieldLabels[field]}.`);
      continue;
    }
    const other = users.get(column);
    if (other !== undefined) add(field, `Column "${table.columns[column].name}" is already used for ${importFieldLabels[other]}.`);
    users.set(column, field);
  }
  if (Object.keys(fields).length > 0) {
    throw new AppError("bad_request:import", Object.values(fields).flat().join(" "), fields);
  }
}

/** The notes column, when chosen, is a column of the table that no field takes. */
function checkNoteColumn(table: ImportTable, mapping: ColumnMapping, noteColumn: number | null | undefined): void {
  if (noteColumn == null) return;
  const field = importFields.find((candidate) => mapping[candidate]?.column === noteColumn);
  const problem =
    noteColumn >= table.columns.length
      ? `The notes column: there is no column ${noteColumn + 1}.`
      : field !== undefined
        ? `Column "${table.columns[noteColumn].name}" is already used for ${importFieldLabels[field]}; it cannot also be the notes.`
        : undefined;
  if (problem !== undefined) throw new AppError("bad_request:import", problem, { noteColumn: [problem] });
}

/**
 * Reads every row into a target as the workspace's target schema defines it (coordinates through
 * lib/workspace/coordinates, quantities through lib/physics/units, the event peak through
 * lib/workspace/event-peak), and collects row-level errors that name the row and the field (and the
 * file's column, for a cell that cannot be read at all). The lens model, when neither a column nor
 * `fill` gives it, follows from what the row has: a mass means a point lens, a velocity dispersion
 * an isothermal sphere.
 */
export function validateImportRows(table: ImportTable, mapping: ColumnMapping, fill: ImportFill = {}, noteColumn?: number | null): ImportPreview {
  checkColumnMapping(table, mapping);
  checkNoteColumn(table, mapping, noteColumn);
  const rows = table.rows.map((row): PreviewRow => {
    const prefix = `row ${row.rowNumber}`;
    const cells: PreviewRow["cells"] = {};
    for (const field of importFields) {
      const assignment = mapping[field];
      if (assignment !== undefined) cells[field] = (row.cells[assignment.column] ?? "").trim();
    }
    if (row.cells.length !== table.columns.length) {
      return { rowNumber: row.rowNumber, cells, errors: [`${prefix}: has ${row.cells.length} fields, but the header has ${table.columns.length}.`] };
    }
    const errors: string[] = [];
    const input: Record<string, unknown> = {};
    for (const field of importFields) {
      const text = cells[field];
      if (text === undefined || MISSING.has(text.toLowerCase())) continue;
      try {
        input[field] = readCell(importFieldKinds[field], text, mapping[field]?.unit);
      } catch (error) {
        if (!(error instanceof CellError)) throw error;
        // The file's own header too, so the cell can be found in a table whose header differs from the field.
        const column = table.columns[mapping[field]!.column].name;
        errors.push(`${prefix}: ${importFieldLabels[field]} ${text} (column "${column}") ${error.message}.`);
      }
    }
    const noteText = noteColumn == null ? "" : (row.cells[noteColumn] ?? "").trim();
    const note = noteText === "" ? undefined : createNoteSchema.shape.body.safeParse(noteText);
    if (note !== undefined && !note.success) {
      errors.push(`${prefix}: Note (column "${table.columns[noteColumn!].name}") — ${note.error.issues[0].message}`);
    }
    if (errors.length > 0) return { rowNumber: row.rowNumber, cells, errors };
    const noteOf = note?.success ? { note: note.data } : {};
    for (const field of ["lensModel", "priority", "sourceOffsetThetaE"] as const) {
      if (input[field] === undefined && fill[field] !== undefined) input[field] = fill[field];
    }
    // a mass alone means a point lens, a velocity dispersion alone an isothermal sphere
    input.lensModel ??= lensModelOfParameters(input);

    const parsed = createTargetSchema.safeParse(input, { error: wordedIssue });
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const field = issue.path[0] as ImportField | undefined;
        const label = field !== undefined && field in importFieldLabels ? importFieldLabels[field] : "Target";
        const text = field !== undefined ? cells[field] : undefined;
        const missing = input[field as string] === undefined;
        errors.push(
          missing
            ? `${prefix}: ${label} is missing${field === "lensModel" ? ` (give ${modelByParameterText})` : ""}.`
            : issue.message.startsWith(`${label}:`)
              ? `${prefix}: ${issue.message}`
              : `${prefix}: ${label}${text ? ` ${text}` : ""} — ${issue.message}`,
        );
      }
      return { rowNumber: row.rowNumber, cells, errors };
    }
    for (const [field, messages] of Object.entries({ ...lensHypothesisErrors(parsed.data), ...sourcePhotometryErrors(parsed.data) })) {
      for (const message of messages) errors.push(`${prefix}: ${importFieldLabels[field as ImportField] ?? field} — ${message}`);
    }
    return errors.length > 0 ? { rowNumber: row.rowNumber, cells, errors } : { rowNumber: row.rowNumber, cells, target: parsed.data, ...noteOf, errors };
  });
  const validRowCount = rows.filter((row) => row.target !== undefined).length;
  return { rows, validRowCount, invalidRowCount: rows.length - validRowCount };
}
