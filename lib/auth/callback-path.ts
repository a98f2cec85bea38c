/** Where a sign-in goes when it was given no usable address. */
export const DEFAULT_CALLBACK_PATH = "/proposals";

/** Stands in for this site while resolving; `.invalid` never names a real host (RFC 2606 §2). */
const SITE_ORIGIN = "http://arcwright.invalid";

/**
 * The same-site path to follow after signing in, or null when `callbackUrl` would leave the site.
 * The text is resolved the way the browser will resolve it (WHATWG URL Standard: `\` counts as `/`
 * in http(s) URLs, tabs and newlines are dropped), so `/\evil.example` and `/<tab>/evil.example`,
 * which a prefix check takes for paths, are refused (OWASP Unvalidated Redirects and Forwards Cheat
 * Sheet). The result is the resolved path, query and fragment, never a scheme or host.
 */
export function sameSitePath(callbackUrl: string): string | null {
  if (!callbackUrl.startsWith("/")) return null;
  let resolved: URL;
  try {
    resolved = new URL(callbackUrl, SITE_ORIGIN);
  } catch {
    return null;
  }
  return resolved.origin === SITE_ORIGIN ? `${resolved.pathname}${resolved.search}${resolved.hash}` : null;
}

/** `sameSitePath`, falling back to the proposals list. */
export function safeCallback(callbackUrl: string | undefined): string {
  return (callbackUrl === undefined ? null : sameSitePath(callbackUrl)) ?? DEFAULT_CALLBACK_PATH;
}
