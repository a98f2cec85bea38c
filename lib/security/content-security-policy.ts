/**
 * The Content-Security-Policy every page is served with (W3C Content Security Policy Level 3).
 *
 * Scripts run only with this response's nonce; 'strict-dynamic' lets those scripts load the app's
 * own chunks and workers (the approach of the CSP3 "strict CSP", common practice for framework apps).
 * Styles allow inline attributes because React sets `style` on elements (plots, the 3D view's
 * container); there is no inline script or remote style sheet. Uploads go straight from the browser
 * to the upload service, so its ingest origin is in `connect-src`, and its file origin in `img-src`.
 */
export interface PolicyOptions {
  /** Fresh per response, base64. */
  nonce: string;
  /** Development builds evaluate modules for fast refresh and need 'unsafe-eval'. */
  development: boolean;
  /** Origins (scheme://host:port) the browser may upload to and fetch from, e.g. the upload service. */
  connectOrigins: string[];
  /** Origins images may come from besides the app itself. */
  imageOrigins: string[];
  /** Behind HTTPS, ask the browser to upgrade any http:// sub-resource. */
  https: boolean;
}

export function contentSecurityPolicy(options: PolicyOptions): string {
  const directives: [string, ...string[]][] = [
    ["default-src", "'self'"],
    ["script-src", "'self'", `'nonce-${options.nonce}'`, "'strict-dynamic'", ...(options.development ? ["'unsafe-eval'"] : [])],
    ["style-src", "'self'", "'unsafe-inline'"],
    ["img-src", "'self'", "data:", "blob:", ...options.imageOrigins],
    ["font-src", "'self'"],
    ["connect-src", "'self'", ...options.connectOrigins, ...(options.development ? ["ws:"] : [])],
    ["worker-src", "'self'", "blob:"],
    ["object-src", "'none'"],
    ["base-uri", "'none'"],
    ["form-action", "'self'"],
    ["frame-src", "'none'"],
    ["frame-ancestors", "'none'"],
    ["manifest-src", "'self'"],
  ];
  if (options.https) directives.push(["upgrade-insecure-requests"]);
  return directives.map((d) => d.join(" ")).join("; ");
}

/** The origin of an absolute URL, or nothing for an unset or unparsable one. */
export function originOf(url: string | undefined): string[] {
  if (!url) return [];
  try {
    return [new URL(url).origin];
  } catch {
    return [];
  }
}
