import { z } from "zod";
import { sameSitePath } from "@/lib/auth/callback-path";
import { nameText } from "@/lib/workspace/stored-text";
import { emailSchema, tokenSchema } from "@/lib/workspace/member-schema";

export const passwordSchema = z
  .string()
  .min(10, "Use at least 10 characters.")
  .max(200, "Use at most 200 characters.");

export const accountSchema = z.object({
  email: emailSchema,
  name: nameText().trim().min(1, "Tell your team what to call you.").max(100, "A name is at most 100 characters."),
  password: passwordSchema,
});

/** Where to go after the e-mailed confirmation link: a path on this site only, never another origin. */
const callbackPathSchema = z
  .string()
  .max(500, "The return address is at most 500 characters.")
  .refine((path) => sameSitePath(path) !== null, "Give a path on this site, starting with a single /.");

export const signUpSchema = accountSchema.extend({ callbackUrl: callbackPathSchema.optional() });
/** Sign-in checks only the shape: a wrong length must cost as much as a wrong password. */
export const signInSchema = accountSchema.pick({ email: true }).extend({ password: z.string().min(1, "Enter your password.").max(200, "Use at most 200 characters.") });
export const emailOnlySchema = accountSchema.pick({ email: true });
export const resetPasswordSchema = accountSchema.pick({ password: true }).extend({ token: tokenSchema });
export const linkSignInSchema = z.object({ token: tokenSchema });
