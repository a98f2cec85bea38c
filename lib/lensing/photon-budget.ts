/**
 * A target's photon budget: the signal-to-noise of what its science case measures at each planned
 * visit, under that visit's air mass, seeing and Moon, and the hours the visits ask for. The lensing
 * layer says what is measured and how bright it is at each visit; the photometry layer
 * (lib/photometry) turns that magnitude into electrons, sky, noise and exposure time.
 *
 * What is measured, by case (our rule):
 * - the microlensing cases: the source and its blend, A(t) f_s + (1 − f_s) times the baseline flux
 *   (the standard blending model), A(t) of the source's disk along u(t)² = u0² + ((t − t0)/t_E)²;
 *   the visits the case needs are those in t0 ± t_E (the event-visits question's span). Without t0
 *   the event cannot be placed, so every planned visit is graded at the peak brightness;
 * - resolved images and time delays: the fainter primary image alone, |μ| times the source's flux
 *   (blended light is not added: the images are measured apart from the lens's light), at every
 *   planned visit;
 * - a relativistic orbit: the orbiting star itself at the source's magnitude (its light is not
 *   magnified, and other light is not added: the star is measured apart), at the visits within the
 *   next periapsis passage's window (periapsisPassage), or at every planned visit while the orbit or
 *   its periapsis time is not set;
 * - horizon-scale imaging has no budget here (an interferometer's sensitivity is not a CCD's).
 * Each visit's exposure is what reaches the S/N goal, at most the time the visit leaves after its
 * overhead; the time request sums exposure and overhead over the visits the case needs.
 */
import { DAY_S } from "@/lib/physics/constants";
import { MOONLIGHT_MODEL_MIN_SEPARATION_DEG } from "@/lib/photometry/moon-sky";
import { baselineMagnitude, magnifiedBlendMagnitude } from "@/lib/photometry/source-flux";
import {
  centroidPrecisionMas,
  visitPhotometry,
  visitPhotometrySeries,
  type BandSky,
  type PhotometryInstrument,
  type VisitPhotometry,
  type VisitPhotometrySeries,
  type VisitSkyConditions,
} from "@/lib/photometry/visit-budget";
import type { ObservingSchedule, VisitSky } from "@/lib/schedule/types";
import { eventMagnificationAtOffset } from "./microlensing";
import { periapsisPassage, relativisticOrbitOf, type PeriapsisPassage } from "./relativistic-orbit";
import { firstVisitFrom } from "./science-case-schedule";
import type { EventTiming, OrbitInputs, ScienceCaseId } from "./science-case-inputs";
import type { LensSolution } from "./solution";

/** What the proposal's photometry settings give the budget. */
export interface PhotonBudgetSetup {
  instrument: PhotometryInstrument;
  sky: BandSky;
  signalToNoiseGoal: number;
  /** Time a visit leaves for exposing: its length minus the overhead, s (> 0). */
  visitExposureS: number;
}

/** The target's source: its own magnitude in the band (unmagnified, no blend) and its share f_s of the baseline flux. */
export interface SourceBrightness {
  sourceMagnitude: number;
  blendFraction: number;
}

/** The budget's inputs, the missing one named in words, or none asked for (a lens bench without a camera). */
export type PhotonBudgetInputs = { setup: PhotonBudgetSetup; source: SourceBrightness } | { missing: string } | { notApplicable: true };

/** Which light the budget measures (see the module comment). */
export type MeasuredLight = "blended-source" | "fainter-image" | "orbiting-star";

/** The measured light in words, as the depth answer and the target page name it. */
export const measuredLightWords: Record<MeasuredLight, string> = {
  "blended-source": "the magnified source with its blend",
  "fainter-image": "the fainter image",
  "orbiting-star": "the orbiting star",
};

