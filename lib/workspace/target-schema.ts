import { z } from "zod";
import { nameText } from "@/lib/workspace/stored-text";
import { CoordinateError, MAX_COORDINATE_CHARS, parseDeclinationDeg, parseRightAscensionDeg } from "@/lib/workspace/coordinates";
import { targetStatuses } from "@/lib/workspace/status";
import type { FieldErrors } from "@/lib/errors";
import { acceptedRanges, lensCompactness, MAX_LENS_COMPACTNESS, type AcceptedRange } from "@/lib/physics/accepted-ranges";
import { EventPeakError, parseEventPeakJdUtc, parsePeriapsisJdUtc } from "@/lib/workspace/event-peak";
import { scienceCaseLabels } from "@/lib/lensing/science-cases";
import { scienceCaseIds } from "@/lib/lensing/science-case-inputs";
import { optionalQuantityField, quantityField, rangeMessage, type QuantitySpec } from "@/lib/workspace/quantity-field";
import { parseAngle, QuantityError } from "@/lib/physics/units";
import { isothermalSphereModel } from "@/lib/lensing/models/isothermal-sphere";
import { pointMassModel } from "@/lib/lensing/models/point-mass";
import { lensModelIds, lensModelLabels, lensModelOf, usesParameter, type LensModelId } from "@/lib/lensing/registry";
import type { LensParameter } from "@/lib/lensing/lens-model";
import { photometryBandIds } from "@/lib/workspace/photometry-schema";

/** The lens models of the registry (`lib/lensing/registry.ts`): ids, labels. */
export const lensModels = lensModelIds;
export type LensModel = LensModelId;
export { lensModelLabels };

function coordinate(label: string, parse: (input: string | number) => number) {
  const text = z.string().max(MAX_COORDINATE_CHARS, `${label} is at most ${MAX_COORDINATE_CHARS} characters.`);
  const typeError = (issue: { input?: unknown }) => `${label} is ${issue.input === undefined ? "missing" : "not a coordinate"}; type e.g. ${label === "Right ascension" ? "17 57 12.4 or 269.30" : "-29 12 05 or -29.20"}.`;
  return z.union([text, z.number()], { error: typeError }).transform((input, ctx) => {
    try {
      return parse(input);
    } catch (error) {
      if (!(error instanceof CoordinateError)) throw error;
      ctx.addIssue({ code: "custom", message: error.message });
      return z.NEVER;
    }
  });
}

/** A date field as typed (a UTC date or a Julian date) or a Julian date (UTC) from the API, read by `parse`. */
function epochField(what: string, parse: (input: string | number) => number) {
  return z.union([z.string(), z.number()], { error: `${what} is a date such as 2027-06-15 04:30 UTC, or a Julian date.` }).transform((input, ctx) => {
    try {
      return parse(input);
    } catch (error) {
      if (!(error instanceof EventPeakError)) throw error;
      ctx.addIssue({ code: "custom", message: error.message });
      return z.NEVER;
    }
  });
}

/** The event's peak time t0. */
const eventPeakField = epochField("The event peak", parseEventPeakJdUtc);
/** A time of periapsis passage of the orbiting star. */
const periapsisField = epochField("The time of periapsis", parsePeriapsisJdUtc);

const targetRange = (what: string, range: AcceptedRange, unitWords: string, why: string) => ({ range, rangeMessage: rangeMessage(what, range, unitWords, why) });

/** A lens model's parameter as a target's quantity field (declared once, in the model's file). */
function lensParameterSpec(p: LensParameter) {
  const { label, kind, unit, unitWords, example, range, rangeWords } = p;
  return { label, kind, unit, unitWords, example, ...targetRange(rangeWords.what, range, rangeWords.unitWords, rangeWords.why) };
}

/**
 * The target's quantities: each is a number in its stored unit or typed text with a unit, inside
 * one of the lensing layer's accepted ranges (`lib/physics/accepted-ranges.ts`), so that no derived
 * quantity overflows, underflows or leaves its formula's domain.
 */
