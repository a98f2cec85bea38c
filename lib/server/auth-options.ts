import "server-only";
import type { NextAuthOptions, User } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { serverEnv } from "@/lib/env";
import { AppError } from "@/lib/errors";
import type { Actor } from "@/lib/server/actor";
import { authenticateWithLink, authenticateWithPassword } from "@/lib/server/accounts";

function clientAddressOf(headers: Record<string, unknown> | undefined): string {
  const forwarded = headers?.["x-forwarded-for"];
  const first = typeof forwarded === "string" ? forwarded.split(",")[0]?.trim() : undefined;
  return first || "unknown";
}

const asUser = (actor: Actor | null): User | null => (actor ? { id: actor.userId, email: actor.email, name: actor.name } : null);

// next-auth turns a thrown Error's message into the `error` the sign-in form shows; AppErrors (rate
// limits, spent links) carry a message meant for people, anything else is hidden behind a generic one.
async function authorizeWith(run: () => Promise<Actor | null>): Promise<User | null> {
  try {
    return asUser(await run());
  } catch (error) {
    if (error instanceof AppError) throw new Error(error.message);
    console.error("sign-in failed:", error);
    throw new Error("Sign-in is not available right now; try again shortly.");
  }
}

/**
 * Sessions are signed JWT cookies (no session table): the token carries only the user id, and every
 * request reloads the account so a changed site role or a deleted account takes effect at once.
 */
export const authOptions: NextAuthOptions = {
  session: { strategy: "jwt", maxAge: 30 * 24 * 60 * 60 },
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
      authorize: (credentials, req) => authorizeWith(() => authenticateWithPassword(credentials, clientAddressOf(req.headers))),
    }),
    CredentialsProvider({
      id: "link",
      name: "E-mailed link",
      credentials: { token: { label: "Token", type: "text" } },
      authorize: (credentials) => authorizeWith(() => authenticateWithLink(credentials)),
    }),
  ],
  callbacks: {
    jwt({ token, user }) {
      if (user) token.sub = user.id;
      return token;
    },
    session({ session, token }) {
      if (session.user && token.sub) Object.assign(session.user, { id: token.sub });
      return session;
    },
  },
};
