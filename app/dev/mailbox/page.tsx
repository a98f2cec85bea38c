import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { formatDateTime } from "@/components/shared/format";
import { isMailboxEnabled, listMailbox } from "@/lib/server/mailbox";

export const metadata: Metadata = { title: "Mailbox (development)" };
export const dynamic = "force-dynamic";

/** Splits a plain-text body into text and links, so a person can follow a link from a message. */
function withLinks(text: string) {
  return text.split(/(https?:\/\/\S+)/g).map((part, i) =>
    /^https?:\/\//.test(part) ? (
      <a key={i} href={part}>
        {part}
      </a>
    ) : (
      part
    ),
  );
}

/** Every e-mail the local fake SMTP server received. Exists only in development and test runs. */
export default async function MailboxPage() {
  if (!isMailboxEnabled()) notFound();
  const messages = await listMailbox();
  return (
    <section className="space-y-4">
      <h1 className="text-3xl font-bold">Mailbox</h1>
      <p className="text-sm text-dusk-dim">Messages the app sent, caught by the local mail fake. Newest first.</p>
      {messages.length === 0 && <p>No messages yet.</p>}
      <ol className="space-y-4">
        {messages.map((m) => (
          <li key={m.id} className="rounded-lg border border-void-edge bg-void-raised p-4" data-testid="mail">
            <h2 className="font-semibold">{m.subject}</h2>
            <p className="text-xs text-dusk-dim">
              To {m.to.join(", ")} · from {m.from} · {formatDateTime(m.receivedAt)}
            </p>
            <p className="mt-2 whitespace-pre-wrap text-sm">{withLinks(m.text)}</p>
          </li>
        ))}
      </ol>
    </section>
  );
}
