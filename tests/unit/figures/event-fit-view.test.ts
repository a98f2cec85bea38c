import { describe, expect, it } from "vitest";
import { eventFitData } from "@/lib/exports/figure-data/event-fit-data";
import { figureMarkup } from "@/lib/exports/figures/figure-markup";
import { buildProvenance } from "@/lib/exports/provenance";
import { eventFitPlot } from "@/lib/figures/event-fit-plot";
import { eventFitView } from "@/lib/figures/event-fit-view";
import { printPalette } from "@/lib/figures/plot-palette";
import { fitPointLens, type PhotometryPoint } from "@/lib/lensing/fit";
import { defaultReferenceDataset, predictionOptionsOf } from "@/lib/lensing/fit-choices";
import { predictFromFit } from "@/lib/lensing/fit-prediction";
import { applyFitRequestOf, valueWithSigma } from "@/lib/lensing/fit-report";
import { pointLensMagnification } from "@/lib/physics/point-lens";

// A noise-free event (the truth is known exactly): a survey in I over 120 days and a follow-up in V
// over the 20 days round the peak, each with its own source and blend flux on the 22 mag scale.
const truth = { t0Days: 2461235.6, u0: 0.12, tEDays: 24, survey: { source: 2, blend: 1 }, followUp: { source: 0.5, blend: 0.1 } };
const magnification = (tDays: number) => pointLensMagnification(Math.hypot(truth.u0, (tDays - truth.t0Days) / truth.tEDays));
const points: PhotometryPoint[] = [];
for (const [dataset, count, startDays, spanDays, fluxes] of [
  ["Survey", 120, -60, 120, truth.survey],
  ["Site V", 60, -10, 20, truth.followUp],
] as const) {
  for (let i = 0; i < count; i++) {
    const tDays = truth.t0Days + startDays + (spanDays * (i + 0.5)) / count;
    const flux = fluxes.source * magnification(tDays) + fluxes.blend;
    points.push({ tDays, flux, fluxErr: 0.01 * flux, dataset });
  }
}
const fit = fitPointLens(points);
const outcome = predictFromFit(fit, { ...predictionOptionsOf(points, fit, { raDeg: 268.45, decDeg: -29.19, limbDarkeningU: null }), draws: 200 });
const prediction = outcome.ok ? outcome.prediction : null;
const lastJd = Math.max(...points.map((p) => p.tDays));
// A schedule with one window before the prediction, one across its start and one inside; visits in and out.
const schedule = {
  windows: [
    { startJdUtc: lastJd - 5.2, endJdUtc: lastJd - 5 },
    { startJdUtc: lastJd - 0.1, endJdUtc: lastJd + 0.2 },
    { startJdUtc: lastJd + 3, endJdUtc: lastJd + 3.25 },
  ],
  visitsJdUtc: Float64Array.of(lastJd - 5.1, lastJd + 0.1, lastJd + 3.1, lastJd + 40),
};
const view = eventFitView({ fit, points, referenceDataset: "Survey", prediction, schedule });
/** The survey's magnitude of the truth at a time: 22 − 2.5 log10(F_s A + F_b) (Paczyński 1986's A). */
const surveyMagnitude = (tDays: number) => 22 - 2.5 * Math.log10(truth.survey.source * magnification(tDays) + truth.survey.blend);

