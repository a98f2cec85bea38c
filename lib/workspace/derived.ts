import { angularDiameterDistance, angularDiameterDistanceBetween, DAY_S, JULIAN_YEAR_S, MICROARCSECOND_RAD, MILLIARCSECOND_RAD, SOLAR_RADIUS_M } from "@/lib/physics";
import type { LensGeometry } from "@/lib/lensing/lens-model";
import { sourceRadiusInThetaE } from "@/lib/lensing/microlensing";
import { solveLens } from "@/lib/lensing/registry";
import { caseVerdictOf, type Verdict } from "@/lib/lensing/feasibility-rules";
import { defaultScienceCase, scienceCaseQuestions } from "@/lib/lensing/science-cases";
import type { EventTiming, InstrumentSettings as CaseInstrument, OrbitInputs, ScienceCaseId } from "@/lib/lensing/science-case-inputs";
import type { CaseAnswer } from "@/lib/lensing/science-case-questions";
import type { LensSolution } from "@/lib/lensing/solution";
import { targetPhotonBudget, type PhotonBudgetInputs, type PhotonBudgetOutcome } from "@/lib/lensing/photon-budget";
import { bandSkyOf, psfShapeOf } from "@/lib/workspace/photometry-schema";
import { LRUCache } from "lru-cache";
import { observingSchedules, type ObservingSchedule, type ScheduleConditions } from "@/lib/schedule";
import { skySiteOf, type ProposalInput } from "@/lib/workspace/proposal-schema";
import { lensHypothesisErrors, lensHypothesisSchema, type LensHypothesis } from "@/lib/workspace/target-schema";

/**
 * The version of the rules the stored derived columns were computed with. Raise it with every change
 * of a lensing formula, a feasibility rule or the schedule: startup re-derives every older row, so no
 * stored verdict is ever stale.
 */
export const DERIVATION_VERSION = 5;

/** A target's computed columns, in the units their names say; null where the model gives no value. */
export interface DerivedColumns {
  einsteinRadiusMas: number | null;
  imageSeparationMas: number | null;
  magnificationTotal: number | null;
  timeDelayDays: number | null;
  crossingTimeDays: number | null;
  shadowDiameterMicroarcsec: number | null;
  /** The photon budget: hours requested over the visits the case needs, and the S/N at the brightest of them in the whole exposure a visit leaves; null without a budget. */
  timeRequestHours: number | null;
  peakSignalToNoise: number | null;
  /** The case the answers are for (chosen, else inferred); null when the hypothesis cannot be solved. */
  answeredCase: ScienceCaseId | null;
  /** The worst of the answers' verdicts ("unknown" when none is known). */
  caseVerdict: Verdict;
  caseAnswers: CaseAnswer[];
  derivationVersion: number;
}

/**
 * What the derivation needs of a proposal: its instrument, site and cycle, and its photometry
 * settings; null photometry (the lens bench, which has no camera) asks for no photon budget.
 */
export type FeasibilitySettings = Pick<ProposalInput, "site" | "instrument" | "cycleStartDate" | "cycleEndDate"> & { photometry: ProposalInput["photometry"] | null };

/**
 * Distances from what the target gives: Galactic distances (then D_LS = D_S − D_L and z_L = 0, where
 * the cosmological (1 + z) stretch of delays does not apply) or redshifts (then angular-diameter
 * distances in the physics module's default flat ΛCDM).
 */
function geometryOf(h: LensHypothesis): LensGeometry | null {
  if (h.lensRedshift != null && h.sourceRedshift != null) {
    return {
      dLensPc: angularDiameterDistance(h.lensRedshift),
      dSourcePc: angularDiameterDistance(h.sourceRedshift),
      dLensSourcePc: angularDiameterDistanceBetween(h.lensRedshift, h.sourceRedshift),
      zLens: h.lensRedshift,
    };
  }
  if (h.lensDistancePc != null && h.sourceDistancePc != null) {
    return { dLensPc: h.lensDistancePc, dSourcePc: h.sourceDistancePc, dLensSourcePc: h.sourceDistancePc - h.lensDistancePc, zLens: 0 };
  }
  return null;
}

const perDay = (seconds: number | null) => (seconds === null ? null : seconds / DAY_S);

