/**
 * What each bench field shows beside its input as the user types: the value it will use, from the
 * quantity parser's echo (lib/physics/units.ts), so the page never formats a typed value itself.
 */

import { echoQuantity, type QuantityEcho, type QuantityKind } from "@/lib/physics";
import { EventPeakError, formatEventPeak, parseEventPeakJdUtc } from "@/lib/workspace/event-peak";
import { proposalQuantities } from "@/lib/workspace/proposal-schema";
import { quantityEcho, type QuantitySpec } from "@/lib/workspace/quantity-field";
import { targetQuantities } from "@/lib/workspace/target-schema";
import { defaultUnits, isCompactRadiusText } from "./parse-sketch";
import type { Sketch, SketchField } from "./sketch-state";

/** The fields read as a target's or a proposal's quantity: their echo is the form's, in the stored unit. */
const storedSpecs: Partial<Record<SketchField, QuantitySpec>> = {
  rstar: targetQuantities.sourceRadiusSolar,
  rho: targetQuantities.sourceRadiusThetaE,
  limb: targetQuantities.limbDarkeningU,
  lat: proposalQuantities.latitudeDeg,
  lon: proposalQuantities.longitudeDeg,
  elev: proposalQuantities.elevationM,
  horizon: proposalQuantities.horizonLimitDeg,
  airmass: proposalQuantities.airmassLimit,
  moonSep: proposalQuantities.moonMinSeparationDeg,
  moonIllum: proposalQuantities.moonMaxIllumination,
  visit: proposalQuantities.visitMinutes,
  clear: proposalQuantities.clearNightFraction,
  astrometry: proposalQuantities.astrometricPrecisionMas,
  contrast: proposalQuantities.reachableContrast,
};

/** The event peak as the date it is read as ("= 2027-07-10 00:00 UTC (JD 2461596.50)"). */
function eventPeakEcho(text: string): QuantityEcho | undefined {
  if (text.trim() === "") return undefined;
  try {
    return { ok: true, text: `= ${formatEventPeak(parseEventPeakJdUtc(text))}`, assumedUnit: false };
  } catch (error) {
    if (!(error instanceof EventPeakError)) throw error;
    return { ok: false, message: error.message };
  }
}

/** The quantity each typed field holds (β depends on how it is given). */
const fieldKinds = {
  mass: "mass",
  sigma: "velocity",
  dl: "distance",
  ds: "distance",
  zl: "number",
  zs: "number",
  h0: "number",
  om0: "number",
  mu: "proper motion",
  fwhm: "angle",
  lambda: "wavelength",
  baseline: "length",
  cadence: "time",
  campaign: "time",
  rays: "number",
  bmin: "number",
  bmax: "number",
  radius: "length",
} as const satisfies Partial<Record<SketchField, QuantityKind>>;

/**
 * The echo of `field`'s text (which says so when a bare number was taken in the field's unit);
 * undefined for choice fields.
 */
export function fieldEcho(sketch: Sketch, field: SketchField): QuantityEcho | undefined {
  if (field === "radius" && isCompactRadiusText(sketch.radius)) {
    return { ok: true, text: "= compact object (no surface outside its photon sphere)", assumedUnit: false };
  }
  if (field === "t0") return eventPeakEcho(sketch.t0);
  const spec = storedSpecs[field];
  if (spec !== undefined) {
    const echo = quantityEcho(spec, sketch[field]);
    return echo === null ? undefined : echo.ok ? { ok: true, text: echo.text, assumedUnit: false } : echo;
  }
  const kind: QuantityKind | undefined = field === "beta" ? (sketch.betaUnit === "angle" ? "angle" : "number") : (fieldKinds as Partial<Record<SketchField, QuantityKind>>)[field];
  if (kind === undefined) return undefined;
  const defaultUnit = kind === "number" ? undefined : (defaultUnits as Partial<Record<SketchField, string>>)[field];
  return echoQuantity(kind, sketch[field], defaultUnit === undefined ? undefined : { defaultUnit });
}
