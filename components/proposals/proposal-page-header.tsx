import Link from "next/link";

/** Heading of a page under one proposal: the way back (Proposals / its title), the page's name, and an intro. */
export function ProposalPageHeader({ proposalId, proposalTitle, heading, children }: { proposalId: string; proposalTitle: string; heading: string; children?: React.ReactNode }) {
  return (
    <header className="space-y-2">
      <p className="text-sm text-dusk-dim">
        <Link href="/proposals">Proposals</Link> / <Link href={`/proposals/${proposalId}`}>{proposalTitle}</Link>
      </p>
      <h1 className="text-3xl font-bold">{heading}</h1>
      {children}
    </header>
  );
}
