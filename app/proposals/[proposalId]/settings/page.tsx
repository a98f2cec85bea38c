import type { Metadata } from "next";
import { ProposalPageHeader } from "@/components/proposals/proposal-page-header";
import { ProposalSettingsForm } from "@/components/proposals/proposal-settings-form";
import { loadForPage } from "@/lib/server/page-access";
import { getProposal } from "@/lib/server/proposals";

export const metadata: Metadata = { title: "Proposal settings" };

/** The PI edits the proposal here; other members are told so (the API refuses their edits with 403). */
export default async function ProposalSettingsPage({ params }: { params: Promise<{ proposalId: string }> }) {
  const { proposalId } = await params;
  const proposal = await loadForPage(`/proposals/${proposalId}/settings`, (actor) => getProposal({ proposalId }, actor));
  return (
    <div className="space-y-6">
      <ProposalPageHeader proposalId={proposal.id} proposalTitle={proposal.title} heading="Proposal settings">
        <p className="max-w-3xl text-sm text-dusk-dim">
          The cycle dates span the season view and each target&apos;s simulated observing schedule; the site, airmass
          limit and Moon constraint decide when a target counts as observable; the instrument settings answer every
          target&apos;s science case; the photometry gives each target&apos;s signal-to-noise per visit and the hours
          requested.
        </p>
      </ProposalPageHeader>
      {proposal.permissions.canManage ? (
        <ProposalSettingsForm proposalId={proposal.id} initial={proposal} />
      ) : (
        <p role="alert" className="text-alarm">
          Only the proposal&apos;s PI can change its settings.
        </p>
      )}
    </div>
  );
}
