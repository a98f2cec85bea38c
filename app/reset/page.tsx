import type { Metadata } from "next";
import { ResetRequestForm } from "@/components/account/reset-forms";

export const metadata: Metadata = { title: "Reset your password" };

export default function ResetRequestPage() {
  return (
    <section className="mx-auto max-w-xl space-y-6">
      <h1 className="text-3xl font-bold">Reset your password</h1>
      <p>We send a link to the account&apos;s address; it works once, within an hour.</p>
      <ResetRequestForm />
    </section>
  );
}
