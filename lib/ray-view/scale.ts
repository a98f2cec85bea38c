/**
 * The scale of the 3D ray view and of its saved figure: rings in the rays' plane at the horizon
 * (r = 2M), the photon sphere (r = 3M) or the lens's surface, and at round radii, each labelled in
 * units of M and, for a known mass, in the readable physical unit; and the scale bar's length.
 * Lengths in units of M = GM/c². Pure (no DOM), for the view, the figure and their tests.
 */
import { SOLAR_MASS_LENGTH_M } from "@/lib/physics";
import { formatInUnit, naturalLengthUnit } from "../bench/display-units";
import { formatSignificant, roundToSignificant } from "@/lib/numbers/significant";

/** Horizon and photon-sphere radii of a Schwarzschild mass, units of M. */
const HORIZON_M = 2;
const PHOTON_SPHERE_M = 3;

/** Fewest round rings wanted inside the outer radius (our rule: enough to read a distance off). */
const MIN_ROUND_RINGS = 3;

/** Round rings nearer the photon sphere than this (units of M) would crowd its label, and are left out. */
const INNER_CLEAR_M = 4;

export type ScaleRingKind = "horizon" | "photon-sphere" | "surface" | "round";

export interface ScaleRing {
  kind: ScaleRingKind;
  radiusM: number;
  /** What the ring is, in M: "horizon, r = 2 M", "50 M". */
  label: string;
  /** The same radius for the mass (e.g. "73.83 km"); undefined when the mass is unknown. */
  physical: string | undefined;
}

/** `lengthM` (units of M = GM/c²) for a mass of `massSolar` M☉, in the readable unit: "14.77 km", "0.6595 au". */
export function physicalLengthText(lengthM: number, massSolar: number): string {
  const metres = lengthM * massSolar * SOLAR_MASS_LENGTH_M;
  return formatInUnit("length", metres, naturalLengthUnit(metres));
}

/**
 * The longest of 1, 2 or 5 × 10ⁿ that is at most `longest` (common practice for map and micrograph
 * scale bars and axis ticks).
 */
export function roundDownToNice(longest: number): number {
  const decade = 10 ** Math.floor(Math.log10(longest));
  return [5, 2, 1].map((step) => step * decade).find((length) => length <= longest * (1 + 1e-12)) ?? decade;
}

/** The scale bar's length, units of M: the longest round length spanning at most `maxPx` pixels at `pxPerM`. */
export function scaleBarLengthM(pxPerM: number, maxPx: number): number {
  return roundDownToNice(maxPx / pxPerM);
}

/**
 * The rings of the view's scale out to `outerRadiusM`: for a compact lens (no surface outside its
 * photon sphere, `surfaceRadiusM` 0) the horizon and the photon sphere, else the lens's surface; then
 * every multiple of a round step (1, 2 or 5 × 10ⁿ M, at least MIN_ROUND_RINGS of them) up to the
 * outer radius, outside the lens. `massSolar` undefined: labels in M only.
 */
export function scaleRings(outerRadiusM: number, surfaceRadiusM: number, massSolar: number | undefined): ScaleRing[] {
  const ring = (kind: ScaleRingKind, radiusM: number, label: string): ScaleRing => ({
    kind,
    radiusM,
    label,
    physical: massSolar === undefined ? undefined : physicalLengthText(radiusM, massSolar),
  });
  const rings =
    surfaceRadiusM > 0
      ? [ring("surface", surfaceRadiusM, `lens surface, R = ${formatSignificant(surfaceRadiusM, 3)} M`)]
      : [ring("horizon", HORIZON_M, `horizon, r = ${HORIZON_M} M`), ring("photon-sphere", PHOTON_SPHERE_M, `photon sphere, r = ${PHOTON_SPHERE_M} M`)];
  if (!(outerRadiusM > 0) || !Number.isFinite(outerRadiusM)) return rings;
  const stepM = roundDownToNice(outerRadiusM / MIN_ROUND_RINGS);
  const innerM = Math.max(INNER_CLEAR_M, surfaceRadiusM);
  for (let k = 1; k * stepM <= outerRadiusM * (1 + 1e-9); k++) {
    const radiusM = roundToSignificant(k * stepM, 12);
    if (radiusM > innerM) rings.push(ring("round", radiusM, `${formatSignificant(radiusM)} M`));
  }
  return rings;
}

/** A ring's label as one line: "50 M = 73.83 km", or the M label alone. */
export const ringLabelText = (ring: ScaleRing): string => (ring.physical === undefined ? ring.label : `${ring.label} = ${ring.physical}`);

/**
 * Where a ring's label stands, in the view and on the saved figure alike: the point of the ring at
 * `angleRad` in the rays' plane (from +x toward +y), and the side of that point the text extends to.
 * The horizon's and photon sphere's labels lean apart (lower left, lower right) so they stay legible
 * when both rings are a few pixels wide; the round rings are labelled on the diagonal toward the
 * source (upper left), where neighbouring labels stand apart in height as well as in width (on the
 * axis, those of 10 M steps overlapped).
 */
export function ringLabelPlacement(ring: Pick<ScaleRing, "kind">): { angleRad: number; side: "left" | "right" } {
  if (ring.kind === "horizon") return { angleRad: (5 * Math.PI) / 4, side: "left" };
  if (ring.kind === "round") return { angleRad: (3 * Math.PI) / 4, side: "left" };
  return { angleRad: -Math.PI / 4, side: "right" };
}

/** Reach of the axis toward the observer beyond the rays' furthest x (share of it; our choice). */
const OBSERVER_AXIS_OVERSHOOT = 0.08;

/** The tip (x, units of M) of the axis drawn from the lens toward the distant observer (+x). */
export const observerAxisTipM = (extentMaxXM: number): number => (1 + OBSERVER_AXIS_OVERSHOOT) * Math.max(extentMaxXM, PHOTON_SPHERE_M);

/** The label of the axis toward the observer. */
export const OBSERVER_AXIS_LABEL = "to observer (+x)";
