"use client";

import { useEffect, useId, useMemo, useRef, useState } from "react";
import { useRouter } from "next/navigation";
import useSWR, { useSWRConfig } from "swr";
import { FigureDownloads } from "@/components/exports/figure-downloads";
import { FigureSvg } from "@/components/figures/figure-svg";
import { apiFetch, swrFetcher } from "@/components/shared/api-client";
import type { SkySiteInput } from "@/lib/astro/inputs";
import { targetPhotometryUrl, type TargetPhotometryView } from "@/lib/event-photometry/views";
import { EVENT_FIT_HEIGHT_PX, EVENT_FIT_WIDTH_PX, eventFitPlot, eventFitTitle } from "@/lib/figures/event-fit-plot";
import { eventFitView } from "@/lib/figures/event-fit-view";
import type { PhotometryPoint, PointLensFit } from "@/lib/lensing/fit";
import { defaultEventFitChoices, defaultReferenceDataset, eventFitQuery, fitOptionsOf, isBand, predictionOptionsOf, type BandName, type EventFitChoices, type EventFitTarget } from "@/lib/lensing/fit-choices";
import type { FitPrediction } from "@/lib/lensing/fit-prediction";
import { sitePeakOutlook } from "@/lib/lensing/fit-prediction-site";
import { applyFitRequestOf, datasetReportRows, fitParameterRows } from "@/lib/lensing/fit-report";
import { NO_SCHEDULE_SENTENCE } from "@/lib/lensing/science-case-words";
import type { ObservingSchedule } from "@/lib/schedule/types";
import { targetRevisionsUrl } from "@/lib/workspace/fit-revision";
import { FitWorkerClient } from "./fit-client";

export interface EventFitPanelProps {
  proposalId: string;
  targetId: string;
  targetName: string;
  canEdit: boolean;
  /** Position (ICRS degrees) and limb darkening of the target, for parallax and a finite source. */
  target: EventFitTarget;
  /** The target's band (its source band, else the proposal's), to pick the reference dataset; null when not described. */
  band: BandName | null;
  /** The band id a fit's source magnitude is stored in: the target's source band, null for the proposal's own. */
  sourceBand: string | null;
  site: SkySiteInput;
  /** The target's simulated schedule over the cycle (the page's, computed on the server); null without cycle dates. */
  schedule: ObservingSchedule | null;
}

type FitState =
  | { status: "idle" }
  | { status: "running"; stage: "fit" | "prediction" }
  | { status: "refused" | "cancelled" | "failed"; message: string }
  | { status: "done"; fit: PointLensFit; points: PhotometryPoint[]; choices: EventFitChoices; prediction: FitPrediction | null; predictionReason: string | null };

const numberText = (value: number, digits = 3) => (Number.isFinite(value) ? value.toFixed(digits) : "—");

/**
 * The light-curve fit of a point-lens target's photometry (read with SWR at `targetPhotometryUrl`, so
 * it follows the files kept or deleted beside it): the options, a fit in a web worker with progress and
 * cancel, the result with each parameter's 1σ error, the datasets' source and blend, the predicted peak
 * against the site's schedule, the figure with its exports, and (editors) applying the fit to the target.
 */
