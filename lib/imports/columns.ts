import { exportColumns } from "@/lib/exports/tables/columns";
import type { ImportColumn } from "@/lib/imports/import-table";
import { orbitFields, targetQuantities } from "@/lib/workspace/target-schema";

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
  "scienceCase",
  "eventPeakJdUtc",
  "sourceRadiusSolar",
  "sourceRadiusThetaE",
  "limbDarkeningU",
  "sourceMagnitude",
  "sourceBand",
  "blendFraction",
  "einsteinTimeDays",
  "parallaxNorth",
  "parallaxEast",
  ...orbitFields,
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
  scienceCase: "Science case",
  eventPeakJdUtc: "Event peak t0",
  sourceRadiusSolar: `${targetQuantities.sourceRadiusSolar.label} (R☉)`,
  sourceRadiusThetaE: `${targetQuantities.sourceRadiusThetaE.label} (θ_E)`,
  limbDarkeningU: targetQuantities.limbDarkeningU.label,
  sourceMagnitude: targetQuantities.sourceMagnitude.label,
  sourceBand: "Source band",
  blendFraction: targetQuantities.blendFraction.label,
  einsteinTimeDays: `${targetQuantities.einsteinTimeDays.label} (days)`,
  parallaxNorth: targetQuantities.parallaxNorth.label,
  parallaxEast: targetQuantities.parallaxEast.label,
  orbitSemiMajorAxisAu: "Orbit semi-major axis a (au)",
  orbitSemiMajorAxisMas: "Orbit semi-major axis a (mas at the lens distance)",
  orbitEccentricity: "Orbit eccentricity e",
  orbitPeriodDays: "Orbital period P (days)",
  orbitPeriapsisJdUtc: "Time of periapsis T_p",
  orbitInclinationDeg: "Orbit inclination i (°)",
  orbitNodeDeg: "Orbit ascending node Ω (°)",
  orbitPeriapsisArgumentDeg: "Orbit argument of periapsis ω (°)",
  priority: "Priority",
  tags: "Tags",
};

/** How a field's cells are read; the quantity kinds and the epoch take a unit. */
export type FieldKind =
  | "text"
  | "ra"
  | "dec"
  | "lensModel"
  | "scienceCase"
  | "epoch"
  | "number"
  | "integer"
  | "tags"
  | "mass"
  | "distance"
  | "radius"
  | "velocity"
  | "properMotion"
  | "magnitude"
  | "band";

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
  scienceCase: "scienceCase",
  eventPeakJdUtc: "epoch",
  sourceRadiusSolar: "radius",
  sourceRadiusThetaE: "number",
  limbDarkeningU: "number",
  sourceMagnitude: "magnitude",
  sourceBand: "band",
  blendFraction: "number",
  einsteinTimeDays: "number",
  parallaxNorth: "number",
  parallaxEast: "number",
  // Read by the target schema, a unit typed in the cell included ("120 au", "16 yr", "66 deg"); a
  // bare number is in the field's own unit.
  orbitSemiMajorAxisAu: "number",
  orbitSemiMajorAxisMas: "number",
  orbitEccentricity: "number",
  orbitPeriodDays: "number",
  orbitPeriapsisJdUtc: "epoch",
  orbitInclinationDeg: "number",
  orbitNodeDeg: "number",
  orbitPeriapsisArgumentDeg: "number",
  priority: "integer",
  tags: "tags",
};

/**
 * The unit a bare number is read in when the file names none (the unit in the field's name); for
 * the event peak, the day count a bare number is in: JD (read as written) or MJD.
 */
export const defaultUnits: Partial<Record<FieldKind, string>> = {
  epoch: "JD",
  mass: "Msun",
  distance: "pc",
  radius: "Rsun",
  velocity: "km/s",
  properMotion: "mas/yr",
  magnitude: "mag",
};

/**
 * The units the mapping step offers for a field's bare numbers, the default first: each one a unit
 * the quantity parser reads for the field's kind (checked in tests/unit/imports/columns.test.ts).
 * RA's "" is "as written": sexagesimal hours or decimal degrees, as the coordinate parser reads them.
 */
