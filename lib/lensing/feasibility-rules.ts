/**
 * Every feasibility rule of the product: the thresholds that turn a lensing number into a verdict,
 * each with its source. "Common practice" marks a trade rule without a single published source,
 * "our rule" a choice of ours (the reasoning is given), "from memory" a reference not re-checked here.
 * Pure numbers in, verdicts out; the wording lives with the science cases (science-case-*.ts).
 * The published sources are keys of lib/citations (`feasibilityRuleReferences`, at the end).
 */
import type { CitationKey } from "@/lib/citations/references";

/** The answers a feasibility question can have; "unknown" when an input it needs is missing. */
export const verdicts = ["feasible", "marginal", "infeasible", "unknown"] as const;
export type Verdict = (typeof verdicts)[number];

/** A ratio rule: at least `feasibleAt` is feasible, at least `marginalAt` marginal, below it infeasible. */
export interface RatioRule {
  feasibleAt: number;
  marginalAt: number;
}

/** A verdict a question reaches once its inputs are there. */
export type KnownVerdict = Exclude<Verdict, "unknown">;

/**
 * Grades `value` against a ratio rule. Questions answer "unknown" for a missing input before they
 * grade; a NaN (no comparison possible) grades infeasible.
 */
export function gradeAtLeast(value: number, rule: RatioRule): KnownVerdict {
  if (value >= rule.feasibleAt) return "feasible";
  if (value >= rule.marginalAt) return "marginal";
  return "infeasible";
}

const verdictOrder: Record<KnownVerdict, number> = { infeasible: 0, marginal: 1, feasible: 2 };

/** The worse of two verdicts (infeasible < marginal < feasible). */
export function worseVerdict(a: KnownVerdict, b: KnownVerdict): KnownVerdict {
  return verdictOrder[a] <= verdictOrder[b] ? a : b;
}

// ── Angular resolution ────────────────────────────────────────────────────────────────────────────

/**
 * Image separation over the resolution element (PSF FWHM, or λ/B). Common practice (Rayleigh-like):
 * at one element two point sources are separate; from half an element a fit of two point sources
 * still splits them.
 */
export const RESOLUTION_RULE: RatioRule = { feasibleAt: 1, marginalAt: 0.5 };

/**
 * Diffraction-limited resolution λ/B of an interferometer, radians, for λ in mm and the longest
 * baseline B in km: the fringe spacing of the longest baseline (Thompson, Moran & Swenson,
 * Interferometry and Synthesis in Radio Astronomy, 3rd ed. 2017, §2.1).
 */
export function interferometerBeamRad(wavelengthMm: number, longestBaselineKm: number): number {
  return (wavelengthMm * 1e-3) / (longestBaselineKm * 1e3);
}

/**
 * Shadow (or photon-ring) diameter over λ/B. Common practice: a ring one beam across or more is imaged
 * (the M87* ring of 42 µas at λ/B ≈ 25 µas: Event Horizon Telescope Collaboration 2019, ApJL 875, L1,
 * from memory); from half a beam its size can still be fitted to the visibilities.
 */
export const SHADOW_RULE: RatioRule = { feasibleAt: 1, marginalAt: 0.5 };

/**
 * Reachable contrast over the images' flux ratio, both as the largest flux ratio bright/faint (a
 * contrast of Δm magnitudes is 10^(0.4 Δm)). Our rule: within the reachable contrast the fainter image
 * is seen; up to twice it (0.75 mag beyond) a careful PSF subtraction may still show it.
 */
export const CONTRAST_RULE: RatioRule = { feasibleAt: 1, marginalAt: 0.5 };

// ── Photometric microlensing ──────────────────────────────────────────────────────────────────────

/**
 * Peak magnification. Common practice: an event is the source passing within θ_E (u0 ≤ 1), i.e.
 * A ≥ 3/√5 ≈ 1.34 (Paczyński 1986, ApJ 304, 1); our rule: down to A(u0 = 2) = 3/√8 ≈ 1.06, a 6 %
 * brightening that good photometry still detects, is marginal.
 */
export const PEAK_MAGNIFICATION_RULE: RatioRule = { feasibleAt: 3 / Math.sqrt(5), marginalAt: 3 / Math.sqrt(8) };

/**
 * Visits within t0 ± t_E. Common practice in microlensing follow-up: ten points per t_E trace the light
 * curve, three give its shape; over the 2 t_E of the event that is 20 and 6.
 */
export const EVENT_VISITS_RULE: RatioRule = { feasibleAt: 20, marginalAt: 6 };

/**
 * Visits within the peak, |t − t0| < t_eff. Our rule: five points give the peak's shape (u0 and, for a
 * large source, ρ); two give its height only.
 */
export const PEAK_VISITS_RULE: RatioRule = { feasibleAt: 5, marginalAt: 2 };

/** The least peak half-width, in units of t_E (our rule: a peak is never taken as narrower than t_E/10). */
export const PEAK_MIN_HALF_WIDTH_THETA_E = 0.1;

/** Which term sets the peak's half-width. */
export type PeakWidthTerm = "impact" | "source" | "floor";

