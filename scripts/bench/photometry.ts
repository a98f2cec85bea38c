// Photon budget speed: S/N, exposure for the goal and saturation at every scheduled visit of a
// 1,000-target proposal (150 visits each), against the 1 s target of the photon-budget issue, with
// the one-object-per-visit version over the same visits as the baseline (it also computes each
// visit's exact brightest-pixel share, which the series skips when bounds settle the saturation
// verdict). Prints figures only; never passes or fails on timing.
import { standardBand, typicalDarkSiteConditions } from "@/lib/photometry/bands";
import { KOLMOGOROV_MOFFAT_BETA } from "@/lib/photometry/psf";
import { visitPhotometry, visitPhotometrySeries, type BandSky, type PhotometryInstrument } from "@/lib/photometry/visit-budget";
import { bestSeconds } from "../lib/bench-sky";

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
    // a source of 13–19 mag brightening by up to 2.6 mag at the middle visit: some visits saturate
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
