"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { signIn } from "next-auth/react";
import { mutate } from "swr";
import { useState } from "react";
import { safeCallback } from "@/lib/auth/callback-path";
import { signInErrorMessage, signInErrorMessages } from "@/lib/auth/sign-in-errors";
import { apiFetch } from "@/components/shared/api-client";
import { Field, FormError, buttonClass, quietButtonClass } from "@/components/shared/field";
import { formValues, useFormSubmit } from "@/components/shared/use-form-submit";

export function SignInForm({ callbackUrl }: { callbackUrl?: string }) {
  const router = useRouter();
  const password = useFormSubmit();
  const link = useFormSubmit();
  const [linkSent, setLinkSent] = useState<string | null>(null);
  const next = safeCallback(callbackUrl);

  return (
    <div className="grid gap-10 md:grid-cols-2">
      <form
        aria-label="Sign in with password"
        className="space-y-4"
        onSubmit={(event) => {
          event.preventDefault();
          const { email, password: secret } = formValues(event.currentTarget);
          void password.run(async () => {
            const result = await signIn("password", { email, password: secret, redirect: false });
            if (!result || result.error) {
              throw new Error(signInErrorMessage(result?.error) ?? signInErrorMessages.CredentialsSignin);
            }
            await mutate("/api/auth/session");
            router.push(next);
            router.refresh();
          });
        }}
      >
        <Field label="E-mail" name="email" type="email" autoComplete="email" required />
        <Field label="Password" name="password" type="password" autoComplete="current-password" required />
        <FormError message={password.message} />
        <div className="flex flex-wrap items-center gap-4">
          <button type="submit" className={buttonClass} disabled={password.isBusy}>
            Sign in
          </button>
          <Link href="/reset">Forgot your password?</Link>
        </div>
        <p className="text-sm text-dusk-dim">
          New to Arcwright? <Link href={`/sign-up?callbackUrl=${encodeURIComponent(next)}`}>Create an account</Link>
        </p>
      </form>
      <form
        aria-label="Sign in by e-mailed link"
        className="space-y-4 border-t border-void-edge pt-6 md:border-l md:border-t-0 md:pl-10 md:pt-0"
        onSubmit={(event) => {
          event.preventDefault();
          const values = formValues(event.currentTarget);
          void link.run(async () => {
            const { message } = await apiFetch<{ message: string }>("/api/account/sign-in-link", { method: "POST", body: values });
            setLinkSent(message);
          });
        }}
      >
        <p className="text-sm text-dusk-dim">Or get a one-time sign-in link by e-mail (valid 15 minutes).</p>
        <Field label="E-mail for the link" name="email" type="email" autoComplete="email" required errors={link.fields.email} />
        <FormError message={link.message} />
        {linkSent && <p role="status" className="text-sm text-glint">{linkSent}</p>}
        <button type="submit" className={quietButtonClass} disabled={link.isBusy}>
          E-mail me a link
        </button>
      </form>
    </div>
  );
}

/** The page a sign-in link opens: one click spends the link (mail scanners that prefetch do not). */
export function LinkSignIn({ token, callbackUrl }: { token: string; callbackUrl?: string }) {
  const router = useRouter();
  const { message, isBusy, run } = useFormSubmit();
  return (
    <div className="space-y-4">
      <button
        type="button"
        className={buttonClass}
        disabled={isBusy}
        onClick={() =>
          void run(async () => {
            const result = await signIn("link", { token, redirect: false });
            if (!result || result.error) {
              // A link that signs nobody in is a spent or unknown one, whatever next-auth calls it.
              const code = result?.error === "CredentialsSignin" ? "LinkSpent" : result?.error;
              throw new Error(signInErrorMessage(code) ?? signInErrorMessages.LinkSpent);
            }
            await mutate("/api/auth/session");
            router.push(safeCallback(callbackUrl));
            router.refresh();
          })
        }
      >
        Sign in to Arcwright
      </button>
      <FormError message={message} />
    </div>
  );
}