/**
 * Half-width of the peak t_eff, days: u0·t_E, the effective timescale of a high-magnification peak
 * (common practice in high-magnification follow-up: near the peak A ≈ 1/u, so the light curve depends
 * on t − t0 only through (t − t0)/(u0 t_E)); ρ·t_E, the source's radius crossing time, when the
 * source is larger than u0 (common practice: the peak is then flattened over the source's crossing);
 * at least t_E/10 (our rule). Units: t_E in days, u0 and ρ in θ_E (ρ null for a point source).
 */
export function peakHalfWidthDays(einsteinTimeDays: number, u0: number, rho: number | null): { days: number; term: PeakWidthTerm } {
  const source = rho ?? 0;
  const term: PeakWidthTerm = Math.max(u0, source) < PEAK_MIN_HALF_WIDTH_THETA_E ? "floor" : source > u0 ? "source" : "impact";
  const width = term === "floor" ? PEAK_MIN_HALF_WIDTH_THETA_E : term === "source" ? source : u0;
  return { days: width * einsteinTimeDays, term };
}

/**
 * Whether the peak is observed, from the distance between t0 and the nearest usable time. Our rule:
 * within t_eff/4 of t0 the point-lens magnification is within 3 % of its peak (u = u0 √(1 + 1/16)
 * for a high-magnification peak), so the peak is observed; within t_eff its wings are (the
 * magnification above 1/√2 of the peak), its top is not; beyond t_eff the peak is missed.
 */
export function peakReachVerdict(distanceDays: number, peakHalfWidthDays: number): KnownVerdict {
  if (distanceDays <= peakHalfWidthDays / 4) return "feasible";
  if (distanceDays <= peakHalfWidthDays) return "marginal";
  return "infeasible";
}

/** Relative rounding of a span computed from Julian dates (about 1e-16 × 2.5e6 d, far below a second). */
const COVERAGE_ROUNDING = 1e-9;

/**
 * How much of a stretch t0 ± halfWidth a span observes: the event (half-width t_E) against the campaign
 * length or the part of t0 ± t_E inside the cycle, or the peak (half-width t_eff) against the part of
 * it inside the cycle; days. Common practice: the event is t0 ± t_E, so 2 t_E is covered whole. Our
 * rule (as before in the product): shorter than that is marginal — the wings and the baseline are
 * partly or wholly missed, t_E is poorly constrained — and below a tenth of the half-width infeasible:
 * near the peak only u0·t_E is seen, neither the timescale nor the baseline.
 */
export function coverageVerdict(spanDays: number, halfWidthDays: number): KnownVerdict {
  // A span computed as (end − start) of a covered stretch differs from 2·halfWidth by rounding only.
  if (spanDays >= 2 * halfWidthDays * (1 - COVERAGE_ROUNDING)) return "feasible";
  if (spanDays >= halfWidthDays / 10) return "marginal";
  return "infeasible";
}

// ── Astrometric microlensing ──────────────────────────────────────────────────────────────────────

/**
 * The event's largest centroid shift over the precision per epoch. Our rule: three times the
 * precision is seen in one epoch; from one precision up, only several epochs combined detect it.
 */
export const ASTROMETRIC_EPOCH_RULE: RatioRule = { feasibleAt: 3, marginalAt: 1 };

/**
 * Significance of the shift over the visits near its largest value, √Σ(δ_i/σ)². Common practice: 5σ
 * is a detection, 3σ evidence.
 */
export const ASTROMETRIC_DETECTION_RULE: RatioRule = { feasibleAt: 5, marginalAt: 3 };

/** Visits "near the largest shift" are those where the shift is at least this fraction of it (our rule). */
export const ASTROMETRIC_NEAR_PEAK_FRACTION = 0.5;

// ── Time-delay monitoring ─────────────────────────────────────────────────────────────────────────

/**
 * The target's longest observing season over the delay. Common practice: the same variation must be
 * seen in both images within one season, so the season holds Δt; with 1.5 Δt (as the product's
 * campaign rule before) half a delay of each light curve overlaps the other's for the cross-correlation;
 * a season just holding Δt is marginal.
 */
export const DELAY_SEASON_RULE: RatioRule = { feasibleAt: 1.5, marginalAt: 1 };

/**
 * Visits per Δt within the seasons. Common practice (as for light curves above): ten points per
 * timescale trace the variation, three give its shape.
 */
export const DELAY_VISITS_RULE: RatioRule = { feasibleAt: 10, marginalAt: 3 };

/**
 * The delay over the cadence. Common practice (the product's rule before): a delay spanning three
 * visit intervals is measured; one shorter than the spacing of the visits is not.
 */
export const DELAY_CADENCE_RULE: RatioRule = { feasibleAt: 3, marginalAt: 1 };

/** Observing seasons of the target in the cycle. Our rule: one season can give a delay; none cannot. */
export const DELAY_SEASONS_RULE: RatioRule = { feasibleAt: 1, marginalAt: 1 };

// ── Relativistic orbit ────────────────────────────────────────────────────────────────────────────

