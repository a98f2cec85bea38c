import type { Metadata } from "next";
import { ResetPasswordForm } from "@/components/account/reset-forms";

export const metadata: Metadata = { title: "Choose a new password" };

export default async function ResetPasswordPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  return (
    <section className="mx-auto max-w-xl space-y-6">
      <h1 className="text-3xl font-bold">Choose a new password</h1>
      <ResetPasswordForm token={token} />
    </section>
  );
}