export const unitChoices: Partial<Record<FieldKind | "ra", readonly string[]>> = {
  ra: ["", "deg", "h"],
  epoch: ["JD", "MJD", "HJD", "BJD"],
  mass: ["Msun", "Mjup", "Mearth", "kg"],
  distance: ["pc", "kpc", "Mpc", "Gpc", "ly", "au"],
  radius: ["Rsun", "Rjup", "km", "au"],
  velocity: ["km/s", "m/s"],
  properMotion: ["mas/yr", "arcsec/yr", "uas/yr"],
  magnitude: ["mag"],
};

/** The unit choices for a field, with the file's own unit first when it is none of them ("km.s-1"). */
export function unitChoicesFor(field: ImportField, current: string | undefined): readonly string[] {
  const choices = unitChoices[field === "ra" ? "ra" : importFieldKinds[field]] ?? [];
  return current === undefined || choices.includes(current) ? choices : [current, ...choices];
}

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
  scienceCase: ["case", "sciencecase", "sciencecaseid", "chosencase", "observingcase"],
  // A time-series catalogue's t0 (microlensing fits write t0, t_0, tmax or a bare HJD column); the
  // last two spellings are this product's own VOTable/ECSV name and CSV header.
  eventPeakJdUtc: ["t0", "tpeak", "peak", "peaktime", "timeofpeak", "peakdate", "tmax", "eventpeak", "jd", "hjd", "bjd", "mjd", "eventpeakjdutc", "eventpeakt0jdutc"],
  sourceRadiusSolar: ["rstar", "rsource", "rsrc", "sourceradius", "starradius", "stellarradius", "sourceradiussolar"],
  sourceRadiusThetaE: ["rho", "rhostar", "rhos", "rhosource", "sourceradiusrho", "sourceradiusthetae"],
  limbDarkeningU: ["ld", "ldu", "ldcoeff", "ldcoefficient", "limbdarkening", "limbdarkeningu", "limbdarkeningcoefficient", "ulimb", "ulinear"],
  // A light-curve fit's source magnitude (I_s, V_s) or a list's one magnitude column; the last two are
  // our own VOTable/ECSV name and CSV header. A baseline (blended) magnitude is no source magnitude.
  sourceMagnitude: ["sourcemag", "srcmag", "magsource", "magsrc", "smag", "mags", "is", "isource", "vs", "vsource", "mag", "magnitude", "sourcemagnitude"],
  sourceBand: ["sourceband", "band", "filter", "passband", "bandpass", "magband", "photband", "sourcefilter"],
  // f_s, or OGLE's Early Warning System "fbl" (the source's share of the baseline flux; from memory).
  blendFraction: ["fs", "fsource", "fsrc", "blendfraction", "blending", "blendingfraction", "sourcefraction", "fbl", "blendfractionfs"],
  // A light-curve fit's t_E and π_E components (tE, piEN, piEE: the usual symbols; common practice),
  // then our own VOTable/ECSV names and CSV headers (a header's bracketed word is set apart as its
  // unit, so "Einstein time t_E (fitted)" is spelled "einsteintimete"). A bare "piE" is the
  // parallax's length, neither component.
  einsteinTimeDays: ["te", "tefit", "teinstein", "einsteintime", "einsteintimedays", "einsteintimete"],
  parallaxNorth: ["pien", "pienorth", "parallaxnorth", "microlensparallaxpienorth"],
  parallaxEast: ["piee", "pieeast", "parallaxeast", "microlensparallaxpieeast"],
  // An orbit's elements by their spelled-out names (common practice in orbit catalogues), then our
  // own VOTable/ECSV names and CSV headers. The one-letter symbols (a, e, P, i, Ω, ω) are matched
  // with their case in `symbolFieldOf`: lower-cased, "I" (a band's magnitude) would be an
  // inclination and "Omega" (the node) would be "omega" (the argument of periapsis). T0 stays the
  // event peak's; a periapsis time is Tp.
  orbitSemiMajorAxisAu: ["aau", "sma", "smaau", "semimajoraxis", "semimajoraxisau", "orbitsemimajoraxisau", "orbitsemimajoraxisa"],
  orbitSemiMajorAxisMas: ["amas", "smamas", "semimajoraxismas", "orbitsemimajoraxismas", "orbitsemimajoraxisaangle"],
  orbitEccentricity: ["ecc", "eccentricity", "orbiteccentricity", "orbiteccentricitye"],
  orbitPeriodDays: ["porb", "orbitalperiod", "orbitperiod", "orbitperioddays", "orbitalperiodp"],
  orbitPeriapsisJdUtc: ["tp", "tperi", "tperiastron", "tperiapsis", "timeofperiapsis", "timeofperiastron", "periastrontime", "periapsistime", "epochofperiastron", "orbitperiapsisjdutc", "timeofperiapsistpjdutc"],
  orbitInclinationDeg: ["incl", "inclination", "orbitinclination", "orbitinclinationi"],
  orbitNodeDeg: ["node", "lan", "ascendingnode", "longitudeofascendingnode", "longitudeoftheascendingnode", "orbitnode", "orbitascendingnodeomega"],
  orbitPeriapsisArgumentDeg: ["argp", "argperi", "periarg", "argumentofperiapsis", "argumentofperiastron", "argumentofpericenter", "orbitperiapsisargument", "orbitargumentofperiapsisomega"],
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
  rsun: "Rsun",
  rsol: "Rsun",
  solrad: "Rsun",
  jd: "JD",
  hjd: "HJD",
  bjd: "BJD",
  mjd: "MJD",
  deg: "deg",
  hms: "h",
  dms: "deg",
};