describe("event-fit figure: what it draws (lib/figures/event-fit-view.ts)", () => {
  it("draws the reference dataset's own magnitudes and carries the other onto them through the fit, so both lie on the truth's survey-scale curve", () => {
    expect(fit.converged).toBe(true);
    const [survey, site] = view.datasets;
    expect(survey.name).toBe("Survey");
    survey.magnitude.forEach((m, k) => expect(m).toBeCloseTo(22 - 2.5 * Math.log10(survey.flux[k]), 12));
    // The follow-up's points, moved to the survey's scale, sit on the survey's curve of the truth (noise-free: to 1e-6 mag).
    site.magnitude.forEach((m, k) => expect(Math.abs(m - surveyMagnitude(site.tJdUtc[k]))).toBeLessThan(1e-6));
    for (const d of view.datasets) for (const r of d.residualMag) expect(Math.abs(r)).toBeLessThan(1e-6);
    // The error scales by F_s,ref/F_s,d (here 2/0.5 = 4) and is 2.5/ln 10 of the relative flux error.
    const k = 30;
    const carried = 10 ** (-0.4 * (site.magnitude[k] - 22));
    expect(site.magnitudeError[k]).toBeCloseTo(((2.5 / Math.LN10) * 0.01 * site.flux[k] * 4) / carried, 6);
  });

  it("has a magnitude axis with the faint end first (bright up) holding every point with its error, and a time axis from the first point to the prediction's end", () => {
    const [faint, bright] = view.magnitudeDomain;
    expect(faint).toBeGreaterThan(bright);
    for (const d of view.datasets) {
      d.magnitude.forEach((m, k) => {
        expect(m + d.magnitudeError[k]).toBeLessThan(faint);
        expect(m - d.magnitudeError[k]).toBeGreaterThan(bright);
      });
    }
    expect(view.timeDomainJdUtc[0]).toBeLessThan(truth.t0Days - 60);
    expect(view.timeDomainJdUtc[1]).toBeGreaterThan(lastJd + 30);
    // The day ticks count from a midnight UTC (a Julian date ending in .5).
    expect((view.originJdUtc - 0.5) % 1).toBe(0);
    // The model curve passes through the truth's peak.
    expect(Math.min(...view.model.magnitude)).toBeCloseTo(surveyMagnitude(truth.t0Days), 5);
  });

  it("gives each dataset its own marker and colour, and draws the prediction's band from the last point for 30 days, bright end above the median above the faint end", () => {
    expect(new Set(view.datasets.map((d) => d.marker)).size).toBe(2);
    expect(new Set(view.datasets.map((d) => d.colour)).size).toBe(2);
    const band = view.prediction!;
    expect(band.fromJdUtc).toBe(lastJd);
    expect(band.toJdUtc).toBeCloseTo(lastJd + 30, 9);
    band.median.forEach((m, k) => {
      expect(band.bright[k]).toBeLessThanOrEqual(m + 1e-12);
      expect(band.faint[k]).toBeGreaterThanOrEqual(m - 1e-12);
      // The median of 200 draws: within its Monte-Carlo error of the truth.
      expect(Math.abs(m - surveyMagnitude(band.tJdUtc[k]))).toBeLessThan(2e-3);
    });
  });

  it("shades only the schedule's windows and visits within the prediction's period, clipped to it", () => {
    expect(view.windows).toEqual([
      { startJdUtc: lastJd, endJdUtc: lastJd + 0.2 },
      { startJdUtc: lastJd + 3, endJdUtc: lastJd + 3.25 },
    ]);
    expect(Array.from(view.visitsJdUtc)).toEqual([lastJd + 0.1, lastJd + 3.1]);
    expect(eventFitView({ fit, points, referenceDataset: "Survey", prediction: null, schedule }).windows).toEqual([]);
  });

  it("refuses a reference dataset the fit does not have", () => {
    expect(() => eventFitView({ fit, points, referenceDataset: "Nowhere", prediction, schedule: null })).toThrow(/no dataset “Nowhere”/);
  });

  it("draws in SVG with the datasets and the legend's words, and its data table holds every point and band step", () => {
    const svg = figureMarkup(eventFitPlot({ view, title: "Light curve of TB-1", width: 760, height: 460, palette: printPalette }));
    expect(svg).toContain('aria-label="Light curve of TB-1"');
    for (const words of ["Survey", "Site V", "model (on Survey)", "prediction, 68 % band", "site's usable windows (shaded)", "schedule visits (ticks at the foot)", "date (UTC)", "data − model (mag)"]) expect(svg).toContain(words);
    const provenance = buildProvenance({ subject: "test", reproduceUrl: "http://arcwright.test/", inputs: {}, exportedAt: new Date(0) });
    const table = eventFitData({ view, title: "t", provenance });
    expect(table.rows.length).toBe(points.length + view.prediction!.tJdUtc.length);
    expect(table.rows[0].slice(0, 2)).toEqual(["data", "Survey"]);
    expect(table.rows.at(-1)!.slice(0, 2)).toEqual(["prediction", "Survey"]);
  });
});

describe("the fit's reference dataset and the request that applies it", () => {
  it("picks the dataset whose band names the target's band, else the first", () => {
    const band = { id: "jc-v", label: "V (Johnson–Cousins)" };
    expect(defaultReferenceDataset([{ name: "OGLE", band: "I" }, { name: "Site", band: "V" }], band)).toBe("Site");
    expect(defaultReferenceDataset([{ name: "OGLE", band: "I" }, { name: "Site", band: "jc-v" }], band)).toBe("Site");
    expect(defaultReferenceDataset([{ name: "OGLE", band: "I" }, { name: "Site" }], band)).toBe("OGLE");
    expect(defaultReferenceDataset([{ name: "OGLE", band: "I" }], null)).toBe("OGLE");
    expect(defaultReferenceDataset([], band)).toBeNull();
  });

  it("reads the source magnitude 22 − 2.5 log10 F_s and f_s = F_s/(F_s + F_b) from the reference dataset", () => {
    const request = applyFitRequestOf(fit, "Site V", "jc-v");
    if ("refusal" in request) throw new Error(request.refusal);
    expect(request.sourceMagnitude).toBeCloseTo(22 - 2.5 * Math.log10(0.5), 6);
    expect(request.blendFraction).toBeCloseTo(0.5 / 0.6, 6);
    expect(request.t0JdUtc).toBeCloseTo(truth.t0Days, 6);
    expect(request.einsteinTimeDays).toBeCloseTo(truth.tEDays, 5);
    expect(request.sourceBand).toBe("jc-v");
    expect(request.summary.datasets).toEqual(["Survey", "Site V"]);
    expect(Object.keys(request.summary.sigmas)).toEqual(["t0Days", "u0", "tEDays"]);
    expect(applyFitRequestOf(fit, "Nowhere", null)).toEqual({ refusal: "The fit has no dataset “Nowhere”." });
  });

  it("rounds a value where its error's second significant digit falls", () => {
    expect(valueWithSigma(0.120345, 0.00213)).toBe("0.1203 ± 0.0021");
    expect(valueWithSigma(24.0213, 0.31)).toBe("24.02 ± 0.31");
    expect(valueWithSigma(24.0213, Number.NaN)).toBe("24.0213 (no error: the covariance is singular)");
  });
});
