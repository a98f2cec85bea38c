import "server-only";
import type { CitationKey } from "@/lib/citations/references";
import { feasibilityRuleReferences } from "@/lib/lensing/feasibility-rules";
import { asc, eq } from "drizzle-orm";
import { z } from "zod";
import { dbClient } from "@/db/client";
import { targets } from "@/db/schema";
import { serverEnv } from "@/lib/env";
import { buildProvenance } from "@/lib/exports/provenance";
import { dataDigitsOf, tableColumnsQuerySchema, type ChosenColumn } from "@/lib/exports/tables/columns";
import { tableFormats, tableWriteOptionsSchema, type TableFormat, type TableWriteOptions } from "@/lib/exports/tables/formats";
import type { TargetTable } from "@/lib/exports/tables/table";
import { proposalParamsSchema } from "@/lib/workspace/ids";
import { storedPhotometrySettings } from "@/lib/workspace/photometry-schema";
import { authorize, parseIds } from "@/lib/server/access";
import { requireActor, type Actor } from "@/lib/server/actor";
import { instrumentSettingsOf } from "@/lib/server/derived-columns";
import { parseOrThrow } from "@/lib/server/http";
import { targetViewOf } from "@/lib/server/targets";

/** Most rows one table export writes; far above a proposal's target list, low enough to bound the work. */
export const MAX_EXPORT_ROWS = 20_000;

const tableQuerySchema = tableWriteOptionsSchema.extend({
  format: z.enum(tableFormats, { error: `The format must be one of ${tableFormats.join(", ")}.` }).default("csv"),
  columns: z.string().optional(),
  digits: z.string().optional(),
});

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

/**
 * A proposal's whole target list (priority, then name) with the chosen columns and the provenance
 * of the export. Any member may export, viewers included (the same rule as reading the table).
 * Order: validate the id and the query → session → load and role → read.
 */
export async function loadTargetTable(params: unknown, query: unknown, actor: Actor | null): Promise<{ table: TargetTable; format: TableFormat; options: TableWriteOptions }> {
  const { proposalId } = parseIds(proposalParamsSchema, params, "proposal");
  const { format, fit, ...columnQuery } = parseOrThrow(tableQuerySchema, query, "export");
  const columns = parseOrThrow(tableColumnsQuerySchema, columnQuery, "export");
  const who = requireActor(actor);
  const { db } = dbClient();
  const { proposal } = await authorize(db, proposalId, who, "read", "export");
  const rows = await db
    .select()
    .from(targets)
    .where(eq(targets.proposalId, proposalId))
    .orderBy(asc(targets.priority), asc(targets.name), asc(targets.id))
    .limit(MAX_EXPORT_ROWS);
  const instrument = instrumentSettingsOf(proposal);
  const photometry = storedPhotometrySettings(proposal.photometry);
  // LaTeX shows the display digits; the data formats write inputs as stored (17) unless asked.
  const digitsOf = format === "tex" ? (c: ChosenColumn) => c.digits : dataDigitsOf;
  const provenance = buildProvenance({
    subject: `Target table of the proposal "${proposal.title}" (${proposal.cycle})`,
    reproduceUrl: new URL(`/proposals/${proposal.id}`, serverEnv().NEXTAUTH_URL).toString(),
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
  return { table: { title: proposal.title, columns, rows: rows.map(targetViewOf), provenance }, format, options: { fit } };
}