export const targetQuantities = {
  lensMassSolar: lensParameterSpec(pointMassModel.parameters[0]),
  velocityDispersionKmPerS: lensParameterSpec(isothermalSphereModel.parameters[0]),
  lensDistancePc: {
    label: "Lens distance",
    kind: "distance",
    unit: "pc",
    unitWords: "pc",
    example: "4 kpc",
    ...targetRange("The lens distance", acceptedRanges.distancePc, "parsecs", "0.2 au to beyond the observable universe"),
  },
  sourceDistancePc: {
    label: "Source distance",
    kind: "distance",
    unit: "pc",
    unitWords: "pc",
    example: "8 kpc",
    ...targetRange("The source distance", acceptedRanges.distancePc, "parsecs", "0.2 au to beyond the observable universe"),
  },
  lensRedshift: {
    label: "Lens redshift",
    kind: "number",
    example: "0.5",
    ...targetRange("The lens redshift", acceptedRanges.redshift, "", "nearer lenses are given by distance in parsecs"),
  },
  sourceRedshift: {
    label: "Source redshift",
    kind: "number",
    example: "2",
    ...targetRange("The source redshift", acceptedRanges.redshift, "", "nearer sources are given by distance in parsecs"),
  },
  sourceOffsetThetaE: {
    label: "Source offset",
    kind: "number",
    example: "0.3",
    ...targetRange("The source offset", acceptedRanges.sourceOffsetThetaE, "Einstein radii", "closer, a real source's size caps the magnification"),
  },
  properMotionMasPerYr: {
    label: "Relative proper motion",
    kind: "proper motion",
    unit: "mas/yr",
    unitWords: "mas/yr",
    example: "5 mas/yr",
    ...targetRange("The relative proper motion", acceptedRanges.properMotionMasPerYr, "mas/yr", "a nanoarcsecond a year to faster than the Sun crosses the sky"),
  },
  // The source's size for the finite-source magnification: its radius (with the source distance,
  // ρ = (R*/D_S)/θ_E) or ρ typed directly, within the range the finite-source integral is checked
  // over (lib/lensing/finite-source.ts); a linear limb-darkening coefficient 0 (uniform) to 1.
  sourceRadiusSolar: {
    label: "Source radius",
    kind: "length",
    unit: "Rsun",
    unitWords: "R☉",
    example: "1.2 Rsun",
    range: { min: 0.01, max: 2000 },
    rangeMessage: "The source radius is from 0.01 R☉ (a white dwarf) to 2000 R☉ (a red supergiant).",
  },
  sourceRadiusThetaE: {
    label: "Source radius ρ",
    kind: "number",
    example: "0.002",
    range: { min: 1e-4, max: 10 },
    rangeMessage: "The source radius ρ is from 0.0001 to 10 Einstein radii.",
  },
  limbDarkeningU: {
    label: "Limb darkening",
    kind: "number",
    example: "0.6",
    range: { min: 0, max: 1 },
    rangeMessage: "The linear limb-darkening coefficient is from 0 (a uniform disk) to 1.",
  },
  // Magnitudes from the brightest stars to the faintest a large telescope reaches, with room (our rule).
  sourceMagnitude: {
    label: "Source magnitude",
    kind: "number",
    example: "19.5",
    range: { min: -5, max: 35 },
    rangeMessage: "The source magnitude is from -5 to 35 (in the band's own system).",
  },
  blendFraction: {
    label: "Blend fraction f_s",
    kind: "number",
    example: "0.6",
    range: { min: 0.001, max: 1 },
    rangeMessage: "The blend fraction f_s (the lensed source's share of the baseline flux) is from 0.001 to 1 (no blended light).",
  },
  // What a light-curve fit measured of the event (applied as a revision, or typed): t_E, which then
  // stands for θ_E/μ_rel everywhere, and the microlens parallax vector (north, east).
  einsteinTimeDays: {
    label: "Einstein time t_E (fitted)",
    kind: "time",
    unit: "d",
    unitWords: "d",
    example: "27.6 d",
    ...targetRange("The fitted Einstein time t_E", acceptedRanges.einsteinTimeDays, "days", "86 seconds to about 270 years"),
  },
  parallaxNorth: {
    label: "Microlens parallax π_E,N",
    kind: "number",
    example: "0.12",
    range: acceptedRanges.microlensParallaxComponent,
    rangeMessage: "The microlens parallax π_E,N (north) is from −100 to 100.",
  },
  parallaxEast: {
    label: "Microlens parallax π_E,E",
    kind: "number",
    example: "-0.05",
    range: acceptedRanges.microlensParallaxComponent,
    rangeMessage: "The microlens parallax π_E,E (east) is from −100 to 100.",
  },
  // A star (or pulsar) orbiting the compact lens (the relativistic-orbit case): its orbital elements.
  // The semi-major axis is typed once, in au or as an angle at the lens distance (`semiMajorAxisKeyOf`),
  // and stored in the matching one of these two.
  orbitSemiMajorAxisAu: {
    label: "Semi-major axis",
    kind: "length",
    unit: "au",
    unitWords: "au",
    example: "1000 au or 125 mas",
    ...targetRange("The semi-major axis", acceptedRanges.orbitSemiMajorAxisAu, "au", "15,000 km to half a parsec"),
  },
  orbitSemiMajorAxisMas: {
    label: "Semi-major axis (angle)",
    kind: "angle",
    unit: "mas",
    unitWords: "mas",
    example: "125 mas or 0.125 arcsec",
    ...targetRange("The semi-major axis as an angle", acceptedRanges.orbitSemiMajorAxisMas, "mas", "1 µas to about 17 arcmin"),
  },
  orbitEccentricity: {
    label: "Eccentricity",
    kind: "number",
    example: "0.88",
    range: acceptedRanges.orbitEccentricity,
    rangeMessage: "The eccentricity is from 0 (a circle) to 0.9999: a bound orbit has e below 1.",
  },
  orbitPeriodDays: {
    label: "Orbital period",
    kind: "time",
    unit: "d",
    unitWords: "d",
    example: "16 yr",
    ...targetRange("The orbital period", acceptedRanges.orbitPeriodDays, "days", "86 seconds to about 27,000 years"),
  },
  orbitInclinationDeg: {
    label: "Inclination",
    kind: "angle",
    unit: "deg",
    unitWords: "°",
    example: "134 deg",
    range: acceptedRanges.orbitInclinationDeg,
    rangeMessage: "The inclination is from 0° to 180° (above 90° the star moves clockwise on the sky).",
  },
  orbitNodeDeg: {
    label: "Longitude of the ascending node Ω",
    kind: "angle",
    unit: "deg",
    unitWords: "°",
    example: "228 deg",
    range: acceptedRanges.orbitAngleDeg,
    rangeMessage: "The longitude of the ascending node Ω is from 0° to 360°.",
  },
  orbitPeriapsisArgumentDeg: {
    label: "Argument of periapsis ω",
    kind: "angle",
    unit: "deg",
    unitWords: "°",
    example: "66 deg",
    range: acceptedRanges.orbitAngleDeg,
    rangeMessage: "The argument of periapsis ω is from 0° to 360°.",
  },
  priority: {
    label: "Priority",
    kind: "number",
    example: "3",
    isInteger: true,
    range: { min: 1, max: 5 },
    rangeMessage: "Priority runs from 1 (highest) to 5.",
  },
} as const satisfies Record<string, QuantitySpec>;

