import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";

vi.mock("server-only", () => ({}));

import { randomUUID } from "node:crypto";
import { dbClient } from "@/db/client";
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
import { linkIn, startMailCatcher } from "./support/mail-catcher";

let mail: Awaited<ReturnType<typeof startMailCatcher>>;

beforeAll(async () => {
  mail = await startMailCatcher();
});

afterAll(async () => {
  await mail.stop();
  await dbClient().sql.end();
});

const freshEmail = (label: string) => `${label}-${randomUUID().slice(0, 8)}@Example.org`;
const address = () => `198.51.100.${Math.floor(Math.random() * 250)}-${randomUUID().slice(0, 4)}`;

describe("accounts", () => {
  it("signs up (e-mail kept lower-case), refuses a second account for the address, signs in with the password", async () => {
    const email = freshEmail("ada");
    const actor = await signUp({ email, name: "Ada Quillon", password: "long-enough-pass" }, address());
    expect(actor.email).toBe(email.toLowerCase());
    await expect(signUp({ email: email.toUpperCase(), name: "Again", password: "long-enough-pass" }, address())).rejects.toMatchObject({ code: "conflict:account" });
    await expect(authenticateWithPassword({ email, password: "long-enough-pass" }, address())).resolves.toMatchObject({ userId: actor.userId });
    await expect(authenticateWithPassword({ email, password: "wrong-password" }, address())).resolves.toBeNull();
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
    await signUp({ email, name: "Timing", password: "long-enough-pass" }, address());
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

  it("limits sign-in attempts per account, whatever the address", async () => {
    const email = freshEmail("guessed");
    await signUp({ email, name: "Guessed", password: "long-enough-pass" }, address());
    for (let i = 0; i < signInLimits.perAccount; i++) {
      await expect(authenticateWithPassword({ email, password: "nope" }, address())).resolves.toBeNull();
    }
    // The right password does not help once the window's attempts are spent.
    await expect(authenticateWithPassword({ email, password: "long-enough-pass" }, address())).rejects.toMatchObject({ code: "rate_limited:sign-in" });
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
    await signUp({ email, name: "Forgetful", password: "old-password-1" }, address());
    await requestPasswordReset({ email }, address());
    const message = mail.messages.findLast((m) => m.to.includes(email.toLowerCase()))!;
    expect(message.subject).toBe("Reset your Arcwright password");
    const token = linkIn(message).pathname.split("/").pop()!;
    await resetPassword({ token, password: "new-password-2" });
    await expect(authenticateWithPassword({ email, password: "old-password-1" }, address())).resolves.toBeNull();
    await expect(authenticateWithPassword({ email, password: "new-password-2" }, address())).resolves.not.toBeNull();
    await expect(resetPassword({ token, password: "third-password" })).rejects.toMatchObject({ code: "bad_request:link" });
  });

  it("sends no mail for an unknown address but answers the same", async () => {
    const before = mail.messages.length;
    await expect(requestPasswordReset({ email: freshEmail("ghost") }, address())).resolves.toBeUndefined();
    expect(mail.messages.length).toBe(before);
  });

  it("signs in once from an e-mailed link", async () => {
    const email = freshEmail("linked");
    const actor = await signUp({ email, name: "Linked", password: "long-enough-pass" }, address());
    await requestSignInLink({ email }, address());
    const message = mail.messages.findLast((m) => m.to.includes(email.toLowerCase()))!;
    const token = linkIn(message).searchParams.get("token");
    await expect(authenticateWithLink({ token })).resolves.toMatchObject({ userId: actor.userId });
    await expect(authenticateWithLink({ token })).rejects.toMatchObject({ code: "bad_request:link" });
  });
});
