import { z } from "zod";
import { importFieldLabels, importFields, type ImportField } from "@/lib/imports/columns";
import { MAX_IMPORT_ROWS } from "@/lib/imports/limits";
import { MAX_MATCH_TOLERANCE_ARCSEC } from "@/lib/imports/matching";
import { lensModels, targetFieldsSchema } from "@/lib/workspace/target-schema";
import { quantityField, type QuantitySpec } from "@/lib/workspace/quantity-field";

/**
 * Position tolerance used to match a row to an existing target when the names differ: 1″, the
 * radius commonly used to cross-match optical catalogues of point sources (common practice).
 */
export const DEFAULT_MATCH_TOLERANCE_ARCSEC = 1;

/**
 * The tolerance as the wizard's field takes it: arcseconds by default, any angle unit typed with it
 * ("0.5 arcsec", "500 mas"), read by the one quantity parser. From 1 mas (our rule: finer than any
 * catalogue position a target list is matched with) to MAX_MATCH_TOLERANCE_ARCSEC.
 */
export const matchToleranceSpec = {
  label: "Position tolerance",
  kind: "angle",
  unit: "arcsec",
  unitWords: "″",
  example: "1 arcsec",
  range: { min: 1e-3, max: MAX_MATCH_TOLERANCE_ARCSEC },
  rangeMessage: `The position tolerance is from 0.001″ (1 mas) to ${MAX_MATCH_TOLERANCE_ARCSEC}″.`,
} as const satisfies QuantitySpec;

/** Fill values the mapping step starts from (the same defaults as the add-a-target form). */
export const defaultImportFill = { priority: 3, sourceOffsetThetaE: 0.3 } as const;

/** "The lens mass column" for an issue under `mapping.lensMassSolar`. */
function mappedColumn(issue: { path?: PropertyKey[] }): string {
  const field = issue.path?.[1];
  if (typeof field !== "string" || !(field in importFieldLabels)) return "A mapped column";
  const label = importFieldLabels[field as ImportField];
  // "RA" and "Dec" keep their capitals; "Lens mass" reads "the lens mass column".
  return `The ${/^[A-Z][a-z]/.test(label) ? label[0].toLowerCase() + label.slice(1) : label} column`;
}

const assignmentSchema = z.object(
  {
    column: z
      .number({ error: (issue) => `${mappedColumn(issue)}: choose a column of the file.` })
      .int({ error: (issue) => `${mappedColumn(issue)}: choose a column of the file.` })
      .min(0, { error: (issue) => `${mappedColumn(issue)}: choose a column of the file.` })
      .max(9_999, { error: (issue) => `${mappedColumn(issue)}: choose a column of the file.` }),
    unit: z
      .string({ error: (issue) => `${mappedColumn(issue)}: name the unit, e.g. kpc.` })
      .trim()
      .min(1, { error: (issue) => `${mappedColumn(issue)}: name the unit, e.g. kpc.` })
      .max(40, { error: (issue) => `${mappedColumn(issue)}: the unit is at most 40 characters.` })
      .optional(),
    isUnitAssumed: z.boolean({ error: (issue) => `${mappedColumn(issue)}: whether its unit is assumed is true or false.` }).optional(),
  },
  { error: (issue) => `${mappedColumn(issue)}: choose a column of the file.` },
);

export const columnMappingSchema = z.partialRecord(z.enum(importFields), assignmentSchema, {
  error: (issue) =>
    issue.code === "invalid_key"
      ? `The column mapping names a field the import does not fill; the fields are ${importFields.map((field) => importFieldLabels[field]).join(", ")}.`
      : "The column mapping must say which column fills each field.",
});

export const importFillSchema = z.object(
  {
    lensModel: z.enum(lensModels, { error: `The lens model for empty cells is ${lensModels.join(" or ")}.` }).optional(),
    priority: targetFieldsSchema.shape.priority.optional(),
    sourceOffsetThetaE: targetFieldsSchema.shape.sourceOffsetThetaE.optional(),
  },
  { error: "The values for empty cells must be a group of fields (lens model, priority, source offset)." },
);

/** Body of a preview: the uploaded file, and optionally the mapping chosen so far (else proposed). */
export const importPreviewSchema = z.object({
  fileId: z.uuid({ error: "The uploaded file is missing: upload a target list first." }),
  mapping: columnMappingSchema.optional(),
  /** The column whose text becomes each new target's first note: null for none, absent for the proposed one. */
  noteColumn: z
    .number({ error: "The notes column: choose a column of the file." })
    .int({ error: "The notes column: choose a column of the file." })
    .min(0, { error: "The notes column: choose a column of the file." })
    .max(9_999, { error: "The notes column: choose a column of the file." })
    .nullable()
    .optional(),
  fill: importFillSchema.default(defaultImportFill),
  toleranceArcsec: quantityField(matchToleranceSpec).default(DEFAULT_MATCH_TOLERANCE_ARCSEC),
});

const refusedCountError = "The number of refused rows to leave out must be the count the preview showed.";

/**
 * Body of a commit: as a preview, with the mapping required (the one the user saw). When some rows
 * are refused, `leaveOutRefusedRows` is the user's explicit choice to commit the others, stating how
 * many refused rows they saw; without it any refused row refuses the whole commit.
 */
export const importCommitSchema = importPreviewSchema.extend({
  mapping: columnMappingSchema,
  leaveOutRefusedRows: z
    .number({ error: refusedCountError })
    .int({ error: refusedCountError })
    .min(1, { error: refusedCountError })
    .max(MAX_IMPORT_ROWS, { error: refusedCountError })
    .optional(),
});

export type ImportPreviewRequest = z.input<typeof importPreviewSchema>;
