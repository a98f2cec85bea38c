import type { Metadata } from "next";
import Link from "next/link";
import { SignUpForm } from "@/components/account/sign-up-form";

export const metadata: Metadata = { title: "Create an account" };

export default async function SignUpPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const { callbackUrl, email } = await searchParams;
  return (
    <section className="mx-auto max-w-xl space-y-6">
      <h1 className="text-3xl font-bold">Create an account</h1>
      <SignUpForm callbackUrl={typeof callbackUrl === "string" ? callbackUrl : undefined} email={typeof email === "string" ? email : undefined} />
      <p className="text-sm text-dusk-dim">
        Already have one? <Link href="/sign-in">Sign in</Link>
      </p>
    </section>
  );
}
