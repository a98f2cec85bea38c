import "server-only";
import { and, asc, eq, inArray } from "drizzle-orm";
import { z } from "zod";
import { dbClient, type Database } from "@/db/client";
import { eventPhotometry, targets, uploadedFiles, users, type UploadedFile } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { MAX_IMPORT_BYTES } from "@/lib/imports/limits";
import type { ImportTable } from "@/lib/imports/import-table";
import { lensModelLabels } from "@/lib/lensing/registry";
import type { PhotometryPoint } from "@/lib/lensing/fit-input";
import { proposePhotometryMapping, timeFormatLabel, type PhotometryMapping } from "@/lib/event-photometry/mapping";
import { mappingProblems, readEventPhotometry, readPhotometryFile, type EventPhotometry, type PhotometryDataset, type ReadPhotometryOptions } from "@/lib/event-photometry/read-event-photometry";
import { MAX_DATASET_NAME_CHARS, photometryCommitSchema, photometryPreviewSchema } from "@/lib/event-photometry/request";
import { uniqueDatasetNames } from "@/lib/event-photometry/dataset-names";
import type { PhotometryCommitResult, PhotometryFileView, PhotometryPreviewView, PhotometryRowView, TargetPhotometryView } from "@/lib/event-photometry/views";
import { targetParamsSchema } from "@/lib/workspace/ids";
import { authorize, parseIds } from "@/lib/server/access";
import { recordActivity } from "@/lib/server/activity";
import { requireActor, type Actor } from "@/lib/server/actor";
import { parseOrThrow } from "@/lib/server/http";
import type { UploadOutcome } from "@/lib/workspace/upload-view";
import { deleteStoredFiles, fetchStoredBytes, refuseOversize } from "@/lib/server/uploads";

type Queryable = Pick<Database, "select">;

/** What a photometry upload's middleware hands to its completion step. */
export type PhotometryUploadMetadata = {
  proposalId: string;
  targetId: string;
  userId: string;
};

const photometryParamsSchema = targetParamsSchema.extend({ photometryId: z.uuid("The photometry file names nothing here.") });

interface PhotometryTarget {
  id: string;
  name: string;
  raDeg: number;
  decDeg: number;
}

/** The target, in this proposal, and a point-lens one: photometry is fitted with the point-lens model only. */
async function loadPointTarget(db: Queryable, proposalId: string, targetId: string): Promise<PhotometryTarget> {
  const [target] = await db
    .select({ id: targets.id, name: targets.name, raDeg: targets.raDeg, decDeg: targets.decDeg, lensModel: targets.lensModel })
    .from(targets)
    .where(and(eq(targets.id, targetId), eq(targets.proposalId, proposalId)))
    .limit(1);
  if (!target) throw new AppError("not_found:target", "No such target in this proposal.");
  if (target.lensModel !== "point") {
    throw new AppError("bad_request:photometry", `Photometry is fitted with a point lens: ${target.name} has a ${lensModelLabels[target.lensModel].toLowerCase()} lens. Change its lens model to a point lens to add photometry.`);
  }
  return { id: target.id, name: target.name, raDeg: target.raDeg, decDeg: target.decDeg };
}

/**
 * Runs in the upload route's middleware, before any URL is signed: validate the input, then the
 * session, then the role (Co-I or PI), then that the target is a point-lens target of the proposal,
 * then the declared size (the target-list limit; checked again on the bytes).
 */
export async function authorizePhotometryUpload(input: unknown, actor: Actor | null, files: readonly { size: number }[]): Promise<PhotometryUploadMetadata> {
  const ids = parseIds(targetParamsSchema, input, "target");
  const who = requireActor(actor);
  const { db } = dbClient();
  await authorize(db, ids.proposalId, who, "edit", "photometry");
  await loadPointTarget(db, ids.proposalId, ids.targetId);
  refuseOversize(files, MAX_IMPORT_BYTES, "payload_too_large:photometry", "a photometry file");
  return { ...ids, userId: who.userId };
}

/**
 * The recording part of a photometry upload's completion step (`completeUpload` re-checks the
 * uploader's role first, and deletes the stored bytes when this throws): fetch the bytes, read them
 * as CSV, ECSV or VOTable (refusing binary, malformed, empty, oversized and over-long files), then
 * record the file. No photometry is kept until the user confirms the mapping.
 */
export async function recordPhotometryUpload(metadata: PhotometryUploadMetadata, file: { key: string; name: string }): Promise<UploadOutcome> {
  const bytes = await fetchStoredBytes(file.key, MAX_IMPORT_BYTES);
  const table = readPhotometryFile(bytes);
  const [row] = await dbClient()
    .db.insert(uploadedFiles)
    .values({
      key: file.key,
      name: file.name.slice(0, 255),
      sizeBytes: bytes.length,
      contentType: table.format === "csv" ? "text/csv" : "application/x-votable+xml",
      proposalId: metadata.proposalId,
      uploadedBy: metadata.userId,
      purpose: "event_photometry",
    })
    .returning({ id: uploadedFiles.id });
  return { ok: true, fileId: row.id };
}

