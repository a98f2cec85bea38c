/**
 * What every exported table and figure carries so a colleague can regenerate it months later: the
 * inputs, the constants and cosmology used (with their sources), the product version, the time of
 * export and a link back to the view that reproduces it.
 */
import packageJson from "@/package.json";
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
  source: string;
}

/** An input value as written into a provenance record. */
export type ProvenanceValue = string | number | boolean | null;

export interface Provenance {
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
}

/** The constants lib/physics computes with; values come from lib/physics/constants.ts, never re-typed. */
export const provenanceConstants: ProvenanceConstant[] = [
  { name: "GM_sun", value: GM_SUN_M3_PER_S2, unit: "m3 s-2", source: "IAU 2015 Resolution B3 (nominal)" },
  { name: "c", value: SPEED_OF_LIGHT_M_PER_S, unit: "m s-1", source: "SI, exact (17th CGPM 1983)" },
  { name: "au", value: AU_M, unit: "m", source: "IAU 2012 Resolution B2, exact" },
  { name: "pc", value: PARSEC_M, unit: "m", source: "IAU 2015 Resolution B2: (648000/pi) au" },
  { name: "day", value: DAY_S, unit: "s", source: "IAU: 86400 SI seconds" },
  { name: "Julian year", value: JULIAN_YEAR_S, unit: "s", source: "IAU: 365.25 days" },
];

interface ProvenanceRequest {
  subject: string;
  reproduceUrl: string;
  inputs: Record<string, ProvenanceValue>;
  cosmology?: Cosmology;
  exportedAt?: Date;
}

/** A provenance record; the time of export defaults to now. */
export function buildProvenance({ subject, reproduceUrl, inputs, cosmology = DEFAULT_COSMOLOGY, exportedAt = new Date() }: ProvenanceRequest): Provenance {
  return {
    product: PRODUCT_NAME,
    version: PRODUCT_VERSION,
    exportedAt: exportedAt.toISOString(),
    subject,
    reproduceUrl,
    inputs,
    constants: provenanceConstants,
    cosmology: { model: "flat LambdaCDM", H0KmPerSPerMpc: cosmology.H0, Om0: cosmology.Om0, source: "lib/physics/cosmology.ts (radiation neglected)" },
  };
}

/**
 * The record as short "key: value" lines for comment-style carriers (LaTeX comments, PNG text, PDF
 * subject). Plain ASCII except where an input itself holds other characters.
 */
export function provenanceLines(p: Provenance): string[] {
  return [
    `${p.subject}`,
    `Exported by ${p.product} ${p.version} at ${p.exportedAt}`,
    `Reproduce: ${p.reproduceUrl}`,
    ...Object.entries(p.inputs).map(([key, value]) => `Input ${key}: ${value === null ? "none" : String(value)}`),
    `Cosmology: ${p.cosmology.model}, H0 = ${p.cosmology.H0KmPerSPerMpc} km/s/Mpc, Om0 = ${p.cosmology.Om0} (${p.cosmology.source})`,
    ...p.constants.map((c) => `Constant ${c.name} = ${c.value} ${c.unit} (${c.source})`),
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
