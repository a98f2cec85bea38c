// Types for the sign-in helper, for the TypeScript tests that use it.

export interface Member {
  email: string;
  password: string;
}

export interface SignInAnswer {
  /** The Cookie header to send, when a session cookie was set. */
  cookie: string | null;
  /** The error next-auth put in the URL it sends the browser to (the sign-in form shows it). */
  error: string | null;
}

/** next-auth's credentials flow as the sign-in form drives it. */
export function attemptSignIn(appUrl: string, member: Member): Promise<SignInAnswer>;

/** Signs in or throws; checks the session answers for this member; the answer is the Cookie header. */
export function signIn(appUrl: string, member: Member): Promise<string>;
