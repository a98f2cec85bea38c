import type { Metadata } from "next";
import Link from "next/link";
import { ConfirmDelete } from "@/components/shared/confirm-delete";
import { TargetNightPanel } from "@/components/sky/target-night-panel";
import { formatWithUnit } from "@/components/shared/format";
import { CaseAnswers } from "@/components/shared/case-answers";
import { PhotonBudgetPanel } from "@/components/targets/photon-budget-panel";
import { TargetEditForm } from "@/components/targets/target-edit-form";
import { TargetNotes } from "@/components/notes/target-notes";
import { TargetStatusControl } from "@/components/targets/target-status";
import { EventFitPanel } from "@/components/lensing/event-fit-panel";
import { EventPhotometrySection } from "@/components/lensing/event-photometry-section";
import { FitRevisions } from "@/components/lensing/fit-revisions";
import { RelativisticOrbitSection } from "@/components/lensing/relativistic-orbit-section";
import { relativisticOrbitOf } from "@/lib/lensing/relativistic-orbit";
import { hasPointLensFit } from "@/lib/lensing/fit-choices";
import { nightDateSchema } from "@/lib/astro/inputs";
import { currentNightIso, jdUtcFromDate } from "@/lib/astro/time";
import { benchLink } from "@/lib/workspace/bench-link";
import { scienceCaseLabels } from "@/lib/lensing/science-cases";
import { eventTimingOf, lensSolutionOf, orbitInputsOf, targetCaseReport, targetSchedule } from "@/lib/workspace/derived";
import { ScheduleTimeline } from "@/components/targets/schedule-timeline";
import { formatEventPeak } from "@/lib/workspace/event-peak";
import { microlensingFigures, type MicrolensingFigures } from "@/lib/workspace/microlensing-figures";
import { angleWords, numberWords } from "@/lib/lensing/science-case-words";
import { skySiteOf } from "@/lib/workspace/proposal-schema";
import { bandSkyOf, photometryBandOf } from "@/lib/workspace/photometry-schema";
import { statusLabels } from "@/lib/workspace/status";
import { lensModelLabels, orbitFields } from "@/lib/workspace/target-schema";
import type { TargetView } from "@/lib/workspace/target-view";
import { listNotes } from "@/lib/server/notes";
import { loadForPage } from "@/lib/server/page-access";
import { getProposal } from "@/lib/server/proposals";
import { getTarget } from "@/lib/server/targets";
import { formatSignificant } from "@/lib/numbers/significant";

export const metadata: Metadata = { title: "Target" };

/** The event's figures as rows of the computed list (a compact lens only). */
function microlensingRows(figures: MicrolensingFigures | null): [string, string, string][] {
  if (figures === null) return [];
  const { finiteSourcePeak: disk } = figures;
  return [
    ["peak-magnification", "Peak magnification A(u0), point source", figures.pointSourcePeak === null ? "— (no finite value at u0 = 0)" : numberWords(figures.pointSourcePeak)],
    [
      "finite-source-peak",
      "Peak magnification of the source's disk",
      disk === null
        ? "— (give the source's radius or ρ)"
        : `${numberWords(disk.magnification)} (ρ = ${numberWords(disk.rho)}, limb darkening ${numberWords(disk.limbDarkeningU)}; ${disk.method})`,
    ],
    ["microlens-parallax", "Microlens parallax π_E", figures.microlensParallax === null ? "— (needs distances, not redshifts)" : numberWords(figures.microlensParallax)],
    ["astrometric-shift", "Largest astrometric shift θ_E/√8", figures.maxAstrometricShiftRad === null ? "—" : angleWords(figures.maxAstrometricShiftRad)],
    ["photon-ring", "Photon ring (n = 1) diameter", figures.photonRingDiameterRad === null ? "—" : angleWords(figures.photonRingDiameterRad)],
  ];
}

