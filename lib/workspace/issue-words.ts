/**
 * Field errors in the user's words for any zod schema of the product. Schemas give their own
 * messages where a field has a rule worth saying; this error map words whatever is left (a wrong
 * type, a missing field, a bound or a choice without a message of its own), naming the field by its
 * label instead of its key, so no schema path, variable name or library message reaches a user.
 */
import type { z } from "zod";
import type { FieldErrors } from "@/lib/errors";

/** The fields of requests and query strings as a message names them, by key. */
const fieldLabels: Record<string, string> = {
  name: "The name",
  email: "The e-mail address",
  password: "The password",
  token: "The link",
  callbackUrl: "The return address",
  role: "The role",
  siteRole: "The site role",
  userId: "The account",
  proposalId: "The proposal",
  targetId: "The target",
  noteId: "The note",
  invitationId: "The invitation",
  fileId: "The uploaded file",
  body: "The note",
  version: "The note's version",
  title: "The title",
  cycle: "The observing cycle",
  abstract: "The abstract",
  cycleStartDate: "The first night of the cycle",
  cycleEndDate: "The last night of the cycle",
  site: "The observing site",
  instrument: "The instrument defaults",
  status: "The status",
  tags: "The tags",
  q: "The search",
  tag: "The tag filter",
  page: "The page",
  pageSize: "The page size",
  sort: "The sort column",
  direction: "The sort direction",
  lensModel: "The lens model",
  caseVerdict: "The case verdict",
  scienceCase: "The science case",
  answeredCase: "The science case filter",
  eventPeakJdUtc: "The event peak",
  sourceRadiusSolar: "The source radius",
  sourceRadiusThetaE: "The source radius ρ",
  limbDarkeningU: "The limb darkening",
  sourceMagnitude: "The source magnitude",
  noteColumn: "The notes column",
  leaveOutRefusedRows: "The refused rows to leave out",
  fit: "The LaTeX table layout",
  sourceBand: "The source's band",
  blendFraction: "The blend fraction f_s",
  photometry: "The photometry settings",
  apertureM: "The telescope aperture",
  centralObstructionM: "The central obstruction",
  throughput: "The total throughput",
  readNoiseElectrons: "The read noise",
  darkElectronsPerSPerPixel: "The dark current",
  gainElectronsPerAdu: "The gain",
  fullWellElectrons: "The full well",
  pixelScaleArcsec: "The pixel scale",
  seeingFwhmArcsec: "The seeing",
  apertureRadiusFwhm: "The photometric aperture radius",
  psfShape: "The PSF shape",
  overheadS: "The overhead per visit",
  signalToNoiseGoal: "The signal-to-noise goal",
  bandId: "The band",
  customBand: "The custom band",
  skyByBand: "The site's sky per band",
  darkSkyMagPerArcsec2: "The dark sky",
  extinctionMagPerAirmass: "The extinction",
  effectiveWavelengthNm: "The band's effective wavelength",
  widthNm: "The band width",
  zeroPointWPerM2PerNm: "The zero point",
  zeroPointSystem: "The zero point's magnitude system",
  abMinusVegaMag: "The AB − Vega offset",
  moonMinSeparationDeg: "The minimum Moon separation",
  moonMaxIllumination: "The largest Moon illumination",
  visitMinutes: "The time per visit",
  clearNightFraction: "The clear-night fraction",
  astrometricPrecisionMas: "The astrometric precision per epoch",
  reachableContrast: "The reachable contrast",
  spectroscopicPrecisionKmPerS: "The spectroscopic precision per epoch",
  einsteinTimeDays: "The fitted Einstein time t_E",
  parallaxNorth: "The microlens parallax π_E,N",
  parallaxEast: "The microlens parallax π_E,E",
  orbitSemiMajorAxisAu: "The semi-major axis",
  orbitSemiMajorAxisMas: "The semi-major axis as an angle",
  orbitEccentricity: "The eccentricity",
  orbitPeriodDays: "The orbital period",
  orbitPeriapsisJdUtc: "The time of periapsis",
  orbitInclinationDeg: "The inclination",
  orbitNodeDeg: "The longitude of the ascending node",
  orbitPeriapsisArgumentDeg: "The argument of periapsis",
  limit: "The number of entries",
  before: "The starting entry",
  format: "The format",
  width: "The width",
  dpi: "The DPI",
  figure: "The figure",
  figures: "The figures",
  nightTargets: "The night-chart targets",
  night: "The night",
  date: "The date",
  start: "The first night",
  nights: "The number of nights",
  columns: "The columns",
  digits: "The digits",
  mapping: "The column mapping",
  fill: "The values for empty cells",
  toleranceArcsec: "The position tolerance",
  column: "The column",
  unit: "The unit",
  isUnitAssumed: "The assumed-unit flag",
};

