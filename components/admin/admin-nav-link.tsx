"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";
import { useEffect } from "react";
import useSWR from "swr";
import { swrFetcher } from "@/components/shared/api-client";

/**
 * The header's Admin link, shown to site admins only. Asked in the browser, like the account menu, so
 * pages stay static; the admin page and API check the role again on every request. The header stays
 * mounted across client navigations (sign-in is one), so the answer is asked again on each of them.
 */
export function AdminNavLink({ className }: { className?: string }) {
  const pathname = usePathname();
  const { data, mutate } = useSWR<{ isAdmin: boolean }>("/api/admin/access", swrFetcher, { revalidateOnFocus: false, revalidateOnMount: false });
  useEffect(() => {
    void mutate();
  }, [pathname, mutate]);
  if (!data?.isAdmin) return null;
  return (
    <Link href="/admin" className={className}>
      Admin
    </Link>
  );
}
