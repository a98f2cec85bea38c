import Link from "next/link";

export default function LandingPage() {
  return (
    <section className="mx-auto max-w-3xl space-y-6 py-8">
      <h1 className="text-4xl font-bold text-dusk">Arcwright</h1>
      <p className="text-xl leading-relaxed">
        Arcwright turns a gravitational-lens hypothesis into the numbers a proposal review checks:
        Einstein radius and image separation against your instrument, magnifications, time delays and
        event timescales against cadence, and when each target can be observed from your site. It
        computes them from exact light paths around the lens mass, keeps your team&apos;s targets, notes
        and files together with roles, and exports the figures and tables for the proposal.
      </p>
      <div className="flex flex-wrap gap-4">
        <Link
          href="/bench"
          className="rounded-md bg-ember px-4 py-2 font-semibold text-void no-underline hover:bg-ember-strong"
        >
          Open the lens bench
        </Link>
        <Link href="/proposals" className="rounded-md border border-void-edge px-4 py-2 no-underline">
          Team proposals
        </Link>
      </div>
    </section>
  );
}
