/**
 * The event a schedule timeline draws over the cycle: a microlensing light curve A(t) from the
 * lensing layer, or, for time-delay monitoring, an illustrative flare of the source as the two images
 * show it Δt apart. Times are Julian dates UTC, spans in days.
 */
import { eventMagnificationAtOffset } from "@/lib/lensing/microlensing";

export interface TimelinePoint {
  jdUtc: number;
  value: number;
}

export interface TimeSpan {
  startJdUtc: number;
  endJdUtc: number;
}

/** A microlensing event as the light curve needs it. */
export interface LightCurveEvent {
  /** t0, JD UTC. */
  peakJdUtc: number;
  /** t_E, days, > 0. */
  einsteinTimeDays: number;
  /** u0, units of θ_E, ≥ 0. */
  impactParameterThetaE: number;
  /** ρ, units of θ_E; null or 0 for a point source. */
  sourceRadiusThetaE: number | null;
  /** Linear limb-darkening coefficient a, 0 ≤ a ≤ 1 (used with ρ only). */
  limbDarkeningU: number;
}

/** Samples over the whole span: about two pixels apart on a 760-pixel chart (finite-source points cost up to 0.3 ms). */
const SPAN_SAMPLES = 361;
/** Samples across the peak, t0 ± 3 max(u0, ρ) t_E, so a peak narrower than the span's step is drawn whole. */
const PEAK_SAMPLES = 64;
const PEAK_HALF_WIDTHS = 3;

/** Sample times: evenly over the span, densely over [centre ± halfWidth] inside it, and the centre itself; ascending. */
function sampleTimes(span: TimeSpan, centresJdUtc: readonly number[], halfWidthDays: number): number[] {
  const { startJdUtc, endJdUtc } = span;
  const times: number[] = [];
  for (let i = 0; i < SPAN_SAMPLES; i++) times.push(startJdUtc + ((endJdUtc - startJdUtc) * i) / (SPAN_SAMPLES - 1));
  for (const centre of centresJdUtc) {
    for (let i = 0; i <= PEAK_SAMPLES; i++) times.push(centre - halfWidthDays + (2 * halfWidthDays * i) / PEAK_SAMPLES);
  }
  return times.filter((jd) => jd >= startJdUtc && jd <= endJdUtc).sort((a, b) => a - b);
}

export interface LightCurveTimeline {
  /** A(t) over the span, finite values only (a point source at u0 = 0 has no finite peak). */
  points: TimelinePoint[];
  /** A at each of `markJdUtc`. */
  marks: TimelinePoint[];
  /** A(t0) when t0 lies in the span and the peak is finite; else null. */
  peak: TimelinePoint | null;
}

/**
 * The light curve A(t), u(t)² = u0² + ((t − t0)/t_E)² (Paczyński 1986), over `span`, and its values
 * at the times `markJdUtc` (the visits).
 */
export function lightCurveTimeline(event: LightCurveEvent, span: TimeSpan, markJdUtc: readonly number[]): LightCurveTimeline {
  const { peakJdUtc, einsteinTimeDays, impactParameterThetaE: u0 } = event;
  const at = (jdUtc: number): TimelinePoint => ({ jdUtc, value: eventMagnificationAtOffset(Math.hypot(u0, (jdUtc - peakJdUtc) / einsteinTimeDays), event) });
  const peakHalfWidthDays = PEAK_HALF_WIDTHS * Math.max(u0, event.sourceRadiusThetaE ?? 0) * einsteinTimeDays;
  const points = sampleTimes(span, [peakJdUtc], peakHalfWidthDays).map(at).filter((point) => Number.isFinite(point.value));
  const isPeakInSpan = peakJdUtc >= span.startJdUtc && peakJdUtc <= span.endJdUtc;
  const peak = isPeakInSpan ? at(peakJdUtc) : null;
  return { points, marks: markJdUtc.map(at).filter((point) => Number.isFinite(point.value)), peak: peak !== null && Number.isFinite(peak.value) ? peak : null };
}

/** The illustrative flare: its height (mag) and its width from the delay, within these bounds (days). */
const FLARE_MAG = 0.3;
const MIN_FLARE_SIGMA_DAYS = 1;
const MAX_FLARE_SPAN_SHARE = 1 / 15;

export interface DelayedImagesTimeline {
  /** Brightness of each image over the span relative to the leading image's quiet level, mag (brighter is higher). */
  leading: TimelinePoint[];
  trailing: TimelinePoint[];
  /** Each image's brightness at `markJdUtc`. */
  leadingMarks: TimelinePoint[];
  trailingMarks: TimelinePoint[];
  /** When the leading image shows the flare, and when the trailing one does, JD UTC. */
  flareJdUtc: number;
  echoJdUtc: number;
  /** The trailing image's quiet level: −2.5 log₁₀(flux ratio), mag. */
  trailingOffsetMag: number;
}

/**
 * Illustrative, not a model of the source: one flare of the source (a Gaussian of 0.3 mag, σ a
 * third of the delay, from 1 day to a fifteenth of the span) as the two images show it. The leading
 * (brighter) image shows it at `flareJdUtc`, the trailing one `delayDays` later and fainter by the
 * flux ratio (brighter over fainter), 2.5 log₁₀ ratio mag. The brighter image leads for the point mass
 * and the isothermal sphere: it is the minimum of the arrival-time surface (lensing texts, e.g.
 * Schneider, Ehlers & Falco 1992; from memory).
 */
export function delayedImagesTimeline(delayDays: number, fluxRatio: number, flareJdUtc: number, span: TimeSpan, markJdUtc: readonly number[]): DelayedImagesTimeline {
  const sigmaDays = Math.min(Math.max(delayDays / 3, MIN_FLARE_SIGMA_DAYS), (span.endJdUtc - span.startJdUtc) * MAX_FLARE_SPAN_SHARE);
  const echoJdUtc = flareJdUtc + delayDays;
  const trailingOffsetMag = -2.5 * Math.log10(fluxRatio);
  const flare = (jdUtc: number, centre: number) => FLARE_MAG * Math.exp(-0.5 * ((jdUtc - centre) / sigmaDays) ** 2);
  const leadingAt = (jdUtc: number): TimelinePoint => ({ jdUtc, value: flare(jdUtc, flareJdUtc) });
  const trailingAt = (jdUtc: number): TimelinePoint => ({ jdUtc, value: trailingOffsetMag + flare(jdUtc, echoJdUtc) });
  const times = sampleTimes(span, [flareJdUtc, echoJdUtc], PEAK_HALF_WIDTHS * sigmaDays);
  return {
    leading: times.map(leadingAt),
    trailing: times.map(trailingAt),
    leadingMarks: markJdUtc.map(leadingAt),
    trailingMarks: markJdUtc.map(trailingAt),
    flareJdUtc,
    echoJdUtc,
    trailingOffsetMag,
  };
}