/** The orbiting star's elements as the team gave them, when it gave any (a point-mass lens only). */
function orbitRows(t: TargetView): [string, string][] {
  if (orbitFields.every((field) => t[field] == null)) return [];
  const angle = (value: number | null | undefined) => (value == null ? "—" : `${formatSignificant(value)}°`);
  return [
    ["Orbiting star: a, e", `${t.orbitSemiMajorAxisAu != null ? `${formatSignificant(t.orbitSemiMajorAxisAu)} au` : t.orbitSemiMajorAxisMas != null ? `${formatSignificant(t.orbitSemiMajorAxisMas)} mas at the lens distance` : "—"}, ${formatSignificant(t.orbitEccentricity)}`],
    ["Orbital period", t.orbitPeriodDays == null ? "— (from the lens mass)" : formatWithUnit(t.orbitPeriodDays, "d")],
    ["Time of periapsis T_p", t.orbitPeriapsisJdUtc == null ? "—" : formatEventPeak(t.orbitPeriapsisJdUtc)],
    ["Inclination i, node Ω, argument ω", `${angle(t.orbitInclinationDeg)}, ${angle(t.orbitNodeDeg)}, ${angle(t.orbitPeriapsisArgumentDeg)}`],
  ];
}

export default async function TargetPage({
  params,
  searchParams,
}: {
  params: Promise<{ proposalId: string; targetId: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const ids = await params;
  const nightParam = nightDateSchema.safeParse((await searchParams).night);
  const { proposal, target, notes } = await loadForPage(`/proposals/${ids.proposalId}/targets/${ids.targetId}`, async (actor) => {
    const [proposal, target, notes] = await Promise.all([getProposal(ids, actor), getTarget(ids, actor), listNotes(ids, actor)]);
    return { proposal, target, notes };
  });
  const apiBase = `/api/proposals/${proposal.id}/targets/${target.id}`;
  const { instrument } = proposal;
  const parameters: [string, string][] = [
    ["Right ascension (ICRS)", `${target.raText} (${formatSignificant(target.raDeg, 8)}°)`],
    ["Declination (ICRS)", `${target.decText} (${formatSignificant(target.decDeg, 8)}°)`],
    ["Lens model", lensModelLabels[target.lensModel]],
    ...(target.lensMassSolar != null ? [["Lens mass", `${formatSignificant(target.lensMassSolar)} M☉`] as [string, string]] : []),
    ...(target.velocityDispersionKmPerS != null ? [["Velocity dispersion", `${formatSignificant(target.velocityDispersionKmPerS)} km/s`] as [string, string]] : []),
    ...(target.lensDistancePc != null ? [["Lens / source distance", `${formatSignificant(target.lensDistancePc)} pc / ${formatSignificant(target.sourceDistancePc)} pc`] as [string, string]] : []),
    ...(target.lensRedshift != null ? [["Lens / source redshift", `${target.lensRedshift} / ${target.sourceRedshift}`] as [string, string]] : []),
    ["Source offset", `${formatSignificant(target.sourceOffsetThetaE)} θE`],
    ["Relative proper motion", formatWithUnit(target.properMotionMasPerYr, "mas/yr")],
    ["Science case", target.scienceCase == null ? "Inferred from the model and numbers" : scienceCaseLabels[target.scienceCase]],
    ["Event peak t0", target.eventPeakJdUtc == null ? "—" : formatEventPeak(target.eventPeakJdUtc)],
    [
      "Source radius",
      target.sourceRadiusSolar != null
        ? `${formatSignificant(target.sourceRadiusSolar)} R☉`
        : target.sourceRadiusThetaE != null
          ? `ρ = ${formatSignificant(target.sourceRadiusThetaE)} θE`
          : "— (a point source)",
    ],
    ["Limb darkening", target.limbDarkeningU == null ? "— (a uniform disk)" : formatSignificant(target.limbDarkeningU)],
    [
      "Source magnitude",
      target.sourceMagnitude == null
        ? "— (needed for the photon budget)"
        : `${formatSignificant(target.sourceMagnitude)} in ${photometryBandOf(proposal.photometry, target.sourceBand ?? proposal.photometry.bandId)?.label ?? "the proposal's own band (not described yet)"}`,
    ],
    ["Blend fraction f_s", target.blendFraction == null ? "1 (no blended light)" : formatSignificant(target.blendFraction)],
    ...orbitRows(target),
    ["Priority", String(target.priority)],
    ["Tags", target.tags.join(", ") || "—"],
  ];
  // Solved once (the photon ring is the costly part) and shared by the figures, the case and the timeline.
  const solved = lensSolutionOf(target);
  const schedule = targetSchedule(proposal, target);
  const computed: [string, string, string][] = [
    ["einstein-radius", "Einstein radius", formatWithUnit(target.einsteinRadiusMas, "mas")],
    ["image-separation", "Image separation", formatWithUnit(target.imageSeparationMas, "mas")],
    ["magnification", "Total magnification", formatSignificant(target.magnificationTotal)],
    ["time-delay", "Time delay between images", formatWithUnit(target.timeDelayDays, "d")],
    ["crossing-time", "Einstein crossing time", formatWithUnit(target.crossingTimeDays, "d")],
    ["shadow", "Shadow angular diameter", formatWithUnit(target.shadowDiameterMicroarcsec, "µas")],
    ...microlensingRows(microlensingFigures(target, solved)),
  ];
  // Answered live from the stored hypothesis and the proposal as it is now, with the target's schedule.
  const report = targetCaseReport(target, proposal, schedule, solved);
  const event = solved === null ? null : eventTimingOf(target, solved.solution, solved.geometry);
  const site = skySiteOf(proposal.site);
  const targetBand = photometryBandOf(proposal.photometry, target.sourceBand ?? proposal.photometry.bandId);
  // The night in the address bar, else tonight at the site, or the cycle's first night while it is ahead.
  const tonightIso = currentNightIso(new Date(), site.longitudeEastDeg);
  const initialNightIso = nightParam.success
    ? nightParam.data
    : proposal.cycleStartDate !== null && proposal.cycleStartDate > tonightIso
      ? proposal.cycleStartDate
      : tonightIso;

  return (
    <div className="space-y-8">
      <header className="space-y-2">
        <p className="text-sm text-dusk-dim">
          <Link href="/proposals">Proposals</Link> / <Link href={`/proposals/${proposal.id}`}>{proposal.title}</Link>
        </p>
        <h1 className="text-3xl font-bold">{target.name}</h1>
        <div className="flex flex-wrap items-center gap-4">
          {proposal.permissions.canEdit ? (
            <TargetStatusControl targetUrl={apiBase} status={target.status} />
          ) : (
            <p className="text-sm">Status: {statusLabels[target.status]}</p>
          )}
          <Link href={benchLink(target, proposal)} className="rounded-md border border-void-edge px-3 py-1.5 text-sm no-underline">
            Open in the lens bench
          </Link>
          {proposal.cycleStartDate !== null && (
            <a href={`/api/proposals/${proposal.id}/exports/calendar?targetId=${target.id}`} download className="rounded-md border border-void-edge px-3 py-1.5 text-sm no-underline">
              Calendar of windows and visits (.ics)
            </a>
          )}
          {proposal.permissions.canEdit && (
            <ConfirmDelete
              label="Delete target"
              consequence={`${target.name} and all its observation notes will be removed from the proposal.`}
              url={apiBase}
              afterUrl={`/proposals/${proposal.id}`}
              staleKeyPrefix={`/api/proposals/${proposal.id}/`}
            />
          )}
        </div>
        {proposal.permissions.canEdit && <TargetEditForm target={target} targetUrl={apiBase} />}
      </header>
      <div className="grid gap-8 md:grid-cols-2">
        <section aria-labelledby="hypothesis-heading">
          <h2 id="hypothesis-heading" className="mb-2 text-xl font-semibold">
            Lens hypothesis
          </h2>
          <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
            {parameters.map(([label, value]) => (
              <div key={label} className="contents">
                <dt className="text-dusk-dim">{label}</dt>
                <dd>{value}</dd>
              </div>
            ))}
          </dl>
        </section>
        <section aria-labelledby="computed-heading">
          <h2 id="computed-heading" className="mb-2 text-xl font-semibold">
            Computed
          </h2>
          <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
            {computed.map(([id, label, value]) => (
              <div key={id} className="contents">
                <dt className="text-dusk-dim">{label}</dt>
                <dd className="tabular-nums text-glint" data-testid={`computed-${id}`}>
                  {value}
                </dd>
              </div>
            ))}
          </dl>
        </section>
      </div>
      <section aria-labelledby="science-case-heading" className="space-y-3">
        <h2 id="science-case-heading" className="text-xl font-semibold">
          Science case
        </h2>
        {report === null ? (
          <p className="text-sm text-dusk-dim" data-testid="science-case">
            The stored numbers do not give a lens solution, so no case can be answered; correct the lens hypothesis in the edit form.
          </p>
        ) : (
          <>
            <div className="space-y-1 text-sm" data-testid="science-case" data-case={report.scienceCase.caseId}>
              <p className="text-base font-semibold">{scienceCaseLabels[report.scienceCase.caseId]}</p>
              {report.scienceCase.reason === null ? (
                <p className="text-dusk-dim">Chosen by the team.</p>
              ) : (
                <>
                  <p>{report.scienceCase.reason}</p>
                  <p className="text-dusk-dim">Inferred from the model and numbers; choose another in the edit form.</p>
                </>
              )}
            </div>
            <CaseAnswers answers={report.answers} />
          </>
        )}
      </section>
      {report !== null && solved !== null && report.scienceCase.caseId === "relativistic-orbit" && (
        <RelativisticOrbitSection
          targetName={target.name}
          outcome={relativisticOrbitOf(orbitInputsOf(target, solved.geometry))}
          periapsisJdUtc={target.orbitPeriapsisJdUtc ?? null}
          fromJdUtc={jdUtcFromDate(new Date())}
        />
      )}
      {report !== null && <PhotonBudgetPanel outcome={report.photonBudget} />}
      <ScheduleTimeline
        schedule={schedule}
        caseId={report?.scienceCase.caseId ?? null}
        solution={report?.solution ?? null}
        event={event}
        photonBudget={report !== null && "budget" in report.photonBudget ? report.photonBudget.budget : null}
      />
      {hasPointLensFit[target.lensModel] && (
        <section aria-labelledby="event-fit-heading" className="space-y-4">
          <h2 id="event-fit-heading" className="text-xl font-semibold">
            Event photometry and fit
          </h2>
          <EventPhotometrySection proposalId={proposal.id} targetId={target.id} canEdit={proposal.permissions.canEdit} />
          <EventFitPanel
            proposalId={proposal.id}
            targetId={target.id}
            targetName={target.name}
            canEdit={proposal.permissions.canEdit}
            target={{ raDeg: target.raDeg, decDeg: target.decDeg, limbDarkeningU: target.limbDarkeningU ?? null }}
            band={targetBand === undefined ? null : { id: targetBand.id, label: targetBand.label }}
            sourceBand={target.sourceBand ?? null}
            site={site}
            schedule={schedule}
          />
          <FitRevisions proposalId={proposal.id} targetId={target.id} canEdit={proposal.permissions.canEdit} />
        </section>
      )}
      <TargetNightPanel
        site={site}
        target={{ name: target.name, raDeg: target.raDeg, decDeg: target.decDeg }}
        airmassLimit={instrument.airmassLimit}
        initialNightIso={initialNightIso}
        schedule={schedule}
        bandSky={bandSkyOf(proposal.photometry, target.sourceBand ?? proposal.photometry.bandId)}
        figureExport={{ proposalId: proposal.id, targetId: target.id }}
      />
      <TargetNotes notesUrl={`${apiBase}/notes`} initialNotes={notes} canEdit={proposal.permissions.canEdit} />
    </div>
  );
}
