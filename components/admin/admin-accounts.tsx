"use client";

import Link from "next/link";
import { useState } from "react";
import useSWR from "swr";
import { roleLabels, siteRoleLabels, siteRoles, type SiteRole } from "@/lib/workspace/roles";
import type { AccountPage, AccountView } from "@/lib/workspace/account-view";
import { apiFetch, swrFetcher } from "@/components/shared/api-client";
import { ChoiceOptions } from "@/components/shared/choice-options";
import { FormError } from "@/components/shared/field";
import { useFormSubmit } from "@/components/shared/use-form-submit";
import { PageStepper } from "@/components/page-stepper";

const accountsUrl = (page: number, q: string) => `/api/admin/accounts?${new URLSearchParams({ page: String(page), pageSize: "50", ...(q ? { q } : {}) })}`;

/**
 * Every account with its site role and its proposals. A site role changes at once on screen and
 * returns if the server refuses (the last admin stays an admin).
 */
export function AdminAccounts({ initialPage, selfId }: { initialPage: AccountPage; selfId: string }) {
  const [page, setPage] = useState(1);
  const [q, setQ] = useState("");
  const url = accountsUrl(page, q);
  const accounts = useSWR<AccountPage>(url, swrFetcher, {
    fallbackData: url === accountsUrl(1, "") ? initialPage : undefined,
    keepPreviousData: true,
  });
  const { message, setMessage, run } = useFormSubmit();
  const data = accounts.data;
  const pageCount = Math.max(1, Math.ceil((data?.total ?? 0) / (data?.pageSize ?? 50)));

  const changeRole = (account: AccountView, siteRole: SiteRole) =>
    run(async () => {
      const current = accounts.data;
      if (!current) return;
      const withRole = (a: AccountView) => (a.userId === account.userId ? { ...a, siteRole } : a);
      await accounts.mutate(
        apiFetch<{ account: AccountView }>(`/api/admin/accounts/${account.userId}`, { method: "PATCH", body: { siteRole } }).then(({ account: updated }) => ({
          ...current,
          accounts: current.accounts.map((a) => (a.userId === updated.userId ? updated : a)),
        })),
        { optimisticData: { ...current, accounts: current.accounts.map(withRole) }, rollbackOnError: true, populateCache: true, revalidate: false },
      );
    });

  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-end gap-3 text-sm" role="search" aria-label="Find accounts">
        <label className="flex flex-col">
          Name or e-mail contains
          <input
            value={q}
            onChange={(e) => {
              setQ(e.target.value);
              setPage(1);
            }}
            className="mt-1 rounded border border-void-edge bg-void px-2 py-1"
          />
        </label>
        <span className="ml-auto text-dusk-dim" aria-live="polite">
          {data ? `${data.total} account${data.total === 1 ? "" : "s"}` : "Loading…"}
        </span>
      </div>
      <FormError message={message} />
      {accounts.error && <p role="alert" className="text-alarm">{accounts.error.message}</p>}
      <div className="overflow-x-auto rounded-lg border border-void-edge">
        <table className="w-full text-left text-sm" data-testid="account-table">
          <thead className="bg-void-raised text-dusk-dim">
            <tr>
              <th scope="col" className="px-3 py-2">Name</th>
              <th scope="col" className="px-3 py-2">E-mail</th>
              <th scope="col" className="px-3 py-2">Site role</th>
              <th scope="col" className="px-3 py-2">Proposals (role)</th>
            </tr>
          </thead>
          <tbody className="divide-y divide-void-edge">
            {(data?.accounts ?? []).map((a) => (
              <tr key={a.userId} data-testid="account-row">
                <td className="px-3 py-2 font-semibold">
                  {a.name}
                  {a.userId === selfId && <span className="ml-2 text-xs text-dusk-dim">(you)</span>}
                </td>
                <td className="px-3 py-2">{a.email}</td>
                <td className="px-3 py-2">
                  <select
                    aria-label={`Site role of ${a.name}`}
                    value={a.siteRole}
                    onChange={(e) => {
                      setMessage(null);
                      void changeRole(a, e.target.value as SiteRole);
                    }}
                    className="rounded border border-void-edge bg-void px-1 py-0.5"
                  >
                    <ChoiceOptions values={siteRoles} labels={siteRoleLabels} />
                  </select>
                </td>
                <td className="px-3 py-2">
                  {a.proposals.length === 0 ? (
                    <span className="text-dusk-dim">none</span>
                  ) : (
                    <ul className="space-y-0.5">
                      {a.proposals.map((p) => (
                        <li key={p.proposalId}>
                          <Link href={`/proposals/${p.proposalId}`}>{p.title}</Link>{" "}
                          <span className="text-dusk-dim">
                            {p.cycle} · {roleLabels[p.role]}
                          </span>
                        </li>
                      ))}
                    </ul>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <PageStepper label="Account pages" page={page} pageCount={pageCount} onPageChange={setPage} />
    </div>
  );
}