export function EventFitPanel(props: EventFitPanelProps) {
  const { proposalId, targetId, target, schedule } = props;
  const id = useId();
  const router = useRouter();
  const { mutate } = useSWRConfig();
  const { data: photometry, error: loadError } = useSWR<TargetPhotometryView>(targetPhotometryUrl(proposalId, targetId), swrFetcher);
  const [choices, setChoices] = useState<EventFitChoices>(defaultEventFitChoices);
  const [state, setState] = useState<FitState>({ status: "idle" });
  const [chosenReference, setChosenReference] = useState<string | null>(null);
  const [applyMessage, setApplyMessage] = useState<{ text: string; isError: boolean } | null>(null);
  const [isApplying, setApplying] = useState(false);
  const client = useRef<FitWorkerClient | null>(null);
  const progressBar = useRef<HTMLProgressElement>(null);
  const progressWords = useRef<HTMLSpanElement>(null);

  useEffect(() => () => client.current?.dispose(), []);

  const datasets = useMemo(() => photometry?.files.flatMap((file) => file.datasets) ?? [], [photometry]);
  const points = photometry?.points ?? [];
  const done = state.status === "done" ? state : null;
  const fittedNames = done?.fit.datasets.map((d) => d.dataset) ?? [];
  const defaultReference = defaultReferenceDataset(
    datasets.filter((d) => done === null || fittedNames.includes(d.name)),
    props.band,
  );
  const referenceDataset = chosenReference !== null && (done === null || fittedNames.includes(chosenReference)) ? chosenReference : defaultReference;
  const isStale = done !== null && photometry !== undefined && done.points !== photometry.points;
  const referenceBand = datasets.find((d) => d.name === referenceDataset)?.band;
  const bandNote =
    props.band === null
      ? "The proposal's band is not described yet, so the source magnitude cannot be checked against it."
      : isBand(referenceBand, props.band)
        ? null
        : `${referenceDataset ?? "This dataset"} is in ${referenceBand ?? "a band its file does not name"}, not ${props.band.label}: its source magnitude is stored as ${props.band.label}, so choose the dataset in that band if there is one.`;

  const view = useMemo(() => {
    if (done === null || referenceDataset === null || !done.fit.converged) return null;
    return eventFitView({ fit: done.fit, points: done.points, referenceDataset, prediction: done.prediction, schedule, model: { limbDarkeningU: target.limbDarkeningU ?? 0, event: target } });
  }, [done, referenceDataset, schedule, target]);
  const outlook = useMemo(() => {
    if (done?.prediction == null) return null;
    if (schedule === null) return NO_SCHEDULE_SENTENCE;
    try {
      return sitePeakOutlook({ prediction: done.prediction, schedule, site: props.site, target }).sentence;
    } catch {
      // The site and target were checked when the schedule was made; say what is missing in words, never the checker's own text.
      return "The predicted peak could not be set against the site's schedule: check the proposal's site settings, then fit again.";
    }
  }, [done, schedule, props.site, target]);

  // Progress is written to the bar directly, not through React state: a fit reports after every round.
  function showProgress(fraction: number, words: string) {
    if (progressBar.current) progressBar.current.value = fraction;
    if (progressWords.current) progressWords.current.textContent = words;
  }

  async function runFit() {
    const fitted = points;
    const fitChoices = choices;
    client.current ??= new FitWorkerClient();
    setApplyMessage(null);
    setState({ status: "running", stage: "fit" });
    try {
      const outcome = await client.current.fit(fitted, fitOptionsOf(fitChoices, target), showProgress);
      if (outcome.status !== "done") {
        setState({ status: outcome.status === "refused" ? "refused" : "cancelled", message: outcome.message });
        return;
      }
      const { fit } = outcome;
      if (!fit.converged) {
        setState({ status: "done", fit, points: fitted, choices: fitChoices, prediction: null, predictionReason: null });
        return;
      }
      setState({ status: "running", stage: "prediction" });
      showProgress(1, "Sampling the fit's uncertainty for the prediction");
      const prediction = await client.current.predict(fit, predictionOptionsOf(fitted, fit, target));
      setState({ status: "done", fit, points: fitted, choices: fitChoices, prediction: prediction.ok ? prediction.prediction : null, predictionReason: prediction.ok ? null : prediction.reason });
    } catch (error) {
      // An unexpected failure of the fitting code: its message is no words for the user, so it goes to the console.
      console.error("light-curve fit failed", error);
      setState({ status: "failed", message: "The fit stopped unexpectedly and nothing was fitted. Try again; if it stops again, fit without the finite source or the parallax." });
    }
  }

  async function applyFit() {
    if (done === null || referenceDataset === null) return;
    const request = applyFitRequestOf(done.fit, referenceDataset, props.sourceBand);
    if ("refusal" in request) {
      setApplyMessage({ text: request.refusal, isError: true });
      return;
    }
    setApplying(true);
    setApplyMessage(null);
    try {
      await apiFetch(targetRevisionsUrl(proposalId, targetId), { method: "POST", body: request });
      setApplyMessage({ text: `Applied: ${props.targetName} now holds this fit's t0, u0, t_E${done.fit.rho === undefined ? "" : ", ρ"}${done.fit.piEN === undefined ? "" : ", π_E"}, source magnitude and blend fraction (from ${referenceDataset}); the previous values are kept for undo.`, isError: false });
      await mutate(targetRevisionsUrl(proposalId, targetId));
      router.refresh();
    } catch (error) {
      setApplyMessage({ text: error instanceof Error ? error.message : "The fit could not be applied.", isError: true });
    } finally {
      setApplying(false);
    }
  }

  const isRunning = state.status === "running";
  const toggle = (key: keyof EventFitChoices, label: string, hint: string) => (
    <label className="flex items-start gap-2">
      <input type="checkbox" checked={choices[key]} disabled={isRunning} onChange={(e) => setChoices({ ...choices, [key]: e.target.checked })} className="mt-1" />
      <span>
        {label} <span className="text-dusk-dim">({hint})</span>
      </span>
    </label>
  );

  return (
    <section aria-labelledby={`${id}-heading`} className="space-y-3 text-sm" data-testid="event-fit">
      <h3 id={`${id}-heading`} className="text-lg font-semibold">
        Light-curve fit
      </h3>
      {loadError ? (
        <p role="alert" className="text-alarm">
          The photometry could not be loaded: {loadError instanceof Error ? loadError.message : String(loadError)}
        </p>
      ) : photometry === undefined ? (
        <p className="text-dusk-dim">Loading the photometry…</p>
      ) : points.length === 0 ? (
        <p className="text-dusk-dim">Add a photometry file above to fit the event&apos;s light curve.</p>
      ) : (
        <p className="text-dusk-dim">
          {points.length.toLocaleString("en-US")} points in {datasets.length} {datasets.length === 1 ? "dataset" : "datasets"}, fitted with a point-source point lens and each dataset&apos;s own source and blend flux.
        </p>
      )}
      <fieldset className="space-y-1" disabled={isRunning}>
        <legend className="sr-only">Fit options</legend>
        {toggle("rescaleErrors", "Rescale each dataset's errors", "so its χ²/dof is 1; the factors are reported")}
        {toggle("finiteSource", "Finite source ρ", target.limbDarkeningU === null ? "uniform disk: the target has no limb darkening" : `limb darkening ${target.limbDarkeningU}`)}
        {toggle("parallax", "Annual parallax π_E", `at RA ${target.raDeg.toFixed(4)}°, Dec ${target.decDeg.toFixed(4)}°`)}
      </fieldset>
      <div className="flex flex-wrap items-center gap-3">
        <button type="button" onClick={() => void runFit()} disabled={isRunning || points.length === 0} className="rounded-md border border-ember px-3 py-1.5 text-dusk disabled:opacity-50">
          Fit light curve
        </button>
        {isRunning ? (
          <>
            <progress ref={progressBar} aria-label={state.stage === "fit" ? "Fit progress" : "Prediction progress"} max={1} className="h-2 w-48 accent-ember" />
            <span ref={progressWords} aria-live="polite" className="text-dusk-dim" />
            <button type="button" onClick={() => client.current?.cancel()} className="rounded-md border border-void-edge px-3 py-1.5">
              Cancel fit
            </button>
          </>
        ) : null}
      </div>
      {state.status === "refused" || state.status === "failed" ? (
        <p role="alert" className="text-alarm">
          {state.message}
        </p>
      ) : null}
      {state.status === "cancelled" ? <p role="status">{state.message}</p> : null}
      {done !== null && !done.fit.converged ? (
        <p role="alert" className="text-alarm" data-testid="fit-not-converged">
          The fit did not converge, so there is nothing to apply. {done.fit.reason} The target is unchanged.
        </p>
      ) : null}
      {done !== null && done.fit.converged ? (
        <FitResult
          done={done}
          view={view}
          title={eventFitTitle(props.targetName, done.fit)}
          referenceDataset={referenceDataset}
          onReferenceChange={setChosenReference}
          outlook={outlook}
          bandNote={props.canEdit ? bandNote : null}
          isStale={isStale}
          exportQuery={referenceDataset === null ? null : eventFitQuery(targetId, done.choices, referenceDataset)}
          exportPath={`/api/proposals/${proposalId}/exports/figures/event-fit`}
        />
      ) : null}
      {done !== null && done.fit.converged && props.canEdit ? (
        <div className="flex flex-wrap items-center gap-3">
          <button type="button" onClick={() => void applyFit()} disabled={isApplying || isStale} className="rounded-md border border-ember px-3 py-1.5 text-dusk disabled:opacity-50">
            Apply fit to target
          </button>
          {isStale ? <span className="text-dusk-dim">The photometry changed since this fit: fit again before applying.</span> : null}
        </div>
      ) : null}
      {applyMessage !== null ? (
        <p role={applyMessage.isError ? "alert" : "status"} className={applyMessage.isError ? "text-alarm" : "text-glint"}>
          {applyMessage.text}
        </p>
      ) : null}
    </section>
  );
}

