import "server-only";
import { readdir, readFile } from "node:fs/promises";
import { join } from "node:path";
import { z } from "zod";
import { serverEnv } from "@/lib/env";
import { AppError } from "@/lib/errors";

/** One message as the fake SMTP server (scripts/fakes/smtp.mjs) stores it. */
const storedMessageSchema = z.object({
  id: z.string(),
  receivedAt: z.string(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  html: z.string().optional(),
});

export type StoredMessage = z.infer<typeof storedMessageSchema>;

/** The mailbox page exists in development, and in test runs that set ARCWRIGHT_DEV_MAILBOX=1. */
export function isMailboxEnabled(): boolean {
  const env = serverEnv();
  return env.NODE_ENV === "development" || env.NODE_ENV === "test" || env.ARCWRIGHT_DEV_MAILBOX === "1";
}

/** Every message the fake received, newest first (read from its folder, so any process sees them). */
export async function listMailbox(limit = 200): Promise<StoredMessage[]> {
  if (!isMailboxEnabled()) throw new AppError("not_found:mailbox", "No such page.");
  const dir = serverEnv().ARCWRIGHT_MAILBOX_DIR;
  if (!dir) return [];
  const names = (await readdir(dir).catch(() => [] as string[])).filter((n) => n.endsWith(".json")).sort().reverse().slice(0, limit);
  const messages = await Promise.all(
    names.map(async (name) => storedMessageSchema.safeParse(JSON.parse(await readFile(join(dir, name), "utf8")))),
  );
  return messages.flatMap((m) => (m.success ? [m.data] : []));
}
