"use client";

import Link from "next/link";
import { useState } from "react";
import {
  defaultUnits,
  importFieldKinds,
  importFieldLabels,
  importFields,
  isComputedColumn,
  requiredImportFields,
  unitChoicesFor,
  unmappedColumns,
  type ColumnMapping,
  type ImportField,
} from "@/lib/imports/columns";
import { refusedRowsCsv, refusedRowsFileName } from "@/lib/imports/refused-rows";
import { DEFAULT_MATCH_TOLERANCE_ARCSEC, defaultImportFill, matchToleranceSpec } from "@/lib/imports/request";
import { lensModelOf } from "@/lib/lensing/registry";
import { scienceCaseLabels } from "@/lib/lensing/science-cases";
import { formatEventPeak } from "@/lib/workspace/event-peak";
import { quantityEcho } from "@/lib/workspace/quantity-field";
import type { FieldErrors } from "@/lib/errors";
import type { ImportPreviewView, ImportResult, ImportRowView } from "@/lib/workspace/import-view";
import { apiFetch } from "@/components/shared/api-client";
import { FormError, buttonClass, quietButtonClass } from "@/components/shared/field";
import { formatSignificant } from "@/lib/numbers/significant";
import { useFormSubmit } from "@/components/shared/use-form-submit";
import { UploadDropzone, dropzoneAppearance, refusalOf } from "@/components/uploads/dropzone";
import { VirtualRows } from "@/components/uploads/virtual-rows";

const inputClass = "rounded-md border border-void-edge bg-void px-2 py-1 text-sm";
const actionLabels: Record<ImportRowView["action"], string> = { add: "Add", update: "Update", skip: "Skip", error: "Error" };
const actionClass: Record<ImportRowView["action"], string> = { add: "text-glint", update: "text-ember", skip: "text-dusk-dim", error: "text-alarm" };

/** Fields whose bare numbers are read in a unit the user can change. */
const hasUnit = (field: ImportField) => field === "ra" || defaultUnits[importFieldKinds[field]] !== undefined;

/**
 * The target-list import: upload a CSV or VOTable through the upload service's dropzone, check the
 * proposed column mapping (column and unit per field), see every row as it will be read, then commit.
 */
