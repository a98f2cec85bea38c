import { z } from "zod";
import { storedText } from "@/lib/workspace/stored-text";
import { siteRoles } from "@/lib/workspace/roles";

/** Route ids of the admin API: a malformed id names no account (404). */
export const accountParamsSchema = z.object({ userId: z.uuid("The account names nothing here.") });

/** The accounts list: bounded pages, an optional name or e-mail fragment. */
export const accountListQuerySchema = z.object({
  q: storedText("The search").trim().max(120, "The search is at most 120 characters.").optional(),
  page: z.coerce.number({ error: "The page is a whole number from 1 to 10,000." }).int("The page is a whole number from 1 to 10,000.").min(1, "The page is a whole number from 1 to 10,000.").max(10_000, "The page is a whole number from 1 to 10,000.").default(1),
  pageSize: z.coerce.number({ error: "The page size is a whole number of accounts from 1 to 100." }).int("The page size is a whole number of accounts from 1 to 100.").min(1, "The page size is at least one account.").max(100, "The page size is at most 100 accounts.").default(50),
});

export const changeSiteRoleSchema = z.object({
  siteRole: z.enum(siteRoles, { error: "The site role is admin or member." }),
});
