import type { AddressInfo } from "node:net";
import { simpleParser } from "mailparser";
import { SMTPServer } from "smtp-server";
import { afterAll, beforeAll } from "vitest";
import { dbClient } from "@/db/client";

export interface CaughtMail {
  to: string[];
  subject: string;
  text: string;
}

/** How long the catcher waits before accepting each message (ms): a slow mail server, as a distant one is. */
export interface AnswerDelay {
  ms: number;
}

/**
 * An in-process SMTP server for integration tests, so invitation and link e-mails really go through
 * nodemailer. Sets SMTP_HOST/SMTP_PORT before the app reads its environment.
 */
export async function startMailCatcher(delay: AnswerDelay = { ms: 0 }): Promise<{ messages: CaughtMail[]; stop: () => Promise<void> }> {
  const messages: CaughtMail[] = [];
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS", "AUTH"],
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          messages.push({ to: session.envelope.rcptTo.map((r) => r.address), subject: parsed.subject ?? "", text: parsed.text ?? "" });
          setTimeout(callback, delay.ms);
        })
        .catch(callback);
    },
  });
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  process.env.SMTP_HOST = "127.0.0.1";
  process.env.SMTP_PORT = String((server.server.address() as AddressInfo).port);
  return { messages, stop: () => new Promise<void>((resolve) => server.close(() => resolve())) };
}

/** The first link into the app found in a message's text. */
export function linkIn(mail: CaughtMail): URL {
  const match = /https?:\/\/\S+/.exec(mail.text);
  if (!match) throw new Error(`no link in "${mail.subject}"`);
  return new URL(match[0]);
}

/**
 * For a test file that sends mail: starts the catcher before its tests, and after them stops it and
 * ends the database client. `messages` is the catcher's list once the file's tests run; a test may set
 * `answerDelay.ms` to make the server slow.
 */
export function catchMailDuringFile(): { messages: CaughtMail[]; answerDelay: AnswerDelay } {
  const caught: { messages: CaughtMail[]; answerDelay: AnswerDelay } = { messages: [], answerDelay: { ms: 0 } };
  let stop: (() => Promise<void>) | undefined;
  beforeAll(async () => {
    const catcher = await startMailCatcher(caught.answerDelay);
    caught.messages = catcher.messages;
    stop = catcher.stop;
  });
  afterAll(async () => {
    await stop?.();
    await dbClient().sql.end();
  });
  return caught;
}
