import type { Metadata } from "next";
import { SignInForm } from "@/components/workspace/sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const { callbackUrl, error } = await searchParams;
  return (
    <section className="mx-auto max-w-4xl space-y-6">
      <h1 className="text-3xl font-bold">Sign in</h1>
      {typeof error === "string" && error !== "CredentialsSignin" && (
        <p role="alert" className="text-alarm">{error}</p>
      )}
      <SignInForm callbackUrl={typeof callbackUrl === "string" ? callbackUrl : undefined} />
    </section>
  );
}
