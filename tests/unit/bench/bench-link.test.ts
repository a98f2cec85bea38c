import { describe, expect, it } from "vitest";
import { parseSketch } from "@/lib/bench/parse-sketch";
import { sketchFromSearchParams } from "@/lib/bench/sketch-state";
import { benchLink, targetBodyFromSketch, type BenchTarget } from "@/lib/workspace/bench-link";
import type { FeasibilitySettings } from "@/lib/workspace/derived";
import { parseDeclinationDeg, parseRightAscensionDeg } from "@/lib/workspace/coordinates";
import { fullPointTarget, fullSisTarget, proposals } from "./proposal-fixtures";

/** Target → "Open in the lens bench" → the bench's URL state and parse. */
function openInBench(target: BenchTarget, proposal: FeasibilitySettings) {
  const url = new URL(benchLink(target, proposal), "http://arcwright.test");
  expect(url.pathname).toBe("/bench");
  const sketch = sketchFromSearchParams(Object.fromEntries(url.searchParams));
  const parsed = parseSketch(sketch);
  if (!parsed.ok) throw new Error(`the bench refused the link: ${JSON.stringify(parsed.fieldErrors)}`);
  return { sketch, inputs: parsed.inputs };
}

/** The stored inputs of a target, as "Save as target" would send them back (position read as the API reads it). */
function savedInputs(target: BenchTarget, proposal: FeasibilitySettings): BenchTarget {
  const { sketch, inputs } = openInBench(target, proposal);
  const { ra, dec, ...hypothesis } = targetBodyFromSketch(sketch, inputs);
  return { ...hypothesis, raDeg: parseRightAscensionDeg(ra), decDeg: parseDeclinationDeg(dec) };
}

describe("Open in the lens bench and Save as target are one mapping, read both ways", () => {
  it("a bulge point lens with every target field set comes back unchanged", () => {
    expect(savedInputs(fullPointTarget, proposals[0])).toEqual(fullPointTarget);
  });

  it("an isothermal lens with redshifts, ρ typed and the case inferred comes back unchanged", () => {
    expect(savedInputs(fullSisTarget, proposals[3])).toEqual(fullSisTarget);
  });

  it("a target without proper motion, peak, source size or limb darkening stays without them (no demo values filled in)", () => {
    const bare: BenchTarget = { ...fullPointTarget, properMotionMasPerYr: null, scienceCase: null, eventPeakJdUtc: null, sourceRadiusSolar: null, limbDarkeningU: null };
    expect(savedInputs(bare, proposals[1])).toEqual(bare);
  });

  it("carries every setting of each proposal the grading reads: instrument, interferometer, site, cycle and constraints", () => {
    for (const proposal of proposals) {
      const { inputs } = openInBench(fullPointTarget, proposal);
      expect(inputs.settings).toEqual(proposal);
    }
  });

  it("writes the link in the bench's typed form, with units", () => {
    const query = new URL(benchLink(fullPointTarget, proposals[3]), "http://x").searchParams;
    expect(Object.fromEntries(query)).toMatchObject({
      lens: "point",
      mass: "0.32 Msun",
      dl: "5200 pc",
      beta: "0.12",
      mu: "6.1 mas/yr",
      case: "photometric-microlensing",
      t0: "JD 2461600.1875",
      fwhm: "1000 mas",
      lambda: "1.3 mm",
      baseline: "10700 km",
      cadence: "12 h",
      campaign: "45 d",
      cycleStart: "2027-04-01",
      cycleEnd: "2027-05-15",
      radius: "compact",
    });
  });
});
