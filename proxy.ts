import { NextResponse, type NextRequest } from "next/server";
import { proxyEnv } from "@/lib/env";
import { contentSecurityPolicy, originOf } from "@/lib/security/content-security-policy";

/**
 * Runs before every page: gives each page a fresh script nonce and the
 * Content-Security-Policy that names it. Next reads the policy from the request headers and puts the
 * nonce on its own scripts. (Cross-site writes are refused in the route handlers themselves, see
 * lib/security/same-origin.ts: a refusal answered from here leaves Next an aborted request body when
 * the browser hangs up.)
 */
export function proxy(request: NextRequest) {
  const env = proxyEnv();
  const nonce = Buffer.from(crypto.getRandomValues(new Uint8Array(16))).toString("base64");
  const policy = contentSecurityPolicy({
    nonce,
    development: env.NODE_ENV === "development",
    connectOrigins: originOf(env.UPLOADTHING_INGEST_URL),
    imageOrigins: uploadFileOrigins(env.UPLOADTHING_UFS_HOST),
    https: env.NEXTAUTH_URL.startsWith("https://"),
  });
  const requestHeaders = new Headers(request.headers);
  requestHeaders.set("x-nonce", nonce);
  requestHeaders.set("content-security-policy", policy);
  const response = NextResponse.next({ request: { headers: requestHeaders } });
  response.headers.set("content-security-policy", policy);
  return response;
}

/** Where the upload service serves stored files from (host[:port], http only for a local fake). */
function uploadFileOrigins(host: string | undefined): string[] {
  if (!host) return [];
  // The SDK itself writes http:// file URLs only for a host containing "local".
  return [`${host.includes("local") ? "http" : "https"}://${host}`];
}

export const config = {
  // Pages only: the build's static files carry no script to allow, and the API answers JSON, files and
  // redirects (never HTML), so neither needs a nonce; skipping them keeps the proxy off the API's path.
  matcher: [{ source: "/((?!api/|_next/static|_next/image|favicon.ico|icon.svg).*)" }],
};
