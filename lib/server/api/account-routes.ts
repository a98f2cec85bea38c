import "server-only";
import { endpoint, readJson } from "@/lib/server/api/endpoint";
import { requestPasswordReset, requestSignInLink, resetPassword, signUp } from "@/lib/server/accounts";

const signedOut = async () => null;

function clientAddress(request: Request): string {
  return request.headers.get("x-forwarded-for")?.split(",")[0]?.trim() || "unknown";
}

const sameAnswerEitherWay = () =>
  Response.json({ ok: true, message: "If an account uses this address, a message with a link is on its way." }, { status: 202 });

/** Account endpoints that work without a session. */
export const accountRoutes = {
  /** POST /api/account/sign-up */
  signUp: endpoint(signedOut, async ({ request }) => {
    await signUp(await readJson(request), clientAddress(request));
    return Response.json({ ok: true, message: "Check your e-mail: the message we sent finishes creating your account." }, { status: 202 });
  }),
  /** POST /api/account/reset-request */
  requestReset: endpoint(signedOut, async ({ request }) => {
    await requestPasswordReset(await readJson(request), clientAddress(request));
    return sameAnswerEitherWay();
  }),
  /** POST /api/account/reset */
  reset: endpoint(signedOut, async ({ request }) => {
    await resetPassword(await readJson(request));
    return Response.json({ ok: true });
  }),
  /** POST /api/account/sign-in-link */
  requestLink: endpoint(signedOut, async ({ request }) => {
    await requestSignInLink(await readJson(request), clientAddress(request));
    return sameAnswerEitherWay();
  }),
};