export function ImportWizard({ proposalId }: { proposalId: string }) {
  const [fileId, setFileId] = useState<string | null>(null);
  const [uploadError, setUploadError] = useState<string | null>(null);
  const [preview, setPreview] = useState<ImportPreviewView | null>(null);
  const [mapping, setMapping] = useState<ColumnMapping>({});
  const [noteColumn, setNoteColumn] = useState<number | null>(null);
  const [toleranceText, setToleranceText] = useState(String(DEFAULT_MATCH_TOLERANCE_ARCSEC));
  const [priorityText, setPriorityText] = useState(String(defaultImportFill.priority));
  const [offsetText, setOffsetText] = useState(String(defaultImportFill.sourceOffsetThetaE));
  const [result, setResult] = useState<ImportResult | null>(null);
  const [isLeavingOutRefused, setLeavingOutRefused] = useState(false);
  const previewing = useFormSubmit();
  const committing = useFormSubmit();
  const base = `/api/proposals/${proposalId}/imports`;

  const requestBody = (id: string, chosen: ColumnMapping | undefined) => ({
    fileId: id,
    mapping: chosen,
    // With no mapping chosen yet the server proposes the notes column too.
    ...(chosen === undefined ? {} : { noteColumn }),
    // Sent as typed ("0.5", "500 mas"): the server reads it with the one quantity parser.
    toleranceArcsec: toleranceText,
    // Sent as typed: the server reads them as the target form's fields are read, and names the one refused.
    fill: { priority: priorityText, sourceOffsetThetaE: offsetText },
  });

  function runPreview(id: string, chosen: ColumnMapping | undefined) {
    void previewing.run(async () => {
      const next = await apiFetch<ImportPreviewView>(`${base}/preview`, { method: "POST", body: requestBody(id, chosen) });
      setPreview(next);
      setMapping(next.mapping);
      setNoteColumn(next.noteColumn);
      setResult(null);
      setLeavingOutRefused(false);
    });
  }

  function setColumn(field: ImportField, columnText: string) {
    const next = { ...mapping };
    if (columnText === "") delete next[field];
    else next[field] = { column: Number(columnText), ...(hasUnit(field) ? { unit: mapping[field]?.unit ?? defaultUnits[importFieldKinds[field]] } : {}) };
    setMapping(next);
  }

  /** A unit chosen from the field's list: the rows are read again with it at once. */
  function setUnit(field: ImportField, unit: string) {
    const current = mapping[field];
    if (!current || !fileId) return;
    const next = { ...mapping, [field]: { column: current.column, ...(unit ? { unit } : {}) } };
    setMapping(next);
    runPreview(fileId, next);
  }

  function downloadRefusedRows(view: ImportPreviewView) {
    const refused = view.rows.flatMap((row) => (row.fileCells ? [{ rowNumber: row.rowNumber, cells: row.fileCells, errors: row.errors }] : []));
    const url = URL.createObjectURL(new Blob([refusedRowsCsv(view.columns, refused)], { type: "text/csv;charset=utf-8" }));
    const link = document.createElement("a");
    link.href = url;
    link.download = refusedRowsFileName(view.file.name);
    link.click();
    URL.revokeObjectURL(url);
  }

  return (
    <div className="space-y-8">
      <section aria-labelledby="upload-heading" className="space-y-3">
        <h2 id="upload-heading" className="text-xl font-semibold">
          1. Target list
        </h2>
        <p className="text-sm text-dusk-dim">A CSV (header row first; an ECSV&apos;s header gives each column&apos;s unit) or a VOTable with TABLEDATA, up to 5 MB and 10,000 rows.</p>
        <div data-testid="list-dropzone">
          <UploadDropzone
            endpoint="targetList"
            input={{ proposalId }}
            config={{ mode: "auto" }}
            appearance={dropzoneAppearance}
            content={{ label: "Drop a CSV or VOTable here, or choose a file", allowedContent: "CSV or VOTable, at most 5 MB" }}
            onUploadBegin={() => setUploadError(null)}
            onClientUploadComplete={(uploaded) => {
              const refusal = refusalOf(uploaded);
              if (refusal) return setUploadError(refusal);
              const outcome = uploaded[0].serverData;
              if (!outcome.ok) return;
              setFileId(outcome.fileId);
              setPreview(null);
              runPreview(outcome.fileId, undefined);
            }}
            onUploadError={(error) => setUploadError(error.message)}
          />
        </div>
        <FormError message={uploadError} />
        {/* A file with no proposal of columns (no name, RA or Dec found) has no mapping step to show the refusal in. */}
        {!preview && <PreviewRefusal message={previewing.message} fields={previewing.fields} />}
        {preview && (
          <p className="text-sm" data-testid="uploaded-list">
            {preview.file.name} · {preview.file.format === "csv" ? "CSV" : "VOTable"} · {preview.rows.length.toLocaleString("en-US")} rows
          </p>
        )}
      </section>

      {preview && fileId && (
        <form
          aria-label="Column mapping"
          className="space-y-4"
          onSubmit={(event) => {
            event.preventDefault();
            runPreview(fileId, mapping);
          }}
        >
          <h2 className="text-xl font-semibold">2. Columns</h2>
          <p className="text-sm text-dusk-dim">Proposed from the file&apos;s headers and units; change any field&apos;s column or the unit its bare numbers are read in.</p>
          <div className="grid gap-x-6 gap-y-2 md:grid-cols-2">
            {importFields.map((field) => {
              const assignment = mapping[field];
              return (
                <div key={field} className="flex flex-wrap items-center gap-2 text-sm">
                  <label className="flex items-center gap-2">
                    <span className="w-40">
                      {importFieldLabels[field]}
                      {requiredImportFields.includes(field) && " *"}
                    </span>
                    <select className={inputClass} value={assignment?.column ?? ""} onChange={(e) => setColumn(field, e.target.value)}>
                      <option value="">— not in the file —</option>
                      {preview.columns.map((column, index) => (
                        // A column this product computes (our own export's θ_E, case verdicts) is no input.
                        <option key={index} value={index} disabled={isComputedColumn(column)}>
                          {column.name}
                          {column.unit ? ` [${column.unit}]` : ""}
                          {isComputedColumn(column) ? " (computed, not imported)" : ""}
                        </option>
                      ))}
                    </select>
                  </label>
                  {assignment && hasUnit(field) && (
                    <label className="flex items-center gap-1">
                      <span className="text-dusk-dim">unit</span>
                      <select className={inputClass} aria-label={`${importFieldLabels[field]} unit`} value={assignment.unit ?? ""} disabled={previewing.isBusy} onChange={(e) => setUnit(field, e.target.value)}>
                        {unitChoicesFor(field, assignment.unit ?? (field === "ra" ? "" : undefined)).map((unit) => (
                          <option key={unit} value={unit}>
                            {unit === "" ? "as written (h:m:s or degrees)" : unit}
                          </option>
                        ))}
                      </select>
                    </label>
                  )}
                  {assignment?.isUnitAssumed && (
                    <span data-testid={`unit-assumed-${field}`} className="text-xs text-alarm">
                      assumed: the file gives no unit for this column; check it
                    </span>
                  )}
                </div>
              );
            })}
          </div>
          <label className="flex flex-wrap items-center gap-2 text-sm">
            <span className="w-40">First note of each new target</span>
            <select className={inputClass} value={noteColumn ?? ""} onChange={(e) => setNoteColumn(e.target.value === "" ? null : Number(e.target.value))}>
              <option value="">— none —</option>
              {preview.columns.map((column, index) => (
                <option key={index} value={index} disabled={isComputedColumn(column)}>
                  {column.name}
                </option>
              ))}
            </select>
          </label>
          <UnmappedColumns preview={preview} mapping={mapping} noteColumn={noteColumn} />
          <div className="flex flex-wrap gap-6 text-sm">
            <label className="flex items-center gap-2">
              Position tolerance for matching existing targets (″)
              <input className={`${inputClass} w-20`} inputMode="decimal" value={toleranceText} onChange={(e) => setToleranceText(e.target.value)} />
              <ToleranceEcho text={toleranceText} />
            </label>
            <label className="flex items-center gap-2">
              Priority where the file has none
              <input className={`${inputClass} w-14`} inputMode="numeric" value={priorityText} onChange={(e) => setPriorityText(e.target.value)} />
            </label>
            <label className="flex items-center gap-2">
              Source offset (θE) where the file has none
              <input className={`${inputClass} w-20`} inputMode="decimal" value={offsetText} onChange={(e) => setOffsetText(e.target.value)} />
            </label>
          </div>
          <PreviewRefusal message={previewing.message} fields={previewing.fields} />
          <button type="submit" className={quietButtonClass} disabled={previewing.isBusy}>
            Read the rows again
          </button>
        </form>
      )}

      {preview && fileId && (
        <section aria-labelledby="preview-heading" className="space-y-3">
          <h2 id="preview-heading" className="text-xl font-semibold">
            3. Rows
          </h2>
          <p className="text-sm" data-testid="import-counts">
            {preview.counts.added} to add · {preview.counts.updated} to update · {preview.counts.skipped} to skip · {preview.counts.invalid} with errors
          </p>
          <PreviewRows rows={preview.rows} />
          {result ? (
            <p className="text-sm" role="status" data-testid="import-result">
              Imported: {result.added} added, {result.updated} updated, {result.skipped} skipped
              {result.leftOut > 0 ? `; ${result.leftOut} refused rows left out` : ""}.{" "}
              <Link href={`/proposals/${proposalId}`}>Back to the proposal</Link>
            </p>
          ) : (
            <>
              {preview.counts.invalid > 0 && (
                <div className="space-y-2 text-sm" data-testid="refused-rows">
                  <p className="text-alarm">
                    {preview.counts.invalid.toLocaleString("en-US")} of {preview.rows.length.toLocaleString("en-US")} rows cannot be imported. Fix them in the file (or the mapping) and upload it again, or import the other rows without them.
                  </p>
                  <button type="button" className={quietButtonClass} onClick={() => downloadRefusedRows(preview)}>
                    Download the {preview.counts.invalid.toLocaleString("en-US")} refused rows with their reasons (CSV)
                  </button>
                  <label className="flex items-center gap-2">
                    <input type="checkbox" checked={isLeavingOutRefused} onChange={(e) => setLeavingOutRefused(e.target.checked)} />
                    Leave out the {preview.counts.invalid.toLocaleString("en-US")} refused rows and import the others
                  </label>
                </div>
              )}
              <FormError message={committing.message} />
              <button
                type="button"
                className={buttonClass}
                disabled={committing.isBusy || previewing.isBusy || (preview.counts.invalid > 0 && !isLeavingOutRefused)}
                onClick={() =>
                  void committing.run(async () => {
                    const leaveOut = preview.counts.invalid > 0 ? { leaveOutRefusedRows: preview.counts.invalid } : {};
                    const { import: done } = await apiFetch<{ import: ImportResult }>(base, { method: "POST", body: { ...requestBody(fileId, mapping), ...leaveOut } });
                    setResult(done);
                  })
                }
              >
                Import {(preview.counts.added + preview.counts.updated).toLocaleString("en-US")} targets
                {preview.counts.invalid > 0 ? ` without the ${preview.counts.invalid.toLocaleString("en-US")} refused rows` : ""}
              </button>
            </>
          )}
        </section>
      )}
    </div>
  );
}

