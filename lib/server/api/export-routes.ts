import "server-only";
import { CALENDAR_CONTENT_TYPE } from "@/lib/exports/calendar/ical";
import { attachmentHeaders, fileSlug, tableDownload } from "@/lib/exports/download";
import { tableWriters } from "@/lib/exports/tables/formats";
import type { GetActor } from "@/lib/server/actor";
import { endpoint, queryOf } from "@/lib/server/api/endpoint";
import { loadCalendar } from "@/lib/server/exports/calendar";
import { technicalSummary } from "@/lib/server/exports/summary";
import { loadTargetTable } from "@/lib/server/exports/target-table";

type ProposalParams = { proposalId: string };

/**
 * /api/proposals/[proposalId]/exports/targets?format=csv|ecsv|tex|votable|json&columns=…&digits=…&fit=shrink|landscape|split
 * (`fit`: the LaTeX table's layout).
 * Every format's download carries the provenance record as JSON in the `Arcwright-Provenance`
 * header; a CSV file, which holds nothing but its table, also names its time of export.
 */
export function targetTableExportRoutes(getActor: GetActor) {
  return {
    GET: endpoint<ProposalParams>(getActor, async ({ request, params, actor }) => {
      const { table, format, options } = await loadTargetTable(params, queryOf(request), actor);
      const writer = tableWriters[format];
      return tableDownload(writer.write(table, options), { fileStem: `${fileSlug(table.title)}-targets`, file: writer, provenance: table.provenance });
    }),
  };
}

/** /api/proposals/[proposalId]/exports/summary?figures=season&columns=…&digits=…: the technical summary PDF. */
export function technicalSummaryRoutes(getActor: GetActor) {
  return {
    GET: endpoint<ProposalParams>(getActor, async ({ request, params, actor }) => {
      const { pdf, title } = await technicalSummary(params, queryOf(request), actor);
      return new Response(Buffer.from(pdf), { headers: attachmentHeaders(`${fileSlug(title)}-technical-summary.pdf`, "application/pdf") });
    }),
  };
}

/** /api/proposals/[proposalId]/exports/calendar?targetId=…: the iCalendar download. */
export function calendarRoutes(getActor: GetActor) {
  return {
    GET: endpoint<ProposalParams>(getActor, async ({ request, params, actor }) => {
      const { ics, fileName } = await loadCalendar(params, queryOf(request), actor);
      return new Response(ics, { headers: attachmentHeaders(fileName, CALENDAR_CONTENT_TYPE) });
    }),
  };
}
