import { z } from "zod";

/**
 * A string PostgreSQL can store, compare and give back exactly as sent. Its `text` type cannot hold
 * the character U+0000 (PostgreSQL manual, "Character Types"), and it stores UTF-8, which has no form
 * for half of a UTF-16 surrogate pair (RFC 3629 §3): the driver would write U+FFFD instead, so the
 * text read back would differ from the text sent. Both are refused here as field errors; otherwise
 * the insert or the search fails (a 500 for what is bad input) or the text changes unseen.
 */
export function storedText() {
  return z
    .string()
    .refine((text) => !text.includes("\u0000"), "Text cannot contain the NUL character (U+0000).")
    .refine((text) => !/\p{Cs}/u.test(text), "Text cannot contain half of a surrogate pair (U+D800–U+DFFF): it is not valid Unicode.");
}
