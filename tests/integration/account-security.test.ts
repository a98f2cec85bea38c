import { randomUUID } from "node:crypto";
import { encode } from "next-auth/jwt";
import type { CredentialsConfig } from "next-auth/providers/credentials";
import { describe, expect, it } from "vitest";
import { signInErrorMessages } from "@/lib/auth/sign-in-errors";
import { socketAddressHeader } from "@/lib/security/client-address";
import { accountRoutes, sessionRoutes } from "@/lib/server/api/account-routes";
import { proposalCollectionRoutes } from "@/lib/server/api/proposal-routes";
import {
  authenticateWithLink,
  authenticateWithPassword,
  mailLimits,
  requestPasswordReset,
  requestSignInLink,
  resetPassword,
  signInLimits,
  signUp,
} from "@/lib/server/accounts";
import { authOptions } from "@/lib/server/auth-options";
import { backgroundMailSettled } from "@/lib/server/mailer";
import { sessionActor } from "@/lib/server/session";
import { catchMailDuringFile, linkIn, type CaughtMail } from "./support/mail-catcher";

const mail = catchMailDuringFile();

const freshEmail = (label: string) => `${label}-${randomUUID().slice(0, 8)}@example.org`.toLowerCase();
const address = () => `198.51.100.${Math.floor(Math.random() * 250)}-${randomUUID().slice(0, 4)}`;

async function mailsTo(email: string): Promise<CaughtMail[]> {
  await backgroundMailSettled();
  return mail.messages.filter((m) => m.to.includes(email));
}

async function lastMailTo(email: string, subject: string): Promise<CaughtMail> {
  const message = (await mailsTo(email)).at(-1);
  expect(message?.subject).toBe(subject);
  return message!;
}

const tokenOf = (message: CaughtMail) => linkIn(message).searchParams.get("token") ?? linkIn(message).pathname.split("/").pop()!;

async function signUpConfirmed(email: string, password: string) {
  await signUp({ email, name: "Owner", password }, address());
  return (await authenticateWithLink({ token: tokenOf(await lastMailTo(email, "Confirm your Arcwright account")) }))!;
}

/** The password provider's own authorize, as next-auth calls it, with the request headers it would pass. */
function authorizePassword(credentials: { email: string; password: string }, headers: Record<string, string>) {
  // next-auth keeps a credentials provider's own settings (its id, its authorize) under `options`.
  const provider = authOptions.providers.find((p) => (p as unknown as { options: CredentialsConfig }).options.id === "password") as unknown as { options: CredentialsConfig };
  return provider.options.authorize(credentials, { headers } as never);
}

/**
 * A session cookie minted as next-auth mints it at sign-in: the jwt callback (which starts the
 * session) on the signed-in user, then next-auth's own encoding with the app's secret.
 */
async function sessionCookieFor(user: { userId: string; email: string; name: string }) {
  const token = await authOptions.callbacks!.jwt!({ token: {}, user: { id: user.userId, email: user.email, name: user.name }, account: null } as never);
  const jwt = await encode({ token, secret: process.env.NEXTAUTH_SECRET! });
  return { cookie: `next-auth.session-token=${jwt}`, token };
}

/** GET /api/proposals with the real session lookup, as the browser would send it. */
async function listProposalsWith(cookie: string): Promise<number> {
  const response = await proposalCollectionRoutes(sessionActor).GET(new Request("http://arcwright.test/api/proposals", { headers: { cookie } }), { params: Promise.resolve({}) });
  return response.status;
}

