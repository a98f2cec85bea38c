import { z } from "zod";
import { nameText } from "@/lib/workspace/stored-text";
import { CoordinateError, MAX_COORDINATE_CHARS, parseDeclinationDeg, parseRightAscensionDeg } from "@/lib/workspace/coordinates";
import { targetStatuses } from "@/lib/workspace/status";
import type { FieldErrors } from "@/lib/errors";

export const lensModels = ["point", "sis"] as const;
export type LensModel = (typeof lensModels)[number];
export const lensModelLabels: Record<LensModel, string> = {
  point: "Point mass",
  sis: "Singular isothermal sphere",
};

function coordinate(parse: (input: string | number) => number) {
  const text = z.string().max(MAX_COORDINATE_CHARS, `A coordinate is at most ${MAX_COORDINATE_CHARS} characters.`);
  return z.union([text, z.number()]).transform((input, ctx) => {
    try {
      return parse(input);
    } catch (error) {
      if (!(error instanceof CoordinateError)) throw error;
      ctx.addIssue({ code: "custom", message: error.message });
      return z.NEVER;
    }
  });
}

const optionalPositive = (message: string) => z.number().positive(message).finite().nullable().optional();
const optionalRedshift = z.number().min(0, "Redshift cannot be negative.").max(20, "Redshift is at most 20.").nullable().optional();

const tagSchema = z.string().trim().min(1, "A tag cannot be empty.").max(32, "A tag is at most 32 characters.").regex(/^[\w.+-]+$/, "Tags use letters, digits, . + - _");

/**
 * Every field of a target as it arrives from a form or the API. The right ascension and declination
 * come in as typed (`ra`, `dec`) and leave as ICRS degrees.
 */
export const targetFieldsSchema = z.object({
  name: nameText().trim().min(1, "Name the target.").max(120, "A target name is at most 120 characters."),
  ra: coordinate(parseRightAscensionDeg),
  dec: coordinate(parseDeclinationDeg),
  lensModel: z.enum(lensModels, { error: "The lens model is point or sis." }),
  lensMassSolar: optionalPositive("The lens mass is a positive number of solar masses."),
  velocityDispersionKmPerS: optionalPositive("The velocity dispersion is a positive speed in km/s."),
  lensDistancePc: optionalPositive("The lens distance is a positive number of parsecs."),
  sourceDistancePc: optionalPositive("The source distance is a positive number of parsecs."),
  lensRedshift: optionalRedshift,
  sourceRedshift: optionalRedshift,
  sourceOffsetThetaE: z.number().positive("The source offset is a positive multiple of the Einstein radius.").max(1000),
  properMotionMasPerYr: optionalPositive("The relative proper motion is a positive number of mas/yr."),
  priority: z.number().int().min(1, "Priority runs from 1 (highest) to 5.").max(5, "Priority runs from 1 (highest) to 5."),
  status: z.enum(targetStatuses),
  tags: z.array(tagSchema).max(12, "At most 12 tags."),
});

export type TargetFields = z.infer<typeof targetFieldsSchema>;

/** New targets always start as candidates. The tags default lives here only: a default in the base
 * would survive `.partial()` and clear a target's tags on every update that does not send them. */
export const createTargetSchema = targetFieldsSchema.omit({ status: true }).extend({ tags: targetFieldsSchema.shape.tags.default([]) });
export const updateTargetSchema = targetFieldsSchema.partial();

export type CreateTargetInput = z.infer<typeof createTargetSchema>;
export type UpdateTargetInput = z.infer<typeof updateTargetSchema>;

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
>;

const present = (value: number | null | undefined): value is number => value !== null && value !== undefined;

/**
 * The checks that span fields: each lens model needs its own parameter, and the geometry needs either
 * both distances or both redshifts, with the lens in front of the source. Checked on the merged record
 * so that a partial update cannot leave a target without a complete hypothesis.
 */
export function lensHypothesisErrors(h: LensHypothesis): FieldErrors {
  const fields: FieldErrors = {};
  const add = (field: string, message: string) => (fields[field] ??= []).push(message);
  if (h.lensModel === "point" && !present(h.lensMassSolar)) add("lensMassSolar", "A point-mass lens needs its mass in solar masses.");
  if (h.lensModel === "sis" && !present(h.velocityDispersionKmPerS)) {
    add("velocityDispersionKmPerS", "An isothermal lens needs its velocity dispersion in km/s.");
  }
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
  }
  return fields;
}
