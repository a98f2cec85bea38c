import { z } from "zod";

/**
 * A string PostgreSQL can store and compare. Its `text` type cannot hold the character U+0000
 * (PostgreSQL manual, "Character Types"), so a NUL is refused here as a field error; otherwise the
 * insert or the search fails and the caller gets a 500 for what is bad input.
 */
export function storedText() {
  return z.string().refine((text) => !text.includes("\u0000"), "Text cannot contain the NUL character (U+0000).");
}