/** "The page size" for a known key; otherwise the key's words ("someField" → "The some field"). */
export function labelOf(path: readonly PropertyKey[]): string {
  const key = [...path].reverse().find((segment): segment is string => typeof segment === "string");
  if (key === undefined) return "The request";
  const label = fieldLabels[key];
  if (label !== undefined) return label;
  const words = key.replace(/([a-z0-9])([A-Z])/g, "$1 $2").toLowerCase();
  return `The ${words}`;
}

const typeWords: Record<string, string> = {
  number: "a number",
  int: "a whole number",
  string: "text",
  boolean: "true or false",
  array: "a list",
  object: "a group of fields",
  date: "a date",
};

function sizeWords(origin: string | undefined, bound: number | bigint): string {
  if (origin === "string") return `${bound} characters`;
  if (origin === "array" || origin === "set") return `${bound} ${bound === 1 ? "entry" : "entries"}`;
  return String(bound);
}

/** The error map: one sentence naming the field and what it takes. */
export const wordedIssue: z.core.$ZodErrorMap = (issue) => {
  const label = labelOf(issue.path ?? []);
  switch (issue.code) {
    case "invalid_type":
      if (issue.input === undefined) return `${label} is missing.`;
      return `${label} must be ${typeWords[issue.expected] ?? "of another kind"}.`;
    case "too_small":
      return `${label} must be ${issue.inclusive === false ? "more than" : "at least"} ${sizeWords(issue.origin, issue.minimum)}.`;
    case "too_big":
      return `${label} must be ${issue.inclusive === false ? "less than" : "at most"} ${sizeWords(issue.origin, issue.maximum)}.`;
    case "invalid_value":
      // Choices are listed only when they read as words (sort columns are internal names).
      return issue.values.length <= 6 && issue.values.every((value) => typeof value === "string" && /^[a-z-]+$/.test(value))
        ? `${label} is one of ${issue.values.join(", ")}.`
        : `${label} is not one of the choices offered.`;
    case "invalid_format":
      return issue.format === "uuid" ? `${label} names nothing here.` : `${label} is not written as it should be.`;
    case "not_multiple_of":
      return `${label} must be a multiple of ${issue.divisor}.`;
    case "unrecognized_keys":
      return `${label} has fields this request does not take.`;
    case "invalid_key":
      return `${label} names a field this request does not take.`;
    default:
      return `${label} is not valid here.`;
  }
};

/** How many fields' messages the summary of a refusal repeats; a form shows every one beside its field. */
const SUMMARY_FIELDS = 3;

/**
 * A refusal's message in words: the first message of each bad field (a few at most), never the
 * fields' keys. "Lens mass: '5 kpc' is a distance, not a mass; type e.g. 0.3 Msun."
 */
export function summaryOf(fields: FieldErrors): string {
  const firsts = Object.values(fields).map((messages) => messages[0]);
  const shown = firsts.slice(0, SUMMARY_FIELDS).map((message) => (/[.!?]$/.test(message) ? message : `${message}.`));
  const more = firsts.length - shown.length;
  return more > 0 ? `${shown.join(" ")} And ${more} more field${more === 1 ? "" : "s"} to correct.` : shown.join(" ");
}
