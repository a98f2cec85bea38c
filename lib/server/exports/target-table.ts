import "server-only";
import { asc, eq } from "drizzle-orm";
import { z } from "zod";
import { dbClient } from "@/db/client";
import { targets } from "@/db/schema";
import { serverEnv } from "@/lib/env";
import { MAX_EXPORT_ROWS, targetTableOf, type TargetTableExport } from "@/lib/exports/assembly/target-table";
import { tableColumnsQuerySchema } from "@/lib/exports/tables/columns";
import { tableFormats, tableWriteOptionsSchema } from "@/lib/exports/tables/formats";
import { proposalParamsSchema } from "@/lib/workspace/ids";
import { authorize, parseIds } from "@/lib/server/access";
import { requireActor, type Actor } from "@/lib/server/actor";
import { instrumentSettingsOf } from "@/lib/server/derived-columns";
import { parseOrThrow } from "@/lib/server/http";
import { targetViewOf } from "@/lib/server/targets";

const tableQuerySchema = tableWriteOptionsSchema.extend({
  format: z.enum(tableFormats, { error: `The format must be one of ${tableFormats.join(", ")}.` }).default("csv"),
  columns: z.string().optional(),
  digits: z.string().optional(),
});

/**
 * A proposal's whole target list (priority, then name) with the chosen columns and the provenance
 * of the export. Any member may export, viewers included (the same rule as reading the table).
 * Order: validate the id and the query → session → load and role → read.
 */
export async function loadTargetTable(params: unknown, query: unknown, actor: Actor | null): Promise<TargetTableExport> {
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
  return targetTableOf({
    proposal,
    instrument: instrumentSettingsOf(proposal),
    rows: rows.map(targetViewOf),
    columns,
    format,
    fit,
    appOrigin: serverEnv().NEXTAUTH_URL,
  });
}
