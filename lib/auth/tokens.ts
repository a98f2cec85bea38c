import { createHash, randomBytes } from "node:crypto";

/** A fresh link secret: 32 random bytes, base64url (43 characters). Only its hash is stored. */
export function newLinkToken(): { token: string; tokenHash: string } {
  const token = randomBytes(32).toString("base64url");
  return { token, tokenHash: hashLinkToken(token) };
}

export function hashLinkToken(token: string): string {
  return createHash("sha256").update(token).digest("hex");
}
