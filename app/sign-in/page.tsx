import type { Metadata } from "next";
import { signInErrorMessage } from "@/lib/auth/sign-in-errors";
import { SignInForm } from "@/components/account/sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const { callbackUrl, error } = await searchParams;
  // Our own text for the code, never the parameter itself: anyone can write a link to this page.
  const message = signInErrorMessage(error);
  return (
    <section className="mx-auto max-w-4xl space-y-6">
      <h1 className="text-3xl font-bold">Sign in</h1>
      {message !== null && (
        <p role="alert" className="text-alarm">
          {message}
        </p>
      )}
      <SignInForm callbackUrl={typeof callbackUrl === "string" ? callbackUrl : undefined} />
    </section>
  );
}
