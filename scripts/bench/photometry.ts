// Photon budget speed: S/N, exposure for the goal and saturation at every scheduled visit of a
// 1,000-target proposal (150 visits each), against the 1 s target of the photon-budget issue, with
// the one-object-per-visit version over the same visits as the baseline (it also computes each
// visit's exact brightest-pixel share, which the series skips when bounds settle the saturation
// verdict). Prints figures only; never passes or fails on timing.
import { standardBand, typicalDarkSiteConditions } from "@/lib/photometry/bands";
import { KOLMOGOROV_MOFFAT_BETA } from "@/lib/photometry/psf";
import { visitPhotometry, visitPhotometrySeries, type BandSky, type PhotometryInstrument } from "@/lib/photometry/visit-budget";
import { targetPhotonBudget } from "@/lib/lensing/photon-budget";
import { eventTimingOf, lensSolutionOf, orbitInputsOf, photonBudgetInputsOf, targetSchedules, type FeasibilitySettings } from "@/lib/workspace/derived";
import { photometrySettingsSchema } from "@/lib/workspace/photometry-schema";
import { instrumentSchema } from "@/lib/workspace/proposal-schema";
import type { LensHypothesis } from "@/lib/workspace/target-schema";
import { bestSeconds, fibonacciSky } from "../lib/bench-sky";

const TARGET_SECONDS = 1;
const TARGET_COUNT = 1000;
const VISITS_PER_TARGET = 150;
const band = standardBand("jc-i");
if (!band) throw new Error("the built-in I band is missing");
const site = typicalDarkSiteConditions["jc-i"];
const sky: BandSky = { band, darkSkyZenithMagPerArcsec2: site.darkSkyMagPerArcsec2, extinctionMagPerAirmass: site.extinctionMagPerAirmass, extinctionV: 0.15 };
const instrument: PhotometryInstrument = {
  optics: { apertureM: 1, centralObstructionM: 0.35, throughput: 0.45 },
  readNoiseElectrons: 5,
  darkElectronsPerSPerPixel: 0.002,
  gainElectronsPerAdu: 1.5,
  fullWellElectrons: 100_000,
  pixelScaleArcsec: 0.4,
  seeingFwhmZenithArcsec: 1,
  apertureRadiusFwhm: 1,
  psf: { kind: "moffat", beta: KOLMOGOROV_MOFFAT_BETA },
  overheadS: 60,
};

/** Plausible visit skies, the same every run: air mass 1–2.5, the Moon anywhere (up or down), any phase, a rising light curve. */
function syntheticVisits(targetIndex: number) {
  const n = VISITS_PER_TARGET;
  const visits = {
    airmass: new Float64Array(n),
    targetZenithDeg: new Float64Array(n),
    moonZenithDeg: new Float64Array(n),
    moonSeparationDeg: new Float64Array(n),
    moonPhaseAngleDeg: new Float64Array(n),
  };
  const magnitudes = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const phase = (targetIndex * 0.618 + i * 0.137) % 1;
    const z = 5 + 60 * ((i * 0.381 + targetIndex * 0.1) % 1);
    visits.targetZenithDeg[i] = z;
    visits.airmass[i] = 1 / Math.cos((z * Math.PI) / 180);
    visits.moonZenithDeg[i] = 20 + 140 * phase;
    visits.moonSeparationDeg[i] = 10 + 160 * ((i * 0.723) % 1);
    visits.moonPhaseAngleDeg[i] = 180 * ((i / n + targetIndex * 0.01) % 1);
    // a source of 13–19 mag brightening by up to 2.6 mag at the middle visit (each visit exposes until S/N 50, so none saturates)
    magnitudes[i] = 13 + 6 * ((targetIndex * 0.377) % 1) - 2.5 * Math.log10(1 + 10 * Math.exp(-(((i - n / 2) / 20) ** 2)));
  }
  return { visits, magnitudes };
}

const targets = Array.from({ length: TARGET_COUNT }, (_, t) => syntheticVisits(t));
const common = { instrument, sky, exposureS: 120, signalToNoiseGoal: 50 };

/** Visits short of the goal in the exposure, and saturated visits. */
interface Tally {
  short: number;
  saturated: number;
}

function runSeries(): Tally {
  const tally = { short: 0, saturated: 0 };
  for (const { visits, magnitudes } of targets) {
    const series = visitPhotometrySeries({ ...common, visits, magnitudes });
    for (let i = 0; i < series.signalToNoise.length; i++) {
      if (series.signalToNoise[i] < 50) tally.short += 1;
      tally.saturated += series.saturated[i];
    }
  }
  return tally;
}

function runPerVisit(): Tally {
  const tally = { short: 0, saturated: 0 };
  for (const { visits, magnitudes } of targets) {
    for (let i = 0; i < magnitudes.length; i++) {
      const visit = {
        airmass: visits.airmass[i],
        targetZenithDeg: visits.targetZenithDeg[i],
        moonZenithDeg: visits.moonZenithDeg[i],
        moonSeparationDeg: visits.moonSeparationDeg[i],
        moonPhaseAngleDeg: visits.moonPhaseAngleDeg[i],
      };
      const one = visitPhotometry({ ...common, visit, magnitude: magnitudes[i] });
      if (one.signalToNoise < 50) tally.short += 1;
      if (one.isSaturated) tally.saturated += 1;
    }
  }
  return tally;
}

