// Signs a member in through next-auth's own credentials flow, the way the sign-in form does, and
// gives the Cookie header a browser would then send. Used by the load run and the resilience tests.
// Every request carries `Origin`, as a browser's would (the app refuses cross-site writes).

/** Folds a response's Set-Cookie headers into `jar` (name → value); an emptied cookie is dropped. */
function keepCookies(jar, response) {
  for (const line of response.headers.getSetCookie()) {
    const [pair] = line.split(";");
    const at = pair.indexOf("=");
    const name = pair.slice(0, at).trim();
    const value = pair.slice(at + 1).trim();
    if (value === "") jar.delete(name);
    else jar.set(name, value);
  }
}

const cookieHeaderOf = (jar) => [...jar].map(([name, value]) => `${name}=${value}`).join("; ");

/**
 * GET /api/auth/csrf (token and its cookie), then POST /api/auth/callback/password, form-encoded, with
 * the token, e-mail and password.
 * @param {string} appUrl
 * @param {{ email: string, password: string }} member
 * @returns {Promise<{ cookie: string | null, error: string | null }>} the Cookie header when a session
 *   cookie was set, and the error next-auth put in the URL it sends the browser to (the form shows it)
 */
export async function attemptSignIn(appUrl, { email, password }) {
  const jar = new Map();
  const csrf = await fetch(`${appUrl}/api/auth/csrf`, { headers: { Origin: appUrl } });
  if (!csrf.ok) throw new Error(`sign-in of ${email}: GET /api/auth/csrf answered ${csrf.status}`);
  keepCookies(jar, csrf);
  const { csrfToken } = await csrf.json();

  const callback = await fetch(`${appUrl}/api/auth/callback/password`, {
    method: "POST",
    redirect: "manual",
    headers: { Origin: appUrl, Cookie: cookieHeaderOf(jar), "Content-Type": "application/x-www-form-urlencoded" },
    body: new URLSearchParams({ csrfToken, email, password, callbackUrl: `${appUrl}/proposals`, json: "true" }),
  });
  keepCookies(jar, callback);
  const hasSession = [...jar.keys()].some((name) => name.startsWith("next-auth.session-token"));
  const redirectTo = callback.headers.get("location") ?? (await callback.json().catch(() => ({}))).url ?? "";
  const error = redirectTo ? new URL(redirectTo, appUrl).searchParams.get("error") : null;
  return { cookie: hasSession ? cookieHeaderOf(jar) : null, error };
}

/**
 * Signs in or throws, and checks the session answers for this member before returning.
 * @param {string} appUrl
 * @param {{ email: string, password: string }} member
 * @returns {Promise<string>} the Cookie header
 */
export async function signIn(appUrl, member) {
  const { cookie, error } = await attemptSignIn(appUrl, member);
  if (!cookie) throw new Error(`sign-in of ${member.email} on ${appUrl} failed: ${error ?? "no session cookie"}`);
  const session = await fetch(`${appUrl}/api/auth/session`, { headers: { Origin: appUrl, Cookie: cookie } });
  const body = session.ok ? await session.json() : {};
  if (body?.user?.email !== member.email) throw new Error(`sign-in of ${member.email}: the session answers for ${body?.user?.email ?? "nobody"}`);
  return cookie;
}
