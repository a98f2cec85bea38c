/**
 * Colouring the rays of the 3D view by a chosen quantity: by fate (each fate its colour and dash), or
 * by the escaped rays' deflection angle or arrival time on the cividis ramp (Nuñez, Anderton &
 * Renslow 2018, PLOS ONE 13, e0199239: monotonic in lightness and readable with colour-vision
 * deficiency), on a logarithmic scale with labelled round values, so the legend reads without colour.
 * Rays that did not escape have neither quantity: they keep their fate's dash in a neutral grey.
 * Pure (no DOM), shared by the view, its legend and the saved figure.
 */
import { interpolateCividis, rgb } from "d3";
import type { AssembledBundle } from "./assemble-bundle";
import { formatSignificant, roundToSignificant } from "@/lib/numbers/significant";

export type RayColouring = "fate" | "deflection" | "arrival";

export const RAY_COLOURINGS: readonly { value: RayColouring; label: string }[] = [
  { value: "fate", label: "Fate" },
  { value: "deflection", label: "Deflection angle" },
  { value: "arrival", label: "Arrival time" },
];

/** Which ink the colours are for: light rays on the night screen, or dark ink on a white page. */
export type RampInk = "screen" | "print";

/**
 * The part of the cividis ramp each ink uses: its darkest blues vanish on the night ground and its
 * lightest yellow on white paper (our choice of cut-offs).
 */
export const RAMP_RANGE: Record<RampInk, [number, number]> = { screen: [0.3, 1], print: [0, 0.85] };

export interface QuantityScale {
  colouring: Exclude<RayColouring, "fate">;
  /** The legend's heading, with the unit. */
  title: string;
  /** Ends of the logarithmic scale, in the title's unit (> 0). */
  min: number;
  max: number;
  /** Round values within [min, max], placed by `fraction` (0 at min, 1 at max). */
  ticks: { fraction: number; label: string }[];
}

/**
 * Each ray's value of the quantity, NaN where it has none: the deflection in degrees; the arrival time
 * as its delay over a straight ray's 2R₀ (the sphere a ray leaves through is the one it started on,
 * bundle-vertices' arrivalTimes), units of M, the Shapiro delay plus the longer bent path.
 */
export function rayQuantity(bundle: Pick<AssembledBundle, "rayDeflectionsRad" | "rayArrivalTimesM" | "startRadiusM">, colouring: Exclude<RayColouring, "fate">): Float32Array {
  if (colouring === "deflection") return bundle.rayDeflectionsRad.map((radians) => (radians * 180) / Math.PI);
  return bundle.rayArrivalTimesM.map((arrivalM) => arrivalM - 2 * bundle.startRadiusM);
}

const TITLES: Record<QuantityScale["colouring"], string> = {
  deflection: "Deflection angle α, degrees (log scale)",
  arrival: "Arrival time: delay over a straight ray's 2R₀, units of M (log scale)",
};

/** Ticks on 1, 2, 5 × 10ⁿ inside [min, max]; with fewer than two such values, the ends themselves. */
function logTicks(min: number, max: number): QuantityScale["ticks"] {
  const fraction = (value: number) => (max > min ? Math.log(value / min) / Math.log(max / min) : 0.5);
  const ticks: QuantityScale["ticks"] = [];
  for (let decade = 10 ** Math.floor(Math.log10(min)); decade <= max; decade *= 10) {
    for (const step of [1, 2, 5]) {
      const value = roundToSignificant(step * decade, 6);
      if (value >= min * (1 - 1e-9) && value <= max * (1 + 1e-9)) ticks.push({ fraction: fraction(value), label: formatSignificant(value, 3) });
    }
  }
  if (ticks.length >= 2) return ticks;
  return [min, max].map((value) => ({ fraction: fraction(value), label: formatSignificant(value, 3) }));
}

/** The logarithmic scale of `values` (the finite, positive ones); undefined when there are none. */
export function quantityScale(values: Float32Array, colouring: QuantityScale["colouring"]): QuantityScale | undefined {
  let min = Infinity;
  let max = -Infinity;
  for (const value of values) {
    if (!(value > 0) || !Number.isFinite(value)) continue;
    min = Math.min(min, value);
    max = Math.max(max, value);
  }
  if (!(min <= max)) return undefined;
  return { colouring, title: TITLES[colouring], min, max, ticks: logTicks(min, max) };
}

