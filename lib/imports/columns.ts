import type { ImportColumn } from "@/lib/imports/import-table";

/** The target fields an imported column can fill, in the order the mapping step shows them. */
export const importFields = [
  "name",
  "ra",
  "dec",
  "lensModel",
  "lensRedshift",
  "sourceRedshift",
  "lensDistancePc",
  "sourceDistancePc",
  "lensMassSolar",
  "velocityDispersionKmPerS",
  "sourceOffsetThetaE",
  "properMotionMasPerYr",
  "priority",
  "tags",
] as const;
export type ImportField = (typeof importFields)[number];

/** Fields without which no row can become a target. */
export const requiredImportFields: readonly ImportField[] = ["name", "ra", "dec"];

export const importFieldLabels: Record<ImportField, string> = {
  name: "Name",
  ra: "RA",
  dec: "Dec",
  lensModel: "Lens model",
  lensRedshift: "Lens redshift",
  sourceRedshift: "Source redshift",
  lensDistancePc: "Lens distance",
  sourceDistancePc: "Source distance",
  lensMassSolar: "Lens mass",
  velocityDispersionKmPerS: "Velocity dispersion",
  sourceOffsetThetaE: "Source offset (θ_E)",
  properMotionMasPerYr: "Relative proper motion",
  priority: "Priority",
  tags: "Tags",
};

/** How a field's cells are read; the quantity kinds take a unit. */
export type FieldKind = "text" | "ra" | "dec" | "lensModel" | "number" | "integer" | "tags" | "mass" | "distance" | "velocity" | "properMotion";

export const importFieldKinds: Record<ImportField, FieldKind> = {
  name: "text",
  ra: "ra",
  dec: "dec",
  lensModel: "lensModel",
  lensRedshift: "number",
  sourceRedshift: "number",
  lensDistancePc: "distance",
  sourceDistancePc: "distance",
  lensMassSolar: "mass",
  velocityDispersionKmPerS: "velocity",
  sourceOffsetThetaE: "number",
  properMotionMasPerYr: "properMotion",
  priority: "integer",
  tags: "tags",
};

/** The unit a bare number is read in when the file names none (the unit in the field's name). */
export const defaultUnits: Partial<Record<FieldKind, string>> = {
  mass: "Msun",
  distance: "pc",
  velocity: "km/s",
  properMotion: "mas/yr",
};

/** Which column fills a field, and in which unit its bare numbers are read. */
export interface ColumnAssignment {
  /** Index into the table's columns. */
  column: number;
  /** For quantities and RA: the unit of bare numbers in the column. */
  unit?: string;
  /** True when no unit came from the file and the field's default unit is assumed (show it). */
  isUnitAssumed?: boolean;
}

export type ColumnMapping = Partial<Record<ImportField, ColumnAssignment>>;

// Header spellings seen in catalogues and spreadsheets (common practice), compared after
// lower-casing and removing everything but letters and digits.
const headerSpellings: Record<ImportField, string[]> = {
  name: ["name", "target", "targetname", "object", "objectname", "objname", "id", "identifier", "designation", "mainid", "sourcename", "lensname"],
  ra: ["ra", "raj2000", "raicrs", "ra2000", "rightascension", "alpha", "alphaj2000", "radeg", "rahms"],
  dec: ["dec", "decl", "dej2000", "decj2000", "deicrs", "decicrs", "dec2000", "declination", "delta", "deltaj2000", "decdeg", "decdms"],
  lensModel: ["model", "lensmodel", "profile", "lensprofile", "lenstype"],
  lensRedshift: ["zl", "zlens", "lensz", "lensredshift", "redshiftlens", "zd", "zdeflector", "zlen"],
  sourceRedshift: ["zs", "zsource", "sourcez", "sourceredshift", "redshiftsource", "zsrc", "zq", "zqso"],
  lensDistancePc: ["dl", "dlens", "lensdistance", "distancelens", "distlens", "lensdist"],
  sourceDistancePc: ["ds", "dsource", "sourcedistance", "distancesource", "distsource", "sourcedist"],
  lensMassSolar: ["mass", "lensmass", "masslens", "mlens", "ml", "mlen"],
  velocityDispersionKmPerS: ["sigma", "sigmav", "sigmal", "veldisp", "velocitydispersion", "vdisp", "sigmalens", "lenssigma"],
  sourceOffsetThetaE: ["u0", "umin", "beta", "offset", "sourceoffset", "impactparameter", "betathetae", "sourceoffsetthetae"],
  properMotionMasPerYr: ["mu", "murel", "mul", "pm", "pmrel", "propermotion", "relativepropermotion", "relpm"],
  priority: ["priority", "prio", "rank"],
  tags: ["tags", "tag", "labels", "label", "keywords"],
};

