import NextAuth from "next-auth";
import { crossSiteError } from "@/lib/security/same-origin";
import { authOptions } from "@/lib/server/auth-options";
import { errorResponse } from "@/lib/server/http";

const nextAuth = NextAuth(authOptions);

/** next-auth checks its own CSRF token on sign-in and sign-out; a cross-site write is refused before that. */
function handler(request: Request, context: { params: Promise<{ nextauth: string[] }> }) {
  const refusal = crossSiteError(request);
  return refusal ? errorResponse(refusal) : nextAuth(request, context);
}

export { handler as GET, handler as POST };
