import Link from "next/link";
import type { Metadata } from "next";
import { ProposalPageHeader } from "@/components/workspace/proposal-page-header";
import { ProposalSeason } from "@/components/sky/proposal-season";
import { cycleNightCount, skySiteOf } from "@/lib/workspace/proposal-schema";
import { loadForPage } from "@/lib/server/page-access";
import { getProposalSky } from "@/lib/server/proposals";

export const metadata: Metadata = { title: "Season view" };

/** Any member: usable dark hours per night for every target of the proposal over its cycle. */
export default async function ProposalSkyPage({ params }: { params: Promise<{ proposalId: string }> }) {
  const { proposalId } = await params;
  const { proposal, targets, total } = await loadForPage(`/proposals/${proposalId}/sky`, (actor) => getProposalSky({ proposalId }, actor));
  const { cycleStartDate: start, cycleEndDate: end, site, instrument } = proposal;
  return (
    <div className="space-y-6">
      <ProposalPageHeader proposalId={proposal.id} proposalTitle={proposal.title} heading="Season view">
        <p className="max-w-3xl text-sm text-dusk-dim">
          From {site.name} ({site.latitudeDeg}°, {site.longitudeDeg}° east, {site.elevationM} m; horizon {site.horizonLimitDeg}°), air mass ≤{" "}
          {instrument.airmassLimit}: the hours each night in astronomical darkness with the target above the limit and at least the
          safe elongation from the Sun (closer nights count as unusable).
        </p>
      </ProposalPageHeader>
      {start === null || end === null ? (
        <p role="alert" className="text-ember">
          This proposal has no cycle dates yet.{" "}
          {proposal.permissions.canManage ? <Link href={`/proposals/${proposal.id}/settings`}>Set them in the proposal settings.</Link> : "Ask the PI to set them."}
        </p>
      ) : targets.length === 0 ? (
        <p className="text-dusk-dim">No targets yet.</p>
      ) : (
        <>
          {total > targets.length && (
            <p role="status" className="text-ember">
              Showing the first {targets.length} of {total} targets by priority.
            </p>
          )}
          <ProposalSeason site={skySiteOf(site)} targets={targets} startNightIso={start} nightCount={cycleNightCount(start, end)} airmassLimit={instrument.airmassLimit} />
        </>
      )}
    </div>
  );
}