export interface TargetPhotonBudget {
  measured: MeasuredLight;
  bandLabel: string;
  signalToNoiseGoal: number;
  visitExposureS: number;
  overheadS: number;
  /** Start times of the visits the case needs (JD UTC), ascending, and each one's magnitude above the atmosphere. */
  visitsJdUtc: Float64Array;
  magnitudes: Float64Array;
  /** Each visit's sky (views into the schedule's arrays). */
  visitSky: VisitSky;
  /** Per visit: S/N in the whole exposure available, the exposure that reaches the goal, saturation, sky. */
  series: VisitPhotometrySeries;
  /** The visit with the lowest S/N in the time available, and the one with the brightest light; −1 without visits. */
  worstVisit: number;
  brightestVisit: number;
  /** Σ (exposure used + overhead) over the visits, h. Exposure used: the goal's, at most the time available. */
  timeRequestHours: number;
  /** Visits on which the goal is not reached in the time available. */
  shortVisits: number;
  /** Visits whose exposure saturates the brightest pixel. */
  saturatedVisits: number;
  /** Visits with the Moon up nearer than the moonlight model's fitted range (their sky is underestimated). */
  nearMoonVisits: number;
  /** Each image's magnitude from its magnification |μ| (images brightest first); empty for the microlensing cases, whose images blend. */
  imageMagnitudes: number[];
  /** Baseline (unmagnified blend) and peak at the conditions of the visit nearest the peak; null for the image cases or without visits. */
  baseline: VisitPhotometry | null;
  peak: VisitPhotometry | null;
  /** Photon-limited centroid precision at the worst visit, mas; astrometric microlensing only. */
  worstCentroidPrecisionMas: number | null;
}

/** The budget's answer: a budget, or why there is none (a missing input, a case without one). */
export type PhotonBudgetOutcome = { budget: TargetPhotonBudget } | { missing: string } | { notApplicable: true };

const NO_SCHEDULE = "Set the proposal's cycle dates to plan the visits the photon budget is computed for.";

/** Visits whose start lies in [startJdUtc, endJdUtc]: the index range [from, to). */
function visitRange(visitsJdUtc: Float64Array, startJdUtc: number, endJdUtc: number): { from: number; to: number } {
  const from = firstVisitFrom(visitsJdUtc, startJdUtc);
  let to = firstVisitFrom(visitsJdUtc, endJdUtc);
  while (to < visitsJdUtc.length && visitsJdUtc[to] <= endJdUtc) to++;
  return { from, to };
}

function skyAt(sky: VisitSky, index: number): VisitSkyConditions {
  return {
    airmass: sky.airmass[index],
    targetZenithDeg: sky.targetZenithDeg[index],
    moonZenithDeg: sky.moonZenithDeg[index],
    moonSeparationDeg: sky.moonSeparationDeg[index],
    moonPhaseAngleDeg: sky.moonPhaseAngleDeg[index],
  };
}

function slice<T extends Float32Array | Float64Array>(array: T, from: number, to: number): T {
  return array.subarray(from, to) as T;
}

/** Magnitude of the blend at each visit: the source's disk magnified along the event, or at its peak when t0 is unknown. */
function blendedMagnitudes(visitsJdUtc: Float64Array, source: SourceBrightness, event: EventTiming, einsteinTimeDays: number | null): Float64Array {
  const base = baselineMagnitude(source.sourceMagnitude, source.blendFraction);
  const u0 = event.impactParameterThetaE ?? 0;
  const magnitudes = new Float64Array(visitsJdUtc.length);
  const peakKnown = event.peakJdUtc !== null && einsteinTimeDays !== null;
  const peakMag = magnifiedBlendMagnitude(base, eventMagnificationAtOffset(u0, event), source.blendFraction);
  for (let i = 0; i < visitsJdUtc.length; i++) {
    if (!peakKnown) {
      magnitudes[i] = peakMag;
      continue;
    }
    const u = Math.hypot(u0, (visitsJdUtc[i] - event.peakJdUtc!) / einsteinTimeDays!);
    magnitudes[i] = magnifiedBlendMagnitude(base, eventMagnificationAtOffset(u, event), source.blendFraction);
  }
  return magnitudes;
}