/**
 * The solution with what a light-curve fit measured of the event in place of what the hypothesis
 * predicts: the fitted t_E for θ_E/μ_rel (the typed proper motion stays as it is, and θ_E with it),
 * and |π_E| = √(π_E,N² + π_E,E²), the length of the fitted parallax vector (its magnitude is
 * π_rel/θ_E, its direction μ_rel's: Gould 2004, ApJ 606, 319), for π_rel/θ_E from the distances. Every reader of the solution (the stored columns, the science cases, the schedule's
 * event windows, the photon budget, the page's figures) then follows the measurement.
 */
function withMeasuredEvent(solution: LensSolution, h: LensHypothesis): LensSolution {
  const { einsteinTimeDays, parallaxNorth, parallaxEast } = h;
  return {
    ...solution,
    einsteinTimeS: einsteinTimeDays == null ? solution.einsteinTimeS : einsteinTimeDays * DAY_S,
    microlensParallax: parallaxNorth == null || parallaxEast == null ? solution.microlensParallax : Math.hypot(parallaxNorth, parallaxEast),
  };
}

/**
 * The lens model's solution of a target's hypothesis (`lib/lensing/registry.ts`), with the event's
 * fitted t_E and parallax where the target has them (`withMeasuredEvent`); null for an incomplete
 * hypothesis, or one outside the accepted ranges (a row stored before a range was narrowed): no
 * value reaches a physics function outside its domain.
 */
export function lensSolutionOf(h: LensHypothesis): { solution: LensSolution; geometry: LensGeometry } | null {
  const isComputable = lensHypothesisSchema.safeParse(h).success && Object.keys(lensHypothesisErrors(h)).length === 0;
  const geometry = isComputable ? geometryOf(h) : null;
  if (geometry === null) return null;
  const properMotionRadPerS = h.properMotionMasPerYr == null ? null : (h.properMotionMasPerYr * MILLIARCSECOND_RAD) / JULIAN_YEAR_S;
  const solution = solveLens(h.lensModel, h, geometry, h.sourceOffsetThetaE, properMotionRadPerS);
  return solution === null ? null : { solution: withMeasuredEvent(solution, h), geometry };
}

/** The proposal's instrument as the science cases compare with it. */
export function caseInstrumentOf(instrument: FeasibilitySettings["instrument"]): CaseInstrument {
  const { interferometerWavelengthMm: wavelengthMm, interferometerBaselineKm: longestBaselineKm } = instrument;
  return {
    psfFwhmMas: instrument.resolutionMas,
    interferometer: wavelengthMm != null && longestBaselineKm != null ? { wavelengthMm, longestBaselineKm } : null,
    astrometricPrecisionMas: instrument.astrometricPrecisionMas ?? null,
    reachableContrast: instrument.reachableContrast ?? null,
    spectroscopicPrecisionKmPerS: instrument.spectroscopicPrecisionKmPerS ?? null,
  };
}

/**
 * The orbiting star of the relativistic-orbit case as the target gives it: the compact mass is the
 * lens mass (a point-mass lens; null for another model, whose orbit fields are refused), at the lens
 * distance (the angular-diameter distance for a lens given by redshift).
 */
export function orbitInputsOf(h: LensHypothesis, geometry: LensGeometry): OrbitInputs {
  return {
    centralMassSolar: h.lensModel === "point" ? (h.lensMassSolar ?? null) : null,
    distancePc: geometry.dLensPc,
    semiMajorAxisAu: h.orbitSemiMajorAxisAu ?? null,
    semiMajorAxisMas: h.orbitSemiMajorAxisMas ?? null,
    eccentricity: h.orbitEccentricity ?? null,
    periodDays: h.orbitPeriodDays ?? null,
    periapsisJdUtc: h.orbitPeriapsisJdUtc ?? null,
    inclinationDeg: h.orbitInclinationDeg ?? null,
    nodeDeg: h.orbitNodeDeg ?? null,
    periapsisArgumentDeg: h.orbitPeriapsisArgumentDeg ?? null,
  };
}

/** The event's timing and source: ρ typed, else from the source's radius and distance (ρ = R_star / (D_S θ_E)). */
export function eventTimingOf(h: LensHypothesis, solution: LensSolution, geometry: LensGeometry): EventTiming {
  const rho =
    h.sourceRadiusThetaE ?? (h.sourceRadiusSolar == null ? null : sourceRadiusInThetaE(h.sourceRadiusSolar * SOLAR_RADIUS_M, geometry.dSourcePc, solution.einsteinRadiusRad));
  return { peakJdUtc: h.eventPeakJdUtc ?? null, impactParameterThetaE: h.sourceOffsetThetaE, sourceRadiusThetaE: rho, limbDarkeningU: h.limbDarkeningU ?? 0 };
}

