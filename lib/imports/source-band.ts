/**
 * A source band written in an imported cell, read as one of our band ids (`lib/photometry/bands.ts`
 * and the proposal's own `custom`): our id ("jc-i", "2mass-ks"), the band's label as we show it
 * ("I (Johnson–Cousins)", "i (SDSS)"), a letter with its system in either order ("SDSS r",
 * "Ks 2MASS"), or a letter alone. A letter alone follows the trade's case convention (common
 * practice): capitals U B V R I are Johnson–Cousins, lower-case u g r i z are SDSS, J H Ks are 2MASS.
 * "Johnson" names only U B V and "Cousins" only R I, the two halves of the Johnson–Cousins system
 * (Bessell 2005, ARA&A 43, 293): a Johnson R or I is another filter, and is refused.
 */
import { standardBands } from "@/lib/photometry/bands";
import { CUSTOM_BAND_ID } from "@/lib/workspace/photometry-schema";

/** How a cell names a band's system, folded (lower case, no spaces or dashes), by our label's system. */
const systemSpellings: Record<string, string[]> = {
  "Johnson–Cousins": ["johnsoncousins", "jc", "bessell"],
  SDSS: ["sdss", "sloan"],
  "2MASS": ["2mass"],
};
const halfSystems: Record<string, { system: string; letters: string[] }> = {
  johnson: { system: "Johnson–Cousins", letters: ["u", "b", "v"] },
  cousins: { system: "Johnson–Cousins", letters: ["r", "i"] },
};

interface BandLetter {
  id: string;
  /** The letter as our label writes it ("I", "i", "Ks"). */
  letter: string;
  system: string;
}

/** Each built-in band's letter and system, read from its label "I (Johnson–Cousins)". */
const bandLetters: BandLetter[] = standardBands.map((band) => {
  const open = band.label.indexOf(" (");
  return { id: band.id, letter: band.label.slice(0, open), system: band.label.slice(open + 2, -1) };
});

const fold = (text: string) => text.toLowerCase().replace(/[\s\u2010-\u2015_-]+/g, "");

/** The letter spellings of a band: "Ks" also as "K_s"; folded for a match with a named system. */
const letterMatches = (band: BandLetter, letter: string) => fold(letter) === fold(band.letter);

function bandInSystem(letter: string, systemText: string): string | undefined {
  const folded = fold(systemText);
  const half = halfSystems[folded];
  if (half !== undefined) {
    if (!half.letters.includes(fold(letter))) return undefined;
    return bandLetters.find((band) => band.system === half.system && letterMatches(band, letter))?.id;
  }
  const system = Object.keys(systemSpellings).find((name) => systemSpellings[name].includes(folded));
  return system === undefined ? undefined : bandLetters.find((band) => band.system === system && letterMatches(band, letter))?.id;
}

/** A letter alone, case kept ("I" Johnson–Cousins, "i" SDSS); Ks in any case, with or without "_", being no other band's. */
function bandOfLetter(letter: string): string | undefined {
  const exact = bandLetters.filter((band) => band.letter === letter || (band.letter === "Ks" && fold(letter) === "ks"));
  return exact.length === 1 ? exact[0].id : undefined;
}

/** Splits "I (Johnson–Cousins)", "SDSS r" or "r SDSS" into a letter and a system; undefined for one word. */
function letterAndSystem(text: string): { letter: string; system: string } | undefined {
  if (text.endsWith(")")) {
    const open = text.lastIndexOf("(");
    if (open > 0) return { letter: text.slice(0, open).trim(), system: text.slice(open + 1, -1).trim() };
  }
  const words = text.split(" ").filter(Boolean);
  if (words.length < 2) return undefined;
  const first = words[0];
  const last = words.at(-1)!;
  // The letter is the shorter end: "SDSS r", "r SDSS", "Johnson Cousins I", "Ks 2MASS".
  return last.length < first.length ? { letter: last, system: words.slice(0, -1).join(" ") } : { letter: first, system: words.slice(1).join(" ") };
}

/** The band id a cell names, or undefined when it names none of ours. */
export function sourceBandOfText(text: string): string | undefined {
  // "I band", "I-band": the word names nothing more.
  const spaced = text.trim().replace(/\s+/g, " ");
  const written = /[ -]band$/i.test(spaced) ? spaced.slice(0, -5).trim() : spaced;
  const lower = written.toLowerCase();
  if (lower === CUSTOM_BAND_ID) return CUSTOM_BAND_ID;
  const byId = bandLetters.find((band) => band.id === lower);
  if (byId !== undefined) return byId.id;
  const split = letterAndSystem(written);
  return split === undefined ? bandOfLetter(written) : bandInSystem(split.letter, split.system);
}

/** What a refused band cell is told to write instead. */
export const sourceBandChoicesText = `write a band id such as jc-i, sdss-r or 2mass-ks, a letter with its system such as "I (Johnson–Cousins)" or "i (SDSS)", "custom" for the proposal's own band, or leave the cell empty for the proposal's band`;