describe("pre-account takeover", () => {
  it("(a) an attacker's sign-up of someone's address: the owner's e-mailed sign-in link never gives the account the attacker's password", async () => {
    const email = freshEmail("victim-a");
    await signUp({ email, name: "Mallory", password: "attacker-chose-this-1" }, address());
    const attackersLink = tokenOf(await lastMailTo(email, "Confirm your Arcwright account"));
    // The owner later signs in with a link, which proves the address.
    await requestSignInLink({ email }, address());
    const owner = await authenticateWithLink({ token: tokenOf(await lastMailTo(email, "Your Arcwright sign-in link")) });
    expect(owner?.email).toBe(email);
    await expect(authenticateWithPassword({ email, password: "attacker-chose-this-1" }, address())).resolves.toBeNull();
    // The confirmation link made with the attacker's password is void now.
    await expect(authenticateWithLink({ token: attackersLink })).rejects.toMatchObject({ code: "bad_request:link" });
    await expect(authenticateWithPassword({ email, password: "attacker-chose-this-1" }, address())).resolves.toBeNull();
  });

  it("(a) the owner signing up after the attacker changes nothing and gets a link to choose their own password", async () => {
    const email = freshEmail("victim-a2");
    await signUp({ email, name: "Mallory", password: "attacker-chose-this-1" }, address());
    const attackersLink = tokenOf(await lastMailTo(email, "Confirm your Arcwright account"));
    await signUp({ email, name: "Owner", password: "owner-chose-this-22" }, address());
    await expect(authenticateWithPassword({ email, password: "owner-chose-this-22" }, address())).resolves.toBeNull();
    const finish = await lastMailTo(email, "Finish creating your Arcwright account");
    await resetPassword({ token: tokenOf(finish), password: "owner-chose-this-22" });
    await expect(authenticateWithPassword({ email, password: "owner-chose-this-22" }, address())).resolves.toMatchObject({ email, name: "Owner" });
    await expect(authenticateWithLink({ token: attackersLink })).rejects.toMatchObject({ code: "bad_request:link" });
    await expect(authenticateWithPassword({ email, password: "attacker-chose-this-1" }, address())).resolves.toBeNull();
  });

  it("(b) a sign-up for an address whose own sign-up is pending does not replace the owner's password", async () => {
    const email = freshEmail("victim-b");
    await signUp({ email, name: "Owner", password: "owner-chose-this-22" }, address());
    const ownersLink = tokenOf(await lastMailTo(email, "Confirm your Arcwright account"));
    await signUp({ email, name: "Mallory", password: "attacker-chose-this-1" }, address());
    await lastMailTo(email, "Finish creating your Arcwright account");
    const owner = await authenticateWithLink({ token: ownersLink });
    expect(owner).toMatchObject({ email, name: "Owner" });
    await expect(authenticateWithPassword({ email, password: "attacker-chose-this-1" }, address())).resolves.toBeNull();
    await expect(authenticateWithPassword({ email, password: "owner-chose-this-22" }, address())).resolves.toMatchObject({ userId: owner!.userId });
  });
});

