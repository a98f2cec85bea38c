import "server-only";
import { and, eq, gt, inArray, isNull, sql } from "drizzle-orm";
import { dbClient, type Database } from "@/db/client";
import { authTokens, users, type User } from "@/db/schema";
import { hashPassword, verifyPassword } from "@/lib/auth/password";
import { passwordWeakness } from "@/lib/auth/password-strength";
import { emailOnlySchema, linkSignInSchema, resetPasswordSchema, signInSchema, signUpSchema } from "@/lib/auth/schemas";
import { hashLinkToken, newLinkToken } from "@/lib/auth/tokens";
import { AppError } from "@/lib/errors";
import type { Actor } from "@/lib/server/actor";
import { parseOrThrow } from "@/lib/server/http";
import { appLink, linkMail, sendMailInBackground } from "@/lib/server/mailer";
import { consumeAttempt, forgiveAttempts, isWithinLimit, refundAttempt } from "@/lib/server/rate-limit";
import { endAllSessions } from "@/lib/server/sessions";

/**
 * Failed sign-ins allowed per account and per client address in each 15-minute window (a success is
 * not counted), and sign-up and link requests per client address in the same window.
 */
export const signInLimits = { perAccount: 8, perAddress: 40, windowSeconds: 15 * 60 } as const;
/**
 * Account e-mails (confirmations, links, notices of a sign-up) sent to one address per hour. A request
 * past it gets the same answer and sends nothing, so nobody can fill a mailbox through the app.
 */
export const mailLimits = { perRecipient: 5, windowSeconds: 60 * 60 } as const;
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

/** Counts one account e-mail to `email` and says whether it may still be sent this hour. */
const mayMail = (email: string) => isWithinLimit({ bucket: `mail:to:${email}`, limit: mailLimits.perRecipient, windowSeconds: mailLimits.windowSeconds });

/**
 * Starts an account with a password. The answer is the same whether or not the address has an account
 * (OWASP Authentication Cheat Sheet, "account enumeration"), and every branch hashes the password and
 * sends at most one mail in the background, so the timing does not tell them apart either.
 * - A new address gets an account without a password and a confirmation link that carries the
 *   password and name chosen here; only following that very link sets them.
 * - An address with an account is never changed (else anyone could choose the password its owner
 *   later confirms or signs in to). Its owner is told by mail: with a sign-in link when the account is
 *   confirmed, or with a link to choose their password when it is still waiting for confirmation.
 */
export async function signUp(input: unknown, clientAddress: string): Promise<void> {
  const { email, name, password, callbackUrl } = parseOrThrow(signUpSchema, input, "account");
  await consumeAttempt({ bucket: `sign-up:address:${clientAddress}`, limit: signInLimits.perAddress, windowSeconds: signInLimits.windowSeconds }, "sign-up");
  const weakness = passwordWeakness(password, { email, name });
  if (weakness !== null) throw new AppError("bad_request:account", `The password is too easy to guess: ${weakness}`, { password: [weakness] });
  const passwordHash = await hashPassword(password);
  const [created] = await dbClient()
    .db.insert(users)
    .values({ email, name, passwordHash: null, emailConfirmedAt: null })
    .onConflictDoNothing({ target: users.email })
    .returning();
  const next = callbackUrl ? `&callbackUrl=${encodeURIComponent(callbackUrl)}` : "";
  const owner = created ?? (await findUserByEmail(email))!;
  if (!(await mayMail(email))) return;
  if (created) {
    const token = await issueToken(created.id, "account_confirmation", { pendingPasswordHash: passwordHash, pendingName: name });
    sendMailInBackground(
      linkMail(email, "Confirm your Arcwright account", [`Hello ${name},`, `Follow this link within ${linkLifetimeMinutes.account_confirmation / 60} hours to finish creating your account; it signs you in once. If you did not ask for an account, ignore this message and nothing is created.`], {
        label: "Confirm and sign in",
        url: appLink(`/sign-in/link?token=${token}${next}`),
      }),
    );
    return;
  }
  if (owner.emailConfirmedAt === null) {
    // The name asked for here is shown in the mail and taken only if the owner follows its link.
    const token = await issueToken(owner.id, "password_reset", { pendingName: name });
    sendMailInBackground(
      linkMail(email, "Finish creating your Arcwright account", [`Hello ${name},`, `Someone, maybe you, asked to create an Arcwright account with this address, which is already waiting for its e-mailed confirmation; nothing was changed. To finish creating the account, follow this link within ${linkLifetimeMinutes.password_reset} minutes and choose your password there. If you did not ask, ignore this message.`], {
        label: "Choose your password",
        url: appLink(`/reset/${token}`),
      }),
    );
    return;
  }
  const token = await issueToken(owner.id, "sign_in_link");
  sendMailInBackground(
    linkMail(email, "You already have an Arcwright account", [`Hello ${owner.name},`, `Someone, maybe you, tried to create an account with this address, which already has one; nothing was changed. This link signs you in once, within ${linkLifetimeMinutes.sign_in_link} minutes. If you forgot your password, choose a new one from the sign-in page.`], {
      label: "Sign in to Arcwright",
      url: appLink(`/sign-in/link?token=${token}${next}`),
    }),
  );
}

