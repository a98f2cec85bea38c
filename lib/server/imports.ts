import "server-only";
import { and, eq } from "drizzle-orm";
import { dbClient, type Database } from "@/db/client";
import { imports, proposals, targets, uploadedFiles, type UploadedFile } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { proposeColumnMapping, proposeNoteColumn, type ColumnMapping } from "@/lib/imports/columns";
import type { ImportTable } from "@/lib/imports/import-table";
import { MAX_IMPORT_BYTES } from "@/lib/imports/limits";
import { mergedHypothesis, planImport, type ExistingTarget, type ImportPlan, type PlannedRow } from "@/lib/imports/plan";
import { readImportFile } from "@/lib/imports/read-import-file";
import { importCommitSchema, importPreviewSchema } from "@/lib/imports/request";
import { checkColumnMapping, validateImportRows, type ImportFill } from "@/lib/imports/rows";
import { proposalParamsSchema } from "@/lib/workspace/ids";
import { authorize, parseIds } from "@/lib/server/access";
import { recordActivity } from "@/lib/server/activity";
import { insertFirstNotes } from "@/lib/server/notes";
import { requireActor, type Actor } from "@/lib/server/actor";
import { deriveMany, feasibilitySettingsOf } from "@/lib/server/derived-columns";
import { parseOrThrow } from "@/lib/server/http";
import { deleteRefusedUpload, fetchStoredBytes, refuseOversize } from "@/lib/server/uploads";
import { z } from "zod";
import type { ImportPreviewView, ImportResult } from "@/lib/workspace/import-view";
import type { UploadOutcome } from "@/lib/workspace/upload-view";

type Queryable = Pick<Database, "select">;

/** What a target-list upload's middleware hands to its completion step. */
export type TargetListUploadMetadata = {
  proposalId: string;
  userId: string;
};

const uploadInputSchema = z.object({ proposalId: z.uuid() });

/**
 * Runs in the upload route's middleware, before any URL is signed: validate the input, then the
 * session, then the actor's role (Co-I or PI) on the proposal, then the declared size.
 */
export async function authorizeTargetListUpload(input: unknown, actor: Actor | null, files: readonly { size: number }[]): Promise<TargetListUploadMetadata> {
  const { proposalId } = parseIds(uploadInputSchema, input, "proposal");
  const who = requireActor(actor);
  await authorize(dbClient().db, proposalId, who, "edit", "import");
  refuseOversize(files, MAX_IMPORT_BYTES, "payload_too_large:import", "a target list");
  return { proposalId, userId: who.userId };
}

/**
 * The completion step of a target-list upload: fetch the stored bytes, read them as CSV or VOTable
 * (which refuses binary, malformed, hostile, empty or header-only files), then record the file. A
 * refused file is deleted from the upload service and leaves no row behind.
 */
export async function recordTargetListUpload(metadata: TargetListUploadMetadata, file: { key: string; name: string }): Promise<UploadOutcome> {
  let table: ImportTable;
  let sizeBytes: number;
  try {
    const bytes = await fetchStoredBytes(file.key, MAX_IMPORT_BYTES);
    table = readImportFile(bytes);
    sizeBytes = bytes.length;
  } catch (error) {
    if (!(error instanceof AppError)) throw error;
    deleteRefusedUpload(file.key);
    return { ok: false, message: error.message };
  }
  const [row] = await dbClient()
    .db.insert(uploadedFiles)
    .values({
      key: file.key,
      name: file.name.slice(0, 255),
      sizeBytes,
      contentType: table.format === "csv" ? "text/csv" : "application/x-votable+xml",
      proposalId: metadata.proposalId,
      uploadedBy: metadata.userId,
      purpose: "target_list",
    })
    .returning({ id: uploadedFiles.id });
  return { ok: true, fileId: row.id };
}

