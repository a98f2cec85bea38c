"use client";

import Link from "next/link";
import { useState } from "react";
import useSWR from "swr";
import type { ParsedSketch } from "@/lib/bench/parse-sketch";
import { sketchToQueryString, type Sketch } from "@/lib/bench/sketch-state";
import { DEFAULT_COSMOLOGY } from "@/lib/physics";
import { hypothesisFromSketch } from "@/lib/workspace/bench-link";
import { roleCan, roleLabels } from "@/lib/workspace/roles";
import type { ProposalSummary } from "@/lib/server/proposals";
import type { TargetView } from "@/lib/server/targets";
import { apiFetch, swrFetcher } from "@/components/workspace/api-client";
import { Field, FormError, buttonClass } from "@/components/workspace/field";
import { formatQuantity } from "@/components/workspace/format";
import { formValues, useFormSubmit } from "@/components/workspace/use-form-submit";

interface SessionAnswer {
  user?: { name?: string | null };
}

interface SaveTargetProps {
  sketch: Sketch;
  parsed: ParsedSketch;
  /** β in units of θ_E from the last computed results; undefined while the sketch does not compute. */
  betaThetaE: number | undefined;
}

/**
 * "Save as target": the bench's lens hypothesis becomes a target of one of the astronomer's proposals
 * (where they are Co-I or PI), through the same targets API the proposal page uses. Signed out, it
 * links to sign-in and back to this very sketch.
 */
export function SaveTarget({ sketch, parsed, betaThetaE }: SaveTargetProps) {
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

  const isComputable = parsed.ok && betaThetaE !== undefined;
  const usesOtherCosmology =
    parsed.ok && sketch.geometry === "redshift" && (Number(sketch.h0) !== DEFAULT_COSMOLOGY.H0 || Number(sketch.om0) !== DEFAULT_COSMOLOGY.Om0);
  return (
    <form
      aria-label="Save as target"
      className="space-y-3 rounded-lg border border-void-edge bg-void-raised p-4"
      onSubmit={(event) => {
        event.preventDefault();
        if (!parsed.ok || betaThetaE === undefined) return;
        const v = formValues(event.currentTarget);
        const body = { ...hypothesisFromSketch(sketch, parsed.inputs, betaThetaE), name: v.name, ra: v.ra, dec: v.dec, priority: Number(v.priority), tags: [] };
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
            <Field label="Right ascension" name="ra" placeholder="17 45 40.04 or 266.417" required errors={fields.ra} />
            <Field label="Declination" name="dec" placeholder="-29 00 28.1 or -29.008" required errors={fields.dec} />
          </div>
          {usesOtherCosmology && (
            <p className="text-xs text-dusk-dim">
              Targets use H0 = {DEFAULT_COSMOLOGY.H0} km/s/Mpc and Ωm = {DEFAULT_COSMOLOGY.Om0}; the saved target keeps the redshifts, so its distances follow those values.
            </p>
          )}
          <p className="text-xs text-dusk-dim" data-testid="save-target-radius-hint">
            A target keeps the lens&apos;s mass, distances, source offset and proper motion; it has no field for the lens radius or the
            source radius, so those stay in this bench link only.
          </p>
          {!isComputable && <p className="text-sm text-alarm">Fix the marked fields first: only a sketch that computes can be saved.</p>}
          <FormError message={message} />
          {saved && (
            <p role="status" className="text-sm text-glint" data-testid="saved-target">
              Saved {saved.target.name}: Einstein radius {formatQuantity(saved.target.einsteinRadiusMas)} mas.{" "}
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
