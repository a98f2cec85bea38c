// Local stand-ins for the hosted services the product uses (e-mail, file uploads), started with the app.
// Each fake adds the environment variables that point the product's real SDKs at it.
import { connect } from "node:net";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { freePort } from "./ports.mjs";
import { startChild } from "./processes.mjs";
import { log } from "./log.mjs";
import { startUploadFake } from "../fakes/uploads.mjs";

const smtpScript = fileURLToPath(new URL("../fakes/smtp.mjs", import.meta.url));

/** Resolves once something accepts TCP connections on 127.0.0.1:port, or fails after `timeoutMs`. */
async function waitForPort(port, timeoutMs = 10_000) {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const isOpen = await new Promise((resolve) => {
      const socket = connect(port, "127.0.0.1");
      socket.once("connect", () => {
        socket.end();
        resolve(true);
      });
      socket.once("error", () => resolve(false));
    });
    if (isOpen) return;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`fake service on port ${port} did not start within ${timeoutMs} ms`);
}

/** The fake SMTP server (child process): every message the app sends lands in `stateDir/mailbox`. */
async function startMailFake(stateDir) {
  const port = await freePort();
  const mailboxDir = join(stateDir, "mailbox");
  const child = startChild("smtp fake", process.execPath, [smtpScript, "--port", String(port), "--dir", mailboxDir]);
  const exited = new Promise((_, reject) => child.once("exit", (code) => reject(new Error(`smtp fake exited (${code})`))));
  await Promise.race([waitForPort(port), exited]);
  return {
    SMTP_HOST: "127.0.0.1",
    SMTP_PORT: String(port),
    MAIL_FROM: "Arcwright <no-reply@arcwright.invalid>",
    ARCWRIGHT_MAILBOX_DIR: mailboxDir,
  };
}

/**
 * Starts every fake. `uploadsPort` fixes the upload fake's port (stored file URLs name it, so
 * `npm start` keeps one across restarts); tests take a free one.
 * The mailbox page is shown whenever the mail fake runs: the messages it lists exist only there.
 * @param {{ stateDir: string, appUrl: string, uploadsPort?: number }} options
 * @returns {Promise<{ env: Record<string, string>, stop: () => Promise<void> }>}
 */
export async function startFakes({ stateDir, appUrl, uploadsPort }) {
  const mail = await startMailFake(stateDir);
  const uploads = await startUploadFake({ stateDir: join(stateDir, "uploads"), appUrl, port: uploadsPort });
  log("uploads", `fake upload service on http://localhost:${uploads.port}`);
  return {
    env: { ...mail, ARCWRIGHT_DEV_MAILBOX: "1", ...uploads.env },
    stop: () => uploads.stop(),
  };
}
