import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { proposePhotometryMapping } from "@/lib/event-photometry/mapping";
import { mappingProblems, readEventPhotometry, readPhotometryFile } from "@/lib/event-photometry/read-event-photometry";
import { fitPointLens } from "@/lib/lensing/fit";
import { parseDeclinationDeg, parseRightAscensionDeg } from "@/lib/workspace/coordinates";

// public/demo/cinder-avocet-photometry.csv, written by scripts/demo/generate_demo_photometry.py with
// the truth t0 = 2031-06-13 10:00 UTC, u0 = 0.08, t_E = 28 d (stated there).
const bytes = readFileSync(join(process.cwd(), "public", "demo", "cinder-avocet-photometry.csv"));
const direction = { raDeg: parseRightAscensionDeg("17 52 31.8"), decDeg: parseDeclinationDeg("-29 41 07") };
const T0_TRUTH_JD_UTC = 2_463_030.916_666_7; // 2031-06-13 10:00 UTC: JD 2440587.5 + Date.UTC(2031, 5, 13, 10) / 86400000

describe("the demo event's photometry file", () => {
  const table = readPhotometryFile(bytes);
  const { mapping } = proposePhotometryMapping(table.columns, table.rows);
  const photometry = readEventPhotometry(table, mapping, { direction });

  it("is proposed whole from its header (HJD − 2450000 in UTC, magnitudes, band and telescope columns) and read without a refusal", () => {
    expect(T0_TRUTH_JD_UTC).toBeCloseTo(2_440_587.5 + Date.UTC(2031, 5, 13, 10) / 86_400_000, 6);
    expect(mapping).toEqual({ timeColumn: 0, timeKind: "HJD", timeOffsetDays: 2_450_000, timeScale: "UTC", brightnessKind: "magnitude", valueColumn: 1, errorColumn: 2, bandColumn: 3, datasetColumn: 4 });
    expect(mappingProblems(table, mapping, { direction })).toEqual([]);
    expect(photometry.summary).toBe("310 points in 2 datasets (Halcyon Survey I: 256, Mesa Lucerna V: 54)");
    // Observed until 2031-06-04, about a week before the stored peak (2031-06-11 04:00 UTC).
    expect(Math.max(...photometry.points.map((point) => point.tDays))).toBeLessThan(2_440_587.5 + Date.UTC(2031, 5, 5) / 86_400_000);
  });

  it("fits back to its truth within the fit's 3σ (the fit of lib/lensing/fit.ts, checked against scipy in its own tests)", () => {
    const fit = fitPointLens(photometry.points);
    expect(fit.converged).toBe(true);
    const sigma = (name: string) => Math.sqrt(fit.covariance[fit.parameterOrder.indexOf(name)][fit.parameterOrder.indexOf(name)]);
    expect(Math.abs(fit.t0Days - T0_TRUTH_JD_UTC)).toBeLessThan(3 * sigma("t0Days"));
    expect(Math.abs(Math.abs(fit.u0) - 0.08)).toBeLessThan(3 * sigma("u0"));
    expect(Math.abs(fit.tEDays - 28)).toBeLessThan(3 * sigma("tEDays"));
    console.log(`demo photometry fit: t0 ${(fit.t0Days - T0_TRUTH_JD_UTC).toFixed(3)} ± ${sigma("t0Days").toFixed(3)} d from the truth, u0 ${fit.u0.toFixed(4)} ± ${sigma("u0").toFixed(4)}, t_E ${fit.tEDays.toFixed(2)} ± ${sigma("tEDays").toFixed(2)} d, χ²/dof ${(fit.chi2 / fit.dof).toFixed(2)}`);
  });
});
