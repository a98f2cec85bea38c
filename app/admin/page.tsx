import type { Metadata } from "next";
import { AdminAccounts } from "@/components/admin/admin-accounts";
import { AppError } from "@/lib/errors";
import { listAccounts } from "@/lib/server/admin";
import { loadForPage } from "@/lib/server/page-access";

export const metadata: Metadata = { title: "Site admin" };

/** Site admins only: the accounts, their site roles and their proposals. */
export default async function AdminPage() {
  const loaded = await loadForPage("/admin", async (actor) => {
    try {
      return { page: await listAccounts({}, actor), selfId: actor?.userId ?? "" };
    } catch (error) {
      // A member who follows a link here is told what the page is for, not shown an error page.
      if (error instanceof AppError && error.kind === "forbidden") return null;
      throw error;
    }
  });
  if (!loaded) {
    return (
      <section className="space-y-2">
        <h1 className="text-3xl font-bold">Site admin</h1>
        <p role="alert">Only site admins can use this page. Ask one of them if you need an account changed.</p>
      </section>
    );
  }
  return (
    <section className="space-y-4">
      <h1 className="text-3xl font-bold">Site admin</h1>
      <p className="max-w-3xl text-sm text-dusk-dim">
        Every account, its site role and the proposals it belongs to. A site admin can open any proposal to audit it (with a
        viewer&apos;s rights: reading only); to work on one, ask its PI for an invitation. The site always keeps at least one admin.
      </p>
      <AdminAccounts initialPage={loaded.page} selfId={loaded.selfId} />
    </section>
  );
}