/**
 * Password sign-in. The attempt is counted against the account and the client address before any
 * check, so parallel guesses cannot overrun a limit, and a success gives its count back: only failures
 * lock, and no number of good sign-ins by others locks anyone out. The same bcrypt work is done
 * whether or not the account exists, so neither timing nor answer reveals it. A sign-up not yet
 * confirmed answers like a wrong password.
 */
export async function authenticateWithPassword(input: unknown, clientAddress: string): Promise<Actor | null> {
  const { email, password } = parseOrThrow(signInSchema, input, "sign-in");
  const window = signInLimits.windowSeconds;
  const addressLimit = { bucket: `sign-in:address:${clientAddress}`, limit: signInLimits.perAddress, windowSeconds: window };
  const accountLimit = { bucket: `sign-in:account:${email}`, limit: signInLimits.perAccount, windowSeconds: window };
  await consumeAttempt(addressLimit, "sign-in");
  const accountFailures = await consumeAttempt(accountLimit, "sign-in");
  const user = await findUserByEmail(email);
  const matches = await verifyPassword(password, user?.passwordHash ?? null);
  if (user && matches && user.emailConfirmedAt !== null) {
    await refundAttempt(addressLimit);
    await forgiveAttempts(accountLimit.bucket);
    return actorOf(user);
  }
  // Exactly one failure reaches the limit in a window, so the owner hears of each lock once.
  if (user && user.emailConfirmedAt !== null && accountFailures === accountLimit.limit) sendLockNotice(user);
  return null;
}

/** Tells an account's owner that wrong passwords paused its password sign-in, and how to get in meanwhile. */
function sendLockNotice(user: User): void {
  sendMailInBackground(
    linkMail(user.email, "Signing in to your Arcwright account with its password is paused", [`Hello ${user.name},`, `Someone, maybe you, entered a wrong password for this account ${signInLimits.perAccount} times, so signing in with its password is paused for up to ${signInLimits.windowSeconds / 60} minutes; none of those attempts got in. You can still sign in at once with a link e-mailed from the sign-in page, or choose a new password there ("Forgot your password?"), which also ends the pause. If the attempts were not yours, choosing a new password is a good idea.`], {
      label: "Go to the sign-in page",
      url: appLink("/sign-in"),
    }),
  );
}

/** What a sign-up's own link carries, to be set on the account only when that link is followed. */
interface PendingSignUp {
  pendingPasswordHash?: string;
  pendingName?: string;
}

async function issueToken(userId: string, purpose: keyof typeof linkLifetimeMinutes, pending: PendingSignUp = {}): Promise<string> {
  const { token, tokenHash } = newLinkToken();
  await dbClient()
    .db.insert(authTokens)
    .values({ tokenHash, userId, purpose, ...pending, expiresAt: sql`now() + make_interval(mins => ${linkLifetimeMinutes[purpose]})` });
  return token;
}

