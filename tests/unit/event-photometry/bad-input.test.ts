import { describe, expect, it } from "vitest";
import { fluxFromMagnitude, readEventPhotometry, readPhotometryFile, REFERENCE_MAGNITUDE, type ReadPhotometryOptions } from "@/lib/event-photometry/read-event-photometry";
import type { PhotometryMapping } from "@/lib/event-photometry/mapping";
import { parseCsvTable } from "@/lib/imports/csv";
import { MAX_IMPORT_ROWS } from "@/lib/imports/limits";

/** Issue 19 point 6: each bad input refused or handled with a message naming the row (1-based, as the preview numbers rows) and the column. */
const mapping: PhotometryMapping = { timeColumn: 0, timeKind: "JD", timeOffsetDays: 2_450_000, timeScale: "UTC", brightnessKind: "magnitude", valueColumn: 1, errorColumn: 2, datasetColumn: 3 };
const header = "JD-2450000,mag,magerr,telescope";
/** Five good rows of dataset A at 11200.1 … 11200.5, then `extra`. */
const read = (extra: string[], options: ReadPhotometryOptions = {}, map = mapping) => {
  const good = [1, 2, 3, 4, 5].map((i) => `11200.${i},18,0.01,A`);
  return readEventPhotometry(parseCsvTable([header, ...good, ...extra].join("\n")), map, options);
};
const messages = (result: ReturnType<typeof read>) => result.problems.map((problem) => problem.message);

