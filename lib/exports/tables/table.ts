import type { TargetView } from "@/lib/workspace/target-view";
import type { Provenance } from "@/lib/exports/provenance";
import { formatDeclinationColons, formatRightAscensionColons } from "@/lib/workspace/coordinates";
import { cellOf, descriptionOf, isWrittenAsStored, type ChosenColumn, type ExportColumnKey } from "./columns";
import type { DataCell, DataColumn, DataTable } from "./data-table";

/** Everything a table export is written from; every format writes the same rows and provenance. */
export interface TargetTable {
  /** The proposal's title, for captions and resource names. */
  title: string;
  columns: ChosenColumn[];
  rows: TargetView[];
  provenance: Provenance;
}

/** Folds line breaks so a value fits one comment line of a text format. */
export function singleLine(text: string): string {
  return text.replace(/[\r\n]+/g, " ");
}

/** Decimals of a second in the sexagesimal RA column: 0.001 s, 15 mas at the equator. */
export const RA_SECOND_DECIMALS = 3;
/** Decimals of an arcsecond in the sexagesimal Dec column: 0.01″, 10 mas. */
export const DEC_SECOND_DECIMALS = 2;

/** A sexagesimal text column written right after the decimal-degree column it restates. */
export interface SexagesimalColumn {
  after: ExportColumnKey;
  column: DataColumn;
  text: (degrees: number) => string;
}

/**
 * RA and Dec as proposal forms ask for them ("17:45:40.036", "-29:00:28.17"), beside the decimal
 * degrees in every data format. No VOUnit describes a sexagesimal text, so the form is in the label
 * and description; the UCD is the position's without meta.main, which stays on the degrees.
 */
export const sexagesimalColumns: readonly SexagesimalColumn[] = [
  {
    after: "raDeg",
    column: {
      name: "raHms",
      label: "RA (ICRS) hms",
      unit: "",
      voUnit: "",
      ucd: "pos.eq.ra",
      kind: "text",
      description: `RA (ICRS) as hours:minutes:seconds, rounded to 0.${"0".repeat(RA_SECOND_DECIMALS - 1)}1 s (input)`,
    },
    text: (raDeg) => formatRightAscensionColons(raDeg, RA_SECOND_DECIMALS),
  },
  {
    after: "decDeg",
    column: {
      name: "decDms",
      label: "Dec (ICRS) dms",
      unit: "",
      voUnit: "",
      ucd: "pos.eq.dec",
      kind: "text",
      description: `Dec (ICRS) as degrees:arcminutes:arcseconds, rounded to 0.${"0".repeat(DEC_SECOND_DECIMALS - 1)}1 arcsec (input)`,
    },
    text: (decDeg) => formatDeclinationColons(decDeg, DEC_SECOND_DECIMALS),
  },
];

/** The sexagesimal column written right after `key`'s, if it has one (RA and Dec). */
export function sexagesimalCompanionOf(key: ExportColumnKey): SexagesimalColumn | undefined {
  return sexagesimalColumns.find(({ after }) => after === key);
}

/** The columns holding ICRS positions, which a VOTable refers to its ICRS COOSYS. */
export const icrsColumnKeys: readonly string[] = ["raDeg", "decDeg", ...sexagesimalColumns.map(({ column }) => column.name)];

function dataColumnOf(chosen: ChosenColumn): DataColumn {
  const { column } = chosen;
  return {
    name: column.key,
    label: column.label,
    unit: column.unit,
    voUnit: column.voUnit,
    ucd: column.ucd,
    kind: column.kind,
    description: descriptionOf(column),
    // Inputs the request named no digits for are written as stored, so a re-import matches exactly (`isWrittenAsStored`).
    ...(column.kind === "double" && !isWrittenAsStored(chosen) ? { digits: chosen.digits } : {}),
  };
}

/** A chosen column's cells, and its sexagesimal companion's after it. */
interface DataColumnWriter {
  column: DataColumn;
  cell: (row: TargetView) => DataCell;
}

function writersOf(chosen: ChosenColumn): DataColumnWriter[] {
  const own: DataColumnWriter = { column: dataColumnOf(chosen), cell: (row) => cellOf(row, chosen.column) };
  const companion = sexagesimalCompanionOf(chosen.column.key);
  if (companion === undefined) return [own];
  return [own, { column: companion.column, cell: (row) => companion.text(row[companion.after] as number) }];
}

/**
 * The target table as the data formats (CSV, ECSV, VOTable) write it: one row per target, cells as
 * stored, and RA and Dec also in sexagesimal form after their degrees.
 */
export function targetDataTable(table: TargetTable): DataTable {
  const writers = table.columns.flatMap(writersOf);
  return {
    name: "targets",
    title: `Targets of ${table.title}`,
    columns: writers.map(({ column }) => column),
    rows: table.rows.map((row) => writers.map(({ cell }) => cell(row))),
    provenance: table.provenance,
  };
}