const ROW_HEIGHT_PX = 44;

/** A refused preview in words: its message, and each field's problem the message does not already say. */
function PreviewRefusal({ message, fields }: { message: string | null; fields: FieldErrors }) {
  if (message === null) return null;
  const more = Object.values(fields)
    .flat()
    .filter((text) => !message.includes(text));
  return (
    <div role="alert" data-testid="preview-refusal" className="space-y-1 text-sm text-alarm">
      <p>{message}</p>
      {more.length > 0 && (
        <ul className="list-disc pl-5">
          {more.map((text) => (
            <li key={text}>{text}</li>
          ))}
        </ul>
      )}
    </div>
  );
}

/** The file's columns no field takes, by name, with what each could be. */
function UnmappedColumns({ preview, mapping, noteColumn }: { preview: ImportPreviewView; mapping: ColumnMapping; noteColumn: number | null }) {
  const unmapped = unmappedColumns(preview.columns, mapping, noteColumn);
  if (unmapped.length === 0) return null;
  return (
    <div className="text-sm" data-testid="unmapped-columns">
      <p className="text-dusk-dim">Columns of the file that fill no field:</p>
      <ul className="list-disc pl-5">
        {unmapped.map(({ column, name, reason }) => (
          <li key={column}>
            <span className="font-semibold">{name}</span> — {reason}
          </li>
        ))}
      </ul>
    </div>
  );
}

