/**
 * Feasibility verdicts of a target against its proposal's instrument defaults and site, and their
 * wording. Each verdict compares one ratio with two thresholds (rules of thumb stated beside each,
 * not instrument models) and is shown with the number behind it.
 */
import type { Target } from "@/db/schema";
import { lensModelOf } from "@/lib/lensing/registry";
import type { LensTimescale } from "@/lib/lensing/lens-model";
import { MICROARCSECOND_RAD } from "@/lib/physics";

export const verdicts = ["feasible", "marginal", "infeasible", "unknown"] as const;
export type Verdict = (typeof verdicts)[number];

/** Ratio thresholds: at least `feasibleAt` is feasible, at least `marginalAt` marginal, else infeasible. */
export function gradeRatio(ratio: number | null, feasibleAt: number, marginalAt: number): Verdict {
  if (ratio === null || !Number.isFinite(ratio)) return "unknown";
  if (ratio >= feasibleAt) return "feasible";
  if (ratio >= marginalAt) return "marginal";
  return "infeasible";
}

/**
 * Thresholds of every verdict. Resolution and shadow: one resolution element resolves (Rayleigh-like),
 * half of one still allows a model fit. Sampling: 10 samples per timescale trace a light curve, 3 give
 * a shape (common practice in microlensing follow-up). Campaign: covering the span once is enough,
 * half of it shows part of the event. Dark hours (our rule): 30 h in the cycle is about three full
 * dark nights, enough for a monitoring programme; any hour at all is marginal.
 */
export const verdictThresholds = {
  resolution: { feasibleAt: 1, marginalAt: 0.5 },
  sampling: { feasibleAt: 10, marginalAt: 3 },
  campaign: { feasibleAt: 1, marginalAt: 0.5 },
  shadow: { feasibleAt: 1, marginalAt: 0.5 },
  darkHours: { feasibleAt: 30, marginalAt: Number.MIN_VALUE },
} as const;

/** Span a campaign must cover, in multiples of the timescale: t0 ± t_E for an event, 1.5 Δt for a delay. */
export const CAMPAIGN_SPAN_CROSSING_TIMES = 2;
export const CAMPAIGN_SPAN_TIME_DELAYS = 1.5;

/**
 * Diffraction-limited resolution λ/B of an interferometer, µas, for λ in mm and the longest
 * baseline B in km (the fringe spacing of the longest baseline; Thompson, Moran & Swenson,
 * Interferometry and Synthesis in Radio Astronomy, 3rd ed. 2017, §2.1). Null when either is unset.
 */
export function interferometerBeamMicroarcsec(wavelengthMm: number | null, baselineKm: number | null): number | null {
  if (wavelengthMm === null || baselineKm === null) return null;
  return (wavelengthMm * 1e-3) / (baselineKm * 1e3) / MICROARCSECOND_RAD;
}

/** The stored numbers of a target that the verdicts read, in the units their names say. */
export type FeasibilityColumns = Pick<
  Target,
  "lensModel" | "imageSeparationMas" | "timeDelayDays" | "crossingTimeDays" | "shadowDiameterMicroarcsec" | "resolutionVerdict" | "cadenceVerdict" | "campaignVerdict"
>;

/** The proposal's side of the comparison. */
export interface FeasibilityDefaults {
  resolutionMas: number;
  cadenceHours: number;
  campaignLengthDays: number;
  interferometerWavelengthMm: number | null;
  interferometerBaselineKm: number | null;
}

/** Usable dark hours of the target over the cycle, or null when the proposal has no cycle dates. */
export interface CycleDarkHours {
  totalHoursDark: number;
  nightCount: number;
  /** Nights the target was up in darkness but closer to the Sun than the safe elongation. */
  sunNightCount: number;
}

export type FeasibilityId = "images" | "sampling" | "campaign" | "shadow" | "dark-hours";

export interface FeasibilityItem {
  /** Stable key, also the test id of the verdict on the page. */
  id: FeasibilityId;
  question: string;
  verdict: Verdict;
  /** The number behind the verdict, in words with units; "—" style text when unknown. */
  figure: string;
}

const digits = (value: number, significant = 3) => Number(value.toPrecision(significant)).toString();

/** The largest angular feature the resolution verdict grades: the image separation or a shadow (mas). */
export function largestFeatureMas(c: Pick<FeasibilityColumns, "imageSeparationMas" | "shadowDiameterMicroarcsec">): number | null {
  const features = [c.imageSeparationMas, c.shadowDiameterMicroarcsec === null ? null : c.shadowDiameterMicroarcsec / 1000].filter((f): f is number => f !== null);
  return features.length > 0 ? Math.max(...features) : null;
}

/**
 * How the sampling and campaign verdicts speak of each model's timescale (`LensModel.timescale`): its
 * stored column, symbol, the span a campaign must cover in multiples of it, and the campaign question.
 */
const timescaleTerms: Record<LensTimescale, { column: "crossingTimeDays" | "timeDelayDays"; symbol: string; spanMultiple: number; campaignQuestion: string }> = {
  einsteinTime: { column: "crossingTimeDays", symbol: "t_E", spanMultiple: CAMPAIGN_SPAN_CROSSING_TIMES, campaignQuestion: "Event within the campaign" },
  timeDelay: { column: "timeDelayDays", symbol: "Δt", spanMultiple: CAMPAIGN_SPAN_TIME_DELAYS, campaignQuestion: "Time delay within the campaign" },
};

