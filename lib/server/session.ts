import "server-only";
import { getServerSession } from "next-auth";
import type { Actor } from "@/lib/server/actor";
import { findActor } from "@/lib/server/accounts";
import { authOptions } from "@/lib/server/auth-options";

/** The actor of the current request, from the next-auth session cookie; null when signed out. */
export async function sessionActor(): Promise<Actor | null> {
  const session = await getServerSession(authOptions);
  const userId = (session?.user as { id?: string } | undefined)?.id;
  return userId ? findActor(userId) : null;
}