/** Where `value` lies on the scale, clamped to [0, 1]; NaN when it has no value there. */
export function fractionOnScale(value: number, scale: Pick<QuantityScale, "min" | "max">): number {
  if (!(value > 0) || !Number.isFinite(value)) return Number.NaN;
  if (!(scale.max > scale.min)) return 0.5;
  return Math.min(1, Math.max(0, Math.log(value / scale.min) / Math.log(scale.max / scale.min)));
}

/** The ramp's colour at `fraction` of the scale in `ink`, as 0–255 red, green, blue. */
export function rampColour(fraction: number, ink: RampInk): [number, number, number] {
  const [from, to] = RAMP_RANGE[ink];
  const colour = rgb(interpolateCividis(from + (to - from) * fraction));
  return [Math.round(colour.r), Math.round(colour.g), Math.round(colour.b)];
}

/** CSS colours along the ramp in `ink`, for a legend's gradient (`stops` ≥ 2). */
export function rampStops(ink: RampInk, stops = 9): string[] {
  return Array.from({ length: stops }, (_, k) => `rgb(${rampColour(k / (stops - 1), ink).join(", ")})`);
}

const rgbOf = (css: string): [number, number, number] => {
  const colour = rgb(css);
  return [Math.round(colour.r), Math.round(colour.g), Math.round(colour.b)];
};

/**
 * Each ray's colour, [r, g, b] 0–255 per ray: by fate (`fateColours[code]`) when `scale` is undefined,
 * else the ramp at the ray's value, and `restColour` for a ray without one.
 */
export function rayColours(fates: Uint8Array, values: Float32Array | undefined, scale: QuantityScale | undefined, ink: RampInk, fateColours: readonly string[], restColour: string): Uint8Array {
  const colours = new Uint8Array(3 * fates.length);
  const byFate = fateColours.map(rgbOf);
  const rest = rgbOf(restColour);
  for (let ray = 0; ray < fates.length; ray++) {
    const fraction = scale === undefined || values === undefined ? Number.NaN : fractionOnScale(values[ray], scale);
    const colour = scale === undefined ? byFate[fates[ray]] : Number.isNaN(fraction) ? rest : rampColour(fraction, ink);
    colours.set(colour, 3 * ray);
  }
  return colours;
}

/** Per-vertex colours from per-ray ones: ray r's points are [rayFirstPoint[r], rayFirstPoint[r + 1]). */
export function vertexColours(colours: Uint8Array, rayFirstPoint: Uint32Array, into?: Uint8Array): Uint8Array {
  const rayCount = rayFirstPoint.length - 1;
  const out = into ?? new Uint8Array(3 * rayFirstPoint[rayCount]);
  for (let ray = 0; ray < rayCount; ray++) {
    const [r, g, b] = [colours[3 * ray], colours[3 * ray + 1], colours[3 * ray + 2]];
    for (let p = rayFirstPoint[ray]; p < rayFirstPoint[ray + 1]; p++) {
      out[3 * p] = r;
      out[3 * p + 1] = g;
      out[3 * p + 2] = b;
    }
  }
  return out;
}

/**
 * Bundles of more rays than this draw each ray fainter (our rule: at 2,000 rays the demo fan's
 * incoming rays lie about five to a pixel on the 1,084-pixel view, and at full opacity they added up
 * to a white slab).
 */
const DENSE_BUNDLE_RAYS = 400;

/**
 * The factor on every ray's opacity for a bundle of `rayCount` rays: 1 up to DENSE_BUNDLE_RAYS, then
 * falling as 1/√N, so that where rays add up (additive blending) a dense bundle shows its structure
 * (caustics, the capture cross-section) instead of saturating into a slab.
 */
export const densityOpacity = (rayCount: number): number => Math.min(1, Math.sqrt(DENSE_BUNDLE_RAYS / Math.max(1, rayCount)));