type Tx = Pick<Database, "update" | "select">;

/**
 * Marks a token used and returns its account, in one statement so a link works exactly once (call it
 * in a transaction). Following any e-mailed link proves the address, so an account still waiting for
 * that is confirmed, with the password and name carried by this very link when it is the sign-up's
 * own and with no password otherwise (a reset sets one next; a sign-in link leaves "Forgot your
 * password?"). A password stored any other way is never taken: anyone can ask for a sign-up.
 */
async function consumeToken(tx: Tx, token: string, purposes: (keyof typeof linkLifetimeMinutes)[]): Promise<{ userId: string; email: string }> {
  const [row] = await tx
    .update(authTokens)
    .set({ usedAt: sql`now()` })
    .where(
      and(
        eq(authTokens.tokenHash, hashLinkToken(token)),
        inArray(authTokens.purpose, purposes),
        isNull(authTokens.usedAt),
        gt(authTokens.expiresAt, sql`now()`),
      ),
    )
    .returning({ userId: authTokens.userId, pendingPasswordHash: authTokens.pendingPasswordHash, pendingName: authTokens.pendingName });
  if (!row) {
    const message = "This link has expired or was already used; ask for a new one.";
    throw new AppError("bad_request:link", message, { token: [message] });
  }
  const [confirmed] = await tx
    .update(users)
    .set({ emailConfirmedAt: sql`now()`, passwordHash: row.pendingPasswordHash, ...(row.pendingName === null ? {} : { name: row.pendingName }) })
    .where(and(eq(users.id, row.userId), isNull(users.emailConfirmedAt)))
    .returning({ email: users.email });
  if (confirmed) {
    // Other confirmation links of the same address may carry passwords other people chose.
    await tx
      .update(authTokens)
      .set({ usedAt: sql`now()` })
      .where(and(eq(authTokens.userId, row.userId), eq(authTokens.purpose, "account_confirmation"), isNull(authTokens.usedAt)));
    return { userId: row.userId, email: confirmed.email };
  }
  const [owner] = await tx.select({ email: users.email }).from(users).where(eq(users.id, row.userId));
  return { userId: row.userId, email: owner.email };
}

/**
 * E-mails a reset or sign-in link when the account exists and its address has not had its hour's
 * share of mail. The answer is the same either way, the client address is rate-limited, and the mail
 * leaves in the background, so neither the answer nor its timing can be used to probe for accounts.
 */
async function mailLink(input: unknown, clientAddress: string, purpose: keyof typeof linkLifetimeMinutes): Promise<void> {
  const { email } = parseOrThrow(emailOnlySchema, input, "e-mail");
  const window = signInLimits.windowSeconds;
  await consumeAttempt({ bucket: `link:address:${clientAddress}`, limit: signInLimits.perAddress, windowSeconds: window }, "link");
  const user = await findUserByEmail(email);
  if (!user || !(await mayMail(email))) return;
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
  if (weakness !== null) throw new AppError("bad_request:password reset", `The password is too easy to guess: ${weakness}`, { password: [weakness] });
  const passwordHash = await hashPassword(password);
  const { email } = await dbClient().db.transaction(async (tx) => {
    const owner = await consumeToken(tx, token, ["password_reset"]);
    await tx.update(users).set({ passwordHash }).where(eq(users.id, owner.userId));
    // Whoever knew the old password may hold a session; none outlives the reset.
    await endAllSessions(owner.userId, tx);
    return owner;
  });
  // The new password works at once, even while wrong guesses had paused the old one.
  await forgiveAttempts(`sign-in:account:${email}`);
}

/** Signs in from an e-mailed link (spent on use). */
export async function authenticateWithLink(input: unknown): Promise<Actor | null> {
  const { token } = parseOrThrow(linkSignInSchema, input, "sign-in link");
  const { userId } = await dbClient().db.transaction((tx) => consumeToken(tx, token, ["sign_in_link", "account_confirmation"]));
  return findActor(userId);
}
