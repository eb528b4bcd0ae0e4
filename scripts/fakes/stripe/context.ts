// What every handler gets: the objects, the clock, the event sink, and the stand-in's own address (for
// the hosted checkout page's URL).
import type { Clock } from "./clock";
import type { Params } from "./params";
import type { Store } from "./state";
import type { JsonObject } from "./types";
import type { Webhooks } from "./webhooks";

export interface Fake {
  store: Store;
  clock: Clock;
  hooks: Webhooks;
  baseUrl: string;
}

export interface Call {
  fake: Fake;
  params: Params;
  /** Path captures, e.g. the id in /v1/customers/:id. */
  ids: string[];
}

export type Handler = (call: Call) => JsonObject;

export function isoDate(t: number): string {
  return new Date(t * 1000).toISOString().slice(0, 10);
}

export function money(amount: number, currency: string): string {
  const symbols: Record<string, string> = { gbp: "£", usd: "$", eur: "€" };
  const sign = amount < 0 ? "-" : "";
  const abs = Math.abs(amount);
  const whole = `${Math.floor(abs / 100)}.${String(abs % 100).padStart(2, "0")}`;
  const sym = symbols[currency.toLowerCase()];
  return sym ? `${sign}${sym}${whole}` : `${sign}${whole} ${currency.toUpperCase()}`;
}
