import type { Metadata } from "next";
import Link from "next/link";
import { NewProposalForm } from "@/components/proposals/new-proposal-form";
import { roleLabels } from "@/lib/workspace/roles";
import { loadForPage } from "@/lib/server/page-access";
import { listProposals } from "@/lib/server/proposals";

export const metadata: Metadata = { title: "Proposals" };

export default async function ProposalsPage() {
  const proposals = await loadForPage("/proposals", listProposals);
  return (
    <section className="space-y-8">
      <h1 className="text-3xl font-bold">Proposals</h1>
      {proposals.length === 0 ? (
        <p className="text-dusk-dim">You are not on any proposal yet. Start one below, or open an invitation a PI sent you.</p>
      ) : (
        <ul className="divide-y divide-void-edge rounded-lg border border-void-edge">
          {proposals.map((p) => (
            <li key={p.id} className="flex flex-wrap items-baseline gap-x-4 gap-y-1 px-4 py-3">
              <Link href={`/proposals/${p.id}`} className="text-lg font-semibold">
                {p.title}
              </Link>
              <span className="text-sm text-dusk-dim">{p.cycle}</span>
              <span className="text-sm text-dusk-dim">{p.targetCount} {p.targetCount === 1 ? "target" : "targets"}</span>
              <span className="ml-auto rounded bg-void-raised px-2 py-0.5 text-sm">{roleLabels[p.role]}</span>
            </li>
          ))}
        </ul>
      )}
      <NewProposalForm />
    </section>
  );
}
