"use client";

import Link from "next/link";

/**
 * What a page shows when the server could not render it, for every route. In practice the cause is
 * most often the database being briefly away (the API answers 503 `unavailable:database` then); a page
 * can only say so in words. `retry` asks the server for the page again.
 */
export default function PageError({ error, retry }: { error: Error & { digest?: string }; retry: () => void }) {
  return (
    <section role="alert" aria-labelledby="page-error-title" className="max-w-2xl space-y-4">
      <h1 id="page-error-title" className="text-2xl font-bold">
        This page could not be loaded
      </h1>
      <p>
        The server could not put this page together just now. The usual cause is a short interruption of the database: what was
        already saved is kept, and the page works again as soon as the database is back.
      </p>
      <p className="text-dusk-dim">If it keeps happening, tell the site&apos;s administrator and quote the reference below.</p>
      <div className="flex flex-wrap items-center gap-4">
        <button type="button" onClick={() => retry()} className="rounded-md border border-void-edge px-3 py-1.5">
          Try again
        </button>
        <Link href="/">Arcwright home</Link>
      </div>
      {error.digest ? (
        <p className="text-sm text-dusk-dim">
          Reference: <code data-testid="error-reference">{error.digest}</code>
        </p>
      ) : null}
    </section>
  );
}
