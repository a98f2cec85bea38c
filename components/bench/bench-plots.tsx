"use client";

import { useMemo } from "react";
import type { BenchResults } from "@/lib/bench/compute-results";
import { angleInUnit, naturalAngleUnit, unitLabel } from "@/lib/bench/display-units";
import { astrometricTrack, deflectionCurves, lightCurve } from "@/lib/bench/plot-data";
import { astrometricTrackPlot } from "@/lib/figures/astrometric-track-plot";
import { deflectionPlot } from "@/lib/figures/deflection-plot";
import { lensPlaneDiagram } from "@/lib/figures/lens-plane-diagram";
import { lightCurvePlot } from "@/lib/figures/light-curve-plot";
import { FigureDownloads } from "@/components/exports/figure-downloads";
import { FigureSvg } from "@/components/figures/figure-svg";
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
  const deflectionTree = useMemo(() => deflectionPlot({ curves: deflectionCurves(), width: PLOT_WIDTH, height: PLOT_HEIGHT }), []);
  const event = results.event;
  const layout = results.lensPlane;
  const thetaERad = layout.thetaERad;
  const lensPlaneTree = useMemo(() => {
    const angleUnit = naturalAngleUnit(thetaERad);
    return lensPlaneDiagram({ layout, thetaEInUnit: angleInUnit(thetaERad, angleUnit), unitLabel: unitLabel(angleUnit), width: PLOT_WIDTH, height: PLOT_HEIGHT });
  }, [layout, thetaERad]);
  const eventPlots = useMemo(() => {
    if (event === undefined) return undefined;
    const light = lightCurve(event, schedule);
    // The centroid shift is ~θ_E/3: a finer unit often reads better there.
    const shiftUnit = naturalAngleUnit(thetaERad / 3);
    const track = astrometricTrackPlot({ track: astrometricTrack(event, schedule), thetaEInUnit: angleInUnit(thetaERad, shiftUnit), unitLabel: unitLabel(shiftUnit), width: PLOT_WIDTH, height: PLOT_HEIGHT });
    return { isLimitedBySourceSize: light.isLimitedBySourceSize, light: lightCurvePlot({ lightCurve: light, width: PLOT_WIDTH, height: PLOT_HEIGHT }), track };
  }, [event, schedule, thetaERad]);
  const isScheduled = schedule !== undefined && event?.campaignStartJdUtc != null;
  return (
    <section aria-label="Plots" className="grid gap-4 xl:grid-cols-2">
      <PlotCard testId="plot-lens-plane">
        <FigureSvg tree={lensPlaneTree} />
        <FigureDownloads path="/api/bench/exports/lens-plane" isSketchFromAddress figureName="lens-plane diagram" />
      </PlotCard>
      <PlotCard testId="plot-deflection">
        <FigureSvg tree={deflectionTree} />
        <FigureDownloads path="/api/bench/exports/deflection" isSketchFromAddress figureName="deflection plot" />
      </PlotCard>
      {eventPlots !== undefined ? (
        <>
          <PlotCard testId="plot-light-curve">
            <FigureSvg tree={eventPlots.light} />
            <figcaption className="px-2 text-xs text-dusk-dim" data-testid="light-curve-epochs">
              {isScheduled
                ? "Epochs: the visits the simulated schedule places in the campaign (dark, above the limits, clear nights), from the cycle's first night."
                : "Epochs: one per cadence interval from the campaign's start, until a schedule is simulated (it needs the cycle dates and the event peak)."}
            </figcaption>
            {eventPlots.isLimitedBySourceSize ? (
              <figcaption className="px-2 text-xs text-ember" data-testid="light-curve-capped">
                The peak is limited by the source&apos;s size: the curve is a uniform disk&apos;s finite-source magnification, which differs there
                by more than 1% from a point source&apos;s.
              </figcaption>
            ) : null}
            <FigureDownloads path="/api/bench/exports/light-curve" isSketchFromAddress figureName="light curve" />
          </PlotCard>
          <PlotCard testId="plot-astrometric-track">
            <FigureSvg tree={eventPlots.track} />
            <FigureDownloads path="/api/bench/exports/astrometric-track" isSketchFromAddress figureName="astrometric track" />
          </PlotCard>
        </>
      ) : (
        <p className="text-sm text-dusk-dim xl:col-span-2">The light curve and astrometric track are drawn for a compact (point) lens.</p>
      )}
    </section>
  );
}
