import type { Metadata } from "next";
import Link from "next/link";
import { AcceptInvitation } from "@/components/proposals/accept-invitation";
import { roleLabels } from "@/lib/workspace/roles";
import { previewInvitation } from "@/lib/server/invitations";
import { loadForPage } from "@/lib/server/page-access";

export const metadata: Metadata = { title: "Invitation" };

export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const path = `/proposals/invitations/${token}`;
  const { invitation, actor } = await loadForPage(path, async (actor) => ({ invitation: await previewInvitation(token), actor }));
  const back = encodeURIComponent(path);
  return (
    <section className="mx-auto max-w-2xl space-y-5">
      <h1 className="text-3xl font-bold">Join “{invitation.proposalTitle}”</h1>
      <p>
        {invitation.invitedByName ?? "A PI"} invites <strong>{invitation.email}</strong> to this proposal as{" "}
        <strong>{roleLabels[invitation.role]}</strong>.
      </p>
      {invitation.state !== "open" ? (
        <p className="text-alarm">This invitation is {invitation.state}; ask the PI for a new one.</p>
      ) : !actor ? (
        <p>
          <Link href={`/sign-in?callbackUrl=${back}`}>Sign in</Link> or{" "}
          <Link href={`/sign-up?callbackUrl=${back}&email=${encodeURIComponent(invitation.email)}`}>create an account</Link> with{" "}
          {invitation.email} to accept.
        </p>
      ) : actor.email !== invitation.email ? (
        <p className="text-alarm">
          You are signed in as {actor.email}; this invitation is for {invitation.email}. Sign out and sign in with that address.
        </p>
      ) : (
        <AcceptInvitation token={token} />
      )}
    </section>
  );
}
