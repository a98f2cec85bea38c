import { z } from "zod";
import { storedText } from "@/lib/workspace/stored-text";
import { lensModels } from "@/lib/workspace/target-schema";
import { targetStatuses } from "@/lib/workspace/status";
import { verdicts } from "@/lib/lensing/feasibility-rules";
import { scienceCaseIds } from "@/lib/lensing/science-case-inputs";

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
  "timeRequestHours",
  "peakSignalToNoise",
  "caseVerdict",
  "updatedAt",
] as const;
export type TargetSortColumn = (typeof targetSortColumns)[number];

export const maxTargetPageSize = 200;

/** The target list's query string: bounded paging, sort on known columns, filters on known fields. */
export const targetListQuerySchema = z.object({
  page: z.coerce.number({ error: "The page must be a whole number from 1 to 10,000." }).int("The page must be a whole number from 1 to 10,000.").min(1, "The page must be a whole number from 1 to 10,000.").max(10_000, "The page must be a whole number from 1 to 10,000.").default(1),
  pageSize: z.coerce
    .number({ error: `The page size is a whole number of rows from 1 to ${maxTargetPageSize}.` })
    .int(`The page size is a whole number of rows from 1 to ${maxTargetPageSize}.`)
    .min(1, `The page size is a whole number of rows from 1 to ${maxTargetPageSize}.`)
    .max(maxTargetPageSize, `The page size is at most ${maxTargetPageSize} rows.`)
    .default(50),
  sort: z.enum(targetSortColumns, { error: "The sort column is not one of the table's columns." }).default("priority"),
  direction: z.enum(["asc", "desc"], { error: "The sort direction is asc or desc." }).default("asc"),
  q: storedText("The search").trim().max(100, "The search is at most 100 characters.").optional(),
  status: z.enum(targetStatuses, { error: `The status filter is one of ${targetStatuses.join(", ")}.` }).optional(),
  lensModel: z.enum(lensModels, { error: `The lens model filter is ${lensModels.join(" or ")}.` }).optional(),
  tag: storedText("The tag filter").trim().max(32, "The tag filter is at most 32 characters.").optional(),
  caseVerdict: z.enum(verdicts, { error: `The case verdict filter is one of ${verdicts.join(", ")}.` }).optional(),
  /** The case a target's answers are for (its `answeredCase`: the chosen case, else the inferred one). */
  answeredCase: z.enum(scienceCaseIds, { error: `The science case filter is one of ${scienceCaseIds.join(", ")}.` }).optional(),
});

export type TargetListQuery = z.infer<typeof targetListQuerySchema>;

/** Activity and other plain lists: a bounded page size and an id cursor. */
export const cursorQuerySchema = z.object({
  limit: z.coerce.number({ error: "The number of entries is a whole number from 1 to 100." }).int("The number of entries is a whole number from 1 to 100.").min(1, "The number of entries is a whole number from 1 to 100.").max(100, "The number of entries is a whole number from 1 to 100.").default(30),
  before: z.coerce.number({ error: "The starting entry is a positive whole number." }).int("The starting entry is a positive whole number.").positive("The starting entry is a positive whole number.").optional(),
});