describe("bad photometry", () => {
  it("refuses a cell that is not a number, naming row and column", () => {
    const result = read(["11201.1,abc,0.01,A", "NaN,18,0.01,A", "11201.3,18,,A", "0x10,18,0.01,A"]);
    expect(messages(result)).toEqual([
      "Row 6, column “mag”: “abc” is not a number.",
      "Row 7, column “JD-2450000”: “NaN” is not a number.",
      "Row 8, column “magerr”: is empty.",
      "Row 9, column “JD-2450000”: “0x10” is not a number.",
    ]);
    expect(result.refusedRowNumbers).toEqual([6, 7, 8, 9]);
    expect(result.summary).toBe("5 points in 1 dataset (A: 5); 4 rows refused");
  });

  it("refuses zero and negative errors and a magnitude error over 1 mag (our rule)", () => {
    expect(messages(read(["11201.1,18,0,A", "11201.2,18,-0.02,A", "11201.3,18,1.5,A"]))).toEqual([
      "Row 6, column “magerr”: the magnitude error must be above 0 (got 0).",
      "Row 7, column “magerr”: the magnitude error must be above 0 (got -0.02).",
      "Row 8, column “magerr”: a magnitude error of 1.5 is over 1 mag, no measurement.",
    ]);
  });

  it("refuses both rows of a time repeated within a dataset, and keeps a repeat in another dataset", () => {
    const result = read(["11200.6,18,0.01,A", "11200.6,18.5,0.01,A", "11200.7,18,0.01,A", ...[1, 2, 3, 4, 5].map((i) => `11200.${i},17,0.02,B`)]);
    expect(messages(result)).toEqual(["Rows 6 and 7, column “JD-2450000”: dataset “A” has two points at the same time; remove one."]);
    expect(result.problems[0].rowNumbers).toEqual([6, 7]);
    expect(result.refusedRowNumbers).toEqual([6, 7]);
    expect(result.datasets.map((d) => [d.name, d.pointCount])).toEqual([["A", 6], ["B", 5]]);
  });

  it("sorts rows out of time order and says so", () => {
    const result = read(["11199.9,18,0.01,A"]);
    expect(result.datasets[0]).toMatchObject({ name: "A", pointCount: 6, wasSorted: true });
    expect(result.points[0].tDays).toBeCloseTo(2_461_199.9, 9);
    expect(messages(result)).toEqual(["The rows of dataset “A” were not in time order: they are sorted."]);
    expect(result.refusedRowNumbers).toEqual([]);
  });

  it("refuses a time outside 1990–2100 (our rule), naming its date", () => {
    expect(messages(read(["2461201.1,18,0.01,A", "-5000,18,0.01,A"]))).toEqual([
      "Row 6, column “JD-2450000”: 2461201.1 as JD − 2450000 is 8734-04-24, outside 1990–2100: check the time's format and offset.",
      "Row 7, column “JD-2450000”: -5000 as JD − 2450000 is 1982-01-30, outside 1990–2100: check the time's format and offset.",
    ]);
  });

  it("leaves out a dataset of fewer than 5 points and names its rows", () => {
    const result = read(["11201.1,17,0.02,B", "11201.2,17,0.02,B"]);
    expect(result.problems).toEqual([{ rowNumbers: [6, 7], message: "Dataset “B” has 2 usable points; a dataset needs at least 5 to be fitted, so it is left out." }]);
    expect(result.summary).toBe("5 points in 1 dataset (A: 5); 2 rows refused");
  });

  it("refuses an empty dataset cell", () => {
    expect(messages(read(["11201.1,17,0.02,"]))).toEqual(["Row 6, column “telescope”: the dataset is empty: name the telescope or survey."]);
  });

  it("refuses a mapping without a time scale, and an HJD without the target's position", () => {
    expect(() => read([], {}, { ...mapping, timeScale: undefined })).toThrow("Say which time scale the times are in: UTC, TT or TDB.");
    expect(() => read([], {}, { ...mapping, timeKind: "HJD" })).toThrow("An HJD needs the target's position: give the target its RA and Dec.");
  });

  it("turns magnitudes into fluxes of a 22 mag source: F = 10^(−0.4 (m − 22)), σ_F = 0.4 ln 10 F σ_m", () => {
    expect(REFERENCE_MAGNITUDE).toBe(22);
    expect(fluxFromMagnitude(22, 0.1)).toEqual({ flux: 1, fluxErr: 0.4 * Math.log(10) * 0.1 });
    const { flux, fluxErr } = fluxFromMagnitude(17, 0.02);
    expect(flux).toBeCloseTo(100, 10); // 5 mag brighter is 100 times the flux (Pogson 1856).
    expect(fluxErr / flux).toBeCloseTo(0.0184206807, 9); // 0.4 ln 10 × 0.02
    // Fluxes with errors are taken as given, negative fluxes of difference imaging included.
    const table = parseCsvTable(["JD,flux,flux_err", ...[1, 2, 3, 4, 5].map((i) => `2461200.${i},${i - 3},0.5`)].join("\n"));
    const result = readEventPhotometry(table, { timeColumn: 0, timeKind: "JD", timeOffsetDays: 0, timeScale: "TT", brightnessKind: "flux", valueColumn: 1, errorColumn: 2 }, { datasetName: "KMT" });
    expect(result.points.map((p) => [p.flux, p.fluxErr, p.dataset])).toEqual([[-2, 0.5, "KMT"], [-1, 0.5, "KMT"], [0, 0.5, "KMT"], [1, 0.5, "KMT"], [2, 0.5, "KMT"]]);
  });

  it("refuses 10⁶ rows early, without reading them all (time and memory printed, not asserted)", () => {
    const row = "11200.12345,18.123,0.012\n";
    const big = new TextEncoder().encode(`HJD-2450000,I,sigma\n${row.repeat(1_000_000)}`);
    const heapBefore = process.memoryUsage().heapUsed;
    let start = performance.now();
    expect(() => readPhotometryFile(big)).toThrow("The photometry file is larger than 5 MB, the limit for one upload: bin the light curve or split it by season.");
    const sizeMs = performance.now() - start;
    // 10⁶ one-column rows fit under 5 MiB: the reader stops after MAX_IMPORT_ROWS + 1 of them.
    const narrow = new TextEncoder().encode(`t\n${"1\n".repeat(1_000_000)}`);
    start = performance.now();
    expect(() => readPhotometryFile(narrow)).toThrow(`The photometry file has more than ${MAX_IMPORT_ROWS.toLocaleString("en-US")} rows, the most one upload reads: bin the light curve or split it by season.`);
    const rowsMs = performance.now() - start;
    const heapMb = (process.memoryUsage().heapUsed - heapBefore) / 2 ** 20;
    console.log(`10⁶ rows: ${(big.length / 2 ** 20).toFixed(1)} MiB refused by size in ${sizeMs.toFixed(2)} ms; ${(narrow.length / 2 ** 20).toFixed(1)} MiB refused by row count in ${rowsMs.toFixed(1)} ms; heap +${heapMb.toFixed(1)} MiB`);
  });
});
