/** Per-proposal roles. A PI owns the proposal, a Co-I edits its content, a viewer only reads. */
export const proposalRoles = ["pi", "coi", "viewer"] as const;
export type ProposalRole = (typeof proposalRoles)[number];

/**
 * Site roles, across every proposal. A member works only on the proposals they belong to. An admin
 * also looks after the accounts (who is admin) and may read any proposal as an auditor, with exactly
 * a viewer's rights: auditing never edits a proposal's science, and an admin who should edit one is
 * invited to it like anyone else.
 */
export const siteRoles = ["admin", "member"] as const;
export type SiteRole = (typeof siteRoles)[number];

export const siteRoleLabels: Record<SiteRole, string> = { admin: "Site admin", member: "Member" };

/** `audit`: read any proposal as a viewer; `manageAccounts`: list accounts and change site roles. */
export type SiteCapability = "audit" | "manageAccounts";

const siteCapabilitiesByRole: Record<SiteRole, ReadonlySet<SiteCapability>> = {
  admin: new Set(["audit", "manageAccounts"]),
  member: new Set(),
};

export function siteRoleCan(role: SiteRole, capability: SiteCapability): boolean {
  return siteCapabilitiesByRole[role].has(capability);
}

/** The proposal role an auditing site admin reads with (a viewer's: read, nothing else). */
export const auditorRole: ProposalRole = "viewer";

/**
 * What a member may do: `read` everything of the proposal, `edit` targets and notes, `manage` the
 * proposal itself (details, members, invitations), `delete` the proposal.
 */
export type Capability = "read" | "edit" | "manage" | "delete";

const capabilitiesByRole: Record<ProposalRole, ReadonlySet<Capability>> = {
  pi: new Set(["read", "edit", "manage", "delete"]),
  coi: new Set(["read", "edit"]),
  viewer: new Set(["read"]),
};

export function roleCan(role: ProposalRole, capability: Capability): boolean {
  return capabilitiesByRole[role].has(capability);
}

export const roleLabels: Record<ProposalRole, string> = { pi: "PI", coi: "Co-I", viewer: "Viewer" };

/** What the UI may offer a member; the server checks the same rules again on every request. */
export interface Permissions {
  canEdit: boolean;
  canManage: boolean;
  canDelete: boolean;
}

export function permissionsFor(role: ProposalRole): Permissions {
  return { canEdit: roleCan(role, "edit"), canManage: roleCan(role, "manage"), canDelete: roleCan(role, "delete") };
}
