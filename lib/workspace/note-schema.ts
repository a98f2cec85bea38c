import { z } from "zod";
import { storedText } from "@/lib/workspace/stored-text";

/** The largest PostgreSQL `integer` (manual, "Numeric Types"), the type the version is stored as. */
const pgIntegerMax = 2_147_483_647;

export const noteSchema = z.object({
  body: storedText().trim().min(1, "A note needs some text.").max(20_000, "A note is at most 20,000 characters."),
  /** The version the editor started from; a save against any other version is refused with 409. */
  version: z.number().int().min(1).max(pgIntegerMax, "Not a version of this note."),
});

export const createNoteSchema = noteSchema.omit({ version: true });
export const updateNoteSchema = noteSchema;