/**
 * Half-width of the periapsis campaign, in periods: the passage ± 10 % of the period (our rule, the
 * window of the product's issue: for S2, ±1.6 yr, it holds the swing through periapsis where the
 * redshift and the orbit's turn are measured, GRAVITY Collaboration 2018, 2020).
 */
export const PERIAPSIS_WINDOW_FRACTION = 0.1;

/**
 * The next periapsis passage against the site's observing seasons (our rule): in a season, feasible;
 * outside the seasons (or the cycle) with usable time within the periapsis window, marginal — the
 * approach to or the recession from periapsis is observed, not the passage; no usable time within the
 * window, infeasible. Units: days.
 */
export function periapsisSeasonVerdict(isInSeason: boolean, daysToUsableTime: number | null, windowHalfWidthDays: number): KnownVerdict {
  if (isInSeason) return "feasible";
  return daysToUsableTime !== null && daysToUsableTime <= windowHalfWidthDays ? "marginal" : "infeasible";
}

/**
 * Visits within the periapsis window. Our rule: ten trace the passage (more than the orbit's elements
 * and the relativistic term a fit frees, on both sides of periapsis); three give it before, at and
 * after periapsis.
 */
export const PERIAPSIS_EPOCHS_RULE: RatioRule = { feasibleAt: 10, marginalAt: 3 };

/**
 * Significance of the apoapsis shift per orbit over the epochs of the periapsis window, (shift/σ)√N.
 * Common practice: 5σ is a detection, 3σ evidence; combining the N epochs as σ/√N is our rule (the
 * orbit's orientation before and after the passage is fitted from them, against an orbit known from
 * earlier epochs).
 */
export const PRECESSION_SIGNAL_RULE: RatioRule = { feasibleAt: 5, marginalAt: 3 };

/**
 * The combined redshift at periapsis over the spectroscopic precision of one epoch. Common practice:
 * 5σ is a detection, 3σ evidence; asking it of one epoch at periapsis is our rule (several epochs near
 * periapsis combine, but there the Newtonian radial velocity they are fitted with changes fast).
 */
export const REDSHIFT_SIGNAL_RULE: RatioRule = { feasibleAt: 5, marginalAt: 3 };

// ── The default science case ──────────────────────────────────────────────────────────────────────

/**
 * A compact lens whose shadow spans at least this many λ/B is taken as a horizon-scale target (our
 * rule: the shadow rule's marginal threshold).
 */
export const HORIZON_DEFAULT_MIN_BEAMS = SHADOW_RULE.marginalAt;

/**
 * A compact lens seen at u ≥ 1 (magnification under 1.34), whose largest centroid shift is at least
 * this many times the precision per epoch, is taken as an astrometric target (our rule: such lenses,
 * nearby stars passing a background star, are found by their shift; K. C. Sahu et al. 2017, Science
 * 356, 1046, from memory).
 */
export const ASTROMETRIC_DEFAULT_MIN_PRECISIONS = ASTROMETRIC_EPOCH_RULE.marginalAt;
/** The least source offset (θ_E) of that astrometric default: u = 1, A = 1.34. */
export const ASTROMETRIC_DEFAULT_MIN_OFFSET_THETA_E = 1;

// ── A case's overall verdict ──────────────────────────────────────────────────────────────────────

/**
 * The verdict of a case from its answers (our rule): infeasible if any answer is, else marginal if
 * any is, else unknown while an answer lacks its input, else feasible. No answers: unknown.
 */
export function caseVerdictOf(answers: readonly Verdict[]): Verdict {
  for (const worst of ["infeasible", "marginal", "unknown"] as const) if (answers.includes(worst)) return worst;
  return answers.length === 0 ? "unknown" : "feasible";
}

// ── Photon budget ─────────────────────────────────────────────────────────────────────────────────

/**
 * Depth: the S/N the worst visit the case needs reaches in the exposure a visit leaves, over the
 * team's S/N goal. Our rule: the goal at every visit is feasible; half the goal at the worst visit
 * is marginal (the light curve or image is still measured there, at twice the error asked for);
 * less is infeasible. A visit whose exposure saturates the brightest pixel makes the answer at most
 * marginal: the exposure must be split into shorter ones, which adds read noise and overheads
 * (common practice).
 */
export const DEPTH_RULE: RatioRule = { feasibleAt: 1, marginalAt: 0.5 };

// ── Published sources ─────────────────────────────────────────────────────────────────────────────

/**
 * The rules above that rest on a publication, each with its references (keys of lib/citations);
 * common-practice rules and our own have none. Read by the References page.
 */
export const feasibilityRuleReferences: readonly { rule: string; references: readonly CitationKey[] }[] = [
  { rule: "Peak magnification of an event (A ≥ 1.34 is u0 ≤ 1)", references: ["paczynski1986"] },
  { rule: "Resolution of an interferometer, λ/B", references: ["thompson2017"] },
  { rule: "Shadow and photon ring over λ/B", references: ["eht2019", "synge1966", "virbhadra2000"] },
  { rule: "The astrometric default case", references: ["sahu2017"] },
  { rule: "Relativistic orbit: the periapsis window and the precession and redshift signals", references: ["gravity2018", "gravity2020", "darwin1961", "einstein1915"] },
];
