"use client";

import { useCallback, useMemo, useState } from "react";
import { benchCaseReport, benchScheduleRequest, TARGET_COSMOLOGY_TEXT, usesOtherCosmology } from "@/lib/bench/case-report";
import { computeResults, type BenchResults } from "@/lib/bench/compute-results";
import { readUnitChoices, withUnitChoice } from "@/lib/bench/display-units";
import { parseSketch, type SketchInputs } from "@/lib/bench/parse-sketch";
import { demoSketch, type Sketch } from "@/lib/bench/sketch-state";
import { isSolarSketch, solarCautionText } from "@/lib/bench/solar-caution";
import { isStaleSketch, STALE_PLOTS_TEXT, STALE_RESULTS_TEXT } from "@/lib/bench/stale-results";
import { BenchPlots } from "./bench-plots";
import { RayBundlePanel } from "./ray-bundle-panel";
import { ResultsPanel, type UnitChoices } from "./results-panel";
import { SaveTarget } from "./save-target";
import { SketchForm } from "./sketch-form";
import { useSchedule } from "./use-schedule";
import { useSketchUrl } from "./use-sketch-url";
import { VerdictList } from "./verdict-list";

/**
 * While the form holds a sketch that does not parse or compute, the last good results stay for
 * reference but dimmed, and this says plainly whose numbers they are.
 */
function StaleNotice() {
  return (
    <p role="status" data-testid="stale-note" className="rounded-md border-2 border-ember bg-void-raised p-3 text-sm font-semibold text-ember">
      ⚠ {STALE_RESULTS_TEXT}
    </p>
  );
}

/** Dims stale results and keeps them out of the way of the eye and of assistive technology's focus order. */
function StaleFrame({ isStale, children, testId }: { isStale: boolean; children: React.ReactNode; testId: string }) {
  return (
    <div data-testid={testId} data-stale={isStale} aria-describedby={isStale ? "bench-stale-note" : undefined} className={isStale ? "opacity-40 grayscale" : undefined}>
      {children}
    </div>
  );
}

/**
 * The lens bench: the sketch form on the left, its numbers, verdicts and plots on the right, the ray
 * bundle below. A sketch that does not parse or compute keeps the last good results on screen, dimmed.
 */
export function LensBench({ initialSketch }: { initialSketch: Sketch }) {
  const { sketch, setSketch, setField } = useSketchUrl(initialSketch);
  const parsed = useMemo(() => parseSketch(sketch), [sketch]);
  const computed = useMemo(() => (parsed.ok ? computeResults(parsed.inputs) : undefined), [parsed]);

  // Derived state kept across renders: replaced only by a sketch that parses and computes.
  const [lastGood, setLastGood] = useState<{ results: BenchResults; inputs: SketchInputs; isSolar: boolean } | undefined>(undefined);
  if (parsed.ok && computed?.ok && computed.results !== lastGood?.results) {
    setLastGood({ results: computed.results, inputs: parsed.inputs, isSolar: isSolarSketch(parsed.inputs) });
  }
  // The case is graded on the sketch shown (the last good one), its schedule simulated in a worker.
  const goodInputs = lastGood?.inputs;
  const scheduleRequest = useMemo(() => (goodInputs === undefined ? null : benchScheduleRequest(goodInputs)), [goodInputs]);
  const schedule = useSchedule(scheduleRequest);
  const report = useMemo(() => (goodInputs === undefined ? null : benchCaseReport(goodInputs, schedule)), [goodInputs, schedule]);

  const fieldErrors = parsed.ok ? {} : parsed.fieldErrors;
  const warnings = parsed.ok ? parsed.warnings : {};
  const isStale = isStaleSketch(parsed, computed);
  const unitsText = sketch.units;
  const onUnitChange = useCallback((id: string, unit: string) => setField("units", withUnitChoice(unitsText, id, unit)), [setField, unitsText]);
  const units: UnitChoices = useMemo(() => ({ chosen: readUnitChoices(unitsText), onChange: onUnitChange }), [unitsText, onUnitChange]);

  return (
    <div className="space-y-6">
      <header className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <h1 className="text-3xl font-bold text-dusk">Lens bench</h1>
          <p className="text-dusk-dim">Sketch a lens and see whether the observation is feasible. The link in the address bar reproduces this sketch.</p>
        </div>
        <button
          type="button"
          onClick={() => setSketch({ ...demoSketch })}
          className="rounded-md border border-void-edge px-3 py-1.5 text-sm text-dusk hover:border-ember"
        >
          Reset to the demo sketch
        </button>
      </header>

      {lastGood?.isSolar ? (
        <p role="note" data-testid="solar-caution" className="rounded-md border border-alarm bg-void-raised p-3 text-sm font-semibold text-alarm">
          ⚠ {solarCautionText}
        </p>
      ) : null}

      <div className="grid gap-6 lg:grid-cols-[minmax(0,5fr)_minmax(0,7fr)]">
        <SketchForm sketch={sketch} fieldErrors={fieldErrors} warnings={warnings} onFieldChange={setField} />
        <div className="space-y-4">
          {computed?.ok === false ? (
            <p role="alert" className="rounded-md border border-alarm p-3 text-sm text-alarm">
              This sketch cannot be computed: {computed.message}
            </p>
          ) : null}
          {isStale && lastGood !== undefined ? (
            <div id="bench-stale-note">
              <StaleNotice />
            </div>
          ) : null}
          {lastGood !== undefined ? (
            <StaleFrame isStale={isStale} testId="bench-results">
              <div className="space-y-4">
                <VerdictList report={report} cosmologyNote={usesOtherCosmology(sketch) ? TARGET_COSMOLOGY_TEXT : undefined} />
                <ResultsPanel results={lastGood.results} units={units} />
              </div>
            </StaleFrame>
          ) : null}
          <SaveTarget sketch={sketch} parsed={parsed} isComputable={parsed.ok && !isStale} />
        </div>
      </div>

      {lastGood !== undefined ? (
        <div className="space-y-2">
          {isStale ? <p className="text-sm font-semibold text-ember">⚠ {STALE_PLOTS_TEXT}</p> : null}
          <StaleFrame isStale={isStale} testId="bench-plots">
            <BenchPlots results={lastGood.results} schedule={schedule.status === "done" ? schedule.schedule : undefined} />
          </StaleFrame>
        </div>
      ) : null}
      <RayBundlePanel sketch={sketch} onFieldChange={setField} />
    </div>
  );
}