/** The models as a refusal lists them: "point (a point mass) or sis (a singular isothermal sphere)". */
export const lensModelChoicesText = lensModels.map((id) => `${id} (a ${lensModelLabels[id].toLowerCase()})`).join(" or ");

const tagRule = "may use only letters, digits, . + - _";
/** A refused tag as its message quotes it: at most 32 characters, so a huge one is not echoed whole. */
const shownTag = (input: unknown) => {
  const text = String(input).trim();
  return text.length > 32 ? `${text.slice(0, 20)}…` : text;
};
const tagSchema = z
  .string({ error: "Each tag is a word, e.g. bulge." })
  .trim()
  .min(1, "A tag cannot be empty.")
  .max(32, { error: (issue) => `Tag '${shownTag(issue.input)}' is longer than 32 characters.` })
  .regex(/^[\w.+-]+$/, { error: (issue) => `Tag '${shownTag(issue.input)}' ${tagRule}.` });

/**
 * Every field of a target as it arrives from a form or the API. The right ascension and declination
 * come in as typed (`ra`, `dec`) and leave as ICRS degrees.
 */
export const targetFieldsSchema = z.object({
  name: nameText("The target name").trim().min(1, "Name the target.").max(120, "The target name is at most 120 characters."),
  ra: coordinate("Right ascension", parseRightAscensionDeg),
  dec: coordinate("Declination", parseDeclinationDeg),
  lensModel: z.enum(lensModels, { error: `The lens model is ${lensModelChoicesText}.` }),
  lensMassSolar: optionalQuantityField(targetQuantities.lensMassSolar),
  velocityDispersionKmPerS: optionalQuantityField(targetQuantities.velocityDispersionKmPerS),
  lensDistancePc: optionalQuantityField(targetQuantities.lensDistancePc),
  sourceDistancePc: optionalQuantityField(targetQuantities.sourceDistancePc),
  lensRedshift: optionalQuantityField(targetQuantities.lensRedshift),
  sourceRedshift: optionalQuantityField(targetQuantities.sourceRedshift),
  sourceOffsetThetaE: quantityField(targetQuantities.sourceOffsetThetaE),
  properMotionMasPerYr: optionalQuantityField(targetQuantities.properMotionMasPerYr),
  scienceCase: z.enum(scienceCaseIds, { error: `The science case is one of ${scienceCaseIds.map((id) => scienceCaseLabels[id].toLowerCase()).join(", ")}; leave it empty to use the inferred one.` }).nullable().optional(),
  eventPeakJdUtc: eventPeakField.nullable().optional(),
  sourceRadiusSolar: optionalQuantityField(targetQuantities.sourceRadiusSolar),
  sourceRadiusThetaE: optionalQuantityField(targetQuantities.sourceRadiusThetaE),
  limbDarkeningU: optionalQuantityField(targetQuantities.limbDarkeningU),
  sourceMagnitude: optionalQuantityField(targetQuantities.sourceMagnitude),
  sourceBand: z.enum(photometryBandIds, { error: "The source's band is one of the built-in bands or the proposal's own; leave it empty for the proposal's band." }).nullable().optional(),
  blendFraction: optionalQuantityField(targetQuantities.blendFraction),
  einsteinTimeDays: optionalQuantityField(targetQuantities.einsteinTimeDays),
  parallaxNorth: optionalQuantityField(targetQuantities.parallaxNorth),
  parallaxEast: optionalQuantityField(targetQuantities.parallaxEast),
  orbitSemiMajorAxisAu: optionalQuantityField(targetQuantities.orbitSemiMajorAxisAu),
  orbitSemiMajorAxisMas: optionalQuantityField(targetQuantities.orbitSemiMajorAxisMas),
  orbitEccentricity: optionalQuantityField(targetQuantities.orbitEccentricity),
  orbitPeriodDays: optionalQuantityField(targetQuantities.orbitPeriodDays),
  orbitPeriapsisJdUtc: periapsisField.nullable().optional(),
  orbitInclinationDeg: optionalQuantityField(targetQuantities.orbitInclinationDeg),
  orbitNodeDeg: optionalQuantityField(targetQuantities.orbitNodeDeg),
  orbitPeriapsisArgumentDeg: optionalQuantityField(targetQuantities.orbitPeriapsisArgumentDeg),
  priority: quantityField(targetQuantities.priority),
  status: z.enum(targetStatuses, { error: `The status is one of ${targetStatuses.join(", ")}.` }),
  tags: z.array(tagSchema, { error: "Tags are a list of words." }).max(12, "At most 12 tags."),
});

