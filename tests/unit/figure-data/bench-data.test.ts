import { describe, expect, it } from "vitest";
import { angleInUnit } from "@/lib/bench/display-units";
import { lightCurve } from "@/lib/bench/plot-data";
import { astrometricTrackData, deflectionData, lensPlaneData, lightCurveData } from "@/lib/exports/figure-data/bench-data";
import { benchInputs, pointSourceEvent, provenance } from "./inputs";
import { columnOf, expectWellFormed } from "./well-formed";

const bench = benchInputs();
const isSeries = (series: string) => (row: unknown[]) => row[0] === series;
const relative = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe("lens-plane data", () => {
  const table = lensPlaneData({ layout: bench.results.lensPlane, unit: bench.lensPlaneUnit, provenance });
  const { layout } = { layout: bench.results.lensPlane };

  it("holds the diagram's marks: lens, ring, source and each image with its magnification", () => {
    expectWellFormed(table);
    expect(table.provenance).toBe(provenance);
    expect(columnOf(table, "object")).toEqual(["lens", "Einstein radius", "source", ...layout.images.map((_, i) => `image ${i + 1}`)]);
    expect(columnOf(table, "position_theta_e")).toEqual([0, 1, layout.betaThetaE, ...layout.images.map((image) => image.thetaThetaE)]);
    expect(columnOf(table, "magnification")).toEqual([null, null, null, ...layout.images.map((image) => image.magnification)]);
    // The diagram's axis unit: the position times θ_E in that unit, as the plot scales it.
    const thetaEInUnit = angleInUnit(layout.thetaERad, bench.lensPlaneUnit);
    expect(columnOf(table, "position")).toEqual(columnOf(table, "position_theta_e").map((theta) => (theta as number) * thetaEInUnit));
    expect(table.columns.find((column) => column.name === "position")!.voUnit).toBe({ uas: "uarcsec", mas: "mas", arcsec: "arcsec", deg: "deg" }[bench.lensPlaneUnit]);
  });

  it("places the point lens's images and magnifications as Paczyński 1986 gives them", () => {
    // θ± = (u ± √(u²+4))/2, μ± = (u²+2)/(2u√(u²+4)) ± 1/2 (Paczyński 1986, ApJ 304, 1); the demo's u = 0.3.
    const u = layout.betaThetaE;
    expect(u).toBe(0.3);
    const root = Math.sqrt(u * u + 4);
    const [plus, minus] = table.rows.slice(3);
    expect(relative(plus[1] as number, (u + root) / 2)).toBeLessThan(1e-12);
    expect(relative(minus[1] as number, (u - root) / 2)).toBeLessThan(1e-12);
    expect(relative(plus[4] as number, (u * u + 2) / (2 * u * root) + 0.5)).toBeLessThan(1e-12);
    expect(relative(minus[4] as number, -((u * u + 2) / (2 * u * root) - 0.5))).toBeLessThan(1e-12);
  });
});

describe("deflection data", () => {
  const table = deflectionData({ curves: bench.curves, provenance });

  it("holds every drawn impact parameter with the exact, weak-field and strong-field curves as drawn", () => {
    expectWellFormed(table);
    expect(columnOf(table, "b_over_m")).toEqual(bench.curves.exact.map((point) => point.x));
    expect(columnOf(table, "alpha_exact")).toEqual(bench.curves.exact.map((point) => point.y));
    for (const order of [1, 2, 3] as const) expect(columnOf(table, `alpha_weak_${order}`)).toEqual(bench.curves.weakField[order].map((point) => point.y));
    expect(columnOf(table, "alpha_strong").filter((cell) => cell !== null)).toEqual(bench.curves.strongField.map((point) => point.y));
    expect(table.title).toContain(`b_c = ${3 * Math.sqrt(3)} M`);
  });

  it("has the weak-field column 4M/b (Einstein 1916, from memory), and the exact α tends to it for large b", () => {
    for (const row of table.rows) expect(relative(row[2] as number, 4 / (row[0] as number))).toBeLessThan(1e-15);
    // At b = 1e4 M the next term, (15π/4)(M/b)², is 2.9e-4 of 4M/b (Keeton & Petters 2005).
    const [b, exact, weak] = table.rows.at(-1) as number[];
    expect(b).toBeCloseTo(1e4, 6);
    expect(relative(exact, weak)).toBeCloseTo((15 * Math.PI) / 4 / b / 4, 6);
    // The strong-deflection limit is given only near b_c (up to 3 b_c), as drawn.
    const bc = 3 * Math.sqrt(3);
    for (const row of table.rows) if (row[5] !== null) expect(row[0] as number).toBeLessThanOrEqual(3 * bc);
  });
});

