import { describe, expect, it } from "vitest";
import { computeResults, type BenchResults } from "@/lib/bench/compute-results";
import { parseSketch } from "@/lib/bench/parse-sketch";
import { demoSketch, type Sketch } from "@/lib/bench/sketch-state";
import { isSolarSketch } from "@/lib/bench/solar-caution";
import { ARCSECOND_RAD, einsteinRadius, sisEinsteinRadius } from "@/lib/physics";

function resultsOf(changes: Partial<Sketch>): BenchResults {
  const parsed = parseSketch({ ...demoSketch, ...changes });
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.fieldErrors));
  const computed = computeResults(parsed.inputs);
  if (!computed.ok) throw new Error(computed.message);
  return computed.results;
}

const row = (results: BenchResults, id: string) => {
  const found = results.rows.find((candidate) => candidate.id === id);
  if (found === undefined) throw new Error(`no row ${id}`);
  return found.value;
};

describe("point-lens results", () => {
  const results = resultsOf({});

  it("shows the physics module's Einstein radius and the images it implies", () => {
    const thetaERad = einsteinRadius(0.5, 4000, 8000);
    expect(row(results, "theta-e")).toBe(thetaERad);
    // Paczyński 1986: θ± = (u ± √(u²+4))/2 θ_E, so the separation is √(u²+4) θ_E.
    expect(row(results, "separation") / thetaERad).toBeCloseTo(Math.sqrt(0.3 ** 2 + 4), 12);
    expect(row(results, "t-e") / 86_400).toBeCloseTo((thetaERad / ((6e-3 / 206_265) / (365.25 * 86_400))) / 86_400, 3);
  });

  it("shows the n = 1 relativistic ring the target page and the horizon-scale case read, just outside the limit ring θ_∞", () => {
    // Bozza 2002 (PRD 66, 103001; from memory): θ_n = θ_∞ (1 + e^((b̄ − 2nπ)/ā)) with ā = 1, b̄ = −0.4002 for
    // Schwarzschild, so the n = 1 ring lies 0.125% outside θ_∞.
    const ringRad = row(results, "photon-ring-n1") / 2;
    expect(ringRad).toBeGreaterThan(row(results, "photon-ring"));
    expect(ringRad / row(results, "photon-ring") - 1).toBeLessThan(0.003);
  });

  it("gives the event's microlens parallax π_E = π_rel/θ_E (Gould 2000, ApJ 542, 785) and largest centroid shift θ_E/√8 (Walker 1995, from memory)", () => {
    const thetaERad = einsteinRadius(0.5, 4000, 8000);
    // π_rel = 1 au (1/4 kpc − 1/8 kpc) = 0.125 mas = 0.125 / 206 264 806.2 rad.
    expect(row(results, "pi-e")).toBeCloseTo((0.125 / 206_264_806.247) / thetaERad, 9);
    expect(row(results, "max-centroid-shift")).toBeCloseTo(thetaERad / Math.sqrt(8), 20);
  });

  it("compares exact and weak-field deflection for each image ray, flagging only the relativistic one", () => {
    const flags = Object.fromEntries(results.deflections.map((deflection) => [deflection.id, deflection.isWeakFieldOff]));
    expect(flags).toEqual({ "deflection-plus": false, "deflection-minus": false, "deflection-ring": false, "deflection-rel-plus": true });
    const ring = results.deflections.find((deflection) => deflection.id === "deflection-ring");
    // The first omitted term makes 4M/b too small by (15π/16) M/b relative (Keeton & Petters 2005).
    expect(ring?.fractionalDifference).toBeCloseTo(-((15 * Math.PI) / 16) / (ring?.bOverM ?? 1), 12);
  });

  it("draws the event with the peak at its date: t0 = 2027-07-10 00:00 UTC is 99.5 d after local mean noon before the cycle's first night (2027-04-01) at 70.7° W", () => {
    // Local mean noon at longitude −70.7° is 12:00 + 70.7/15 h = 16:42:48 UTC; to 2027-07-10 00:00 UTC: 99 d 7 h 17 min 12 s.
    expect(results.event!.peakTimeS / 86_400).toBeCloseTo(99 + (7 * 3600 + 17 * 60 + 12) / 86_400, 9);
    expect(resultsOf({ cycleStart: "", cycleEnd: "" }).event!.peakTimeS / 86_400).toBe(45);
    expect(resultsOf({ mu: "" }).event).toBeUndefined();
  });

  it("is not a solar sketch, but the Sun seen from 1 au is", () => {
    const demo = parseSketch(demoSketch);
    const sun = parseSketch({ ...demoSketch, mass: "1 Msun", dl: "1 au" });
    expect(demo.ok && isSolarSketch(demo.inputs)).toBe(false);
    expect(sun.ok && isSolarSketch(sun.inputs)).toBe(true);
  });
});

describe("isothermal-sphere results", () => {
  it("uses the SIS Einstein radius and loses the inner image once β ≥ θ_E", () => {
    const pair = resultsOf({ lens: "sis", sigma: "220 km/s", geometry: "redshift", beta: "0.5" });
    const thetaERad = row(pair, "theta-e");
    expect(thetaERad / ARCSECOND_RAD).toBeGreaterThan(0.3);
    expect(row(pair, "separation")).toBeCloseTo(2 * thetaERad, 18);
    expect(pair.deflections).toEqual([]);
    const single = resultsOf({ lens: "sis", sigma: "220 km/s", beta: "1.5" });
    expect(single.rows.some((candidate) => candidate.id === "theta-minus")).toBe(false);
    expect(single.rows.some((candidate) => candidate.id === "time-delay")).toBe(false);
    expect(sisEinsteinRadius(220, 4000, 8000)).toBe(row(single, "theta-e"));
  });
});
