import { z } from "zod";
import { storedText } from "@/lib/workspace/stored-text";
import { lensModels } from "@/lib/workspace/target-schema";
import { targetStatuses } from "@/lib/workspace/status";
import { verdicts } from "@/lib/workspace/verdicts";

/** Columns the target table may be sorted by; anything else is refused, never passed to SQL. */
export const targetSortColumns = [
  "name",
  "raDeg",
  "decDeg",
  "priority",
  "status",
  "einsteinRadiusMas",
  "imageSeparationMas",
  "magnificationTotal",
  "timeDelayDays",
  "crossingTimeDays",
  "updatedAt",
] as const;
export type TargetSortColumn = (typeof targetSortColumns)[number];

export const maxTargetPageSize = 200;

/** The target list's query string: bounded paging, sort on known columns, filters on known fields. */
export const targetListQuerySchema = z.object({
  page: z.coerce.number().int().min(1).max(10_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(maxTargetPageSize, `At most ${maxTargetPageSize} rows per page.`).default(50),
  sort: z.enum(targetSortColumns).default("priority"),
  direction: z.enum(["asc", "desc"]).default("asc"),
  q: storedText().trim().max(100, "Search for at most 100 characters.").optional(),
  status: z.enum(targetStatuses).optional(),
  lensModel: z.enum(lensModels).optional(),
  tag: storedText().trim().max(32, "A tag is at most 32 characters.").optional(),
  resolutionVerdict: z.enum(verdicts).optional(),
});

export type TargetListQuery = z.infer<typeof targetListQuerySchema>;

/** Activity and other plain lists: a bounded page size and an id cursor. */
export const cursorQuerySchema = z.object({
  limit: z.coerce.number().int().min(1).max(100).default(30),
  before: z.coerce.number().int().positive().optional(),
});
