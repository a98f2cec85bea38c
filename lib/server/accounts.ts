import "server-only";
import { and, eq, gt, inArray, isNull, sql } from "drizzle-orm";
import { dbClient } from "@/db/client";
import { authTokens, users, type User } from "@/db/schema";
import { hashPassword, verifyPassword } from "@/lib/auth/password";
import { passwordWeakness } from "@/lib/auth/password-strength";
import { emailOnlySchema, linkSignInSchema, resetPasswordSchema, signInSchema, signUpSchema } from "@/lib/auth/schemas";
import { hashLinkToken, newLinkToken } from "@/lib/auth/tokens";
import { AppError } from "@/lib/errors";
import type { Actor } from "@/lib/server/actor";
import { parseOrThrow } from "@/lib/server/http";
import { appLink, linkMail, sendMailInBackground } from "@/lib/server/mailer";
import { consumeAttempt, forgiveAttempts } from "@/lib/server/rate-limit";

/** Sign-in attempts allowed per account and per client address in each 15-minute window. */
export const signInLimits = { perAccount: 8, perAddress: 40, windowSeconds: 15 * 60 } as const;
const linkLifetimeMinutes = { password_reset: 60, sign_in_link: 15, account_confirmation: 24 * 60 } as const;

export function actorOf(user: Pick<User, "id" | "email" | "name" | "siteRole">): Actor {
  return { userId: user.id, email: user.email, name: user.name, siteRole: user.siteRole };
}

async function findUserByEmail(email: string): Promise<User | undefined> {
  const [user] = await dbClient().db.select().from(users).where(eq(users.email, email)).limit(1);
  return user;
}

export async function findActor(userId: string): Promise<Actor | null> {
  const [user] = await dbClient().db.select().from(users).where(eq(users.id, userId)).limit(1);
  return user ? actorOf(user) : null;
}

/**
 * Starts an account with a password. The answer is the same whether or not the address has an account
 * (OWASP Authentication Cheat Sheet, "account enumeration"): a new address gets a confirmation link
 * and cannot sign in with its password until that link is followed; an address with an account gets a
 * message saying so, with a one-time sign-in link. Both branches hash the password and send one mail in
 * the background, so the timing does not tell them apart either.
 */
export async function signUp(input: unknown, clientAddress: string): Promise<void> {
  const { email, name, password, callbackUrl } = parseOrThrow(signUpSchema, input, "account");
  await consumeAttempt({ bucket: `sign-up:address:${clientAddress}`, limit: signInLimits.perAddress, windowSeconds: signInLimits.windowSeconds }, "sign-up");
  const weakness = passwordWeakness(password, { email, name });
  if (weakness !== null) throw new AppError("bad_request:account", "Invalid account: check password.", { password: [weakness] });
  const passwordHash = await hashPassword(password);
  // A sign-up that was never confirmed is replaced by the newer one (the address owner trying again).
  const [pending] = await dbClient()
    .db.insert(users)
    .values({ email, name, passwordHash, emailConfirmedAt: null })
    .onConflictDoUpdate({ target: users.email, set: { name, passwordHash }, setWhere: isNull(users.emailConfirmedAt) })
    .returning();
  const next = callbackUrl ? `&callbackUrl=${encodeURIComponent(callbackUrl)}` : "";
  if (pending) {
    const token = await issueToken(pending.id, "account_confirmation");
    sendMailInBackground(
      linkMail(email, "Confirm your Arcwright account", [`Hello ${name},`, `Follow this link within ${linkLifetimeMinutes.account_confirmation / 60} hours to finish creating your account; it signs you in once. If you did not ask for an account, ignore this message and nothing is created.`], {
        label: "Confirm and sign in",
        url: appLink(`/sign-in/link?token=${token}${next}`),
      }),
    );
    return;
  }
  const existing = (await findUserByEmail(email))!;
  const token = await issueToken(existing.id, "sign_in_link");
  sendMailInBackground(
    linkMail(email, "You already have an Arcwright account", [`Hello ${existing.name},`, `Someone, maybe you, tried to create an account with this address, which already has one; nothing was changed. This link signs you in once, within ${linkLifetimeMinutes.sign_in_link} minutes. If you forgot your password, choose a new one from the sign-in page.`], {
      label: "Sign in to Arcwright",
      url: appLink(`/sign-in/link?token=${token}${next}`),
    }),
  );
}

/**
 * Password sign-in. Rate-limited per account and per address before any check, and the same bcrypt
 * work is done whether or not the account exists, so neither timing nor answer reveals it. A sign-up
 * not yet confirmed answers like a wrong password.
 */