export type TargetFields = z.infer<typeof targetFieldsSchema>;

/** New targets always start as candidates. The tags default lives here only: a default in the base
 * would survive `.partial()` and clear a target's tags on every update that does not send them. */
export const createTargetSchema = targetFieldsSchema.omit({ status: true }).extend({ tags: targetFieldsSchema.shape.tags.default([]) });
export const updateTargetSchema = targetFieldsSchema.partial();

export type CreateTargetInput = z.infer<typeof createTargetSchema>;
export type UpdateTargetInput = z.infer<typeof updateTargetSchema>;

/** The fields of a target that its derived columns are computed from, each in its accepted range. */
export const lensHypothesisSchema = targetFieldsSchema.pick({
  lensModel: true,
  lensMassSolar: true,
  velocityDispersionKmPerS: true,
  lensDistancePc: true,
  sourceDistancePc: true,
  lensRedshift: true,
  sourceRedshift: true,
  sourceOffsetThetaE: true,
  properMotionMasPerYr: true,
  scienceCase: true,
  eventPeakJdUtc: true,
  sourceRadiusSolar: true,
  sourceRadiusThetaE: true,
  limbDarkeningU: true,
  sourceMagnitude: true,
  sourceBand: true,
  blendFraction: true,
  einsteinTimeDays: true,
  parallaxNorth: true,
  parallaxEast: true,
  orbitSemiMajorAxisAu: true,
  orbitSemiMajorAxisMas: true,
  orbitEccentricity: true,
  orbitPeriodDays: true,
  orbitPeriapsisJdUtc: true,
  orbitInclinationDeg: true,
  orbitNodeDeg: true,
  orbitPeriapsisArgumentDeg: true,
});

