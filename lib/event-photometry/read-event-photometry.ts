/**
 * A photometry file's rows as points for the light-curve fit (`fitPointLens` of lib/lensing/fit.ts):
 * each time converted to the geocentric Julian date in UTC, each magnitude to a flux, grouped by
 * dataset and sorted by time, with every refused row named and explained in the user's words.
 */
import { AppError } from "@/lib/errors";
import { dateFromJdUtc } from "@/lib/astro/time";
import type { ImportTable } from "@/lib/imports/import-table";
import { MAX_IMPORT_BYTES, MAX_IMPORT_ROWS, TooManyRowsError } from "@/lib/imports/limits";
import { formatMebibytes } from "@/lib/imports/import-table";
import { readImportFile } from "@/lib/imports/read-import-file";
import type { PhotometryPoint } from "@/lib/lensing/fit-input";
import { EARLIEST_PHOTOMETRY_JD, fullJd, jdUtcOfTime, LATEST_PHOTOMETRY_JD, type EventDirection, type EventTimeFormat } from "./event-time";
import { timeFormatLabel, type BrightnessKind, type PhotometryMapping } from "./mapping";
import { REFERENCE_MAGNITUDE } from "./reference-magnitude";
import { readPlainNumber } from "@/lib/numbers/plain-number";

export { REFERENCE_MAGNITUDE } from "./reference-magnitude";

/** Our rule: a magnitude error above 1 mag is no measurement (the flux's error would exceed 90 % of it). */
export const MAX_MAGNITUDE_ERROR = 1;

/** Our rule: a dataset needs 5 points, more than the fit's t0, u0, t_E and its own two fluxes. */
export const MIN_DATASET_POINTS = 5;

/** A refusal or a remark about the rows: the file's rows (1-based, as the preview numbers them) and column it concerns. */
export interface PhotometryProblem {
  rowNumbers: number[];
  /** The column's header as the file writes it. */
  column?: string;
  message: string;
}

export interface PhotometryDataset {
  /** The fit's dataset: the telescope or survey and the band ("Site A", "OGLE I"). */
  name: string;
  band?: string;
  pointCount: number;
  /** True when the file's rows of this dataset were not in time order (they were sorted). */
  wasSorted: boolean;
}

export interface EventPhotometry {
  /** Each point's `tDays` is the geocentric Julian date in UTC (days), as the fit's parallax option needs. */
  points: PhotometryPoint[];
  datasets: PhotometryDataset[];
  /** Row refusals, datasets too small, and the datasets sorted. */
  problems: PhotometryProblem[];
  /** Every refused row's number, ascending. */
  refusedRowNumbers: number[];
  /** "812 points in 2 datasets (OGLE I: 640, Site A V: 172); 3 rows refused". */
  summary: string;
}

export interface ReadPhotometryOptions {
  /** Where the event is (ICRS, degrees): needed for an HJD or BJD. */
  direction?: EventDirection;
  /** The dataset's name when no column gives one (e.g. the file's name). */
  datasetName?: string;
}

const importError = (message: string) => new AppError("bad_request:import", message);

/**
 * Reads an uploaded photometry file (CSV, ECSV or VOTable) with the product's one reader, refusing a
 * file above MAX_IMPORT_BYTES before decoding it, in photometry's words. The reader stops after
 * MAX_IMPORT_ROWS + 1 rows (10,000: a season of a dense survey for one event is a few thousand;
 * bin or split a longer one), so a file of 10⁶ rows is refused without reading all of it.
 */
export function readPhotometryFile(bytes: Uint8Array): ImportTable {
  if (bytes.length > MAX_IMPORT_BYTES) {
    throw new AppError("payload_too_large:import", `The photometry file is larger than ${formatMebibytes(MAX_IMPORT_BYTES)}, the limit for one upload: bin the light curve or split it by season.`);
  }
  try {
    return readImportFile(bytes);
  } catch (error) {
    if (!(error instanceof TooManyRowsError)) throw error;
    throw new AppError("bad_request:import", `The photometry file has more than ${MAX_IMPORT_ROWS.toLocaleString("en-US")} rows, the most one upload reads: bin the light curve or split it by season.`);
  }
}