/** An uploaded photometry file of the proposal that no target keeps yet. */
async function loadUploadedPhotometry(db: Queryable, proposalId: string, fileId: string): Promise<UploadedFile> {
  const [found] = await db
    .select({ file: uploadedFiles, keptAs: eventPhotometry.id })
    .from(uploadedFiles)
    .leftJoin(eventPhotometry, eq(eventPhotometry.fileId, uploadedFiles.id))
    .where(and(eq(uploadedFiles.id, fileId), eq(uploadedFiles.proposalId, proposalId), eq(uploadedFiles.purpose, "event_photometry")))
    .limit(1);
  if (!found) throw new AppError("not_found:file", "No such uploaded photometry file in this proposal.", { fileId: ["Upload the photometry file again."] });
  if (found.keptAs !== null) throw new AppError("conflict:photometry", "This photometry file is already kept; upload it again to read it anew.", { fileId: ["Upload the photometry file again."] });
  return found.file;
}

/** Role check (Co-I or PI), the point-lens target, then the uploaded file read from the upload service. */
async function readUploadedPhotometry(proposalId: string, targetId: string, fileId: string, who: Actor) {
  const { db } = dbClient();
  await authorize(db, proposalId, who, "edit", "photometry");
  const target = await loadPointTarget(db, proposalId, targetId);
  const file = await loadUploadedPhotometry(db, proposalId, fileId);
  const table = readPhotometryFile(await fetchStoredBytes(file.key, MAX_IMPORT_BYTES));
  return { db, target, file, table };
}

/** The dataset of a file without a dataset column: its name without the extension ("ogle-2031.csv" → "ogle-2031"). */
export function datasetNameOfFile(fileName: string): string {
  const dot = fileName.lastIndexOf(".");
  const stem = (dot > 0 ? fileName.slice(0, dot) : fileName).trim().slice(0, MAX_DATASET_NAME_CHARS).trim();
  return stem === "" ? "photometry" : stem;
}

const readOptions = (target: PhotometryTarget, datasetName: string): ReadPhotometryOptions => ({ direction: { raDeg: target.raDeg, decDeg: target.decDeg }, datasetName });

/** Each row of the file with its refusals; problems that name no column concern the file (or a dataset) and are listed apart. */
function rowViews(table: ImportTable, read: EventPhotometry | null): { rows: PhotometryRowView[]; fileProblems: string[] } {
  const errorsByRow = new Map<number, PhotometryRowView["errors"]>();
  const fileProblems: string[] = [];
  for (const problem of read?.problems ?? []) {
    if (problem.column === undefined) fileProblems.push(problem.message);
    for (const rowNumber of problem.rowNumbers) {
      const list = errorsByRow.get(rowNumber) ?? [];
      list.push({ ...(problem.column !== undefined ? { column: problem.column } : {}), message: problem.message });
      errorsByRow.set(rowNumber, list);
    }
  }
  const refused = new Set(read?.refusedRowNumbers ?? []);
  const rows = table.rows.map(({ rowNumber, cells }) => ({ rowNumber, cells, isKept: read !== null && !refused.has(rowNumber), errors: errorsByRow.get(rowNumber) ?? [] }));
  return { rows, fileProblems };
}

/**
 * Co-I or PI. Reads the uploaded file with the mapping given (or the proposed one) and shows every
 * row as it will be read, with each refusal naming its row and column; writes nothing. An HJD or BJD
 * is read for the target's RA and Dec.
 */
export async function previewPhotometry(params: unknown, input: unknown, actor: Actor | null): Promise<PhotometryPreviewView> {
  const ids = parseIds(targetParamsSchema, params, "target");
  const who = requireActor(actor);
  const request = parseOrThrow(photometryPreviewSchema, input, "photometry");
  const { target, file, table } = await readUploadedPhotometry(ids.proposalId, ids.targetId, request.fileId, who);
  const proposal = proposePhotometryMapping(table.columns, table.rows);
  const mapping: PhotometryMapping = request.mapping ?? proposal.mapping;
  const datasetName = request.datasetName ?? datasetNameOfFile(file.name);
  const options = readOptions(target, datasetName);
  const problems = mappingProblems(table, mapping, options);
  const read = problems.length === 0 ? readEventPhotometry(table, mapping, options) : null;
  return {
    file: { id: file.id, name: file.name, sizeBytes: file.sizeBytes, format: table.format },
    columns: table.columns,
    proposedMapping: proposal.mapping,
    notes: proposal.notes,
    mapping,
    datasetName,
    mappingProblems: problems,
    ...rowViews(table, read),
    datasets: read?.datasets ?? [],
    summary: read?.summary ?? null,
  };
}

