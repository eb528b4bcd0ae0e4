import { createHash, randomUUID } from "node:crypto";
import { appendFileSync, existsSync, readFileSync } from "node:fs";

/** A message as the stand-in keeps it: the fields the app sends, plus what the page and tests read. */
export interface FakeEmail {
  id: string;
  from: string;
  to: string[];
  subject: string;
  html: string | null;
  text: string | null;
  created_at: string;
  idempotency_key: string | null;
  body_hash: string;
}

export type StoreResult = { kind: "stored" | "replayed"; email: FakeEmail } | { kind: "conflict" };

/**
 * Messages in memory, newest last, optionally appended to a JSON-lines file so they outlive a
 * restart of `npm start`. An idempotency key maps to the first message stored with it.
 */
export class FakeEmailStore {
  private readonly emails: FakeEmail[] = [];
  private readonly byKey = new Map<string, FakeEmail>();

  constructor(private readonly file?: string) {
    if (file && existsSync(file)) {
      for (const line of readFileSync(file, "utf8").split("\n")) {
        if (line.trim()) this.remember(JSON.parse(line) as FakeEmail);
      }
    }
  }

  store(
    message: Omit<FakeEmail, "id" | "created_at" | "idempotency_key" | "body_hash">,
    key: string | null,
    rawBody: string,
  ): StoreResult {
    const bodyHash = createHash("sha256").update(rawBody).digest("hex");
    const earlier = key ? this.byKey.get(key) : undefined;
    if (earlier) {
      // Resend: the same key with another payload is refused (409 invalid_idempotent_request).
      return earlier.body_hash === bodyHash ? { kind: "replayed", email: earlier } : { kind: "conflict" };
    }
    const email: FakeEmail = {
      ...message,
      id: randomUUID(),
      created_at: new Date().toISOString(),
      idempotency_key: key,
      body_hash: bodyHash,
    };
    this.remember(email);
    if (this.file) appendFileSync(this.file, `${JSON.stringify(email)}\n`);
    return { kind: "stored", email };
  }

  list(): FakeEmail[] {
    return [...this.emails].reverse();
  }

  get(id: string): FakeEmail | undefined {
    return this.emails.find((e) => e.id === id);
  }

  clear(): void {
    this.emails.length = 0;
    this.byKey.clear();
  }

  private remember(email: FakeEmail): void {
    this.emails.push(email);
    if (email.idempotency_key) this.byKey.set(email.idempotency_key, email);
  }
}
