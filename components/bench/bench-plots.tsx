"use client";

import { useMemo } from "react";
import type { BenchResults } from "@/lib/bench/compute-results";
import { angleInUnit, naturalAngleUnit, unitLabel } from "@/lib/bench/display-units";
import { astrometricTrack, deflectionCurves, lightCurve } from "@/lib/bench/plot-data";
import { AstrometricTrackPlot } from "@/lib/figures/astrometric-track-plot";
import { DeflectionPlot } from "@/lib/figures/deflection-plot";
import { LensPlaneDiagram } from "@/lib/figures/lens-plane-diagram";
import { LightCurvePlot } from "@/lib/figures/light-curve-plot";
import { FigureDownloads } from "@/components/exports/figure-downloads";
import type { ObservingSchedule } from "@/lib/schedule";

const PLOT_WIDTH = 540;
const PLOT_HEIGHT = 340;

function PlotCard({ children, testId }: { children: React.ReactNode; testId: string }) {
  return (
    <figure data-testid={testId} className="overflow-x-auto rounded-md border border-void-edge bg-void-raised p-2">
      {children}
    </figure>
  );
}

/**
 * The four plots of the sketch; the deflection curves are in units of M and never change. The event's
 * epochs are the simulated schedule's visits once it is known, the ones the science case counts.
 */
export function BenchPlots({ results, schedule }: { results: BenchResults; schedule: ObservingSchedule | undefined }) {
  const curves = useMemo(() => deflectionCurves(), []);
  const event = results.event;
  const eventPlots = useMemo(() => (event === undefined ? undefined : { light: lightCurve(event, schedule), track: astrometricTrack(event, schedule) }), [event, schedule]);
  const isScheduled = schedule !== undefined && event?.campaignStartJdUtc != null;
  const thetaERad = results.lensPlane.thetaERad;
  const angleUnit = naturalAngleUnit(thetaERad);
  const thetaEInUnit = angleInUnit(thetaERad, angleUnit);
  // The centroid shift is ~θ_E/3: a finer unit often reads better there.
  const shiftUnit = naturalAngleUnit(thetaERad / 3);
  return (
    <section aria-label="Plots" className="grid gap-4 xl:grid-cols-2">
      <PlotCard testId="plot-lens-plane">
        <LensPlaneDiagram layout={results.lensPlane} thetaEInUnit={thetaEInUnit} unitLabel={unitLabel(angleUnit)} width={PLOT_WIDTH} height={PLOT_HEIGHT} />
        <FigureDownloads path="/api/bench/exports/lens-plane" isSketchFromAddress figureName="lens-plane diagram" />
      </PlotCard>
      <PlotCard testId="plot-deflection">
        <DeflectionPlot curves={curves} width={PLOT_WIDTH} height={PLOT_HEIGHT} />
        <FigureDownloads path="/api/bench/exports/deflection" isSketchFromAddress figureName="deflection plot" />
      </PlotCard>
      {eventPlots !== undefined ? (
        <>
          <PlotCard testId="plot-light-curve">
            <LightCurvePlot lightCurve={eventPlots.light} width={PLOT_WIDTH} height={PLOT_HEIGHT} />
            <figcaption className="px-2 text-xs text-dusk-dim" data-testid="light-curve-epochs">
              {isScheduled
                ? "Epochs: the visits the simulated schedule places in the campaign (dark, above the limits, clear nights), from the cycle's first night."
                : "Epochs: one per cadence interval from the campaign's start, until a schedule is simulated (it needs the cycle dates and the event peak)."}
            </figcaption>
            {eventPlots.light.isLimitedBySourceSize ? (
              <figcaption className="px-2 text-xs text-ember" data-testid="light-curve-capped">
                The peak is limited by the source&apos;s size: the curve is a uniform disk&apos;s finite-source magnification, which differs there
                by more than 1% from a point source&apos;s.
              </figcaption>
            ) : null}
            <FigureDownloads path="/api/bench/exports/light-curve" isSketchFromAddress figureName="light curve" />
          </PlotCard>
          <PlotCard testId="plot-astrometric-track">
            <AstrometricTrackPlot track={eventPlots.track} thetaEInUnit={angleInUnit(thetaERad, shiftUnit)} unitLabel={unitLabel(shiftUnit)} width={PLOT_WIDTH} height={PLOT_HEIGHT} />
            <FigureDownloads path="/api/bench/exports/astrometric-track" isSketchFromAddress figureName="astrometric track" />
          </PlotCard>
        </>
      ) : (
        <p className="text-sm text-dusk-dim xl:col-span-2">The light curve and astrometric track are drawn for a compact (point) lens.</p>
      )}
    </section>
  );
}
