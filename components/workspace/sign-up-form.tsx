"use client";

import { useRouter } from "next/navigation";
import { signIn } from "next-auth/react";
import { mutate } from "swr";
import { apiFetch } from "@/components/workspace/api-client";
import { Field, FormError, buttonClass } from "@/components/workspace/field";
import { safeCallback } from "@/components/workspace/sign-in-form";
import { formValues, useFormSubmit } from "@/components/workspace/use-form-submit";

export function SignUpForm({ callbackUrl, email }: { callbackUrl?: string; email?: string }) {
  const router = useRouter();
  const { fields, message, isBusy, run } = useFormSubmit();
  return (
    <form
      aria-label="Create an account"
      className="max-w-md space-y-4"
      onSubmit={(event) => {
        event.preventDefault();
        const values = formValues(event.currentTarget);
        void run(async () => {
          await apiFetch("/api/account/sign-up", { method: "POST", body: values });
          const result = await signIn("password", { email: values.email, password: values.password, redirect: false });
          if (!result || result.error) throw new Error("The account was created, but signing in failed; try the sign-in page.");
          await mutate("/api/auth/session");
          router.push(safeCallback(callbackUrl));
          router.refresh();
        });
      }}
    >
      <Field label="Name" name="name" autoComplete="name" required errors={fields.name} />
      <Field label="E-mail" name="email" type="email" autoComplete="email" required defaultValue={email} errors={fields.email} />
      <Field label="Password" name="password" type="password" autoComplete="new-password" required hint="At least 10 characters." errors={fields.password} />
      <FormError message={message} />
      <button type="submit" className={buttonClass} disabled={isBusy}>
        Create account
      </button>
    </form>
  );
}