/** The mapping's refusals in words: what the user must still choose. Empty when the mapping can be read. */
export function mappingProblems(table: ImportTable, mapping: PhotometryMapping, options: ReadPhotometryOptions = {}): string[] {
  const problems: string[] = [];
  const columnCount = table.columns.length;
  const isColumn = (index: number | undefined) => index !== undefined && Number.isInteger(index) && index >= 0 && index < columnCount;
  if (!isColumn(mapping.timeColumn)) problems.push("Choose the time column.");
  if (mapping.timeKind === undefined) problems.push("Say whether the times are JD, MJD, HJD or BJD.");
  if (mapping.timeKind !== undefined && mapping.timeKind !== "MJD" && mapping.timeOffsetDays === undefined) problems.push("Say which offset the times are counted from (none, 2400000, 2450000 or 2460000).");
  if (mapping.timeScale === undefined) problems.push("Say which time scale the times are in: UTC, TT or TDB.");
  if ((mapping.timeKind === "HJD" || mapping.timeKind === "BJD") && options.direction === undefined) problems.push(`An ${mapping.timeKind} needs the target's position: give the target its RA and Dec.`);
  if (mapping.brightnessKind === undefined || !isColumn(mapping.valueColumn)) problems.push("Choose the magnitude or flux column.");
  if (!isColumn(mapping.errorColumn)) problems.push(`Choose the column of the ${mapping.brightnessKind ?? "magnitude or flux"} errors.`);
  if (mapping.bandColumn !== undefined && !isColumn(mapping.bandColumn)) problems.push("Choose the band column again: the file has no such column.");
  if (mapping.datasetColumn !== undefined && !isColumn(mapping.datasetColumn)) problems.push("Choose the dataset column again: the file has no such column.");
  return problems;
}

type CellReading = { value: number } | { problem: string };

/** A cell as a plain decimal number ("8000.5", "-1.2e3"); anything else (hex, "NaN", "Infinity", a comma) is refused. */
function readNumberCell(cell: string | undefined): CellReading {
  const text = (cell ?? "").trim();
  if (text === "") return { problem: "is empty" };
  const value = readPlainNumber(text);
  return value !== undefined && Number.isFinite(value) ? { value } : { problem: `“${text.slice(0, 40)}” is not a number` };
}

/** The calendar date of a Julian date, "1953-05-04", or "far outside" for a date JavaScript cannot hold. */
const dateOf = (jd: number) => (Math.abs(jd - 2_440_587.5) < 1e8 ? dateFromJdUtc(jd).toISOString().slice(0, 10) : "far outside any calendar");

interface AcceptedRow {
  rowNumber: number;
  jdUtc: number;
  flux: number;
  fluxErr: number;
  dataset: string;
  band?: string;
}

/** Flux and its 1σ error from a magnitude and its error: F = 10^(−0.4 (m − m_ref)), σ_F = 0.4 ln 10 · F · σ_m (first-order propagation). */
export function fluxFromMagnitude(magnitude: number, magnitudeErr: number): { flux: number; fluxErr: number } {
  const flux = 10 ** (-0.4 * (magnitude - REFERENCE_MAGNITUDE));
  return { flux, fluxErr: 0.4 * Math.LN10 * flux * magnitudeErr };
}

/**
 * Reads the rows of `table` under `mapping` into fit points. Throws an AppError
 * (`bad_request:import`) when the mapping is incomplete (the first of `mappingProblems`, e.g. "Say
 * which time scale the times are in: UTC, TT or TDB.") or `payload_too_large:import` above
 * MAX_IMPORT_ROWS rows. Refuses, row by row, with the row's number and column: a cell that is empty
 * or not a number, an error ≤ 0, a magnitude error above MAX_MAGNITUDE_ERROR, a time outside
 * 1990–2100 (our rule: likely a wrong offset or format), an empty dataset cell, and both rows of a
 * time repeated within a dataset; then each dataset with fewer than MIN_DATASET_POINTS points.
 * Rows out of time order are sorted, and the result says so.
 */
