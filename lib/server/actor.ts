import type { SiteRole } from "@/lib/workspace/roles";
import { AppError } from "@/lib/errors";

/** The signed-in person a request acts for. Data-access functions take it explicitly. */
export interface Actor {
  userId: string;
  email: string;
  name: string;
  siteRole: SiteRole;
}

/**
 * How a route finds its actor. The app passes the next-auth session lookup; tests pass a function that
 * returns a fixed actor, since `getServerSession` only runs inside a real request.
 */
export type GetActor = (request: Request) => Promise<Actor | null>;

/** 401 for a missing session: "who are you" comes before "what may you do". */
export function requireActor(actor: Actor | null): Actor {
  if (!actor) throw new AppError("unauthorized:session", "Sign in to continue.");
  return actor;
}
