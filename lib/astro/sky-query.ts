/**
 * The /sky page's inputs as typed text, their address-bar form, and their parsing into the values
 * lib/astro takes. Every field's error is reported under the field's own key.
 */
import { nightDateSchema, skyLimitsSchema, skySiteSchema, type SkyLimits, type SkySite, type SkyTarget } from "@/lib/astro/inputs";
import { CoordinateError, parseDeclinationDeg, parseRightAscensionDeg } from "@/lib/workspace/coordinates";
import { proposalQuantities } from "@/lib/workspace/proposal-schema";
import { readQuantityField, type QuantitySpec } from "@/lib/workspace/quantity-field";
import { parseNumber, QuantityError } from "@/lib/physics/units";
import { SEASON_DEFAULT_NIGHTS, SEASON_MAX_NIGHTS, SEASON_MIN_NIGHTS, seasonNightsRangeWords } from "@/lib/astro/season-length";

export const skyQueryFields = ["site", "lat", "lon", "elev", "horizon", "ra", "dec", "date", "airmass", "nights"] as const;
export type SkyQueryField = (typeof skyQueryFields)[number];
export type SkyQuery = Record<SkyQueryField, string>;

/** An invented site for the demo (not a real observatory): a dry ridge at 2,300 m, 27.5°S. */
export const demoSite = { name: "Demo ridge (invented site)", latitudeDeg: -27.5, longitudeEastDeg: -66.9, elevationM: 2300, horizonLimitDeg: 15 };

export function defaultSkyQuery(todayIso: string): SkyQuery {
  return {
    site: demoSite.name,
    lat: String(demoSite.latitudeDeg),
    lon: String(demoSite.longitudeEastDeg),
    elev: String(demoSite.elevationM),
    horizon: String(demoSite.horizonLimitDeg),
    ra: "17 45 40.04",
    dec: "-29 00 28.1",
    date: todayIso,
    airmass: "2",
    nights: String(SEASON_DEFAULT_NIGHTS),
  };
}

/** Fields from the address bar over the defaults; unknown keys ignored, repeated keys take the first. */
export function skyQueryFromParams(params: Record<string, string | string[] | undefined>, defaults: SkyQuery): SkyQuery {
  const query = { ...defaults };
  for (const field of skyQueryFields) {
    const raw = params[field];
    const value = Array.isArray(raw) ? raw[0] : raw;
    if (value !== undefined) query[field] = value;
  }
  return query;
}

export function skyQueryToString(query: SkyQuery): string {
  return new URLSearchParams(skyQueryFields.map((field) => [field, query[field]])).toString();
}

export interface ParsedSkyQuery {
  site: SkySite;
  target: SkyTarget;
  nightDateIso: string;
  limits: SkyLimits;
  nightCount: number;
}

/**
 * The page's quantity fields read as the proposal settings read the same quantities (units, comma
 * rules and messages from the one parser), so a site is typed one way everywhere.
 */
export const skyQuantitySpecs = {
  lat: proposalQuantities.latitudeDeg,
  lon: proposalQuantities.longitudeDeg,
  elev: proposalQuantities.elevationM,
  horizon: proposalQuantities.horizonLimitDeg,
  airmass: proposalQuantities.airmassLimit,
} as const satisfies Partial<Record<SkyQueryField, QuantitySpec>>;

const seasonLengthMessage = `The season is a whole number of nights ${seasonNightsRangeWords}.`;

/** The season length in nights, with the comma rules of every number field; NaN when not a number. */
function nightCountOf(text: string): number {
  try {
    return parseNumber(text);
  } catch (error) {
    if (!(error instanceof QuantityError)) throw error;
    return Number.NaN;
  }
}

/** The parsed inputs, or the message for each field that does not parse (keyed by field). */
export function parseSkyQuery(query: SkyQuery): { value: ParsedSkyQuery; errors: null } | { value: null; errors: Partial<Record<SkyQueryField, string>> } {
  const errors: Partial<Record<SkyQueryField, string>> = {};
  const quantity = (field: keyof typeof skyQuantitySpecs): number => {
    const reading = readQuantityField(skyQuantitySpecs[field], query[field]);
    if (reading.ok) return reading.value;
    errors[field] = reading.message;
    return Number.NaN;
  };
  const site = skySiteSchema.safeParse({
    name: query.site,
    latitudeDeg: quantity("lat"),
    longitudeEastDeg: quantity("lon"),
    elevationM: quantity("elev"),
    horizonLimitDeg: quantity("horizon"),
  });
  if (!site.success) {
    const siteField: Record<string, SkyQueryField> = { name: "site", latitudeDeg: "lat", longitudeEastDeg: "lon", elevationM: "elev", horizonLimitDeg: "horizon" };
    for (const issue of site.error.issues) errors[siteField[String(issue.path[0])]] ??= issue.message;
  }
  const coordinate = (field: "ra" | "dec", parse: (text: string) => number): number => {
    try {
      return parse(query[field]);
    } catch (error) {
      if (!(error instanceof CoordinateError)) throw error;
      errors[field] = error.message;
      return Number.NaN;
    }
  };
  const raDeg = coordinate("ra", parseRightAscensionDeg);
  const decDeg = coordinate("dec", parseDeclinationDeg);
  const date = nightDateSchema.safeParse(query.date);
  if (!date.success) errors.date = date.error.issues[0].message;
  const limits = skyLimitsSchema.safeParse({ airmassLimit: quantity("airmass") });
  if (!limits.success) errors.airmass ??= limits.error.issues[0].message;
  const nightCount = nightCountOf(query.nights);
  if (!(Number.isInteger(nightCount) && nightCount >= SEASON_MIN_NIGHTS && nightCount <= SEASON_MAX_NIGHTS)) errors.nights = seasonLengthMessage;
  if (Object.keys(errors).length > 0 || !site.success || !date.success || !limits.success) return { value: null, errors };
  return {
    value: { site: site.data, target: { name: "Target", raDeg, decDeg }, nightDateIso: date.data, limits: limits.data, nightCount },
    errors: null,
  };
}