const termsOf = (lensModel: FeasibilityColumns["lensModel"]) => timescaleTerms[lensModelOf(lensModel).timescale];

/** The variability timescale the sampling and campaign verdicts grade: t_E of an event (point lens), Δt of an image pair (SIS), days. */
export function timescaleDays(c: Pick<FeasibilityColumns, "lensModel" | "crossingTimeDays" | "timeDelayDays">): number | null {
  return c[termsOf(c.lensModel).column];
}

/** Samples per timescale at the cadence. */
export function samplesPerTimescale(timescale: number | null, cadenceHours: number): number | null {
  return timescale === null ? null : (timescale * 24) / cadenceHours;
}

/** Campaign length over the span to cover. */
export function campaignCoverage(lensModel: FeasibilityColumns["lensModel"], timescale: number | null, campaignLengthDays: number): number | null {
  if (timescale === null) return null;
  return campaignLengthDays / (termsOf(lensModel).spanMultiple * timescale);
}

/** The shadow against λ/B: verdict and ratio (unknown without a shadow or without λ and B). */
export function shadowVerdict(shadowMicroarcsec: number | null, beamMicroarcsec: number | null): { verdict: Verdict; ratio: number | null } {
  const ratio = shadowMicroarcsec === null || beamMicroarcsec === null ? null : shadowMicroarcsec / beamMicroarcsec;
  return { verdict: gradeRatio(ratio, verdictThresholds.shadow.feasibleAt, verdictThresholds.shadow.marginalAt), ratio };
}

/** Usable dark hours in the cycle: unknown without a cycle, infeasible at 0 h. */
export function darkHoursVerdict(dark: CycleDarkHours | null): Verdict {
  return gradeRatio(dark?.totalHoursDark ?? null, verdictThresholds.darkHours.feasibleAt, verdictThresholds.darkHours.marginalAt);
}

/**
 * The five feasibility questions of a target with their verdicts and numbers. The first three
 * repeat the stored verdicts (graded with the same thresholds by `deriveTargetColumns`); shadow and
 * dark hours are graded here from the proposal's λ, B and cycle.
 */
export function feasibilityReport(c: FeasibilityColumns, d: FeasibilityDefaults, dark: CycleDarkHours | null): FeasibilityItem[] {
  const feature = largestFeatureMas(c);
  const isShadowLargest = feature !== null && c.shadowDiameterMicroarcsec !== null && feature === c.shadowDiameterMicroarcsec / 1000 && feature !== c.imageSeparationMas;
  const timescale = timescaleDays(c);
  const terms = termsOf(c.lensModel);
  const timescaleName = terms.symbol;
  const samples = samplesPerTimescale(timescale, d.cadenceHours);
  const coverage = campaignCoverage(c.lensModel, timescale, d.campaignLengthDays);
  const spanWords = `${terms.spanMultiple} ${timescaleName} = ${timescale === null ? "" : digits(terms.spanMultiple * timescale)} d`;
  const beam = interferometerBeamMicroarcsec(d.interferometerWavelengthMm, d.interferometerBaselineKm);
  const shadow = shadowVerdict(c.shadowDiameterMicroarcsec, beam);
  const shadowFigure =
    c.shadowDiameterMicroarcsec === null
      ? "no shadow for this lens model"
      : beam === null
        ? `shadow ${digits(c.shadowDiameterMicroarcsec)} µas; set the interferometer's λ and B`
        : `shadow ${digits(c.shadowDiameterMicroarcsec)} µas = ${digits(shadow.ratio!)} × λ/B (${digits(beam)} µas)`;
  return [
    {
      id: "images",
      question: "Images resolvable",
      verdict: c.resolutionVerdict,
      figure:
        feature === null
          ? "no image pair for this hypothesis"
          : `${isShadowLargest ? "shadow" : "separation"} ${digits(feature)} mas = ${digits(feature / d.resolutionMas)} × resolution (${d.resolutionMas} mas)`,
    },
    {
      id: "campaign",
      question: terms.campaignQuestion,
      verdict: c.campaignVerdict,
      figure: coverage === null ? `no ${timescaleName} for this hypothesis` : `${spanWords} against a ${d.campaignLengthDays} d campaign (${digits(coverage)} ×)`,
    },
    {
      id: "sampling",
      question: "Samples across the event",
      verdict: c.cadenceVerdict,
      figure: samples === null ? `no ${timescaleName} for this hypothesis` : `${digits(samples)} samples per ${timescaleName} (${digits(timescale!)} d at ${d.cadenceHours} h cadence)`,
    },
    { id: "shadow", question: "Shadow against λ/B", verdict: shadow.verdict, figure: shadowFigure },
    {
      id: "dark-hours",
      question: "Observable dark hours in the cycle",
      verdict: darkHoursVerdict(dark),
      figure:
        dark === null
          ? "set the cycle dates"
          : `${dark.totalHoursDark.toFixed(1)} h over ${dark.nightCount} nights${dark.sunNightCount > 0 ? ` (${dark.sunNightCount} nights unusable: too close to the Sun)` : ""}`,
    },
  ];
}
