/**
 * What the browser receives about a target's photometry: the files kept with their datasets, and
 * every dataset's points ready for the light-curve fit. Types only, shared by the data-access layer
 * (lib/server/event-photometry.ts), its routes and the target page's components.
 */
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

/** The SWR key (and GET address) of a target's photometry, shared by the upload, the file list and the fit. */
export function targetPhotometryUrl(proposalId: string, targetId: string): string {
  return `/api/proposals/${proposalId}/targets/${targetId}/photometry`;
}
