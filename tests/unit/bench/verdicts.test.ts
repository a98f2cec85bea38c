import { describe, expect, it } from "vitest";
import { epochsWithin, resolutionVerdict, samplingVerdict, singleImageVerdict, timeDelayVerdict } from "@/lib/bench/verdicts";
import { DAY_S, MILLIARCSECOND_RAD } from "@/lib/physics";

describe("resolution verdict", () => {
  it("calls 1.8 FWHM resolvable and says so in plain words", () => {
    expect(resolutionVerdict(90 * MILLIARCSECOND_RAD, 50 * MILLIARCSECOND_RAD, "FWHM")).toEqual({
      id: "resolution",
      outlook: "feasible",
      text: "images separated by 1.8 FWHM (90 mas): resolvable",
    });
  });

  it("is marginal from half an element and unresolved below, naming λ/B for an interferometer", () => {
    expect(resolutionVerdict(0.6 * MILLIARCSECOND_RAD, MILLIARCSECOND_RAD, "λ/B")).toMatchObject({ outlook: "marginal", text: "images separated by 0.6 λ/B (600 µas): marginal, needs a two-source fit" });
    expect(resolutionVerdict(0.4 * MILLIARCSECOND_RAD, MILLIARCSECOND_RAD, "λ/B")).toMatchObject({ outlook: "infeasible", text: "images separated by 0.4 λ/B (400 µas): unresolved, the images blend into one" });
  });
});

describe("sampling verdict", () => {
  it("counts epochs across t0 ± t_E: t_E = 12 d at a 1 d cadence is 25 epochs, well sampled", () => {
    const verdict = samplingVerdict(12 * DAY_S, DAY_S, 90 * DAY_S, 45 * DAY_S);
    expect(verdict).toEqual({ id: "sampling", outlook: "feasible", text: "t_E = 12 d sampled 25 times within t0 ± t_E at a cadence of 1 d: well sampled" });
  });

  it("is sparse below 20 epochs, undersampled below 6, and says when the peak is outside the campaign", () => {
    expect(samplingVerdict(12 * DAY_S, 2 * DAY_S, 90 * DAY_S, 45 * DAY_S)).toMatchObject({ outlook: "marginal", text: expect.stringMatching(/sampled 12 times .*: sparsely sampled$/) });
    expect(samplingVerdict(2 * DAY_S, DAY_S, 90 * DAY_S, 45 * DAY_S)).toMatchObject({ outlook: "infeasible", text: expect.stringMatching(/sampled 5 times .*: undersampled$/) });
    expect(samplingVerdict(12 * DAY_S, DAY_S, 30 * DAY_S, 45 * DAY_S).text).toMatch(/the peak falls outside the 30 d campaign$/);
    // The Sun seen from the Earth against a star at 8 kpc: t_E = θ_E/μ ≈ 6,800 yr, not sampled by 90 d.
    expect(samplingVerdict(6831 * 365.25 * DAY_S, DAY_S, 90 * DAY_S, 45 * DAY_S)).toMatchObject({
      outlook: "infeasible",
      text: expect.stringMatching(/^t_E = 6800 yr sampled 91 times .*; the 90 d campaign covers less than t_E \(under a tenth of it\), so neither the event's timescale nor its baseline can be measured$/),
    });
    // A campaign between a tenth of t_E and t_E still sees the peak and part of the wings: marginal, not hopeless.
    expect(samplingVerdict(120 * DAY_S, DAY_S, 90 * DAY_S, 45 * DAY_S)).toMatchObject({
      outlook: "marginal",
      text: expect.stringMatching(/; the 90 d campaign covers less than t_E, so the wings and the baseline fall outside it and t_E is poorly constrained$/),
    });
  });

  it("counts only epochs inside the campaign", () => {
    expect(epochsWithin(-5 * DAY_S, 5 * DAY_S, DAY_S, 90 * DAY_S)).toBe(6);
    expect(epochsWithin(85 * DAY_S, 95 * DAY_S, DAY_S, 90 * DAY_S)).toBe(6);
    expect(epochsWithin(100 * DAY_S, 110 * DAY_S, DAY_S, 90 * DAY_S)).toBe(0);
  });
});

describe("time-delay verdict", () => {
  it("calls a delay of several cadences measurable and a microsecond delay not measurable", () => {
    expect(timeDelayVerdict(12 * DAY_S, DAY_S, 300 * DAY_S)).toEqual({ id: "time-delay", outlook: "feasible", text: "time delay 12 d against a cadence of 1 d: measurable" });
    expect(timeDelayVerdict(4.9e-6, DAY_S, 90 * DAY_S)).toMatchObject({ outlook: "infeasible", text: "time delay 4.9 µs against a cadence of 1 d: shorter than the cadence, not measurable" });
    expect(timeDelayVerdict(400 * DAY_S, DAY_S, 90 * DAY_S).text).toMatch(/longer than the 90 d campaign$/);
  });

  it("says plainly that a single SIS image has nothing to resolve", () => {
    expect(singleImageVerdict().text).toBe("a single image (β ≥ θ_E): no image pair to resolve and no time delay");
  });
});
