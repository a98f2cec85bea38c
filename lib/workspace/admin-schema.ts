import { z } from "zod";
import { storedText } from "@/lib/workspace/stored-text";
import { siteRoles } from "@/lib/workspace/roles";

/** Route ids of the admin API: a malformed id names no account (404). */
export const accountParamsSchema = z.object({ userId: z.uuid() });

/** The accounts list: bounded pages, an optional name or e-mail fragment. */
export const accountListQuerySchema = z.object({
  q: storedText().trim().max(120, "Search for at most 120 characters.").optional(),
  page: z.coerce.number().int("The page is a whole number.").min(1, "Pages start at 1.").max(10_000).default(1),
  pageSize: z.coerce.number().int().min(1, "At least one account per page.").max(100, "At most 100 accounts per page.").default(50),
});

export const changeSiteRoleSchema = z.object({
  siteRole: z.enum(siteRoles, { error: "The site role is admin or member." }),
});
