/**
 * Checks on the photometry handed to the light-curve fit, with messages in the user's words that name
 * the row (1-based, in the order given) or the column. Times in days, fluxes in any linear unit
 * common to a dataset.
 */

/** One photometric measurement: time (days, e.g. a Julian date), flux and its 1σ error (same unit), dataset name. */
export interface PhotometryPoint {
  tDays: number;
  flux: number;
  fluxErr: number;
  dataset: string;
}

/** Most rows one fit accepts (our rule: a season of a dense survey is ~10⁴ points; 10⁵ keeps a fit within seconds). */
export const MAX_FIT_ROWS = 100_000;

/** Refused photometry; `row` (1-based) or `column` names where, when one place is at fault. */
export class FitInputError extends Error {
  constructor(
    message: string,
    readonly row?: number,
    readonly column?: "time" | "flux" | "flux error" | "dataset",
  ) {
    super(message);
    this.name = "FitInputError";
  }
}

/** The photometry grouped by dataset (in order of first appearance), as typed arrays. */
export interface CheckedPhotometry {
  datasets: string[];
  tDays: Float64Array;
  flux: Float64Array;
  fluxErr: Float64Array;
  /** Index into `datasets` of each point. */
  datasetIndex: Int32Array;
  /** Number of points of each dataset. */
  counts: number[];
}

function shown(value: unknown): string {
  return typeof value === "number" ? (Number.isNaN(value) ? "not a number" : String(value)) : value === undefined ? "empty" : JSON.stringify(value);
}

/**
 * Checks `points` for a fit of `parameterCount` parameters and returns them as arrays; throws
 * `FitInputError` on: no rows, more than MAX_FIT_ROWS, a time, flux or error that is not a finite
 * number, an error ≤ 0, an empty dataset name, times that go back or repeat within a dataset (the
 * upload sorts each file; a fit does not guess which of two rows is right), a dataset with fewer
 * than 2 points (its source and blend flux) and fewer points than parameters + 1.
 */
export function checkPhotometry(points: readonly PhotometryPoint[], parameterCount: (datasetCount: number) => number): CheckedPhotometry {
  if (!Array.isArray(points) || points.length === 0) throw new FitInputError("There is no photometry to fit: add at least one dataset.");
  if (points.length > MAX_FIT_ROWS) {
    throw new FitInputError(`The photometry has ${points.length.toLocaleString("en-US")} rows; a fit takes at most ${MAX_FIT_ROWS.toLocaleString("en-US")}: bin or trim it first.`);
  }
  const n = points.length;
  const tDays = new Float64Array(n);
  const flux = new Float64Array(n);
  const fluxErr = new Float64Array(n);
  const datasetIndex = new Int32Array(n);
  const datasets: string[] = [];
  const indexOf = new Map<string, number>();
  const counts: number[] = [];
  const lastRow: number[] = [];
  for (let i = 0; i < n; i++) {
    const row = i + 1;
    const point = points[i];
    if (!Number.isFinite(point?.tDays)) throw new FitInputError(`Row ${row}: the time must be a number (got ${shown(point?.tDays)}).`, row, "time");
    if (!Number.isFinite(point.flux)) throw new FitInputError(`Row ${row}: the flux must be a number (got ${shown(point.flux)}).`, row, "flux");
    if (!Number.isFinite(point.fluxErr)) throw new FitInputError(`Row ${row}: the flux error must be a number (got ${shown(point.fluxErr)}).`, row, "flux error");
    if (!(point.fluxErr > 0)) throw new FitInputError(`Row ${row}: the flux error must be above 0 (got ${point.fluxErr}).`, row, "flux error");
    if (typeof point.dataset !== "string" || point.dataset.trim() === "") throw new FitInputError(`Row ${row}: the dataset is empty; name the telescope or survey.`, row, "dataset");
    let d = indexOf.get(point.dataset);
    if (d === undefined) {
      d = datasets.length;
      indexOf.set(point.dataset, d);
      datasets.push(point.dataset);
      counts.push(0);
      lastRow.push(-1);
    } else {
      const previous = lastRow[d];
      if (point.tDays === tDays[previous]) {
        throw new FitInputError(`Rows ${previous + 1} and ${row} of dataset “${point.dataset}” have the same time (${point.tDays}): remove the duplicate.`, row, "time");
      }
      if (point.tDays < tDays[previous]) {
        throw new FitInputError(`Row ${row} of dataset “${point.dataset}” is earlier than row ${previous + 1}: sort the photometry by time.`, row, "time");
      }
    }
    tDays[i] = point.tDays;
    flux[i] = point.flux;
    fluxErr[i] = point.fluxErr;
    datasetIndex[i] = d;
    counts[d] += 1;
    lastRow[d] = i;
  }
  counts.forEach((count, d) => {
    if (count < 2) throw new FitInputError(`Dataset “${datasets[d]}” has ${count} point; each dataset needs at least 2 (for its source and blend flux).`, undefined, "dataset");
  });
  const parameters = parameterCount(datasets.length);
  if (n <= parameters) {
    throw new FitInputError(`${n} points cannot fit ${parameters} parameters: at least ${parameters + 1} are needed.`);
  }
  return { datasets, tDays, flux, fluxErr, datasetIndex, counts };
}
