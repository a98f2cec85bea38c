import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { finiteSourceMagnification } from "@/lib/lensing/finite-source";
import type { PointLensFit } from "@/lib/lensing/fit";
import { predictFromFit, type FitPrediction, type PercentileBand } from "@/lib/lensing/fit-prediction";
import { sitePeakOutlook } from "@/lib/lensing/fit-prediction-site";
import { observingSchedule, type ObservingSchedule } from "@/lib/schedule";

// A fixed fit and covariance sampled by numpy's multivariate_normal (400,000 draws, its own random
// stream), written by tests/fixtures/generate_fit_prediction.py (Debian python3-numpy, version in the file).
const fixture = JSON.parse(readFileSync(new URL("../../fixtures/lensing/fit-prediction.json", import.meta.url), "utf8")) as {
  draws: number;
  fit: { t0Days: number; u0: number; tEDays: number; datasets: { dataset: string; sourceFlux: number; blendFlux: number; zeroPointMag: number }[] };
  parameterOrder: string[];
  covariance: number[][];
  t0Days: PercentileBand;
  peakMagnification: PercentileBand;
  peakMagnitude: PercentileBand[];
  bandTimes: number[];
  bandMagnification: PercentileBand[];
  bandFlux: PercentileBand[][];
  linear: { sigmaT0Days: number; sigmaPeakMagnification: number; peakMagnification: number };
};

const fit: PointLensFit = {
  converged: true,
  reason: null,
  t0Days: fixture.fit.t0Days,
  u0: fixture.fit.u0,
  tEDays: fixture.fit.tEDays,
  datasets: fixture.fit.datasets.map((d) => ({ dataset: d.dataset, points: 100, sourceFlux: d.sourceFlux, blendFlux: d.blendFlux, chi2: 100, errorScale: 1 })),
  chi2: 193,
  dof: 193,
  parameterOrder: fixture.parameterOrder,
  covariance: fixture.covariance,
  iterations: 20,
};
const zeroPointsMag = Object.fromEntries(fixture.fit.datasets.map((d) => [d.dataset, d.zeroPointMag]));
// The band's grid from t0 − 10 d in 1 d steps holds the fixture's five band times (t0 − 10, −2, 0, +1, +15 d).
const bandOptions = { fromDays: fixture.bandTimes[0], bandDays: 25, bandStepDays: 1, zeroPointsMag };
const bandIndex = fixture.bandTimes.map((t) => Math.round(t - fixture.bandTimes[0]));

function predicted(options: Parameters<typeof predictFromFit>[1], of: PointLensFit = fit): FitPrediction {
  const outcome = predictFromFit(of, options);
  if (!outcome.ok) throw new Error(outcome.reason);
  return outcome.prediction;
}

/**
 * Monte-Carlo standard error of the 16th/50th/84th percentile of N draws, in units of the quantity's
 * spread s = (84th − 16th)/2 (as for a normal): √(p(1 − p)/N)/φ(z_p) — 1.515/√N and 1.253/√N.
 */
function percentileErrors(draws: number, spread: number): PercentileBand {
  const outer = (Math.sqrt(0.16 * 0.84) / 0.2420) * (spread / Math.sqrt(draws));
  return { low: outer, median: (Math.sqrt(0.25) / 0.3989) * (spread / Math.sqrt(draws)), high: outer };
}

/** Largest |ours − numpy| over the three percentiles, in units of our draws' Monte-Carlo error (numpy's is 20× smaller). */
function worstInErrors(ours: PercentileBand, numpy: PercentileBand, draws: number): number {
  const errors = percentileErrors(draws, (numpy.high - numpy.low) / 2);
  return Math.max(...(["low", "median", "high"] as const).map((key) => Math.abs(ours[key] - numpy[key]) / errors[key]));
}

