import { z } from "zod";
import { timeKinds, timeOffsetsDays } from "./event-time";
import { timeScales } from "./time-scales";

/** A dataset's name is at most this long (our rule: a telescope or survey and a band). */
export const MAX_DATASET_NAME_CHARS = 80;

const columnIndex = (what: string) => {
  const message = `${what}: choose a column of the file.`;
  return z.number({ error: message }).int({ error: message }).min(0, { error: message }).max(9_999, { error: message });
};

const offsetWords = timeOffsetsDays.map((offset) => (offset === 0 ? "none" : String(offset))).join(", ");

/**
 * The mapping of a photometry file's columns as the user confirms it (lib/event-photometry/mapping
 * PhotometryMapping). The time scale is never defaulted: a file that does not state it must be told.
 */
export const photometryMappingSchema = z.object(
  {
    timeColumn: columnIndex("The time column"),
    timeKind: z.enum(timeKinds, { error: "The time column's kind: choose JD, MJD, HJD or BJD." }),
    timeOffsetDays: z
      .number({ error: `The time column's offset: choose ${offsetWords} days.` })
      .refine((offset) => (timeOffsetsDays as readonly number[]).includes(offset), { error: `The time column's offset: choose ${offsetWords} days.` })
      .optional(),
    timeScale: z.enum(timeScales, {
      error: (issue) => (issue.input === undefined ? "Choose the time scale of the time column (UTC, TT or TDB): the file does not say." : "The time column's time scale is UTC, TT or TDB."),
    }),
    brightnessKind: z.enum(["magnitude", "flux"], { error: "The brightness column: say whether it holds magnitudes or fluxes." }),
    valueColumn: columnIndex("The magnitude or flux column"),
    errorColumn: columnIndex("The error column"),
    bandColumn: columnIndex("The band column").optional(),
    band: z
      .string({ error: "The band: name it, e.g. I or V." })
      .trim()
      .min(1, { error: "The band: name it, e.g. I or V." })
      .max(20, { error: "The band is at most 20 characters." })
      .optional(),
    datasetColumn: columnIndex("The dataset column").optional(),
  },
  { error: "The column mapping must say which column holds the time, the magnitude or flux and its error." },
);

const fileIdField = z.uuid({ error: "The uploaded file is missing: upload a photometry file first." });

/** The dataset of every row when no column names one (the telescope or survey); by default the file's name. */
const datasetNameField = z
  .string({ error: "The dataset name: name the telescope or survey." })
  .trim()
  .min(1, { error: "The dataset name: name the telescope or survey." })
  .max(MAX_DATASET_NAME_CHARS, { error: `The dataset name is at most ${MAX_DATASET_NAME_CHARS} characters.` })
  .optional();

/** Body of a preview: the uploaded file, and the mapping chosen so far (absent: the proposed one), complete or not. */
export const photometryPreviewSchema = z.object({
  fileId: fileIdField,
  mapping: photometryMappingSchema.partial().optional(),
  datasetName: datasetNameField,
});

/** Body of a commit: the file and the whole mapping the user confirmed. */
export const photometryCommitSchema = z.object({
  fileId: fileIdField,
  mapping: photometryMappingSchema,
  datasetName: datasetNameField,
});

export type PhotometryPreviewRequest = z.input<typeof photometryPreviewSchema>;
export type PhotometryCommitRequest = z.input<typeof photometryCommitSchema>;
