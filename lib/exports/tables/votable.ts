import { dataTableVotable } from "./data-table";
import { icrsColumnKeys, targetDataTable, type TargetTable } from "./table";

/**
 * The target table as a VOTable 1.4 TABLEDATA document (`dataTableVotable`): RA and Dec refer to an
 * ICRS COOSYS; inputs are written as stored unless the request names their digits, and computed
 * columns declare their significant digits as `precision="E<n>"`.
 */
export function targetTableVotable(table: TargetTable): string {
  return dataTableVotable(targetDataTable(table), { icrsColumns: icrsColumnKeys });
}
