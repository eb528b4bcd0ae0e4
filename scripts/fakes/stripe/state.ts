// The stand-in's memory: every object by id, the events it sent, the clock's offset. Saved as JSON after
// each change (write to a temporary file, then rename, so a crash never leaves half a file) and loaded at
// start, so `npm start` keeps customers and subscriptions across restarts.
import { randomBytes } from "node:crypto";
import { existsSync, readFileSync, renameSync, writeFileSync } from "node:fs";
import type { EventRecord, Stored, StoredKind } from "./types";
import { notFound } from "./errors";

interface Saved {
  version: 1;
  clockOffset: number;
  objects: Record<string, Stored>;
  events: EventRecord[];
  sequence: number;
}

type OfKind<K extends StoredKind> = Extract<Stored, { object: K }>;

const ALPHABET = "0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz";

/** Stripe-looking id: prefix + 24 base62 characters (Stripe's ids are opaque; the length is from memory). */
export function newId(prefix: string): string {
  const bytes = randomBytes(24);
  let out = "";
  for (const b of bytes) out += ALPHABET[b % ALPHABET.length];
  return `${prefix}_${out}`;
}

/** The names Stripe uses in "No such …" errors. */
const NOUN: Record<StoredKind, string> = {
  customer: "customer",
  product: "product",
  price: "price",
  payment_method: "PaymentMethod",
  "checkout.session": "checkout.session",
  subscription: "subscription",
  invoice: "invoice",
  payment_intent: "payment_intent",
  charge: "charge",
  refund: "refund",
};

export class Store {
  objects = new Map<string, Stored>();
  events: EventRecord[] = [];
  clockOffset = 0;
  /** Monotonic counter for receipt numbers and for ordering objects created in the same second. */
  sequence = 0;
  private order = new Map<string, number>();

  constructor(private readonly file?: string) {
    if (file && existsSync(file)) {
      const saved = JSON.parse(readFileSync(file, "utf8")) as Saved;
      this.clockOffset = saved.clockOffset;
      this.sequence = saved.sequence;
      this.events = saved.events;
      for (const o of Object.values(saved.objects)) this.put(o);
    }
  }

  put<T extends Stored>(o: T): T {
    if (!this.order.has(o.id)) this.order.set(o.id, ++this.sequence);
    this.objects.set(o.id, o);
    return o;
  }

  find<K extends StoredKind>(kind: K, id: string): OfKind<K> | undefined {
    const o = this.objects.get(id);
    return o && o.object === kind ? (o as OfKind<K>) : undefined;
  }

  /** The object or Stripe's 404 resource_missing. */
  get<K extends StoredKind>(kind: K, id: string, param = "id"): OfKind<K> {
    const o = this.find(kind, id);
    if (!o) throw notFound(NOUN[kind], id, param);
    return o;
  }

  /** Newest first, as Stripe lists (created desc; insertion order breaks ties). */
  all<K extends StoredKind>(kind: K): OfKind<K>[] {
    const out: OfKind<K>[] = [];
    for (const o of this.objects.values()) if (o.object === kind) out.push(o as OfKind<K>);
    return out.sort((a, b) => b.created - a.created || (this.order.get(b.id) ?? 0) - (this.order.get(a.id) ?? 0));
  }

  nextNumber(): number {
    return ++this.sequence;
  }

  save(): void {
    if (!this.file) return;
    const saved: Saved = {
      version: 1,
      clockOffset: this.clockOffset,
      sequence: this.sequence,
      events: this.events,
      objects: Object.fromEntries(this.objects),
    };
    const tmp = `${this.file}.tmp`;
    writeFileSync(tmp, JSON.stringify(saved));
    renameSync(tmp, this.file);
  }
}
