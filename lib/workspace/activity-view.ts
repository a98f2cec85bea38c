/**
 * What the activity feed receives. Types only, shared by the data-access layer
 * (lib/server/activity.ts) and the feed.
 */
/** Verbs of the feed, `<subject>.<what happened>`. */
export type ActivityAction =
  | "proposal.created"
  | "proposal.updated"
  | "member.joined"
  | "member.role_changed"
  | "member.removed"
  | "invitation.sent"
  | "invitation.revoked"
  | "target.added"
  | "target.updated"
  | "target.removed"
  | "target.fit_applied"
  | "target.fit_undone"
  | "note.added"
  | "note.edited"
  | "note.removed";

export interface ActivityEntry {
  id: number;
  action: ActivityAction;
  subject: string;
  actorName: string | null;
  createdAt: string;
}
