import "server-only";
import nodemailer, { type Transporter } from "nodemailer";
import { serverEnv } from "@/lib/env";
import { AppError } from "@/lib/errors";

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html: string;
}

let transporter: Transporter | undefined;

function transport(): Transporter {
  const env = serverEnv();
  if (env.SMTP_PORT === undefined) {
    throw new AppError("unavailable:mail", "E-mail is not configured on this server (SMTP_PORT is not set).");
  }
  transporter ??= nodemailer.createTransport({
    host: env.SMTP_HOST,
    port: env.SMTP_PORT,
    secure: false,
    // The server speaks plain SMTP on loopback; never upgrade to TLS against it.
    ignoreTLS: env.SMTP_HOST === "127.0.0.1" || env.SMTP_HOST === "localhost",
    connectionTimeout: 5_000,
    greetingTimeout: 5_000,
  });
  return transporter;
}

/** Sends one message; a failure to reach the mail server is a 503, not a silent loss. */
export async function sendMail(mail: OutgoingMail): Promise<void> {
  const message = { from: serverEnv().MAIL_FROM, ...mail };
  try {
    await transport().sendMail(message);
  } catch (error) {
    if (error instanceof AppError) throw error;
    console.error("sending mail failed:", error);
    throw new AppError("unavailable:mail", "The e-mail could not be sent right now; try again shortly.");
  }
}

const deliveries = new Set<Promise<void>>();

/**
 * Hands a message to the mail server without making the request wait. Account e-mails (links, sign-up
 * confirmations) go this way so that the answer takes as long whether or not a message was sent: its
 * timing cannot tell whether an address has an account. A failed delivery is logged; the person asks
 * again.
 */
export function sendMailInBackground(mail: OutgoingMail): void {
  const delivery: Promise<void> = sendMail(mail)
    .catch((error) => console.error(`background mail "${mail.subject}" failed:`, error))
    .finally(() => deliveries.delete(delivery));
  deliveries.add(delivery);
}

/** Resolves once every message handed over in the background was delivered or failed. */
export async function backgroundMailSettled(): Promise<void> {
  await Promise.all([...deliveries]);
}

/** An absolute link into the app, for e-mails. */
export function appLink(path: string): string {
  return new URL(path, serverEnv().NEXTAUTH_URL).toString();
}

const escapeHtml = (text: string) =>
  text.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c] ?? c);

/** A plain message with one call to action, as text and as HTML (every value escaped). */
export function linkMail(to: string, subject: string, lines: string[], action: { label: string; url: string }): OutgoingMail {
  return {
    to,
    subject,
    text: `${lines.join("\n\n")}\n\n${action.label}: ${action.url}\n`,
    html: `${lines.map((line) => `<p>${escapeHtml(line)}</p>`).join("")}<p><a href="${escapeHtml(action.url)}">${escapeHtml(action.label)}</a></p>`,
  };
}
