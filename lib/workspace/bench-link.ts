import { lensParametersOf, parsePlainNumber, type SketchInputs } from "@/lib/bench/parse-sketch";
import type { LensParameterKey } from "@/lib/lensing/lens-model";
import { lensParameters } from "@/lib/lensing/registry";
import type { Sketch } from "@/lib/bench/sketch-state";
import { JULIAN_YEAR_S, MILLIARCSECOND_RAD } from "@/lib/physics";
import type { InstrumentDefaults } from "@/lib/workspace/proposal-schema";
import type { LensHypothesis } from "@/lib/workspace/target-schema";

/**
 * The lens bench URL that opens a target's hypothesis with its proposal's instrument: the bench keeps
 * its inputs as typed text with units, so each value is written with its unit.
 */
export function benchLink(h: LensHypothesis, instrument: InstrumentDefaults): string {
  const query = new URLSearchParams({ lens: h.lensModel, beta: String(h.sourceOffsetThetaE), betaUnit: "thetaE" });
  if (h.lensMassSolar != null) query.set("mass", `${h.lensMassSolar} Msun`);
  if (h.velocityDispersionKmPerS != null) query.set("sigma", `${h.velocityDispersionKmPerS} km/s`);
  if (h.lensRedshift != null && h.sourceRedshift != null) {
    query.set("geometry", "redshift");
    query.set("zl", String(h.lensRedshift));
    query.set("zs", String(h.sourceRedshift));
  } else if (h.lensDistancePc != null && h.sourceDistancePc != null) {
    query.set("geometry", "distance");
    query.set("dl", `${h.lensDistancePc} pc`);
    query.set("ds", `${h.sourceDistancePc} pc`);
  }
  if (h.properMotionMasPerYr != null) query.set("mu", `${h.properMotionMasPerYr} mas/yr`);
  query.set("resolution", "fwhm");
  query.set("fwhm", `${instrument.resolutionMas} mas`);
  query.set("cadence", `${instrument.cadenceHours} h`);
  query.set("campaign", `${instrument.campaignLengthDays} d`);
  return `/bench?${query}`;
}

/** Twelve significant digits: unit conversions ("4 kpc" → 3999.9999999999995 pc) come back as typed. */
const tidy = (value: number) => Number(value.toPrecision(12));

/** Every lens parameter of a target: the sketch's model's, tidied, and null for the others. */
function storedParameters(inputs: SketchInputs): Record<LensParameterKey, number | null> {
  const given: Partial<Record<LensParameterKey, number>> = lensParametersOf(inputs.lens);
  return Object.fromEntries(lensParameters.map(({ key }) => [key, given[key] === undefined ? null : tidy(given[key])])) as Record<LensParameterKey, number | null>;
}

/**
 * The reverse of `benchLink`: the hypothesis a bench sketch describes, for saving it as a target. It
 * reads the same keys (`lens`, `mass`/`sigma`, `geometry` with `dl`/`ds` or `zl`/`zs`, `beta`, `mu`)
 * after the bench has parsed them with their units. `betaThetaE` is β in units of θ_E as the bench
 * computed it, since a β typed as an angle needs the lens solved first. A redshift sketch keeps its
 * redshifts; the target then uses the physics module's default cosmology, whatever H0 and Ωm the
 * sketch had.
 */
export function hypothesisFromSketch(sketch: Sketch, inputs: SketchInputs, betaThetaE: number): LensHypothesis {
  const isRedshift = sketch.geometry === "redshift";
  return {
    lensModel: inputs.lens.model,
    ...storedParameters(inputs),
    lensDistancePc: isRedshift ? null : tidy(inputs.geometry.dLensPc),
    sourceDistancePc: isRedshift ? null : tidy(inputs.geometry.dSourcePc),
    lensRedshift: isRedshift ? inputs.geometry.zLens : null,
    sourceRedshift: isRedshift ? parsePlainNumber(sketch.zs) : null,
    sourceOffsetThetaE: tidy(betaThetaE),
    properMotionMasPerYr: tidy((inputs.lightCurve.muRelRadPerS * JULIAN_YEAR_S) / MILLIARCSECOND_RAD),
  };
}