/** The schedule's conditions from the proposal; null until it has cycle dates. */
export function scheduleConditionsOf(settings: FeasibilitySettings): ScheduleConditions | null {
  const { cycleStartDate, cycleEndDate, instrument } = settings;
  if (cycleStartDate === null || cycleEndDate === null) return null;
  return {
    site: skySiteOf(settings.site),
    cycleStartNightIso: cycleStartDate,
    cycleEndNightIso: cycleEndDate,
    limits: { airmassLimit: instrument.airmassLimit },
    moon: { minSeparationDeg: instrument.moonMinSeparationDeg ?? null, maxIlluminatedFraction: instrument.moonMaxIllumination ?? null },
    cadenceHours: instrument.cadenceHours,
    visitMinutes: instrument.visitMinutes,
    clearNightFraction: instrument.clearNightFraction,
  };
}

/** The simulated schedules of many targets under one proposal (one shared night grid); nulls without cycle dates. */
export function targetSchedules(settings: FeasibilitySettings, targets: readonly { raDeg: number; decDeg: number }[]): (ObservingSchedule | null)[] {
  const conditions = scheduleConditionsOf(settings);
  if (conditions === null || targets.length === 0) return targets.map(() => null);
  return observingSchedules({ ...conditions, targets: targets.map(({ raDeg, decDeg }) => ({ raDeg, decDeg })) });
}

/**
 * Schedules already simulated for one target, by their conditions and coordinates (all a schedule
 * depends on, so a kept one is never stale). A target page costs one simulated cycle, ~70 ms for 183
 * nights; kept, 0.2 ms (measured on this machine). 256 entries of
 * ~40 kB each (a 183-night cycle) bound the memory at about 11 MB.
 */
const singleScheduleCache = new LRUCache<string, ObservingSchedule>({ max: 256 });

/**
 * One target's schedule: `targetSchedules` for a list of one, kept for the next caller with the same
 * conditions and coordinates. The schedule is shared between callers: read it, never change it.
 */
export function targetSchedule(settings: FeasibilitySettings, target: { raDeg: number; decDeg: number }): ObservingSchedule | null {
  const conditions = scheduleConditionsOf(settings);
  if (conditions === null) return null;
  const key = JSON.stringify([conditions, target.raDeg, target.decDeg]);
  const kept = singleScheduleCache.get(key);
  if (kept !== undefined) return kept;
  const [schedule] = observingSchedules({ ...conditions, targets: [{ raDeg: target.raDeg, decDeg: target.decDeg }] });
  singleScheduleCache.set(key, schedule);
  return schedule;
}

/** The science case a target is graded in: the team's choice, else the inferred one with its reason. */
export interface TargetCase {
  caseId: ScienceCaseId;
  isChosen: boolean;
  /** Why the case was inferred; null when the team chose it. */
  reason: string | null;
}

/** A target's case, its photon budget and its answered questions. */
export interface TargetCaseReport {
  solution: LensSolution;
  scienceCase: TargetCase;
  photonBudget: PhotonBudgetOutcome;
  answers: CaseAnswer[];
}

/**
 * What the photon budget needs of the proposal's photometry settings and the target's source, or the
 * first missing input in words: the telescope's aperture, the source's magnitude, a described band
 * and the site's sky in it.
 */
export function photonBudgetInputsOf(h: LensHypothesis, settings: FeasibilitySettings): PhotonBudgetInputs {
  const p = settings.photometry;
  if (p === null) return { notApplicable: true };
  if (p.apertureM === null) return { missing: "Set the telescope's aperture in the proposal's photometry settings to compute the photon budget." };
  if (h.sourceMagnitude == null) return { missing: "Set the source's magnitude (in the proposal's band, or name its band) to compute the photon budget." };
  const bandSky = bandSkyOf(p, h.sourceBand ?? p.bandId);
  if ("missing" in bandSky) return bandSky;
  const visitExposureS = settings.instrument.visitMinutes * 60 - p.overheadS;
  return {
    setup: {
      instrument: {
        optics: { apertureM: p.apertureM, centralObstructionM: p.centralObstructionM, throughput: p.throughput },
        readNoiseElectrons: p.readNoiseElectrons,
        darkElectronsPerSPerPixel: p.darkElectronsPerSPerPixel,
        gainElectronsPerAdu: p.gainElectronsPerAdu,
        fullWellElectrons: p.fullWellElectrons,
        pixelScaleArcsec: p.pixelScaleArcsec,
        seeingFwhmZenithArcsec: p.seeingFwhmArcsec,
        apertureRadiusFwhm: p.apertureRadiusFwhm,
        psf: psfShapeOf(p.psfShape),
        overheadS: p.overheadS,
      },
      sky: bandSky.sky,
      signalToNoiseGoal: p.signalToNoiseGoal,
      visitExposureS,
    },
    source: { sourceMagnitude: h.sourceMagnitude, blendFraction: h.blendFraction ?? 1 },
  };
}

