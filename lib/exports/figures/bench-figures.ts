import { benchSchedule, benchScheduleRequest } from "@/lib/bench/case-report";
import { computeResults, type BenchResults } from "@/lib/bench/compute-results";
import type { ObservingSchedule } from "@/lib/schedule";
import { angleInUnit, naturalAngleUnit, unitLabel } from "@/lib/bench/display-units";
import { parsePlainNumber, parseSketch } from "@/lib/bench/parse-sketch";
import { astrometricTrack, deflectionCurves, lightCurve } from "@/lib/bench/plot-data";
import { sketchToQueryString, type Sketch } from "@/lib/bench/sketch-state";
import { AppError } from "@/lib/errors";
import { summaryOf } from "@/lib/workspace/issue-words";
import type { CitationKey } from "@/lib/citations/references";
import { buildProvenance } from "@/lib/exports/provenance";
import { astrometricTrackPlot } from "@/lib/figures/astrometric-track-plot";
import { deflectionPlot } from "@/lib/figures/deflection-plot";
import type { FigureTree } from "@/lib/figures/figure-tree";
import { lensPlaneDiagram } from "@/lib/figures/lens-plane-diagram";
import { lightCurvePlot } from "@/lib/figures/light-curve-plot";
import { printPalette } from "@/lib/figures/plot-palette";
import type { Provenance } from "@/lib/exports/provenance";
import { astrometricTrackData, deflectionData, lensPlaneData, lightCurveData } from "@/lib/exports/figure-data/bench-data";
import type { DataTable } from "@/lib/exports/tables/data-table";
import { figureMarkup } from "./figure-markup";
import type { PlotExport } from "./figure-response";

export const benchFigureKinds = ["lens-plane", "deflection", "light-curve", "astrometric-track"] as const;
export type BenchFigureKind = (typeof benchFigureKinds)[number];

/** The bench draws its plots at this size (CSS px); exports keep it so labels sit as on screen. */
export const BENCH_PLOT_WIDTH_PX = 540;
export const BENCH_PLOT_HEIGHT_PX = 340;

/** The methods and tables each bench figure is drawn from (lib/citations). */
const figureReferences: Record<BenchFigureKind, readonly CitationKey[]> = {
  "lens-plane": ["paczynski1986", "schneider1992", "virbhadra2000", "okabe2008"],
  deflection: ["darwin1959", "carlson1995", "keeton2005", "bozza2002", "okabe2008"],
  "light-curve": ["paczynski1986", "wittmao1994", "lee2009", "gould2008", "pejcha2009", "astronomyengine", "pickering2002", "okabe2008"],
  "astrometric-track": ["walker1995", "miyamoto1995", "hog1995", "astronomyengine", "pickering2002", "okabe2008"],
};

const titles: Record<BenchFigureKind, string> = {
  "lens-plane": "Lens plane: source, images and Einstein ring",
  deflection: "Deflection angle against impact parameter",
  "light-curve": "Microlensing light curve with the schedule's visits",
  "astrometric-track": "Astrometric centroid track",
};

/** A bench figure's tree and the table of what it draws (given the export's provenance). */
function benchFigure(kind: BenchFigureKind, results: BenchResults, schedule: ObservingSchedule | undefined): { tree: FigureTree; data: (provenance: Provenance) => DataTable } {
  // Exports are drawn in the publication style: white ground, dark ink.
  const size = { width: BENCH_PLOT_WIDTH_PX, height: BENCH_PLOT_HEIGHT_PX, palette: printPalette };
  const thetaERad = results.lensPlane.thetaERad;
  if (kind === "deflection") {
    const curves = deflectionCurves();
    return { tree: deflectionPlot({ curves, ...size }), data: (provenance) => deflectionData({ curves, provenance }) };
  }
  if (kind === "lens-plane") {
    const unit = naturalAngleUnit(thetaERad);
    return {
      tree: lensPlaneDiagram({ layout: results.lensPlane, thetaEInUnit: angleInUnit(thetaERad, unit), unitLabel: unitLabel(unit), ...size }),
      data: (provenance) => lensPlaneData({ layout: results.lensPlane, unit, provenance }),
    };
  }
  const event = results.event;
  if (event === undefined) throw new AppError("bad_request:figure", "The light curve and astrometric track are drawn for a compact (point) lens.", { lens: ["Choose the point lens for this figure."] });
  if (kind === "light-curve") {
    const curve = lightCurve(event, schedule);
    return { tree: lightCurvePlot({ lightCurve: curve, ...size }), data: (provenance) => lightCurveData({ lightCurve: curve, event, provenance }) };
  }
  // The same unit choice as the bench: the centroid shift is ~θ_E/3.
  const shiftUnit = naturalAngleUnit(thetaERad / 3);
  const track = astrometricTrack(event, schedule);
  return {
    tree: astrometricTrackPlot({ track, thetaEInUnit: angleInUnit(thetaERad, shiftUnit), unitLabel: unitLabel(shiftUnit), ...size }),
    data: (provenance) => astrometricTrackData({ track, thetaERad, unit: shiftUnit, event, provenance }),
  };
}

/**
 * A bench plot regenerated on the server from the bench's URL parameters: the same parsing and
 * computation as the page (`lib/bench`) and the same figure tree the page draws, written as SVG markup.
 * A sketch that does not parse is refused with the bench's own message for each field.
 */
export function benchPlotExport(kind: BenchFigureKind, sketch: Sketch, appOrigin: string, exportedAt?: Date): PlotExport {
  const parsed = parseSketch(sketch);
  if (!parsed.ok) {
    const fields = Object.fromEntries(Object.entries(parsed.fieldErrors).map(([field, message]) => [field, [message as string]]));
    throw new AppError("bad_request:figure", summaryOf(fields), fields);
  }
  const computed = computeResults(parsed.inputs);
  // Parsed sketches stay inside the accepted ranges, where the physics does not refuse; should one
  // still be refused, the physics' own wording (argument names) stays in the server log.
  if (!computed.ok) {
    console.error("bench figure not computed:", computed.message);
    throw new AppError("bad_request:figure", "This sketch cannot be computed.", { _: ["Check the lens, the distances and the source offset."] });
  }
  // The visits of the sketch's simulated schedule, as the page marks them (none without a cycle).
  const scheduleRequest = kind === "light-curve" || kind === "astrometric-track" ? benchScheduleRequest(parsed.inputs) : null;
  const schedule = scheduleRequest === null ? undefined : benchSchedule(scheduleRequest);
  const figure = benchFigure(kind, computed.results, schedule);
  const cosmology = sketch.geometry === "redshift" ? { H0: parsePlainNumber(sketch.h0), Om0: parsePlainNumber(sketch.om0) } : undefined;
  const provenance = buildProvenance({
    subject: `Lens bench figure: ${titles[kind]}`,
    reproduceUrl: new URL(`/bench?${sketchToQueryString(sketch)}`, appOrigin).toString(),
    inputs: { figure: kind, ...sketch },
    cosmology,
    references: figureReferences[kind],
    exportedAt,
  });
  return { markup: figureMarkup(figure.tree), title: titles[kind], fileStem: `bench-${kind}`, provenance, data: figure.data(provenance) };
}