// A unit written as the last word of a header ("dist_kpc", "sigma_kms"), common practice in catalogues.
const headerUnitWords: Record<string, string> = {
  pc: "pc",
  kpc: "kpc",
  mpc: "Mpc",
  gpc: "Gpc",
  msun: "Msun",
  msol: "Msun",
  solmass: "Msun",
  kms: "km/s",
  masyr: "mas/yr",
  deg: "deg",
  hms: "h",
  dms: "deg",
};

// UCD1+ words (IVOA UCD1+ controlled vocabulary 1.5) that name one field without doubt. Redshift
// (src.redshift) and distance (pos.distance) do not say lens or source, so only the header can.
const ucdFields: Record<string, ImportField> = {
  "pos.eq.ra": "ra",
  "pos.eq.dec": "dec",
  "phys.mass": "lensMassSolar",
  "phys.veloc.dispersion": "velocityDispersionKmPerS",
  "pos.pm": "properMotionMasPerYr",
};

function headerWords(name: string): string[] {
  return name
    .replace(/([a-z])([A-Z])/g, "$1 $2")
    .toLowerCase()
    .split(/[^a-z0-9]+/)
    .filter(Boolean);
}

/** A header read as a field spelling and perhaps a trailing unit word. */
function readHeader(name: string): { spelling: string; unit?: string } {
  const words = headerWords(name);
  const last = words.at(-1);
  if (words.length > 1 && last !== undefined && last in headerUnitWords) {
    return { spelling: words.slice(0, -1).join(""), unit: headerUnitWords[last] };
  }
  return { spelling: words.join("") };
}

function fieldFromUcd(ucd: string | undefined): ImportField | undefined {
  if (ucd === undefined) return undefined;
  const words = ucd.toLowerCase().split(";").map((word) => word.trim());
  if (words[0] === "meta.id" && words.includes("meta.main")) return "name";
  return ucdFields[words[0]];
}

/**
 * Proposes which column fills which field: header spellings first, then VOTable UCDs for the fields
 * still open; each column fills at most one field and each field comes from one column (the first).
 * Units come from the file (VOTable unit, "[kpc]" in a header, a trailing unit word); where none is
 * given the field's default unit is assumed and marked so the mapping step can show it.
 */
export function proposeColumnMapping(columns: ImportColumn[]): ColumnMapping {
  const mapping: ColumnMapping = {};
  const taken = new Set<number>();
  const units = new Map<number, string | undefined>();
  const assign = (field: ImportField, column: number) => {
    if (mapping[field] !== undefined || taken.has(column)) return;
    taken.add(column);
    const fileUnit = columns[column].unit ?? units.get(column);
    const fallback = defaultUnits[importFieldKinds[field]];
    mapping[field] =
      fileUnit !== undefined && (fallback !== undefined || field === "ra")
        ? { column, unit: fileUnit }
        : fallback !== undefined
          ? { column, unit: fallback, isUnitAssumed: true }
          : { column };
  };
  columns.forEach((column, index) => {
    const header = readHeader(column.name);
    units.set(index, header.unit);
    const field = importFields.find((candidate) => headerSpellings[candidate].includes(header.spelling));
    if (field) assign(field, index);
  });
  columns.forEach((column, index) => {
    const field = fieldFromUcd(column.ucd);
    if (field) assign(field, index);
  });
  return mapping;
}
