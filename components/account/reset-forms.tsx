"use client";

import Link from "next/link";
import { useState } from "react";
import { apiFetch } from "@/components/shared/api-client";
import { Field, FormError, buttonClass } from "@/components/shared/field";
import { formValues, useFormSubmit } from "@/components/shared/use-form-submit";

export function ResetRequestForm() {
  const { fields, message, isBusy, run } = useFormSubmit();
  const [sent, setSent] = useState<string | null>(null);
  return (
    <form
      aria-label="Ask for a password reset"
      className="max-w-md space-y-4"
      onSubmit={(event) => {
        event.preventDefault();
        const values = formValues(event.currentTarget);
        void run(async () => {
          const answer = await apiFetch<{ message: string }>("/api/account/reset-request", { method: "POST", body: values });
          setSent(answer.message);
        });
      }}
    >
      <Field label="E-mail" name="email" type="email" autoComplete="email" required errors={fields.email} />
      <FormError message={message} />
      {sent && <p role="status" className="text-glint">{sent}</p>}
      <button type="submit" className={buttonClass} disabled={isBusy}>
        E-mail me a reset link
      </button>
    </form>
  );
}

export function ResetPasswordForm({ token }: { token: string }) {
  const { fields, message, isBusy, run } = useFormSubmit();
  const [isDone, setDone] = useState(false);
  if (isDone) {
    return (
      <p role="status" className="text-glint">
        Your password is changed. <Link href="/sign-in">Sign in</Link> with it.
      </p>
    );
  }
  return (
    <form
      aria-label="Choose a new password"
      className="max-w-md space-y-4"
      onSubmit={(event) => {
        event.preventDefault();
        const { password } = formValues(event.currentTarget);
        void run(async () => {
          await apiFetch("/api/account/reset", { method: "POST", body: { token, password } });
          setDone(true);
        });
      }}
    >
      <Field label="New password" name="password" type="password" autoComplete="new-password" required hint="At least 10 characters." errors={fields.password ?? fields.token} />
      <FormError message={message} />
      <button type="submit" className={buttonClass} disabled={isBusy}>
        Set the new password
      </button>
    </form>
  );
}
