"use client";

import { useState } from "react";
import useSWR from "swr";
import { timeKinds, timeOffsetsDays, type TimeKind } from "@/lib/event-photometry/event-time";
import type { BrightnessKind, PhotometryMapping } from "@/lib/event-photometry/mapping";
import { timeScales, type TimeScale } from "@/lib/event-photometry/time-scales";
import { targetPhotometryUrl, type PhotometryCommitResult, type PhotometryFileView, type PhotometryPreviewView, type PhotometryRowView, type TargetPhotometryView } from "@/lib/event-photometry/views";
import { apiFetch, swrFetcher } from "@/components/shared/api-client";
import { FormError, buttonClass, quietButtonClass } from "@/components/shared/field";
import { formatDateTime } from "@/components/shared/format";
import { useFormSubmit } from "@/components/shared/use-form-submit";
import { UploadDropzone, dropzoneAppearance, refusalOf } from "@/components/uploads/dropzone";
import { VirtualRows } from "@/components/uploads/virtual-rows";
import { ConfirmDelete } from "@/components/shared/confirm-delete";

const inputClass = "rounded-md border border-void-edge bg-void px-2 py-1 text-sm";
const plural = (n: number, word: string) => `${n.toLocaleString("en-US")} ${word}${n === 1 ? "" : "s"}`;

/**
 * A point-lens target's photometry: the files kept (with their datasets, time format and refused
 * rows), and for a Co-I or PI the way to add one (upload, confirm the columns, see every row as read,
 * keep) or delete one. Reads and refreshes the SWR key `targetPhotometryUrl`, which the fit shares.
 */
export function EventPhotometrySection({ proposalId, targetId, canEdit }: { proposalId: string; targetId: string; canEdit: boolean }) {
  const url = targetPhotometryUrl(proposalId, targetId);
  const { data, error, mutate } = useSWR<TargetPhotometryView>(url, swrFetcher);
  const [isAdding, setAdding] = useState(false);
  const [kept, setKept] = useState<string | null>(null);
  const files = data?.files ?? [];
  return (
    <section aria-labelledby="photometry-heading" className="space-y-4" data-testid="event-photometry">
      <h2 id="photometry-heading" className="text-xl font-semibold">
        Photometry
      </h2>
      {error && <p role="alert" className="text-alarm">{error.message}</p>}
      {data && files.length === 0 && <p className="text-sm text-dusk-dim">No photometry yet: a survey&apos;s or a site&apos;s light curve of this event can be added as CSV, ECSV or VOTable.</p>}
      {files.length > 0 && (
        <ul className="space-y-3" aria-label="Photometry files">
          {files.map((file) => (
            <PhotometryFile key={file.id} file={file} listUrl={url} canDelete={canEdit} />
          ))}
        </ul>
      )}
      {kept && (
        <p role="status" className="text-sm text-glint" data-testid="photometry-kept">
          {kept}
        </p>
      )}
      {canEdit &&
        (isAdding ? (
          <AddPhotometry
            proposalId={proposalId}
            targetId={targetId}
            onCancel={() => setAdding(false)}
            onKept={(result) => {
              setKept(result.message);
              setAdding(false);
              void mutate();
            }}
          />
        ) : (
          <button
            type="button"
            className={quietButtonClass}
            onClick={() => {
              setKept(null);
              setAdding(true);
            }}
          >
            Add photometry
          </button>
        ))}
    </section>
  );
}

/** One kept file: name, datasets with band and points, time format, refused rows, who and when; its delete asks first. */
function PhotometryFile({ file, listUrl, canDelete }: { file: PhotometryFileView; listUrl: string; canDelete: boolean }) {
  return (
    <li className="space-y-1 rounded-lg border border-void-edge p-3 text-sm" data-testid="photometry-file">
      <p>
        <span className="font-semibold">{file.fileName}</span> <span className="text-dusk-dim">· times {file.timeFormat} · {plural(file.pointCount, "point")}</span>
        {file.refusedRowCount > 0 && <span className="text-alarm"> · {plural(file.refusedRowCount, "row")} refused on reading</span>}
      </p>
      <ul className="list-disc pl-5" aria-label={`Datasets of ${file.fileName}`}>
        {file.datasets.map((dataset) => (
          <li key={dataset.name}>
            {dataset.name}
            {dataset.band ? ` (band ${dataset.band})` : ""}: {plural(dataset.pointCount, "point")}
            {dataset.wasSorted ? ", sorted by time on reading" : ""}
          </li>
        ))}
      </ul>
      <p className="text-xs text-dusk-dim">
        Added by {file.addedBy ?? "a former member"} on {formatDateTime(file.addedAt)}
      </p>
      {canDelete && (
        // The list (and the fit, which reads the same key) is read again once the file is gone.
        <ConfirmDelete
          label={`Delete ${file.fileName}`}
          consequence={`The file ${file.fileName} and its ${plural(file.pointCount, "point")} go; a fit already applied to the target stays until the target is fitted again.`}
          url={`${listUrl}/${file.id}`}
          staleKeyPrefix={listUrl}
        />
      )}
    </li>
  );
}

