import { describe, expect, it } from "vitest";
import { safeCallback, sameSitePath } from "@/lib/auth/callback-path";
import { signUpSchema } from "@/lib/auth/schemas";

describe("the address followed after signing in", () => {
  it("keeps same-site paths with their query and fragment", () => {
    expect(sameSitePath("/proposals/3f1c?night=2033-06-01#notes")).toBe("/proposals/3f1c?night=2033-06-01#notes");
    expect(sameSitePath("/proposals/invitations/abc")).toBe("/proposals/invitations/abc");
  });

  // Each of these leaves the site once a browser resolves it (WHATWG URL Standard: backslash is a
  // path separator in http(s) URLs and tab/newline are stripped; OWASP Unvalidated Redirects Cheat Sheet).
  it.each(["//evil.example/", "/\\evil.example/", "/\t/evil.example/", "/\n/evil.example", "\\/evil.example", "https://evil.example/", "javascript:alert(1)", " /proposals"])(
    "refuses %j",
    (callbackUrl) => {
      expect(sameSitePath(callbackUrl)).toBeNull();
      expect(safeCallback(callbackUrl)).toBe("/proposals");
    },
  );

  it("falls back to the proposals list without an address", () => {
    expect(safeCallback(undefined)).toBe("/proposals");
  });

  it("the sign-up API refuses the same addresses", () => {
    const account = { email: "a@example.org", name: "A", password: "long-enough-password" };
    expect(signUpSchema.safeParse({ ...account, callbackUrl: "/\t/evil.example/" }).success).toBe(false);
    expect(signUpSchema.safeParse({ ...account, callbackUrl: "/proposals" }).success).toBe(true);
  });
});
