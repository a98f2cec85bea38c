import "server-only";
import { getToken } from "next-auth/jwt";
import { cookies, headers } from "next/headers";
import type { Actor } from "@/lib/server/actor";
import { findActor } from "@/lib/server/accounts";
import { authOptions } from "@/lib/server/auth-options";

/**
 * The actor of the current request, from the next-auth session cookie; null when signed out. Only the
 * signed, encrypted cookie is decoded (next-auth's `getToken`); `getServerSession` would also run the
 * session callbacks and re-encrypt a fresh cookie on every call, several milliseconds of CPU per
 * request under load. The account is then reloaded, so a deleted account or a changed site role
 * counts at once.
 */
export async function sessionActor(): Promise<Actor | null> {
  const request = { cookies: await cookies(), headers: await headers() } as unknown as Parameters<typeof getToken>[0]["req"];
  const token = await getToken({ req: request, secureCookie: authOptions.useSecureCookies });
  return token?.sub ? findActor(token.sub) : null;
}