// UCD1+ words (IVOA UCD1+ controlled vocabulary 1.5) that name one field without doubt. Redshift
// (src.redshift) and distance (pos.distance) do not say lens or source, so only the header can.
// A radius (phys.size.radius) is a source's only in solar radii (a lens galaxy's effective radius is
// given in kpc or arcsec), and time.epoch a peak only in days: an epoch in years is a position's epoch.
const ucdFields: Record<string, ImportField> = {
  "pos.eq.ra": "ra",
  "pos.eq.dec": "dec",
  "phys.mass": "lensMassSolar",
  "phys.veloc.dispersion": "velocityDispersionKmPerS",
  "pos.pm": "properMotionMasPerYr",
  "time.epoch": "eventPeakJdUtc",
  "phys.size.radius": "sourceRadiusSolar",
  "phot.limbdark": "limbDarkeningU",
};
// Whole UCDs that name one field: a flux ratio is f_s, a filter's identifier the source's band. A
// magnitude (phot.mag) alone is not mapped: a catalogue's magnitudes are baselines in several bands,
// so only a header can say which is the source's.
const ucdPhraseFields: Record<string, ImportField> = {
  "phot.flux;arith.ratio": "blendFraction",
  "meta.id;instr.filter": "sourceBand",
  // A periapsis time is an epoch, but not the event peak's.
  "time.epoch;src.orbital.periastron": "orbitPeriapsisJdUtc",
  "src.orbital.eccentricity": "orbitEccentricity",
  "src.orbital.inclination": "orbitInclinationDeg",
  "src.orbital.node": "orbitNodeDeg",
};
const ucdUnitRules: Partial<Record<ImportField, (unit: string) => boolean>> = {
  eventPeakJdUtc: (unit) => epochScaleOf(unit) !== undefined,
  sourceRadiusSolar: (unit) => headerUnitWords[unit.toLowerCase().replace(/[^a-z]/g, "")] === "Rsun",
};

/**
 * The day count a t0 column's bare numbers are in, from its unit or header word: "JD" (as written;
 * an HJD or BJD differs from the JD by at most 8.3 min, below what a schedule of nights resolves,
 * and is read as one, as lib/workspace/event-peak.ts reads "HJD") or "MJD"; undefined for a unit
 * that is no day count. VOUnit "d" on a time.epoch column is a Julian date (common practice).
 */
export function epochScaleOf(unit: string): "JD" | "MJD" | undefined {
  const word = unit.trim().replace(/^"(.*)"$/, "$1").toLowerCase();
  if (word === "mjd") return "MJD";
  return ["jd", "hjd", "bjd", "d", "day", "days"].includes(word) ? "JD" : undefined;
}

// Our own export's computed columns by their VOTable/ECSV name (the key) and CSV header (the label).
const computedColumnNames = new Set(exportColumns.filter((column) => column.origin === "computed").flatMap((column) => [column.key.toLowerCase(), column.label.toLowerCase()]));

/**
 * Whether a column is one this product computes from a target's inputs (the Einstein radius, the
 * science case answered, its verdicts) as its own table export names it: such a column is never
 * read as an input, since re-importing it would turn a computed value (an inferred case) into a
 * typed one.
 */