async function loadTargetList(db: Queryable, proposalId: string, fileId: string): Promise<UploadedFile> {
  const [file] = await db
    .select()
    .from(uploadedFiles)
    .where(and(eq(uploadedFiles.id, fileId), eq(uploadedFiles.proposalId, proposalId), eq(uploadedFiles.purpose, "target_list")))
    .limit(1);
  if (!file) throw new AppError("not_found:file", "No such uploaded target list in this proposal.", { fileId: ["Upload the target list again."] });
  return file;
}

async function existingTargets(db: Queryable, proposalId: string): Promise<ExistingTarget[]> {
  const rows = await db.select().from(targets).where(eq(targets.proposalId, proposalId));
  return rows.map(({ id, name, raDeg, decDeg, lensModel, lensMassSolar, velocityDispersionKmPerS, lensDistancePc, sourceDistancePc, lensRedshift, sourceRedshift, sourceOffsetThetaE, properMotionMasPerYr, scienceCase, eventPeakJdUtc, sourceRadiusSolar, sourceRadiusThetaE, limbDarkeningU, sourceMagnitude, sourceBand, blendFraction, einsteinTimeDays, parallaxNorth, parallaxEast, orbitSemiMajorAxisAu, orbitSemiMajorAxisMas, orbitEccentricity, orbitPeriodDays, orbitPeriapsisJdUtc, orbitInclinationDeg, orbitNodeDeg, orbitPeriapsisArgumentDeg, priority, tags }) => ({
    id,
    name,
    raDeg,
    decDeg,
    lensModel,
    lensMassSolar,
    velocityDispersionKmPerS,
    lensDistancePc,
    sourceDistancePc,
    lensRedshift,
    sourceRedshift,
    sourceOffsetThetaE,
    properMotionMasPerYr,
    scienceCase,
    eventPeakJdUtc,
    sourceRadiusSolar,
    sourceRadiusThetaE,
    limbDarkeningU,
    sourceMagnitude,
    sourceBand,
    blendFraction,
    einsteinTimeDays,
    parallaxNorth,
    parallaxEast,
    orbitSemiMajorAxisAu,
    orbitSemiMajorAxisMas,
    orbitEccentricity,
    orbitPeriodDays,
    orbitPeriapsisJdUtc,
    orbitInclinationDeg,
    orbitNodeDeg,
    orbitPeriapsisArgumentDeg,
    priority,
    tags,
  }));
}

/** Role check (Co-I or PI), then the proposal's uploaded list read from the upload service. */
async function readUploadedList(proposalId: string, fileId: string, who: Actor) {
  const { db } = dbClient();
  await authorize(db, proposalId, who, "edit", "import");
  const file = await loadTargetList(db, proposalId, fileId);
  const table = readImportFile(await fetchStoredBytes(file.key, MAX_IMPORT_BYTES));
  return { db, file, table };
}

function detailOf(action: PlannedRow["action"]): string {
  switch (action.kind) {
    case "add":
      return "new target";
    case "update":
      return action.by === "name"
        ? `updates ${action.targetName} (same name)`
        : `updates ${action.targetName} (${action.separationArcsec?.toFixed(2)}″ away)`;
    case "skip":
      return action.targetName ? `${action.reason}: ${action.targetName}` : action.reason;
    case "error":
      return "cannot be imported";
  }
}

/** `checkColumnMapping`, its refusal naming each field as the request does ("mapping.ra"), since the mapping is one input of it. */
function checkRequestMapping(table: ImportTable, mapping: ColumnMapping): void {
  try {
    checkColumnMapping(table, mapping);
  } catch (error) {
    if (!(error instanceof AppError) || !error.fields) throw error;
    throw new AppError(error.code, error.message, Object.fromEntries(Object.entries(error.fields).map(([field, messages]) => [`mapping.${field}`, messages])));
  }
}

function readPlan(table: ImportTable, mapping: ColumnMapping, fill: ImportFill, noteColumn: number | null, existing: ExistingTarget[], toleranceArcsec: number): ImportPlan {
  checkRequestMapping(table, mapping);
  return planImport(validateImportRows(table, mapping, fill, noteColumn), mapping, existing, toleranceArcsec);
}

