import { AppError } from "@/lib/errors";

/**
 * Cross-site request refusal for state-changing requests (OWASP CSRF Prevention Cheat Sheet:
 * "verifying origin with standard headers" and Fetch Metadata). Browsers send `Origin` on every
 * non-GET request and `Sec-Fetch-Site` on every request; a request that carries either must come
 * from this very host. A request with neither did not come from a browser page (scripts, the upload
 * service's signed callbacks) and cannot carry a victim's cookies by accident, so it is let through.
 */

/**
 * Methods that only read (RFC 9110 §9.2.1 safe methods). OPTIONS is safe too, but a browser sends it
 * only as another origin's CORS preflight, which this app never grants: it is refused like a write.
 */
const safeMethods = new Set(["GET", "HEAD"]);

export interface RequestFacts {
  method: string;
  /** The Host the request was sent to (`X-Forwarded-Host` first, behind a proxy). */
  host: string | null;
  origin: string | null;
  secFetchSite: string | null;
}

/** Why a request is refused, or null when it may proceed. */
export function crossSiteRefusal(request: RequestFacts): string | null {
  if (safeMethods.has(request.method.toUpperCase())) return null;
  if (request.origin !== null) {
    let originHost: string | null = null;
    try {
      originHost = request.origin === "null" ? null : new URL(request.origin).host;
    } catch {
      originHost = null;
    }
    if (originHost === null || request.host === null || originHost.toLowerCase() !== request.host.toLowerCase()) {
      return `requests that change data must come from this site; this one came from ${request.origin}.`;
    }
    return null;
  }
  if (request.secFetchSite !== null && request.secFetchSite !== "same-origin" && request.secFetchSite !== "none") {
    return `requests that change data must come from this site; this one was ${request.secFetchSite}.`;
  }
  return null;
}

/** The refusal of a fetch `Request` as the product's error (403 `forbidden:origin`), or null. */
export function crossSiteError(request: Request): AppError | null {
  const refusal = crossSiteRefusal({
    method: request.method,
    host: request.headers.get("x-forwarded-host") ?? request.headers.get("host") ?? new URL(request.url).host,
    origin: request.headers.get("origin"),
    secFetchSite: request.headers.get("sec-fetch-site"),
  });
  return refusal === null ? null : new AppError("forbidden:origin", `Refused: ${refusal}`);
}
