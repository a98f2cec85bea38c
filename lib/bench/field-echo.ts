/**
 * What each bench field shows beside its input as the user types: the value it will use, from the
 * quantity parser's echo (lib/physics/units.ts), so the page never formats a typed value itself.
 */

import { echoQuantity, type QuantityEcho, type QuantityKind } from "@/lib/physics";
import { defaultUnits, isCompactRadiusText } from "./parse-sketch";
import type { Sketch, SketchField } from "./sketch-state";

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
  t0: "time",
  u0: "number",
  fwhm: "angle",
  lambda: "wavelength",
  baseline: "length",
  cadence: "time",
  campaign: "time",
  rays: "number",
  bmin: "number",
  bmax: "number",
  radius: "length",
  rstar: "length",
} as const satisfies Partial<Record<SketchField, QuantityKind>>;

/**
 * The echo of `field`'s text (which says so when a bare number was taken in the field's unit);
 * undefined for choice fields.
 */
export function fieldEcho(sketch: Sketch, field: SketchField): QuantityEcho | undefined {
  if (field === "radius" && isCompactRadiusText(sketch.radius)) {
    return { ok: true, text: "= compact object (no surface outside its photon sphere)", assumedUnit: false };
  }
  const kind: QuantityKind | undefined = field === "beta" ? (sketch.betaUnit === "angle" ? "angle" : "number") : (fieldKinds as Partial<Record<SketchField, QuantityKind>>)[field];
  if (kind === undefined) return undefined;
  const defaultUnit = kind === "number" ? undefined : (defaultUnits as Partial<Record<SketchField, string>>)[field];
  return echoQuantity(kind, sketch[field], defaultUnit === undefined ? undefined : { defaultUnit });
}