/** The notes column asked for; when the request names none, the proposed one (null: none). */
const noteColumnOf = (requested: number | null | undefined, table: ImportTable, mapping: ColumnMapping): number | null =>
  requested === undefined ? (proposeNoteColumn(table.columns, mapping) ?? null) : requested;

/**
 * Co-I or PI. Reads the uploaded file with the mapping given (or the proposed one) and shows what a
 * commit would do with every row, changing nothing.
 */
export async function previewImport(params: unknown, input: unknown, actor: Actor | null): Promise<ImportPreviewView> {
  const { proposalId } = parseIds(proposalParamsSchema, params, "proposal");
  const who = requireActor(actor);
  const request = parseOrThrow(importPreviewSchema, input, "import");
  const { db, file, table } = await readUploadedList(proposalId, request.fileId, who);
  const proposedMapping = proposeColumnMapping(table.columns);
  const mapping = request.mapping ?? proposedMapping;
  const noteColumn = noteColumnOf(request.noteColumn, table, mapping);
  const plan = readPlan(table, mapping, request.fill, noteColumn, await existingTargets(db, proposalId), request.toleranceArcsec);
  return {
    file: { id: file.id, name: file.name, sizeBytes: file.sizeBytes, format: table.format },
    columns: table.columns,
    proposedMapping,
    mapping,
    noteColumn,
    fill: request.fill,
    toleranceArcsec: request.toleranceArcsec,
    rows: plan.rows.map((row, index) => ({
      rowNumber: row.rowNumber,
      cells: row.cells,
      values: row.target ?? null,
      errors: row.errors,
      action: row.action.kind,
      detail: detailOf(row.action),
      ...(row.action.kind === "error" ? { fileCells: table.rows[index].cells } : {}),
    })),
    counts: plan.counts,
  };
}

/** Rows per INSERT: 10,000 targets × 25 columns would pass PostgreSQL's 65,535 parameters. */
const INSERT_CHUNK_ROWS = 500;

/**
 * Co-I or PI. Commits the import in one transaction: every row is added, updated or skipped, or —
 * when any row cannot be imported — nothing is written at all and the answer lists the row errors.
 * With `leaveOutRefusedRows` (the user's choice, stating the count the preview showed) the refused
 * rows are left out and every other row is committed, still in one transaction; a count that no
 * longer matches (the proposal's targets changed since the preview) refuses the commit whole.
 * The targets' derived columns are computed as for a target added by hand; the original file stays
 * attached to the import record; one activity entry tells the team.
 */
