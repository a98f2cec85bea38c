/**
 * What a failed sign-in says. next-auth passes the outcome through the URL (`/sign-in?error=<code>`),
 * which anyone can write, so only these codes are shown, each with our own fixed text; any other
 * value gets the generic line, never its own text.
 */
export const signInErrorMessages = {
  /** next-auth's code for credentials it did not accept. */
  CredentialsSignin: "Wrong e-mail or password, or the account is waiting for its e-mailed confirmation.",
  RateLimited: "Too many failed attempts; wait a few minutes and try again, or sign in with an e-mailed link.",
  LinkSpent: "This link has expired or was already used; ask for a new one.",
  Unavailable: "Sign-in is not available right now; try again shortly.",
  /** next-auth's code for a page that needs a session. */
  SessionRequired: "Sign in to continue.",
} as const;

export type SignInErrorCode = keyof typeof signInErrorMessages;

const genericMessage = "Signing in did not work; try again.";

/** The text for an `error` parameter: ours for a known code, the generic line for anything else, null for none. */
export function signInErrorMessage(code: unknown): string | null {
  if (typeof code !== "string" || code === "") return null;
  return Object.hasOwn(signInErrorMessages, code) ? signInErrorMessages[code as SignInErrorCode] : genericMessage;
}
