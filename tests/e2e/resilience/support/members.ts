/**
 * A signed-in member as a script sees one: the next-auth session cookie, and calls that carry it with
 * the `Origin` a browser page of that instance would send (the app refuses cross-site writes).
 */

export { attemptSignIn, signIn } from "@/scripts/lib/sign-in.mjs";

export interface CallOptions {
  method?: "GET" | "POST" | "PATCH" | "DELETE";
  body?: unknown;
  /** Abort after this long (the caller records an abort as a hang). */
  timeoutMs?: number;
}

/** One request to `appUrl` as the member whose Cookie header is `cookie`. */
export function call(appUrl: string, cookie: string, path: string, { method = "GET", body, timeoutMs = 30_000 }: CallOptions = {}): Promise<Response> {
  return fetch(`${appUrl}${path}`, {
    method,
    redirect: "manual",
    headers: { Origin: appUrl, Cookie: cookie, ...(body === undefined ? {} : { "Content-Type": "application/json" }) },
    body: body === undefined ? undefined : JSON.stringify(body),
    signal: AbortSignal.timeout(timeoutMs),
  });
}

/** A call that must answer `status`; resolves with the parsed JSON body. */
export async function callOk<T>(appUrl: string, cookie: string, path: string, options: CallOptions & { status?: number } = {}): Promise<T> {
  const response = await call(appUrl, cookie, path, options);
  const expected = options.status ?? 200;
  if (response.status !== expected) throw new Error(`${options.method ?? "GET"} ${path} answered ${response.status}, not ${expected}: ${(await response.text()).slice(0, 400)}`);
  return (await response.json()) as T;
}

/** The id of the proposal with this title among the member's proposals. */
export async function proposalIdByTitle(appUrl: string, cookie: string, title: string): Promise<string> {
  const { proposals } = await callOk<{ proposals: { id: string; title: string }[] }>(appUrl, cookie, "/api/proposals");
  const found = proposals.find((p) => p.title === title);
  if (!found) throw new Error(`no proposal titled "${title}" among ${proposals.map((p) => p.title).join(", ")}`);
  return found.id;
}