// One untimed run of each warms the JIT, as a worker that has served a request before would be.
let seriesTally = runSeries();
let perVisitTally = runPerVisit();
const seriesSeconds = bestSeconds(() => {
  seriesTally = runSeries();
}, 3);
const perVisitSeconds = bestSeconds(() => {
  perVisitTally = runPerVisit();
}, 3);
const visitCount = TARGET_COUNT * VISITS_PER_TARGET;
console.log(
  `photon budget series: ${TARGET_COUNT} targets × ${VISITS_PER_TARGET} visits in ${seriesSeconds.toFixed(3)} s (best of 3), ` +
    `${Math.round(visitCount / seriesSeconds).toLocaleString("en")} visits/s; target ${TARGET_SECONDS} s; ratio ${(seriesSeconds / TARGET_SECONDS).toFixed(3)} of the target`,
);
console.log(
  `baseline, one visitPhotometry object per visit: ${perVisitSeconds.toFixed(3)} s, ${Math.round(visitCount / perVisitSeconds).toLocaleString("en")} visits/s; ` +
    `series/baseline time ratio ${(seriesSeconds / perVisitSeconds).toFixed(3)}`,
);
console.log(
  `of ${visitCount} visits, short of S/N 50 in 120 s: ${seriesTally.short} (series), ${perVisitTally.short} (per visit); ` +
    `saturated: ${seriesTally.saturated} (series), ${perVisitTally.saturated} (per visit)`,
);

// (b) The product's path over real schedules: a 1,000-target proposal's simulated schedules (183
// nights, 4 h cadence, computed once and not timed), then every target's photon budget through the
// lensing layer (`targetPhotonBudget`: which visits the case needs, each visit's magnitude along the
// event or of the fainter image, then the series), against the schedules' own time as the baseline.
const proposal: FeasibilitySettings = {
  site: { name: "Bench site (invented)", latitudeDeg: -30.2, longitudeDeg: -70.7, elevationM: 2200, horizonLimitDeg: 15 },
  instrument: instrumentSchema.parse({ resolutionMas: 800, cadenceHours: 4, campaignLengthDays: 90, visitMinutes: 20, moonMinSeparationDeg: 30 }),
  photometry: photometrySettingsSchema.parse({ apertureM: 1, centralObstructionM: 0.35, bandId: "jc-i" }),
  cycleStartDate: "2027-02-01",
  cycleEndDate: "2027-08-02",
};
const hypotheses: LensHypothesis[] = [
  // A bulge-like event peaking mid-cycle (its visits in t0 ± t_E), and a galaxy lens graded at every visit.
  { lensModel: "point", lensMassSolar: 0.4, lensDistancePc: 4000, sourceDistancePc: 8000, sourceOffsetThetaE: 0.2, properMotionMasPerYr: 4, eventPeakJdUtc: 2_461_530.5, sourceMagnitude: 19, blendFraction: 0.6 },
  { lensModel: "sis", velocityDispersionKmPerS: 250, lensRedshift: 0.4, sourceRedshift: 1.8, sourceOffsetThetaE: 0.3, scienceCase: "resolved-images", sourceMagnitude: 20 },
];
const sky1000 = fibonacciSky(TARGET_COUNT);
let scheduleList: ReturnType<typeof targetSchedules> = [];
const scheduleSeconds = bestSeconds(() => {
  scheduleList = targetSchedules(proposal, sky1000);
}, 1);
const prepared = sky1000.map((_, t) => {
  const h = hypotheses[t % hypotheses.length];
  const solved = lensSolutionOf(h)!;
  const caseId = h.lensModel === "point" ? ("photometric-microlensing" as const) : ("resolved-images" as const);
  return { caseId, solution: solved.solution, event: eventTimingOf(h, solved.solution, solved.geometry), schedule: scheduleList[t], inputs: photonBudgetInputsOf(h, proposal), orbit: orbitInputsOf(h, solved.geometry) };
});
let gradedVisits = 0;
let requestedHours = 0;
const runBudgets = () => {
  gradedVisits = 0;
  requestedHours = 0;
  for (const input of prepared) {
    const outcome = targetPhotonBudget(input);
    if (!("budget" in outcome)) continue;
    gradedVisits += outcome.budget.visitsJdUtc.length;
    requestedHours += outcome.budget.timeRequestHours;
  }
};
runBudgets();
const budgetSeconds = bestSeconds(runBudgets, 3);
const scheduledVisits = scheduleList.reduce((sum, schedule) => sum + (schedule?.visitsJdUtc.length ?? 0), 0);
console.log(
  `(b) ${TARGET_COUNT} targets' photon budgets over their schedules: ${budgetSeconds.toFixed(3)} s (best of 3) for ${gradedVisits.toLocaleString("en")} graded visits ` +
    `(of ${scheduledVisits.toLocaleString("en")} scheduled); target ${TARGET_SECONDS} s; ratio ${(budgetSeconds / TARGET_SECONDS).toFixed(3)} of the target; ${requestedHours.toFixed(0)} h requested`,
);
console.log(`    baseline, the same targets' schedules: ${scheduleSeconds.toFixed(3)} s; the budgets add ${(budgetSeconds / scheduleSeconds).toFixed(2)}x of it`);
