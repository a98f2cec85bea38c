/**
 * The data behind the event-fit figure, from the view it draws (lib/figures/event-fit-view.ts): one
 * row per photometric point (its dataset, time, measured flux, magnitude on the reference dataset's
 * scale with its error, the model and the residual), then one per time step of the prediction's band.
 */
import type { Provenance } from "@/lib/exports/provenance";
import type { DataColumn, DataTable } from "@/lib/exports/tables/data-table";
import type { EventFitView } from "@/lib/figures/event-fit-view";
import { jdUtcColumn, numberCell, seriesColumn, utcIsoColumn, utcIsoOfJd } from "./columns";

const magnitudeColumn = (name: string, label: string, description: string): DataColumn => ({ name, label, unit: "mag", voUnit: "mag", ucd: "phot.mag", kind: "double", description });
const fluxColumn = (name: string, label: string, description: string): DataColumn => ({ name, label, unit: "", voUnit: "", ucd: "phot.flux", kind: "double", description });

export function eventFitData(input: { view: EventFitView; title: string; provenance: Provenance }): DataTable {
  const { view, provenance } = input;
  const ref = view.referenceDataset;
  const pointRows = view.datasets.flatMap((d) =>
    Array.from(d.tJdUtc, (t, k) => [
      "data",
      d.name,
      t,
      utcIsoOfJd(t),
      d.flux[k],
      d.fluxErr[k],
      numberCell(d.magnitude[k]),
      numberCell(d.magnitudeError[k]),
      numberCell(d.modelMagnitude[k]),
      numberCell(d.residualMag[k]),
      null,
      null,
    ]),
  );
  const prediction = view.prediction;
  const bandRows = prediction
    ? Array.from(prediction.tJdUtc, (t, k) => ["prediction", ref, t, utcIsoOfJd(t), null, null, null, null, numberCell(prediction.median[k]), null, numberCell(prediction.bright[k]), numberCell(prediction.faint[k])])
    : [];
  return {
    name: "event_fit",
    title: input.title,
    columns: [
      seriesColumn("data: a photometric point of the dataset named; prediction: a time step of the model's predicted band."),
      { name: "dataset", label: "Dataset", unit: "", voUnit: "", ucd: "meta.id", kind: "text", description: "The telescope or survey the point comes from; on prediction rows, the reference dataset whose scale the figure is drawn in." },
      jdUtcColumn,
      utcIsoColumn,
      fluxColumn("flux", "Flux", "The measured flux as fitted, on the scale where flux 1 is magnitude 22 in the dataset's own band."),
      fluxColumn("flux_error", "Flux error", "The flux's stated 1-sigma error, before the dataset's error factor."),
      magnitudeColumn("magnitude", "Magnitude", `The point carried through the fit to ${ref}'s scale: its magnification on ${ref}'s source and blend flux (common practice in microlensing plots).`),
      magnitudeColumn("magnitude_error", "Magnitude error", "The point's 1-sigma error on that scale, with the dataset's error factor applied."),
      magnitudeColumn("model_magnitude", "Model magnitude", "The best fit on the reference's scale at the row's time; on prediction rows, the median of the predicted band."),
      magnitudeColumn("residual", "Residual", "Magnitude less model magnitude (data minus model)."),
      magnitudeColumn("band_bright", "Band, bright end", "The predicted band's bright end (84th percentile of the flux) on the reference's scale."),
      magnitudeColumn("band_faint", "Band, faint end", "The predicted band's faint end (16th percentile of the flux) on the reference's scale."),
    ],
    rows: [...pointRows, ...bandRows],
    provenance,
  };
}
