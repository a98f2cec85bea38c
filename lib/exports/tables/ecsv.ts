import { dataTableEcsv } from "./data-table";
import { targetDataTable, type TargetTable } from "./table";

/** The target table as ECSV 1.0 (`dataTableEcsv`): units, UCDs and descriptions per column, the provenance as meta. */
export function targetTableEcsv(table: TargetTable): string {
  return dataTableEcsv(targetDataTable(table));
}
