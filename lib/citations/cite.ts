/**
 * A reference in a few words, as running text cites it ("Paczyński 1986, ApJ 304, 1"): the form the
 * provenance of exports and the pages show beside a number.
 */
import { OTHERS, referenceOf, type CitationKey, type Reference } from "./references";

/** The family name of a "Last, Given" author, or an organization's whole name. */
function familyName(author: string): string {
  const comma = author.indexOf(",");
  return comma === -1 ? author : author.slice(0, comma);
}

/** "Paczyński", "Witt & Mao", "Lee et al." (common practice in astronomy). */
export function authorsShort(authors: readonly string[]): string {
  const named = authors.filter((a) => a !== OTHERS);
  if (named.length === 1 && authors.length === 1) return familyName(named[0]);
  if (named.length === 2 && authors.length === 2) return `${familyName(named[0])} & ${familyName(named[1])}`;
  return `${familyName(named[0])} et al.`;
}

const firstPage = (pages: string | undefined) => pages?.split("--")[0];

/** Where the work is found, in a few words: journal, volume and first page; the arXiv id; the book. */
function venueOf(r: Reference): string {
  if (r.arxiv !== undefined) return `arXiv:${r.arxiv}`;
  switch (r.kind) {
    case "article":
      return [r.journal, r.volume].filter(Boolean).join(" ") + (r.pages === undefined ? "" : `, ${firstPage(r.pages)}`);
    case "inproceedings":
      return `${r.booktitle}${r.pages === undefined ? "" : `, ${firstPage(r.pages)}`}`;
    case "book":
      return `${r.title}${r.edition === undefined ? "" : `, ${r.edition} ed.`} (${r.publisher})`;
    case "misc":
      return r.title;
  }
}

/** The short citation of a key: authors, year and where the work is found. */
export function citationText(key: CitationKey): string {
  const r = referenceOf(key);
  return `${authorsShort(r.authors)} ${r.year}, ${venueOf(r)}`;
}
