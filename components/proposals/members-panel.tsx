"use client";

import useSWR from "swr";
import { proposalRoles, roleLabels, type ProposalRole } from "@/lib/workspace/roles";
import type { InvitationView, MemberView } from "@/lib/workspace/member-view";
import { apiFetch, swrFetcher } from "@/components/shared/api-client";
import { ChoiceOptions } from "@/components/shared/choice-options";
import { Field, FormError, quietButtonClass } from "@/components/shared/field";
import { formatDateTime } from "@/components/shared/format";
import { formValues, useFormSubmit } from "@/components/shared/use-form-submit";

interface MembersPanelProps {
  proposalId: string;
  initialMembers: MemberView[];
  canManage: boolean;
}

/** The team: everyone sees it; a PI changes roles, removes members and sends invitations. */
export function MembersPanel({ proposalId, initialMembers, canManage }: MembersPanelProps) {
  const membersUrl = `/api/proposals/${proposalId}/members`;
  const members = useSWR<{ members: MemberView[] }>(membersUrl, swrFetcher, { fallbackData: { members: initialMembers } });
  const { message, setMessage, run } = useFormSubmit();

  // Optimistic: the list changes at once and rolls back if the server refuses (e.g. the last PI).
  const changeRole = (member: MemberView, role: ProposalRole) =>
    run(async () => {
      const current = members.data?.members ?? [];
      await members.mutate(apiFetch<{ members: MemberView[] }>(`${membersUrl}/${member.userId}`, { method: "PATCH", body: { role } }), {
        optimisticData: { members: current.map((m) => (m.userId === member.userId ? { ...m, role } : m)) },
        rollbackOnError: true,
        populateCache: true,
        revalidate: false,
      });
    });
  const remove = (member: MemberView) =>
    run(async () => {
      const current = members.data?.members ?? [];
      await members.mutate(
        apiFetch(`${membersUrl}/${member.userId}`, { method: "DELETE" }).then(() => ({ members: current.filter((m) => m.userId !== member.userId) })),
        { optimisticData: { members: current.filter((m) => m.userId !== member.userId) }, rollbackOnError: true, revalidate: false },
      );
    });

  return (
    <section aria-labelledby="members-heading" className="space-y-3">
      <h2 id="members-heading" className="text-xl font-semibold">
        Team
      </h2>
      <ul className="space-y-2 text-sm" data-testid="member-list">
        {(members.data?.members ?? []).map((m) => (
          <li key={m.userId} className="flex flex-wrap items-center gap-2">
            <span className="font-semibold">{m.name}</span>
            <span className="text-dusk-dim">{m.email}</span>
            {canManage ? (
              <>
                <select
                  aria-label={`Role of ${m.name}`}
                  value={m.role}
                  onChange={(e) => {
                    setMessage(null);
                    void changeRole(m, e.target.value as ProposalRole);
                  }}
                  className="ml-auto rounded border border-void-edge bg-void px-1 py-0.5"
                >
                  <ChoiceOptions values={proposalRoles} labels={roleLabels} />
                </select>
                <button type="button" className="text-alarm" aria-label={`Remove ${m.name}`} onClick={() => void remove(m)}>
                  Remove
                </button>
              </>
            ) : (
              <span className="ml-auto rounded bg-void-raised px-2">{roleLabels[m.role]}</span>
            )}
          </li>
        ))}
      </ul>
      <FormError message={message} />
      {canManage && <Invitations proposalId={proposalId} />}
    </section>
  );
}

function Invitations({ proposalId }: { proposalId: string }) {
  const url = `/api/proposals/${proposalId}/invitations`;
  const { data, mutate } = useSWR<{ invitations: InvitationView[] }>(url, swrFetcher);
  const { fields, message, isBusy, run } = useFormSubmit();
  return (
    <div className="space-y-3 border-t border-void-edge pt-3">
      <form
        aria-label="Invite a colleague"
        className="space-y-2"
        onSubmit={(event) => {
          event.preventDefault();
          const form = event.currentTarget;
          const values = formValues(form);
          void run(async () => {
            await apiFetch(url, { method: "POST", body: values });
            form.reset();
            await mutate();
          });
        }}
      >
        <Field label="Invite by e-mail" name="email" type="email" required errors={fields.email} />
        <label className="flex items-center gap-2 text-sm">
          Role
          <select name="role" defaultValue="coi" className="rounded border border-void-edge bg-void px-1 py-0.5">
            <ChoiceOptions values={proposalRoles} labels={roleLabels} />
          </select>
          <button type="submit" className={quietButtonClass} disabled={isBusy}>
            Send invitation
          </button>
        </label>
        <FormError message={message} />
      </form>
      {(data?.invitations.length ?? 0) > 0 && (
        <ul className="space-y-1 text-sm" aria-label="Open invitations">
          {data?.invitations.map((i) => (
            <li key={i.id} className="flex flex-wrap gap-2">
              <span>{i.email}</span>
              <span className="text-dusk-dim">
                {roleLabels[i.role]} · until {formatDateTime(i.expiresAt)}
              </span>
              <button
                type="button"
                className="ml-auto text-alarm"
                onClick={() => void run(async () => {
                  await apiFetch(`${url}/${i.id}`, { method: "DELETE" });
                  await mutate();
                })}
              >
                Withdraw
              </button>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
