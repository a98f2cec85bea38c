import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { finiteSourceMagnification } from "@/lib/lensing/finite-source";
import { fitPointLens, FitInputError, MAX_FIT_ROWS, type PhotometryPoint, type PointLensFit } from "@/lib/lensing/fit";
import { projectedSunAu } from "@/lib/lensing/fit-parallax";

// Synthetic events and scipy.optimize.least_squares (MINPACK LM) fits of them, written by
// tests/fixtures/generate_point_lens_fits.py (Debian python3-numpy / python3-scipy, versions in the file).
interface ScipyEvent {
  truth: { t0Days: number; u0: number; tEDays: number; sourceFlux: number[]; blendFlux: number[] };
  points: { tDays: number[]; flux: number[]; fluxErr: number[]; dataset: string[] };
  scipy: { parameters: number[]; covariance: number[][]; chi2: number };
}
interface Draw {
  truth: ScipyEvent["truth"];
  flux: number[];
  scipy: { parameters: number[]; errors: number[]; chi2: number };
}
interface ParallaxEvent extends ScipyEvent {
  event: { raDeg: number; decDeg: number };
  t0ParDays: number;
  projectedSun: { jd: number[]; northAu: number[]; eastAu: number[] };
  scipy: ScipyEvent["scipy"] & { otherSignChi2: number };
}
const fixture = JSON.parse(readFileSync(new URL("../../fixtures/lensing/point-lens-fits.json", import.meta.url), "utf8")) as {
  events: ScipyEvent[];
  parallax: ParallaxEvent;
  draws: { tDays: number[]; dataset: string[]; fluxErr: number[]; draws: Draw[] };
};

function parametersOf(fit: PointLensFit): number[] {
  return [fit.t0Days, fit.u0, fit.tEDays, ...fit.datasets.flatMap((d) => [d.sourceFlux, d.blendFlux])];
}

function truthOf(truth: ScipyEvent["truth"]): number[] {
  return [truth.t0Days, truth.u0, truth.tEDays, truth.sourceFlux[0], truth.blendFlux[0], truth.sourceFlux[1], truth.blendFlux[1]];
}

function pointsOf(event: ScipyEvent): PhotometryPoint[] {
  return event.points.tDays.map((t, i) => ({ tDays: t, flux: event.points.flux[i], fluxErr: event.points.fluxErr[i], dataset: event.points.dataset[i] }));
}

function drawPoints(draw: Draw): PhotometryPoint[] {
  const { tDays, dataset, fluxErr } = fixture.draws;
  return tDays.map((t, i) => ({ tDays: t, flux: draw.flux[i], fluxErr: fluxErr[dataset[i] === "survey" ? 0 : 1], dataset: dataset[i] }));
}

const drawFits = fixture.draws.draws.map((draw) => fitPointLens(drawPoints(draw)));

