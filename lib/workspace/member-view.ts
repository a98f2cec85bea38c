/**
 * What the members panel receives: a proposal's members and its open invitations. Types only, shared
 * by the data-access layer (lib/server/members.ts, lib/server/invitations.ts) and the panel.
 */
import type { ProposalRole } from "@/lib/workspace/roles";

export interface MemberView {
  userId: string;
  name: string;
  email: string;
  role: ProposalRole;
  joinedAt: string;
}

export interface InvitationView {
  id: string;
  email: string;
  role: ProposalRole;
  invitedByName: string | null;
  expiresAt: string;
  createdAt: string;
}
