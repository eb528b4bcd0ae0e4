// Events and their delivery. Each change makes an event (id evt_…, created from the stand-in's clock,
// data.object a snapshot of the object at that moment, data.previous_attributes on *.updated) and posts
// it to the webhook URL signed as Stripe signs (Stripe docs: "Check the webhook signatures"): header
// `Stripe-Signature: t=<unix seconds>,v1=<hex HMAC-SHA256 of "<t>.<raw body>" keyed with the whsec secret>`.
// `t` is the machine's real time, since the receiver checks it against its own clock.
// Delivery goes one event at a time in creation order; an event answered with a non-2xx status or a
// connection error is retried after 1 s, 2 s, 4 s … for up to 8 attempts, while later events carry on.
// Stripe retries for up to three days; the schedule is shortened for local use.
import { createHmac } from "node:crypto";
import Stripe from "stripe";
import type { Clock } from "./clock";
import { render } from "./render";
import { newId, type Store } from "./state";
import type { EventRecord, JsonObject, Stored } from "./types";

export const MAX_ATTEMPTS = 8;
const KEEP_EVENTS = 5000;

export function signatureHeader(payload: string, secret: string, t: number): string {
  const v1 = createHmac("sha256", secret).update(`${t}.${payload}`, "utf8").digest("hex");
  return `t=${t},v1=${v1}`;
}

export interface WebhookOptions {
  url?: string;
  secret: string;
  /** First back-off step; doubles after each failed attempt. */
  retryBaseMs?: number;
  onEvent?: (event: EventRecord) => void;
}

export function publicEvent(e: EventRecord): Omit<EventRecord, "delivery"> {
  const { delivery: _d, ...rest } = e;
  return rest;
}

export class Webhooks {
  private timer: NodeJS.Timeout | null = null;
  private running = false;
  private stopped = false;
  private idle: Array<() => void> = [];

  constructor(
    private readonly store: Store,
    private readonly clock: Clock,
    private readonly opts: WebhookOptions,
  ) {}

  emit(type: string, obj: Stored, previous?: JsonObject): EventRecord {
    const event: EventRecord = {
      id: newId("evt"),
      object: "event",
      api_version: Stripe.API_VERSION,
      created: this.clock.now(),
      livemode: false,
      pending_webhooks: this.opts.url ? 1 : 0,
      request: { id: null, idempotency_key: null },
      type,
      data: { object: render(this.store, obj), ...(previous ? { previous_attributes: previous } : {}) },
      delivery: {
        status: this.opts.url ? "pending" : "not_sent",
        attempts: 0,
        next_attempt_at: this.opts.url ? Date.now() : null,
        last_status: null,
        last_error: null,
        delivered_at: null,
      },
    };
    this.store.events.push(event);
    this.trim();
    this.opts.onEvent?.(event);
    this.kick();
    return event;
  }

  /** Keeps the state file small on a long-running `npm start`: the oldest finished events go first. */
  private trim(): void {
    const events = this.store.events;
    let excess = events.length - KEEP_EVENTS;
    if (excess <= 0) return;
    this.store.events = events.filter((e) => !(excess > 0 && e.delivery.status !== "pending" && excess-- > 0));
  }

  /** Resolves once nothing is due now (later retries may still be waiting). */
  settled(): Promise<void> {
    if (!this.running && !this.dueNow()) return Promise.resolve();
    return new Promise((resolve) => this.idle.push(resolve));
  }

  stop(): void {
    this.stopped = true;
    if (this.timer) clearTimeout(this.timer);
  }

  kick(): void {
    if (this.stopped || this.running || !this.opts.url) return;
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
    void this.run();
  }

  private dueNow(): EventRecord | undefined {
    const now = Date.now();
    return this.store.events.find((e) => e.delivery.status === "pending" && (e.delivery.next_attempt_at ?? 0) <= now);
  }

  private async run(): Promise<void> {
    this.running = true;
    try {
      for (let e = this.dueNow(); e && !this.stopped; e = this.dueNow()) await this.deliver(e);
    } finally {
      this.running = false;
    }
    for (const resolve of this.idle.splice(0)) resolve();
    const next = this.store.events
      .filter((e) => e.delivery.status === "pending")
      .map((e) => e.delivery.next_attempt_at ?? 0)
      .sort((a, b) => a - b)[0];
    if (next !== undefined && !this.stopped) this.timer = setTimeout(() => this.kick(), Math.max(0, next - Date.now()));
  }

  private async deliver(e: EventRecord): Promise<void> {
    const payload = JSON.stringify(publicEvent(e), null, 2);
    const d = e.delivery;
    d.attempts += 1;
    try {
      const res = await fetch(this.opts.url ?? "", {
        method: "POST",
        headers: {
          "content-type": "application/json; charset=utf-8",
          "stripe-signature": signatureHeader(payload, this.opts.secret, this.clock.wallNow()),
          "user-agent": "Stripe/1.0 (+https://stripe.com/docs/webhooks) stand-in",
        },
        body: payload,
        signal: AbortSignal.timeout(20_000),
      });
      await res.arrayBuffer().catch(() => undefined);
      d.last_status = res.status;
      d.last_error = res.ok ? null : `HTTP ${res.status}`;
      if (res.ok) {
        d.status = "delivered";
        d.delivered_at = Date.now();
        d.next_attempt_at = null;
      }
    } catch (err) {
      d.last_status = null;
      d.last_error =
        err instanceof Error ? (err.cause instanceof Error ? err.cause.message : err.message) : String(err);
    }
    if (d.status === "pending") {
      if (d.attempts >= MAX_ATTEMPTS) {
        d.status = "failed";
        d.next_attempt_at = null;
      } else {
        d.next_attempt_at = Date.now() + (this.opts.retryBaseMs ?? 1000) * 2 ** (d.attempts - 1);
      }
    }
    this.store.save();
  }
}
