import bibtexParse from "bibtex-parse";
import { describe, expect, it } from "vitest";
import { AppError } from "@/lib/errors";
import { referencesDownload } from "@/lib/citations/bibtex-route";
import { citationKeys } from "@/lib/citations/references";

describe("GET /api/references: the BibTeX download, open to everyone", () => {
  it("without keys is every reference, a file bibtex-parse reads whole", () => {
    const { bib, fileName } = referencesDownload({});
    expect(fileName).toBe("arcwright-references.bib");
    expect(bibtexParse.entries(bib).map((e) => e.key)).toEqual(citationKeys);
  });

  it("with the keys a provenance names is those entries, each once", () => {
    const { bib } = referencesDownload({ keys: "hogg1999,paczynski1986,hogg1999" });
    expect(bibtexParse.entries(bib).map((e) => e.key)).toEqual(["hogg1999", "paczynski1986"]);
  });

  it("refuses an unknown key, naming it in the user's words", () => {
    let refusal: unknown;
    try {
      referencesDownload({ keys: "hogg1999,nobody2099" });
    } catch (error) {
      refusal = error;
    }
    expect(refusal).toBeInstanceOf(AppError);
    expect((refusal as AppError).fields).toEqual({ keys: ['References: "nobody2099" is not a reference key; the References page lists every key.'] });
  });
});
