import { angularDiameterDistance, angularDiameterDistanceBetween, DAY_S, JULIAN_YEAR_S, MICROARCSECOND_RAD, MILLIARCSECOND_RAD } from "@/lib/physics";
import type { LensGeometry } from "@/lib/lensing/lens-model";
import { solveLens } from "@/lib/lensing/registry";
import { seasonWindows, type SeasonWindows } from "@/lib/astro/season";
import { cycleNightCount, skySiteOf, type InstrumentDefaults, type ProposalInput } from "@/lib/workspace/proposal-schema";
import { lensHypothesisErrors, lensHypothesisSchema, type LensHypothesis } from "@/lib/workspace/target-schema";
import {
  campaignCoverage,
  feasibilityReport,
  gradeRatio,
  largestFeatureMas,
  samplesPerTimescale,
  timescaleDays,
  verdictThresholds,
  type CycleDarkHours,
  type FeasibilityColumns,
  type FeasibilityItem,
  type Verdict,
} from "@/lib/workspace/verdicts";

/** A target's computed columns, in the units their names say; null where the model gives no value. */
export interface DerivedColumns {
  einsteinRadiusMas: number | null;
  imageSeparationMas: number | null;
  magnificationTotal: number | null;
  timeDelayDays: number | null;
  crossingTimeDays: number | null;
  shadowDiameterMicroarcsec: number | null;
  resolutionVerdict: Verdict;
  cadenceVerdict: Verdict;
  campaignVerdict: Verdict;
}

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
 * The stored verdicts against the instrument defaults (thresholds and spans in `verdicts.ts`):
 * - resolution: the largest angular feature (image separation, or a compact lens's shadow) over the
 *   resolution;
 * - cadence: samples per variability timescale (Einstein crossing time for a point lens, the image
 *   time delay for an isothermal galaxy);
 * - campaign: campaign length over the span to cover (2 t_E for an event's rise and fall, 1.5 × the
 *   delay to see a feature in both images).
 */
function verdictsFor(
  columns: Omit<DerivedColumns, "resolutionVerdict" | "cadenceVerdict" | "campaignVerdict">,
  lensModel: LensHypothesis["lensModel"],
  instrument: InstrumentDefaults,
) {
  const feature = largestFeatureMas(columns);
  const timescale = timescaleDays({ ...columns, lensModel });
  const { resolution, sampling, campaign } = verdictThresholds;
  return {
    resolutionVerdict: gradeRatio(feature === null ? null : feature / instrument.resolutionMas, resolution.feasibleAt, resolution.marginalAt),
    cadenceVerdict: gradeRatio(samplesPerTimescale(timescale, instrument.cadenceHours), sampling.feasibleAt, sampling.marginalAt),
    campaignVerdict: gradeRatio(campaignCoverage(lensModel, timescale, instrument.campaignLengthDays), campaign.feasibleAt, campaign.marginalAt),
  };
}

/**
 * Computes a target's derived columns from its lens hypothesis and the proposal's instrument
 * defaults. Every lensing quantity is the lens model's solution (`lib/lensing/registry.ts`); this
 * function only chooses the distances and converts units.
 * An incomplete hypothesis, or one outside the accepted ranges (a row stored before a range was
 * narrowed), yields nulls and "unknown" verdicts rather than an error: no value reaches a physics
 * function outside its domain.
 */
export function deriveTargetColumns(h: LensHypothesis, instrument: InstrumentDefaults): DerivedColumns {
  const isComputable = lensHypothesisSchema.safeParse(h).success && Object.keys(lensHypothesisErrors(h)).length === 0;
  const geometry = isComputable ? geometryOf(h) : null;
  const properMotionRadPerS = h.properMotionMasPerYr == null ? null : (h.properMotionMasPerYr * MILLIARCSECOND_RAD) / JULIAN_YEAR_S;
  const solution = geometry === null ? null : solveLens(h.lensModel, h, geometry, h.sourceOffsetThetaE, properMotionRadPerS);
  const columns: Omit<DerivedColumns, "resolutionVerdict" | "cadenceVerdict" | "campaignVerdict"> =
    solution === null
      ? { einsteinRadiusMas: null, imageSeparationMas: null, magnificationTotal: null, timeDelayDays: null, crossingTimeDays: null, shadowDiameterMicroarcsec: null }
      : {
          einsteinRadiusMas: solution.einsteinRadiusRad / MILLIARCSECOND_RAD,
          imageSeparationMas: solution.imageSeparationRad === null ? null : solution.imageSeparationRad / MILLIARCSECOND_RAD,
          magnificationTotal: solution.magnificationTotal,
          timeDelayDays: perDay(solution.timeDelayS),
          crossingTimeDays: perDay(solution.einsteinTimeS),
          shadowDiameterMicroarcsec: solution.shadowDiameterRad === null ? null : solution.shadowDiameterRad / MICROARCSECOND_RAD,
        };
  return { ...columns, ...verdictsFor(columns, h.lensModel, instrument) };
}

/** What the feasibility report needs of a proposal: its scales, λ and B, site and cycle. */
export type FeasibilitySettings = Pick<ProposalInput, "site" | "instrument" | "cycleStartDate" | "cycleEndDate">;

/**
 * Usable dark hours of one target (ICRS degrees) over the proposal's cycle from its site under its
 * airmass limit (`seasonWindows`: astronomical darkness, above the limit, nights closer to the Sun
 * than the safe elongation counted as 0 h). Null when the cycle dates are not set. ~60 ms for 183 nights.
 */
export function cycleDarkHours(settings: FeasibilitySettings, target: { raDeg: number; decDeg: number }): CycleDarkHours | null {
  const { cycleStartDate: start, cycleEndDate: end } = settings;
  if (start === null || end === null) return null;
  const season = seasonWindows({
    site: skySiteOf(settings.site),
    targets: [{ raDeg: target.raDeg, decDeg: target.decDeg }],
    startNightIso: start,
    nightCount: cycleNightCount(start, end),
    limits: { airmassLimit: settings.instrument.airmassLimit },
  });
  return darkHoursOfSeason(season, 0);
}

/** The dark-hours figures of target `index` of a computed season. */
export function darkHoursOfSeason(season: SeasonWindows, index: number): CycleDarkHours {
  const t = season.targets[index];
  let sunNightCount = 0;
  for (const flag of t.tooCloseToSunPerNight) sunNightCount += flag;
  return { totalHoursDark: t.totalHoursDark, nightCount: season.nightDatesIso.length, sunNightCount };
}

/** A target's five feasibility verdicts against its proposal (`feasibilityReport`), dark hours computed here. */
export function targetFeasibility(target: FeasibilityColumns & { raDeg: number; decDeg: number }, settings: FeasibilitySettings): FeasibilityItem[] {
  return feasibilityReport(target, settings.instrument, cycleDarkHours(settings, target));
}
