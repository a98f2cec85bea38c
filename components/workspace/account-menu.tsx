"use client";

import Link from "next/link";
import { signOut } from "next-auth/react";
import useSWR from "swr";

interface SessionAnswer {
  user?: { name?: string | null; email?: string | null };
}

// The session is read in the browser so that pages without personal content stay static.
const fetchSession = (url: string) => fetch(url).then((r) => r.json() as Promise<SessionAnswer>);

/** The header's account corner: who is signed in and a sign-out button, or a sign-in link. */
export function AccountMenu() {
  const { data, isLoading } = useSWR("/api/auth/session", fetchSession);
  if (isLoading) return <span className="ml-auto text-sm text-dusk-dim" aria-hidden="true">…</span>;
  if (!data?.user) {
    return (
      <Link href="/sign-in" className="ml-auto text-sm">
        Sign in
      </Link>
    );
  }
  return (
    <div className="ml-auto flex items-center gap-3 text-sm" data-testid="account-menu">
      <span className="text-dusk" title={data.user.email ?? undefined}>
        {data.user.name}
      </span>
      <button type="button" className="rounded border border-void-edge px-2 py-1 text-dusk-dim hover:text-dusk" onClick={() => void signOut({ callbackUrl: "/" })}>
        Sign out
      </button>
    </div>
  );
}
