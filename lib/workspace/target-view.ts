/**
 * A target as the API, the pages and the exports see it: its inputs, its position in text and
 * degrees, and its derived columns (in `lib/workspace` so that the exports and the components read
 * the shape without depending on the server's data access).
 */
import type { Target } from "@/db/schema";
import type { DerivedColumns } from "@/lib/workspace/derived";
import type { LensHypothesis } from "@/lib/workspace/target-schema";

export interface TargetView extends LensHypothesis, Omit<DerivedColumns, "derivationVersion"> {
  id: string;
  proposalId: string;
  name: string;
  raDeg: number;
  decDeg: number;
  raText: string;
  decText: string;
  priority: number;
  status: Target["status"];
  tags: string[];
  updatedAt: string;
}

export interface TargetPage {
  rows: TargetView[];
  total: number;
  page: number;
  pageSize: number;
}
