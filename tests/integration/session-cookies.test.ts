import { afterEach, describe, expect, it, vi } from "vitest";

// Session cookies (OWASP Session Management Cheat Sheet): Secure whenever the app is served over
// HTTPS. The browser test in tests/e2e/security.test.ts checks httpOnly and SameSite on the real
// cookie; this checks the HTTPS switch, which the plain-http test server cannot show.
async function authOptionsFor(appUrl: string) {
  vi.resetModules();
  vi.stubEnv("NEXTAUTH_URL", appUrl);
  return (await import("@/lib/server/auth-options")).authOptions;
}

afterEach(() => {
  vi.unstubAllEnvs();
  vi.resetModules();
});

describe("session cookie security follows the app's scheme", () => {
  it("Secure cookies behind https://", async () => {
    expect((await authOptionsFor("https://arcwright.example")).useSecureCookies).toBe(true);
  });

  it("plain cookies for an http:// server such as the loopback one of npm start", async () => {
    expect((await authOptionsFor("http://127.0.0.1:3000")).useSecureCookies).toBe(false);
  });
});
