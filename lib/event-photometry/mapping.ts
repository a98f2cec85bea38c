/**
 * Which column of a photometry file is the time, the magnitude or flux and its error, the band and
 * the dataset, proposed from the header (names, units, VOTable/ECSV UCDs) and the first values, for
 * the user to confirm. The time scale is taken only from what the file says: never guessed.
 */
import type { ImportColumn, ImportRow } from "@/lib/imports/import-table";
import { MJD_OFFSET_DAYS, timeOffsetsDays, type TimeKind } from "./event-time";
import { timeScales, type TimeScale } from "./time-scales";

export type BrightnessKind = "magnitude" | "flux";

/** The meaning given to a photometry file's columns (indices into its columns); what is unset the user must give. */
export interface PhotometryMapping {
  timeColumn?: number;
  timeKind?: TimeKind;
  /** Days added to each time cell to give the full JD, HJD or BJD (one of `timeOffsetsDays`); unused for an MJD. */
  timeOffsetDays?: number;
  timeScale?: TimeScale;
  brightnessKind?: BrightnessKind;
  valueColumn?: number;
  errorColumn?: number;
  bandColumn?: number;
  /** The band of every row when no column names it (from a magnitude column's header, "I" or "Vmag"). */
  band?: string;
  datasetColumn?: number;
}

export interface PhotometryMappingProposal {
  mapping: PhotometryMapping;
  /** What the proposal assumed or could not tell, in words, for the mapping step to show. */
  notes: string[];
}

/** A header's words: lower case, split at anything but letters, digits and a decimal point ("HJD-2450000" → hjd, 2450000). */
function words(text: string | undefined): string[] {
  return (text ?? "")
    .toLowerCase()
    .split(/[^a-z0-9.]+/)
    .filter(Boolean);
}

// Header words (common practice in survey and follow-up files; our selection).
const timeKindWords: Record<string, { kind: TimeKind; offsetDays?: number }> = {
  jd: { kind: "JD" },
  mjd: { kind: "MJD" },
  hjd: { kind: "HJD" },
  bjd: { kind: "BJD" },
  // Heliocentric and barycentric MJDs (ZTF's "hmjd"): the MJD's offset on an HJD or BJD.
  hmjd: { kind: "HJD", offsetDays: MJD_OFFSET_DAYS },
  bmjd: { kind: "BJD", offsetDays: MJD_OFFSET_DAYS },
};
const timeWords = new Set(["time", "t", "date", "epoch", "obstime", "tobs", "times"]);
const errorWords = new Set(["err", "error", "errors", "sigma", "sig", "e", "unc", "uncertainty", "dmag", "merr", "emag", "sigmag", "eflux", "sigflux", "dflux"]);
const magnitudeWords = new Set(["mag", "mags", "magnitude", "magnitudes"]);
const fluxWords = new Set(["flux", "fluxes", "f", "counts", "cts"]);
const bandWords = new Set(["band", "filter", "passband", "bandpass", "filt"]);
const datasetWords = new Set(["dataset", "telescope", "tel", "observatory", "survey", "site", "instrument", "camera"]);
/** Band letters a magnitude column is named by ("I", "V", "Ks"), as written (case matters: I is Cousins, i SDSS). */
const bandLetters = new Set(["U", "B", "V", "R", "I", "u", "g", "r", "i", "z", "J", "H", "K", "Ks", "G"]);

const ucdWords = (column: ImportColumn) => (column.ucd ?? "").toLowerCase().split(";").map((word) => word.trim());
const isErrorColumn = (column: ImportColumn, tokens: string[]) => ucdWords(column)[0].startsWith("stat.error") || tokens.some((word) => errorWords.has(word) || (word.length > 3 && word.endsWith("err")));

/** A magnitude column's band from its header: "I", "Vmag", "mag_I", or a UCD "phot.mag;em.opt.V". */
function bandOfMagnitudeColumn(column: ImportColumn): string | undefined {
  const name = column.name.trim();
  if (bandLetters.has(name)) return name;
  const parts = name.split(/[^A-Za-z]+/).filter(Boolean);
  for (const part of parts) {
    const letter = part.toLowerCase().endsWith("mag") ? part.slice(0, -3) : part;
    if (letter !== "" && bandLetters.has(letter)) return letter;
  }
  const opt = ucdWords(column).find((word) => word.startsWith("em.opt.") || word.startsWith("em.ir."));
  return opt?.split(".").at(-1)?.toUpperCase();
}

/** The median of the numbers among the first cells of a column (at most 50), or undefined. */
function typicalValue(rows: readonly ImportRow[], column: number): number | undefined {
  const values = rows
    .slice(0, 50)
    .map((row) => Number((row.cells[column] ?? "").trim()))
    .filter((value) => Number.isFinite(value))
    .sort((a, b) => a - b);
  return values.length === 0 ? undefined : values[Math.floor(values.length / 2)];
}

const formatted = (value: number) => value.toLocaleString("en-US", { maximumFractionDigits: 1 });

/**
 * Proposes a mapping from the header and the first rows: header words first, then UCDs and units
 * (`time.epoch` or a unit of days for the time, `phot.mag`/`mag` for magnitudes, `phot.flux` for
 * fluxes, `stat.error` for errors). The time's offset is read from the header ("HJD-2450000") or,
 * when the header gives none, from the values (about 2.45e6: none; 7,000–13,000: 2450000, i.e.
 * 2013–2031). The time scale only from a header word or unit (UTC, TT, TDB).
 */