export async function authenticateWithPassword(input: unknown, clientAddress: string): Promise<Actor | null> {
  const { email, password } = parseOrThrow(signInSchema, input, "sign-in");
  const window = signInLimits.windowSeconds;
  await consumeAttempt({ bucket: `sign-in:address:${clientAddress}`, limit: signInLimits.perAddress, windowSeconds: window }, "sign-in");
  const accountBucket = `sign-in:account:${email}`;
  await consumeAttempt({ bucket: accountBucket, limit: signInLimits.perAccount, windowSeconds: window }, "sign-in");
  const user = await findUserByEmail(email);
  const matches = await verifyPassword(password, user?.passwordHash ?? null);
  if (!user || !matches || user.emailConfirmedAt === null) return null;
  await forgiveAttempts(accountBucket);
  return actorOf(user);
}

async function issueToken(userId: string, purpose: keyof typeof linkLifetimeMinutes): Promise<string> {
  const { token, tokenHash } = newLinkToken();
  await dbClient()
    .db.insert(authTokens)
    .values({ tokenHash, userId, purpose, expiresAt: sql`now() + make_interval(mins => ${linkLifetimeMinutes[purpose]})` });
  return token;
}

/**
 * Marks a token used and returns its user, in one statement so a link works exactly once. Following
 * any e-mailed link proves the address, so it also confirms an account that was not confirmed yet.
 */
async function consumeToken(token: string, purposes: (keyof typeof linkLifetimeMinutes)[]) {
  const [row] = await dbClient()
    .db.update(authTokens)
    .set({ usedAt: sql`now()` })
    .where(
      and(
        eq(authTokens.tokenHash, hashLinkToken(token)),
        inArray(authTokens.purpose, purposes),
        isNull(authTokens.usedAt),
        gt(authTokens.expiresAt, sql`now()`),
      ),
    )
    .returning({ userId: authTokens.userId });
  if (!row) {
    const message = "This link has expired or was already used; ask for a new one.";
    throw new AppError("bad_request:link", message, { token: [message] });
  }
  await dbClient()
    .db.update(users)
    .set({ emailConfirmedAt: sql`now()` })
    .where(and(eq(users.id, row.userId), isNull(users.emailConfirmedAt)));
  return row.userId;
}

/**
 * E-mails a reset or sign-in link when the account exists. The answer is the same either way, the
 * address is rate-limited like a sign-in, and the mail leaves in the background, so neither the answer
 * nor its timing can be used to probe for accounts.
 */
async function mailLink(input: unknown, clientAddress: string, purpose: keyof typeof linkLifetimeMinutes): Promise<void> {
  const { email } = parseOrThrow(emailOnlySchema, input, "e-mail");
  const window = signInLimits.windowSeconds;
  await consumeAttempt({ bucket: `link:address:${clientAddress}`, limit: signInLimits.perAddress, windowSeconds: window }, "link");
  await consumeAttempt({ bucket: `link:account:${email}`, limit: 5, windowSeconds: window }, "link");
  const user = await findUserByEmail(email);
  if (!user) return;
  const token = await issueToken(user.id, purpose);
  const mail =
    purpose === "password_reset"
      ? linkMail(email, "Reset your Arcwright password", [`Hello ${user.name},`, `Someone asked to reset the password of this account. The link works once, within ${linkLifetimeMinutes.password_reset} minutes. If it was not you, ignore this message.`], { label: "Choose a new password", url: appLink(`/reset/${token}`) })
      : linkMail(email, "Your Arcwright sign-in link", [`Hello ${user.name},`, `This link signs you in once, within ${linkLifetimeMinutes.sign_in_link} minutes.`], { label: "Sign in to Arcwright", url: appLink(`/sign-in/link?token=${token}`) });
  sendMailInBackground(mail);
}

export const requestPasswordReset = (input: unknown, clientAddress: string) => mailLink(input, clientAddress, "password_reset");
export const requestSignInLink = (input: unknown, clientAddress: string) => mailLink(input, clientAddress, "sign_in_link");

/** The account a link belongs to, without spending it (to judge a new password against its name). */
async function findTokenOwner(token: string): Promise<{ email: string; name: string } | undefined> {
  const [owner] = await dbClient()
    .db.select({ email: users.email, name: users.name })
    .from(authTokens)
    .innerJoin(users, eq(users.id, authTokens.userId))
    .where(eq(authTokens.tokenHash, hashLinkToken(token)))
    .limit(1);
  return owner;
}

/** Sets a new password from a reset link and spends the link. */
export async function resetPassword(input: unknown): Promise<void> {
  const { token, password } = parseOrThrow(resetPasswordSchema, input, "password reset");
  const weakness = passwordWeakness(password, (await findTokenOwner(token)) ?? {});
  if (weakness !== null) throw new AppError("bad_request:password reset", "Invalid password reset: check password.", { password: [weakness] });
  const passwordHash = await hashPassword(password);
  const userId = await consumeToken(token, ["password_reset"]);
  await dbClient().db.update(users).set({ passwordHash }).where(eq(users.id, userId));
}

/** Signs in from an e-mailed link (spent on use). */
export async function authenticateWithLink(input: unknown): Promise<Actor | null> {
  const { token } = parseOrThrow(linkSignInSchema, input, "sign-in link");
  const userId = await consumeToken(token, ["sign_in_link", "account_confirmation"]);
  return findActor(userId);
}
