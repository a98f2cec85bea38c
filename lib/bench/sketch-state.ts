/**
 * The lens-bench sketch as it lives in the URL: every input is kept as the text the astronomer typed
 * (with its unit), so a shared link reproduces the sketch character for character. Parsing into
 * numbers happens in `parse-sketch.ts`; this module only validates the shape of the query string.
 */

import { z } from "zod";
import { lensModelIds, type LensModelId } from "@/lib/lensing/registry";
import { scienceCaseIds } from "@/lib/lensing/science-case-inputs";

/** Longest text a field accepts from a URL; far above any real quantity, short enough to bound work. */
const MAX_FIELD_CHARS = 80;

/** Longest unit-choice list from a URL: every results row with its longest unit name fits. */
const MAX_UNITS_CHARS = 600;

/**
 * The demo sketch: a Galactic-bulge microlensing event by a half-solar-mass star peaking in the
 * southern winter, seen from a southern site over one semester, with an interferometer as well as a
 * single telescope's PSF. An empty field is "not set", as on a target or a proposal.
 */
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
  ra: "17 57 12.4",
  dec: "-29 12 05",
  case: "inferred",
  t0: "2027-07-10 00:00 UTC",
  rho: "",
  limb: "",
  fwhm: "50 mas",
  lambda: "2.2 um",
  baseline: "130 m",
  astrometry: "",
  contrast: "",
  site: "Sketch site",
  lat: "-30.2",
  lon: "-70.7",
  elev: "2200",
  horizon: "20",
  cycleStart: "2027-04-01",
  cycleEnd: "2027-09-30",
  airmass: "2",
  moonSep: "30",
  moonIllum: "",
  cadence: "1 d",
  visit: "20 min",
  clear: "1",
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
/** A science case of `lib/lensing/science-cases.ts`, or "inferred": the one the lens and instrument suggest. */
export const caseChoices = ["inferred", ...scienceCaseIds] as const;
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
  ra: textField("ra"),
  dec: textField("dec"),
  case: choiceField(caseChoices, demoSketch.case),
  /** The event's peak as a UTC date or a Julian date (`lib/workspace/event-peak.ts`); empty: not set. */
  t0: textField("t0"),
  /** The source's radius in θ_E, typed instead of its radius in length; empty: not set. */
  rho: textField("rho"),
  limb: textField("limb"),
  fwhm: textField("fwhm"),
  /** The interferometer's wavelength and longest baseline, both or neither (empty). */
  lambda: textField("lambda"),
  baseline: textField("baseline"),
  astrometry: textField("astrometry"),
  contrast: textField("contrast"),
  /** The observing site and cycle of the simulated schedule; empty cycle dates: no schedule. */
  site: textField("site"),
  lat: textField("lat"),
  lon: textField("lon"),
  elev: textField("elev"),
  horizon: textField("horizon"),
  cycleStart: textField("cycleStart"),
  cycleEnd: textField("cycleEnd"),
  airmass: textField("airmass"),
  moonSep: textField("moonSep"),
  moonIllum: textField("moonIllum"),
  cadence: textField("cadence"),
  visit: textField("visit"),
  clear: textField("clear"),
  campaign: textField("campaign"),
  rays: textField("rays"),
  bmin: textField("bmin"),
  bmax: textField("bmax"),
  layout: choiceField(rayLayouts, demoSketch.layout),
  /** The lens's physical radius, or "compact" for a body inside its photon sphere (a black hole). */
  radius: textField("radius"),
  /** The source's radius, for its finite-source magnification along the light curve; empty: not set. */
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
  ra: "Right ascension",
  dec: "Declination",
  case: "Science case",
  t0: "Event peak t0",
  rho: "Source radius ρ",
  limb: "Limb darkening",
  fwhm: "PSF FWHM",
  lambda: "Wavelength λ",
  baseline: "Longest baseline B",
  astrometry: "Astrometric precision per epoch",
  contrast: "Reachable contrast",
  site: "Site name",
  lat: "Latitude",
  lon: "Longitude",
  elev: "Elevation",
  horizon: "Horizon limit",
  cycleStart: "First night of the cycle",
  cycleEnd: "Last night of the cycle",
  airmass: "Airmass limit",
  moonSep: "Minimum Moon separation",
  moonIllum: "Largest Moon illumination",
  cadence: "Cadence",
  visit: "Time per visit",
  clear: "Clear-night fraction",
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

/** The bench's side of each lens model: the sketch fields of its own inputs (its parameter, and a point mass's body radius). */
export const lensSketches: Record<LensModelId, { fields: readonly SketchField[] }> = {
  point: { fields: ["mass", "radius"] },
  sis: { fields: ["sigma"] },
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
