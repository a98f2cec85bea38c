import { describe, expect, it } from "vitest";
import { computeResults } from "@/lib/bench/compute-results";
import { parseSketch } from "@/lib/bench/parse-sketch";
import { sketchFromSearchParams } from "@/lib/bench/sketch-state";
import { benchLink, hypothesisFromSketch } from "@/lib/workspace/bench-link";
import type { LensHypothesis } from "@/lib/workspace/target-schema";

const instrument = { resolutionMas: 60, cadenceHours: 6, campaignLengthDays: 120 };

/** Target → "Open in the lens bench" link → the bench's parse → "Save as target": the same hypothesis. */
function roundTrip(h: LensHypothesis): LensHypothesis {
  const query = new URL(benchLink(h, instrument), "http://arcwright.test").searchParams;
  const sketch = sketchFromSearchParams(Object.fromEntries(query));
  const parsed = parseSketch(sketch);
  if (!parsed.ok) throw new Error(`bench refused the link: ${JSON.stringify(parsed.fieldErrors)}`);
  const computed = computeResults(parsed.inputs);
  if (!computed.ok) throw new Error(computed.message);
  return hypothesisFromSketch(sketch, parsed.inputs, computed.results.lensPlane.betaThetaE);
}

describe("bench link and save-as-target are one mapping, read both ways", () => {
  it("a point lens with Galactic distances comes back unchanged", () => {
    const h: LensHypothesis = {
      lensModel: "point",
      lensMassSolar: 0.32,
      velocityDispersionKmPerS: null,
      lensDistancePc: 5200,
      sourceDistancePc: 8100,
      lensRedshift: null,
      sourceRedshift: null,
      sourceOffsetThetaE: 0.12,
      properMotionMasPerYr: 6.1,
    };
    expect(roundTrip(h)).toEqual(h);
  });

  it("an isothermal lens with redshifts comes back unchanged", () => {
    const h: LensHypothesis = {
      lensModel: "sis",
      lensMassSolar: null,
      velocityDispersionKmPerS: 245,
      lensDistancePc: null,
      sourceDistancePc: null,
      lensRedshift: 0.42,
      sourceRedshift: 1.85,
      sourceOffsetThetaE: 0.35,
      properMotionMasPerYr: 2,
    };
    expect(roundTrip(h)).toEqual(h);
  });
});