describe("predictFromFit against numpy's multivariate_normal (generate_fit_prediction.py)", () => {
  const prediction = predicted(bandOptions);

  it("gives t0, the peak magnification and each dataset's peak magnitude within 4 Monte-Carlo errors of numpy's percentiles (1,000 draws)", () => {
    expect(prediction.draws).toBe(1000);
    expect(prediction.setAside).toBe(0);
    const worst = Math.max(
      worstInErrors(prediction.t0Days, fixture.t0Days, 1000),
      worstInErrors(prediction.peakMagnification, fixture.peakMagnification, 1000),
      ...prediction.datasets.map((d, i) => worstInErrors(d.peakMagnitude!, fixture.peakMagnitude[i], 1000)),
    );
    // Measured: worst 1.1 errors (a different random stream: the two agree only to the Monte-Carlo error).
    expect(worst).toBeLessThan(4);
  });

  it("gives the model band's magnification and each dataset's flux (median and 16/84 %) within 4 Monte-Carlo errors of numpy's at five times from t0 − 10 d to t0 + 15 d", () => {
    let worst = 0;
    fixture.bandMagnification.forEach((numpy, i) => {
      const k = bandIndex[i];
      const ours = { low: prediction.bandMagnification.low[k], median: prediction.bandMagnification.median[k], high: prediction.bandMagnification.high[k] };
      expect(prediction.bandTDays[k]).toBeCloseTo(fixture.bandTimes[i], 6);
      worst = Math.max(worst, worstInErrors(ours, numpy, 1000));
    });
    // Measured: worst 2.0 errors.
    expect(worst).toBeLessThan(4);
    let worstFlux = 0;
    prediction.datasets.forEach((d, i) => {
      fixture.bandFlux[i].forEach((numpy, j) => {
        const k = bandIndex[j];
        worstFlux = Math.max(worstFlux, worstInErrors({ low: d.bandFlux.low[k], median: d.bandFlux.median[k], high: d.bandFlux.high[k] }, numpy, 1000));
      });
    });
    expect(worstFlux).toBeLessThan(4);
  });

  it("has the 16–84 % half-width of t0 equal to the linear error √C_t0t0, and of A_peak to |dA/du0| σ_u0, to 3 % (20,000 draws)", () => {
    const many = predicted({ ...bandOptions, bandDays: 0, draws: 20_000 });
    // Linear propagation from the covariance (the fixture's values, numpy's sqrt of the same C).
    // Measured: −1.4 % for t0 (the Monte-Carlo error of the half-width is ~0.8 %), −0.8 % for A_peak.
    expect(Math.abs(many.t0SigmaDays / fixture.linear.sigmaT0Days - 1)).toBeLessThan(0.03);
    const peakHalfWidth = (many.peakMagnification.high - many.peakMagnification.low) / 2;
    expect(Math.abs(peakHalfWidth / fixture.linear.sigmaPeakMagnification - 1)).toBeLessThan(0.03);
    expect(Math.abs(many.peakMagnification.median / fixture.linear.peakMagnification - 1)).toBeLessThan(0.01);
  });

  it("is the same for the same seed and differs for another", () => {
    const again = predicted(bandOptions);
    expect(again.t0Days).toEqual(prediction.t0Days);
    expect(Array.from(again.bandMagnification.high)).toEqual(Array.from(prediction.bandMagnification.high));
    const other = predicted({ ...bandOptions, seed: 2 });
    expect(other.t0Days.median).not.toBe(prediction.t0Days.median);
  });

  it("has no peak magnitude for a dataset without a zero point", () => {
    const without = predicted({ ...bandOptions, zeroPointsMag: { survey: 25 } });
    expect(without.datasets[1].peakMagnitude).toBeNull();
    expect(without.datasets[0].peakMagnitude).toEqual(prediction.datasets[0].peakMagnitude);
  });
});

