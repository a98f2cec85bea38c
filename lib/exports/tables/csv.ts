import { dataTableCsv } from "./data-table";
import { targetDataTable, type TargetTable } from "./table";

export { quoteCommentLike } from "./data-table";

/**
 * The target table as plain CSV (`dataTableCsv`), headed by each column's label and unit
 * ("Einstein radius [mas]"). The provenance travels in the download's `Arcwright-Provenance` header
 * and file name (`lib/server/api/export-routes.ts`); the ECSV export carries it inside the file. Inputs
 * are written as stored, computed quantities at their digits.
 */
export function targetTableCsv(table: TargetTable): string {
  return dataTableCsv(targetDataTable(table), { header: "label" });
}
