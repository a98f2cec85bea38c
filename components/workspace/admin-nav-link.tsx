"use client";

import Link from "next/link";
import useSWR from "swr";
import { swrFetcher } from "@/components/workspace/api-client";

/**
 * The header's Admin link, shown to site admins only. Asked in the browser, like the account menu, so
 * pages stay static; the admin page and API check the role again on every request.
 */
export function AdminNavLink({ className }: { className?: string }) {
  const { data } = useSWR<{ isAdmin: boolean }>("/api/admin/access", swrFetcher, { revalidateOnFocus: false });
  if (!data?.isAdmin) return null;
  return (
    <Link href="/admin" className={className}>
      Admin
    </Link>
  );
}
