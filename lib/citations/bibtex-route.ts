import "server-only";
import { z } from "zod";
import { attachmentHeaders } from "@/lib/exports/download";
import { queryOf } from "@/lib/server/api/endpoint";
import { handle, parseOrThrow } from "@/lib/server/http";
import { bibtexFile } from "./bibtex";
import { citationKeys, isCitationKey, type CitationKey } from "./references";

/** The media type of a .bib file (common practice; no registered type exists). */
export const BIBTEX_CONTENT_TYPE = "application/x-bibtex; charset=utf-8";

/** Longer than every key of the registry joined, short enough to bound the work. */
const MAX_KEYS_LENGTH = 4000;

const referencesQuerySchema = z.object({
  keys: z
    .string()
    .max(MAX_KEYS_LENGTH, `References: the list of keys is at most ${MAX_KEYS_LENGTH} characters.`)
    .transform((text, context) => {
      const keys = text.split(",").map((key) => key.trim());
      const unknown = keys.find((key) => !isCitationKey(key));
      if (unknown !== undefined) {
        context.addIssue({ code: "custom", message: `References: "${unknown.slice(0, 40)}" is not a reference key; the References page lists every key.` });
        return z.NEVER;
      }
      return [...new Set(keys)] as CitationKey[];
    })
    .optional(),
});

/** The .bib of the keys a query names (every reference without `keys`) and its file name; 400 naming an unknown key. */
export function referencesDownload(query: unknown): { bib: string; fileName: string } {
  const { keys } = parseOrThrow(referencesQuerySchema, query, "references");
  return {
    bib: bibtexFile(keys ?? citationKeys),
    fileName: keys === undefined ? "arcwright-references.bib" : "arcwright-references-selected.bib",
  };
}

/**
 * GET /api/references?keys=hogg1999,paczynski1986: the BibTeX of those references (every one without
 * `keys`), as a download. Open to everyone: it reads no session and no proposal, only the registry.
 */
export function referencesRoutes() {
  return {
    GET: handle(async (request: Request) => {
      const { bib, fileName } = referencesDownload(queryOf(request));
      return new Response(bib, { headers: attachmentHeaders(fileName, BIBTEX_CONTENT_TYPE) });
    }),
  };
}
