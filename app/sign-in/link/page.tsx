import type { Metadata } from "next";
import { LinkSignIn } from "@/components/account/sign-in-form";

export const metadata: Metadata = { title: "Sign in by link" };

export default async function LinkSignInPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const { token, callbackUrl } = await searchParams;
  return (
    <section className="mx-auto max-w-xl space-y-6">
      <h1 className="text-3xl font-bold">Sign in by e-mailed link</h1>
      {typeof token === "string" ? <LinkSignIn token={token} callbackUrl={typeof callbackUrl === "string" ? callbackUrl : undefined} /> : <p className="text-alarm">This link is incomplete; ask for a new one.</p>}
    </section>
  );
}
