#!/usr/bin/env node
// A local SMTP server for e-mail the app sends (invitations, sign-in links, password resets). It
// accepts every message on loopback without authentication and keeps each one as a JSON file in the
// mailbox folder, where the app's development mailbox page reads them from any process.
//   node scripts/fakes/smtp.mjs --port <port> --dir <mailbox folder>
import { randomUUID } from "node:crypto";
import { mkdirSync, renameSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { parseArgs } from "node:util";
import { simpleParser } from "mailparser";
import { SMTPServer } from "smtp-server";

const { values } = parseArgs({ options: { port: { type: "string" }, dir: { type: "string" } } });
const port = Number(values.port);
const dir = values.dir;
if (!Number.isInteger(port) || port <= 0 || !dir) {
  console.error("usage: smtp.mjs --port <port> --dir <mailbox folder>");
  process.exit(2);
}
mkdirSync(dir, { recursive: true });

const addressesOf = (field) => (field ? (Array.isArray(field) ? field : [field]).flatMap((a) => a.value.map((v) => v.address ?? "")) : []);

/** Writes through a temporary name, so a reader never sees half a message. */
function store(message) {
  // Sortable names: the receipt time first, so a directory listing is already in order.
  const name = `${message.receivedAt.replace(/[:.]/g, "-")}-${message.id}.json`;
  const temporary = join(dir, `.${name}.tmp`);
  writeFileSync(temporary, JSON.stringify(message, null, 2));
  renameSync(temporary, join(dir, name));
}

const server = new SMTPServer({
  authOptional: true,
  disabledCommands: ["STARTTLS", "AUTH"],
  banner: "Arcwright local mail fake",
  size: 5 * 1024 * 1024,
  onData(stream, session, callback) {
    simpleParser(stream)
      .then((parsed) => {
        store({
          id: randomUUID(),
          receivedAt: new Date().toISOString(),
          from: parsed.from?.text ?? session.envelope.mailFrom?.address ?? "",
          to: addressesOf(parsed.to).length > 0 ? addressesOf(parsed.to) : session.envelope.rcptTo.map((r) => r.address),
          subject: parsed.subject ?? "",
          text: parsed.text ?? "",
          html: typeof parsed.html === "string" ? parsed.html : undefined,
        });
        callback();
      })
      .catch((error) => callback(error));
  },
});

server.on("error", (error) => console.error(`[smtp] ${error.message}`));
server.listen(port, "127.0.0.1", () => console.log(`[smtp] fake mail server on 127.0.0.1:${port}, messages in ${dir}`));

for (const signal of ["SIGTERM", "SIGINT"]) process.on(signal, () => server.close(() => process.exit(0)));
