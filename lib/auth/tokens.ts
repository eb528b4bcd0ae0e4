import { createHash, randomBytes } from "node:crypto";

/** A URL-safe secret with 256 bits of randomness; only its hash is stored, so a database leak opens nothing. */
export function newToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString("base64url");
  return { token, hash: hashToken(token) };
}

// A plain SHA-256 is enough for a high-entropy random token (unlike a password, it cannot be guessed).
export function hashToken(token: string): string {
  return createHash("sha256").update(token).digest("hex");
}

export const MINUTE = 60_000;
/** Reset links expire within the hour (issue 4 §3). */
export const RESET_TTL_MINUTES = 60;
export const VERIFY_TTL_MINUTES = 48 * 60;
export const INVITATION_TTL_DAYS = 14;