/** The part of a target that its derived columns are computed from. */
export type LensHypothesis = Pick<
  TargetFields,
  | "lensModel"
  | "lensMassSolar"
  | "velocityDispersionKmPerS"
  | "lensDistancePc"
  | "sourceDistancePc"
  | "lensRedshift"
  | "sourceRedshift"
  | "sourceOffsetThetaE"
  | "properMotionMasPerYr"
  | "scienceCase"
  | "eventPeakJdUtc"
  | "sourceRadiusSolar"
  | "sourceRadiusThetaE"
  | "limbDarkeningU"
  | "sourceMagnitude"
  | "sourceBand"
  | "blendFraction"
  | "einsteinTimeDays"
  | "parallaxNorth"
  | "parallaxEast"
  | OrbitField
>;

/** The orbiting star's elements on a target (the relativistic-orbit case), in the order the form shows them. */
export const orbitFields = [
  "orbitSemiMajorAxisAu",
  "orbitSemiMajorAxisMas",
  "orbitEccentricity",
  "orbitPeriodDays",
  "orbitPeriapsisJdUtc",
  "orbitInclinationDeg",
  "orbitNodeDeg",
  "orbitPeriapsisArgumentDeg",
] as const;
export type OrbitField = (typeof orbitFields)[number];

/**
 * Which column a typed semi-major axis is stored in: an angle ("125 mas", "0.125 arcsec", "0.125″")
 * goes to the angle at the lens distance, anything else (a bare number, "1000 au", "0.1 pc") to the
 * length in au, whose reader then accepts it or says why not. One input, two columns.
 */
export function semiMajorAxisKeyOf(text: string): "orbitSemiMajorAxisAu" | "orbitSemiMajorAxisMas" {
  try {
    // No default unit: a bare number is no angle.
    parseAngle(text);
    return "orbitSemiMajorAxisMas";
  } catch (error) {
    if (!(error instanceof QuantityError)) throw error;
    return "orbitSemiMajorAxisAu";
  }
}

const present = (value: number | null | undefined): value is number => value !== null && value !== undefined;

/**
 * The checks that span fields: each lens model needs its own parameter, and the geometry needs either
 * both distances or both redshifts, with the lens in front of the source. Checked on the merged record
 * so that a partial update cannot leave a target without a complete hypothesis.
 */
/**
 * The checks of a target's source photometry across fields: a band names what the magnitude is in,
 * so a band without a magnitude is refused (it would silently give no photon budget). Kept apart from
 * `lensHypothesisErrors`: the lens is solved without its photometry.
 */
