/**
 * The data behind the lens bench's figures, from the same series the plots draw (`lib/bench/plot-data`,
 * the lens-plane layout of `computeResults`): a table per figure with every drawn point at full
 * precision, so a reader can plot it again in their own tool.
 */
import type { LensPlaneLayout, MicrolensingEvent } from "@/lib/bench/compute-results";
import { angleInUnit, naturalAngleUnit, unitLabel } from "@/lib/bench/display-units";
import type { AstrometricTrack, DeflectionCurves, LightCurve } from "@/lib/bench/plot-data";
import type { Provenance } from "@/lib/exports/provenance";
import type { DataCell, DataColumn, DataTable } from "@/lib/exports/tables/data-table";
import { DAY_S } from "@/lib/physics";
import { magnifiedBlendMagnitude } from "@/lib/photometry/source-flux";
import { jdUtcColumn, numberCell, seriesColumn } from "./columns";

/** The angle units the bench's plots read in (`naturalAngleUnit`). */
export type PlotAngleUnit = ReturnType<typeof naturalAngleUnit>;

/** IVOA VOUnits 1.0 spelling of each plot angle unit. */
const angleVoUnits: Record<PlotAngleUnit, string> = { uas: "uarcsec", mas: "mas", arcsec: "arcsec", deg: "deg" };

function angleColumn(column: Omit<DataColumn, "unit" | "voUnit" | "kind">, unit: PlotAngleUnit): DataColumn {
  return { ...column, unit: unitLabel(unit), voUnit: angleVoUnits[unit], kind: "double" };
}

const ratioColumn = (column: Omit<DataColumn, "unit" | "voUnit" | "kind">): DataColumn => ({ ...column, unit: "", voUnit: "", kind: "double" });

/**
 * The lens-plane diagram: the lens at the origin, the Einstein ring's radius, the source's true
 * position and each image, along the lens–source line (the diagram's x axis; nothing lies off it),
 * in θ_E and in the diagram's unit `unit`, with each image's signed magnification (negative: inverted).
 */
export function lensPlaneData(input: { layout: LensPlaneLayout; unit: PlotAngleUnit; provenance: Provenance }): DataTable {
  const { layout, unit, provenance } = input;
  const thetaEInUnit = angleInUnit(layout.thetaERad, unit);
  const marks: [string, number, number | null][] = [
    ["lens", 0, null],
    ["Einstein radius", 1, null],
    ["source", layout.betaThetaE, null],
    ...layout.images.map((image, index): [string, number, number] => [`image ${index + 1}`, image.thetaThetaE, image.magnification]),
  ];
  return {
    name: "lens_plane",
    title: `Lens plane: lens, Einstein radius, source and images along the lens–source line; θ_E = ${layout.thetaERad} rad`,
    columns: [
      { name: "object", label: "Object", unit: "", voUnit: "", ucd: "meta.id", kind: "text", description: "What the row marks: the lens (origin), the Einstein ring's radius, the source's true position, or an image (numbered as the lens model lists them)." },
      ratioColumn({ name: "position_theta_e", label: "Position (θ_E)", ucd: "pos.angDistance;arith.ratio", description: "Signed angle from the lens along the lens-source line, in units of the Einstein radius theta_E (the source's side positive)." }),
      angleColumn({ name: "position", label: "Position", ucd: "pos.angDistance", description: "The same angle in the diagram's unit." }, unit),
      { name: "position_rad", label: "Position", unit: "rad", voUnit: "rad", ucd: "pos.angDistance", kind: "double", description: "The same angle in radians." },
      ratioColumn({ name: "magnification", label: "Magnification", ucd: "arith.factor", description: "Signed magnification of an image (negative: inverted parity); empty for the lens, the ring and the source." }),
    ],
    rows: marks.map(([object, thetaThetaE, magnification]) => [object, thetaThetaE, thetaThetaE * thetaEInUnit, thetaThetaE * layout.thetaERad, numberCell(magnification)]),
    provenance,
  };
}

/**
 * The deflection plot: α against b/M for every drawn impact parameter, exact and the three weak-field
 * orders, and the strong-deflection limit where it is drawn (near b_c; empty elsewhere). M = GM/c², so
 * the curves hold for any mass.
 */
export function deflectionData(input: { curves: DeflectionCurves; provenance: Provenance }): DataTable {
  const { curves, provenance } = input;
  const strongByB = new Map(curves.strongField.map((point) => [point.x, point.y]));
  const alphaColumn = (name: string, label: string, description: string): DataColumn => ({ name, label, unit: "rad", voUnit: "rad", ucd: "pos.angDistance", kind: "double", description });
  return {
    name: "deflection",
    title: `Deflection angle against impact parameter (Schwarzschild); critical impact parameter b_c = ${curves.criticalBOverM} M`,
    columns: [
      ratioColumn({ name: "b_over_m", label: "Impact parameter b / M", ucd: "pos.distance;arith.ratio", description: "Impact parameter b in units of M = GM/c^2." }),
      alphaColumn("alpha_exact", "Deflection α, exact", "Exact Schwarzschild deflection angle (Darwin 1959 elliptic-integral form)."),
      alphaColumn("alpha_weak_1", "Deflection α, weak field 1st order", "Weak-field series to first order: 4M/b."),
      alphaColumn("alpha_weak_2", "Deflection α, weak field 2nd order", "Weak-field series to second order: 4M/b + (15 pi/4)(M/b)^2 (Keeton & Petters 2005)."),
      alphaColumn("alpha_weak_3", "Deflection α, weak field 3rd order", "Weak-field series to third order: adds (128/3)(M/b)^3 (Keeton & Petters 2005)."),
      alphaColumn("alpha_strong", "Deflection α, strong-deflection limit", "Strong-deflection limit (Bozza 2002), drawn for b up to 3 b_c where it is positive; empty elsewhere."),
    ],
    rows: curves.exact.map((point, index) => [
      point.x,
      point.y,
      curves.weakField[1][index].y,
      curves.weakField[2][index].y,
      curves.weakField[3][index].y,
      numberCell(strongByB.get(point.x) ?? null),
    ]),
    provenance,
  };
}