describe("fitPointLens against scipy.optimize.least_squares (generate_point_lens_fits.py)", () => {
  it("finds scipy's best fit, χ² and covariance on three two-dataset events to 1e-4 σ", () => {
    let worstParameter = 0;
    let worstCovariance = 0;
    for (const event of fixture.events) {
      const points = pointsOf(event);
      const fit = fitPointLens(points);
      expect(fit.converged).toBe(true);
      expect(fit.parameterOrder).toEqual(["t0Days", "u0", "tEDays", "sourceFlux:survey", "blendFlux:survey", "sourceFlux:follow-up", "blendFlux:follow-up"]);
      expect(fit.dof).toBe(points.length - 7);
      expect(fit.chi2).toBeCloseTo(event.scipy.chi2, 6);
      const sigma = event.scipy.parameters.map((_, k) => Math.sqrt(event.scipy.covariance[k][k]));
      parametersOf(fit).forEach((value, k) => {
        worstParameter = Math.max(worstParameter, Math.abs(value - event.scipy.parameters[k]) / sigma[k]);
      });
      for (let a = 0; a < 7; a++) {
        for (let b = 0; b < 7; b++) {
          worstCovariance = Math.max(worstCovariance, Math.abs(fit.covariance[a][b] - event.scipy.covariance[a][b]) / (sigma[a] * sigma[b]));
        }
      }
    }
    // Measured: worst 1e-8 σ in the parameters, 1e-8 of σ_a σ_b in the covariance.
    expect(worstParameter).toBeLessThan(1e-4);
    expect(worstCovariance).toBeLessThan(1e-4);
  });

  it("finds scipy's best fit and standard errors on all 200 draws to 1e-4 σ", () => {
    let worstParameter = 0;
    let worstError = 0;
    fixture.draws.draws.forEach((draw, index) => {
      const fit = drawFits[index];
      expect(fit.converged).toBe(true);
      parametersOf(fit).forEach((value, k) => {
        worstParameter = Math.max(worstParameter, Math.abs(value - draw.scipy.parameters[k]) / draw.scipy.errors[k]);
        worstError = Math.max(worstError, Math.abs(Math.sqrt(fit.covariance[k][k]) / draw.scipy.errors[k] - 1));
      });
    });
    // Measured: worst 5e-7 σ and 7e-8 relative.
    expect(worstParameter).toBeLessThan(1e-4);
    expect(worstError).toBeLessThan(1e-4);
  });
});

describe("fitPointLens with annual parallax against astropy and scipy (generate_point_lens_fits.py)", () => {
  const event = fixture.parallax;

  it("projects the Sun as astropy's built-in ephemeris (ERFA epv00) does, to 2e-5 au", () => {
    let worst = 0;
    event.projectedSun.jd.forEach((jd, i) => {
      const sun = projectedSunAu(jd, event.event.raDeg, event.event.decDeg);
      worst = Math.max(worst, Math.abs(sun.northAu - event.projectedSun.northAu[i]), Math.abs(sun.eastAu - event.projectedSun.eastAu[i]));
    });
    // Measured: 8e-6 au, the difference between astronomy-engine's and ERFA's Earth (a sign or axis error would be ~1 au).
    expect(worst).toBeLessThan(2e-5);
  });

  it("finds scipy's best fit of both signs of u0 (Gould 2004 eq. 5), within what the two ephemerides allow", () => {
    const fit = fitPointLens(pointsOf(event), { parallax: { ...event.event, t0ParDays: event.t0ParDays } });
    expect(fit.converged).toBe(true);
    expect(fit.t0ParDays).toBe(event.t0ParDays);
    expect(fit.parameterOrder.slice(0, 5)).toEqual(["t0Days", "u0", "tEDays", "piEN", "piEE"]);
    // The lower of the two minima (scipy's other sign: χ² higher by ~0.5) — the sign of u0 is negative.
    expect(fit.u0).toBeLessThan(0);
    expect(fit.chi2).toBeLessThan(event.scipy.otherSignChi2);
    const parameters = [fit.t0Days, fit.u0, fit.tEDays, fit.piEN ?? Number.NaN, fit.piEE ?? Number.NaN, ...fit.datasets.flatMap((d) => [d.sourceFlux, d.blendFlux])];
    const sigma = event.scipy.parameters.map((_, k) => Math.sqrt(event.scipy.covariance[k][k]));
    let worstParameter = 0;
    let worstCovariance = 0;
    parameters.forEach((value, k) => {
      worstParameter = Math.max(worstParameter, Math.abs(value - event.scipy.parameters[k]) / sigma[k]);
      parameters.forEach((_, l) => {
        worstCovariance = Math.max(worstCovariance, Math.abs(fit.covariance[k][l] - event.scipy.covariance[k][l]) / (sigma[k] * sigma[l]));
      });
    });
    // Measured: 1.6e-2 σ (t0) and 1.2e-4 in the covariance; the ephemerides' 8e-6 au sets it (with
    // scipy's own offsets the no-parallax fits agree to 1e-8 σ above).
    expect(worstParameter).toBeLessThan(0.05);
    expect(worstCovariance).toBeLessThan(1e-3);
  });

  it("refuses parallax for times that are not Julian dates, and a position off the sky", () => {
    const points = pointsOf(event).map((point) => ({ ...point, tDays: point.tDays - 2_400_000.5 }));
    expect(() => fitPointLens(points, { parallax: event.event })).toThrow(`Row 1: a parallax fit needs times as Julian dates between 1900 and 2100 (got ${points[0].tDays}).`);
    expect(() => fitPointLens(pointsOf(event), { parallax: { raDeg: 80, decDeg: -91 } })).toThrow("The event's declination must be −90 to +90 degrees (got -91).");
  });
});

