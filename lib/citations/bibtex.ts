/**
 * The registry as BibTeX (the .bib format of O. Patashnik, "BibTeXing", 1988), plain ASCII so that
 * classic BibTeX, biber and every reference manager read it: accents as LaTeX commands (ń → {\'n}),
 * the characters LaTeX treats specially escaped, titles braced whole so styles keep their case.
 *
 * Written here rather than with a package: the npm packages that write BibTeX (citation-js and its
 * plugins) convert from CSL-JSON through a general framework many times this module's size, and the
 * format the registry needs is a dozen fields of one entry per reference.
 */
import { citationKeys, journals, OTHERS, references, type CitationKey, type Reference } from "./references";

/** LaTeX accent commands by Unicode combining mark (what NFD splits an accented letter into). */
const ACCENTS: Record<string, string> = {
  "\u0300": "`",
  "\u0301": "'",
  "\u0302": "^",
  "\u0303": "~",
  "\u0304": "=",
  "\u0306": "u",
  "\u0307": ".",
  "\u0308": '"',
  "\u030A": "r",
  "\u030B": "H",
  "\u030C": "v",
  "\u0327": "c",
  "\u0328": "k",
};

/** Letters NFD does not split, and punctuation, as LaTeX writes them. */
const LETTERS: Record<string, string> = {
  ø: "{\\o}",
  Ø: "{\\O}",
  ł: "{\\l}",
  Ł: "{\\L}",
  ß: "{\\ss}",
  æ: "{\\ae}",
  Æ: "{\\AE}",
  œ: "{\\oe}",
  Œ: "{\\OE}",
  þ: "{\\th}",
  Þ: "{\\TH}",
  ð: "{\\dh}",
  Ð: "{\\DH}",
  "–": "--",
  "—": "---",
  "‘": "`",
  "’": "'",
};

/** ASCII characters LaTeX gives a meaning of their own. */
const SPECIALS: Record<string, string> = {
  "\\": "\\textbackslash{}",
  "{": "\\{",
  "}": "\\}",
  "&": "\\&",
  "%": "\\%",
  $: "\\$",
  "#": "\\#",
  _: "\\_",
  "~": "\\textasciitilde{}",
  "^": "\\textasciicircum{}",
};

/**
 * Unicode text as ASCII LaTeX. Throws for a character with no spelling here (the registry's test
 * writes every entry, so a new one fails there, not in a user's download).
 */
export function latexText(text: string): string {
  let out = "";
  for (const char of text.normalize("NFD")) {
    const accent = ACCENTS[char];
    if (accent !== undefined) {
      // The accent follows its base letter in NFD: wrap the letter just written (dotless i and j). A
      // letter command takes its argument braced ({\\v{s}}: "\\vs" would be one control word).
      const last = out.slice(-1);
      const base = last === "i" ? "\\i" : last === "j" ? "\\j" : last;
      out = `${out.slice(0, -1)}{\\${accent}${/[a-z]/i.test(accent) ? `{${base}}` : base}}`;
    } else if (SPECIALS[char] !== undefined) out += SPECIALS[char];
    else if (LETTERS[char] !== undefined) out += LETTERS[char];
    else if (char >= " " && char <= "~") out += char;
    else throw new Error(`No LaTeX spelling for the character U+${char.codePointAt(0)!.toString(16).toUpperCase().padStart(4, "0")} in "${text}".`);
  }
  return out;
}

/** One name of an author list: a person as "Last, Given" in LaTeX; an organization braced whole. */
function authorName(author: string): string {
  if (author === OTHERS) return "others";
  return author.includes(",") ? latexText(author) : `{${latexText(author)}}`;
}

const names = (list: readonly string[]) => list.map(authorName).join(" and ");

/** The fields of an entry in the order they are written; values already in BibTeX form. */
function fieldsOf(r: Reference): [string, string | undefined][] {
  return [
    ["author", names(r.authors)],
    ["title", `{${latexText(r.title)}}`],
    ["journal", r.journal === undefined ? undefined : latexText(journals[r.journal])],
    ["booktitle", r.booktitle === undefined ? undefined : latexText(r.booktitle)],
    ["editor", r.editors === undefined ? undefined : names(r.editors)],
    ["year", String(r.year)],
    ["volume", r.volume],
    ["number", r.number],
    ["pages", r.pages],
    ["edition", r.edition],
    ["publisher", r.publisher === undefined ? undefined : latexText(r.publisher)],
    ["address", r.address === undefined ? undefined : latexText(r.address)],
    ["howpublished", r.howpublished === undefined ? undefined : latexText(r.howpublished)],
    // Identifiers and addresses are written as they are: styles print them with \url or \doi.
    ["url", r.url],
    ["doi", r.doi],
    ["eprint", r.arxiv],
    ["archiveprefix", r.arxiv === undefined ? undefined : "arXiv"],
    ["adsurl", r.bibcode === undefined ? undefined : `https://ui.adsabs.harvard.edu/abs/${r.bibcode}`],
    ["annote", r.isFromMemory ? "Arcwright: written from memory of the publication; check the details against it before citing." : undefined],
  ];
}

/** One reference as a BibTeX entry, its key the registry's. */
export function bibtexEntry(key: CitationKey): string {
  const r = references[key];
  const fields = fieldsOf(r)
    .filter((field): field is [string, string] => field[1] !== undefined)
    .map(([name, value]) => `  ${name} = {${value}}`);
  return `@${r.kind}{${key},\n${fields.join(",\n")}\n}\n`;
}

/** A .bib file of the given references (every one by default), entries separated by a blank line. */
export function bibtexFile(keys: readonly CitationKey[] = citationKeys): string {
  const header = "% References cited by Arcwright (methods, constants and tables), written by Arcwright as BibTeX.\n\n";
  return header + keys.map(bibtexEntry).join("\n");
}
