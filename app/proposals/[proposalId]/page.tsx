import type { Metadata } from "next";
import Link from "next/link";
import { ActivityFeed } from "@/components/proposals/activity-feed";
import { ConfirmDelete } from "@/components/shared/confirm-delete";
import { MembersPanel } from "@/components/proposals/members-panel";
import { TargetForm } from "@/components/targets/target-form";
import { TargetTable } from "@/components/targets/target-table";
import { initialTargetSorting, targetPageSize } from "@/components/targets/target-table-state";
import { roleLabels } from "@/lib/workspace/roles";
import { listMembers } from "@/lib/server/members";
import { loadForPage } from "@/lib/server/page-access";
import { getProposal, getProposalTimeRequest } from "@/lib/server/proposals";
import { timeRequestSentence } from "@/lib/workspace/time-request";
import { listTargets } from "@/lib/server/targets";

export const metadata: Metadata = { title: "Proposal" };

export default async function ProposalPage({ params }: { params: Promise<{ proposalId: string }> }) {
  const { proposalId } = await params;
  const sort = initialTargetSorting[0];
  const { proposal, targets, members, timeRequest } = await loadForPage(`/proposals/${proposalId}`, async (actor) => {
    const proposal = await getProposal({ proposalId }, actor);
    const [targets, members, timeRequest] = await Promise.all([
      listTargets({ proposalId }, { sort: sort.id, direction: sort.desc ? "desc" : "asc", page: 1, pageSize: targetPageSize }, actor),
      listMembers({ proposalId }, actor),
      getProposalTimeRequest({ proposalId }, actor),
    ]);
    return { proposal, targets, members, timeRequest };
  });
  const { site, instrument, permissions } = proposal;
  return (
    <div className="space-y-8">
      <header className="space-y-2">
        <p className="text-sm text-dusk-dim">
          <Link href="/proposals">Proposals</Link> / {proposal.cycle}
        </p>
        <h1 className="text-3xl font-bold">{proposal.title}</h1>
        <p className="text-sm">
          Your role:{" "}
          <span className="font-semibold" data-testid="my-role">
            {proposal.isAudit ? "Site admin, auditing (read only)" : roleLabels[proposal.role]}
          </span>
        </p>
        {proposal.abstract && <p className="max-w-3xl leading-relaxed text-dusk-dim">{proposal.abstract}</p>}
        <nav aria-label="Proposal views" className="flex flex-wrap gap-3 text-sm">
          <Link href={`/proposals/${proposalId}/sky`} className="rounded-md border border-void-edge px-3 py-1.5 no-underline">
            Season view (sky windows)
          </Link>
          <Link href={`/proposals/${proposalId}/summary`} className="rounded-md border border-void-edge px-3 py-1.5 no-underline">
            Technical summary and exports
          </Link>
          {permissions.canManage && (
            <Link href={`/proposals/${proposalId}/settings`} className="rounded-md border border-void-edge px-3 py-1.5 no-underline">
              Proposal settings
            </Link>
          )}
        </nav>
        <dl className="flex flex-wrap gap-x-8 gap-y-1 text-sm">
          <div>
            <dt className="inline text-dusk-dim">Site </dt>
            <dd className="inline">
              {site.name} ({site.latitudeDeg}°, {site.longitudeDeg}°, {site.elevationM} m; horizon {site.horizonLimitDeg}°)
            </dd>
          </div>
          <div>
            <dt className="inline text-dusk-dim">Instrument </dt>
            <dd className="inline">
              resolution {instrument.resolutionMas} mas · cadence {instrument.cadenceHours} h · campaign {instrument.campaignLengthDays} d
            </dd>
          </div>
          <div>
            <dt className="inline text-dusk-dim">Cycle nights </dt>
            <dd className="inline" data-testid="cycle-dates">
              {proposal.cycleStartDate && proposal.cycleEndDate ? `${proposal.cycleStartDate} – ${proposal.cycleEndDate}` : "not set"} · airmass ≤ {instrument.airmassLimit}
              {instrument.interferometerWavelengthMm !== null && instrument.interferometerBaselineKm !== null
                ? ` · λ ${instrument.interferometerWavelengthMm} mm, B ${instrument.interferometerBaselineKm} km`
                : ""}
            </dd>
          </div>
          <div>
            <dt className="inline text-dusk-dim">Time requested </dt>
            <dd className="inline" data-testid="time-request">
              {timeRequestSentence(timeRequest)}
            </dd>
          </div>
        </dl>
        {permissions.canDelete && (
          <ConfirmDelete
            label="Delete proposal"
            consequence={`“${proposal.title}” goes with all its targets, notes, members, invitations and activity.`}
            url={`/api/proposals/${proposalId}`}
            afterUrl="/proposals"
            typeToConfirm={proposal.title}
            staleKeyPrefix={`/api/proposals/${proposalId}`}
          />
        )}
      </header>
      <section aria-labelledby="targets-heading" className="space-y-4">
        <h2 id="targets-heading" className="text-2xl font-semibold">
          Targets
        </h2>
        <TargetTable proposalId={proposalId} initialPage={targets} />
        {permissions.canEdit && <TargetForm proposalId={proposalId} initialPage={targets} />}
        {permissions.canEdit && (
          <Link href={`/proposals/${proposalId}/import`} className="inline-block text-sm">
            Import a target list (CSV or VOTable)
          </Link>
        )}
      </section>
      <div className="grid gap-8 md:grid-cols-2">
        <MembersPanel proposalId={proposalId} initialMembers={members} canManage={permissions.canManage} />
        <ActivityFeed proposalId={proposalId} />
      </div>
    </div>
  );
}
