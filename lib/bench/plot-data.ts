/**
 * The series the bench plots draw, sampled from lib/physics: deflection against impact parameter,
 * the Paczyński light curve with the campaign's epochs, and the astrometric centroid track. The epochs
 * are the simulated schedule's visits when it is known (the ones the science case counts), else one
 * per cadence interval from the campaign's start.
 */

import {
  criticalImpactParameter,
  DAY_S,
  exactDeflection,
  pointLensImages,
  strongFieldDeflection,
  weakFieldDeflection,
} from "@/lib/physics";
import type { ObservingSchedule } from "@/lib/schedule";
import type { MicrolensingEvent } from "./compute-results";
import { eventMagnification } from "./event-magnification";

export interface CurvePoint {
  x: number;
  y: number;
}

export interface DeflectionCurves {
  criticalBOverM: number;
  exact: CurvePoint[];
  weakField: Record<1 | 2 | 3, CurvePoint[]>;
  strongField: CurvePoint[];
}

const DEFLECTION_POINTS = 240;
/** From just outside b_c (where α is already ~7 rad) out to where α is a few parts in 10^4. */
const DEFLECTION_MIN_EXCESS = 1e-3;
const DEFLECTION_MAX_B_OVER_M = 1e4;
/** The strong-deflection limit is drawn only near b_c, where it applies. */
const STRONG_FIELD_MAX_B_OVER_BC = 3;

/** α(b) on log axes for b/M from b_c (1 + 1e-3) to 1e4, in units of M (the curves do not depend on M). */
export function deflectionCurves(): DeflectionCurves {
  const criticalBOverM = criticalImpactParameter(1);
  const logLow = Math.log10(criticalBOverM * (1 + DEFLECTION_MIN_EXCESS));
  const logHigh = Math.log10(DEFLECTION_MAX_B_OVER_M);
  const exact: CurvePoint[] = [];
  const weakField: DeflectionCurves["weakField"] = { 1: [], 2: [], 3: [] };
  const strongField: CurvePoint[] = [];
  for (let i = 0; i < DEFLECTION_POINTS; i++) {
    const b = 10 ** (logLow + ((logHigh - logLow) * i) / (DEFLECTION_POINTS - 1));
    exact.push({ x: b, y: exactDeflection(b, 1) });
    for (const order of [1, 2, 3] as const) weakField[order].push({ x: b, y: weakFieldDeflection(b, 1, order) });
    if (b <= STRONG_FIELD_MAX_B_OVER_BC * criticalBOverM) {
      const alpha = strongFieldDeflection(b, 1);
      if (alpha > 0) strongField.push({ x: b, y: alpha });
    }
  }
  return { criticalBOverM, exact, weakField, strongField };
}

export interface LightCurve {
  /** Magnification against days from the campaign start. */
  curve: CurvePoint[];
  /** The campaign's epochs (the schedule's visits, else every cadence interval) with the magnification each would see. */
  epochs: CurvePoint[];
  peakTimeDays: number;
  campaignDays: number;
  /** Somewhere the source's size moves the curve by more than 1% from a point source's (event-magnification). */
  isLimitedBySourceSize: boolean;
}

const LIGHT_CURVE_POINTS = 400;
/** An epoch list longer than this is thinned for drawing (the science case still counts every visit). */
const MAX_DRAWN_EPOCHS = 600;

/**
 * The campaign's epochs, seconds from its start, thinned to at most `MAX_DRAWN_EPOCHS`: the schedule's
 * visit starts inside the campaign when a schedule is given and the campaign has a date, else every
 * cadence interval.
 */
function epochTimesS(event: MicrolensingEvent, schedule: Pick<ObservingSchedule, "visitsJdUtc"> | undefined): number[] {
  const times: number[] = [];
  if (schedule !== undefined && event.campaignStartJdUtc !== null) {
    for (const jd of schedule.visitsJdUtc) {
      const timeS = (jd - event.campaignStartJdUtc) * DAY_S;
      if (timeS >= 0 && timeS <= event.campaignS) times.push(timeS);
    }
  } else {
    const epochCount = Math.floor(event.campaignS / event.cadenceS) + 1;
    for (let k = 0; k < epochCount; k++) times.push(k * event.cadenceS);
  }
  const stride = Math.max(1, Math.ceil(times.length / MAX_DRAWN_EPOCHS));
  return times.filter((_, index) => index % stride === 0);
}

/**
 * The light curve A(t) with u(t)² = u0² + ((t − t0)/t_E)² (Paczyński 1986), as an observer sees it:
 * a uniform source disk's finite-source magnification, images behind the lens's body left out (event-magnification).
 */
export function lightCurve(event: MicrolensingEvent, schedule?: Pick<ObservingSchedule, "visitsJdUtc">): LightCurve {
  const { campaignS, peakTimeS, einsteinTimeS, u0ThetaE } = event;
  const magnificationAt = (timeS: number) => eventMagnification(Math.hypot(u0ThetaE, (timeS - peakTimeS) / einsteinTimeS), event);
  const curve: CurvePoint[] = [];
  let isLimitedBySourceSize = magnificationAt(peakTimeS).isLimitedBySourceSize;
  for (let i = 0; i < LIGHT_CURVE_POINTS; i++) {
    const timeS = (campaignS * i) / (LIGHT_CURVE_POINTS - 1);
    const point = magnificationAt(timeS);
    isLimitedBySourceSize ||= point.isLimitedBySourceSize;
    curve.push({ x: timeS / DAY_S, y: point.magnification });
  }
  const epochs = epochTimesS(event, schedule).map((timeS) => ({ x: timeS / DAY_S, y: magnificationAt(timeS).magnification }));
  return { curve, epochs, peakTimeDays: peakTimeS / DAY_S, campaignDays: campaignS / DAY_S, isLimitedBySourceSize };
}

/** A centroid shift (x along the lens–source motion, y across it, θ_E) at a time, days from the campaign start. */
export interface TrackPoint extends CurvePoint {
  timeDays: number;
}

/** Centroid shift on the sky in units of θ_E: along the lens–source vector (τ, u0), length u/(u²+2). */
export interface AstrometricTrack {
  track: TrackPoint[];
  epochs: TrackPoint[];
}

function centroidAt(timeS: number, event: MicrolensingEvent): TrackPoint {
  const tau = (timeS - event.peakTimeS) / event.einsteinTimeS;
  const u = Math.hypot(tau, event.u0ThetaE);
  const shift = pointLensImages(u).centroidShift;
  return { x: (shift * tau) / u, y: (shift * event.u0ThetaE) / u, timeDays: timeS / DAY_S };
}

/** The track from t0 − 6 t_E to t0 + 6 t_E (nearly the whole ellipse), and the campaign's epochs on it. */
export function astrometricTrack(event: MicrolensingEvent, schedule?: Pick<ObservingSchedule, "visitsJdUtc">): AstrometricTrack {
  const track: TrackPoint[] = [];
  const span = 6 * event.einsteinTimeS;
  for (let i = 0; i < LIGHT_CURVE_POINTS; i++) {
    track.push(centroidAt(event.peakTimeS - span + (2 * span * i) / (LIGHT_CURVE_POINTS - 1), event));
  }
  return { track, epochs: epochTimesS(event, schedule).map((timeS) => centroidAt(timeS, event)) };
}
