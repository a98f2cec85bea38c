import "server-only";
import { AppError } from "@/lib/errors";
import type { Actor, GetActor } from "@/lib/server/actor";
import { handle } from "@/lib/server/http";

/** The second argument Next passes to a route handler. */
export interface RouteContext<P> {
  params: Promise<P>;
}

/** Request bodies above this are refused before parsing (notes are the largest, 20,000 characters). */
const maxBodyBytes = 256 * 1024;

/** The body as unknown JSON; the data-access function validates it with its schema. */
export async function readJson(request: Request): Promise<unknown> {
  // A client that hangs up mid-body (ECONNRESET on the request stream) is not a database outage.
  const text = await request.text().catch(() => {
    throw new AppError("bad_request:body", "The request body could not be read to its end.", { _: ["Send the whole body again."] });
  });
  if (text.length > maxBodyBytes) throw new AppError("payload_too_large:body", "The request body is too large.");
  if (text.trim() === "") return {};
  try {
    return JSON.parse(text);
  } catch {
    // "_" is the key of the request as a whole, as for a zod issue without a path.
    throw new AppError("bad_request:body", "The request body is not valid JSON.", { _: ["Send the body as JSON (RFC 8259)."] });
  }
}

/** Query string parameters as a plain record, for a zod query schema. */
export function queryOf(request: Request): Record<string, string> {
  return Object.fromEntries(new URL(request.url).searchParams);
}

export const noContent = () => new Response(null, { status: 204 });

interface EndpointArgs<P> {
  request: Request;
  params: P;
  actor: Actor | null;
}

/**
 * A route handler that resolves its params and actor, then calls `fn`; every throw becomes the
 * product's error answer. Authorization is not done here but in the data-access function `fn` calls.
 */
export function endpoint<P = Record<string, never>>(getActor: GetActor, fn: (args: EndpointArgs<P>) => Promise<Response>) {
  return handle(async (request: Request, context: RouteContext<P>) => {
    const params = await context.params;
    return fn({ request, params, actor: await getActor(request) });
  });
}
