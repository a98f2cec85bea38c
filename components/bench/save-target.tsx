"use client";

import Link from "next/link";
import { useState } from "react";
import useSWR from "swr";
import type { ParsedSketch } from "@/lib/bench/parse-sketch";
import { sketchToQueryString, type Sketch } from "@/lib/bench/sketch-state";
import { TARGET_COSMOLOGY_TEXT, usesOtherCosmology } from "@/lib/bench/case-report";
import { targetBodyFromSketch } from "@/lib/workspace/bench-link";
import { roleCan, roleLabels } from "@/lib/workspace/roles";
import type { ProposalSummary } from "@/lib/workspace/proposal-view";
import type { TargetView } from "@/lib/workspace/target-view";
import { apiFetch, swrFetcher } from "@/components/shared/api-client";
import { Field, FormError, buttonClass } from "@/components/shared/field";
import { formatSignificant } from "@/lib/numbers/significant";
import { formValues, useFormSubmit } from "@/components/shared/use-form-submit";

interface SessionAnswer {
  user?: { name?: string | null };
}

interface SaveTargetProps {
  sketch: Sketch;
  parsed: ParsedSketch;
  /** The sketch parses and computes (the results on screen are its own). */
  isComputable: boolean;
}

/**
 * "Save as target": the sketch becomes a target of one of the astronomer's proposals (where they are
 * Co-I or PI), through the same targets API the proposal page uses, with every input a target keeps
 * (`targetBodyFromSketch`). Signed out, it links to sign-in and back to this very sketch.
 */
export function SaveTarget({ sketch, parsed, isComputable }: SaveTargetProps) {
  const session = useSWR<SessionAnswer>("/api/auth/session", (url: string) => fetch(url).then((r) => r.json()));
  const isSignedIn = Boolean(session.data?.user);
  const proposals = useSWR<{ proposals: ProposalSummary[] }>(isSignedIn ? "/api/proposals" : null, swrFetcher);
  const { fields, message, isBusy, run } = useFormSubmit();
  const [saved, setSaved] = useState<{ target: TargetView; proposalId: string } | null>(null);
  const editable = (proposals.data?.proposals ?? []).filter((p) => roleCan(p.role, "edit"));

  if (session.isLoading) return null;
  if (!isSignedIn) {
    const back = `/bench?${sketchToQueryString(sketch)}`;
    return (
      <section aria-labelledby="save-target-heading" className="rounded-lg border border-void-edge bg-void-raised p-4 text-sm">
        <h2 id="save-target-heading" className="font-semibold">Save as target</h2>
        <p className="mt-1 text-dusk-dim">
          Saving this sketch to a proposal needs an account.{" "}
          <Link href={`/sign-in?callbackUrl=${encodeURIComponent(back)}`}>Sign in to save it</Link>; you come back to this sketch.
        </p>
      </section>
    );
  }

  return (
    <form
      aria-label="Save as target"
      className="space-y-3 rounded-lg border border-void-edge bg-void-raised p-4"
      onSubmit={(event) => {
        event.preventDefault();
        if (!parsed.ok || !isComputable) return;
        const v = formValues(event.currentTarget);
        const body = { ...targetBodyFromSketch(sketch, parsed.inputs), name: v.name, priority: Number(v.priority), tags: [] };
        void run(async () => {
          const { target } = await apiFetch<{ target: TargetView }>(`/api/proposals/${v.proposalId}/targets`, { method: "POST", body });
          setSaved({ target, proposalId: v.proposalId });
        });
      }}
    >
      <h2 className="font-semibold">Save as target</h2>
      {proposals.data && editable.length === 0 ? (
        <p className="text-sm text-dusk-dim">
          You are Co-I or PI on no proposal yet. <Link href="/proposals">Start one</Link> to save sketches to it.
        </p>
      ) : (
        <>
          <label className="flex flex-col text-sm font-semibold">
            Proposal
            <select name="proposalId" required className="mt-1 rounded border border-void-edge bg-void px-2 py-1 font-normal">
              {editable.map((p) => (
                <option key={p.id} value={p.id}>
                  {p.title} ({p.cycle}, {roleLabels[p.role]})
                </option>
              ))}
            </select>
          </label>
          <div className="grid gap-3 sm:grid-cols-2">
            <Field label="Target name" name="name" required errors={fields.name} />
            <Field label="Priority (1–5)" name="priority" inputMode="numeric" defaultValue="3" required errors={fields.priority} />
          </div>
          {parsed.ok && usesOtherCosmology(sketch) && <p className="text-xs text-dusk-dim">{TARGET_COSMOLOGY_TEXT}</p>}
          <p className="text-xs text-dusk-dim" data-testid="save-target-radius-hint">
            A target keeps the sketch&apos;s lens, distances, source offset, proper motion, position, science case, event peak and source
            size; it has no field for the lens radius, so that stays in this bench link only. The saved target is graded with the
            chosen proposal&apos;s instrument, site and cycle, not the sketch&apos;s.
          </p>
          {/* Refusals of the sketch's own fields (position, event, source): the form has no input to show them beside. */}
          {Object.entries(fields)
            .filter(([field]) => field !== "name" && field !== "priority")
            .map(([field, messages]) => (
              <p key={field} role="alert" className="text-sm text-alarm">
                {messages?.join(" ")}
              </p>
            ))}
          {!isComputable && <p className="text-sm text-alarm">Fix the marked fields first: only a sketch that computes can be saved.</p>}
          <FormError message={message} />
          {saved && (
            <p role="status" className="text-sm text-glint" data-testid="saved-target">
              Saved {saved.target.name}: Einstein radius {formatSignificant(saved.target.einsteinRadiusMas)} mas.{" "}
              <Link href={`/proposals/${saved.proposalId}`}>Open the proposal</Link>
            </p>
          )}
          <button type="submit" className={buttonClass} disabled={isBusy || !isComputable || !proposals.data}>
            Save as target
          </button>
        </>
      )}
    </form>
  );
}
