import { randomUUID } from "node:crypto";
import { like } from "drizzle-orm";
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { dbClient } from "@/db/client";
import { rateLimitCounters } from "@/db/schema";
import { demoAccounts } from "@/db/seed/demo-scenario";
import { attemptSignIn, signIn as signInOverHttp } from "@/scripts/lib/sign-in.mjs";
import { baseUrl, launchBrowser, newPage } from "./support/browser";
import { signIn } from "./support/demo";

// Against the app as npm start serves it (scripts/serve.mjs, one next start per core): the session
// cookie, the sign-out and the client address are the real ones.

const account = (key: string) => demoAccounts.find((a) => a.key === key)!;
const proposalsStatus = async (cookie: string) => (await fetch(`${baseUrl}/api/proposals`, { headers: { Cookie: cookie } })).status;

/** next-auth's own sign-out, as the account menu's button sends it (CSRF token, then POST). */
async function signOutOverHttp(cookie: string): Promise<void> {
  const csrf = await fetch(`${baseUrl}/api/auth/csrf`, { headers: { Cookie: cookie, Origin: baseUrl } });
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const csrfCookie = csrf.headers.getSetCookie().map((line) => line.split(";")[0]).join("; ");
  const answer = await fetch(`${baseUrl}/api/auth/signout`, {
    method: "POST",
    redirect: "manual",
    headers: { Cookie: [cookie, csrfCookie].filter(Boolean).join("; "), Origin: baseUrl, "Content-Type": "application/x-www-form-urlencoded" },
    body: new URLSearchParams({ csrfToken, callbackUrl: baseUrl, json: "true" }),
  });
  expect(answer.status).toBeLessThan(400);
}

let browser: Browser;

beforeAll(async () => {
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await dbClient().sql.end();
});

/** One failed password sign-in through next-auth, with extra request headers a client chose. */
async function failedSignInWith(headers: Record<string, string>): Promise<string | null> {
  const csrf = await fetch(`${baseUrl}/api/auth/csrf`, { headers: { Origin: baseUrl } });
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const answer = await fetch(`${baseUrl}/api/auth/callback/password`, {
    method: "POST",
    redirect: "manual",
    headers: { ...headers, Origin: baseUrl, Cookie: csrf.headers.getSetCookie().map((line) => line.split(";")[0]).join("; "), "Content-Type": "application/x-www-form-urlencoded" },
    body: new URLSearchParams({ csrfToken, email: `nobody-${randomUUID().slice(0, 8)}@example.org`, password: "wrong-password", json: "true" }),
  });
  const url = (answer.headers.get("location") ?? ((await answer.json()) as { url?: string }).url)!;
  return new URL(url, baseUrl).searchParams.get("error");
}

describe("sessions end for every copy of the cookie", () => {
  it("after sign-out a copied cookie and the account's other sessions are refused (401), another person's session goes on", async () => {
    const member = account("coi");
    const copied = await signInOverHttp(baseUrl, member);
    const other = await signInOverHttp(baseUrl, member);
    const colleague = await signInOverHttp(baseUrl, account("pi"));
    expect(await proposalsStatus(copied)).toBe(200);
    await signOutOverHttp(copied);
    expect(await proposalsStatus(copied)).toBe(401);
    expect(await proposalsStatus(other)).toBe(401);
    expect(await proposalsStatus(colleague)).toBe(200);
  });

  it('"Sign out everywhere" in the account menu ends the account\'s sessions elsewhere (401)', async () => {
    const member = account("viewer");
    const elsewhere = await signInOverHttp(baseUrl, member);
    const { context, page } = await newPage(browser);
    await signIn(page, member.email, member.password);
    await page.getByTestId("account-menu").getByRole("button", { name: "Sign out everywhere" }).click();
    await page.getByRole("link", { name: "Sign in" }).waitFor();
    expect(await proposalsStatus(elsewhere)).toBe(401);
    await context.close();
  });
});

describe("sign-in limits", () => {
  it("count a failure against the socket's address, whatever address headers the client sends", async () => {
    const forged = { "X-Arcwright-Socket-Address": "192.0.2.77", "X-Forwarded-For": "192.0.2.78" };
    expect(await failedSignInWith(forged)).toBe("CredentialsSignin");
    const buckets = (await dbClient().db.select({ bucket: rateLimitCounters.bucket }).from(rateLimitCounters).where(like(rateLimitCounters.bucket, "sign-in:address:%"))).map((r) => r.bucket);
    expect(buckets).toContain("sign-in:address:127.0.0.1");
    // Only the forged values of this request: earlier phases of the run leave buckets of their own.
    expect(buckets.filter((b) => b.includes("192.0.2.77") || b.includes("192.0.2.78"))).toEqual([]);
  });

  it("50 successful sign-ins from one address lock nobody out", async () => {
    const frequent = account("pi");
    for (let i = 0; i < 50; i++) {
      const { cookie, error } = await attemptSignIn(baseUrl, frequent);
      expect(error, `sign-in ${i + 1}`).toBeNull();
      expect(cookie).not.toBeNull();
    }
    await expect(signInOverHttp(baseUrl, account("coi"))).resolves.toContain("next-auth.session-token");
  });
});

describe("the sign-in page", () => {
  it("shows our own text for an error parameter, never the parameter", async () => {
    const { context, page } = await newPage(browser);
    await page.goto(`/sign-in?error=${encodeURIComponent("Your account is suspended; call +1 555 0100")}`);
    const alert = page.getByRole("alert").filter({ hasText: "Signing in did not work" });
    await alert.waitFor();
    // (The URL itself is in the page's data for the router; what matters is what a person reads.)
    expect(await page.locator("body").innerText()).not.toContain("suspended");
    await context.close();
  });
});
