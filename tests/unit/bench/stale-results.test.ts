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