describe("fitPointLens recovers the truth of the synthetic draws (generate_point_lens_fits.py)", () => {
  it("has every parameter within 3σ of the truth in at least 95 % of 200 draws", () => {
    const covered = new Array<number>(7).fill(0);
    fixture.draws.draws.forEach((draw, index) => {
      const fit = drawFits[index];
      const truth = truthOf(draw.truth);
      parametersOf(fit).forEach((value, k) => {
        if (Math.abs(value - truth[k]) <= 3 * Math.sqrt(fit.covariance[k][k])) covered[k] += 1;
      });
    });
    // Measured: 198 to 200 of 200 per parameter (a Gaussian expects 199.5).
    for (const count of covered) expect(count).toBeGreaterThanOrEqual(190);
  });
});

describe("fitPointLens options", () => {
  const draw = fixture.draws.draws[0];
  const understated = drawPoints(draw).map((point) => ({ ...point, fluxErr: point.dataset === "survey" ? point.fluxErr / 2 : point.fluxErr * 3 }));

  it("does not rescale the stated errors by default", () => {
    const fit = fitPointLens(understated);
    expect(fit.datasets.map((d) => d.errorScale)).toEqual([1, 1]);
    expect(fit.chi2 / fit.dof).toBeGreaterThan(2);
  });

  it("rescales each dataset's errors to χ²/dof ≈ 1 and reports the factors", () => {
    const fit = fitPointLens(understated, { rescaleErrors: true });
    expect(fit.converged).toBe(true);
    // The errors were halved and tripled: the factors undo that to within the noise of 60 and 40 points.
    expect(fit.datasets[0].errorScale).toBeGreaterThan(1.6);
    expect(fit.datasets[0].errorScale).toBeLessThan(2.5);
    expect(fit.datasets[1].errorScale).toBeGreaterThan(0.2);
    expect(fit.datasets[1].errorScale).toBeLessThan(0.45);
    expect(fit.chi2 / fit.dof).toBeCloseTo(1, 1);
  });

  it("fits the source radius of a transit event (magnification from finite-source.ts, itself checked against mpmath)", () => {
    const truth = { t0: 2461200.3, u0: 0.004, tE: 15, rho: 0.02, fs: 1000, fb: 200 };
    let state = 12345;
    const gaussian = () => {
      // Park–Miller minimal standard generator and Box–Muller: reproducible noise for this one test.
      state = (state * 16807) % 2147483647;
      const u1 = state / 2147483647;
      state = (state * 16807) % 2147483647;
      return Math.sqrt(-2 * Math.log(u1)) * Math.cos((2 * Math.PI * state) / 2147483647);
    };
    const points: PhotometryPoint[] = [];
    for (let i = 0; i < 100; i++) {
      const t = truth.t0 - 1 + (2 * i) / 99;
      const u = Math.hypot(truth.u0, (t - truth.t0) / truth.tE);
      points.push({ tDays: t, flux: truth.fs * finiteSourceMagnification(u, truth.rho) + truth.fb + 10 * gaussian(), fluxErr: 10, dataset: "follow-up" });
    }
    for (let i = 0; i < 40; i++) {
      const t = truth.t0 - 40 + (80 * i) / 39 + 0.01;
      const u = Math.hypot(truth.u0, (t - truth.t0) / truth.tE);
      points.push({ tDays: t, flux: truth.fs * finiteSourceMagnification(u, truth.rho) + truth.fb + 10 * gaussian(), fluxErr: 10, dataset: "survey" });
    }
    const fit = fitPointLens(points, { finiteSource: true });
    expect(fit.converged).toBe(true);
    expect(fit.parameterOrder.slice(0, 4)).toEqual(["t0Days", "u0", "tEDays", "rho"]);
    const rhoError = Math.sqrt(fit.covariance[3][3]);
    expect(Math.abs((fit.rho ?? 0) - truth.rho)).toBeLessThan(4 * rhoError);
    expect(Math.abs(fit.tEDays - truth.tE)).toBeLessThan(4 * Math.sqrt(fit.covariance[2][2]));
  });
});

