"use client";

import Link from "next/link";
import { signOut } from "next-auth/react";
import { useState } from "react";
import useSWR from "swr";
import { apiFetch } from "@/components/shared/api-client";

interface SessionAnswer {
  user?: { name?: string | null; email?: string | null };
}

// The session is read in the browser so that pages without personal content stay static.
const fetchSession = (url: string) => fetch(url).then((r) => r.json() as Promise<SessionAnswer>);

const quietButton = "rounded border border-void-edge px-2 py-1 text-dusk-dim hover:text-dusk";

/** "Sign out everywhere": the server ends every session of the account, then this browser forgets its cookie. */
async function signOutEverywhere() {
  await apiFetch("/api/account/sessions", { method: "DELETE" }).catch(() => undefined);
  await signOut({ callbackUrl: "/" });
}

/** The header's account corner: who is signed in and the sign-out buttons, or a sign-in link. */
export function AccountMenu() {
  const { data, isLoading } = useSWR("/api/auth/session", fetchSession);
  const [isSigningOut, setSigningOut] = useState(false);
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
      <button type="button" className={quietButton} onClick={() => void signOut({ callbackUrl: "/" })}>
        Sign out
      </button>
      <button
        type="button"
        className={quietButton}
        title="Ends every session of this account, on every device"
        disabled={isSigningOut}
        onClick={() => {
          setSigningOut(true);
          void signOutEverywhere();
        }}
      >
        Sign out everywhere
      </button>
    </div>
  );
}
