import { z } from "zod";
import { sameSitePath } from "@/lib/auth/callback-path";
import { nameText } from "@/lib/workspace/stored-text";
import { emailSchema, tokenSchema } from "@/lib/workspace/member-schema";

export const passwordSchema = z
  .string({ error: (issue) => (issue.input === undefined ? "The password is missing." : "The password must be text.") })
  .min(10, "The password needs at least 10 characters.")
  .max(200, "The password is at most 200 characters.");

export const accountSchema = z.object({
  email: emailSchema,
  name: nameText("Your name").trim().min(1, "Your name: tell your team what to call you.").max(100, "Your name is at most 100 characters."),
  password: passwordSchema,
});

/** Where to go after the e-mailed confirmation link: a path on this site only, never another origin. */
const callbackPathSchema = z
  .string({ error: "The return address must be a path on this site, e.g. /proposals." })
  .max(500, "The return address is at most 500 characters.")
  .refine((path) => sameSitePath(path) !== null, "The return address must be a path on this site, starting with a single /.");

export const signUpSchema = accountSchema.extend({ callbackUrl: callbackPathSchema.optional() });
/** Sign-in checks only the shape: a wrong length must cost as much as a wrong password. */
export const signInSchema = accountSchema.pick({ email: true }).extend({ password: z.string({ error: "The password is missing." }).min(1, "The password is empty; enter your password.").max(200, "The password is at most 200 characters.") });
export const emailOnlySchema = accountSchema.pick({ email: true });
export const resetPasswordSchema = accountSchema.pick({ password: true }).extend({ token: tokenSchema });
export const linkSignInSchema = z.object({ token: tokenSchema });
