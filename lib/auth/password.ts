import { hash, verify } from "@node-rs/argon2";

// Argon2id at the OWASP Password Storage Cheat Sheet's first recommended configuration:
// m = 19 MiB (19456 KiB), t = 2 iterations, p = 1 (OWASP Password Storage Cheat Sheet, "Argon2id").
// @node-rs/argon2 uses Argon2id by default (algorithm 2).
const OPTIONS = { memoryCost: 19456, timeCost: 2, parallelism: 1, outputLen: 32 } as const;

export function hashPassword(password: string): Promise<string> {
  return hash(password, OPTIONS);
}

export async function verifyPassword(stored: string, password: string): Promise<boolean> {
  try {
    return await verify(stored, password);
  } catch {
    return false; // a malformed stored hash never signs anyone in
  }
}
