import "server-only";
import { notFound, redirect } from "next/navigation";
import { AppError } from "@/lib/errors";
import type { Actor } from "@/lib/server/actor";
import { sessionActor } from "@/lib/server/session";

/**
 * Loads a page's data as the signed-in actor: signed out goes to the sign-in page (and back here
 * after), a proposal the actor cannot see is the ordinary 404 page. Pages call the same data-access
 * functions as the API, so they are authorized the same way.
 */
export async function loadForPage<T>(path: string, load: (actor: Actor | null) => Promise<T>): Promise<T> {
  const actor = await sessionActor();
  try {
    return await load(actor);
  } catch (error) {
    if (error instanceof AppError && error.kind === "unauthorized") redirect(`/sign-in?callbackUrl=${encodeURIComponent(path)}`);
    if (error instanceof AppError && error.kind === "not_found") notFound();
    throw error;
  }
}