export function proposePhotometryMapping(columns: readonly ImportColumn[], rows: readonly ImportRow[]): PhotometryMappingProposal {
  const mapping: PhotometryMapping = {};
  const notes: string[] = [];
  const tokens = columns.map((column) => [...words(column.name), ...words(column.unit)]);
  const taken = new Set<number>();
  const take = (index: number | undefined) => {
    if (index !== undefined) taken.add(index);
    return index;
  };

  const timeIndex = take(
    [
      tokens.findIndex((list) => list.some((word) => word in timeKindWords)),
      tokens.findIndex((list) => list.some((word) => timeWords.has(word))),
      columns.findIndex((column) => ucdWords(column)[0] === "time.epoch"),
    ].find((index) => index >= 0),
  );
  if (timeIndex === undefined) {
    notes.push("No column looks like the time: choose the time column.");
  } else {
    const list = tokens[timeIndex];
    const kindWord = list.find((word) => word in timeKindWords);
    const stated = kindWord === undefined ? undefined : timeKindWords[kindWord];
    mapping.timeColumn = timeIndex;
    const scale = timeScales.find((candidate) => list.includes(candidate.toLowerCase()));
    if (scale !== undefined) mapping.timeScale = scale;
    else notes.push("The file does not say which time scale the times are in: say whether they are UTC, TT or TDB.");
    const statedOffset = timeOffsetsDays.find((offset) => offset !== 0 && list.includes(String(offset)));
    const typical = typicalValue(rows, timeIndex);
    const name = columns[timeIndex].name;
    if (stated !== undefined) mapping.timeKind = stated.kind;
    if (stated?.kind === "MJD") mapping.timeOffsetDays = 0;
    else if (stated?.offsetDays !== undefined || statedOffset !== undefined) mapping.timeOffsetDays = stated?.offsetDays ?? statedOffset;
    else if (typical !== undefined && typical > 2_400_000) mapping.timeOffsetDays = 0;
    else if (typical !== undefined && typical >= 7_000 && typical <= 13_000) {
      mapping.timeOffsetDays = 2_450_000;
      notes.push(`The times in “${name}” are around ${formatted(typical)}: read as days after JD 2450000 (2013–2031). Check the offset.`);
    } else if (typical !== undefined) {
      notes.push(`The times in “${name}” are around ${formatted(typical)}: say which offset they are counted from (2400000, 2450000 or 2460000).`);
    }
    if (mapping.timeKind === undefined) {
      const isEpoch = ucdWords(columns[timeIndex])[0] === "time.epoch" && words(columns[timeIndex].unit).some((word) => word === "d" || word === "day" || word === "days");
      if (isEpoch || (typical !== undefined && typical > 2_400_000)) {
        mapping.timeKind = "JD";
        notes.push(`“${name}” is read as a Julian date at the Earth's centre: choose HJD or BJD if the times are heliocentric or barycentric.`);
      } else {
        notes.push(`Say whether “${name}” is a JD, MJD, HJD or BJD.`);
      }
    }
  }

  const isMagnitude = (index: number) => tokens[index].some((word) => magnitudeWords.has(word) || word.endsWith("mag")) || ucdWords(columns[index])[0] === "phot.mag" || words(columns[index].unit).includes("mag") || bandLetters.has(columns[index].name.trim());
  const isFlux = (index: number) => tokens[index].some((word) => fluxWords.has(word)) || ucdWords(columns[index])[0].startsWith("phot.flux");
  const free = columns.map((_, index) => index).filter((index) => !taken.has(index));
  const values = free.filter((index) => !isErrorColumn(columns[index], tokens[index]));
  const valueIndex = take(values.find((index) => isMagnitude(index) || isFlux(index)));
  if (valueIndex === undefined) {
    notes.push("No column looks like a magnitude or a flux: choose the brightness column.");
  } else {
    const kind: BrightnessKind = isMagnitude(valueIndex) ? "magnitude" : "flux";
    mapping.brightnessKind = kind;
    mapping.valueColumn = valueIndex;
    const errors = free.filter((index) => index !== valueIndex && isErrorColumn(columns[index], tokens[index]));
    const kindWord = kind === "magnitude" ? "mag" : "flux";
    const errorIndex = take(errors.find((index) => tokens[index].some((word) => word.includes(kindWord))) ?? errors[0]);
    if (errorIndex === undefined) notes.push(`No column looks like the ${kind}'s error: choose it.`);
    else mapping.errorColumn = errorIndex;
    const band = kind === "magnitude" ? bandOfMagnitudeColumn(columns[valueIndex]) : undefined;
    if (band !== undefined) mapping.band = band;
  }

  const bandIndex = columns.findIndex((_, index) => !taken.has(index) && tokens[index].some((word) => bandWords.has(word)));
  if (bandIndex >= 0) {
    take(bandIndex);
    mapping.bandColumn = bandIndex;
    delete mapping.band;
  }
  const datasetIndex = columns.findIndex((_, index) => !taken.has(index) && tokens[index].some((word) => datasetWords.has(word)));
  if (datasetIndex >= 0) mapping.datasetColumn = datasetIndex;
  return { mapping, notes };
}

/** A time's kind and offset in words: "HJD − 2450000", "MJD", "BJD". */
export function timeFormatLabel(kind: TimeKind, offsetDays: number): string {
  return kind === "MJD" || offsetDays === 0 ? kind : `${kind} − ${offsetDays}`;
}