function valueText(row: ImportRowView): string {
  const v = row.values;
  if (!v) return "";
  const parts = [`RA ${formatSignificant(v.ra, 7)}°`, `Dec ${formatSignificant(v.dec, 7)}°`, lensModelOf(v.lensModel).shortLabel];
  if (v.lensMassSolar != null) parts.push(`${formatSignificant(v.lensMassSolar)} M☉`);
  if (v.velocityDispersionKmPerS != null) parts.push(`σ ${formatSignificant(v.velocityDispersionKmPerS)} km/s`);
  if (v.lensDistancePc != null) parts.push(`D_L ${formatSignificant(v.lensDistancePc)} pc`);
  if (v.sourceDistancePc != null) parts.push(`D_S ${formatSignificant(v.sourceDistancePc)} pc`);
  if (v.lensRedshift != null) parts.push(`z_L ${v.lensRedshift}`);
  if (v.sourceRedshift != null) parts.push(`z_S ${v.sourceRedshift}`);
  if (v.scienceCase != null) parts.push(scienceCaseLabels[v.scienceCase]);
  if (v.eventPeakJdUtc != null) parts.push(`t0 ${formatEventPeak(v.eventPeakJdUtc)}`);
  if (v.sourceRadiusSolar != null) parts.push(`R* ${formatSignificant(v.sourceRadiusSolar)} R☉`);
  if (v.sourceRadiusThetaE != null) parts.push(`ρ ${formatSignificant(v.sourceRadiusThetaE)}`);
  if (v.limbDarkeningU != null) parts.push(`LD ${v.limbDarkeningU}`);
  return parts.join(" · ");
}

/** Every row, virtualized so a 10,000-row file scrolls smoothly. */
function PreviewRows({ rows }: { rows: ImportRowView[] }) {
  return (
    <VirtualRows rows={rows} label="Rows as read" rowHeightPx={ROW_HEIGHT_PX} heightClass="h-96" keyOf={(row) => row.rowNumber} attributesOf={(row) => ({ "data-testid": "preview-row", "data-action": row.action })}>
      {(row) => (
        <>
          <span role="cell" className="w-12 shrink-0 tabular-nums text-dusk-dim">
            {row.rowNumber}
          </span>
          <span role="cell" className={`w-16 shrink-0 ${actionClass[row.action]}`}>
            {actionLabels[row.action]}
          </span>
          <span role="cell" className="w-40 shrink-0 truncate font-semibold">
            {row.cells.name}
          </span>
          <span role="cell" className="min-w-0 flex-1">
            {row.errors.length > 0 ? <span className="text-alarm">{row.errors.join(" ")}</span> : <span className="tabular-nums">{valueText(row)}</span>}
            <span className="ml-2 text-xs text-dusk-dim">{row.detail}</span>
          </span>
        </>
      )}
    </VirtualRows>
  );
}

/** The tolerance the server will use, beside its input as the user types ("= 0.5″"), or why it will refuse it. */
function ToleranceEcho({ text }: { text: string }) {
  const echo = quantityEcho(matchToleranceSpec, text);
  if (echo === null) return null;
  return (
    <span data-testid="echo-toleranceArcsec" aria-live="polite" className={`font-mono text-xs ${echo.ok ? "text-glint" : "text-alarm"}`}>
      {echo.ok ? echo.text : echo.message}
    </span>
  );
}