const timeKindWords: Record<TimeKind, string> = {
  JD: "JD (at the Earth's centre)",
  MJD: "MJD (JD − 2400000.5)",
  HJD: "HJD (at the Sun)",
  BJD: "BJD (at the barycentre)",
};

const offsetLabel = (offset: number) => (offset === 0 ? "none (full date)" : `− ${offset}`);

/** The mapping's column fields, in the order the form shows them. */
type ColumnKey = "timeColumn" | "valueColumn" | "errorColumn" | "bandColumn" | "datasetColumn";

/** Upload → columns → rows as read → keep. Every change of a choice reads the rows again at once. */
function AddPhotometry({ proposalId, targetId, onCancel, onKept }: { proposalId: string; targetId: string; onCancel: () => void; onKept: (result: PhotometryCommitResult) => void }) {
  const url = targetPhotometryUrl(proposalId, targetId);
  const [uploadError, setUploadError] = useState<string | null>(null);
  const [preview, setPreview] = useState<PhotometryPreviewView | null>(null);
  const [mapping, setMapping] = useState<PhotometryMapping>({});
  const [band, setBand] = useState("");
  const [datasetName, setDatasetName] = useState("");
  const previewing = useFormSubmit();
  const committing = useFormSubmit();

  function runPreview(fileId: string, chosen: PhotometryMapping | undefined, name: string | undefined) {
    void previewing.run(async () => {
      const next = await apiFetch<PhotometryPreviewView>(`${url}/preview`, { method: "POST", body: { fileId, mapping: chosen, ...(name ? { datasetName: name } : {}) } });
      setPreview(next);
      setMapping(next.mapping);
      setBand(next.mapping.band ?? "");
      setDatasetName(next.datasetName);
    });
  }

  /** The mapping with one choice changed ("" unsets it), read again at once. */
  function choose(change: Partial<Record<keyof PhotometryMapping, string | number | undefined>>) {
    if (!preview) return;
    const next: Record<string, unknown> = { ...mapping };
    for (const [key, value] of Object.entries(change)) {
      if (value === "" || value === undefined) delete next[key];
      else next[key] = value;
    }
    const chosen = next as PhotometryMapping;
    if (chosen.timeKind === "MJD") chosen.timeOffsetDays = 0;
    readAgain(preview.file.id, chosen);
  }

  /** Reads the rows with `chosen` and the band and dataset name as typed (used only where no column gives them). */
  function readAgain(fileId: string, chosen: PhotometryMapping) {
    const next = { ...chosen };
    if (next.bandColumn === undefined && band.trim() !== "") next.band = band.trim();
    else delete next.band;
    setMapping(next);
    runPreview(fileId, next, next.datasetColumn === undefined ? datasetName.trim() || undefined : undefined);
  }

  const chooseColumn = (key: ColumnKey, text: string) => choose({ [key]: text === "" ? undefined : Number(text) });
  const isReadable = preview !== null && preview.mappingProblems.length === 0 && preview.rows.some((row) => row.isKept);

  return (
    <div className="space-y-6 rounded-lg border border-void-edge p-4" data-testid="add-photometry">
      <div className="space-y-2">
        <h3 className="font-semibold">1. Photometry file</h3>
        <p className="text-sm text-dusk-dim">
          A CSV (header row first), an ECSV or a VOTable with TABLEDATA, up to 5 MB and 10,000 rows: a time column (JD, MJD, HJD or BJD), a magnitude or flux with its error, and
          optionally the band and the telescope or survey of each row.
        </p>
        <div data-testid="photometry-dropzone">
          <UploadDropzone
            endpoint="eventPhotometry"
            input={{ proposalId, targetId }}
            config={{ mode: "auto" }}
            appearance={dropzoneAppearance}
            content={{ label: "Drop a light curve here, or choose a file", allowedContent: "CSV, ECSV or VOTable, at most 5 MB" }}
            onUploadBegin={() => setUploadError(null)}
            onClientUploadComplete={(uploaded) => {
              const refusal = refusalOf(uploaded);
              if (refusal) return setUploadError(refusal);
              const outcome = uploaded[0].serverData;
              if (!outcome.ok) return;
              setPreview(null);
              runPreview(outcome.fileId, undefined, undefined);
            }}
            onUploadError={(error) => setUploadError(error.message)}
          />
        </div>
        <FormError message={uploadError} />
        {!preview && <FormError message={previewing.message} />}
        {preview && (
          <p className="text-sm" data-testid="uploaded-photometry">
            {preview.file.name} · {plural(preview.rows.length, "row")}
          </p>
        )}
      </div>

      {preview && (
        <form
          aria-label="Photometry columns"
          className="space-y-3"
          onSubmit={(event) => {
            event.preventDefault();
            readAgain(preview.file.id, mapping);
          }}
        >
          <h3 className="font-semibold">2. Columns</h3>
          {preview.notes.length > 0 && (
            <ul className="list-disc pl-5 text-sm text-dusk-dim" aria-label="What the proposal assumed">
              {preview.notes.map((note) => (
                <li key={note}>{note}</li>
              ))}
            </ul>
          )}
          <div className="grid gap-x-6 gap-y-2 text-sm md:grid-cols-2">
            <ColumnChoice label="Time column" value={mapping.timeColumn} preview={preview} onChange={(text) => chooseColumn("timeColumn", text)} />
            <label className="flex items-center gap-2">
              <span className="w-44">Time kind</span>
              <select className={inputClass} value={mapping.timeKind ?? ""} onChange={(e) => choose({ timeKind: e.target.value })}>
                <option value="">— choose —</option>
                {timeKinds.map((kind) => (
                  <option key={kind} value={kind}>
                    {timeKindWords[kind]}
                  </option>
                ))}
              </select>
            </label>
            <label className="flex items-center gap-2">
              <span className="w-44">Time offset (days)</span>
              <select className={inputClass} value={mapping.timeOffsetDays ?? ""} disabled={mapping.timeKind === "MJD"} onChange={(e) => choose({ timeOffsetDays: e.target.value === "" ? undefined : Number(e.target.value) })}>
                <option value="">— choose —</option>
                {timeOffsetsDays.map((offset) => (
                  <option key={offset} value={offset}>
                    {offsetLabel(offset)}
                  </option>
                ))}
              </select>
            </label>
            <label className="flex items-center gap-2">
              <span className="w-44">Time scale</span>
              <select className={inputClass} aria-required="true" value={mapping.timeScale ?? ""} aria-invalid={mapping.timeScale === undefined ? true : undefined} onChange={(e) => choose({ timeScale: e.target.value as TimeScale | "" })}>
                <option value="">— choose: the file does not say —</option>
                {timeScales.map((scale) => (
                  <option key={scale} value={scale}>
                    {scale}
                  </option>
                ))}
              </select>
            </label>
            <label className="flex items-center gap-2">
              <span className="w-44">Brightness</span>
              <select className={inputClass} value={mapping.brightnessKind ?? ""} onChange={(e) => choose({ brightnessKind: e.target.value as BrightnessKind | "" })}>
                <option value="">— choose —</option>
                <option value="magnitude">magnitudes</option>
                <option value="flux">fluxes</option>
              </select>
            </label>
            <ColumnChoice label="Magnitude or flux column" value={mapping.valueColumn} preview={preview} onChange={(text) => chooseColumn("valueColumn", text)} />
            <ColumnChoice label="Error column" value={mapping.errorColumn} preview={preview} onChange={(text) => chooseColumn("errorColumn", text)} />
            <ColumnChoice label="Band column" value={mapping.bandColumn} preview={preview} onChange={(text) => chooseColumn("bandColumn", text)} noneLabel="— none: one band for every row —" />
            {mapping.bandColumn === undefined && (
              <label className="flex items-center gap-2">
                <span className="w-44">Band of every row</span>
                <input className={`${inputClass} w-24`} value={band} onChange={(e) => setBand(e.target.value)} />
              </label>
            )}
            <ColumnChoice label="Dataset column" value={mapping.datasetColumn} preview={preview} onChange={(text) => chooseColumn("datasetColumn", text)} noneLabel="— none: one dataset —" />
            {mapping.datasetColumn === undefined && (
              <label className="flex items-center gap-2">
                <span className="w-44">Dataset name</span>
                <input className={`${inputClass} w-56`} value={datasetName} onChange={(e) => setDatasetName(e.target.value)} />
              </label>
            )}
          </div>
          {preview.mappingProblems.length > 0 && (
            <ul role="alert" className="list-disc pl-5 text-sm text-alarm" data-testid="mapping-problems">
              {preview.mappingProblems.map((problem) => (
                <li key={problem}>{problem}</li>
              ))}
            </ul>
          )}
          <FormError message={previewing.message} />
          <button type="submit" className={quietButtonClass} disabled={previewing.isBusy}>
            Read the rows again
          </button>
        </form>
      )}

      {preview && (
        <div className="space-y-3">
          <h3 className="font-semibold">3. Rows as read</h3>
          {preview.summary && (
            <p className="text-sm" data-testid="photometry-summary">
              {preview.summary}
            </p>
          )}
          {preview.fileProblems.length > 0 && (
            <ul className="list-disc pl-5 text-sm text-ember" aria-label="About the file">
              {preview.fileProblems.map((problem) => (
                <li key={problem}>{problem}</li>
              ))}
            </ul>
          )}
          <PreviewRows preview={preview} />
          <FormError message={committing.message} />
          <div className="flex gap-3">
            <button
              type="button"
              className={buttonClass}
              disabled={!isReadable || previewing.isBusy || committing.isBusy}
              onClick={() =>
                void committing.run(async () => {
                  const body = { fileId: preview.file.id, mapping: preview.mapping, ...(preview.mapping.datasetColumn === undefined ? { datasetName: preview.datasetName } : {}) };
                  onKept(await apiFetch<PhotometryCommitResult>(url, { method: "POST", body }));
                })
              }
            >
              Keep photometry
            </button>
            <button type="button" className={quietButtonClass} onClick={onCancel}>
              Cancel
            </button>
          </div>
        </div>
      )}
      {!preview && (
        <button type="button" className={quietButtonClass} onClick={onCancel}>
          Cancel
        </button>
      )}
    </div>
  );
}

