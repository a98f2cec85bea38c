/**
 * The lens-bench sketch as it lives in the URL: every input is kept as the text the astronomer typed
 * (with its unit), so a shared link reproduces the sketch character for character. Parsing into
 * numbers happens in `parse-sketch.ts`; this module only validates the shape of the query string.
 */

import { z } from "zod";
import { lensModelIds, type LensModelId } from "@/lib/lensing/registry";

/** Longest text a field accepts from a URL; far above any real quantity, short enough to bound work. */
const MAX_FIELD_CHARS = 80;

/** Longest unit-choice list from a URL: every results row with its longest unit name fits. */
const MAX_UNITS_CHARS = 600;

/** The demo sketch: a Galactic microlensing event by a half-solar-mass star seen with an interferometer. */
export const demoSketch = {
  lens: "point",
  mass: "0.5 Msun",
  sigma: "220 km/s",
  geometry: "distance",
  dl: "4 kpc",
  ds: "8 kpc",
  zl: "0.5",
  zs: "2",
  h0: "70",
  om0: "0.3",
  beta: "0.3",
  betaUnit: "thetaE",
  mu: "6 mas/yr",
  t0: "45 d",
  u0: "0.2",
  resolution: "interferometer",
  fwhm: "50 mas",
  lambda: "2.2 um",
  baseline: "130 m",
  cadence: "1 d",
  campaign: "90 d",
  rays: "2000",
  bmin: "0.5",
  bmax: "15",
  layout: "fan",
  radius: "compact",
  rstar: "1 Rsun",
  units: "",
} as const;

function textField(key: keyof typeof demoSketch) {
  return z.string().trim().max(MAX_FIELD_CHARS).catch(demoSketch[key]);
}

function choiceField<const T extends readonly [string, ...string[]]>(options: T, fallback: T[number]) {
  return z.enum(options).catch(fallback);
}

/** The lens models of the registry (`lib/lensing/registry.ts`). */
export const lensModels = lensModelIds;
export const geometryModes = ["distance", "redshift"] as const;
export const betaUnits = ["thetaE", "angle"] as const;
export const resolutionModes = ["fwhm", "interferometer"] as const;
export const rayLayouts = ["fan", "cylinder"] as const;

/** Query-string schema; a missing or malformed key falls back to the demo value, never to an error page. */
export const sketchSchema = z.object({
  lens: choiceField(lensModels, demoSketch.lens),
  mass: textField("mass"),
  sigma: textField("sigma"),
  geometry: choiceField(geometryModes, demoSketch.geometry),
  dl: textField("dl"),
  ds: textField("ds"),
  zl: textField("zl"),
  zs: textField("zs"),
  h0: textField("h0"),
  om0: textField("om0"),
  beta: textField("beta"),
  betaUnit: choiceField(betaUnits, demoSketch.betaUnit),
  mu: textField("mu"),
  t0: textField("t0"),
  u0: textField("u0"),
  resolution: choiceField(resolutionModes, demoSketch.resolution),
  fwhm: textField("fwhm"),
  lambda: textField("lambda"),
  baseline: textField("baseline"),
  cadence: textField("cadence"),
  campaign: textField("campaign"),
  rays: textField("rays"),
  bmin: textField("bmin"),
  bmax: textField("bmax"),
  layout: choiceField(rayLayouts, demoSketch.layout),
  /** The lens's physical radius, or "compact" for a body inside its photon sphere (a black hole). */
  radius: textField("radius"),
  /** The source's radius, for its finite-source magnification along the light curve. */
  rstar: textField("rstar"),
  /** Result units the user chose over the readable default: "t-e:yr,theta-e:arcsec" (see display-units). */
  units: z.string().trim().max(MAX_UNITS_CHARS).catch(demoSketch.units),
});

export type Sketch = z.infer<typeof sketchSchema>;

/** Field names as the form shows them; error messages start with them so each names its field. */
export const fieldLabels = {
  lens: "Lens model",
  mass: "Lens mass",
  sigma: "Velocity dispersion σ",
  geometry: "Distances from",
  dl: "Lens distance D_L",
  ds: "Source distance D_S",
  zl: "Lens redshift z_L",
  zs: "Source redshift z_S",
  h0: "Hubble constant H0",
  om0: "Matter density Ωm",
  beta: "Source offset β",
  betaUnit: "Source offset β given",
  mu: "Relative proper motion μ_rel",
  t0: "Peak time t0",
  u0: "Impact parameter at peak u0",
  resolution: "Resolution from",
  fwhm: "PSF FWHM",
  lambda: "Wavelength λ",
  baseline: "Longest baseline B",
  cadence: "Cadence",
  campaign: "Campaign length",
  rays: "Number of rays",
  bmin: "Smallest impact parameter b (M)",
  bmax: "Largest impact parameter b (M)",
  layout: "Bundle shape",
  radius: "Lens radius",
  rstar: "Source radius R_*",
  units: "Result units",
} as const satisfies Record<keyof typeof demoSketch, string>;
export type SketchField = keyof Sketch;

/**
 * The bench's side of each lens model: the sketch fields of its own inputs (its parameter, and a point
 * mass's body radius) and whether its sketch draws a microlensing event (light curve, finite source).
 */
export const lensSketches: Record<LensModelId, { fields: readonly SketchField[]; hasLightCurve: boolean }> = {
  point: { fields: ["mass", "radius"], hasLightCurve: true },
  sis: { fields: ["sigma"], hasLightCurve: false },
};

/** Next's `searchParams` (or any record of query values) to a complete sketch; repeated keys use the first. */
export function sketchFromSearchParams(params: Record<string, string | string[] | undefined>): Sketch {
  const firstValues: Record<string, string | undefined> = {};
  for (const [key, value] of Object.entries(params)) {
    firstValues[key] = Array.isArray(value) ? value[0] : value;
  }
  return sketchSchema.parse(firstValues);
}

/** The query string that reproduces `sketch` (all keys, in schema order, so links are stable). */
export function sketchToQueryString(sketch: Sketch): string {
  const query = new URLSearchParams();
  for (const key of Object.keys(sketchSchema.shape) as SketchField[]) query.set(key, sketch[key]);
  return query.toString();
}
