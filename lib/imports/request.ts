import { z } from "zod";
import { importFields } from "@/lib/imports/columns";
import { MAX_MATCH_TOLERANCE_ARCSEC } from "@/lib/imports/matching";
import { lensModels, targetFieldsSchema } from "@/lib/workspace/target-schema";

/**
 * Position tolerance used to match a row to an existing target when the names differ: 1″, the
 * radius commonly used to cross-match optical catalogues of point sources (common practice).
 */
export const DEFAULT_MATCH_TOLERANCE_ARCSEC = 1;

/** Fill values the mapping step starts from (the same defaults as the add-a-target form). */
export const defaultImportFill = { priority: 3, sourceOffsetThetaE: 0.3 } as const;

const assignmentSchema = z.object({
  column: z.number().int().min(0, "Choose a column.").max(9_999),
  unit: z.string().trim().min(1, "Name the unit.").max(40, "A unit is at most 40 characters.").optional(),
  isUnitAssumed: z.boolean().optional(),
});

export const columnMappingSchema = z.partialRecord(z.enum(importFields), assignmentSchema);

export const importFillSchema = z.object({
  lensModel: z.enum(lensModels).optional(),
  priority: targetFieldsSchema.shape.priority.optional(),
  sourceOffsetThetaE: targetFieldsSchema.shape.sourceOffsetThetaE.optional(),
});

/** Body of a preview: the uploaded file, and optionally the mapping chosen so far (else proposed). */
export const importPreviewSchema = z.object({
  fileId: z.uuid("Upload a target list first."),
  mapping: columnMappingSchema.optional(),
  fill: importFillSchema.default(defaultImportFill),
  toleranceArcsec: z
    .number()
    .positive("The position tolerance is a positive number of arcseconds.")
    .max(MAX_MATCH_TOLERANCE_ARCSEC, `The position tolerance is at most ${MAX_MATCH_TOLERANCE_ARCSEC}″.`)
    .default(DEFAULT_MATCH_TOLERANCE_ARCSEC),
});

/** Body of a commit: as a preview, with the mapping required (the one the user saw). */
export const importCommitSchema = importPreviewSchema.extend({ mapping: columnMappingSchema });

export type ImportPreviewRequest = z.input<typeof importPreviewSchema>;
