import { describe, expect, it, vi } from "vitest";

vi.mock("server-only", () => ({}));

import { randomUUID } from "node:crypto";
import { accountRoutes } from "@/lib/server/api/account-routes";
import {
  authenticateWithLink,
  authenticateWithPassword,
  requestPasswordReset,
  requestSignInLink,
  resetPassword,
  signInLimits,
  signUp,
} from "@/lib/server/accounts";
import { backgroundMailSettled } from "@/lib/server/mailer";
import { socketAddressHeader } from "@/lib/security/client-address";
import { catchMailDuringFile, linkIn } from "./support/mail-catcher";

const mail = catchMailDuringFile();

/** The newest message to an address, after the background deliveries finished. */
async function lastMailTo(email: string, subject: string) {
  await backgroundMailSettled();
  const message = mail.messages.findLast((m) => m.to.includes(email.toLowerCase()));
  expect(message?.subject).toBe(subject);
  return message!;
}

/** Signs up and follows the confirmation link, as a new member does. */
async function signUpConfirmed(email: string, name: string, password: string) {
  await signUp({ email, name, password }, address());
  const actor = await authenticateWithLink({ token: linkIn(await lastMailTo(email, "Confirm your Arcwright account")).searchParams.get("token") });
  return actor!;
}

const freshEmail = (label: string) => `${label}-${randomUUID().slice(0, 8)}@Example.org`;
const address = () => `198.51.100.${Math.floor(Math.random() * 250)}-${randomUUID().slice(0, 4)}`;

