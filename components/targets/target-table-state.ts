import type { SortingState } from "@tanstack/react-table";
import { targetSortColumns, type TargetSortColumn } from "@/lib/workspace/target-query";

// Shared by the table (client) and the proposal page (server), which renders the first page.

const sortable = new Set<string>(targetSortColumns);

export interface TargetFilters {
  q: string;
  status: string;
  lensModel: string;
  tag: string;
  /** The case the answers are for, an id of `scienceCaseIds`. */
  answeredCase: string;
  caseVerdict: string;
}

/** The API query for a table state (sort and filters as the server knows them). */
export function targetListUrl(proposalId: string, sorting: SortingState, page: number, pageSize: number, filters: TargetFilters): string {
  const query = new URLSearchParams({ page: String(page), pageSize: String(pageSize) });
  const sort = sorting[0];
  if (sort && sortable.has(sort.id)) {
    query.set("sort", sort.id as TargetSortColumn);
    query.set("direction", sort.desc ? "desc" : "asc");
  }
  for (const [key, value] of Object.entries(filters)) if (value) query.set(key, value);
  return `/api/proposals/${proposalId}/targets?${query}`;
}

export const initialTargetSorting: SortingState = [{ id: "priority", desc: false }];
export const emptyFilters: TargetFilters = { q: "", status: "", lensModel: "", tag: "", answeredCase: "", caseVerdict: "" };
export const targetPageSize = 50;

