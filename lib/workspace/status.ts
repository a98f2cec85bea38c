/** A target's path through a proposal: candidate → accepted → scheduled → observed, or dropped. */
export const targetStatuses = ["candidate", "accepted", "scheduled", "observed", "dropped"] as const;
export type TargetStatus = (typeof targetStatuses)[number];

// A step back is allowed where plans change (a slot lost, a dropped target reinstated); an observed
// target stays observed because its data exist.
const nextStatuses: Record<TargetStatus, readonly TargetStatus[]> = {
  candidate: ["accepted", "dropped"],
  accepted: ["scheduled", "candidate", "dropped"],
  scheduled: ["observed", "accepted", "dropped"],
  observed: [],
  dropped: ["candidate"],
};

/** Whether a target may move from `from` to `to`; staying in place is always allowed. */
export function canChangeStatus(from: TargetStatus, to: TargetStatus): boolean {
  return from === to || nextStatuses[from].includes(to);
}

export function allowedNextStatuses(from: TargetStatus): readonly TargetStatus[] {
  return nextStatuses[from];
}

export const statusLabels: Record<TargetStatus, string> = {
  candidate: "Candidate",
  accepted: "Accepted",
  scheduled: "Scheduled",
  observed: "Observed",
  dropped: "Dropped",
};
