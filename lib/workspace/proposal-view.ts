/**
 * A proposal as a list of proposals shows it (the proposals page, the bench's save form). Types only,
 * shared by the data-access layer (lib/server/proposals.ts) and the components.
 */
import type { ProposalRole } from "@/lib/workspace/roles";

export interface ProposalSummary {
  id: string;
  title: string;
  cycle: string;
  role: ProposalRole;
  targetCount: number;
  updatedAt: string;
}
