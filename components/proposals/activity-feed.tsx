"use client";

import useSWRInfinite from "swr/infinite";
import type { ActivityEntry } from "@/lib/workspace/activity-view";
import { swrFetcher } from "@/components/shared/api-client";
import { formatDateTime } from "@/components/shared/format";

type FeedPage = { entries: ActivityEntry[]; nextBefore: number | null };

const verbs: Record<ActivityEntry["action"], string> = {
  "proposal.created": "created the proposal",
  "proposal.updated": "changed the proposal",
  "member.joined": "joined:",
  "member.role_changed": "changed a role:",
  "member.removed": "removed",
  "invitation.sent": "invited",
  "invitation.revoked": "withdrew the invitation of",
  "target.added": "added",
  "target.updated": "changed",
  "target.removed": "removed",
  "target.fit_applied": "applied a light-curve fit to",
  "target.fit_undone": "undid the light-curve fit of",
  "note.added": "wrote a",
  "note.edited": "edited a",
  "note.removed": "deleted a",
};

/** Who added, changed or removed what, newest first, 20 entries at a time. */
export function ActivityFeed({ proposalId }: { proposalId: string }) {
  const { data, size, setSize, isValidating, error } = useSWRInfinite<FeedPage>(
    (index, previous: FeedPage | null) => {
      if (previous && previous.nextBefore === null) return null;
      const before = previous?.nextBefore ? `&before=${previous.nextBefore}` : "";
      return `/api/proposals/${proposalId}/activity?limit=20${before}`;
    },
    swrFetcher,
  );
  const entries = data?.flatMap((p) => p.entries) ?? [];
  const hasMore = data ? data[data.length - 1]?.nextBefore !== null : false;
  return (
    <section aria-labelledby="activity-heading" className="space-y-3">
      <h2 id="activity-heading" className="text-xl font-semibold">
        Activity
      </h2>
      {error && <p role="alert" className="text-alarm">{error.message}</p>}
      <ol className="space-y-2 text-sm" data-testid="activity-feed">
        {entries.map((e) => (
          <li key={e.id}>
            <span className="font-semibold">{e.actorName ?? "A former member"}</span> {verbs[e.action]} {e.action.startsWith("proposal.") ? "" : e.subject}
            <span className="block text-xs text-dusk-dim">{formatDateTime(e.createdAt)}</span>
          </li>
        ))}
      </ol>
      {hasMore && (
        <button type="button" className="text-sm text-glint" disabled={isValidating} onClick={() => void setSize(size + 1)}>
          Older activity
        </button>
      )}
    </section>
  );
}
