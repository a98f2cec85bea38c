import "server-only";
import { z } from "zod";
import { AppError, errorBody, statusForCode, type FieldErrors } from "@/lib/errors";
import { crossSiteError } from "@/lib/security/same-origin";
import { summaryOf, wordedIssue } from "@/lib/workspace/issue-words";

/** Field errors from a zod failure, keyed by dotted path ("site.latitudeDeg"). */
export function fieldErrorsOf(error: z.ZodError): FieldErrors {
  const fields: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.length > 0 ? issue.path.join(".") : "_";
    (fields[key] ??= []).push(issue.message);
  }
  return fields;
}

/**
 * Parses with a schema or throws `bad_request:<subject>` with every bad field's messages, worded
 * for the user (`wordedIssue` fills in what a schema leaves to zod's defaults).
 */
export function parseOrThrow<T extends z.ZodType>(schema: T, input: unknown, subject: string): z.infer<T> {
  const result = schema.safeParse(input, { error: wordedIssue });
  if (!result.success) {
    const fields = fieldErrorsOf(result.error);
    throw new AppError(`bad_request:${subject}`, summaryOf(fields), fields);
  }
  return result.data;
}

/**
 * Every API answer is about one caller at one moment (a member's proposals, a refusal naming their
 * input): no browser or shared cache may keep it (RFC 9111 §5.2.2.5).
 */
export const NO_STORE = "no-store";

/** Maps any thrown value to the product's error answer. Unknown errors are logged, never echoed. */
export function errorResponse(error: unknown): Response {
  if (error instanceof AppError) {
    // A rate limit says when to come back (RFC 9110 §10.2.3), from the limiter's window.
    const retryAfter = error.kind === "rate_limited" ? error.details?.retryAfterSeconds : undefined;
    const headers = { "Cache-Control": NO_STORE, ...(typeof retryAfter === "number" ? { "Retry-After": String(Math.ceil(retryAfter)) } : {}) };
    return Response.json(errorBody(error), { status: statusForCode(error.code), headers });
  }
  if (isDatabaseUnavailable(error)) {
    logUnavailable(error);
    const unavailable = new AppError("unavailable:database", "The database is not reachable right now; try again shortly.");
    return Response.json(errorBody(unavailable), { status: 503, headers: { "Cache-Control": NO_STORE, "Retry-After": "5" } });
  }
  console.error("unexpected error:", error);
  return Response.json(errorBody(new AppError("internal:server", "Something went wrong on our side.")), {
    status: 500,
    headers: { "Cache-Control": NO_STORE },
  });
}

/**
 * The answer with `Cache-Control: no-store` unless it set its own (downloads say `private, no-store`).
 * Copied into a new Response because some answers' headers are immutable (`Response.redirect`).
 */
function withNoStore(response: Response): Response {
  if (response.headers.has("cache-control")) return response;
  const headers = new Headers(response.headers);
  headers.set("Cache-Control", NO_STORE);
  return new Response(response.body, { status: response.status, statusText: response.statusText, headers });
}

/** During an outage every request fails alike: the log gets the first failure and then one line per interval. */
const unavailableLogIntervalMs = 10_000;
const unavailableLog = { lastAt: 0, suppressed: 0 };

function logUnavailable(error: unknown): void {
  const now = Date.now();
  if (now - unavailableLog.lastAt < unavailableLogIntervalMs) {
    unavailableLog.suppressed += 1;
    return;
  }
  const repeats = unavailableLog.suppressed > 0 ? ` (${unavailableLog.suppressed} more like it since the last report)` : "";
  console.error(`database unavailable${repeats}:`, error);
  unavailableLog.lastAt = now;
  unavailableLog.suppressed = 0;
}

/**
 * Codes that mean the database cannot be reached or is going away: Node's socket errors (refused,
 * reset, a write to a closed socket, timeouts), postgres.js's connection states, and PostgreSQL's
 * SQLSTATE class 08 (connection exception) and 57P01–57P03 (shutdown, crash, cannot connect now) and
 * 57014 (statement timeout) — PostgreSQL documentation, Appendix A.
 */
const unavailableCodes = new Set([
  "ECONNREFUSED", "ECONNRESET", "ECONNABORTED", "EPIPE", "ETIMEDOUT", "EHOSTUNREACH", "ENETUNREACH",
  "CONNECT_TIMEOUT", "CONNECTION_CLOSED", "CONNECTION_ENDED", "CONNECTION_DESTROYED",
  "08000", "08001", "08003", "08004", "08006", "57P01", "57P02", "57P03", "57014",
]);

/**
 * True for errors that mean "PostgreSQL is down or too slow", not "the query is wrong": the error,
 * its causes, and the errors an AggregateError gathers (a connection tried on several addresses).
 */
export function isDatabaseUnavailable(error: unknown, depth = 0): boolean {
  if (depth > 4 || !error || typeof error !== "object") return false;
  const code = (error as { code?: unknown }).code;
  if (typeof code === "string" && unavailableCodes.has(code)) return true;
  const gathered = (error as { errors?: unknown }).errors;
  if (Array.isArray(gathered) && gathered.some((inner) => isDatabaseUnavailable(inner, depth + 1))) return true;
  return isDatabaseUnavailable((error as { cause?: unknown }).cause, depth + 1);
}

/**
 * Wraps a route handler so every failure becomes the documented error shape, a cross-site request
 * that would change data is refused (403 `forbidden:origin`) before the handler runs, and no answer
 * is kept by a cache (`Cache-Control: no-store`).
 */
export function handle<A extends unknown[]>(fn: (...args: A) => Promise<Response>) {
  return async (...args: A): Promise<Response> => {
    try {
      const refusal = args[0] instanceof Request ? crossSiteError(args[0]) : null;
      if (refusal) throw refusal;
      return withNoStore(await fn(...args));
    } catch (error) {
      return errorResponse(error);
    }
  };
}