/** "HJD − 2450000 (UTC)": the time column's kind, offset and scale in words. */
const timeFormatOf = (mapping: PhotometryMapping) => `${timeFormatLabel(mapping.timeKind!, mapping.timeOffsetDays ?? 0)} (${mapping.timeScale})`;

function selectKept(db: Queryable) {
  return db
    .select({ record: eventPhotometry, fileName: uploadedFiles.name, sizeBytes: uploadedFiles.sizeBytes, key: uploadedFiles.key, addedBy: users.name })
    .from(eventPhotometry)
    .innerJoin(uploadedFiles, eq(uploadedFiles.id, eventPhotometry.fileId))
    .leftJoin(users, eq(users.id, eventPhotometry.addedBy));
}

type KeptRow = Awaited<ReturnType<ReturnType<typeof selectKept>["where"]>>[number];

function fileViewOf(row: KeptRow): PhotometryFileView {
  const mapping = row.record.mapping as PhotometryMapping;
  return {
    id: row.record.id,
    fileName: row.fileName,
    sizeBytes: row.sizeBytes,
    mapping,
    timeFormat: timeFormatOf(mapping),
    datasets: row.record.datasets as PhotometryDataset[],
    pointCount: row.record.timesJdUtc.length,
    refusedRowCount: row.record.refusedRows.length,
    addedBy: row.addedBy,
    addedAt: row.record.createdAt.toISOString(),
  };
}

const counted = (n: number, word: string) => `${n.toLocaleString("en-US")} ${word}${n === 1 ? "" : "s"}`;

/**
 * Co-I or PI. Reads the file with the mapping the user confirmed and keeps its points on the target,
 * in one transaction with its activity entry; a refusal writes nothing. Refused when the mapping is
 * incomplete (the time scale is never guessed) or when no row can be read. A dataset whose name
 * another file of the target already uses is renamed with a suffix (" (2)"), and the answer says so.
 */
export async function commitPhotometry(params: unknown, input: unknown, actor: Actor | null): Promise<PhotometryCommitResult> {
  const ids = parseIds(targetParamsSchema, params, "target");
  const who = requireActor(actor);
  const request = parseOrThrow(photometryCommitSchema, input, "photometry");
  // Read before the transaction opens, so no lock is held while the upload service answers.
  const { db, target, file, table } = await readUploadedPhotometry(ids.proposalId, ids.targetId, request.fileId, who);
  const options = readOptions(target, request.datasetName ?? datasetNameOfFile(file.name));
  const mapping: PhotometryMapping = request.mapping;
  const problems = mappingProblems(table, mapping, options);
  if (problems.length > 0) throw new AppError("bad_request:photometry", problems.join(" "), { mapping: problems });
  const read = readEventPhotometry(table, mapping, options);
  if (read.points.length === 0) {
    const rowErrors = read.problems.map((problem) => problem.message);
    throw new AppError("bad_request:photometry", `No row of ${file.name} can be kept, so nothing was kept: ${read.summary}. ${rowErrors.slice(0, 3).join(" ")}`.trim(), { _: ["No row of the file can be read as a point with this column mapping."] }, { rowErrors: rowErrors.slice(0, 200) });
  }
  return db.transaction(async (tx) => {
    await authorize(tx, ids.proposalId, who, "edit", "photometry");
    // One photometry commit at a time per target, so two files cannot take the same dataset name.
    await tx.select({ id: targets.id }).from(targets).where(eq(targets.id, ids.targetId)).for("update");
    await loadPointTarget(tx, ids.proposalId, ids.targetId);
    await loadUploadedPhotometry(tx, ids.proposalId, file.id);
    const kept = await tx.select({ datasets: eventPhotometry.datasets }).from(eventPhotometry).where(eq(eventPhotometry.targetId, ids.targetId));
    const taken = kept.flatMap((row) => (row.datasets as PhotometryDataset[]).map((dataset) => dataset.name));
    const names = uniqueDatasetNames(read.datasets.map((dataset) => dataset.name), taken);
    const datasets = read.datasets.map((dataset, index) => ({ ...dataset, name: names[index] }));
    const indexOf = new Map(read.datasets.map((dataset, index) => [dataset.name, index]));
    const [record] = await tx
      .insert(eventPhotometry)
      .values({
        targetId: ids.targetId,
        fileId: file.id,
        mapping,
        datasets,
        timesJdUtc: read.points.map((point) => point.tDays),
        fluxes: read.points.map((point) => point.flux),
        fluxErrors: read.points.map((point) => point.fluxErr),
        datasetIndices: read.points.map((point) => indexOf.get(point.dataset)!),
        refusedRows: read.refusedRowNumbers,
        addedBy: who.userId,
      })
      .returning();
    await recordActivity(tx, {
      proposalId: ids.proposalId,
      actorId: who.userId,
      action: "target.updated",
      subject: `${target.name}: photometry from ${file.name} (${counted(read.points.length, "point")} in ${counted(datasets.length, "dataset")})`,
    });
    const renamed = read.datasets.flatMap((dataset, index) => (names[index] === dataset.name ? [] : [{ from: dataset.name, to: names[index] }]));
    const renaming = renamed.map(({ from, to }) => ` Dataset “${from}” is kept as “${to}”: another file of ${target.name} has a dataset of that name.`).join("");
    const [view] = await selectKept(tx).where(eq(eventPhotometry.id, record.id));
    return { file: fileViewOf(view), renamed, message: `Kept ${read.summary} from ${file.name}.${renaming}` };
  });
}