/** The periapsis passage after the cycle's start; null while the orbit or its periapsis time is not set. */
function passageOf(orbit: OrbitInputs, cycleStartJdUtc: number): PeriapsisPassage | null {
  const outcome = relativisticOrbitOf(orbit);
  if ("missing" in outcome || orbit.periapsisJdUtc === null || !Number.isFinite(orbit.periapsisJdUtc)) return null;
  return periapsisPassage(outcome.orbit, orbit.periapsisJdUtc, cycleStartJdUtc);
}

/**
 * The photon budget of a target in `caseId` (see the module comment), or why there is none. Throws
 * only for inputs outside the photometry layer's domains, which the settings' schema keeps out.
 */
export function targetPhotonBudget(input: {
  caseId: ScienceCaseId;
  solution: LensSolution;
  event: EventTiming;
  schedule: ObservingSchedule | null;
  inputs: PhotonBudgetInputs;
  /** The orbiting star of the relativistic-orbit case (every value null for other targets). */
  orbit: OrbitInputs;
}): PhotonBudgetOutcome {
  const { caseId, solution, event, schedule } = input;
  if (caseId === "horizon-scale" || "notApplicable" in input.inputs) return { notApplicable: true };
  if ("missing" in input.inputs) return { missing: input.inputs.missing };
  const { setup, source } = input.inputs;
  if (schedule === null) return { missing: NO_SCHEDULE };
  if (event.impactParameterThetaE === 0 && (event.sourceRadiusThetaE === null || event.sourceRadiusThetaE === 0) && (caseId === "photometric-microlensing" || caseId === "astrometric-microlensing")) {
    return { missing: "Set the source's radius ρ: a point source exactly behind the lens (u0 = 0) has no finite peak brightness to budget." };
  }

  const isEvent = caseId === "photometric-microlensing" || caseId === "astrometric-microlensing";
  const isOrbit = caseId === "relativistic-orbit";
  const einsteinTimeDays = solution.einsteinTimeS === null ? null : solution.einsteinTimeS / DAY_S;
  const passage = isOrbit ? passageOf(input.orbit, schedule.cycle.startJdUtc) : null;
  const { from, to } =
    isEvent && event.peakJdUtc !== null && einsteinTimeDays !== null
      ? visitRange(schedule.visitsJdUtc, event.peakJdUtc - einsteinTimeDays, event.peakJdUtc + einsteinTimeDays)
      : passage !== null
        ? visitRange(schedule.visitsJdUtc, passage.jdUtc - passage.windowHalfDays, passage.jdUtc + passage.windowHalfDays)
        : { from: 0, to: schedule.visitsJdUtc.length };
  const visitsJdUtc = slice(schedule.visitsJdUtc, from, to);
  const imageMagnitudes = isEvent || isOrbit ? [] : solution.images.map((image) => source.sourceMagnitude - 2.5 * Math.log10(Math.abs(image.magnification)));
  // The fainter primary image (the second, images being brightest first), or the only one.
  const magnitudes = isEvent
    ? blendedMagnitudes(visitsJdUtc, source, event, einsteinTimeDays)
    : new Float64Array(visitsJdUtc.length).fill(isOrbit ? source.sourceMagnitude : imageMagnitudes[Math.min(1, imageMagnitudes.length - 1)]);
  const all = schedule.visitSky;
  const visitSky: VisitSky = {
    airmass: slice(all.airmass, from, to),
    targetZenithDeg: slice(all.targetZenithDeg, from, to),
    moonZenithDeg: slice(all.moonZenithDeg, from, to),
    moonSeparationDeg: slice(all.moonSeparationDeg, from, to),
    moonPhaseAngleDeg: slice(all.moonPhaseAngleDeg, from, to),
  };
  const series = visitPhotometrySeries({
    instrument: setup.instrument,
    sky: setup.sky,
    visits: visitSky,
    magnitudes,
    exposureS: setup.visitExposureS,
    signalToNoiseGoal: setup.signalToNoiseGoal,
  });

  let worstVisit = -1;
  let brightestVisit = -1;
  let exposureSum = 0;
  let shortVisits = 0;
  let saturatedVisits = 0;
  let nearMoonVisits = 0;
  for (let i = 0; i < visitsJdUtc.length; i++) {
    if (worstVisit < 0 || series.signalToNoise[i] < series.signalToNoise[worstVisit]) worstVisit = i;
    if (brightestVisit < 0 || magnitudes[i] < magnitudes[brightestVisit]) brightestVisit = i;
    const needed = series.exposureForGoalS[i];
    if (needed > setup.visitExposureS) shortVisits++;
    exposureSum += Math.min(needed, setup.visitExposureS);
    if (series.saturated[i]) saturatedVisits++;
    if (visitSky.moonZenithDeg[i] <= 90 && visitSky.moonSeparationDeg[i] < MOONLIGHT_MODEL_MIN_SEPARATION_DEG) nearMoonVisits++;
  }
  const overheadS = setup.instrument.overheadS;
  const timeRequestHours = (exposureSum + visitsJdUtc.length * overheadS) / 3600;

  let baseline: VisitPhotometry | null = null;
  let peak: VisitPhotometry | null = null;
  if (isEvent && visitsJdUtc.length > 0) {
    const nearPeak = event.peakJdUtc === null ? brightestVisit : nearestVisit(visitsJdUtc, event.peakJdUtc);
    const conditions = skyAt(visitSky, nearPeak);
    const common = { instrument: setup.instrument, sky: setup.sky, visit: conditions, exposureS: setup.visitExposureS, signalToNoiseGoal: setup.signalToNoiseGoal };
    baseline = visitPhotometry({ ...common, magnitude: baselineMagnitude(source.sourceMagnitude, source.blendFraction) });
    const peakMag = magnifiedBlendMagnitude(baselineMagnitude(source.sourceMagnitude, source.blendFraction), eventMagnificationAtOffset(event.impactParameterThetaE ?? 0, event), source.blendFraction);
    peak = visitPhotometry({ ...common, magnitude: peakMag });
  }
  const worstCentroidPrecisionMas =
    caseId === "astrometric-microlensing" && worstVisit >= 0
      ? centroidPrecisionMas(visitPhotometry({ instrument: setup.instrument, sky: setup.sky, visit: skyAt(visitSky, worstVisit), magnitude: magnitudes[worstVisit], exposureS: setup.visitExposureS, signalToNoiseGoal: setup.signalToNoiseGoal }).seeingFwhmArcsec, series.signalToNoise[worstVisit])
      : null;

  return {
    budget: {
      measured: isEvent ? "blended-source" : isOrbit ? "orbiting-star" : "fainter-image",
      bandLabel: setup.sky.band.label,
      signalToNoiseGoal: setup.signalToNoiseGoal,
      visitExposureS: setup.visitExposureS,
      overheadS,
      visitsJdUtc,
      magnitudes,
      visitSky,
      series,
      worstVisit,
      brightestVisit,
      timeRequestHours,
      shortVisits,
      saturatedVisits,
      nearMoonVisits,
      imageMagnitudes,
      baseline,
      peak,
      worstCentroidPrecisionMas,
    },
  };
}

/** Index of the visit starting nearest `jdUtc` (visits ascending, at least one). */
function nearestVisit(visitsJdUtc: Float64Array, jdUtc: number): number {
  const after = firstVisitFrom(visitsJdUtc, jdUtc);
  if (after === 0) return 0;
  if (after === visitsJdUtc.length) return after - 1;
  return jdUtc - visitsJdUtc[after - 1] <= visitsJdUtc[after] - jdUtc ? after - 1 : after;
}

/** The S/N the worst visit reaches in the time available, over the goal: what the depth question grades. */
export function worstVisitShareOfGoal(budget: TargetPhotonBudget): number | null {
  return budget.worstVisit < 0 ? null : budget.series.signalToNoise[budget.worstVisit] / budget.signalToNoiseGoal;
}