describe("predictFromFit with a finite source", () => {
  it("takes the peak magnification from the finite-source magnification (finite-source.ts, checked against mpmath)", () => {
    const sigma = [1e-4, 1e-6, 1e-4, 1e-7, 1e-3, 1e-3];
    const transit: PointLensFit = {
      ...fit,
      u0: 0.004,
      tEDays: 15,
      rho: 0.02,
      datasets: [fit.datasets[0]],
      parameterOrder: ["t0Days", "u0", "tEDays", "rho", "sourceFlux:survey", "blendFlux:survey"],
      covariance: sigma.map((s, k) => sigma.map((_, l) => (k === l ? s * s : 0))),
    };
    const prediction = predicted({ fromDays: fit.t0Days - 1, bandDays: 2, bandStepDays: 0.5, draws: 50, limbDarkeningU: 0.5 }, transit);
    // ρ = 0.02 caps the peak at ~100 where the point lens gives 250: the value is the limb-darkened disk's.
    expect(prediction.peakMagnification.median).toBeCloseTo(finiteSourceMagnification(0.004, 0.02, 0.5), 2);
    expect(prediction.bandMagnification.median[2]).toBeCloseTo(finiteSourceMagnification(0.004, 0.02, 0.5), 2);
  });
});

describe("predictFromFit refuses what it cannot predict from, in words", () => {
  it("a fit that did not converge, one that was cancelled, one without covariance, parallax without the event's position", () => {
    expect(predictFromFit({ ...fit, converged: false, reason: "The fit did not converge: χ² was still falling." }, bandOptions)).toEqual({
      ok: false,
      reason: "There is no prediction from a fit that did not converge. The fit did not converge: χ² was still falling.",
    });
    expect(predictFromFit({ ...fit, converged: false, cancelled: true }, bandOptions)).toEqual({ ok: false, reason: "The fit was cancelled, so there is nothing to predict from." });
    expect(predictFromFit({ ...fit, covariance: [] }, bandOptions).ok).toBe(false);
    const parallax = { ...fit, piEN: 0.1, piEE: 0.1, t0ParDays: fit.t0Days };
    expect(predictFromFit(parallax, bandOptions)).toEqual({ ok: false, reason: "The fit has parallax: give the event's position to predict its light curve." });
    expect(() => predictFromFit(fit, { ...bandOptions, draws: 5 })).toThrow("The number of draws must be a whole number from 10 to 100000 (got 5).");
  });
});

// A site at the latitude and longitude of the Chilean observatories and an event towards the
// Galactic bulge, in July 2031: the bulge is up all night there (site and target chosen for the test).
const site = { latitudeDeg: -30.17, longitudeEastDeg: -70.8, elevationM: 2200, horizonLimitDeg: 0 };
const target = { raDeg: 270.9, decDeg: -30 };
const conditions = { site, cycleStartNightIso: "2031-07-08", cycleEndNightIso: "2031-07-21", cadenceHours: 1, visitMinutes: 10 };
const schedule = observingSchedule({ ...conditions, target });
const cloudy = observingSchedule({ ...conditions, target, clearNightFraction: 0.5, limits: { airmassLimit: 1.3 } });
const peakAt = (jdUtc: number, sigmaDays: number) => ({ t0Days: { low: jdUtc - sigmaDays, median: jdUtc, high: jdUtc + sigmaDays }, t0SigmaDays: sigmaDays });
const clock = (jdUtc: number) => new Date(Math.round((jdUtc - 2440587.5) * 86_400_000)).toISOString().slice(11, 16);
const visitsWithin = (s: ObservingSchedule, centre: number, sigma: number) => Array.from(s.visitsJdUtc).filter((v) => v >= centre - sigma && v < centre + sigma);