export async function commitImport(params: unknown, input: unknown, actor: Actor | null): Promise<ImportResult> {
  const { proposalId } = parseIds(proposalParamsSchema, params, "proposal");
  const who = requireActor(actor);
  const request = parseOrThrow(importCommitSchema, input, "import");
  // Read before the transaction opens, so no lock is held while the upload service answers.
  const { db, file, table } = await readUploadedList(proposalId, request.fileId, who);
  return db.transaction(async (tx) => {
    const access = await authorize(tx, proposalId, who, "edit", "import");
    // One import at a time per proposal: two commits of the same file must not both add its rows.
    await tx.select({ id: proposals.id }).from(proposals).where(eq(proposals.id, proposalId)).for("update");
    const existing = await existingTargets(tx, proposalId);
    const plan = readPlan(table, request.mapping, request.fill, noteColumnOf(request.noteColumn, table, request.mapping), existing, request.toleranceArcsec);
    const leftOut = plan.counts.invalid;
    if (leftOut > 0 && request.leaveOutRefusedRows === undefined) {
      const rowErrors = plan.rows.flatMap((row) => row.errors);
      const summary = `${leftOut} of ${plan.rows.length} rows cannot be imported, so nothing was imported; fix them, or choose to import the other rows without them.`;
      // The rows of the file under this mapping are at fault, not one field: "_", the request as a whole.
      throw new AppError("bad_request:import", `${summary} ${rowErrors.slice(0, 3).join(" ")}`, { _: [summary] }, { rowErrors: rowErrors.slice(0, 200) });
    }
    if (request.leaveOutRefusedRows !== undefined && request.leaveOutRefusedRows !== leftOut) {
      const rows = (n: number) => `${n.toLocaleString("en-US")} row${n === 1 ? "" : "s"}`;
      throw new AppError(
        "conflict:import",
        `The file now has ${rows(leftOut)} that cannot be imported, not ${rows(request.leaveOutRefusedRows)} as the preview showed (the proposal's targets changed since); nothing was imported. Read the rows again.`,
        { leaveOutRefusedRows: [`The preview is out of date: ${rows(leftOut)} would be left out now.`] },
      );
    }
    const settings = feasibilitySettingsOf(access.proposal);
    const byId = new Map(existing.map((target) => [target.id, target]));
    const addedRows = plan.rows.flatMap((row) => (row.action.kind === "add" ? [{ target: row.action.target, note: row.note }] : []));
    const added = addedRows.map((row) => row.target);
    const firstNotes: { targetId: string; body: string }[] = [];
    for (let start = 0; start < added.length; start += INSERT_CHUNK_ROWS) {
      const chunk = added.slice(start, start + INSERT_CHUNK_ROWS);
      const derived = deriveMany(chunk.map(({ ra, dec, ...target }) => ({ ...target, raDeg: ra, decDeg: dec })), settings);
      const values = chunk.map(({ ra, dec, ...target }, index) => ({
        ...target,
        raDeg: ra,
        decDeg: dec,
        ...derived[index],
        proposalId,
        createdBy: who.userId,
      }));
      const ids = await tx.insert(targets).values(values).returning({ id: targets.id });
      // PostgreSQL returns a multi-row INSERT's rows in the order of its VALUES.
      ids.forEach(({ id }, index) => {
        const body = addedRows[start + index].note;
        if (body !== undefined) firstNotes.push({ targetId: id, body });
      });
    }
    const updates = plan.rows.flatMap((row) => (row.action.kind === "update" ? [row.action] : []));
    const updatedDerived = deriveMany(
      updates.map(({ targetId, patch }) => {
        const { ra, dec, ...merged } = mergedHypothesis(byId.get(targetId)!, patch);
        return { ...merged, raDeg: ra ?? merged.raDeg, decDeg: dec ?? merged.decDeg };
      }),
      settings,
    );
    for (const [index, { targetId, patch }] of updates.entries()) {
      const { ra, dec, ...fields } = patch;
      await tx
        .update(targets)
        .set({
          ...fields,
          ...(ra !== undefined ? { raDeg: ra } : {}),
          ...(dec !== undefined ? { decDeg: dec } : {}),
          ...updatedDerived[index],
          updatedAt: new Date(),
        })
        .where(eq(targets.id, targetId));
    }
    await insertFirstNotes(tx, who.userId, firstNotes);
    const { added: addedCount, updated, skipped } = plan.counts;
    const [record] = await tx
      .insert(imports)
      .values({
        proposalId,
        fileId: file.id,
        format: table.format,
        mapping: request.mapping,
        fill: request.fill,
        toleranceArcsec: request.toleranceArcsec,
        addedCount,
        updatedCount: updated,
        skippedCount: skipped,
        importedBy: who.userId,
      })
      .returning({ id: imports.id });
    await tx.update(proposals).set({ updatedAt: new Date() }).where(eq(proposals.id, proposalId));
    const counted = (n: number) => n.toLocaleString("en-US");
    await recordActivity(tx, {
      proposalId,
      actorId: who.userId,
      action: "target.added",
      subject: `targets from ${file.name} (${counted(addedCount)} added, ${counted(updated)} updated, ${counted(skipped)} skipped${leftOut > 0 ? `, ${counted(leftOut)} refused rows left out` : ""})`,
    });
    return { importId: record.id, added: addedCount, updated, skipped, leftOut };
  });
}