export function isComputedColumn(column: ImportColumn): boolean {
  return computedColumnNames.has(column.name.trim().toLowerCase());
}

function headerWords(name: string): string[] {
  return name
    .replace(/([a-z])([A-Z])/g, "$1 $2")
    .toLowerCase()
    .split(/[^a-z0-9]+/)
    .filter(Boolean);
}

/** A header read as a field spelling and perhaps a trailing unit word; a lone "HJD" is both. */
function readHeader(name: string): { spelling: string; unit?: string } {
  const words = headerWords(name);
  const last = words.at(-1);
  if (words.length > 1 && last !== undefined && last in headerUnitWords) {
    return { spelling: words.slice(0, -1).join(""), unit: headerUnitWords[last] };
  }
  const spelling = words.join("");
  const dayCount = words.length === 1 ? headerUnitWords[spelling] : undefined;
  return dayCount !== undefined && epochScaleOf(dayCount) !== undefined ? { spelling, unit: dayCount } : { spelling };
}

// The one-letter symbols of an orbit's elements, with their case (common practice in orbit
// catalogues; Ω and ω also as words), and the units (lower-cased) a symbol's column may carry: the
// import reads a cell's bare number in the field's own unit, so a column in another unit (a in
// arcsec, P in years) is left for the user to map knowingly rather than misread.
const orbitSymbols: Record<string, ImportField> = {
  a: "orbitSemiMajorAxisAu",
  e: "orbitEccentricity",
  P: "orbitPeriodDays",
  i: "orbitInclinationDeg",
  Omega: "orbitNodeDeg",
  "\u03a9": "orbitNodeDeg",
  omega: "orbitPeriapsisArgumentDeg",
  "\u03c9": "orbitPeriapsisArgumentDeg",
};
const orbitSymbolUnits: Partial<Record<ImportField, readonly string[]>> = {
  orbitSemiMajorAxisAu: ["au"],
  orbitSemiMajorAxisMas: ["mas"],
  orbitEccentricity: [],
  orbitPeriodDays: ["d", "day", "days"],
  orbitInclinationDeg: ["deg"],
  orbitNodeDeg: ["deg"],
  orbitPeriapsisArgumentDeg: ["deg"],
};

/**
 * The orbit element a header's one-letter symbol names, case kept ("a", "P", "Omega" but not "I" or
 * "OMEGA"), when its unit (the file's, or a trailing word: "i_deg") is none or the field's own; "a"
 * in mas is the angle at the lens distance. Undefined for any other header.
 */
function symbolFieldOf(column: ImportColumn): ImportField | undefined {
  const words = column.name.trim().split(/[^A-Za-z0-9\u03a9\u03c9]+/).filter(Boolean);
  const trailing = words.length === 2 ? headerUnitWords[words[1].toLowerCase()] : undefined;
  if (words.length !== 1 && trailing === undefined) return undefined;
  const symbolField = orbitSymbols[words[0]];
  if (symbolField === undefined) return undefined;
  const unit = (column.unit ?? trailing)?.trim().replace(/^"(.*)"$/, "$1").toLowerCase();
  const field = symbolField === "orbitSemiMajorAxisAu" && unit === "mas" ? "orbitSemiMajorAxisMas" : symbolField;
  return unit === undefined || unit === "" || orbitSymbolUnits[field]!.includes(unit) ? field : undefined;
}

function fieldFromUcd({ ucd, unit }: ImportColumn): ImportField | undefined {
  if (ucd === undefined) return undefined;
  const words = ucd.toLowerCase().split(";").map((word) => word.trim());
  if (words[0] === "meta.id" && words.includes("meta.main")) return "name";
  const phraseField = ucdPhraseFields[words.join(";")];
  if (phraseField !== undefined) return phraseField;
  const field = ucdFields[words[0]];
  const unitRule = field === undefined ? undefined : ucdUnitRules[field];
  return unitRule === undefined || (unit !== undefined && unitRule(unit)) ? field : undefined;
}