/** A select of the file's columns, labelled; "" is none. */
function ColumnChoice({ label, value, preview, onChange, noneLabel = "— choose —" }: { label: string; value: number | undefined; preview: PhotometryPreviewView; onChange: (text: string) => void; noneLabel?: string }) {
  return (
    <label className="flex items-center gap-2">
      <span className="w-44">{label}</span>
      <select className={inputClass} value={value ?? ""} onChange={(e) => onChange(e.target.value)}>
        <option value="">{noneLabel}</option>
        {preview.columns.map((column, index) => (
          <option key={index} value={index}>
            {column.name}
            {column.unit ? ` [${column.unit}]` : ""}
          </option>
        ))}
      </select>
    </label>
  );
}

const ROW_HEIGHT_PX = 32;

/** The cells of the mapped columns, in the form's order. */
function mappedCells(row: PhotometryRowView, mapping: PhotometryMapping): string[] {
  const columns = [mapping.timeColumn, mapping.valueColumn, mapping.errorColumn, mapping.bandColumn, mapping.datasetColumn];
  return columns.filter((column): column is number => column !== undefined).map((column) => row.cells[column] ?? "");
}

/** Every row with its refusals, virtualised so a 10,000-row file scrolls smoothly. */
function PreviewRows({ preview }: { preview: PhotometryPreviewView }) {
  const isRead = preview.summary !== null;
  return (
    <VirtualRows rows={preview.rows} label="Photometry rows as read" rowHeightPx={ROW_HEIGHT_PX} heightClass="h-80" keyOf={(row) => row.rowNumber} attributesOf={(row) => ({ "data-testid": "photometry-row", "data-kept": row.isKept })}>
      {(row) => (
        <>
          <span role="cell" className="w-12 shrink-0 tabular-nums text-dusk-dim">
            {row.rowNumber}
          </span>
          <span role="cell" className={`w-16 shrink-0 ${row.isKept ? "text-glint" : isRead ? "text-alarm" : "text-dusk-dim"}`}>
            {!isRead ? "—" : row.isKept ? "Kept" : "Refused"}
          </span>
          <span role="cell" className="w-72 shrink-0 truncate font-mono text-xs">
            {mappedCells(row, preview.mapping).join(" · ")}
          </span>
          <span role="cell" className="min-w-0 flex-1 text-alarm">
            {row.errors.map((error) => error.message).join(" ")}
          </span>
        </>
      )}
    </VirtualRows>
  );
}
