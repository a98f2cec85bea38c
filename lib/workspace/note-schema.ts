import { z } from "zod";
import { storedText } from "@/lib/workspace/stored-text";

/** The largest PostgreSQL `integer` (manual, "Numeric Types"), the type the version is stored as. */
const pgIntegerMax = 2_147_483_647;

export const noteSchema = z.object({
  body: storedText("The note").trim().min(1, "The note needs some text.").max(20_000, "A note is at most 20,000 characters."),
  /** The version the editor started from; a save against any other version is refused with 409. */
  version: z
    .number({ error: "The note's version is missing: reload the note and save again." })
    .int("The note's version is not a version of this note.")
    .min(1, "The note's version is not a version of this note.")
    .max(pgIntegerMax, "The note's version is not a version of this note."),
});

export const createNoteSchema = noteSchema.omit({ version: true });
export const updateNoteSchema = noteSchema;