export function readEventPhotometry(table: ImportTable, mapping: PhotometryMapping, options: ReadPhotometryOptions = {}): EventPhotometry {
  const refusal = mappingProblems(table, mapping, options)[0];
  if (refusal !== undefined) throw importError(refusal);
  if (table.rows.length > MAX_IMPORT_ROWS) {
    throw new AppError("payload_too_large:import", `The file has ${table.rows.length.toLocaleString("en-US")} rows; one upload takes at most ${MAX_IMPORT_ROWS.toLocaleString("en-US")}: bin the light curve or split it by season.`);
  }
  const timeColumn = mapping.timeColumn as number;
  const valueColumn = mapping.valueColumn as number;
  const errorColumn = mapping.errorColumn as number;
  const kind = mapping.brightnessKind as BrightnessKind;
  const format: EventTimeFormat = { kind: mapping.timeKind!, offsetDays: mapping.timeOffsetDays ?? 0, scale: mapping.timeScale! };
  const header = (index: number) => table.columns[index].name;
  const timeLabel = timeFormatLabel(format.kind, format.offsetDays);

  const problems: PhotometryProblem[] = [];
  const refused = new Set<number>();
  const accepted: AcceptedRow[] = [];
  for (const { rowNumber, cells } of table.rows) {
    const rowProblems: PhotometryProblem[] = [];
    const refuse = (column: number, message: string) => rowProblems.push({ rowNumbers: [rowNumber], column: header(column), message: `Row ${rowNumber}, column “${header(column)}”: ${message}.` });
    const time = readNumberCell(cells[timeColumn]);
    const value = readNumberCell(cells[valueColumn]);
    const error = readNumberCell(cells[errorColumn]);
    let jdUtc = Number.NaN;
    if ("problem" in time) refuse(timeColumn, time.problem);
    else {
      const jd = fullJd(time.value, format);
      if (!(jd >= EARLIEST_PHOTOMETRY_JD && jd < LATEST_PHOTOMETRY_JD)) {
        refuse(timeColumn, `${time.value} as ${timeLabel} is ${dateOf(jd)}, outside 1990–2100: check the time's format and offset`);
      } else jdUtc = jdUtcOfTime(time.value, format, options.direction);
    }
    if ("problem" in value) refuse(valueColumn, value.problem);
    if ("problem" in error) refuse(errorColumn, error.problem);
    else if (!(error.value > 0)) refuse(errorColumn, `the ${kind} error must be above 0 (got ${error.value})`);
    else if (kind === "magnitude" && error.value > MAX_MAGNITUDE_ERROR) refuse(errorColumn, `a magnitude error of ${error.value} is over ${MAX_MAGNITUDE_ERROR} mag, no measurement`);
    const band = mapping.bandColumn === undefined ? mapping.band : (cells[mapping.bandColumn] ?? "").trim() || undefined;
    const source = mapping.datasetColumn === undefined ? options.datasetName?.trim() : (cells[mapping.datasetColumn] ?? "").trim();
    if (mapping.datasetColumn !== undefined && source === "") refuse(mapping.datasetColumn, "the dataset is empty: name the telescope or survey");
    // Every failed reading added a row problem; the type checks narrow the readings.
    if (rowProblems.length > 0 || "problem" in value || "problem" in error) {
      problems.push(...rowProblems);
      refused.add(rowNumber);
      continue;
    }
    const dataset = [source, band].filter(Boolean).join(" ") || "photometry";
    const brightness = kind === "magnitude" ? fluxFromMagnitude(value.value, error.value) : { flux: value.value, fluxErr: error.value };
    accepted.push({ rowNumber, jdUtc, ...brightness, dataset, ...(band !== undefined ? { band } : {}) });
  }

  const groups = new Map<string, AcceptedRow[]>();
  for (const row of accepted) {
    const group = groups.get(row.dataset);
    if (group === undefined) groups.set(row.dataset, [row]);
    else group.push(row);
  }
  const datasets: PhotometryDataset[] = [];
  const points: PhotometryPoint[] = [];
  for (const [name, rows] of groups) {
    const wasSorted = rows.some((row, i) => i > 0 && row.jdUtc < rows[i - 1].jdUtc);
    if (wasSorted) {
      rows.sort((a, b) => a.jdUtc - b.jdUtc);
      problems.push({ rowNumbers: [], message: `The rows of dataset “${name}” were not in time order: they are sorted.` });
    }
    const kept = rows.filter((row, i) => {
      const twin = rows[i - 1]?.jdUtc === row.jdUtc ? rows[i - 1] : rows[i + 1]?.jdUtc === row.jdUtc ? rows[i + 1] : undefined;
      if (twin === undefined) return true;
      refused.add(row.rowNumber);
      if (twin.rowNumber > row.rowNumber) {
        const column = header(timeColumn);
        problems.push({ rowNumbers: [row.rowNumber, twin.rowNumber], column, message: `Rows ${row.rowNumber} and ${twin.rowNumber}, column “${column}”: dataset “${name}” has two points at the same time; remove one.` });
      }
      return false;
    });
    if (kept.length < MIN_DATASET_POINTS) {
      for (const row of kept) refused.add(row.rowNumber);
      problems.push({ rowNumbers: kept.map((row) => row.rowNumber), message: `Dataset “${name}” has ${kept.length} usable point${kept.length === 1 ? "" : "s"}; a dataset needs at least ${MIN_DATASET_POINTS} to be fitted, so it is left out.` });
      continue;
    }
    datasets.push({ name, ...(kept[0].band !== undefined ? { band: kept[0].band } : {}), pointCount: kept.length, wasSorted });
    for (const row of kept) points.push({ tDays: row.jdUtc, flux: row.flux, fluxErr: row.fluxErr, dataset: name });
  }
  const refusedRowNumbers = [...refused].sort((a, b) => a - b);
  return { points, datasets, problems, refusedRowNumbers, summary: summaryOf(points.length, datasets, refusedRowNumbers.length) };
}

/** "812 points in 2 datasets (OGLE I: 640, Site A: 172); 3 rows refused". */
function summaryOf(pointCount: number, datasets: readonly PhotometryDataset[], refusedCount: number): string {
  const plural = (count: number, word: string) => `${count.toLocaleString("en-US")} ${word}${count === 1 ? "" : "s"}`;
  const list = datasets.map((dataset) => `${dataset.name}: ${dataset.pointCount.toLocaleString("en-US")}`).join(", ");
  const points = pointCount === 0 ? "No points to fit" : `${plural(pointCount, "point")} in ${plural(datasets.length, "dataset")} (${list})`;
  return refusedCount === 0 ? points : `${points}; ${plural(refusedCount, "row")} refused`;
}
