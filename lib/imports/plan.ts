import { importFields, type ColumnMapping } from "@/lib/imports/columns";
import { TargetMatcher, type PositionedTarget } from "@/lib/imports/matching";
import type { ImportPreview, PreviewRow } from "@/lib/imports/rows";
import { lensHypothesisErrors, sourcePhotometryErrors, type CreateTargetInput, type TargetFields } from "@/lib/workspace/target-schema";

/** A proposal's target as the planner compares it: position, name and the importable fields. */
export type ExistingTarget = PositionedTarget & Omit<TargetFields, "name" | "ra" | "dec" | "status">;

/** The target fields an update from a file may change (ra/dec as ICRS degrees). */
export type TargetPatch = Partial<Omit<CreateTargetInput, "name">>;

/** What committing one row does. */
export type RowAction =
  | { kind: "add"; target: CreateTargetInput }
  | { kind: "update"; targetId: string; targetName: string; by: "name" | "position"; separationArcsec?: number; patch: TargetPatch }
  | { kind: "skip"; reason: string; targetName?: string }
  | { kind: "error" };

export interface PlannedRow extends PreviewRow {
  action: RowAction;
}

export interface ImportPlan {
  rows: PlannedRow[];
  counts: { added: number; updated: number; skipped: number; invalid: number };
}

type PatchField = Exclude<(typeof importFields)[number], "name">;

/**
 * The fields a matched row overwrites: those the file has a column for, and the lens model (which
 * follows from the row's mass or dispersion). Fields the file lacks keep the target's values, so a
 * re-import never clears what was typed in the app.
 */
function patchOf(target: CreateTargetInput, mapping: ColumnMapping): TargetPatch {
  const patch: Record<string, unknown> = { lensModel: target.lensModel };
  for (const field of importFields) {
    if (field === "name" || mapping[field] === undefined) continue;
    const value = target[field as PatchField];
    if (value !== undefined) patch[field] = value;
  }
  return patch as TargetPatch;
}

const existingValueOf = (existing: ExistingTarget, field: keyof TargetPatch): unknown =>
  field === "ra" ? existing.raDeg : field === "dec" ? existing.decDeg : existing[field];

function isUnchanged(existing: ExistingTarget, patch: TargetPatch): boolean {
  return (Object.keys(patch) as (keyof TargetPatch)[]).every((field) => {
    const before = existingValueOf(existing, field);
    const after = patch[field];
    if (Array.isArray(after)) return Array.isArray(before) && before.length === after.length && after.every((tag, i) => before[i] === tag);
    return (before ?? null) === (after ?? null);
  });
}

/** The target as it would be after the patch, for the cross-field checks of the lens hypothesis. */
export function mergedHypothesis(existing: ExistingTarget, patch: TargetPatch) {
  return { ...existing, ...patch };
}

/**
 * Decides, for every validated row, whether committing adds a target, updates the one it matches
 * (by name, else by position within `toleranceArcsec`), or skips it (unchanged, or a repeat of an
 * earlier row of the same file). A row whose update would leave its target's hypothesis incomplete
 * becomes an error row. Pure: the same file against the same targets always plans the same.
 */
export function planImport(preview: ImportPreview, mapping: ColumnMapping, existing: readonly ExistingTarget[], toleranceArcsec: number): ImportPlan {
  const byId = new Map(existing.map((target) => [target.id, target]));
  const matcher = new TargetMatcher(existing, toleranceArcsec);
  const fromFile = new Map<string, number>();
  const counts = { added: 0, updated: 0, skipped: 0, invalid: 0 };
  const rows = preview.rows.map((row): PlannedRow => {
    const target = row.target;
    if (target === undefined) {
      counts.invalid += 1;
      return { ...row, action: { kind: "error" } };
    }
    const candidate = { name: target.name, raDeg: target.ra, decDeg: target.dec };
    const match = matcher.match(candidate);
    if (match !== null && fromFile.has(match.targetId)) {
      counts.skipped += 1;
      return { ...row, action: { kind: "skip", reason: `repeats row ${fromFile.get(match.targetId)} of this file` } };
    }
    if (match === null) {
      const pendingId = `row-${row.rowNumber}`;
      fromFile.set(pendingId, row.rowNumber);
      matcher.add({ id: pendingId, ...candidate });
      counts.added += 1;
      return { ...row, action: { kind: "add", target } };
    }
    const current = byId.get(match.targetId)!;
    // A target matched once is not matched again by a later row: that row is a repeat.
    fromFile.set(match.targetId, row.rowNumber);
    const patch = patchOf(target, mapping);
    if (isUnchanged(current, patch)) {
      counts.skipped += 1;
      return { ...row, action: { kind: "skip", reason: "unchanged", targetName: current.name } };
    }
    const merged = mergedHypothesis(current, patch);
    const problems = Object.entries({ ...lensHypothesisErrors(merged), ...sourcePhotometryErrors(merged) });
    if (problems.length > 0) {
      counts.invalid += 1;
      const errors = problems.flatMap(([field, messages]) => messages.map((m) => `row ${row.rowNumber}: updating ${current.name}, ${field} — ${m}`));
      return { ...row, target: undefined, errors, action: { kind: "error" } };
    }
    counts.updated += 1;
    const separation = match.by === "position" ? { separationArcsec: match.separationArcsec } : {};
    return { ...row, action: { kind: "update", targetId: current.id, targetName: current.name, by: match.by, ...separation, patch } };
  });
  return { rows, counts };
}
