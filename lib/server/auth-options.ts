import "server-only";
import type { NextAuthOptions, User } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import type { SignInErrorCode } from "@/lib/auth/sign-in-errors";
import { serverEnv } from "@/lib/env";
import { AppError } from "@/lib/errors";
import { clientAddressOf } from "@/lib/security/client-address";
import type { Actor } from "@/lib/server/actor";
import { authenticateWithLink, authenticateWithPassword } from "@/lib/server/accounts";
import { isDatabaseUnavailable } from "@/lib/server/http";
import { endSession, sessionLifetimeSeconds, sessionOwner, startSession } from "@/lib/server/sessions";

const asUser = (actor: Actor | null): User | null => (actor ? { id: actor.userId, email: actor.email, name: actor.name } : null);

function signInErrorCodeOf(error: AppError): SignInErrorCode {
  if (error.kind === "rate_limited") return "RateLimited";
  if (error.code === "bad_request:link") return "LinkSpent";
  return error.kind === "unavailable" ? "Unavailable" : "CredentialsSignin";
}

// next-auth turns a thrown Error's message into the `error` parameter of the sign-in page's URL; it
// carries only one of our codes, which the page and the form turn into fixed text
// (lib/auth/sign-in-errors.ts), so nothing in that URL is ever shown as written.
async function authorizeWith(run: () => Promise<Actor | null>): Promise<User | null> {
  try {
    return asUser(await run());
  } catch (error) {
    if (error instanceof AppError) throw new Error(signInErrorCodeOf(error));
    console.error("sign-in failed:", error);
    throw new Error("Unavailable" satisfies SignInErrorCode);
  }
}

/**
 * Sessions are signed JWT cookies that name a row of `user_sessions` (lib/server/sessions.ts): the
 * token carries the user id and that session id, and every request checks the row and reloads the
 * account, so a sign-out, a password reset, a changed site role or a deleted account counts at once,
 * for every copy of the cookie.
 */
export const authOptions: NextAuthOptions = {
  session: { strategy: "jwt", maxAge: sessionLifetimeSeconds },
  // Cookies are httpOnly and SameSite=Lax (next-auth's defaults); behind HTTPS they are also Secure
  // and carry the __Secure- / __Host- prefixes. Said here rather than left to the default.
  // A getter: read per request, so building the app needs no environment.
  get useSecureCookies() {
    return serverEnv().NEXTAUTH_URL.startsWith("https://");
  },
  pages: { signIn: "/sign-in", error: "/sign-in" },
  providers: [
    CredentialsProvider({
      id: "password",
      name: "E-mail and password",
      credentials: { email: { label: "E-mail", type: "email" }, password: { label: "Password", type: "password" } },
      authorize: (credentials, req) => authorizeWith(() => authenticateWithPassword(credentials, clientAddressOf(req.headers, serverEnv().ARCWRIGHT_TRUSTED_PROXY))),
    }),
    CredentialsProvider({
      id: "link",
      name: "E-mailed link",
      credentials: { token: { label: "Token", type: "text" } },
      authorize: (credentials) => authorizeWith(() => authenticateWithLink(credentials)),
    }),
  ],
  callbacks: {
    // `user` is there only at sign-in: each sign-in starts a session of its own.
    async jwt({ token, user }) {
      if (user) {
        token.sub = user.id;
        token.sid = await startSession(user.id);
      }
      return token;
    },
    // GET /api/auth/session, which the header asks: an ended session answers {} (signed out), as
    // next-auth does for no cookie at all.
    // next-auth clears the browser's cookie when this callback throws, so a database outage would
    // sign everyone out: while PostgreSQL is away the header keeps the name the signed cookie carries
    // (every data request still checks the session row, and fails with 503 until it is back).
    async session({ session, token }) {
      let actor: Actor | null;
      try {
        actor = await sessionOwner(token);
      } catch (error) {
        if (isDatabaseUnavailable(error)) return session;
        throw error;
      }
      if (!actor) return {} as typeof session;
      session.user = { name: actor.name, email: actor.email };
      Object.assign(session.user, { id: actor.userId });
      return session;
    },
  },
  events: {
    // Awaited by next-auth before it clears the cookie: a copy of the cookie is dead too.
    async signOut({ token }) {
      await endSession(token);
    },
  },
};
