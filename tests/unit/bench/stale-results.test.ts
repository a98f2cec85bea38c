import { describe, expect, it } from "vitest";
import { computeResults } from "@/lib/bench/compute-results";
import { parseSketch } from "@/lib/bench/parse-sketch";
import { demoSketch } from "@/lib/bench/sketch-state";
import { isStaleSketch, STALE_RESULTS_TEXT } from "@/lib/bench/stale-results";

describe("stale results", () => {
  it("marks the results stale while a field does not parse, and fresh again once it does", () => {
    const bad = parseSketch({ ...demoSketch, mass: "heavy" });
    expect(isStaleSketch(bad, undefined)).toBe(true);
    const good = parseSketch(demoSketch);
    expect(isStaleSketch(good, good.ok ? computeResults(good.inputs) : undefined)).toBe(false);
  });

  it("marks them stale when the sketch parses but does not compute, without the physics' own words", () => {
    expect(isStaleSketch(parseSketch(demoSketch), { ok: false, message: "x" })).toBe(true);
  });

  it("says plainly whose numbers are on screen", () => {
    expect(STALE_RESULTS_TEXT).toMatch(/^The results, verdicts and plots below belong to the last valid sketch/);
  });
});

describe("messages the bench shows for values the physics cannot take", () => {
  it("refuses a mass typed as 5 kpc beside the mass field, in words, not with the physics' argument names", () => {
    const parsed = parseSketch({ ...demoSketch, mass: "5 kpc" });
    if (parsed.ok) throw new Error("expected a refusal");
    expect(parsed.fieldErrors.mass).toMatch(/^Lens mass: '5 kpc' .*not a mass/);
    expect(JSON.stringify(parsed.fieldErrors)).not.toMatch(/dLensPc|massSolar|sourceAngleRad/);
  });

  it("says in plain words that a sketch cannot be computed, without the physics' own message", () => {
    const parsed = parseSketch(demoSketch);
    if (!parsed.ok) throw new Error("the demo parses");
    const computed = computeResults({ ...parsed.inputs, geometry: { ...parsed.inputs.geometry, dLensPc: -1 } });
    expect(computed.ok).toBe(false);
    expect(computed.ok || computed.message).toMatch(/^These values lie outside what the bench can compute/);
    expect(computed.ok || computed.message).not.toMatch(/dLensPc|must be a finite number/);
  });
});
