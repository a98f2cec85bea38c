import { z } from "zod";

/**
 * A string PostgreSQL can store, compare and give back exactly as sent. Its `text` type cannot hold
 * the character U+0000 (PostgreSQL manual, "Character Types"), and it stores UTF-8, which has no form
 * for half of a UTF-16 surrogate pair (RFC 3629 §3): the driver would write U+FFFD instead, so the
 * text read back would differ from the text sent. Both are refused here as field errors; otherwise
 * the insert or the search fails (a 500 for what is bad input) or the text changes unseen.
 */
export function storedText(label: string) {
  return z
    .string({ error: (issue) => (issue.input === undefined ? `${label} is missing.` : `${label} must be text.`) })
    .refine((text) => !text.includes("\u0000"), `${label} cannot contain the NUL character (U+0000).`)
    .refine((text) => !/\p{Cs}/u.test(text), `${label} cannot contain half of a surrogate pair (U+D800–U+DFFF): it is not valid Unicode.`);
}

/**
 * Unicode's explicit direction controls: embeddings and overrides (U+202A–U+202E) and isolates
 * (U+2066–U+2069). In a name they make it display in another order than it is stored, so two
 * targets or people can look alike in a list while differing (Unicode Technical Report #36,
 * "Unicode Security Considerations", bidirectional text spoofing; the "Trojan Source" attack,
 * CVE-2021-42574). The implicit marks (U+200E, U+200F, U+061C), which right-to-left writing
 * needs, stay allowed.
 */
const directionControls = /[\u202A-\u202E\u2066-\u2069]/u;

/**
 * Control characters (Unicode category Cc: tab, line feed, carriage return, the rest of C0, DEL and
 * C1; NUL has its own message above) and the line and paragraph separators (U+2028, U+2029). A name
 * is one line: in a list, a mail or a log line a break would start what looks like another entry
 * (CWE-93, CWE-117).
 */
const lineBreaksAndControls = /[\u0001-\u001F\u007F-\u009F\u2028\u2029]/u;

/**
 * A name the team reads in lists (a target, a proposal, a cycle, a site, a person): one line of stored
 * text without direction controls. `label` names the field as a message starts: "The target name".
 */
export function nameText(label: string) {
  return storedText(label)
    .refine((text) => !lineBreaksAndControls.test(text), `${label} is one line: it cannot contain line breaks, tabs or other control characters.`)
    .refine(
      (text) => !directionControls.test(text),
      `${label} cannot contain Unicode direction controls (U+202A–U+202E, U+2066–U+2069): they show a name in another order than it is stored.`,
    );
}
