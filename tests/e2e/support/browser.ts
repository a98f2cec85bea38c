import { chromium, type Browser, type BrowserContext, type BrowserContextOptions, type Page } from "playwright-core";

/** The built app that `npm test` serves for these tests. */
export const baseUrl = process.env.E2E_BASE_URL ?? "http://127.0.0.1:3000";

/**
 * Debian's Chromium (never a downloaded browser). Without the background-networking, sync and
 * component-update flags it floods the closed network with refused connections; SwiftShader gives
 * software WebGL2 (DEVELOPERS.md, "Run and test").
 */
const chromiumFlags = [
  "--headless",
  "--no-sandbox",
  "--disable-gpu",
  "--disable-quic",
  "--no-first-run",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
  "--enable-unsafe-swiftshader",
  "--use-angle=swiftshader",
];

export function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    args: chromiumFlags,
  });
}

/**
 * A fresh context (own cookies) and page; console errors are collected for assertions. `options` add
 * to or override the defaults (e.g. `bypassCSP` to test what the markup alone allows).
 */
export async function newPage(browser: Browser, options: BrowserContextOptions = {}): Promise<{ context: BrowserContext; page: Page; consoleErrors: string[] }> {
  const context = await browser.newContext({ baseURL: baseUrl, viewport: { width: 1280, height: 900 }, ...options });
  const page = await context.newPage();
  const consoleErrors: string[] = [];
  page.on("console", (message) => {
    if (message.type() === "error") consoleErrors.push(message.text());
  });
  page.on("pageerror", (error) => consoleErrors.push(error.message));
  return { context, page, consoleErrors };
}
