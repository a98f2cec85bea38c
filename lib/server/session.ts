import "server-only";
import { getToken } from "next-auth/jwt";
import { RequestCookies } from "next/dist/server/web/spec-extension/cookies";
import { cookies, headers } from "next/headers";
import type { Actor } from "@/lib/server/actor";
import { authOptions } from "@/lib/server/auth-options";
import { sessionOwner } from "@/lib/server/sessions";

/**
 * The actor of the current request, from the next-auth session cookie; null when signed out. Only the
 * signed, encrypted cookie is decoded (next-auth's `getToken`); `getServerSession` would also run the
 * session callbacks and re-encrypt a fresh cookie on every call, several milliseconds of CPU per
 * request under load. The session it names and the account are then loaded in one query, so an
 * ended session (sign-out, password reset), a deleted account or a changed site role counts at once.
 */
export async function sessionActor(of?: Request): Promise<Actor | null> {
  // A route handler passes its request (whose headers are the ones next/headers would give); a page
  // passes nothing and the request scope is asked.
  const source = of ? { cookies: new RequestCookies(of.headers), headers: of.headers } : { cookies: await cookies(), headers: await headers() };
  const request = source as unknown as Parameters<typeof getToken>[0]["req"];
  const token = await getToken({ req: request, secureCookie: authOptions.useSecureCookies });
  return sessionOwner(token);
}