describe("fitPointLens refuses bad photometry, naming the row or column", () => {
  const good = drawPoints(fixture.draws.draws[0]);
  const refusal = (points: PhotometryPoint[]) => {
    try {
      fitPointLens(points);
    } catch (error) {
      expect(error).toBeInstanceOf(FitInputError);
      const { message, row, column } = error as FitInputError;
      return { message, row, column };
    }
    throw new Error("the fit accepted the photometry");
  };
  const withRow = (index: number, change: Partial<PhotometryPoint>) => good.map((point, i) => (i === index ? { ...point, ...change } : point));

  it("a time, flux or error that is not a number", () => {
    expect(refusal(withRow(4, { tDays: Number.NaN }))).toEqual({ message: "Row 5: the time must be a number (got not a number).", row: 5, column: "time" });
    expect(refusal(withRow(6, { flux: Number.POSITIVE_INFINITY }))).toMatchObject({ row: 7, column: "flux" });
    expect(refusal(withRow(8, { fluxErr: Number.NaN }))).toMatchObject({ row: 9, column: "flux error" });
  });

  it("a zero or negative error", () => {
    expect(refusal(withRow(2, { fluxErr: 0 }))).toEqual({ message: "Row 3: the flux error must be above 0 (got 0).", row: 3, column: "flux error" });
    expect(refusal(withRow(3, { fluxErr: -1 })).message).toBe("Row 4: the flux error must be above 0 (got -1).");
  });

  it("unsorted or repeated times within a dataset", () => {
    expect(refusal(withRow(10, { tDays: good[9].tDays }))).toEqual({ message: `Rows 10 and 11 of dataset “survey” have the same time (${good[9].tDays}): remove the duplicate.`, row: 11, column: "time" });
    expect(refusal(withRow(10, { tDays: good[8].tDays })).message).toBe("Row 11 of dataset “survey” is earlier than row 10: sort the photometry by time.");
  });

  it("an empty dataset name, a dataset of one point, no rows, too many rows", () => {
    expect(refusal(withRow(0, { dataset: " " }))).toMatchObject({ row: 1, column: "dataset" });
    expect(refusal([...good, { tDays: 2461300, flux: 1, fluxErr: 1, dataset: "lone" }]).message).toBe("Dataset “lone” has 1 point; each dataset needs at least 2 (for its source and blend flux).");
    expect(refusal([]).message).toBe("There is no photometry to fit: add at least one dataset.");
    const many = Array.from({ length: MAX_FIT_ROWS + 1 }, (_, i) => ({ tDays: i, flux: 1, fluxErr: 1, dataset: "survey" }));
    expect(refusal(many).message).toBe("The photometry has 100,001 rows; a fit takes at most 100,000: bin or trim it first.");
  });

  it("fewer points than parameters", () => {
    const few = good.filter((point) => point.dataset === "survey").slice(0, 5);
    expect(refusal(few).message).toBe("5 points cannot fit 5 parameters: at least 6 are needed.");
  });
});

describe("fitPointLens reports a fit that does not converge", () => {
  it("a flat light curve: no event to fit, reported in words, not thrown", () => {
    const flat = Array.from({ length: 50 }, (_, i) => ({ tDays: 2461200 + i, flux: 1000 + (i % 2 === 0 ? 1 : -1), fluxErr: 2, dataset: "survey" }));
    const fit = fitPointLens(flat);
    expect(fit.converged).toBe(false);
    expect(fit.reason).toMatch(/^The fit did not converge: /);
  });
});