describe("sign-in limits count failures, per account and per socket address", () => {
  it("50 successful sign-ins from one address lock nobody out, that address's other members included", async () => {
    const from = { [socketAddressHeader]: "203.0.113.50" };
    const frequent = freshEmail("frequent");
    const other = freshEmail("colleague");
    await signUpConfirmed(frequent, "long-enough-pass");
    await signUpConfirmed(other, "long-enough-pass");
    for (let i = 0; i < 50; i++) {
      await expect(authorizePassword({ email: frequent, password: "long-enough-pass" }, from), `sign-in ${i + 1}`).resolves.toMatchObject({ email: frequent });
    }
    await expect(authorizePassword({ email: other, password: "long-enough-pass" }, from)).resolves.toMatchObject({ email: other });
  });

  it("a forged X-Forwarded-For does not lift the failure limit of the socket's address", async () => {
    const socket = `203.0.113.${Math.floor(Math.random() * 200) + 51}`;
    const forged = () => ({ [socketAddressHeader]: socket, "x-forwarded-for": `192.0.2.${Math.floor(Math.random() * 250)}` });
    for (let i = 0; i < signInLimits.perAddress; i++) {
      await expect(authorizePassword({ email: freshEmail("spray"), password: "wrong-password" }, forged())).resolves.toBeNull();
    }
    await expect(authorizePassword({ email: freshEmail("spray"), password: "wrong-password" }, forged())).rejects.toThrow("RateLimited");
    // Another client is not affected.
    await expect(authorizePassword({ email: freshEmail("spray"), password: "wrong-password" }, { [socketAddressHeader]: "203.0.113.250" })).resolves.toBeNull();
  });

  it("the failure that locks an account mails its owner once, saying how to get in with a link or a new password", async () => {
    const email = freshEmail("locked");
    await signUpConfirmed(email, "long-enough-pass");
    for (let i = 0; i < signInLimits.perAccount; i++) {
      await expect(authenticateWithPassword({ email, password: `wrong-${i}` }, address())).resolves.toBeNull();
    }
    await expect(authenticateWithPassword({ email, password: "long-enough-pass" }, address())).rejects.toMatchObject({ code: "rate_limited:sign-in" });
    await expect(authenticateWithPassword({ email, password: "wrong-again" }, address())).rejects.toMatchObject({ code: "rate_limited:sign-in" });
    const notices = (await mailsTo(email)).filter((m) => m.subject === "Signing in to your Arcwright account with its password is paused");
    expect(notices).toHaveLength(1);
    expect(notices[0].text).toMatch(/link e-mailed from the sign-in page/);
    expect(notices[0].text).toMatch(/choose a new password/);
    // A reset ends the pause: the new password works at once.
    await requestPasswordReset({ email }, address());
    await resetPassword({ token: tokenOf(await lastMailTo(email, "Reset your Arcwright password")), password: "a-brand-new-pass-3" });
    await expect(authenticateWithPassword({ email, password: "a-brand-new-pass-3" }, address())).resolves.toMatchObject({ email });
  });

  it("a refused sign-in says so with a fixed code, never free text", async () => {
    const email = freshEmail("coded");
    for (let i = 0; i < signInLimits.perAccount; i++) await authorizePassword({ email, password: "wrong-password" }, { [socketAddressHeader]: `192.0.2.${i}` });
    const error = await Promise.resolve(authorizePassword({ email, password: "wrong-password" }, { [socketAddressHeader]: "192.0.2.99" })).catch((e: Error) => e);
    expect((error as Error).message).toBe("RateLimited");
    expect(Object.keys(signInErrorMessages)).toContain((error as Error).message);
  });
});

describe("account mail to one address is capped", () => {
  const post = (route: "signUp" | "requestReset" | "requestLink", body: object) =>
    accountRoutes[route](new Request("http://arcwright.test/api/account/x", { method: "POST", headers: { [socketAddressHeader]: address() }, body: JSON.stringify(body) }), { params: Promise.resolve({}) });

  for (const route of ["signUp", "requestReset", "requestLink"] as const) {
    it(`12 ${route} requests for one address: the same answer each time, at most ${mailLimits.perRecipient} mails an hour`, async () => {
      const email = freshEmail(`flooded-${route}`);
      await signUpConfirmed(email, "long-enough-pass");
      const answers = new Set<string>();
      for (let i = 0; i < 12; i++) {
        const response = await post(route, route === "signUp" ? { email, name: "Someone", password: "another-strong-pass" } : { email });
        answers.add(`${response.status} ${await response.text()}`);
      }
      expect([...answers]).toHaveLength(1);
      expect([...answers][0]).toMatch(/^202 /);
      // The confirmation mail of the sign-up above counts too.
      expect(await mailsTo(email)).toHaveLength(mailLimits.perRecipient);
    });
  }
});

