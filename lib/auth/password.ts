import bcrypt from "bcryptjs";

/** bcrypt cost 10: about 60 ms per hash here, slow for guessing, quick enough for a sign-in. */
export const bcryptCost = 10;

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, bcryptCost);
}

// A real hash of a random string at the same cost: comparing against it when no account exists takes
// as long as a real comparison, so the answer's timing does not tell whether an e-mail is registered.
let absentAccountHash: Promise<string> | undefined;

/**
 * True when `password` matches `hash`. With `hash` null (no such account, or a link-only account) it
 * still does a full bcrypt comparison and answers false.
 */
export async function verifyPassword(password: string, hash: string | null): Promise<boolean> {
  if (hash === null) {
    absentAccountHash ??= bcrypt.hash(crypto.randomUUID(), bcryptCost);
    await bcrypt.compare(password, await absentAccountHash);
    return false;
  }
  return bcrypt.compare(password, hash);
}
