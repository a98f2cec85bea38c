/**
 * What the admin page receives about an account. Types only, shared by the data-access layer
 * (lib/server/admin.ts) and the admin components.
 */
import type { ProposalRole, SiteRole } from "@/lib/workspace/roles";

/** One proposal an account belongs to, with the role it holds there. */
export interface AccountMembership {
  proposalId: string;
  title: string;
  cycle: string;
  role: ProposalRole;
}

/** An account as the admin page sees it; never the password hash. */
export interface AccountView {
  userId: string;
  name: string;
  email: string;
  siteRole: SiteRole;
  createdAt: string;
  proposals: AccountMembership[];
}

export interface AccountPage {
  accounts: AccountView[];
  total: number;
  page: number;
  pageSize: number;
}
