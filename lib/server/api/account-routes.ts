import "server-only";
import { serverEnv } from "@/lib/env";
import { clientAddressOf } from "@/lib/security/client-address";
import type { GetActor } from "@/lib/server/actor";
import { endpoint, noContent, readJson } from "@/lib/server/api/endpoint";
import { requestPasswordReset, requestSignInLink, resetPassword, signUp } from "@/lib/server/accounts";
import { signOutEverywhere } from "@/lib/server/sessions";

const signedOut = async () => null;

const clientAddress = (request: Request) => clientAddressOf(request.headers, serverEnv().ARCWRIGHT_TRUSTED_PROXY);

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

/** /api/account/sessions */
export function sessionRoutes(getActor: GetActor) {
  return {
    /** "Sign out everywhere": ends every session of the signed-in account, this one included. */
    DELETE: endpoint(getActor, async ({ actor }) => {
      await signOutEverywhere(actor);
      return noContent();
    }),
  };
}
