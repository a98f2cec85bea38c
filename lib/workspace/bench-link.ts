import { lensParametersOf, sourceOffsetThetaEOf, tidy, type SketchInputs } from "@/lib/bench/parse-sketch";
import { demoSketch, sketchToQueryString, type Sketch } from "@/lib/bench/sketch-state";
import type { LensParameterKey } from "@/lib/lensing/lens-model";
import { lensParameters } from "@/lib/lensing/registry";
import { DEFAULT_COSMOLOGY, JULIAN_YEAR_S, MILLIARCSECOND_RAD } from "@/lib/physics";
import type { FeasibilitySettings } from "@/lib/workspace/derived";
import type { LensHypothesis } from "@/lib/workspace/target-schema";
import { eventPeakText } from "@/lib/workspace/event-peak";
import { degreesFieldText } from "@/lib/workspace/coordinates";

/** What "Open in the lens bench" reads of a target: its hypothesis and its position (ICRS degrees). */
export interface BenchTarget extends LensHypothesis {
  raDeg: number;
  decDeg: number;
}

/** A stored number as the bench reads it back exactly: the shortest decimal that parses to it; "" when not set. */
const typed = (value: number | null | undefined, unit?: string) => (value == null ? "" : unit === undefined ? String(value) : `${value} ${unit}`);

/**
 * The sketch of a target under its proposal: every stored input of the target (lens, geometry, β as
 * u0, proper motion, position, science case, event peak, source size, limb darkening) and every
 * setting of the proposal the grading reads (instrument, interferometer, site, cycle, observing
 * constraints). A value the target or proposal does not have is an empty field, never the demo's.
 * Fields the target and proposal know nothing of (the ray bundle, the lens's body) keep the bench's
 * own defaults: a target's lens is compact.
 */
export function benchSketchOf(h: BenchTarget, proposal: FeasibilitySettings): Sketch {
  const isRedshift = h.lensRedshift != null && h.sourceRedshift != null;
  const { site, instrument } = proposal;
  return {
    ...demoSketch,
    lens: h.lensModel,
    mass: typed(h.lensMassSolar, "Msun"),
    sigma: typed(h.velocityDispersionKmPerS, "km/s"),
    geometry: isRedshift ? "redshift" : "distance",
    dl: typed(h.lensDistancePc, "pc"),
    ds: typed(h.sourceDistancePc, "pc"),
    zl: typed(h.lensRedshift),
    zs: typed(h.sourceRedshift),
    h0: String(DEFAULT_COSMOLOGY.H0),
    om0: String(DEFAULT_COSMOLOGY.Om0),
    beta: String(h.sourceOffsetThetaE),
    betaUnit: "thetaE",
    mu: typed(h.properMotionMasPerYr, "mas/yr"),
    ra: degreesFieldText(h.raDeg),
    dec: degreesFieldText(h.decDeg),
    case: h.scienceCase ?? "inferred",
    t0: h.eventPeakJdUtc == null ? "" : eventPeakText(h.eventPeakJdUtc),
    rstar: typed(h.sourceRadiusSolar),
    rho: typed(h.sourceRadiusThetaE),
    limb: typed(h.limbDarkeningU),
    fwhm: typed(instrument.resolutionMas, "mas"),
    lambda: typed(instrument.interferometerWavelengthMm, "mm"),
    baseline: typed(instrument.interferometerBaselineKm, "km"),
    astrometry: typed(instrument.astrometricPrecisionMas),
    contrast: typed(instrument.reachableContrast),
    site: site.name,
    lat: typed(site.latitudeDeg),
    lon: typed(site.longitudeDeg),
    elev: typed(site.elevationM),
    horizon: typed(site.horizonLimitDeg),
    cycleStart: proposal.cycleStartDate ?? "",
    cycleEnd: proposal.cycleEndDate ?? "",
    airmass: typed(instrument.airmassLimit),
    moonSep: typed(instrument.moonMinSeparationDeg),
    moonIllum: typed(instrument.moonMaxIllumination),
    cadence: typed(instrument.cadenceHours, "h"),
    visit: typed(instrument.visitMinutes),
    clear: typed(instrument.clearNightFraction),
    campaign: typed(instrument.campaignLengthDays, "d"),
    radius: "compact",
    units: "",
  };
}

/** The lens bench URL that opens a target with its proposal's instrument, site and cycle (`benchSketchOf`). */
export function benchLink(h: BenchTarget, proposal: FeasibilitySettings): string {
  return `/bench?${sketchToQueryString(benchSketchOf(h, proposal))}`;
}

/** Every lens parameter of a target: the sketch's model's, tidied, and null for the others. */
function storedParameters(inputs: SketchInputs): Record<LensParameterKey, number | null> {
  const given: Partial<Record<LensParameterKey, number>> = lensParametersOf(inputs.lens);
  return Object.fromEntries(lensParameters.map(({ key }) => [key, given[key] === undefined ? null : tidy(given[key])])) as Record<LensParameterKey, number | null>;
}

/**
 * The reverse of `benchSketchOf`: the hypothesis a parsed sketch describes, as a target stores it. It
 * is what the bench grades (`lib/bench/case-report.ts`) and what "Save as target" sends, so the bench
 * and the saved target answer from the same inputs. β typed as an angle becomes units of θ_E. A
 * redshift sketch keeps its redshifts; the target then uses the physics module's default cosmology,
 * whatever H0 and Ωm the sketch had.
 */
export function hypothesisFromSketch(inputs: SketchInputs): LensHypothesis {
  const { geometry, redshifts, event } = inputs;
  const { muRelRadPerS } = inputs.lightCurve;
  return {
    lensModel: inputs.lens.model,
    ...storedParameters(inputs),
    lensDistancePc: redshifts === null ? tidy(geometry.dLensPc) : null,
    sourceDistancePc: redshifts === null ? tidy(geometry.dSourcePc) : null,
    lensRedshift: redshifts?.lens ?? null,
    sourceRedshift: redshifts?.source ?? null,
    sourceOffsetThetaE: tidy(sourceOffsetThetaEOf(inputs)),
    properMotionMasPerYr: muRelRadPerS === null ? null : tidy((muRelRadPerS * JULIAN_YEAR_S) / MILLIARCSECOND_RAD),
    scienceCase: event.scienceCase,
    eventPeakJdUtc: event.eventPeakJdUtc,
    sourceRadiusSolar: event.sourceRadiusSolar,
    sourceRadiusThetaE: event.sourceRadiusThetaE,
    limbDarkeningU: event.limbDarkeningU,
  };
}

/**
 * The body of "Save as target" (without name, priority and tags, which the save form asks for): the
 * hypothesis, and the position as the sketch has it typed, which the targets API reads with the same
 * coordinate reader as the bench.
 */
export function targetBodyFromSketch(sketch: Sketch, inputs: SketchInputs): LensHypothesis & { ra: string; dec: string } {
  return { ...hypothesisFromSketch(inputs), ra: sketch.ra, dec: sketch.dec };
}
