// Secrets of a local installation, made once and kept in its git-ignored state folder.
import { randomBytes } from "node:crypto";
import { existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";

const fresh = () => ({
  postgresPassword: randomBytes(18).toString("base64url"),
  authSecret: randomBytes(32).toString("base64url"),
});

/** Reads `dir/secrets.json`, creating it (mode 600) on first use; missing keys are added. */
export function loadOrCreateSecrets(dir) {
  mkdirSync(dir, { recursive: true });
  const file = join(dir, "secrets.json");
  const existing = existsSync(file) ? JSON.parse(readFileSync(file, "utf8")) : {};
  const secrets = { ...fresh(), ...existing };
  if (JSON.stringify(secrets) !== JSON.stringify(existing)) {
    writeFileSync(file, `${JSON.stringify(secrets, null, 2)}\n`, { mode: 0o600 });
  }
  return secrets;
}

/** Secrets for a throwaway run (tests): never written anywhere. */
export const throwawaySecrets = fresh;
