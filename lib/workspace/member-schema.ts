import { z } from "zod";
import { proposalRoles } from "@/lib/workspace/roles";

/** The length is checked before the address pattern, so the pattern never runs on a long text. */
export const emailSchema = z
  .string({ error: (issue) => (issue.input === undefined ? "The e-mail address is missing." : "The e-mail address must be text, like name@example.org.") })
  .trim()
  .max(254, "The e-mail address is at most 254 characters.")
  .toLowerCase()
  .pipe(z.email("The e-mail address should look like name@example.org."));

export const membershipSchema = z.object({
  userId: z.uuid("The member names nobody on this proposal."),
  email: emailSchema,
  role: z.enum(proposalRoles, { error: "The role is one of pi (principal investigator), coi (co-investigator) or viewer." }),
});

export const changeRoleSchema = membershipSchema.pick({ role: true });
export const createInvitationSchema = membershipSchema.omit({ userId: true });

/** Invitation links arrive as 43-character base64url strings (32 random bytes). */
export const tokenSchema = z
  .string({ error: "The link is missing its code; ask for a new one." })
  .regex(/^[A-Za-z0-9_-]{43}$/, "The link is malformed; ask for a new one.");

export const acceptInvitationSchema = z.object({ token: tokenSchema });
