"use client";

import { useState } from "react";
import { apiFetch } from "@/components/shared/api-client";
import { Field, FormError, buttonClass } from "@/components/shared/field";
import { safeCallback } from "@/lib/auth/callback-path";
import { formValues, useFormSubmit } from "@/components/shared/use-form-submit";

/**
 * Sign-up asks for the account and then for the e-mailed confirmation: the link in that message signs
 * the new member in and goes on to `callbackUrl` (an invitation, for instance).
 */
export function SignUpForm({ callbackUrl, email }: { callbackUrl?: string; email?: string }) {
  const { fields, message, isBusy, run } = useFormSubmit();
  const [sent, setSent] = useState<{ email: string; message: string } | null>(null);
  if (sent) {
    return (
      <div role="status" className="max-w-md space-y-3">
        <p className="text-glint">{sent.message}</p>
        <p className="text-sm text-dusk-dim">
          It went to <strong>{sent.email}</strong>. The link works once, within a day; until then the account cannot sign in with its password.
        </p>
      </div>
    );
  }
  return (
    <form
      aria-label="Create an account"
      className="max-w-md space-y-4"
      onSubmit={(event) => {
        event.preventDefault();
        const values = formValues(event.currentTarget);
        void run(async () => {
          const answer = await apiFetch<{ message: string }>("/api/account/sign-up", { method: "POST", body: { ...values, callbackUrl: safeCallback(callbackUrl) } });
          setSent({ email: values.email, message: answer.message });
        });
      }}
    >
      <Field label="Name" name="name" autoComplete="name" required errors={fields.name} />
      <Field label="E-mail" name="email" type="email" autoComplete="email" required defaultValue={email} errors={fields.email} />
      <Field
        label="Password"
        name="password"
        type="password"
        autoComplete="new-password"
        required
        hint="At least 10 characters; not a common password, nor one made of your name or address."
        errors={fields.password}
      />
      <FormError message={message} />
      <button type="submit" className={buttonClass} disabled={isBusy}>
        Create account
      </button>
    </form>
  );
}