interface FitResultProps {
  done: Extract<FitState, { status: "done" }>;
  view: ReturnType<typeof eventFitView> | null;
  title: string;
  referenceDataset: string | null;
  onReferenceChange: (dataset: string) => void;
  outlook: string | null;
  /** Why the reference dataset's magnitude may not be in the target's band; null when it is. */
  bandNote: string | null;
  isStale: boolean;
  exportQuery: Record<string, string> | null;
  exportPath: string;
}

/** A converged fit: χ²/dof, the parameters, the datasets, the prediction, the figure and its downloads. */
function FitResult({ done, view, title, referenceDataset, onReferenceChange, outlook, bandNote, isStale, exportQuery, exportPath }: FitResultProps) {
  const id = useId();
  const { fit } = done;
  // Clip ids unique on the page: url(#…) resolves to the first element of that id in the document.
  const figure = useMemo(() => (view === null ? null : eventFitPlot({ view, title, width: EVENT_FIT_WIDTH_PX, height: EVENT_FIT_HEIGHT_PX, idPrefix: `event-fit-${id.replace(/[^A-Za-z0-9-]/g, "")}` })), [view, title, id]);
  return (
    <div className="space-y-3" data-testid="fit-result">
      {isStale ? <p className="text-dusk-dim">The photometry has changed since this fit; the figure and numbers are of the points it was fitted on.</p> : null}
      <p data-testid="fit-chi2">
        χ²/dof = {numberText(fit.chi2 / fit.dof)} ({numberText(fit.chi2, 1)} for {fit.dof} degrees of freedom)
        {done.choices.rescaleErrors ? ", with each dataset's errors rescaled" : ", with the errors as stated"}.
      </p>
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1">
        {fitParameterRows(fit).map((row) => (
          <div key={row.name} className="contents">
            <dt className="text-dusk-dim">{row.label}</dt>
            <dd className="tabular-nums" data-testid={`fit-${row.name}`}>
              {row.text}
            </dd>
          </div>
        ))}
      </dl>
      <table className="text-left tabular-nums">
        <caption className="text-left text-dusk-dim">Each dataset: source and blend on the 22 mag flux scale of its own band</caption>
        <thead>
          <tr>
            <th className="pr-4">Dataset</th>
            <th className="pr-4">Points</th>
            <th className="pr-4">Source (mag)</th>
            <th className="pr-4">Blend (mag)</th>
            <th className="pr-4">f_s</th>
            <th className="pr-4">Error factor</th>
          </tr>
        </thead>
        <tbody>
          {datasetReportRows(fit).map((row) => (
            <tr key={row.dataset}>
              <td className="pr-4">{row.dataset}</td>
              <td className="pr-4">{row.points}</td>
              <td className="pr-4">{numberText(row.sourceMagnitude)}</td>
              <td className="pr-4">{Number.isFinite(row.blendMagnitude) ? numberText(row.blendMagnitude) : `none (blend flux ${numberText(row.blendFlux, 2)})`}</td>
              <td className="pr-4">{numberText(row.sourceFraction)}</td>
              <td className="pr-4">{numberText(row.errorScale)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {fit.datasets.length > 1 && referenceDataset !== null ? (
        <div className="flex items-center gap-2">
          <label htmlFor={`${id}-reference`}>Reference dataset (figure scale and the target&apos;s source magnitude)</label>
          <select id={`${id}-reference`} value={referenceDataset} onChange={(e) => onReferenceChange(e.target.value)} className="rounded border border-void-edge bg-void px-2 py-0.5 text-dusk">
            {fit.datasets.map((d) => (
              <option key={d.dataset} value={d.dataset}>
                {d.dataset}
              </option>
            ))}
          </select>
        </div>
      ) : null}
      {bandNote !== null ? <p className="text-dusk-dim">{bandNote}</p> : null}
      <p data-testid="fit-prediction">{done.prediction === null ? (done.predictionReason ?? "No prediction.") : outlook}</p>
      {view !== null && figure !== null ? (
        <figure className="space-y-1">
          <div className="overflow-x-auto">
            <FigureSvg tree={figure} />
          </div>
          <figcaption className="text-xs text-dusk-dim">
            Every dataset is drawn on {view.referenceDataset}&apos;s magnitudes through the fit (common practice); the band is the prediction&apos;s 68 % interval from the last point, with the site&apos;s usable windows shaded.
          </figcaption>
          {exportQuery !== null && !isStale ? <FigureDownloads path={exportPath} query={exportQuery} figureName="light-curve fit figure" /> : null}
        </figure>
      ) : null}
    </div>
  );
}
