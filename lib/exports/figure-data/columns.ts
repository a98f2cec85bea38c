/**
 * Columns and cells the figure data tables share: times (Julian date and ISO instant, UTC), and the
 * rule that a value a figure does not draw (NaN, ±Infinity) is an empty cell.
 */
import { dateFromJdUtc } from "@/lib/astro/time";
import type { DataCell, DataColumn } from "@/lib/exports/tables/data-table";

/** A number as a table cell: full precision when finite, else empty (the writers' "no value"). */
export function numberCell(value: number | null): DataCell {
  return value !== null && Number.isFinite(value) ? value : null;
}

/** "2031-06-10T22:15:00.000Z": the instant of a Julian date (UTC), to the millisecond. */
export function utcIsoOfJd(jdUtc: number): string {
  return dateFromJdUtc(jdUtc).toISOString();
}

export const jdUtcColumn: DataColumn = {
  name: "time_jd_utc",
  label: "Time (JD, UTC)",
  unit: "d",
  voUnit: "d",
  ucd: "time.epoch",
  kind: "double",
  description: "Julian date of the instant, UTC.",
};

export const utcIsoColumn: DataColumn = {
  name: "time_utc",
  label: "Time (UTC)",
  unit: "",
  voUnit: "",
  ucd: "time.epoch",
  kind: "text",
  description: "The same instant as ISO 8601 text, UTC, to the millisecond.",
};

/** A text column naming which drawn series a row belongs to (`meanings`: each value and what it is). */
export function seriesColumn(meanings: string): DataColumn {
  return { name: "series", label: "Series", unit: "", voUnit: "", ucd: "meta.code.class", kind: "text", description: meanings };
}
