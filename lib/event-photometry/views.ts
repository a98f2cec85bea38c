/**
 * What the browser receives about a target's photometry: the files kept with their datasets, and
 * every dataset's points ready for the light-curve fit. Types only, shared by the data-access layer
 * (lib/server/event-photometry.ts), its routes and the target page's components.
 */
import type { ImportColumn, ImportTable } from "@/lib/imports/import-table";
import type { PhotometryPoint } from "@/lib/lensing/fit-input";
import type { PhotometryMapping } from "./mapping";
import type { PhotometryDataset } from "./read-event-photometry";

/** One photometry file kept on a target. */
export interface PhotometryFileView {
  id: string;
  /** The file's name as uploaded, and its size in bytes. */
  fileName: string;
  sizeBytes: number;
  /** The mapping the file was read with, and its time column in words ("HJD − 2450000 (TDB)"). */
  mapping: PhotometryMapping;
  timeFormat: string;
  datasets: PhotometryDataset[];
  pointCount: number;
  refusedRowCount: number;
  /** Who added it (null once their account is gone) and when (ISO 8601, UTC). */
  addedBy: string | null;
  addedAt: string;
}

/** `GET /api/proposals/{proposalId}/targets/{targetId}/photometry`. */
export interface TargetPhotometryView {
  files: PhotometryFileView[];
  /**
   * Every file's points, grouped by dataset and sorted by time within each: `tDays` is the
   * geocentric Julian date in UTC (days), fluxes on REFERENCE_MAGNITUDE's scale. Dataset names are
   * unique across the target's files.
   */
  points: PhotometryPoint[];
}

/** One row of a photometry file as the preview shows it. */
export interface PhotometryRowView {
  /** 1-based, the first row after the header. */
  rowNumber: number;
  /** The file's cells as written. */
  cells: string[];
  /** Whether the row becomes a point (false for a refused row, or when the mapping cannot be read yet). */
  isKept: boolean;
  /** Each refusal of the row, with the column's header as the file writes it. */
  errors: { column?: string; message: string }[];
}

/** `POST .../photometry/preview`: how the file reads under the mapping given (or proposed), changing nothing. */
export interface PhotometryPreviewView {
  file: { id: string; name: string; sizeBytes: number; format: ImportTable["format"] };
  columns: ImportColumn[];
  /** The mapping proposed from the header and first rows, and what it assumed or could not tell. */
  proposedMapping: PhotometryMapping;
  notes: string[];
  /** The mapping the rows were read with (the one sent, else the proposed one). */
  mapping: PhotometryMapping;
  /** The dataset of every row when no column names one: as sent, else the file's name without its extension. */
  datasetName: string;
  /** What the user must still choose before the rows can be read (empty when they were read). */
  mappingProblems: string[];
  rows: PhotometryRowView[];
  /** Remarks that concern no single row (a dataset sorted, a dataset too small to fit). */
  fileProblems: string[];
  datasets: PhotometryDataset[];
  /** "812 points in 2 datasets (OGLE I: 640, Site A V: 172); 3 rows refused"; null when the rows were not read. */
  summary: string | null;
}

/** `POST .../photometry`: the file kept, and each dataset renamed because another kept file has its name. */
export interface PhotometryCommitResult {
  file: PhotometryFileView;
  renamed: { from: string; to: string }[];
  /** The answer in words: "Kept 312 points in 2 datasets (…) from ogle.csv. Dataset “OGLE I” is kept as “OGLE I (2)”: another file of Cinder Avocet has a dataset of that name." */
  message: string;
}

/** The SWR key (and GET address) of a target's photometry, shared by the upload, the file list and the fit. */
export function targetPhotometryUrl(proposalId: string, targetId: string): string {
  return `/api/proposals/${proposalId}/targets/${targetId}/photometry`;
}
