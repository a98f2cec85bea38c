import "server-only";
import type { GetActor } from "@/lib/server/actor";
import { endpoint, queryOf } from "@/lib/server/api/endpoint";
import { attachmentHeaders, fileSlug } from "@/lib/exports/download";
import { tableWriters } from "@/lib/exports/tables/formats";
import { loadTargetTable } from "./target-table";

type ProposalParams = { proposalId: string };

/** /api/proposals/[proposalId]/exports/targets?format=csv|tex|votable|json&columns=…&digits=… */
export function targetTableExportRoutes(getActor: GetActor) {
  return {
    GET: endpoint<ProposalParams>(getActor, async ({ request, params, actor }) => {
      const { table, format } = await loadTargetTable(params, queryOf(request), actor);
      const writer = tableWriters[format];
      const fileName = `${fileSlug(table.title)}-targets.${writer.extension}`;
      return new Response(writer.write(table), { headers: attachmentHeaders(fileName, writer.contentType) });
    }),
  };
}
