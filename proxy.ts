import { NextResponse, type NextRequest } from "next/server";
import { AppError, errorBody } from "@/lib/errors";
import { contentSecurityPolicy, originOf } from "@/lib/security/content-security-policy";
import { crossSiteRefusal } from "@/lib/security/same-origin";

/**
 * Runs before every page and route handler: refuses cross-site requests that would change data, and
 * gives each page a fresh script nonce and the Content-Security-Policy that names it. Next reads the
 * policy from the request headers and puts the nonce on its own scripts.
 */
export function proxy(request: NextRequest) {
  const refusal = crossSiteRefusal({
    method: request.method,
    host: request.headers.get("x-forwarded-host") ?? request.headers.get("host"),
    origin: request.headers.get("origin"),
    secFetchSite: request.headers.get("sec-fetch-site"),
  });
  if (refusal !== null) {
    const error = new AppError("forbidden:origin", `Refused: ${refusal}`);
    return NextResponse.json(errorBody(error), { status: 403 });
  }

  const nonce = Buffer.from(crypto.getRandomValues(new Uint8Array(16))).toString("base64");
  const policy = contentSecurityPolicy({
    nonce,
    development: process.env.NODE_ENV === "development",
    connectOrigins: originOf(process.env.UPLOADTHING_INGEST_URL),
    imageOrigins: uploadFileOrigins(),
    https: (process.env.NEXTAUTH_URL ?? "").startsWith("https://"),
  });
  const requestHeaders = new Headers(request.headers);
  requestHeaders.set("x-nonce", nonce);
  requestHeaders.set("content-security-policy", policy);
  const response = NextResponse.next({ request: { headers: requestHeaders } });
  response.headers.set("content-security-policy", policy);
  return response;
}

/** Where the upload service serves stored files from (host[:port], http only for a local fake). */
function uploadFileOrigins(): string[] {
  const host = process.env.UPLOADTHING_UFS_HOST;
  if (!host) return [];
  // The SDK itself writes http:// file URLs only for a host containing "local".
  return [`${host.includes("local") ? "http" : "https"}://${host}`];
}

export const config = {
  // Everything but the build's static files, which carry no data and need no nonce.
  matcher: [{ source: "/((?!_next/static|_next/image|favicon.ico|icon.svg).*)" }],
};