describe("light-curve data", () => {
  it("holds the drawn curve and the schedule's visits, in JD UTC and days from the start and from t0", () => {
    const table = lightCurveData({ lightCurve: bench.lightCurve, event: bench.event, provenance });
    expectWellFormed(table);
    const model = isSeries("model");
    const visit = isSeries("visit");
    expect(columnOf(table, "time_from_start", model)).toEqual(bench.lightCurve.curve.map((point) => point.x));
    expect(columnOf(table, "magnification", model)).toEqual(bench.lightCurve.curve.map((point) => point.y));
    expect(columnOf(table, "magnification", visit)).toEqual(bench.lightCurve.epochs.map((point) => point.y));
    // The visit rows are the schedule's visits inside the campaign, to well under a second.
    const start = bench.event.campaignStartJdUtc!;
    const visits = Array.from(bench.schedule.visitsJdUtc).filter((jd) => jd >= start && jd <= start + 30);
    const visitJd = columnOf(table, "time_jd_utc", visit) as number[];
    expect(visitJd).toHaveLength(visits.length);
    visitJd.forEach((jd, i) => expect(Math.abs(jd - visits[i])).toBeLessThan(1e-8));
    const peakDays = bench.event.peakTimeS / 86_400;
    table.rows.forEach((row) => expect(row[3]).toBeCloseTo((row[2] as number) - peakDays, 12));
  });

  it("is Paczyński's curve for a point source, with the magnitude change −2.5 log₁₀ A", () => {
    const table = lightCurveData({ lightCurve: lightCurve(pointSourceEvent), event: pointSourceEvent, provenance });
    expectWellFormed(table);
    // A(u) = (u²+2)/(u√(u²+4)), u² = u0² + ((t − t0)/t_E)² (Paczyński 1986, ApJ 304, 1).
    for (const [, jd, fromStart, fromPeak, magnification, deltaMag] of table.rows as number[][]) {
      expect(jd).toBe(pointSourceEvent.campaignStartJdUtc! + fromStart);
      const u = Math.hypot(0.1, fromPeak / 20);
      expect(relative(magnification, (u * u + 2) / (u * Math.sqrt(u * u + 4)))).toBeLessThan(1e-12);
      expect(deltaMag).toBeCloseTo(-2.5 * Math.log10(magnification), 12);
    }
    // One epoch per cadence day without a schedule: 31 visit rows on days 0..30.
    expect(columnOf(table, "time_from_start", isSeries("visit"))).toEqual(Array.from({ length: 31 }, (_, day) => day));
  });

  it("leaves the Julian date empty when the campaign has no date", () => {
    const undated = { ...pointSourceEvent, campaignStartJdUtc: null };
    const table = lightCurveData({ lightCurve: lightCurve(undated), event: undated, provenance });
    expect(new Set(columnOf(table, "time_jd_utc"))).toEqual(new Set([null]));
  });
});

describe("astrometric-track data", () => {
  const table = astrometricTrackData({ track: bench.track, thetaERad: bench.event.thetaERad, unit: bench.shiftUnit, event: bench.event, provenance });

  it("holds the drawn track and the epochs on it, in θ_E and in the plot's unit", () => {
    expectWellFormed(table);
    const thetaEInUnit = angleInUnit(bench.event.thetaERad, bench.shiftUnit);
    expect(columnOf(table, "shift_along_theta_e", isSeries("track"))).toEqual(bench.track.track.map((point) => point.x));
    expect(columnOf(table, "shift_across_theta_e", isSeries("visit"))).toEqual(bench.track.epochs.map((point) => point.y));
    expect(columnOf(table, "shift_along", isSeries("track"))).toEqual(bench.track.track.map((point) => point.x * thetaEInUnit));
    expect(columnOf(table, "time_from_start", isSeries("visit"))).toEqual(bench.lightCurve.epochs.map((point) => point.x));
    // The track spans t0 ± 6 t_E.
    const fromPeak = columnOf(table, "time_from_peak", isSeries("track")) as number[];
    const tEDays = bench.event.einsteinTimeS / 86_400;
    expect(fromPeak[0]).toBeCloseTo(-6 * tEDays, 9);
    expect(fromPeak.at(-1)).toBeCloseTo(6 * tEDays, 9);
  });

  it("has the centroid shift u/(u²+2) θ_E along (τ, u0) (the light centroid of the two images; physics notes, after Paczyński 1986)", () => {
    const u0 = bench.event.u0ThetaE;
    const tEDays = bench.event.einsteinTimeS / 86_400;
    for (const row of table.rows) {
      const tau = (row[3] as number) / tEDays;
      const u = Math.hypot(tau, u0);
      const [along, across] = [row[6] as number, row[7] as number];
      expect(relative(Math.hypot(along, across), u / (u * u + 2))).toBeLessThan(1e-9);
      expect(across * tau).toBeCloseTo(along * u0, 12);
    }
  });
});
