import type { Metadata } from "next";
import Link from "next/link";
import { ProposalSettingsForm } from "@/components/workspace/proposal-settings-form";
import { loadForPage } from "@/lib/server/page-access";
import { getProposal } from "@/lib/server/proposals";

export const metadata: Metadata = { title: "Proposal settings" };

/** The PI edits the proposal here; other members are told so (the API refuses their edits with 403). */
export default async function ProposalSettingsPage({ params }: { params: Promise<{ proposalId: string }> }) {
  const { proposalId } = await params;
  const proposal = await loadForPage(`/proposals/${proposalId}/settings`, (actor) => getProposal({ proposalId }, actor));
  return (
    <div className="space-y-6">
      <header className="space-y-2">
        <p className="text-sm text-dusk-dim">
          <Link href="/proposals">Proposals</Link> / <Link href={`/proposals/${proposal.id}`}>{proposal.title}</Link>
        </p>
        <h1 className="text-3xl font-bold">Proposal settings</h1>
        <p className="max-w-3xl text-sm text-dusk-dim">
          The cycle dates span the season view and the dark-hours verdict; the site and airmass limit decide
          when a target counts as observable; the instrument defaults grade every target.
        </p>
      </header>
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
