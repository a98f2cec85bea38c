import type { Metadata } from "next";
import { ProposalPageHeader } from "@/components/proposals/proposal-page-header";
import { ImportWizard } from "@/components/uploads/import-wizard";
import { roleLabels } from "@/lib/workspace/roles";
import { loadForPage } from "@/lib/server/page-access";
import { getProposal } from "@/lib/server/proposals";

export const metadata: Metadata = { title: "Import targets" };

/** Co-I and PI import a target list; other members see why they cannot (the API refuses them too). */
export default async function ImportPage({ params }: { params: Promise<{ proposalId: string }> }) {
  const { proposalId } = await params;
  const proposal = await loadForPage(`/proposals/${proposalId}/import`, (actor) => getProposal({ proposalId }, actor));
  return (
    <div className="space-y-6">
      <ProposalPageHeader proposalId={proposal.id} proposalTitle={proposal.title} heading="Import targets" />
      {proposal.permissions.canEdit ? (
        <ImportWizard proposalId={proposal.id} />
      ) : (
        <p data-testid="import-not-allowed">
          Your role on this proposal ({roleLabels[proposal.role]}) can read its targets but not import them; a Co-I or the PI can.
        </p>
      )}
    </div>
  );
}
