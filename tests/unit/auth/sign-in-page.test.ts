import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it, vi } from "vitest";

// The form is a client component (hooks, next-auth's browser client); this test is about the page's
// own alert, so the form renders as nothing.
vi.mock("@/components/account/sign-in-form", () => ({ SignInForm: () => null }));

import SignInPage from "@/app/sign-in/page";
import { signInErrorMessages } from "@/lib/auth/sign-in-errors";

async function render(error?: string): Promise<string> {
  const page = await SignInPage({ searchParams: Promise.resolve(error === undefined ? {} : { error }) });
  return renderToStaticMarkup(createElement(() => page));
}

// Anyone can send a link to /sign-in?error=…: the page must not display what the link says.
describe("the sign-in page shows only our own text for ?error=", () => {
  it("an attacker-written error is not echoed; the generic line is shown instead", async () => {
    const html = await render("Your account is suspended. Call +1 555 0100 with your password");
    expect(html).not.toContain("suspended");
    expect(html).not.toContain("555 0100");
    expect(html).toContain("Signing in did not work; try again.");
  });

  it("a known code shows its fixed text", async () => {
    expect(await render("RateLimited")).toContain(signInErrorMessages.RateLimited);
  });

  it("no error, no alert", async () => {
    expect(await render()).not.toContain('role="alert"');
  });
});