/**
 * Proposes which column fills which field: header spellings first, then VOTable UCDs for the fields
 * still open; each column fills at most one field and each field comes from one column (the first).
 * Our own export's computed columns fill none. Units come from the file (VOTable unit, "[kpc]" in a
 * header, a trailing unit word; for the event peak a header's "MJD" before a unit "d", which gives
 * only the dimension); where none is given the field's default unit is assumed and marked so the
 * mapping step can show it.
 */
export function proposeColumnMapping(columns: ImportColumn[]): ColumnMapping {
  const mapping: ColumnMapping = {};
  const taken = new Set<number>();
  const units = new Map<number, string | undefined>();
  const assign = (field: ImportField, column: number) => {
    if (mapping[field] !== undefined || taken.has(column)) return;
    taken.add(column);
    const headerUnit = units.get(column);
    const fileUnit = importFieldKinds[field] === "epoch" && headerUnit !== undefined ? headerUnit : (columns[column].unit ?? headerUnit);
    const fallback = defaultUnits[importFieldKinds[field]];
    mapping[field] =
      fileUnit !== undefined && (fallback !== undefined || field === "ra")
        ? { column, unit: fileUnit }
        : fallback !== undefined
          ? { column, unit: fallback, isUnitAssumed: true }
          : { column };
  };
  const inputs = columns.flatMap((column, index) => (isComputedColumn(column) ? [] : [{ column, index }]));
  for (const { column, index } of inputs) {
    const header = readHeader(column.name);
    units.set(index, header.unit);
    const field = symbolFieldOf(column) ?? importFields.find((candidate) => headerSpellings[candidate].includes(header.spelling));
    if (field) assign(field, index);
  }
  for (const { column, index } of inputs) {
    const field = fieldFromUcd(column);
    if (field) assign(field, index);
  }
  return mapping;
}

// Headers of free text about a target (common practice in observing lists).
const noteSpellings = new Set(["note", "notes", "comment", "comments", "remark", "remarks", "description"]);

/**
 * The column whose text becomes the first note of each new target: the first column no field takes
 * whose header is a notes header ("notes", "comment", "remarks"); undefined when there is none.
 */
export function proposeNoteColumn(columns: readonly ImportColumn[], mapping: ColumnMapping): number | undefined {
  const taken = new Set(Object.values(mapping).map((assignment) => assignment.column));
  const index = columns.findIndex((column, i) => !taken.has(i) && !isComputedColumn(column) && noteSpellings.has(readHeader(column.name).spelling));
  return index < 0 ? undefined : index;
}

/** A column of the file that fills no field, and what it could have been. */
export interface UnmappedColumn {
  column: number;
  name: string;
  /** Why it is not imported, in the user's words. */
  reason: string;
}


/**
 * The columns no field takes under `mapping`, each with what it could be: a computed column of our
 * own export, a field already filled from another column, a magnitude beyond the one source
 * magnitude a target keeps, free text (notes), or nothing the import knows.
 */
export function unmappedColumns(columns: readonly ImportColumn[], mapping: ColumnMapping, noteColumn?: number | null): UnmappedColumn[] {
  const taken = new Map<number, ImportField | "note">();
  if (noteColumn != null) taken.set(noteColumn, "note");
  for (const field of importFields) {
    const assignment = mapping[field];
    if (assignment !== undefined) taken.set(assignment.column, field);
  }
  return columns.flatMap((column, index): UnmappedColumn[] => {
    if (taken.has(index)) return [];
    const spelling = readHeader(column.name).spelling;
    const field = symbolFieldOf(column) ?? importFields.find((candidate) => headerSpellings[candidate].includes(spelling)) ?? fieldFromUcd(column);
    const filledFrom = field === undefined ? undefined : mapping[field];
    const reason = isComputedColumn(column)
      ? "computed from a target's inputs; not imported"
      : field !== undefined && filledFrom !== undefined
        ? `could be ${importFieldLabels[field]}, which comes from column "${columns[filledFrom.column]?.name}"; not imported`
        : field !== undefined
          ? `could be ${importFieldLabels[field]}: choose it above; not imported`
          : /mag/.test(spelling) || column.ucd?.toLowerCase().startsWith("phot.mag")
            ? "a magnitude: a target keeps one source magnitude (with its band); not imported"
            : noteSpellings.has(spelling)
              ? "notes: choose it as the first note of each new target; not imported"
              : "not imported";
    return [{ column: index, name: column.name, reason }];
  });
}