describe("sessions end for every copy of the cookie", () => {
  it("after sign-out, a copy of the cookie and every other session of the account are refused (401)", async () => {
    const owner = await signUpConfirmed(freshEmail("sign-out"), "long-enough-pass");
    const other = await signUpConfirmed(freshEmail("sign-out-bystander"), "long-enough-pass");
    const [{ cookie, token }, elsewhere, bystander] = await Promise.all([sessionCookieFor(owner), sessionCookieFor(owner), sessionCookieFor(other)]);
    expect(await listProposalsWith(cookie)).toBe(200);
    // What next-auth's sign-out calls with the decoded cookie before it clears the browser's copy.
    await authOptions.events!.signOut!({ token } as never);
    expect(await listProposalsWith(cookie)).toBe(401);
    expect(await listProposalsWith(elsewhere.cookie)).toBe(401);
    expect(await listProposalsWith(bystander.cookie)).toBe(200);
  });

  it("a cookie whose session already ended signs nobody out (a stolen old cookie cannot end its owner's new sessions)", async () => {
    const owner = await signUpConfirmed(freshEmail("old-cookie"), "long-enough-pass");
    const old = await sessionCookieFor(owner);
    await authOptions.events!.signOut!({ token: old.token } as never);
    const fresh = await sessionCookieFor(owner);
    await authOptions.events!.signOut!({ token: old.token } as never);
    expect(await listProposalsWith(fresh.cookie)).toBe(200);
  });

  it('after "sign out everywhere", every session of the account is refused (401), other accounts\' are not', async () => {
    const owner = await signUpConfirmed(freshEmail("everywhere"), "long-enough-pass");
    const other = await signUpConfirmed(freshEmail("bystander"), "long-enough-pass");
    const [laptop, phone, bystander] = await Promise.all([sessionCookieFor(owner), sessionCookieFor(owner), sessionCookieFor(other)]);
    const response = await sessionRoutes(sessionActor).DELETE(new Request("http://arcwright.test/api/account/sessions", { method: "DELETE", headers: { cookie: laptop.cookie } }), { params: Promise.resolve({}) });
    expect(response.status).toBe(204);
    expect(await listProposalsWith(laptop.cookie)).toBe(401);
    expect(await listProposalsWith(phone.cookie)).toBe(401);
    expect(await listProposalsWith(bystander.cookie)).toBe(200);
  });

  it("after a password reset, a session opened with the old password is refused (401)", async () => {
    const email = freshEmail("reset-ends");
    const owner = await signUpConfirmed(email, "long-enough-pass");
    const { cookie } = await sessionCookieFor(owner);
    await requestPasswordReset({ email }, address());
    await resetPassword({ token: tokenOf(await lastMailTo(email, "Reset your Arcwright password")), password: "a-brand-new-pass-3" });
    expect(await listProposalsWith(cookie)).toBe(401);
  });

  it("the session answer for the header is empty once the session ended", async () => {
    const owner = await signUpConfirmed(freshEmail("header"), "long-enough-pass");
    const { token } = await sessionCookieFor(owner);
    const session = { user: {}, expires: new Date().toISOString() };
    await expect(authOptions.callbacks!.session!({ session, token } as never)).resolves.toMatchObject({ user: { email: owner.email } });
    await authOptions.events!.signOut!({ token } as never);
    await expect(authOptions.callbacks!.session!({ session: { ...session, user: {} }, token } as never)).resolves.toEqual({});
  });
});

describe("names are one line", () => {
  it("a line break in a sign-up's name is a 400 naming the field, in words", async () => {
    const response = await accountRoutes.signUp(
      new Request("http://arcwright.test/api/account/sign-up", { method: "POST", body: JSON.stringify({ email: freshEmail("crlf"), name: "Ada\r\nBcc: everyone@example.org", password: "long-enough-pass" }) }),
      { params: Promise.resolve({}) },
    );
    expect(response.status).toBe(400);
    const { error } = (await response.json()) as { error: { fields: Record<string, string[]> } };
    expect(Object.keys(error.fields)).toEqual(["name"]);
    expect(error.fields.name[0]).toMatch(/one line/);
  });
});
