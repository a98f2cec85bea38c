import { z } from "zod";
import { proposalRoles } from "@/lib/workspace/roles";

/** The length is checked before the address pattern, so the pattern never runs on a long text. */
export const emailSchema = z
  .string()
  .trim()
  .max(254, "An e-mail address is at most 254 characters.")
  .toLowerCase()
  .pipe(z.email("Enter an e-mail address like name@example.org."));

export const membershipSchema = z.object({
  userId: z.uuid("Not a member id."),
  email: emailSchema,
  role: z.enum(proposalRoles, { error: "Role is one of pi, coi, viewer." }),
});

export const changeRoleSchema = membershipSchema.pick({ role: true });
export const createInvitationSchema = membershipSchema.omit({ userId: true });

/** Invitation links arrive as 43-character base64url strings (32 random bytes). */
export const tokenSchema = z.string().regex(/^[A-Za-z0-9_-]{43}$/, "This link is malformed; ask for a new one.");

export const acceptInvitationSchema = z.object({ token: tokenSchema });