type EventTiming = Pick<MicrolensingEvent, "campaignStartJdUtc" | "peakTimeS">;

const timeFromStartColumn: DataColumn = {
  name: "time_from_start",
  label: "Time from campaign start",
  unit: "d",
  voUnit: "d",
  ucd: "time.interval",
  kind: "double",
  description: "Days from the campaign's start (the figure's time axis).",
};
const timeFromPeakColumn: DataColumn = { name: "time_from_peak", label: "Time from peak t0", unit: "d", voUnit: "d", ucd: "time.interval", kind: "double", description: "Days from the event's peak t0 (t - t0)." };
const eventJdColumn: DataColumn = { ...jdUtcColumn, description: "Julian date, UTC; empty when the campaign has no date (no cycle start or peak date)." };

/** A time in days from the campaign start as the three time cells: JD UTC (null without a date), from the start, from the peak. */
function eventTimeCells(timeDays: number, event: EventTiming): DataCell[] {
  return [event.campaignStartJdUtc === null ? null : event.campaignStartJdUtc + timeDays, timeDays, timeDays - event.peakTimeS / DAY_S];
}

const VISIT_MEANING = "visit: a visit of the simulated observing schedule inside the campaign (without a schedule, an epoch every cadence interval from the start)";

/**
 * The light curve: the drawn magnification A(t) (`series` "model") and the magnification at each of the
 * campaign's epochs ("visit"), with the magnitude change of an unblended source, −2.5 log₁₀ A.
 */
export function lightCurveData(input: { lightCurve: LightCurve; event: EventTiming; provenance: Provenance }): DataTable {
  const { lightCurve, event, provenance } = input;
  const row = (series: string, point: { x: number; y: number }): DataCell[] => [
    series,
    ...eventTimeCells(point.x, event),
    numberCell(point.y),
    Number.isFinite(point.y) && point.y > 0 ? magnifiedBlendMagnitude(0, point.y, 1) : null,
  ];
  return {
    name: "light_curve",
    title: "Microlensing light curve (finite source where its size is set, images behind the lens left out) and its value at the schedule's visits",
    columns: [
      seriesColumn(`model: the sampled light curve; ${VISIT_MEANING}.`),
      eventJdColumn,
      timeFromStartColumn,
      timeFromPeakColumn,
      ratioColumn({ name: "magnification", label: "Magnification A", ucd: "arith.factor", description: "Total magnification of the source as an observer sees it; empty where it is unbounded (a point source on the lens)." }),
      { name: "delta_mag", label: "Magnitude change", unit: "mag", voUnit: "mag", ucd: "phot.mag;arith.diff", kind: "double", description: "Magnitude change of an unblended source, -2.5 log10 A (negative: brighter); empty where nothing is seen." },
    ],
    rows: [...lightCurve.curve.map((point) => row("model", point)), ...lightCurve.epochs.map((point) => row("visit", point))],
    provenance,
  };
}

/**
 * The astrometric track: the centroid shift of the images through the event, along the lens–source
 * motion and across it (the plot's axes; the bench has no direction on the sky), in θ_E and in the
 * plot's unit `unit`, for the drawn track ("track", t0 ± 6 t_E) and at the campaign's epochs ("visit").
 */
export function astrometricTrackData(input: { track: AstrometricTrack; thetaERad: number; unit: PlotAngleUnit; event: EventTiming; provenance: Provenance }): DataTable {
  const { track, thetaERad, unit, event, provenance } = input;
  const thetaEInUnit = angleInUnit(thetaERad, unit);
  const row = (series: string, point: AstrometricTrack["track"][number]): DataCell[] => [
    series,
    ...eventTimeCells(point.timeDays, event),
    point.x * thetaEInUnit,
    point.y * thetaEInUnit,
    point.x,
    point.y,
  ];
  return {
    name: "astrometric_track",
    title: `Astrometric centroid shift through the event, along and across the lens–source motion; θ_E = ${thetaERad} rad`,
    columns: [
      seriesColumn(`track: the sampled track from t0 - 6 t_E to t0 + 6 t_E; ${VISIT_MEANING}.`),
      eventJdColumn,
      timeFromStartColumn,
      timeFromPeakColumn,
      angleColumn({ name: "shift_along", label: "Centroid shift along the motion", ucd: "pos.cartesian.x", description: "Shift of the light centroid from the unlensed source, along the lens-source relative motion, in the plot's unit." }, unit),
      angleColumn({ name: "shift_across", label: "Centroid shift across the motion", ucd: "pos.cartesian.y", description: "Shift of the light centroid across the motion, towards the lens-source offset at the peak, in the plot's unit." }, unit),
      ratioColumn({ name: "shift_along_theta_e", label: "Centroid shift along the motion (θ_E)", ucd: "pos.cartesian.x;arith.ratio", description: "The shift along the motion in units of the Einstein radius theta_E." }),
      ratioColumn({ name: "shift_across_theta_e", label: "Centroid shift across the motion (θ_E)", ucd: "pos.cartesian.y;arith.ratio", description: "The shift across the motion in units of the Einstein radius theta_E." }),
    ],
    rows: [...track.track.map((point) => row("track", point)), ...track.epochs.map((point) => row("visit", point))],
    provenance,
  };
}
