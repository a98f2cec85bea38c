import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { proposePhotometryMapping } from "@/lib/event-photometry/mapping";
import { readEventPhotometry, readPhotometryFile } from "@/lib/event-photometry/read-event-photometry";
import { fitPointLens } from "@/lib/lensing/fit";

/**
 * Photometry files written by astropy 5.2 from one synthetic event (tests/fixtures/generate_event_photometry.py):
 * each is read by the product's reader, mapped by the proposal (plus the time scale the user states
 * when the file does not), converted, and compared with astropy's instants and the fluxes of the
 * stated formula.
 */
const dir = "tests/fixtures/event-photometry";
interface FileTruth {
  jdUtc: number[];
  flux: number[];
  fluxErr: number[];
  dataset: string[];
}
const truth = JSON.parse(readFileSync(`${dir}/event-truth.json`, "utf8")) as { t0JdUtc: number; raDeg: number; decDeg: number; files: Record<string, FileTruth> };
const direction = { raDeg: truth.raDeg, decDeg: truth.decDeg };

function readFixture(name: string) {
  const table = readPhotometryFile(new Uint8Array(readFileSync(`${dir}/${name}`)));
  return { table, ...proposePhotometryMapping(table.columns, table.rows) };
}

/** Each point against the truth's row of the same time; worst differences printed. */
function compare(name: string, points: ReturnType<typeof readEventPhotometry>["points"]) {
  const expected = truth.files[name];
  const order = expected.jdUtc.map((_, i) => i).sort((a, b) => expected.dataset[a].localeCompare(expected.dataset[b]) || expected.jdUtc[a] - expected.jdUtc[b]);
  const got = [...points].sort((a, b) => a.dataset.localeCompare(b.dataset) || a.tDays - b.tDays);
  expect(got).toHaveLength(order.length);
  let worstTime = 0;
  let worstFlux = 0;
  got.forEach((point, k) => {
    const i = order[k];
    expect(point.dataset).toBe(expected.dataset[i]);
    worstTime = Math.max(worstTime, Math.abs(point.tDays - expected.jdUtc[i]));
    worstFlux = Math.max(worstFlux, Math.abs(point.flux / expected.flux[i] - 1), Math.abs(point.fluxErr / expected.fluxErr[i] - 1));
  });
  console.log(`${name}: worst time ${(worstTime * 86400 * 1000).toFixed(2)} ms, worst flux or error ${worstFlux.toExponential(1)} relative`);
  return { worstTime, worstFlux };
}

describe("photometry files written by astropy", () => {
  it("CSV “HJD-2450000,I,sigma”: HJD − 2450000 in I magnitudes, refused until the time scale is stated, then within 1e-6 d", () => {
    const { table, mapping, notes } = readFixture("event-hjd.csv");
    expect(mapping).toEqual({ timeColumn: 0, timeKind: "HJD", timeOffsetDays: 2_450_000, brightnessKind: "magnitude", valueColumn: 1, errorColumn: 2, band: "I" });
    expect(notes).toContain("The file does not say which time scale the times are in: say whether they are UTC, TT or TDB.");
    expect(() => readEventPhotometry(table, mapping, { direction })).toThrow("Say which time scale the times are in: UTC, TT or TDB.");
    const result = readEventPhotometry(table, { ...mapping, timeScale: "UTC" }, { direction });
    expect(result.problems).toEqual([]);
    expect(result.summary).toBe("120 points in 1 dataset (I: 120)");
    const { worstTime, worstFlux } = compare("event-hjd.csv", result.points);
    // Seven decimals of the written HJD round by ≤ 5e-8 d; the conversion adds ≤ 3e-8 d (conversions.test.ts).
    expect(worstTime).toBeLessThan(1e-7);
    expect(worstFlux).toBeLessThan(1e-12);
  });

  it("ECSV with units: BJD_TDB [d], flux and flux_err, two telescopes", () => {
    const { table, mapping } = readFixture("event-bjd.ecsv");
    expect(mapping).toEqual({ timeColumn: 0, timeKind: "BJD", timeScale: "TDB", timeOffsetDays: 0, brightnessKind: "flux", valueColumn: 1, errorColumn: 2, datasetColumn: 3 });
    const result = readEventPhotometry(table, mapping, { direction });
    expect(result.summary).toBe("48 points in 2 datasets (Site A: 24, Site B: 24)");
    const { worstTime, worstFlux } = compare("event-bjd.ecsv", result.points);
    expect(worstTime).toBeLessThan(1e-7);
    expect(worstFlux).toBe(0);
  });

  it("VOTable: MJD with time.epoch [d], V and e_V magnitudes", () => {
    const { table, mapping } = readFixture("event-mjd.vot");
    expect(mapping).toEqual({ timeColumn: 0, timeKind: "MJD", timeOffsetDays: 0, brightnessKind: "magnitude", valueColumn: 1, errorColumn: 2, band: "V" });
    const result = readEventPhotometry(table, { ...mapping, timeScale: "UTC" });
    expect(result.datasets).toEqual([{ name: "V", band: "V", pointCount: 30, wasSorted: false }]);
    const { worstTime, worstFlux } = compare("event-mjd.vot", result.points);
    expect(worstTime).toBeLessThan(1e-8);
    expect(worstFlux).toBeLessThan(1e-12);
  });

  it("the points of the CSV and the ECSV fit together: t0 within 3σ of the event's", () => {
    const csv = readFixture("event-hjd.csv");
    const ecsv = readFixture("event-bjd.ecsv");
    const points = [
      ...readEventPhotometry(csv.table, { ...csv.mapping, timeScale: "UTC" }, { direction }).points,
      ...readEventPhotometry(ecsv.table, ecsv.mapping, { direction }).points,
    ];
    const fit = fitPointLens(points);
    expect(fit.converged).toBe(true);
    const t0Sigma = Math.sqrt(fit.covariance[0][0]);
    expect(Math.abs(fit.t0Days - truth.t0JdUtc)).toBeLessThan(3 * t0Sigma);
  });
});
