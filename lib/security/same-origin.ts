import { serverEnv } from "@/lib/env";
import { AppError } from "@/lib/errors";

/**
 * Cross-site request refusal for state-changing requests (OWASP CSRF Prevention Cheat Sheet:
 * "verifying origin with standard headers" and Fetch Metadata). Browsers send `Origin` on every
 * non-GET request and `Sec-Fetch-Site` on every request; a request that carries either must come
 * from this very origin. A request with neither did not come from a browser page (scripts, the upload
 * service's signed callbacks) and cannot carry a victim's cookies by accident, so it is let through.
 *
 * "This origin" is the configured public one (`NEXTAUTH_URL`): scheme, host and port, as RFC 6454
 * compares origins. Nothing in the request itself is trusted to say where it was sent (`Host` and
 * `X-Forwarded-Host` are the client's to write), and another port or scheme on the same host is
 * another origin, whose pages the session cookie would reach all the same.
 */

/**
 * Methods that only read (RFC 9110 §9.2.1 safe methods). OPTIONS is safe too, but a browser sends it
 * only as another origin's CORS preflight, which this app never grants: it is refused like a write.
 */
const safeMethods = new Set(["GET", "HEAD"]);

export interface RequestFacts {
  method: string;
  /** The app's own origin from configuration (`http://127.0.0.1:3000`); a path on it is ignored. */
  appOrigin: string;
  origin: string | null;
  secFetchSite: string | null;
}

/** Why a request is refused, or null when it may proceed. */
export function crossSiteRefusal(request: RequestFacts): string | null {
  if (safeMethods.has(request.method.toUpperCase())) return null;
  if (request.origin !== null) {
    // URL parsing lowercases the host and drops a scheme's default port, so equal origins compare equal.
    const origin = originOf(request.origin);
    if (origin === null || origin !== originOf(request.appOrigin)) {
      return `requests that change data must come from this site; this one came from ${request.origin}.`;
    }
    return null;
  }
  if (request.secFetchSite !== null && request.secFetchSite !== "same-origin" && request.secFetchSite !== "none") {
    return `requests that change data must come from this site; this one was ${request.secFetchSite}.`;
  }
  return null;
}

/** The serialized origin of a URL (`https://host:port`), or null for an opaque origin ("null") or garbage. */
function originOf(url: string): string | null {
  try {
    const origin = new URL(url).origin;
    return origin === "null" ? null : origin;
  } catch {
    return null;
  }
}

/**
 * The refusal of a fetch `Request` as the product's error (403 `forbidden:origin`), or null.
 * `appOrigin` is the configured public origin unless a test names another.
 */
export function crossSiteError(request: Request, appOrigin: string = serverEnv().NEXTAUTH_URL): AppError | null {
  const refusal = crossSiteRefusal({
    method: request.method,
    appOrigin,
    origin: request.headers.get("origin"),
    secFetchSite: request.headers.get("sec-fetch-site"),
  });
  return refusal === null ? null : new AppError("forbidden:origin", `Refused: ${refusal}`);
}