describe("accounts", () => {
  it("signs up: the password works only after the e-mailed confirmation, whose link signs in once", async () => {
    const email = freshEmail("ada");
    await expect(signUp({ email, name: "Ada Quillon", password: "long-enough-pass" }, address())).resolves.toBeUndefined();
    // Until the address is proven, the right password answers like a wrong one.
    await expect(authenticateWithPassword({ email, password: "long-enough-pass" }, address())).resolves.toBeNull();
    const token = linkIn(await lastMailTo(email, "Confirm your Arcwright account")).searchParams.get("token");
    const actor = await authenticateWithLink({ token });
    expect(actor?.email).toBe(email.toLowerCase());
    await expect(authenticateWithLink({ token })).rejects.toMatchObject({ code: "bad_request:link" });
    await expect(authenticateWithPassword({ email, password: "long-enough-pass" }, address())).resolves.toMatchObject({ userId: actor!.userId });
    await expect(authenticateWithPassword({ email, password: "wrong-password" }, address())).resolves.toBeNull();
  });

  it("a second sign-up for a confirmed address changes nothing and tells the owner by mail, with the same answer", async () => {
    const email = freshEmail("taken");
    const owner = await signUpConfirmed(email, "Taken Owner", "long-enough-pass");
    const attempt = async (address: string) =>
      accountRoutes.signUp(
        new Request("http://arcwright.test/api/account/sign-up", { method: "POST", body: JSON.stringify({ email: address, name: "Someone Else", password: "another-strong-pass" }) }),
        { params: Promise.resolve({}) },
      );
    const forTaken = await attempt(email.toUpperCase());
    const forNew = await attempt(freshEmail("brand-new"));
    expect(forTaken.status).toBe(202);
    expect(forTaken.status).toBe(forNew.status);
    expect(await forTaken.json()).toEqual(await forNew.json());
    await expect(authenticateWithPassword({ email, password: "another-strong-pass" }, address())).resolves.toBeNull();
    await expect(authenticateWithPassword({ email, password: "long-enough-pass" }, address())).resolves.toMatchObject({ userId: owner.userId });
    const notice = await lastMailTo(email, "You already have an Arcwright account");
    await expect(authenticateWithLink({ token: linkIn(notice).searchParams.get("token") })).resolves.toMatchObject({ userId: owner.userId });
  });

  it("signing up again before confirming changes nothing; the mail lets the address's owner choose the password (the owner trying again)", async () => {
    const email = freshEmail("retry");
    await signUp({ email, name: "First Try", password: "first-strong-pass" }, address());
    await signUp({ email, name: "Second Try", password: "second-strong-pass" }, address());
    await expect(authenticateWithPassword({ email, password: "second-strong-pass" }, address())).resolves.toBeNull();
    const token = linkIn(await lastMailTo(email, "Finish creating your Arcwright account")).pathname.split("/").pop()!;
    await resetPassword({ token, password: "second-strong-pass" });
    await expect(authenticateWithPassword({ email, password: "first-strong-pass" }, address())).resolves.toBeNull();
    await expect(authenticateWithPassword({ email, password: "second-strong-pass" }, address())).resolves.toMatchObject({ name: "Second Try" });
  });

  it("refuses common, repetitive and self-describing passwords (NIST SP 800-63B §5.1.1.2 blocklist), naming the field", async () => {
    for (const password of ["password1234", "aaaaaaaaaaaa", "qwertyuiop12", "1234567890", "adaquillon12", "arcwright123"]) {
      const error = await signUp({ email: freshEmail("weak"), name: "Ada Quillon", password }, address()).catch((e: unknown) => e);
      expect(error, password).toMatchObject({ code: "bad_request:account" });
      expect(Object.keys((error as { fields: Record<string, string[]> }).fields), password).toEqual(["password"]);
    }
  });

  it("answers the sign-up route with field errors for a short password", async () => {
    const response = await accountRoutes.signUp(
      new Request("http://arcwright.test/api/account/sign-up", { method: "POST", body: JSON.stringify({ email: "not-an-email", name: "", password: "short" }) }),
      { params: Promise.resolve({}) },
    );
    expect(response.status).toBe(400);
    const { error } = await response.json();
    expect(Object.keys(error.fields).sort()).toEqual(["email", "name", "password"]);
  });

  it("takes as long for an unknown e-mail as for a wrong password", async () => {
    const email = freshEmail("timing");
    await signUpConfirmed(email, "Timing", "long-enough-pass");
    const time = async (input: { email: string; password: string }) => {
      const started = performance.now();
      await authenticateWithPassword(input, address());
      return performance.now() - started;
    };
    await time({ email: freshEmail("warmup"), password: "x" });
    const known: number[] = [];
    const unknown: number[] = [];
    for (let i = 0; i < 6; i++) {
      known.push(await time({ email, password: `wrong-${i}` }));
      unknown.push(await time({ email: freshEmail("nobody"), password: `wrong-${i}` }));
    }
    const median = (xs: number[]) => xs.sort((a, b) => a - b)[Math.floor(xs.length / 2)];
    console.log(`[measure] sign-in, wrong password: median ${median(known).toFixed(1)} ms; unknown account: median ${median(unknown).toFixed(1)} ms`);
    // Both do one bcrypt comparison at cost 10 (tens of ms); without the stand-in hash the unknown
    // account would answer in about a millisecond.
    expect(median(unknown)).toBeGreaterThan(median(known) * 0.6);
    expect(median(unknown)).toBeLessThan(median(known) * 1.6);
  });

  it("answers reset, link and sign-up requests as fast for an unknown address as for a known one (the mail leaves in the background)", async () => {
    const post = (route: "requestReset" | "requestLink" | "signUp", body: object) => async () => {
      const started = performance.now();
      const response = await accountRoutes[route](
        new Request("http://arcwright.test/api/account/x", { method: "POST", headers: { [socketAddressHeader]: address() }, body: JSON.stringify(body) }),
        { params: Promise.resolve({}) },
      );
      expect(response.status).toBe(202);
      return performance.now() - started;
    };
    const median = (xs: number[]) => xs.sort((a, b) => a - b)[Math.floor(xs.length / 2)];
    const cases = [
      { route: "requestReset", known: { email: freshEmail("timed") }, unknown: () => ({ email: freshEmail("nobody") }) },
      { route: "requestLink", known: { email: freshEmail("timed") }, unknown: () => ({ email: freshEmail("nobody") }) },
      { route: "signUp", known: { email: freshEmail("timed"), name: "Someone", password: "another-strong-pass" }, unknown: () => ({ email: freshEmail("nobody"), name: "Someone", password: "another-strong-pass" }) },
    ] as const;
    // The mail server takes 400 ms to accept each message, as a distant one may: an answer that waited
    // for delivery would be that much slower for a known address, far beyond the noise of a busy machine.
    const deliveryMs = 400;
    for (const c of cases) {
      // One account per kind: its address's share of mail (mailLimits, 5 an hour) is not reached.
      await signUpConfirmed(c.known.email, "Timed Member", "long-enough-pass");
      const forKnown: number[] = [];
      const forUnknown: number[] = [];
      mail.answerDelay.ms = deliveryMs;
      try {
        for (let i = 0; i < 4; i++) {
          forKnown.push(await post(c.route, c.known)());
          forUnknown.push(await post(c.route, c.unknown())());
        }
        await backgroundMailSettled();
      } finally {
        mail.answerDelay.ms = 0;
      }
      const [k, u] = [median(forKnown), median(forUnknown)];
      console.log(`[measure] ${c.route}: known address median ${k.toFixed(1)} ms; unknown address median ${u.toFixed(1)} ms`);
      expect(Math.abs(k - u)).toBeLessThan(Math.max(deliveryMs / 2, 0.5 * Math.max(k, u)));
    }
  });

  it("limits sign-in attempts per account, whatever the address", async () => {
    const email = freshEmail("guessed");
    await signUpConfirmed(email, "Guessed", "long-enough-pass");
    for (let i = 0; i < signInLimits.perAccount; i++) {
      await expect(authenticateWithPassword({ email, password: "nope" }, address())).resolves.toBeNull();
    }
    // The right password does not help once the window's attempts are spent.
    await expect(authenticateWithPassword({ email, password: "long-enough-pass" }, address())).rejects.toMatchObject({ code: "rate_limited:sign-in" });
  });

  it("a successful sign-in clears the account's count, so members who sign in often are never locked out", async () => {
    const email = freshEmail("frequent");
    await signUpConfirmed(email, "Frequent Visitor", "long-enough-pass");
    for (let i = 0; i < signInLimits.perAccount + 4; i++) {
      await expect(authenticateWithPassword({ email, password: "long-enough-pass" }, address())).resolves.not.toBeNull();
    }
    for (let i = 0; i < signInLimits.perAccount; i++) {
      await expect(authenticateWithPassword({ email, password: "nope" }, address())).resolves.toBeNull();
    }
    await expect(authenticateWithPassword({ email, password: "nope" }, address())).rejects.toMatchObject({ code: "rate_limited:sign-in" });
  });

  it("limits sign-in attempts per address across accounts", async () => {
    const from = address();
    for (let i = 0; i < signInLimits.perAddress; i++) {
      await authenticateWithPassword({ email: freshEmail("spray"), password: "nope" }, from);
    }
    await expect(authenticateWithPassword({ email: freshEmail("spray"), password: "nope" }, from)).rejects.toMatchObject({ code: "rate_limited:sign-in" });
  });

  it("resets a password through the e-mailed link, which works once", async () => {
    const email = freshEmail("forgetful");
    await signUpConfirmed(email, "Forgetful", "old-password-1");
    await requestPasswordReset({ email }, address());
    const token = linkIn(await lastMailTo(email, "Reset your Arcwright password")).pathname.split("/").pop()!;
    // A weak new password is refused and the link stays usable.
    await expect(resetPassword({ token, password: "forgetful123" })).rejects.toMatchObject({ code: "bad_request:password reset", fields: { password: [expect.any(String)] } });
    await resetPassword({ token, password: "new-password-2" });
    await expect(authenticateWithPassword({ email, password: "old-password-1" }, address())).resolves.toBeNull();
    await expect(authenticateWithPassword({ email, password: "new-password-2" }, address())).resolves.not.toBeNull();
    await expect(resetPassword({ token, password: "third-password" })).rejects.toMatchObject({ code: "bad_request:link" });
  });

  it("sends no mail for an unknown address but answers the same", async () => {
    const before = mail.messages.length;
    await expect(requestPasswordReset({ email: freshEmail("ghost") }, address())).resolves.toBeUndefined();
    await backgroundMailSettled();
    expect(mail.messages.length).toBe(before);
  });

  it("signs in once from an e-mailed link", async () => {
    const email = freshEmail("linked");
    const actor = await signUpConfirmed(email, "Linked", "long-enough-pass");
    await requestSignInLink({ email }, address());
    const token = linkIn(await lastMailTo(email, "Your Arcwright sign-in link")).searchParams.get("token");
    await expect(authenticateWithLink({ token })).resolves.toMatchObject({ userId: actor.userId });
    await expect(authenticateWithLink({ token })).rejects.toMatchObject({ code: "bad_request:link" });
  });
});
