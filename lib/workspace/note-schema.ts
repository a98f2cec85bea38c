import { z } from "zod";
import { storedText } from "@/lib/workspace/stored-text";

export const noteSchema = z.object({
  body: storedText().trim().min(1, "A note needs some text.").max(20_000, "A note is at most 20,000 characters."),
  /** The version the editor started from; a save against any other version is refused with 409. */
  version: z.number().int().min(1),
});

export const createNoteSchema = noteSchema.omit({ version: true });
export const updateNoteSchema = noteSchema;