export function sourcePhotometryErrors(h: Pick<LensHypothesis, "sourceBand" | "sourceMagnitude" | "blendFraction">): FieldErrors {
  const fields: FieldErrors = {};
  if (h.sourceBand != null && !present(h.sourceMagnitude)) fields.sourceMagnitude = ["Give the source magnitude in the band chosen for it, or clear the source's band."];
  if (present(h.blendFraction) && !present(h.sourceMagnitude)) fields.sourceMagnitude = [...(fields.sourceMagnitude ?? []), "Give the source magnitude the blend fraction f_s refers to, or clear f_s."];
  return fields;
}

export function lensHypothesisErrors(h: LensHypothesis): FieldErrors {
  const fields: FieldErrors = {};
  const add = (field: string, message: string) => (fields[field] ??= []).push(message);
  for (const parameter of lensModelOf(h.lensModel).parameters) if (!present(h[parameter.key])) add(parameter.key, parameter.missingMessage);
  if (present(h.sourceRadiusSolar) && present(h.sourceRadiusThetaE)) add("sourceRadiusThetaE", "Give the source's radius or ρ, not both.");
  if (present(h.parallaxNorth) !== present(h.parallaxEast)) add(present(h.parallaxNorth) ? "parallaxEast" : "parallaxNorth", "Give both components of the microlens parallax, π_E,N and π_E,E, or neither.");
  for (const [field, messages] of Object.entries(orbitErrors(h))) for (const message of messages) add(field, message);
  const hasDistances = present(h.lensDistancePc) || present(h.sourceDistancePc);
  const hasRedshifts = present(h.lensRedshift) || present(h.sourceRedshift);
  if (hasDistances && hasRedshifts) {
    add("lensRedshift", "Give either distances or redshifts, not both.");
  } else if (hasRedshifts) {
    if (!present(h.lensRedshift)) add("lensRedshift", "Give the lens redshift too.");
    else if (!present(h.sourceRedshift)) add("sourceRedshift", "Give the source redshift too.");
    else if (h.sourceRedshift <= h.lensRedshift) add("sourceRedshift", "The source must lie behind the lens (higher redshift).");
  } else if (!present(h.lensDistancePc)) {
    add("lensDistancePc", "Give the lens distance in parsecs, or both redshifts.");
  } else if (!present(h.sourceDistancePc)) {
    add("sourceDistancePc", "Give the source distance in parsecs too.");
  } else if (h.sourceDistancePc <= h.lensDistancePc) {
    add("sourceDistancePc", "The source must lie behind the lens (farther than it).");
  } else if (usesParameter(h.lensModel, "lensMassSolar") && present(h.lensMassSolar) && lensCompactness(h.lensMassSolar, h.lensDistancePc) > MAX_LENS_COMPACTNESS) {
    const message = "The lens is too close for its mass: its gravitational radius exceeds 1/10,000 of its distance, where the thin-lens formulas fail. Check the mass and the distance.";
    add("lensMassSolar", message);
    add("lensDistancePc", message);
  }
  return fields;
}

/**
 * The checks of the orbiting star across fields: its elements describe an orbit around a compact
 * mass, so only a point-mass lens has them (an isothermal sphere is no compact mass); the semi-major
 * axis is stored once, in au or as an angle. The elements themselves may be partial: the case's
 * questions name what is missing.
 */
export function orbitErrors(h: Pick<LensHypothesis, "lensModel" | OrbitField>): FieldErrors {
  const fields: FieldErrors = {};
  const given = orbitFields.filter((field) => present(h[field]));
  if (given.length > 0 && h.lensModel !== "point") {
    fields[given[0]] = [
      `An orbiting star's elements describe an orbit around a compact mass: this target has a ${lensModelLabels[h.lensModel].toLowerCase()} lens. Change its lens model to a point mass, or clear the orbit's fields.`,
    ];
  }
  if (present(h.orbitSemiMajorAxisAu) && present(h.orbitSemiMajorAxisMas)) {
    (fields.orbitSemiMajorAxisMas ??= []).push("Give the semi-major axis in au or as an angle at the lens distance, not both.");
  }
  return fields;
}
