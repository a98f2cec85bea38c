import { afterEach, describe, expect, it, vi } from "vitest";

// lib/env validates process.env once per module instance, so each case loads the modules afresh
// after setting the variables a production server would have.
async function loadWith(env: { NODE_ENV: string; ARCWRIGHT_DEV_MAILBOX?: string }) {
  vi.resetModules();
  vi.stubEnv("NODE_ENV", env.NODE_ENV);
  if (env.ARCWRIGHT_DEV_MAILBOX === undefined) delete process.env.ARCWRIGHT_DEV_MAILBOX;
  else vi.stubEnv("ARCWRIGHT_DEV_MAILBOX", env.ARCWRIGHT_DEV_MAILBOX);
  const mailbox = await import("@/lib/server/mailbox");
  const page = await import("@/app/dev/mailbox/page");
  return { ...mailbox, MailboxPage: page.default };
}

/** The digest Next gives the error `notFound()` throws; it renders the 404 page with status 404. */
const notFoundDigest = /^NEXT_HTTP_ERROR_FALLBACK;404$/;

afterEach(() => {
  vi.unstubAllEnvs();
});

describe("/dev/mailbox exists only when asked for", () => {
  it("answers 404 on a production server without ARCWRIGHT_DEV_MAILBOX", async () => {
    const { isMailboxEnabled, listMailbox, MailboxPage } = await loadWith({ NODE_ENV: "production" });
    expect(isMailboxEnabled()).toBe(false);
    await expect(listMailbox()).rejects.toMatchObject({ code: "not_found:mailbox" });
    const thrown = await MailboxPage().then(() => null, (error: unknown) => error as { digest?: string });
    expect(thrown?.digest).toMatch(notFoundDigest);
  });

  it("answers 404 on a production server with ARCWRIGHT_DEV_MAILBOX=0", async () => {
    const { isMailboxEnabled, MailboxPage } = await loadWith({ NODE_ENV: "production", ARCWRIGHT_DEV_MAILBOX: "0" });
    expect(isMailboxEnabled()).toBe(false);
    const thrown = await MailboxPage().then(() => null, (error: unknown) => error as { digest?: string });
    expect(thrown?.digest).toMatch(notFoundDigest);
  });

  it("opens on a production server with ARCWRIGHT_DEV_MAILBOX=1 (the test runs' setting)", async () => {
    const { isMailboxEnabled, listMailbox } = await loadWith({ NODE_ENV: "production", ARCWRIGHT_DEV_MAILBOX: "1" });
    expect(isMailboxEnabled()).toBe(true);
    await expect(listMailbox()).resolves.toBeInstanceOf(Array);
  });
});
