import "server-only";
import { AppError } from "@/lib/errors";
import type { Actor, GetActor } from "@/lib/server/actor";
import { handle } from "@/lib/server/http";

/** The second argument Next passes to a route handler. */
export interface RouteContext<P> {
  params: Promise<P>;
}

/** Request bodies above this are refused unread (notes are the largest, 20,000 characters). */
export const MAX_BODY_BYTES = 256 * 1024;

const bodyTooLarge = () =>
  new AppError("payload_too_large:body", `The request body is larger than ${MAX_BODY_BYTES / 1024} KB.`, undefined, { maxBytes: MAX_BODY_BYTES });

/**
 * The body's text, read chunk by chunk and abandoned at the first byte past `MAX_BODY_BYTES`: a 20 MB
 * body costs no more than a 256 KB one, and a `Content-Length` above the limit is refused before any
 * byte is read.
 */
async function readBodyText(request: Request): Promise<string> {
  const declaredBytes = Number(request.headers.get("content-length") ?? 0);
  if (declaredBytes > MAX_BODY_BYTES) throw bodyTooLarge();
  if (request.body === null) return "";
  const decoder = new TextDecoder();
  let text = "";
  let bytes = 0;
  try {
    // Leaving the loop early cancels the stream, so the rest of the body is never pulled.
    for await (const chunk of request.body) {
      bytes += chunk.byteLength;
      if (bytes > MAX_BODY_BYTES) throw bodyTooLarge();
      text += decoder.decode(chunk, { stream: true });
    }
  } catch (error) {
    if (error instanceof AppError) throw error;
    // A client that hangs up mid-body (ECONNRESET on the request stream) is not a database outage.
    throw new AppError("bad_request:body", "The request body could not be read to its end.", { _: ["Send the whole body again."] });
  }
  return text + decoder.decode();
}

/** The body as unknown JSON; the data-access function validates it with its schema. */
export async function readJson(request: Request): Promise<unknown> {
  const text = await readBodyText(request);
  if (text.trim() === "") return {};
  try {
    return JSON.parse(text);
  } catch {
    // "_" is the key of the request as a whole, as for a zod issue without a path.
    throw new AppError("bad_request:body", "The request body is not valid JSON.", { _: ["Send the body as JSON (RFC 8259)."] });
  }
}

/**
 * The body of a route that needs a session. A signed-out caller's body is never read: it stays
 * `undefined`, and the data-access function answers 401 before it looks at the body (after a 404 for
 * a route id that names nothing), so a stranger can make the server neither buffer nor validate it.
 */
export async function readJsonOfSignedIn(request: Request, actor: Actor | null): Promise<unknown> {
  return actor === null ? undefined : readJson(request);
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