describe("sitePeakOutlook: the predicted peak against the simulated schedule (lib/schedule)", () => {
  it("writes the issue's sentence for a peak in a window, with the air mass the schedule gives its visit there", () => {
    // The middle of a planned visit near 2031-07-14 03:10 UTC: the air mass must be that visit's own (visit-sky.ts).
    const i = Array.from(schedule.visitsJdUtc).findIndex((v) => v > fixture.fit.t0Days - 0.03);
    const peak = schedule.visitsJdUtc[i] + schedule.visitLengthDays / 2;
    const outlook = sitePeakOutlook({ prediction: peakAt(peak, 0.4), schedule, site, target });
    expect(outlook.where).toBe("window");
    expect(outlook.window!.startJdUtc).toBeLessThanOrEqual(peak);
    expect(outlook.window!.endJdUtc).toBeGreaterThanOrEqual(peak);
    expect(outlook.airmass).toBeCloseTo(schedule.visitSky.airmass[i], 5);
    const inSigma = visitsWithin(schedule, peak, 0.4);
    expect(Array.from(outlook.visitsInSigmaJdUtc)).toEqual(inSigma);
    expect(outlook.sentence).toBe(
      `Peak 2031-07-14 ${clock(peak)} UTC ± 0.4 d; the site observes it ${clock(outlook.window!.startJdUtc)}–${clock(outlook.window!.endJdUtc)} that night at airmass ${schedule.visitSky.airmass[i].toFixed(1)}. ${inSigma.length} visits of the schedule start within t0 ± 1σ.`,
    );
  });

  it("names daylight and gives that night's window and the air mass at its nearest instant", () => {
    const noon = fixture.fit.t0Days + 0.6; // 17:34 UTC, early afternoon at the site
    const outlook = sitePeakOutlook({ prediction: peakAt(noon, 0.1), schedule, site, target });
    expect(outlook.where).toBe("gap");
    expect(outlook.gapReason).toBe("daylight");
    expect(outlook.observedJdUtc).toBe(outlook.window!.startJdUtc);
    expect(outlook.airmass).toBeGreaterThan(1);
    expect(outlook.sentence).toMatch(
      new RegExp(`^Peak 2031-07-14 17:34 UTC ± 0\\.1 d falls in daylight \\(the Sun is above the twilight limit\\); that night the site observes the target ${clock(outlook.window!.startJdUtc)}–${clock(outlook.window!.endJdUtc)}, nearest the peak at ${clock(outlook.window!.startJdUtc)} at airmass [0-9.]+\\. 0 visits`),
    );
  });

  it("names a night lost to weather and the next window, and a peak below the airmass limit", () => {
    const weather = cloudy.gaps.find((gap) => gap.reason === "weather")!;
    const middle = (weather.startJdUtc + weather.endJdUtc) / 2;
    const lost = sitePeakOutlook({ prediction: peakAt(middle, 0.2), schedule: cloudy, site, target });
    expect(lost.gapReason).toBe("weather");
    expect(lost.window).toBeNull();
    const next = cloudy.windows.find((w) => w.startJdUtc > middle)!;
    expect(lost.nextWindow).toEqual(next);
    expect(lost.sentence).toContain(
      `falls on a night counted as lost to weather (the clear-night fraction); the site has no usable window that night, and the next usable window is ${new Date(Math.round((next.startJdUtc - 2440587.5) * 86_400_000)).toISOString().slice(0, 10)} ${clock(next.startJdUtc)}–${clock(next.endJdUtc)} UTC.`,
    );
    const below = cloudy.gaps.find((gap) => gap.reason === "below-limit" && gap.endJdUtc - gap.startJdUtc > 0.02)!;
    const low = sitePeakOutlook({ prediction: peakAt((below.startJdUtc + below.endJdUtc) / 2, 0.2), schedule: cloudy, site, target });
    expect(low.gapReason).toBe("below-limit");
    expect(low.sentence).toContain("falls while the target is below the airmass limit; ");
  });

  it("says when the peak falls outside the cycle", () => {
    const outlook = sitePeakOutlook({ prediction: peakAt(schedule.cycle.endJdUtc + 3, 0.4), schedule, site, target });
    expect(outlook.where).toBe("outside-cycle");
    expect(outlook.sentence).toMatch(/^Peak 2031-07-25 .* falls outside the cycle \(2031-07-08 .* to 2031-07-22 .*\)\. 0 visits of the schedule start within t0 ± 1σ\.$/);
  });
});