/** The case and answers of a solvable hypothesis under the proposal's settings and the target's schedule. */
export function targetCaseReport(h: LensHypothesis, settings: FeasibilitySettings, schedule: ObservingSchedule | null, solved = lensSolutionOf(h)): TargetCaseReport | null {
  if (solved === null) return null;
  const { solution, geometry } = solved;
  const instrument = caseInstrumentOf(settings.instrument);
  const orbit = orbitInputsOf(h, geometry);
  const inferred = h.scienceCase == null ? defaultScienceCase(solution, instrument, orbit) : null;
  const scienceCase: TargetCase = inferred === null ? { caseId: h.scienceCase!, isChosen: true, reason: null } : { caseId: inferred.caseId, isChosen: false, reason: inferred.reason };
  const event = eventTimingOf(h, solution, geometry);
  const photonBudget = targetPhotonBudget({ caseId: scienceCase.caseId, solution, event, schedule, inputs: photonBudgetInputsOf(h, settings), orbit });
  const answers = scienceCaseQuestions(scienceCase.caseId, {
    solution,
    event,
    instrument,
    schedule,
    campaign: { lengthDays: settings.instrument.campaignLengthDays, cadenceHours: settings.instrument.cadenceHours },
    photonBudget,
    orbit,
  });
  return { solution, scienceCase, photonBudget, answers };
}

/** The derived columns of a hypothesis without a solution (incomplete, or outside today's ranges). */
export const unsolvedColumns: Omit<DerivedColumns, "derivationVersion"> = {
  einsteinRadiusMas: null,
  imageSeparationMas: null,
  magnificationTotal: null,
  timeDelayDays: null,
  crossingTimeDays: null,
  shadowDiameterMicroarcsec: null,
  timeRequestHours: null,
  peakSignalToNoise: null,
  answeredCase: null,
  caseVerdict: "unknown",
  caseAnswers: [],
};

/**
 * A target's stored derived columns: the lens model's solution in table units, and its science
 * case's answers from the proposal's settings and the target's simulated schedule (null when the
 * proposal has no cycle dates; the sampling questions then say so).
 */
export function deriveTargetColumns(h: LensHypothesis, settings: FeasibilitySettings, schedule: ObservingSchedule | null): DerivedColumns {
  const report = targetCaseReport(h, settings, schedule);
  if (report === null) return { ...unsolvedColumns, derivationVersion: DERIVATION_VERSION };
  const { solution, answers, photonBudget } = report;
  const budget = "budget" in photonBudget && photonBudget.budget.brightestVisit >= 0 ? photonBudget.budget : null;
  return {
    einsteinRadiusMas: solution.einsteinRadiusRad / MILLIARCSECOND_RAD,
    imageSeparationMas: solution.imageSeparationRad === null ? null : solution.imageSeparationRad / MILLIARCSECOND_RAD,
    magnificationTotal: solution.magnificationTotal,
    timeDelayDays: perDay(solution.timeDelayS),
    crossingTimeDays: perDay(solution.einsteinTimeS),
    shadowDiameterMicroarcsec: solution.shadowDiameterRad === null ? null : solution.shadowDiameterRad / MICROARCSECOND_RAD,
    timeRequestHours: budget === null ? null : budget.timeRequestHours,
    peakSignalToNoise: budget === null ? null : budget.series.signalToNoise[budget.brightestVisit],
    answeredCase: report.scienceCase.caseId,
    caseVerdict: caseVerdictOf(answers.map((answer) => answer.verdict)),
    caseAnswers: answers,
    derivationVersion: DERIVATION_VERSION,
  };
}
