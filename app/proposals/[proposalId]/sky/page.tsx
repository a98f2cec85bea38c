import Link from "next/link";
import type { Metadata } from "next";
import { ProposalPageHeader } from "@/components/proposals/proposal-page-header";
import { ProposalSeason } from "@/components/sky/proposal-season";
import { DEFAULT_SAFE_SUN_ELONGATION_DEG } from "@/lib/astro/constants";
import { clearNightsText, moonRuleText, seasonWindowQuerySchema } from "@/lib/figures/season-view";
import { addDaysIso } from "@/lib/astro/time";
import { SEASON_BRIDGE_NIGHTS } from "@/lib/schedule";
import { loadForPage } from "@/lib/server/page-access";
import { getProposalSky } from "@/lib/server/proposals";
import { scheduleConditionsOf } from "@/lib/workspace/derived";

export const metadata: Metadata = { title: "Season view" };

/**
 * Any member: the simulated observing schedule of every target of the proposal over its cycle, or over
 * the window `start` + `nights` a season figure was drawn for (its reproduce link).
 */
export default async function ProposalSkyPage({ params, searchParams }: { params: Promise<{ proposalId: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const { proposalId } = await params;
  const { proposal, targets, total } = await loadForPage(`/proposals/${proposalId}/sky`, (actor) => getProposalSky({ proposalId }, actor));
  const { site, instrument } = proposal;
  const asked = seasonWindowQuerySchema.safeParse(await searchParams);
  const chosen = asked.success && asked.data.start !== undefined && asked.data.nights !== undefined ? { start: asked.data.start, nights: asked.data.nights } : null;
  const conditions = scheduleConditionsOf(chosen === null ? proposal : { ...proposal, cycleStartDate: chosen.start, cycleEndDate: addDaysIso(chosen.start, chosen.nights - 1) });
  return (
    <div className="space-y-6">
      <ProposalPageHeader proposalId={proposal.id} proposalTitle={proposal.title} heading="Season view">
        <p className="max-w-3xl text-sm text-dusk-dim" data-testid="season-conditions">
          The proposal&apos;s simulated observing schedule, the one every verdict counts. From {site.name} ({site.latitudeDeg}°, {site.longitudeDeg}° east,{" "}
          {site.elevationM} m; horizon {site.horizonLimitDeg}°), air mass ≤ {instrument.airmassLimit}: the usable hours each night count astronomical
          darkness, the target above the limit, at least {DEFAULT_SAFE_SUN_ELONGATION_DEG}° from the Sun, and {moonRuleText({ minSeparationDeg: instrument.moonMinSeparationDeg, maxIlluminatedFraction: instrument.moonMaxIllumination })}; they are the
          hours of a clear night. Visits of {instrument.visitMinutes} min every {instrument.cadenceHours} h are planned in them on the clear nights:{" "}
          {clearNightsText(instrument.clearNightFraction)}. An observing season is a run of nights that can hold a visit, with interruptions of up to{" "}
          {SEASON_BRIDGE_NIGHTS} nights bridged.
        </p>
      </ProposalPageHeader>
      {conditions === null ? (
        <p role="alert" className="text-ember">
          This proposal has no cycle dates yet.{" "}
          {proposal.permissions.canManage ? <Link href={`/proposals/${proposal.id}/settings`}>Set them in the proposal settings.</Link> : "Ask the PI to set them."}
        </p>
      ) : targets.length === 0 ? (
        <p className="text-dusk-dim">No targets yet.</p>
      ) : (
        <>
          {chosen !== null && (
            <p role="status" className="text-sm text-dusk-dim" data-testid="season-window">
              Showing {chosen.nights} nights from {chosen.start}, the window a season figure was drawn for.{" "}
              <Link href={`/proposals/${proposal.id}/sky`}>Show the cycle</Link>
            </p>
          )}
          {total > targets.length && (
            <p role="status" className="text-ember">
              Showing the first {targets.length} of {total} targets by priority.
            </p>
          )}
          <ProposalSeason conditions={conditions} targets={targets} />
        </>
      )}
    </div>
  );
}
