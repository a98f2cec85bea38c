/**
 * What every exported table and figure carries so a colleague can regenerate it months later: the
 * inputs, the constants and cosmology used (with their sources), the references the export depends on
 * (keys of lib/citations and a link to their BibTeX), the product version, the time of export and a
 * link back to the view that reproduces it.
 */
import packageJson from "@/package.json";
import { citationText } from "@/lib/citations/cite";
import type { CitationKey } from "@/lib/citations/references";
import {
  AU_M,
  DAY_S,
  GM_SUN_M3_PER_S2,
  JULIAN_YEAR_S,
  PARSEC_M,
  SPEED_OF_LIGHT_M_PER_S,
} from "@/lib/physics/constants";
import { DEFAULT_COSMOLOGY, type Cosmology } from "@/lib/physics/cosmology";

export const PRODUCT_NAME = "Arcwright";

/** The product version exports are stamped with (package.json `version`). */
export const PRODUCT_VERSION: string = packageJson.version;

export interface ProvenanceConstant {
  name: string;
  value: number;
  unit: string;
  /** The source in words (the reference's short citation and what it fixes). */
  source: string;
  /** The source's key in lib/citations. */
  reference: CitationKey;
}

/** A reference an export depends on: its key in lib/citations and its short citation. */
export interface ProvenanceReference {
  key: CitationKey;
  citation: string;
}

/** An input value as written into a provenance record. */
export type ProvenanceValue = string | number | boolean | null;

/** A type, not an interface, so that generic writers may walk it as a record of fields. */
export type Provenance = {
  product: string;
  version: string;
  /** ISO 8601, UTC. */
  exportedAt: string;
  /** What was exported, in words ("Target table of …"). */
  subject: string;
  /** Absolute URL of the view that reproduces the export. */
  reproduceUrl: string;
  inputs: Record<string, ProvenanceValue>;
  constants: ProvenanceConstant[];
  cosmology: { model: string; H0KmPerSPerMpc: number; Om0: number; source: string };
  /** The constants', the cosmology's and the export's own references, each once, in that order. */
  references: ProvenanceReference[];
  /** Absolute URL of the BibTeX of exactly `references` (`GET /api/references?keys=…`). */
  bibtexUrl: string;
};

/** A constant's source: its reference and, after a colon, what the reference fixes. */
function constantOf(name: string, value: number, unit: string, reference: CitationKey, fixes: string): ProvenanceConstant {
  return { name, value, unit, source: `${citationText(reference)}: ${fixes}`, reference };
}

/** The constants lib/physics computes with; values come from lib/physics/constants.ts, never re-typed. */
export const provenanceConstants: ProvenanceConstant[] = [
  constantOf("GM_sun", GM_SUN_M3_PER_S2, "m3 s-2", "prsa2016", "IAU 2015 Resolution B3, nominal"),
  constantOf("c", SPEED_OF_LIGHT_M_PER_S, "m s-1", "cgpm1983", "SI, exact"),
  constantOf("au", AU_M, "m", "iau2012b2", "exact"),
  constantOf("pc", PARSEC_M, "m", "iau2015b2", "(648000/pi) au"),
  constantOf("day", DAY_S, "s", "wilkins1989", "86400 SI seconds"),
  constantOf("Julian year", JULIAN_YEAR_S, "s", "wilkins1989", "365.25 days"),
];

/** The distance formulas of lib/physics/cosmology.ts. */
const COSMOLOGY_REFERENCE: CitationKey = "hogg1999";

/** Where the cosmology's formulas and its two parameters come from, in words. */
function cosmologySource(cosmology: Cosmology): string {
  const isDefault = cosmology.H0 === DEFAULT_COSMOLOGY.H0 && cosmology.Om0 === DEFAULT_COSMOLOGY.Om0;
  const parameters = isDefault ? "a common-practice default, not a measurement" : "as set for this export";
  return `distances: ${citationText(COSMOLOGY_REFERENCE)} (flat Lambda-CDM, radiation neglected); H0 and Om0: ${parameters}`;
}

interface ProvenanceRequest {
  subject: string;
  reproduceUrl: string;
  inputs: Record<string, ProvenanceValue>;
  cosmology?: Cosmology;
  /** References of the export's own methods and tables, beyond the constants' and the cosmology's. */
  references?: readonly CitationKey[];
  exportedAt?: Date;
}

/** The path of the BibTeX download of some references (the whole file without keys). */
export function bibtexPathOf(keys: readonly CitationKey[]): string {
  return keys.length === 0 ? "/api/references" : `/api/references?keys=${keys.join(",")}`;
}

/** A provenance record; the time of export defaults to now. */
export function buildProvenance({ subject, reproduceUrl, inputs, cosmology = DEFAULT_COSMOLOGY, references = [], exportedAt = new Date() }: ProvenanceRequest): Provenance {
  const keys = [...new Set([...provenanceConstants.map((c) => c.reference), COSMOLOGY_REFERENCE, ...references])];
  return {
    product: PRODUCT_NAME,
    version: PRODUCT_VERSION,
    exportedAt: exportedAt.toISOString(),
    subject,
    reproduceUrl,
    inputs,
    constants: provenanceConstants,
    cosmology: { model: "flat LambdaCDM", H0KmPerSPerMpc: cosmology.H0, Om0: cosmology.Om0, source: cosmologySource(cosmology) },
    references: keys.map((key) => ({ key, citation: citationText(key) })),
    bibtexUrl: new URL(bibtexPathOf(keys), reproduceUrl).toString(),
  };
}

/**
 * The record as short "key: value" lines for comment-style carriers (LaTeX comments, PNG text, PDF
 * subject). Plain ASCII except where an input or an author's name holds other characters.
 */
export function provenanceLines(p: Provenance): string[] {
  return [
    `${p.subject}`,
    `Exported by ${p.product} ${p.version} at ${p.exportedAt}`,
    `Reproduce: ${p.reproduceUrl}`,
    ...Object.entries(p.inputs).map(([key, value]) => `Input ${key}: ${value === null ? "none" : String(value)}`),
    `Cosmology: ${p.cosmology.model}, H0 = ${p.cosmology.H0KmPerSPerMpc} km/s/Mpc, Om0 = ${p.cosmology.Om0} (${p.cosmology.source})`,
    ...p.constants.map((c) => `Constant ${c.name} = ${c.value} ${c.unit} (${c.source})`),
    `References (BibTeX: ${p.bibtexUrl}):`,
    ...p.references.map((r) => `Reference ${r.key}: ${r.citation}`),
  ];
}

/** The response header that carries a table download's provenance record (see `provenanceHeaderValue`). */
export const PROVENANCE_HEADER = "Arcwright-Provenance";

/**
 * The record as one HTTP field value: its JSON with every character outside printable ASCII written
 * as a `\uXXXX` escape, so the value is plain visible ASCII (RFC 9110 §5.5: no line break can end
 * it early) and `JSON.parse` gives back the record exactly.
 */
export function provenanceHeaderValue(p: Provenance): string {
  return JSON.stringify(p).replace(/[^\x20-\x7E]/g, (c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, "0")}`);
}

/** The time of export in ISO 8601 basic form (`20310203T040506Z`), for a file name. */
export function exportStampOf(p: Provenance): string {
  return p.exportedAt.replace(/[-:]/g, "").replace(/\.\d+Z$/, "Z");
}
