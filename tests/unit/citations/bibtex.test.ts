import bibtexParse from "bibtex-parse";
import { describe, expect, it } from "vitest";
import { bibtexEntry, bibtexFile, latexText } from "@/lib/citations/bibtex";
import { citationText } from "@/lib/citations/cite";
import { citationKeys, isCitationKey } from "@/lib/citations/references";
import { buildProvenance, provenanceConstants, provenanceLines } from "@/lib/exports/provenance";
import { feasibilityRuleReferences } from "@/lib/lensing/feasibility-rules";

type ParsedEntry = { key: string; type: string } & Record<string, unknown>;

/** The .bib read by bibtex-parse 2.1.0 (an independent parser from npm), which throws on a syntax error. */
const parsed = (bib: string): ParsedEntry[] => bibtexParse.entries(bib) as ParsedEntry[];

describe("the references as BibTeX, read back by bibtex-parse", () => {
  const bib = bibtexFile();
  const entries = parsed(bib);

  it("parses every entry of the registry, each with its key, type, author, title and year", () => {
    expect(entries.map((e) => e.key)).toEqual(citationKeys);
    for (const entry of entries) {
      expect(["article", "book", "inproceedings", "misc"], entry.key).toContain(entry.type);
      for (const field of ["AUTHOR", "TITLE", "YEAR"]) expect(entry[field], `${entry.key} ${field}`).toBeTruthy();
    }
  });

  it("has unique keys even as BibTeX compares them, without regard to case", () => {
    const lower = entries.map((e) => e.key.toLowerCase());
    expect(new Set(lower).size).toBe(lower.length);
  });

  it("is plain ASCII (classic BibTeX reads no other encoding), with accents as LaTeX commands", () => {
    expect(/^[\x20-\x7E\n]*$/.test(bib)).toBe(true);
    expect(bibtexEntry("paczynski1986")).toContain("author = {Paczy{\\'n}ski, Bohdan}");
    expect(bibtexEntry("hog1995")).toContain("H{\\o}g, Erik");
    expect(bibtexEntry("einstein1915")).toContain("K{\\\"o}niglich Preu{\\ss}ischen");
    expect(bibtexEntry("eht2019")).toContain("author = {{Event Horizon Telescope Collaboration}}");
    expect(bibtexEntry("prsa2016")).toContain("author = {Pr{\\v{s}}a, Andrej and Harmanec, Petr and Torres, Guillermo and others}");
  });

  it("writes DOIs, arXiv ids and ADS links as they are", () => {
    const hogg = parsed(bibtexEntry("hogg1999"))[0];
    expect(hogg.EPRINT).toBe("astro-ph/9905116");
    expect(hogg.ARCHIVEPREFIX).toBe("arXiv");
    const paczynski = parsed(bibtexEntry("paczynski1986"))[0];
    expect(paczynski.DOI).toBe("10.1086/164140");
    expect(paczynski.ADSURL).toBe("https://ui.adsabs.harvard.edu/abs/1986ApJ...304....1P");
    expect(paczynski.JOURNAL).toBe("The Astrophysical Journal");
  });

  it("gives a selection of keys only those entries", () => {
    expect(parsed(bibtexFile(["hogg1999", "eht2019"])).map((e) => e.key)).toEqual(["hogg1999", "eht2019"]);
  });
});

describe("LaTeX spelling of reference text", () => {
  it("escapes LaTeX's special characters and spells accents, dotless i included", () => {
    expect(latexText("A&A 50% $x_1$ #3")).toBe("A\\&A 50\\% \\$x\\_1\\$ \\#3");
    expect(latexText("Sæmundsson, Þorsteinn")).toBe("S{\\ae}mundsson, {\\TH}orsteinn");
    expect(latexText("Gutiérrez – Nørsett")).toBe("Guti{\\'e}rrez -- N{\\o}rsett");
    expect(latexText("í")).toBe("{\\'\\i}");
    expect(latexText("Prša, Šafařík")).toBe("Pr{\\v{s}}a, {\\v{S}}afa{\\v{r}}{\\'\\i}k");
  });

  it("refuses a character it has no spelling for rather than writing a file classic BibTeX misreads", () => {
    expect(() => latexText("θ_E")).toThrow(/U\+03B8/);
  });
});

describe("every key the product cites is in the registry", () => {
  it("the provenance of an export names the constants' and the cosmology's references, with a link to their BibTeX", () => {
    const p = buildProvenance({ subject: "Test", reproduceUrl: "https://arcwright.example/proposals/1", inputs: {}, references: ["paczynski1986"], exportedAt: new Date(0) });
    const keys = p.references.map((r) => r.key);
    expect(keys).toEqual(["prsa2016", "cgpm1983", "iau2012b2", "iau2015b2", "wilkins1989", "hogg1999", "paczynski1986"]);
    for (const key of keys) expect(isCitationKey(key)).toBe(true);
    expect(p.bibtexUrl).toBe(`https://arcwright.example/api/references?keys=${keys.join(",")}`);
    expect(p.references.at(-1)).toEqual({ key: "paczynski1986", citation: "Paczyński 1986, ApJ 304, 1" });
    // Item 8 of issue 18: the cosmology's source names the formulas' paper, not a source file.
    expect(p.cosmology.source).toBe("distances: Hogg 1999, arXiv:astro-ph/9905116 (flat Lambda-CDM, radiation neglected); H0 and Om0: a common-practice default, not a measurement");
    expect(provenanceLines(p)).toContain("Reference hogg1999: Hogg 1999, arXiv:astro-ph/9905116");
  });

  it("each constant's source is its reference's citation", () => {
    for (const c of provenanceConstants) expect(c.source.startsWith(citationText(c.reference)), c.name).toBe(true);
    expect(provenanceConstants.find((c) => c.name === "au")?.source).toBe(
      "International Astronomical Union 2012, Resolution B2 of the XXVIII General Assembly: On the re-definition of the astronomical unit of length: exact",
    );
  });

  it("the feasibility rules' references exist, and the short citations read as running text does", () => {
    for (const rule of feasibilityRuleReferences) for (const key of rule.references) expect(isCitationKey(key), key).toBe(true);
    expect(citationText("lee2009")).toBe("Lee et al. 2009, ApJ 695, 200");
    expect(citationText("wittmao1994")).toBe("Witt & Mao 1994, ApJ 430, 505");
    expect(citationText("howell2006")).toBe("Howell 2006, Handbook of CCD Astronomy, 2nd ed. (Cambridge University Press)");
  });
});
