/**
 * A signed-in member as a script sees one: the next-auth session cookie, and calls that carry it with
 * the `Origin` a browser page of that instance would send (the app refuses cross-site writes).
 */

export interface SignInAnswer {
  /** The Cookie header to send, when a session cookie was set. */
  cookie: string | null;
  /** The error next-auth put in the URL it sends the browser to (the sign-in form shows it). */
  error: string | null;
}

/** Folds a response's Set-Cookie headers into `jar` (name → value); an emptied cookie is dropped. */
function keepCookies(jar: Map<string, string>, response: Response): void {
  for (const line of response.headers.getSetCookie()) {
    const [pair] = line.split(";");
    const at = pair.indexOf("=");
    const value = pair.slice(at + 1).trim();
    if (value === "") jar.delete(pair.slice(0, at).trim());
    else jar.set(pair.slice(0, at).trim(), value);
  }
}

const cookieHeaderOf = (jar: Map<string, string>) => [...jar].map(([name, value]) => `${name}=${value}`).join("; ");

/**
 * next-auth's credentials flow as the sign-in form drives it: GET /api/auth/csrf (token and its
 * cookie), then POST /api/auth/callback/password form-encoded with the token, e-mail and password.
 */
export async function attemptSignIn(appUrl: string, email: string, password: string): Promise<SignInAnswer> {
  const jar = new Map<string, string>();
  const csrf = await fetch(`${appUrl}/api/auth/csrf`, { headers: { Origin: appUrl } });
  if (!csrf.ok) throw new Error(`GET /api/auth/csrf answered ${csrf.status}`);
  keepCookies(jar, csrf);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const callback = await fetch(`${appUrl}/api/auth/callback/password`, {
    method: "POST",
    redirect: "manual",
    headers: { Origin: appUrl, Cookie: cookieHeaderOf(jar), "Content-Type": "application/x-www-form-urlencoded" },
    body: new URLSearchParams({ csrfToken, email, password, callbackUrl: `${appUrl}/proposals`, json: "true" }),
  });
  keepCookies(jar, callback);
  const hasSession = [...jar.keys()].some((name) => name.startsWith("next-auth.session-token"));
  const redirectTo = callback.headers.get("location") ?? ((await callback.json().catch(() => ({}))) as { url?: string }).url ?? "";
  const error = redirectTo ? new URL(redirectTo, appUrl).searchParams.get("error") : null;
  return { cookie: hasSession ? cookieHeaderOf(jar) : null, error };
}

/** Signs in or throws; the answer is the Cookie header. */
export async function signIn(appUrl: string, email: string, password: string): Promise<string> {
  const answer = await attemptSignIn(appUrl, email, password);
  if (!answer.cookie) throw new Error(`sign-in of ${email} on ${appUrl} failed: ${answer.error ?? "no session cookie"}`);
  return answer.cookie;
}

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
