/**
 * The target table export assembled from the rows the data-access layer loaded
 * (lib/server/exports/target-table.ts): the chosen columns and the provenance record.
 */
import type { Proposal } from "@/db/schema";
import type { CitationKey } from "@/lib/citations/references";
import { buildProvenance } from "@/lib/exports/provenance";
import { dataDigitsOf, type ChosenColumn } from "@/lib/exports/tables/columns";
import type { TableFormat, TableWriteOptions } from "@/lib/exports/tables/formats";
import type { TargetTable } from "@/lib/exports/tables/table";
import { feasibilityRuleReferences } from "@/lib/lensing/feasibility-rules";
import { storedPhotometrySettings } from "@/lib/workspace/photometry-schema";
import type { InstrumentSettings } from "@/lib/workspace/proposal-schema";
import type { TargetView } from "@/lib/workspace/target-view";

/** Most rows one table export writes; far above a proposal's target list, low enough to bound the work. */
export const MAX_EXPORT_ROWS = 20_000;

/**
 * The methods the table's computed columns come from (lib/citations): the lensing layer's solutions
 * and science cases, every feasibility rule's source, the simulated schedule and the photon budget.
 */
const TARGET_TABLE_REFERENCES: readonly CitationKey[] = [
  ...new Set([
    ...feasibilityRuleReferences.flatMap((rule) => rule.references),
    ...(["paczynski1986", "refsdal1964", "schneider1992", "wittmao1994", "lee2009", "gould2008", "pejcha2009", "gould2000", "walker1995", "wozniak1997"] as const),
    ...(["astronomyengine", "pickering2002", "krisciunas1991", "willmer2018", "merline1995", "howell2006", "moffat1969", "lindegren1978"] as const),
  ]),
];

export interface TargetTableExport {
  table: TargetTable;
  format: TableFormat;
  options: TableWriteOptions;
}

/**
 * A proposal's target table in the chosen format and columns: `rows` in the order they are written
 * (priority, then name), `instrument` the proposal's instrument settings, `appOrigin` the app's
 * public origin (the provenance's reproduce link).
 */
export function targetTableOf({
  proposal,
  instrument,
  rows,
  columns,
  format,
  fit,
  appOrigin,
}: {
  proposal: Proposal;
  instrument: InstrumentSettings;
  rows: TargetView[];
  columns: ChosenColumn[];
  format: TableFormat;
  fit: TableWriteOptions["fit"];
  appOrigin: string;
}): TargetTableExport {
  const photometry = storedPhotometrySettings(proposal.photometry);
  // LaTeX shows the display digits; the data formats write inputs as stored (17) unless asked.
  const digitsOf = format === "tex" ? (c: ChosenColumn) => c.digits : dataDigitsOf;
  const provenance = buildProvenance({
    subject: `Target table of the proposal "${proposal.title}" (${proposal.cycle})`,
    reproduceUrl: new URL(`/proposals/${proposal.id}`, appOrigin).toString(),
    inputs: {
      proposalId: proposal.id,
      proposalUpdatedAt: proposal.updatedAt.toISOString(),
      site: `${proposal.siteName} (lat ${proposal.siteLatitudeDeg} deg, lon ${proposal.siteLongitudeDeg} deg, ${proposal.siteElevationM} m)`,
      resolutionMas: instrument.resolutionMas,
      cadenceHours: instrument.cadenceHours,
      campaignLengthDays: instrument.campaignLengthDays,
      cycleStartDate: proposal.cycleStartDate ?? null,
      // What the photon budget columns were computed with; an empty source band is this band.
      photometryBandId: photometry.bandId,
      apertureM: photometry.apertureM,
      signalToNoiseGoal: photometry.signalToNoiseGoal,
      overheadPerVisitS: photometry.overheadS,
      visitMinutes: instrument.visitMinutes,
      columns: columns.map((c) => c.column.key).join(","),
      digits: columns.filter((c) => c.column.kind === "double").map((c) => `${c.column.key}:${digitsOf(c)}`).join(","),
      ...(format === "tex" ? { latexFit: fit } : {}),
      rowCount: rows.length,
      order: "priority, name",
    },
    references: TARGET_TABLE_REFERENCES,
  });
  return { table: { title: proposal.title, columns, rows, provenance }, format, options: { fit } };
}
