import { COMMON_PASSWORDS } from "./common-passwords";

// Length rule: 10 characters or more. NIST SP 800-63B sets 8 as the floor for a chosen password
// and asks that long passphrases be allowed; 10 is a common practice a little above that floor.
export const MIN_PASSWORD_LENGTH = 10;
// An upper bound keeps one request from making argon2 hash megabytes (common practice).
export const MAX_PASSWORD_LENGTH = 200;

/** Why a new password is not acceptable, in words for the person choosing it; null when it is. */
export function passwordProblem(password: string, email?: string): string | null {
  const length = [...password].length; // count characters, not UTF-16 units
  if (length < MIN_PASSWORD_LENGTH)
    return `Use at least ${MIN_PASSWORD_LENGTH} characters (a few words strung together works well).`;
  if (length > MAX_PASSWORD_LENGTH) return `Use at most ${MAX_PASSWORD_LENGTH} characters.`;
  const folded = password.trim().toLowerCase();
  if (COMMON_PASSWORDS.has(folded))
    return "That is one of the most common passwords, so it is easy to guess. Please choose another.";
  if (/^(.)\1*$/u.test(folded)) return "A single character repeated is easy to guess. Please choose another.";
  if (email && folded === email.trim().toLowerCase()) return "Please don't use your e-mail address as your password.";
  return null;
}