/**
 * Any member: the photometry files kept on a target, oldest first, and every point grouped by dataset
 * and sorted by time within each (the light-curve fit's input, tDays the geocentric JD in UTC).
 */
export async function getTargetPhotometry(params: unknown, actor: Actor | null): Promise<TargetPhotometryView> {
  const ids = parseIds(targetParamsSchema, params, "target");
  const { db } = dbClient();
  await authorize(db, ids.proposalId, requireActor(actor), "read", "photometry");
  const [target] = await db
    .select({ id: targets.id })
    .from(targets)
    .where(and(eq(targets.id, ids.targetId), eq(targets.proposalId, ids.proposalId)))
    .limit(1);
  if (!target) throw new AppError("not_found:target", "No such target in this proposal.");
  const rows = await selectKept(db).where(eq(eventPhotometry.targetId, ids.targetId)).orderBy(asc(eventPhotometry.createdAt), asc(eventPhotometry.id));
  const points: PhotometryPoint[] = [];
  for (const { record } of rows) {
    const datasets = record.datasets as PhotometryDataset[];
    datasets.forEach((dataset, datasetIndex) => {
      const start = points.length;
      record.datasetIndices.forEach((index, i) => {
        if (index === datasetIndex) points.push({ tDays: record.timesJdUtc[i], flux: record.fluxes[i], fluxErr: record.fluxErrors[i], dataset: dataset.name });
      });
      // Stored sorted; sorted again so the view's order never rests on how a row was written.
      const group = points.splice(start).sort((a, b) => a.tDays - b.tDays);
      points.push(...group);
    });
  }
  return { files: rows.map(fileViewOf), points };
}

/**
 * Co-I or PI. Removes a kept photometry file: its points and its file record in one transaction with
 * the activity entry, then the stored bytes through the upload service once that has committed.
 */
export async function deletePhotometryFile(params: unknown, actor: Actor | null): Promise<void> {
  const ids = parseIds(photometryParamsSchema, params, "photometry");
  const who = requireActor(actor);
  const key = await dbClient().db.transaction(async (tx) => {
    await authorize(tx, ids.proposalId, who, "edit", "photometry");
    const [row] = await tx
      .select({ fileId: uploadedFiles.id, key: uploadedFiles.key, fileName: uploadedFiles.name, targetName: targets.name })
      .from(eventPhotometry)
      .innerJoin(uploadedFiles, eq(uploadedFiles.id, eventPhotometry.fileId))
      .innerJoin(targets, eq(targets.id, eventPhotometry.targetId))
      .where(and(eq(eventPhotometry.id, ids.photometryId), eq(eventPhotometry.targetId, ids.targetId), eq(targets.proposalId, ids.proposalId)))
      .limit(1);
    if (!row) throw new AppError("not_found:photometry", "No such photometry file on this target.");
    // The points go with their file record (cascade).
    await tx.delete(uploadedFiles).where(eq(uploadedFiles.id, row.fileId));
    await recordActivity(tx, { proposalId: ids.proposalId, actorId: who.userId, action: "target.updated", subject: `${row.targetName}: photometry ${row.fileName} removed` });
    return row.key;
  });
  await deleteStoredFiles([key]);
}

/**
 * Inside the transaction that deletes a target: forgets the file records of its photometry (the
 * points go with them) and returns their keys, for `deleteStoredFiles` once that transaction has committed.
 */
export async function forgetTargetPhotometryFiles(tx: Pick<Database, "select" | "delete">, targetId: string): Promise<string[]> {
  const rows = await tx
    .select({ id: uploadedFiles.id, key: uploadedFiles.key })
    .from(eventPhotometry)
    .innerJoin(uploadedFiles, eq(uploadedFiles.id, eventPhotometry.fileId))
    .where(eq(eventPhotometry.targetId, targetId));
  if (rows.length > 0) await tx.delete(uploadedFiles).where(inArray(uploadedFiles.id, rows.map((row) => row.id)));
  return rows.map((row) => row.key);
}
